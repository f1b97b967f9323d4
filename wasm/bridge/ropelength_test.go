package bridge

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"swaysheet/core/ropelength"
	"swaysheet/core/units"
)

// The ropelength call answers a timed swing and names bad fields.
func TestRopeLengthCall(t *testing.T) {
	var r struct {
		Result struct {
			RopeLengthM float64 `json:"rope_length_m"`
		} `json:"result"`
	}
	out := Call(nil, "ropelength", []byte(`{"timed": {"swings": 10, "time_s": 86}}`))
	if err := json.Unmarshal(out, &r); err != nil {
		t.Fatal(err)
	}
	// Small swing: L = g*(T/(2*pi))^2 (T = 2*pi*sqrt(L/g), handbook formula).
	if want := units.StandardGravity * math.Pow(8.6/(2*math.Pi), 2); math.Abs(r.Result.RopeLengthM-want) > 1e-12 {
		t.Errorf("rope length %v m, want %v m (%s)", r.Result.RopeLengthM, want, out)
	}
	for in, field := range map[string]string{
		`{"timed": {"swings": 0, "time_s": 86}}`:          "timed.swings",
		`{"timed": {"swings": "ten", "time_s": 86}}`:      "timed.swings",
		`{"timed": {"swings": 10, "time_s": 86}, "x": 1}`: "(input)",
		`{"timed": `: "(input)",
	} {
		var e errReply
		if err := json.Unmarshal(Call(nil, "ropelength", []byte(in)), &e); err != nil || e.Error == nil ||
			len(e.Error.Fields) == 0 || e.Error.Fields[0].Field != field {
			t.Errorf("%s: want an error on %s, got %+v", in, field, e.Error)
		}
	}
}

// A rigid load's question (load with load.body) answers with the rope to
// the hook whose first mode has the timed period (the bay girder of the
// examples: 6.53 s at 5 m, sway.RigidFirstMode) and names a bad field of
// the body by its path.
func TestRopeLengthCallRigid(t *testing.T) {
	body := `"body": {"length_m": 13, "width_m": 0.5, "height_m": 1, "hook_mass_kg": 250, "legs": [{"length_m": %s, "attach_x_m": 5, "attach_z_m": 0.5}, {"length_m": 5.831, "attach_x_m": -5, "attach_z_m": 0.5}]}`
	q := func(leg string) []byte {
		return []byte(`{"timed": {"swings": 5, "time_s": 32.65}, "load": {"mass_kg": 7200, ` + strings.Replace(body, "%s", leg, 1) + `}}`)
	}
	var r struct {
		Result struct {
			RopeLengthM float64 `json:"rope_length_m"`
			FromTimed   struct {
				RopeToHookM float64 `json:"rope_to_hook_m"`
			} `json:"from_timed"`
		} `json:"result"`
	}
	out := Call(nil, "ropelength", q("5.831"))
	if err := json.Unmarshal(out, &r); err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.Result.RopeLengthM-5) > 0.05 || r.Result.RopeLengthM != r.Result.FromTimed.RopeToHookM {
		t.Errorf("rope to the hook %v m, want about 5 m: %s", r.Result.RopeLengthM, out)
	}
	var e errReply
	if err := json.Unmarshal(Call(nil, "ropelength", q("500")), &e); err != nil || e.Error == nil ||
		len(e.Error.Fields) == 0 || e.Error.Fields[0].Field != "load.body.legs[0].length_m" {
		t.Errorf("a leg of 500 m: want an error at load.body.legs[0].length_m, got %+v", e.Error)
	}
}

// The ropelength_ranges call gives every field of the ropelength call
// with its quantity, for the page to convert.
func TestRopeLengthRangesCall(t *testing.T) {
	var r struct {
		Result map[string]FieldRange `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "ropelength_ranges", nil), &r); err != nil {
		t.Fatal(err)
	}
	if len(r.Result) != len(ropelength.Ranges) {
		t.Fatalf("%d ranges, want %d", len(r.Result), len(ropelength.Ranges))
	}
	for k, q := range map[string]string{"heights.sheave_height_m": "length", "timed.time_s": "time", "timed.amplitude_deg": "angle", "timed.swings": ""} {
		if got := r.Result[k]; got.Quantity != q || got.Text != ropelength.Ranges[k].Text() {
			t.Errorf("%s: %+v, want quantity %q", k, got, q)
		}
	}
}
