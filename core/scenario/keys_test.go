package scenario_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// TestKeysCaseAndTwice checks that a key differing from a known one only by
// case, and a key given twice in one object, are errors naming the key's
// path (encoding/json alone matches keys regardless of case and keeps the
// last of two).
func TestKeysCaseAndTwice(t *testing.T) {
	for _, c := range []struct{ name, data, field, msg string }{
		{"case", file(`{"mass_kg": 1000, "rope_length_m": 8, "Rope_Length_M": 40}`, ""),
			"load.Rope_Length_M", "unknown field; field names are case-sensitive (did you mean rope_length_m?)"},
		{"case alone", file(`{"mass_kg": 1000, "ROPE_LENGTH_M": 8}`, ""),
			"load.ROPE_LENGTH_M", "unknown field; field names are case-sensitive (did you mean rope_length_m?)"},
		{"twice", file(`{"mass_kg": 1000, "rope_length_m": 8, "rope_length_m": 40}`, ""),
			"load.rope_length_m", "appears twice"},
		{"twice escaped", file(`{"mass_kg": 1000, "rope_length_m": 8, "rope\u005flength_m": 40}`, ""),
			"load.rope_length_m", "appears twice"},
		{"twice at the top", file(`{"mass_kg": 1000, "rope_length_m": 8}`, `, "name": "again"`),
			"name", "appears twice"},
		{"case in a move", "{" + head + `, "load": {"mass_kg": 1000, "rope_length_m": 5}, "motions": [` + move +
			`, {"axis": "hoist", "Distance_M": 2, "speed_m_per_s": 0.1, "accel_m_per_s2": 0.1}]}`,
			"motions[1].Distance_M", "did you mean distance_m?"},
		{"case in an embedded field", "{" + head + `, "load": {"mass_kg": 1000, "rope_length_m": 5}, "motions": [` +
			`{"axis": "travel_x", "profile": "s_curve", "distance_m": 4, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3, "Rounding_S": 1}]}`,
			"motions[0].Rounding_S", "did you mean rounding_s?"},
		{"twice in a shaper", "{" + head + `, "load": {"mass_kg": 1000, "rope_length_m": 5}, "motions": [` +
			`{"axis": "travel_x", "distance_m": 4, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3, "shaper": {"kind": "zv", "kind": "ei"}}]}`,
			"motions[0].shaper.kind", "appears twice"},
		{"twice in a plan list", file(`{"mass_kg": 1000, "rope_length_m": 5}`,
			`, "plan": {"axis": "travel_x", "distance_m": 4, "distance_m": 5}`), "plan.distance_m", "appears twice"},
		{"case in the sheet", file(`{"mass_kg": 1000, "rope_length_m": 5}`, `, "sheet": {"Project": "x"}`),
			"sheet.Project", "did you mean project?"},
		{"twice in the sheet", file(`{"mass_kg": 1000, "rope_length_m": 5}`, `, "sheet": {"project": "x", "project": "y"}`),
			"sheet.project", "appears twice"},
		{"case at the top", file(`{"mass_kg": 1000, "rope_length_m": 5}`, `, "Wind": {"force_n": 3}`),
			"Wind", "did you mean wind?"},
	} {
		_, err := scenario.Parse([]byte(c.data))
		var es scenario.Errors
		if !errors.As(err, &es) || len(es) == 0 {
			t.Errorf("%s: want a field error, got %v", c.name, err)
			continue
		}
		want := c.field + ": " + c.msg
		if es[0].Field != c.field || !strings.Contains(es[0].Message, c.msg) {
			t.Errorf("%s: got %q, want %q", c.name, es[0].Error(), want)
		}
	}
}
