package ode

import (
	"math"
	"testing"
)

// Source: exact solution of the linear oscillator, whose rate is
// (-sin t, -cos t). DenseRate is the derivative of the dense output (of
// order 4), so it is exact to about the same accuracy; at the step's ends
// it matches the stages the step was built from: f(t0, y0) and Rate,
// f(t1, y1), the next step's first stage.
func TestDenseRate(t *testing.T) {
	out, f := make([]float64, 2), make([]float64, 2)
	worst, ends := 0.0, 0.0
	run(t, Settings{RelTol: 1e-9, AbsTol: 1e-9}, 10, func(v *Solver) {
		t0, t1 := v.LastStep()
		for j := 1; j < 10; j++ {
			tt := t0 + (t1-t0)*float64(j)/10
			v.DenseRate(tt, out)
			worst = math.Max(worst, math.Hypot(out[0]+math.Sin(tt), out[1]+math.Cos(tt)))
		}
		v.DenseRate(t1, out)
		r := v.Rate()
		ends = math.Max(ends, math.Hypot(out[0]-r[0], out[1]-r[1]))
		y0 := make([]float64, 2)
		v.Dense(t0, y0)
		harmonic(t0, y0, f)
		v.DenseRate(t0, out)
		ends = math.Max(ends, math.Hypot(out[0]-f[0], out[1]-f[1]))
	})
	if worst > 1e-7 {
		t.Errorf("dense rate error %g", worst)
	}
	if ends > 1e-12 {
		t.Errorf("dense rate at the step's ends off its stages by %g", ends)
	}
}
