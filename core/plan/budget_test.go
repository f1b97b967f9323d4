package plan

import (
	"errors"
	"math"
	"strings"
	"testing"

	"swaysheet/core/motion"
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

// TestSlewScreeningIsCharged: the linear theory of a slew (a quadrature of
// 8 points a period over the whole slew, at every rope length and ramp
// tried) draws on the plan's budget like the simulations. A slow slew of
// a 0.3 m rope with a hook block over rope lengths 0.3 to 500 m (found by
// FuzzPlanValues, whose runs stopped on Go's 10 s limit for one input)
// spent about 4 s of one core in that screening with nothing charged.
func TestSlewScreeningIsCharged(t *testing.T) {
	p := motion.NewTrapezoid(0, 0.1, 3e-4, 2e-4, 2e-4) // rad: a slow slew of 5.7 deg
	w := 2 * math.Pi / 1.1                             // a 0.3 m rope
	want := slewResidual(p, 20, w)
	full := sway.NewBudget(1e9, "")
	rq := &request{budget: full, radius: 20}
	if got := rq.slewResidual(p, w); got != want {
		t.Errorf("charged quadrature %g, the plain one %g", got, want)
	}
	if spent := 1e9 - full.Left(); spent != 4*slewResidualPoints(p, w) || spent < 4*2000 {
		t.Errorf("spent %d units for %d points", spent, slewResidualPoints(p, w))
	}
	empty := sway.NewBudget(1, "")
	rq.budget = empty
	if got := rq.slewResidual(p, w); !math.IsInf(got, 1) || empty.Left() >= 0 {
		t.Errorf("a spent budget: residual %g, left %d", got, empty.Left())
	}

	// The plan itself ends with the budget's message.
	data := `{"format": "swaysheet-scenario", "version": 1, "name": "fuzz",
	  "load": {"mass_kg": 2000, "rope_length_m": 0.3, "hook": {"mass_kg": 0.1, "rigging_length_m": 0.1}}, "crane": {"radius_m": 20},
	  "motions": [], "limits": {"peak_swing_deg": 0.04, "residual_swing_deg": 0.01},
	  "plan": {"axis": "slew", "angle_deg": -5.99875, "top_rate_deg_per_s": 0.02, "max_accel_deg_per_s2": 0.01,
	    "rope_length_min_m": 0.3, "rope_length_max_m": 500}}`
	s, err := scenario.Parse([]byte(data))
	if err != nil {
		t.Fatal(err)
	}
	if _, err = makeWith(s, sway.NewBudget(5e6, budgetMessage)); !errors.Is(err, sway.ErrWorkLimit) || err.Error() != budgetMessage {
		t.Fatalf("want the budget's error, got %v", err)
	}
}
