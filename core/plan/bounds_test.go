package plan

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

func slewPlan(angle, rate, accel, radius, peak string, steps string) string {
	return `{"format": "swaysheet-scenario", "version": 1, "name": "tiny slew", "load": {"mass_kg": 1000, "rope_length_m": 5},
	  "crane": {"radius_m": ` + radius + `}, "motions": [], "limits": {"peak_swing_deg": ` + peak + `, "residual_swing_deg": 0.01},
	  "plan": {"axis": "slew", "angle_deg": ` + angle + `, "top_rate_deg_per_s": ` + rate + `, "max_accel_deg_per_s2": ` + accel + steps + `}}`
}

// TestPlanAtTheBounds checks plans at the smallest accepted values: the
// planner must give a result (an option whose own move would be below
// what a drive does is left out, saying why) or an error at a plan field,
// never an error about a move the user did not write.
func TestPlanAtTheBounds(t *testing.T) {
	for _, c := range []struct{ name, data string }{
		{"slowest slew", slewPlan("0.01", "0.01", "0.01", "0.1", "0.01", "")},
		{"tiny fast slew", slewPlan("0.01", "36", "30", "150", "0.01", "")},
		{"tiny slew on own pendant", slewPlan("0.01", "0.01", "30", "0.001", "0.01", `, "pendant_steps_pct": [1, 2, 3, 4, 100]`)},
		{"tiny slew with a hook block, pendant steps out of order (found by FuzzPlanValues)", `{"format": "swaysheet-scenario", "version": 1, "name": "fuzz",
		  "load": {"mass_kg": 2000, "rope_length_m": 0.3, "hook": {"mass_kg": 48.1, "rigging_length_m": 7}}, "crane": {"radius_m": 20},
		  "motions": [], "limits": {"peak_swing_deg": 0.01, "residual_swing_deg": 71.01},
		  "plan": {"axis": "slew", "angle_deg": 0.01, "top_rate_deg_per_s": 0.01, "max_accel_deg_per_s2": 0.01, "rope_length_min_m": 0.3, "rope_length_max_m": 500}}`},
		{"smallest travel", `{"format": "swaysheet-scenario", "version": 1, "name": "tiny travel", "load": {"mass_kg": 1000, "rope_length_m": 0.3},
		  "motions": [], "limits": {"peak_excursion_m": 0.001, "residual_swing_deg": 0.01},
		  "plan": {"axis": "travel_x", "distance_m": 0.01, "top_speed_m_per_s": 0.001, "max_accel_m_per_s2": 0.001, "pendant_steps_pct": [1, 100]}}`},
	} {
		s, err := scenario.Parse([]byte(c.data))
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		res, err := Make(s)
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		for _, m := range res.Infeasible {
			if strings.Contains(m, "motions[") && !strings.Contains(m, "is not offered") {
				t.Errorf("%s: %q", c.name, m)
			}
		}
	}
	// The fastest move itself too long: an error at the plan's field.
	_, err := scenario.Parse([]byte(slewPlan("3600", "0.01", "0.01", "20", "2", "")))
	var es scenario.Errors
	if !errors.As(err, &es) || es[0].Field != "plan.top_rate_deg_per_s" ||
		!strings.Contains(es[0].Message, "at most 3600 s is simulated; raise plan.top_rate_deg_per_s (accepted from 0.01 up to 36 deg/s)") {
		t.Errorf("slow long slew: got %v", err)
	}
}
