package sway

import (
	"math"
	"testing"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
)

// travelOf gives the span tables for trolley, bridge and hoist moves, the
// same motion as the closures over the combined profiles to rounding, and
// nil for a slewing arm (the closures then).
func TestTravelOf(t *testing.T) {
	var d crane.Drives
	for _, name := range []string{"travel_x", "travel_y", "hoist"} {
		a, _ := crane.Of(name)
		*d.Of(a) = motion.Sum{motion.NewTrapezoid(0.5, 3, 1, 0.5, 0.3), motion.NewTrapezoid(6, -1, 0.5, 0.4, 0.4)}
	}
	const l0 = 8
	tr := travelOf(&d, l0, crane.Start{})
	if tr == nil {
		t.Fatal("no span tables for travel and hoist moves")
	}
	susp, rope := d.Suspension(crane.Start{}), d.RopeLength(l0)
	// Forward as the solver goes, then back (a fresh evaluation).
	for _, tm := range []float64{0, 0.3, 1.2, 3.9, 6.1, 7.5, 12, 2, 0.1} {
		s, l, dl, ddl := tr.At(tm)
		k := susp(tm)
		wl, wdl, wddl := rope(tm)
		got := []float64{s.Pos.X, s.Pos.Y, s.Pos.Z, s.Vel.X, s.Vel.Y, s.Acc.X, s.Acc.Y, l, dl, ddl}
		want := []float64{k.Pos.X, k.Pos.Y, k.Pos.Z, k.Vel.X, k.Vel.Y, k.Acc.X, k.Acc.Y, wl, wdl, wddl}
		for i := range got {
			if math.Abs(got[i]-want[i]) > 1e-12*(1+math.Abs(want[i])) {
				t.Errorf("t = %g s: %v, closures %v", tm, got, want)
				break
			}
		}
	}
	a, _ := crane.Of("slew")
	*d.Of(a) = motion.Sum{motion.NewTrapezoid(1, 0.5, 0.1, 0.05, 0.05)}
	if travelOf(&d, l0, crane.Start{RadiusM: 20}) != nil {
		t.Error("span tables for a slewing arm: its geometry is the closures'")
	}
}
