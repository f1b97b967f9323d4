package sway

import (
	"math"
	"testing"

	"swaysheet/core/units"
)

// The load of the wind-gust example hangs off plumb by the static offset:
// the closed form of a mass on a rope under a horizontal force (statics,
// tan(theta) = F/(m*g)), and the middle about which the simulated load
// swings once the gust has struck (its mean over whole periods).
func TestWindOffset(t *testing.T) {
	ex := loadExamples(t)
	s := ex["wind-gust"]
	r, err := Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	F, m, L := r.WindForceN, *s.Load.MassKg, *s.Load.RopeLengthM
	want := L * math.Sin(math.Atan(F/(m*units.StandardGravity)))
	if math.Abs(r.WindOffsetM-want) > 1e-12*want {
		t.Fatalf("offset %.15g m, statics gives %.15g m", r.WindOffsetM, want)
	}
	// The load swings about the offset, toward +y (toward_deg 90): the
	// mean of rel_y over the three periods after the gust at 2 s.
	h := r.History
	sum, n := 0.0, 0
	for i, ts := range h.TimeS {
		if ts >= s.Wind.StartS && ts < s.Wind.StartS+3*r.PeriodS {
			sum += h.RelYM[i]
			n++
		}
	}
	if mean := sum / float64(n); math.Abs(mean-want) > 0.02*want {
		t.Errorf("simulated load swings about %.4f m, the static offset is %.4f m", mean, want)
	}
	// With a hook block the rope and the rigging lean apart; their
	// offsets add up to the line to the load's lean (WindLeanRad).
	h2 := ex["heavy-hook-long-slings"]
	off := WindOffsetM(h2, 2000, 8)
	lean := WindLeanRad(h2, 2000, 8)
	mg := (*h2.Load.MassKg + *h2.Load.Hook.MassKg) * units.StandardGravity
	z := 8*mg/math.Hypot(2000, mg) + *h2.Load.Hook.RiggingLengthM**h2.Load.MassKg*units.StandardGravity/math.Hypot(2000, *h2.Load.MassKg*units.StandardGravity)
	if math.Abs(math.Atan2(off, z)-lean) > 1e-12 {
		t.Errorf("hook block: offset %.6g m at height %.6g m leans %.9g rad, WindLeanRad %.9g rad", off, z, math.Atan2(off, z), lean)
	}
}
