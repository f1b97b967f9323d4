package sway

import (
	"os"
	"testing"

	"swaysheet/core/scenario"
)

// TestStagesAgree: the stages' and the error norm's sums written out
// (natively) and as loops (Options.loopedStages, as in wasm) give the same
// bits: every figure, the solver's counts and every history sample, in
// full and the path alone, for every example and reference scenario the
// specialised path takes, at the default and the tight accuracy. In wasm
// both runs take the loops.
func TestStagesAgree(t *testing.T) {
	checked := 0
	for _, file := range scenarioFiles(t) {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		s, err := scenario.Parse(data)
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		s.Plan, s.Site = nil, nil
		if su, err := build(s, false); err != nil || su.fast == nil {
			continue
		}
		checked++
		for _, acc := range []string{"default", "tight"} {
			s.Settings = &scenario.Settings{Accuracy: acc}
			for _, pathOnly := range []bool{false, true} {
				written, err := EvaluateWith(s, Options{PathOnly: pathOnly})
				if err != nil {
					t.Fatalf("%s: %v", file, err)
				}
				looped, err := EvaluateWith(s, Options{PathOnly: pathOnly, loopedStages: true})
				if err != nil {
					t.Fatalf("%s: %v", file, err)
				}
				sameResultBits(t, file+" ("+acc+")", written, looped)
			}
		}
	}
	if checked < 30 {
		t.Errorf("%d scenarios on the specialised path: the test checks too little", checked)
	}
	t.Logf("%d scenarios", checked)
}
