package pendulum

import (
	"errors"

	"swaysheet/core/ode"
)

// CrossingPeriod integrates sys from y0 at t = 0 (tolerance 1e-10,
// projecting after every step) and returns the mean time between the
// first `crossings` times where component i of the state crosses zero from
// below, each located by bisection on the dense output; the run stops at
// tEnd. For a free oscillation released from rest, with i a rate, that is
// its period. A sys that is a DirectFunc gives the solver its
// DirectFunc.
func CrossingPeriod(sys System, y0 []float64, i, crossings int, tEnd float64) (float64, error) {
	f := sys.Func
	if d, ok := sys.(DirectFunc); ok {
		f = d.DirectFunc()
	}
	v := ode.New(f, sys.Len(), ode.Settings{RelTol: 1e-10, AbsTol: 1e-12, MaxSteps: 200000})
	v.Reset(0, y0)
	var ups []float64
	buf := make([]float64, sys.Len())
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
		sys.Project(y)
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

// DirectFunc is a System whose right-hand side comes as a function that
// calls the model directly (the method value sys.Func goes through a
// wrapper and the interface's method first: in wasm two calls more for
// every evaluation). It computes what Func computes.
type DirectFunc interface {
	DirectFunc() func(t float64, y, dy []float64)
}
