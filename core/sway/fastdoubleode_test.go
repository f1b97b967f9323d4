package sway

import (
	"math"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/ode"
)

// TestDoubleSolverIsODESolver runs doubleSolver (fastdoubleode.go) and
// ode.Solver side by side on the hook block of the heavy-hook example,
// segment by segment as the scan does, at two accuracies: every step ends
// at the same time in the same state, bit for bit, and so does the dense
// output inside it. Its rate, which ode.Solver does not have, is held
// against a central difference of the dense output (to 1e-6 of the rate's
// scale: the difference's own error) and, at the step's end, against
// f(t1, y1), the stage the step keeps (to rounding).
func TestDoubleSolverIsODESolver(t *testing.T) {
	s := testscenario.Example(t, "heavy-hook-long-slings")
	su, err := build(s, false)
	if err != nil {
		t.Fatal(err)
	}
	d, ok := su.model.(*fastDouble)
	if !ok {
		t.Fatalf("the example's model is %T, not the concrete hook block", su.model)
	}
	cuts := restartCuts(su.breaks, 40)
	for _, tol := range []float64{1e-5, 1e-7} {
		v := doubleSolver{m: d, relTol: tol, absTol: tol * 1e-2, maxSteps: maxSteps}
		o := ode.New(d.Func, 12, ode.Settings{RelTol: tol, AbsTol: tol * 1e-2, MaxSteps: maxSteps})
		var y [12]float64
		copy(y[:], su.y0)
		v.reset(0, &y)
		o.Reset(0, y[:])
		var a, b, r, f [12]float64
		bb := make([]float64, 12)
		at, steps, worst := 0.0, 0, 0.0
		for _, cut := range cuts {
			d.segment(at, cut)
			v.reset(at, &v.y)
			o.Reset(at, o.State())
			for {
				done, err := v.step(cut)
				doneO, errO := o.Step(cut)
				if err != nil || errO != nil {
					t.Fatal(err, errO)
				}
				steps++
				t0, t1 := o.LastStep()
				if done != doneO || v.told != t0 || v.t != t1 || [12]float64(o.State()) != v.y {
					t.Fatalf("tol %g, step %d: [%v, %v] %v, ode.Solver [%v, %v] %v", tol, steps, v.told, v.t, v.y, t0, t1, o.State())
				}
				h := t1 - t0
				for _, frac := range []float64{0.25, 0.5, 0.75} {
					tt := t0 + frac*h
					v.dense(tt, &a)
					o.Dense(tt, bb)
					if a != [12]float64(bb) {
						t.Fatalf("tol %g, step %d: dense output at %v differs", tol, steps, tt)
					}
					e := 1e-4 * h
					v.dense(tt-e, &a)
					v.dense(tt+e, &b)
					v.denseRate(tt, &r)
					for i := range 12 {
						fd := (b[i] - a[i]) / (2 * e)
						worst = math.Max(worst, math.Abs(fd-r[i])/(1+math.Abs(r[i])))
					}
				}
				v.denseRate(t1, &r)
				d.rhs(t1, &v.y, &f)
				for i := range 12 {
					if math.Abs(r[i]-f[i]) > 1e-9*(1+math.Abs(f[i])) {
						t.Fatalf("tol %g, step %d: the dense rate at the step's end %v, f(t1, y1) %v", tol, steps, r[i], f[i])
					}
				}
				d.Project(v.y[:])
				d.Project(o.State())
				if done {
					break
				}
			}
			at = cut
		}
		if worst > 1e-6 {
			t.Errorf("tol %g: the dense rate is off a central difference of the dense output by %.3g", tol, worst)
		}
		t.Logf("tol %g: %d steps the same; dense rate within %.3g of the central difference", tol, steps, worst)
	}
}

// TestPowIsMathPow: powExp(y*powLog(x)) is math.Pow(x, y) to the bit for
// the step control's exponents (fastpow.go), over the error norms a step
// can have (and its floor 1e-4, and the starting step's 0.2).
func TestPowIsMathPow(t *testing.T) {
	for _, y := range []float64{0.2 - stepBeta*0.75, stepBeta, 0.2} {
		for x := 1e-12; x < 1e12; x *= 1.0137 {
			for _, z := range []float64{x, 1e-4, 1e10} {
				if got, want := powExp(y*powLog(z)), math.Pow(z, y); got != want {
					t.Fatalf("%v^%v: %v, math.Pow %v", z, y, got, want)
				}
			}
		}
	}
}
