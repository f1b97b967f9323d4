package draws

import (
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/sway"
)

// The draws skip the hook block's measured mode periods
// (sway.Options.NoModePeriods): the four figures they gather are the same
// with and without them.
func TestHookFiguresWithoutModePeriods(t *testing.T) {
	s := testscenario.Example(t, "heavy-hook-long-slings")
	with, err := sway.EvaluateWith(s, sway.Options{NoHistory: true})
	if err != nil {
		t.Fatal(err)
	}
	r, err := Run(s, Request{Runs: 1, Seed: 1}, 1)
	if err != nil {
		t.Fatal(err)
	}
	f := r.Figures
	if f.PeakSwingDeg[0] != with.PeakSwingDeg || f.PeakExcursionM[0] != with.PeakExcursionM ||
		f.ResidualSwingDeg[0] != with.ResidualSwingDeg || f.TensionFactor[0] != with.TensionFactor {
		t.Fatalf("draw %+v, evaluation with mode periods %v %v %v %v", f, with.PeakSwingDeg, with.PeakExcursionM, with.ResidualSwingDeg, with.TensionFactor)
	}
	if with.Rigging == nil || with.Rigging.SimulatedPeriodsS[0] == 0 {
		t.Fatal("the example has no hook block with measured periods")
	}
}
