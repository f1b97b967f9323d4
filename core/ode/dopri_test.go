package ode

import (
	"errors"
	"math"
	"testing"
)

// harmonic is y¨ = -y written as a first-order system; its exact solution
// from (1, 0) is (cos t, -sin t).
func harmonic(t float64, y, dy []float64) {
	dy[0] = y[1]
	dy[1] = -y[0]
}

func run(t *testing.T, s Settings, tEnd float64, each func(v *Solver)) *Solver {
	t.Helper()
	v := New(harmonic, 2, s)
	v.Reset(0, []float64{1, 0})
	for {
		done, err := v.Step(tEnd)
		if err != nil {
			t.Fatal(err)
		}
		if each != nil {
			each(v)
		}
		if done {
			return v
		}
	}
}

// Source: exact solution of the linear oscillator.
func TestHarmonicEndpointAccuracy(t *testing.T) {
	for _, tol := range []float64{1e-6, 1e-9, 1e-12} {
		v := run(t, Settings{RelTol: tol, AbsTol: tol}, 20, nil)
		y := v.State()
		err := math.Hypot(y[0]-math.Cos(20), y[1]+math.Sin(20))
		// The global error of a tolerance-proportional method stays within a
		// modest multiple of the tolerance over a few periods.
		if err > 200*tol {
			t.Errorf("tol %g: global error %g", tol, err)
		}
		if v.T() != 20 {
			t.Errorf("tol %g: ended at %v", tol, v.T())
		}
	}
}

// Source: exact solution; the dense output of DOPRI5 is of order 4
// (Hairer, Norsett & Wanner, sec. II.6).
func TestDenseOutputInsideSteps(t *testing.T) {
	out := make([]float64, 2)
	worst := 0.0
	run(t, Settings{RelTol: 1e-9, AbsTol: 1e-9}, 10, func(v *Solver) {
		t0, t1 := v.LastStep()
		for j := 1; j < 10; j++ {
			tt := t0 + (t1-t0)*float64(j)/10
			v.Dense(tt, out)
			worst = math.Max(worst, math.Hypot(out[0]-math.Cos(tt), out[1]+math.Sin(tt)))
		}
	})
	if worst > 1e-7 {
		t.Errorf("dense output error %g", worst)
	}
}

// The dense output reproduces both ends of the step exactly.
func TestDenseOutputEnds(t *testing.T) {
	out := make([]float64, 2)
	run(t, Settings{}, 3, func(v *Solver) {
		t0, t1 := v.LastStep()
		v.Dense(t1, out)
		y := v.State()
		if math.Abs(out[0]-y[0]) > 1e-14 || math.Abs(out[1]-y[1]) > 1e-14 {
			t.Fatalf("dense output at step end %v, state %v", out, y)
		}
		_ = t0
	})
}

// Source: exact solution y = exp(t) of y' = y; error estimate must
// shrink like tol.
func TestExponentialConvergence(t *testing.T) {
	f := func(t float64, y, dy []float64) { dy[0] = y[0] }
	prevSteps := 0
	for _, tol := range []float64{1e-5, 1e-8, 1e-11} {
		v := New(f, 1, Settings{RelTol: tol, AbsTol: 0})
		v.Reset(0, []float64{1})
		for {
			done, err := v.Step(5)
			if err != nil {
				t.Fatal(err)
			}
			if done {
				break
			}
		}
		rel := math.Abs(v.State()[0]/math.Exp(5) - 1)
		if rel > 100*tol {
			t.Errorf("tol %g: relative error %g", tol, rel)
		}
		if v.Accepted <= prevSteps {
			t.Errorf("tol %g: %d steps, not more than at a looser tolerance", tol, v.Accepted)
		}
		prevSteps = v.Accepted
	}
}

func TestStepLimit(t *testing.T) {
	v := New(harmonic, 2, Settings{RelTol: 1e-12, AbsTol: 1e-12, MaxSteps: 10})
	v.Reset(0, []float64{1, 0})
	var err error
	for range 20 {
		if _, err = v.Step(1000); err != nil {
			break
		}
	}
	if !errors.Is(err, ErrTooManySteps) {
		t.Fatalf("want step limit error, got %v", err)
	}
}

func BenchmarkHarmonic100(b *testing.B) {
	v := New(harmonic, 2, Settings{})
	for b.Loop() {
		v.Reset(0, []float64{1, 0})
		for {
			done, _ := v.Step(100)
			if done {
				break
			}
		}
	}
}
