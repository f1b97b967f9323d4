package pendulum

import (
	"errors"

	"swaysheet/core/ode"
)

// PeriodSettings are the solver settings of CrossingPeriod: tolerance
// 1e-10 (absolute 1e-12), at most 200,000 steps.
func PeriodSettings() ode.Settings {
	return ode.Settings{RelTol: 1e-10, AbsTol: 1e-12, MaxSteps: 200000}
}

// CrossingPeriod integrates sys from y0 at t = 0 (PeriodSettings,
// projecting after every step) and returns the mean time between the
// first `crossings` times where component i of the state crosses zero from
// below, each located by bisection on the dense output; the run stops at
// tEnd. For a free oscillation released from rest, with i a rate, that is
// its period.
func CrossingPeriod(sys System, y0 []float64, i, crossings int, tEnd float64) (float64, error) {
	v := ode.New(sys.Func, sys.Len(), PeriodSettings())
	v.Reset(0, y0)
	return CrossingPeriodOn(v, sys.Project, i, crossings, tEnd)
}

// Stepper is the part of ode.Solver that CrossingPeriodOn drives; a
// solver written for one model may stand in for it (core/sway's
// doubleSolver for the hook block).
type Stepper interface {
	Step(tEnd float64) (done bool, err error)
	LastStep() (t0, t1 float64)
	Dense(t float64, out []float64)
	State() []float64
	SetState(y []float64)
}

// CrossingPeriodOn is CrossingPeriod on a stepper already placed at its
// start (Reset at t = 0, with PeriodSettings for CrossingPeriod's
// numbers), which project puts back onto the constraint after every step.
func CrossingPeriodOn(v Stepper, project func([]float64) float64, i, crossings int, tEnd float64) (float64, error) {
	var ups []float64
	buf := make([]float64, len(v.State()))
	for len(ups) < crossings {
		done, err := v.Step(tEnd)
		if err != nil {
			return 0, err
		}
		t0, t1 := v.LastStep()
		v.Dense(t0, buf)
		if f0 := buf[i]; f0 < 0 && v.State()[i] >= 0 {
			a, b := t0, t1
			for range 50 {
				c := 0.5 * (a + b)
				v.Dense(c, buf)
				if buf[i] < 0 {
					a = c
				} else {
					b = c
				}
			}
			ups = append(ups, 0.5*(a+b))
		}
		y := v.State()
		project(y)
		v.SetState(y)
		if done {
			break
		}
	}
	if len(ups) < 2 {
		return 0, errors.New("pendulum: no full cycle found")
	}
	return (ups[len(ups)-1] - ups[0]) / float64(len(ups)-1), nil
}
