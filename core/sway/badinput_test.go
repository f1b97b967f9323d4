package sway_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestBadMotion checks the bad inputs that only the evaluation can see
// (the README's "Bad input" table): an error naming the field, or a result
// with a warning.
func TestBadMotion(t *testing.T) {
	const head = `{"format": "swaysheet-scenario", "version": 1, "name": "bad motion", "load": {"mass_kg": 1000, "rope_length_m": 5}, `
	for _, c := range []struct {
		name, rest string
		field      string // error expected on this field, or
		warning    string // a result with this warning
	}{
		{"rope to zero while hoisting", `"motions": [{"axis": "hoist", "distance_m": 5, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3}]}`,
			"load.rope_length_m", ""},
		{"radius below zero", `"crane": {"radius_m": 5}, "motions": [{"axis": "radius", "distance_m": -8, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3}]}`,
			"crane.radius_m", ""},
		{"run too long", `"motions": [{"axis": "travel_x", "start_s": 3590, "distance_m": 4, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3}]}`,
			"settings.duration_s", ""},
		{"move too short for its speed", `"motions": [{"axis": "travel_x", "distance_m": 0.5, "speed_m_per_s": 1, "accel_m_per_s2": 0.3}]}`,
			"", "too short to reach its top speed"},
		{"slack rope", `"initial": {"swing_deg": 60, "velocity_x_m_per_s": 6}, "motions": []}`,
			"", "The rope goes slack"},
		{"swing over the top", `"initial": {"velocity_x_m_per_s": 17}, "motions": []}`,
			"", "over the top"},
	} {
		s, err := scenario.Parse([]byte(head + c.rest))
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		res, err := sway.Evaluate(s)
		if c.field != "" {
			var es scenario.Errors
			if !errors.As(err, &es) || es[0].Field != c.field {
				t.Errorf("%s: want an error on %s, got %v", c.name, c.field, err)
			}
			continue
		}
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		found := false
		for _, w := range res.Warnings {
			found = found || strings.Contains(w, c.warning)
		}
		if !found {
			t.Errorf("%s: no warning with %q in %q", c.name, c.warning, res.Warnings)
		}
	}
}

// TestStepLimit checks that a run needing more integration steps than
// allowed ends with an error that says what to do, instead of running on.
func TestStepLimit(t *testing.T) {
	s := readScenario(t, "testdata/scenarios/bay-travel.json")
	_, err := sway.EvaluateWith(s, sway.Options{NoHistory: true, MaxSteps: 300})
	if !errors.Is(err, sway.ErrStepLimit) {
		t.Fatalf("want the step limit error, got %v", err)
	}
	for _, want := range []string{"This run needs more computing than allowed", "settings.rel_tol", "300 steps by t ="} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("message %q lacks %q", err, want)
		}
	}
}
