package words

import (
	"encoding/json"
	"strings"
	"testing"

	"swaysheet/core/units"
)

func TestFormat(t *testing.T) {
	s := Say("Move {0} is too short to reach its top speed of {1}: it peaks at {2} after {3}; swing {4}.",
		Quantity{Value: 1, Quantity: ""}, Speed(1), Speed(0.3873), Time(3.43864), Angle(4.7e-05))
	us := units.Choice{System: "us"}
	got := s.Format(us)
	// 1 m/s = 196.85 ft/min (NIST SP 811: 1 ft = 0.3048 m exactly).
	want := "Move 1 is too short to reach its top speed of 197 ft/min: it peaks at 76 ft/min after 3.4 s; swing 0.0 deg."
	if got != want {
		t.Errorf("US:\n got %s\nwant %s", got, want)
	}
	if got := s.String(); got != "Move 1 is too short to reach its top speed of 1.00 m/s: it peaks at 0.39 m/s after 3.4 s; swing 0.0 deg." {
		t.Errorf("SI: %s", got)
	}
	if strings.Contains(s.Format(units.Choice{System: "si"}), "e-") {
		t.Error("scientific notation")
	}
	// Placeholders out of range and stray braces are left as they are.
	if got := Say("a {7} {x} {0}", Length(2)).Format(us); got != "a {7} {x} 6.55 ft" {
		t.Errorf("stray: %s", got)
	}
	if got := Plain("set {a}").Text; got != "set (a)" {
		t.Errorf("plain: %s", got)
	}
	if got := Say("{0} of the swing", Quantity{Value: 0.123, Quantity: "share"}).Format(us); got != "12 % of the swing" {
		t.Errorf("share: %s", got)
	}
}

func TestJSON(t *testing.T) {
	b, _ := json.Marshal(Say("at {0}", Length(0.5)))
	if string(b) != `{"text":"at {0}","quantities":[{"value":0.5,"quantity":"length"}]}` {
		t.Errorf("JSON: %s", b)
	}
	// The planner's sentences carry "digits" too: they read the same.
	var s Sentence
	if err := json.Unmarshal([]byte(`{"text":"ramp {0}","quantities":[{"value":3.439,"quantity":"time","digits":3}]}`), &s); err != nil {
		t.Fatal(err)
	}
	if got := s.Format(units.Choice{}); got != "ramp 3.4 s" {
		t.Errorf("planner's: %s", got)
	}
}
