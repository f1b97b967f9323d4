package sway

import (
	"math"
	"testing"

	"swaysheet/core/ode"
)

// TestDoubleSolverAsOde: doubleSolver takes ode.Solver's steps to the bit
// on the hook block's model (ode.Solver given fastDouble.Func): every
// step's interval, state, rate, dense output and its rate inside the
// step, and the counts, through the restarts and projections of the hook
// block's scan, along every example with a hook block, at the default and
// a tight tolerance.
func TestDoubleSolverAsOde(t *testing.T) {
	checked := 0
	for name, s := range loadExamples(t) {
		su, err := build(s, false)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		d, ok := su.model.(*fastDouble)
		if !ok {
			continue
		}
		checked++
		tEnd := su.motionEnd + 10
		for _, tol := range []float64{DefaultRelTol, 1e-10} {
			set := ode.Settings{RelTol: tol, AbsTol: tol * 1e-2, MaxSteps: 100000}
			gen := ode.New(d.Func, 12, set)
			fast := newDoubleSolver(d, set)
			var y [12]float64
			copy(y[:], su.y0)
			gen.Reset(0, y[:])
			fast.reset(0, &y)
			at := 0.0
			for _, cut := range restartCuts(su.breaks, tEnd) {
				if cut <= at {
					continue
				}
				d.segment(at, cut)
				gen.Reset(at, gen.State())
				fast.reset(at, fast.state())
				for {
					dg, eg := gen.Step(cut)
					df, ef := fast.Step(cut)
					if eg != nil || ef != nil || dg != df {
						t.Fatalf("%s: ode.Solver (%v, %v), doubleSolver (%v, %v)", name, dg, eg, df, ef)
					}
					g0, g1 := gen.LastStep()
					f0, f1 := fast.LastStep()
					if g0 != f0 || g1 != f1 {
						t.Fatalf("%s: step [%v, %v], doubleSolver's [%v, %v]", name, g0, g1, f0, f1)
					}
					sameTwelve(t, name, "state", gen.State(), fast.state())
					sameTwelve(t, name, "rate", gen.Rate(), fast.rate())
					for _, x := range []float64{0, 0.3, 0.77, 1} {
						tt := g0 + x*(g1-g0)
						var a, b [12]float64
						gen.Dense(tt, a[:])
						fast.dense(tt, &b)
						sameTwelve(t, name, "dense output", a[:], &b)
						gen.DenseRate(tt, a[:])
						fast.denseRate(tt, &b)
						sameTwelve(t, name, "dense rate", a[:], &b)
					}
					d.Project(gen.State())
					d.Project(fast.state()[:])
					if dg {
						break
					}
				}
				at = cut
			}
			t.Logf("%s at %g: %d steps", name, tol, gen.Accepted)
			if gen.Accepted != fast.accepted || gen.Rejected != fast.rejected || gen.Evals != fast.evals {
				t.Errorf("%s: ode.Solver %d+%d steps, %d evaluations; doubleSolver %d+%d, %d",
					name, gen.Accepted, gen.Rejected, gen.Evals, fast.accepted, fast.rejected, fast.evals)
			}
		}
	}
	if checked == 0 {
		t.Fatal("no example with a hook block")
	}
}

func sameTwelve(t *testing.T, name, what string, want []float64, got *[12]float64) {
	t.Helper()
	for k := range got {
		if math.Float64bits(got[k]) != math.Float64bits(want[k]) {
			t.Fatalf("%s: %s component %d is %v, ode.Solver's %v", name, what, k, got[k], want[k])
		}
	}
}
