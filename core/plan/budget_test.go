package plan

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestPlanBudget checks that a plan whose runs need more computing than
// allowed (a tiny hook block on a 0.3 m rope: a stiff second mode) ends
// with a message naming what to narrow, instead of running on for minutes.
func TestPlanBudget(t *testing.T) {
	s, err := scenario.Parse([]byte(`{"format": "swaysheet-scenario", "version": 1, "name": "stiff hook",
	  "load": {"mass_kg": 1000, "rope_length_m": 0.3, "hook": {"mass_kg": 0.1, "rigging_length_m": 0.1}},
	  "motions": [], "limits": {"peak_swing_deg": 5, "residual_swing_deg": 0.5},
	  "plan": {"axis": "travel_x", "distance_m": 2000, "top_speed_m_per_s": 10, "max_accel_m_per_s2": 5,
	           "rope_length_min_m": 0.3, "rope_length_max_m": 500}}`))
	if err != nil {
		t.Fatal(err)
	}
	_, err = makeWith(s, sway.NewBudget(1e7, budgetMessage))
	if !errors.Is(err, sway.ErrWorkLimit) {
		t.Fatalf("want the work limit, got %v", err)
	}
	for _, want := range []string{"This plan needs more computing than allowed", "plan.rope_length_min_m", "plan.distance_m"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("message %q lacks %q", err, want)
		}
	}
}
