package sway

import (
	"fmt"
	"math"

	"swaysheet/core/ode"
)

// doubleSolver is ode.Solver written for the hook block's state of twelve
// numbers (fastDouble: n1, u1, n2, u2), as fastSolver is for the single
// rope's six: the same tableau, error norm, step-size control
// (ode.StepControl itself), starting step, restarts and dense output, in
// the same order of operations (core/ode/dopri.go cites the sources), on
// fixed-size arrays, with the right-hand side a direct call of
// fastDouble.rhs. It gives ode.Solver's bits step for step
// (TestDoubleSolverAsOde). Issue 16: under node ode.Solver.Step took about
// twice its native time on heavy-hook-long-slings, and each evaluation
// went through a function value and its closure (about 6 % of the run
// under node, a few tenths of a per cent natively).
//
// ode.Solver without MaxStep (the hook block's scan sets none); the stages'
// sums are loops over the twelve components, whose bounds the compiler
// knows.
type doubleSolver struct {
	_              [0]func() // not comparable: no equality function (see fastScan)
	d              *fastDouble
	relTol, absTol float64
	maxSteps       int

	t, h, told   float64
	y, ynew, tmp [12]float64
	k            [7][12]float64
	cont         [5][12]float64
	ctl          ode.StepControl
	started      bool
	fresh        bool // k[0] holds f(t, y)

	accepted, rejected, evals int
}

// newDoubleSolver is ode.New's counterpart (its defaults, Settings.Filled),
// as a value for its owner to hold. set.MaxStep must be zero:
// doubleSolver has no bound on the step (a programmer's mistake, it
// panics).
func newDoubleSolver(d *fastDouble, set ode.Settings) doubleSolver {
	if set.MaxStep != 0 {
		panic("sway: doubleSolver takes no MaxStep")
	}
	set = set.Filled()
	return doubleSolver{d: d, relTol: set.RelTol, absTol: set.AbsTol, maxSteps: set.MaxSteps}
}

func (v *doubleSolver) eval(t float64, y, dy *[12]float64) {
	v.d.rhs(t, y, dy)
	v.evals++
}

// reset places the solver at (t, y); the next step starts afresh
// (ode.Solver.Reset).
func (v *doubleSolver) reset(t float64, y *[12]float64) {
	v.t, v.told = t, t
	v.y = *y
	v.fresh = false
	v.ctl.Restart()
}

// state is the current state (ode.Solver.State): a caller may project it
// in place.
func (v *doubleSolver) state() *[12]float64 { return &v.y }

// rate is f(t1, y1) at the end of the last accepted step
// (ode.Solver.Rate).
func (v *doubleSolver) rate() *[12]float64 { return &v.k[0] }

// errNorm is ode's error norm (ode.Solver.errNorm).
func (v *doubleSolver) errNorm(y0, y1, e *[12]float64) float64 {
	return math.Sqrt(v.errSquare(y0, y1, e))
}

// errSquare is errNorm squared, which the step control takes
// (ode.Solver.errSquare, with 1/n as the constant 1/12).
func (v *doubleSolver) errSquare(y0, y1, e *[12]float64) float64 {
	var sum float64
	for i := range 12 {
		a, b := y0[i], y1[i]
		if a < 0 {
			a = -a
		}
		if b < 0 {
			b = -b
		}
		if b > a {
			a = b
		}
		r := e[i] * (1 / (v.absTol + v.relTol*a))
		sum += r * r
	}
	return sum * (1.0 / 12)
}

// initialStep is ode's starting step heuristic (ode.InitialStep).
func (v *doubleSolver) initialStep(tEnd float64) float64 {
	return ode.InitialStep(v.t, tEnd, v.y[:], v.k[0][:], v.tmp[:], v.k[1][:], v.ynew[:],
		func(y0, y1, e []float64) float64 {
			return v.errNorm((*[12]float64)(y0), (*[12]float64)(y1), (*[12]float64)(e))
		},
		func(t float64, y, dy []float64) { v.eval(t, (*[12]float64)(y), (*[12]float64)(dy)) })
}

// Step advances by one accepted step, never beyond tEnd (ode.Solver.Step).
func (v *doubleSolver) Step(tEnd float64) (done bool, err error) {
	if tEnd <= v.t {
		return true, nil
	}
	y, ynew, tmp := &v.y, &v.ynew, &v.tmp
	k1, k2, k3, k4, k5, k6, k7 := &v.k[0], &v.k[1], &v.k[2], &v.k[3], &v.k[4], &v.k[5], &v.k[6]
	c0, c1, c2, c3, c4 := &v.cont[0], &v.cont[1], &v.cont[2], &v.cont[3], &v.cont[4]
	if !v.fresh {
		v.eval(v.t, y, k1)
		v.fresh = true
	}
	if !v.started || v.h <= 0 {
		v.h = v.initialStep(tEnd)
		v.started = true
	}
	d := v.d
	span := tEnd - v.t
	for {
		if v.accepted+v.rejected >= v.maxSteps {
			return false, fmt.Errorf("%w (%d steps at t = %.6g)", ode.ErrTooManySteps, v.maxSteps, v.t)
		}
		h := v.h
		last := false
		if h >= span*(1-1e-12) {
			h, last = span, true
		}
		t := v.t
		for i := range 12 {
			tmp[i] = y[i] + h*ode.A21*k1[i]
		}
		d.rhs(t+ode.C2*h, tmp, k2)
		for i := range 12 {
			tmp[i] = y[i] + h*(ode.A31*k1[i]+ode.A32*k2[i])
		}
		d.rhs(t+ode.C3*h, tmp, k3)
		for i := range 12 {
			tmp[i] = y[i] + h*(ode.A41*k1[i]+ode.A42*k2[i]+ode.A43*k3[i])
		}
		d.rhs(t+ode.C4*h, tmp, k4)
		for i := range 12 {
			tmp[i] = y[i] + h*(ode.A51*k1[i]+ode.A52*k2[i]+ode.A53*k3[i]+ode.A54*k4[i])
		}
		d.rhs(t+ode.C5*h, tmp, k5)
		for i := range 12 {
			tmp[i] = y[i] + h*(ode.A61*k1[i]+ode.A62*k2[i]+ode.A63*k3[i]+ode.A64*k4[i]+ode.A65*k5[i])
		}
		tn := t + h
		if last {
			tn = tEnd
		}
		d.rhs(tn, tmp, k6)
		for i := range 12 {
			ynew[i] = y[i] + h*(ode.A71*k1[i]+ode.A73*k3[i]+ode.A74*k4[i]+ode.A75*k5[i]+ode.A76*k6[i])
		}
		d.rhs(tn, ynew, k7)
		v.evals += 6
		for i := range 12 {
			tmp[i] = h * (ode.E1*k1[i] + ode.E3*k3[i] + ode.E4*k4[i] + ode.E5*k5[i] + ode.E6*k6[i] + ode.E7*k7[i])
		}
		ratio, accept := v.ctl.Next(v.errSquare(y, ynew, tmp))
		if accept {
			v.accepted++
			for i := range 12 {
				ydiff := ynew[i] - y[i]
				bspl := h*k1[i] - ydiff
				c0[i] = y[i]
				c1[i] = ydiff
				c2[i] = bspl
				c3[i] = ydiff - h*k7[i] - bspl
				c4[i] = h * (ode.D1*k1[i] + ode.D3*k3[i] + ode.D4*k4[i] + ode.D5*k5[i] + ode.D6*k6[i] + ode.D7*k7[i])
			}
			*k1 = *k7 // first same as last
			*y = *ynew
			v.told, v.t = t, tn
			v.h = h * ratio
			return last, nil
		}
		v.rejected++
		v.h = h * ratio
		if v.h < 1e-14*math.Max(1, math.Abs(t)) {
			return false, fmt.Errorf("ode: step size underflow at t = %.6g", t)
		}
	}
}

// dense writes the continuous extension of the last step at t into out
// (ode.Solver.Dense).
func (v *doubleSolver) dense(t float64, out *[12]float64) {
	h := v.t - v.told
	var s float64
	if h > 0 {
		s = (t - v.told) / h
	}
	s1 := 1 - s
	c0, c1, c2, c3, c4 := &v.cont[0], &v.cont[1], &v.cont[2], &v.cont[3], &v.cont[4]
	for i := range 12 {
		out[i] = c0[i] + s*(c1[i]+s1*(c2[i]+s*(c3[i]+s1*c4[i])))
	}
}

// denseRate writes the time derivative of the continuous extension at t
// into out (ode.Solver.DenseRate).
func (v *doubleSolver) denseRate(t float64, out *[12]float64) {
	h := v.t - v.told
	if h <= 0 {
		*out = v.k[0]
		return
	}
	s := (t - v.told) / h
	s1 := 1 - s
	ih := 1 / h
	c1, c2, c3, c4 := &v.cont[1], &v.cont[2], &v.cont[3], &v.cont[4]
	for i := range 12 {
		p := c2[i] + s*(c3[i]+s1*c4[i])
		q := c1[i] + s1*p
		out[i] = (q + s*(s1*(c3[i]+(1-2*s)*c4[i])-p)) * ih
	}
}

// Step, LastStep, Dense, State and SetState make doubleSolver a
// pendulum.Stepper, for the hook block's mode periods (modePeriodOf).

// LastStep is the last accepted step's interval (ode.Solver.LastStep).
func (v *doubleSolver) LastStep() (t0, t1 float64) { return v.told, v.t }

// Dense is dense on a slice of twelve.
func (v *doubleSolver) Dense(t float64, out []float64) { v.dense(t, (*[12]float64)(out)) }

// State is the current state as a slice the solver owns.
func (v *doubleSolver) State() []float64 { return v.y[:] }

// SetState replaces the state; the next step evaluates its rate afresh
// (ode.Solver.SetState).
func (v *doubleSolver) SetState(y []float64) {
	v.y = [12]float64(y)
	v.fresh = false
}
