package plan

import (
	"math"
	"reflect"
	"testing"
)

// TestCheckAtOnce holds the plan made with the likely recommendation
// simulated at the check tolerance at once (atCheckTol) to the plan made
// with every option simulated at RelTol first and the recommended one
// rechecked: the same recommendation with the same figures (both at
// CheckRelTol), the other options' figures within 1e-4 deg and 1e-4 m of
// each other (an option guessed wrongly keeps its figures at CheckRelTol,
// RelTol's agree with the SciPy reference to about 1e-4 deg), and never
// more simulations; fewer where the guess saves the recheck.
func TestCheckAtOnce(t *testing.T) {
	fewer := map[string]int{"plan-bay-travel.json": 10, "plan-tower-slew.json": 15, "plan-precast-hook.json": 10}
	for name, s := range screeningCases(t) {
		at, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		checkAtOnce = false
		plain, err := Make(s)
		checkAtOnce = true
		if err != nil {
			t.Fatal(err)
		}
		if at.Recommended != plain.Recommended || len(at.Options) != len(plain.Options) {
			t.Fatalf("%s: recommended %d of %d options, rechecked plan %d of %d", name, at.Recommended, len(at.Options), plain.Recommended, len(plain.Options))
		}
		if at.Simulations > plain.Simulations {
			t.Errorf("%s: %d simulations, more than the rechecked plan's %d", name, at.Simulations, plain.Simulations)
		}
		if n, ok := fewer[name]; ok && at.Simulations != n {
			t.Errorf("%s: %d simulations, want %d (the recommendation's recheck saved)", name, at.Simulations, n)
		}
		for i := range at.Options {
			a, p := &at.Options[i], &plain.Options[i]
			if a.Key != p.Key || a.Within != p.Within || len(a.Verified) != len(p.Verified) {
				t.Fatalf("%s: option %d is %s (within %v), rechecked plan %s (within %v)", name, i, a.Key, a.Within, p.Key, p.Within)
			}
			for l := range a.Verified {
				va, vp := a.Verified[l], p.Verified[l]
				if i == at.Recommended && !reflect.DeepEqual(va, vp) {
					t.Errorf("%s: recommended %s at %g m: %+v, rechecked %+v", name, a.Key, va.RopeLengthM, va, vp)
				}
				d := math.Max(math.Max(math.Abs(va.PeakSwingDeg-vp.PeakSwingDeg), math.Abs(va.ResidualSwingDeg-vp.ResidualSwingDeg)),
					math.Max(math.Abs(va.PeakExcursionM-vp.PeakExcursionM), math.Abs(va.ResidualExcursionM-vp.ResidualExcursionM)))
				if d > 1e-4 {
					t.Errorf("%s: %s at %g m differs by %.2g from the rechecked plan", name, a.Key, va.RopeLengthM, d)
				}
			}
		}
		t.Logf("%s: %d simulations (rechecked plan %d)", name, at.Simulations, plain.Simulations)
	}
}
