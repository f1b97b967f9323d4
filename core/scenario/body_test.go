package scenario_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// TestBodyBadInput checks that bad load.body fields get a message naming
// the field and saying what is accepted.
func TestBodyBadInput(t *testing.T) {
	load := func(body string) string { return `{"mass_kg": 5000, "rope_length_m": 5, "body": ` + body + `}` }
	box := `"length_m": 8, "width_m": 0.5, "height_m": 1`
	two := `"legs": [{"length_m": 5, "attach_x_m": 3, "attach_z_m": 0.5}, {"length_m": 5, "attach_x_m": -3, "attach_z_m": 0.5}]`
	for _, c := range []struct {
		name, load, field, says string
	}{
		{"no size", load(`{` + two + `, "hook_mass_kg": 100}`), "load.body.length_m", "is required: accepted from 0.01 up to 100 m"},
		{"three legs", load(`{` + box + `, "legs": [{"length_m": 5, "attach_z_m": 0.5}, {"length_m": 5, "attach_z_m": 0.5}, {"length_m": 5, "attach_z_m": 0.5}]}`),
			"load.body.legs", "has 3 legs: give two or four legs"},
		{"no legs", load(`{` + box + `}`), "load.body.legs", "has 0 legs"},
		{"leg without length", load(`{` + box + `, "hook_mass_kg": 100, "legs": [{"attach_z_m": 0.5}, {"length_m": 5, "attach_z_m": 0.5}]}`),
			"load.body.legs[0].length_m", "is required: accepted from 0.1 up to 100 m"},
		{"leg without height", load(`{` + box + `, "hook_mass_kg": 100, "legs": [{"length_m": 5}, {"length_m": 5, "attach_z_m": 0.5}]}`),
			"load.body.legs[0].attach_z_m", "is required"},
		{"two legs without a hook block", load(`{` + box + `, ` + two + `}`), "load.body.hook_mass_kg", "is required with two legs, at least 5 kg"},
		{"legs and spreader", load(`{` + box + `, ` + two + `, "spreader": {"spacing_m": 4}}`), "load.body.legs", "not both"},
		{"spreader without spacing", load(`{` + box + `, "spreader": {}}`), "load.body.spreader.spacing_m", "is required"},
		{"hook block on a spreader", load(`{` + box + `, "hook_mass_kg": 100, "spreader": {"spacing_m": 4}}`), "load.body.hook_mass_kg", "does not apply with a spreader"},
		{"impossible gyration", load(`{` + box + `, "gyration_height_m": 9, "spreader": {"spacing_m": 4}}`), "load.body.gyration_height_m", "at most the sum"},
		{"body and hook", `{"mass_kg": 5000, "rope_length_m": 5, "hook": {"mass_kg": 100, "rigging_length_m": 2}, "body": {` + box + `, "spreader": {"spacing_m": 4}}}`,
			"load.hook", "does not apply with load.body"},
		{"tandem and spreader", load(`{` + box + `, "spreader": {"spacing_m": 4}, "tandem": {"ropes": [{"attach_x_m": 3}, {"attach_x_m": -3}]}}`), "load.body.tandem", "not more"},
		{"one tandem rope", load(`{` + box + `, "tandem": {"ropes": [{"attach_x_m": 3}]}}`), "load.body.tandem.ropes", "has 1 ropes: a tandem lift has two"},
		{"tandem rope without attach", load(`{` + box + `, "tandem": {"ropes": [{"length_m": 5}, {"attach_x_m": -3}]}}`), "load.body.tandem.ropes[0].attach_x_m", "is required: accepted from -60 up to 60 m"},
		{"tandem rope too long", load(`{` + box + `, "tandem": {"ropes": [{"length_m": 900, "attach_x_m": 3}, {"attach_x_m": -3}]}}`), "load.body.tandem.ropes[0].length_m", "accepted from 0.1 up to 500 m"},
		{"tandem spacing", load(`{` + box + `, "tandem": {"spacing_m": 0, "ropes": [{"attach_x_m": 3}, {"attach_x_m": -3}]}}`), "load.body.tandem.spacing_m", "accepted from 0.1 up to 100 m"},
		{"tandem ropes crossed", load(`{` + box + `, "tandem": {"ropes": [{"attach_x_m": -3}, {"attach_x_m": 3}]}}`), "load.body.tandem.ropes[1].attach_x_m", "not behind ropes[0].attach_x_m"},
		{"tandem rope too short for the plan", `{"mass_kg": 5000, "rope_length_m": 5, "body": {` + box + `, "tandem": {"ropes": [{"attach_x_m": 3}, {"length_m": 1, "attach_x_m": -3}]}}}`,
			"load.body.tandem.ropes[1].length_m", "at plan.rope_length_min_m this rope would be"},
		{"hook block on two ropes", load(`{` + box + `, "hook_mass_kg": 100, "tandem": {"ropes": [{"attach_x_m": 3}, {"attach_x_m": -3}]}}`), "load.body.hook_mass_kg", "does not apply with two hook ropes"},
		{"unknown body field", load(`{` + box + `, "spreader": {"spacing_m": 4}, "colour": 1}`), "load.body.colour", "unknown field"},
	} {
		rest := ""
		if strings.Contains(c.name, "plan") {
			rest = `, "plan": {"axis": "travel_x", "distance_m": 10, "top_speed_m_per_s": 0.5, "max_accel_m_per_s2": 0.3, "rope_length_min_m": 4, "rope_length_max_m": 6}`
		}
		_, err := scenario.Parse([]byte(file(c.load, rest)))
		var es scenario.Errors
		if !errors.As(err, &es) || len(es) == 0 {
			t.Errorf("%s: want a field error, got %v", c.name, err)
			continue
		}
		found := false
		for _, e := range es {
			if e.Field == c.field && strings.Contains(e.Message, c.says) {
				found = true
			}
		}
		if !found {
			t.Errorf("%s: got %v; want field %q with %q", c.name, es, c.field, c.says)
		}
	}
}
