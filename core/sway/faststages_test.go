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
		sameWith(t, s, file, func(o *Options) { o.loopedStages = true }, "default", "tight")
	}
	if checked < 30 {
		t.Errorf("%d scenarios on the specialised path: the test checks too little", checked)
	}
	t.Logf("%d scenarios", checked)
}
