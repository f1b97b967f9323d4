package sway

import (
	"math"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
)

// TestStoppedFastPathAgrees: a move cut by an emergency stop keeps the
// specialised single-rope path, and it agrees with the general one (as
// TestFastPathAgrees, 1e-8 of the rope on the load's path), for a plain
// move, a shaped one (several components frozen at the stop) and two
// moves at once.
func TestStoppedFastPathAgrees(t *testing.T) {
	for _, name := range []string{"bay-travel", "tower-slew", "diagonal-travel", "hoist-during-travel", "hard-stop", "pendant-steps"} {
		s := testscenario.Example(t, name)
		s.Plan, s.Site = nil, nil
		for _, at := range []float64{0.5, 3, 9} {
			d := *s
			d.Motions = append([]scenario.Motion(nil), s.Motions...)
			if at == 3 {
				d.Motions[0].Shaper = &scenario.ShaperSpec{Kind: "zvd"}
			}
			for i := range d.Motions {
				d.Motions[i].Stop = &scenario.StopCut{AtS: at, ReactionS: 1}
			}
			su, err := build(&d, true)
			if err != nil {
				t.Fatal(err)
			}
			if su.fast == nil {
				t.Fatalf("%s, stop at %g s: the specialised path was not taken", name, at)
			}
			fast, err := EvaluateWith(&d, Options{})
			if err != nil {
				t.Fatal(err)
			}
			gen, err := EvaluateWith(&d, Options{General: true})
			if err != nil {
				t.Fatal(err)
			}
			l := gen.RopeLengthStartM
			for i := range fast.History.TimeS {
				for _, p := range [][2]float64{{fast.History.RelXM[i], gen.History.RelXM[i]},
					{fast.History.RelYM[i], gen.History.RelYM[i]},
					{fast.History.SuspensionXM[i], gen.History.SuspensionXM[i]},
					{fast.History.SuspensionYM[i], gen.History.SuspensionYM[i]}} {
					if math.Abs(p[0]-p[1]) > 1e-8*l {
						t.Fatalf("%s, stop at %g s, sample %d: fast %g, general %g", name, at, i, p[0], p[1])
					}
				}
			}
		}
	}
}
