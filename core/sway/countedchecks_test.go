package sway

import (
	"reflect"
	"testing"

	"swaysheet/core/scenario"
)

// TestCountedChecks: with Options.CountedChecks an evaluation has the same
// checks and as many warnings as without, the limit checks' warnings left
// unworded (empty) and every other warning as it was; the examples are
// run with every limit at its lowest accepted value, so that checks fail.
func TestCountedChecks(t *testing.T) {
	for name, s := range loadExamples(t) {
		base, err := Evaluate(s)
		if err != nil {
			t.Fatal(name, err)
		}
		tight := *s
		tight.Limits = &tight0
		worded, err := Evaluate(&tight)
		if err != nil {
			t.Fatal(name, err)
		}
		counted, err := EvaluateWith(&tight, Options{CountedChecks: true})
		if err != nil {
			t.Fatal(name, err)
		}
		if !reflect.DeepEqual(worded.Checks, counted.Checks) || len(worded.Warnings) != len(counted.Warnings) {
			t.Fatalf("%s: checks %v and %d warnings; counted %v and %d", name, worded.Checks, len(worded.Warnings), counted.Checks, len(counted.Warnings))
		}
		if len(s.Motions) > 0 && len(worded.Warnings) <= len(base.Warnings) {
			t.Errorf("%s: no check failed with the limits tightened", name)
		}
		empty := 0
		for i, w := range counted.Warnings {
			if w == "" {
				empty++
			} else if w != worded.Warnings[i] {
				t.Errorf("%s: warning %d is %q, worded %q", name, i, w, worded.Warnings[i])
			}
		}
		if empty != len(worded.Checks)-countWithin(worded.Checks) {
			t.Errorf("%s: %d empty warnings, %d checks outside", name, empty, len(worded.Checks)-countWithin(worded.Checks))
		}
	}
}

// tight0 is each limit at the lowest value accepted (scenario.Ranges).
var tight0 = func() scenario.Limits {
	low := func(key string) *float64 { v := scenario.Ranges["limits."+key].Min; return &v }
	return scenario.Limits{PeakSwingDeg: low("peak_swing_deg"), PeakExcursionM: low("peak_excursion_m"),
		ResidualSwingDeg: low("residual_swing_deg"), ResidualExcursionM: low("residual_excursion_m"),
		TensionFactor: low("tension_factor"), PeakTiltDeg: low("peak_tilt_deg")}
}()

func countWithin(cs []Check) int {
	n := 0
	for _, c := range cs {
		if c.Within {
			n++
		}
	}
	return n
}
