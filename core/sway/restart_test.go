package sway_test

import (
	"math"
	"slices"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestMotionOrder checks that the order in which a scenario lists its
// moves does not change the result: the integrator must restart at every
// breakpoint of every move and of the wind, whichever comes first in the
// file. (A regression test: the restarts were once taken in list order,
// which skipped every breakpoint earlier than one listed before it.)
func TestMotionOrder(t *testing.T) {
	for _, rel := range []string{
		"testdata/reference/scenarios/all-axes.json",
		"testdata/scenarios/diagonal-travel.json",
		"testdata/reference/scenarios/gust-drag-travel.json",
	} {
		a := readScenario(t, rel)
		a.Settings = &scenario.Settings{Accuracy: "tight"}
		b := readScenario(t, rel)
		b.Settings = &scenario.Settings{Accuracy: "tight"}
		slices.Reverse(b.Motions)
		ra, err := sway.Evaluate(a)
		if err != nil {
			t.Fatal(err)
		}
		rb, err := sway.Evaluate(b)
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			what     string
			x, y, to float64
		}{
			{"peak_swing_deg", ra.PeakSwingDeg, rb.PeakSwingDeg, 1e-9},
			{"residual_swing_deg", ra.ResidualSwingDeg, rb.ResidualSwingDeg, 1e-9},
			{"peak_excursion_m", ra.PeakExcursionM, rb.PeakExcursionM, 1e-9},
			{"tension_factor", ra.TensionFactor, rb.TensionFactor, 1e-11},
		} {
			if d := math.Abs(c.x - c.y); !(d <= c.to) {
				t.Errorf("%s: %s %.12g with the moves as listed, %.12g reversed (differ by %.3g)", rel, c.what, c.x, c.y, d)
			}
		}
		// The solver restarts at the same points whatever the order, so
		// it takes the same steps.
		if ra.Solver.Steps != rb.Solver.Steps {
			t.Errorf("%s: %d steps with the moves as listed, %d reversed", rel, ra.Solver.Steps, rb.Solver.Steps)
		}
	}
}
