package scenario_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

const head = `"format": "swaysheet-scenario", "version": 1, "name": "bad input"`
const move = `{"axis": "travel_x", "distance_m": 4, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3}`

func file(load, rest string) string {
	return "{" + head + `, "load": ` + load + `, "motions": [` + move + "]" + rest + "}"
}

// TestBadInput checks that each kind of bad file gets a message naming the
// field (or "(file)") and saying what is accepted; the README's "Bad input"
// table lists the same cases.
func TestBadInput(t *testing.T) {
	good := `{"mass_kg": 1000, "rope_length_m": 5}`
	for _, c := range []struct {
		name, data, field, says string
	}{
		{"missing field", file(`{"mass_kg": 1000}`, ""), "load.rope_length_m", "is required: accepted from 0.3 up to 500 m"},
		{"unknown field", file(good, `, "colour": "red"`), "colour", "unknown field"},
		{"unknown nested field", file(`{"mass_kg": 1000, "rope_length_m": 5, "colour": 1}`, ""), "load.colour", "unknown field"},
		{"unknown field in a move", "{" + head + `, "load": ` + good + `, "motions": [` + move + `, {"axis": "hoist", "lift": 2}]}`, "motions[1].lift", "unknown field"},
		{"empty key", file(good, `, "": 0`), `""`, "unknown field"},
		{"zero rope", file(`{"mass_kg": 1000, "rope_length_m": 0}`, ""), "load.rope_length_m", "0 is out of range: accepted from 0.3 up to 500 m"},
		{"negative rope", file(`{"mass_kg": 1000, "rope_length_m": -2}`, ""), "load.rope_length_m", "-2 is out of range"},
		{"zero mass", file(`{"mass_kg": 0, "rope_length_m": 5}`, ""), "load.mass_kg", "0 is out of range: accepted from 0.1 up to 2e+06 kg"},
		{"absurd acceleration", "{" + head + `, "load": ` + good + `, "motions": [{"axis": "travel_x", "distance_m": 4, "speed_m_per_s": 0.5, "accel_m_per_s2": 50}]}`,
			"motions[0].accel_m_per_s2", "50 is out of range: accepted from 0.001 up to 5 m/s²"},
		{"text for a number", file(`{"mass_kg": "1 t", "rope_length_m": 5}`, ""), "load.mass_kg", "expected a number, found a JSON string"},
		{"text for a number in a move", "{" + head + `, "load": ` + good + `, "motions": [` + move + `, {"axis": "hoist", "distance_m": "2"}]}`,
			"motions[1].distance_m", "expected a number, found a JSON string"},
		{"object for a list", "{" + head + `, "load": ` + good + `, "motions": {}}`, "motions", "expected a list in [ ], found a JSON object"},
		{"number too large", file(`{"mass_kg": 1e400, "rope_length_m": 5}`, ""), "load.mass_kg", "too large"},
		{"fraction for a count", file(good, `, "settings": {"samples": 1.5}`), "settings.samples", "expected a whole number, found 1.5"},
		{"run too long", file(good, `, "settings": {"duration_s": 7200}`), "settings.duration_s", "accepted from 0 up to 3600 s"},
		{"unknown axis", "{" + head + `, "load": ` + good + `, "motions": [{"axis": "luff", "distance_m": 4}]}`, "motions[0].axis", `is "luff"`},
		{"wrong version", strings.Replace(file(good, ""), `"version": 1`, `"version": 2`, 1), "version", "this build reads version 1"},
		{"malformed JSON", file(`{"mass_kg": 1000, "rope_length_m": 5,}`, ""), "(file)", "not valid JSON at byte"},
		{"NaN", file(`{"mass_kg": NaN, "rope_length_m": 5}`, ""), "(file)", "not valid JSON"},
		{"empty file", "", "(file)", "the file is empty"},
		{"truncated file", file(good, "")[:80], "(file)", "ends in the middle"},
		{"trailing data", file(good, "") + "{}", "(file)", "more after the scenario's closing brace"},
		{"not an object", "[]", "(file)", "found a JSON array"},
		{"deeply nested", strings.Repeat("[", 1_000_000), "(file)", "nested 65 levels deep: a scenario has at most 64 levels"},
		{"deeply nested objects", strings.Repeat(`{"a":`, 200_000), "(file)", "a scenario has at most 64 levels"},
		{"too large", `{"name": "` + strings.Repeat("x", scenario.MaxFileBytes) + `"}`, "(file)", "larger than"},
	} {
		_, err := scenario.Parse([]byte(c.data))
		var es scenario.Errors
		if !errors.As(err, &es) || len(es) == 0 {
			t.Errorf("%s: want a field error, got %v", c.name, err)
			continue
		}
		if es[0].Field != c.field || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %q: %q; want field %q with %q", c.name, es[0].Field, es[0].Message, c.field, c.says)
		}
	}
}

// TestValidateMotion: one move checked alone names its fields as Validate
// does for the same move in a scenario (the planner's runs use it).
func TestValidateMotion(t *testing.T) {
	speed, accel, dist := 0.5, 0.2, 12.0
	good := scenario.Motion{Axis: "travel_x", DistanceM: &dist, SpeedMPerS: &speed, AccelMPerS2: &accel}
	if err := scenario.ValidateMotion(&good, "motions[0]"); err != nil {
		t.Fatalf("a valid move: %v", err)
	}
	bad := good
	fast := 99.0
	bad.SpeedMPerS = &fast
	bad.Steps = []scenario.SpeedStep{{AtS: 1}}
	err := scenario.ValidateMotion(&bad, "motions[0]")
	fe, ok := err.(scenario.Errors)
	if !ok || len(fe) != 2 || fe[0].Field != "motions[0].steps" || fe[1].Field != "motions[0].speed_m_per_s" {
		t.Fatalf("got %v, want errors at motions[0].steps and motions[0].speed_m_per_s", err)
	}
}
