package plan

import (
	"strings"
	"testing"
)

// decided stops drawing at a rope length only when the verdict of all 40
// draws is known: 36 inside every limit (within) or 5 beyond one limit
// (outside), after MinTimingDraws at least. The percentile's rank was once
// computed as 90/100 in integer constants (0), which made every rope
// length stop at MinTimingDraws whatever the draws gave.
func TestDecidedNeedsTheVerdictOfAll(t *testing.T) {
	rq := &request{lim: Limits{PeakSwingDeg: 3, ResidualSwingDeg: 0.5}}
	in, out := Verified{PeakSwingDeg: 1, ResidualSwingDeg: 0.2}, Verified{PeakSwingDeg: 1, ResidualSwingDeg: 0.8}
	runs := func(nIn, nOut int) []Verified {
		var ds []Verified
		for range nIn {
			ds = append(ds, in)
		}
		for range nOut {
			ds = append(ds, out)
		}
		return ds
	}
	for _, c := range []struct {
		nIn, nOut int
		want      bool
	}{
		{20, 0, false}, {35, 0, false}, {36, 0, true}, {16, 4, false}, {15, 5, true}, {4, 5, false}, {31, 4, false}, {35, 4, false}, {36, 4, true},
	} {
		if got := rq.decided(runs(c.nIn, c.nOut), TimingDraws); got != c.want {
			t.Errorf("%d inside, %d beyond: decided %v, want %v", c.nIn, c.nOut, got, c.want)
		}
	}
}

// A pendant option that is recommended is checked again at the default
// accuracy with its drawn timings in the seeded order until the verdict
// of all 40 is decided by simulation alone: at least 36 draws inside
// every limit at every rope length (the first pass simulated only the
// draws linear theory says can be the percentile).
func TestRecommendedPendantCheckedByEveryDraw(t *testing.T) {
	s := load(t, "plan-gantry-pendant.json")
	sig := 0.05
	s.Plan.TimingSigmaS = &sig
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Recommended != 0 || r.Options[0].Key != "own_pendant" {
		t.Fatalf("recommended %d (%s), want the pendant steps", r.Recommended, r.Options[0].Key)
	}
	for _, v := range r.Options[0].Verified {
		if v.Draws < 36 || v.simulated != v.Draws {
			t.Errorf("at %g m: percentile over %d draws, %d simulated; want 36 or more, all simulated", v.RopeLengthM, v.Draws, v.simulated)
		}
	}
}

// Where the small-angle theory is off (a 3 m rope and sudden ramps of
// 1.5 m/s²: swings of some 15 deg), an estimate differs from its
// simulation by more than half its margin and the draws are simulated in
// the seeded order until the verdict of all 40 is decided, as without the
// estimates: every draw the percentile is over is simulated, the verdict
// is the one every draw simulated gives, and the findings do not speak of
// estimates.
func TestTimingDrawsFallBackWhenLinearTheoryIsOff(t *testing.T) {
	s := load(t, "plan-gantry-pendant.json")
	l, lo, hi, a := 3.0, 2.85, 3.15, 1.5
	s.Load.RopeLengthM, s.Plan.RopeLengthMinM, s.Plan.RopeLengthMaxM = &l, &lo, &hi
	s.Plan.MaxAccelMPerS2 = &a
	s.Plan.PendantStepsPct = []float64{50, 100}
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	full := withoutScreening(t, s)
	o, f := optionByKey(t, r, "own_pendant"), optionByKey(t, full, "own_pendant")
	if o.Within != f.Within {
		t.Errorf("within %v, with every draw simulated %v", o.Within, f.Within)
	}
	for _, v := range o.Verified {
		if v.simulated != v.Draws || v.Draws < MinTimingDraws {
			t.Errorf("at %g m: percentile over %d draws, %d simulated", v.RopeLengthM, v.Draws, v.simulated)
		}
	}
	for _, x := range o.Findings {
		if strings.Contains(x, "linear-theory estimate") {
			t.Errorf("findings speak of estimates: %q", x)
		}
	}
}
