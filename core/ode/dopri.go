// Package ode integrates systems of ordinary differential equations
// y' = f(t, y) with the explicit embedded Runge-Kutta pair of Dormand and
// Prince, order 5 with an order-4 error estimate, adaptive step size and a
// continuous (dense) output of order 4 inside every step.
//
// The tableau is that of
//
//	J. R. Dormand and P. J. Prince, "A family of embedded Runge-Kutta
//	formulae", J. Comp. Appl. Math. 6 (1980) 19-26,
//
// and the step-size control (with Lund stabilisation; its arithmetic in
// control.go) and the dense output follow
//
//	E. Hairer, S. P. Norsett and G. Wanner, "Solving Ordinary Differential
//	Equations I", 2nd ed., Springer 1993, sec. II.4-II.6 (code DOPRI5).
//
// The solver is driven one step at a time so that the caller can look at
// every step (to find peaks with the dense output), restart at points where f
// is not smooth (Reset), and project the state back onto a constraint
// manifold between steps (SetState).
package ode

import (
	"errors"
	"fmt"
	"math"
)

// Func evaluates dy = f(t, y). It must not keep y or dy.
type Func func(t float64, y, dy []float64)

// Settings tune the solver. The zero value is usable.
type Settings struct {
	// RelTol and AbsTol bound the local error of each component:
	// |err_i| <= AbsTol + RelTol*|y_i|. Zero means 1e-8 and 1e-10.
	RelTol, AbsTol float64
	// MaxStep bounds the step size; zero means no bound.
	MaxStep float64
	// MaxSteps bounds the number of accepted plus rejected steps over the
	// life of the solver; zero means 1e6.
	MaxSteps int
}

// ErrTooManySteps is returned by Step when Settings.MaxSteps is reached.
var ErrTooManySteps = errors.New("ode: step limit reached")

// Dormand-Prince 5(4) coefficients, exported for specialised steppers
// elsewhere in the module (core/sway/fastode.go).
const (
	C2, C3, C4, C5 = 1.0 / 5, 3.0 / 10, 4.0 / 5, 8.0 / 9

	A21                     = 1.0 / 5
	A31, A32                = 3.0 / 40, 9.0 / 40
	A41, A42, A43           = 44.0 / 45, -56.0 / 15, 32.0 / 9
	A51, A52, A53, A54      = 19372.0 / 6561, -25360.0 / 2187, 64448.0 / 6561, -212.0 / 729
	A61, A62, A63, A64, A65 = 9017.0 / 3168, -355.0 / 33, 46732.0 / 5247, 49.0 / 176, -5103.0 / 18656
	A71, A73, A74, A75, A76 = 35.0 / 384, 500.0 / 1113, 125.0 / 192, -2187.0 / 6784, 11.0 / 84

	// Error coefficients: 5th-order weights minus 4th-order weights.
	E1, E3, E4, E5, E6, E7 = 71.0 / 57600, -71.0 / 16695, 71.0 / 1920, -17253.0 / 339200, 22.0 / 525, -1.0 / 40

	// Dense output coefficients (Hairer, Norsett & Wanner, DOPRI5 CONTD5).
	D1, D3, D4 = -12715105075.0 / 11282082432, 87487479700.0 / 32700410799, -10690763975.0 / 1880347072
	D5, D6, D7 = 701980252875.0 / 199316789632, -1453857185.0 / 822651844, 69997945.0 / 29380423
)

// Filled returns s with its zeros replaced by the defaults (RelTol 1e-8,
// AbsTol 1e-10, MaxSteps 1e6), as New takes it. A negative setting is a
// programmer's mistake: it panics.
func (s Settings) Filled() Settings {
	if s.RelTol == 0 {
		s.RelTol = 1e-8
	}
	if s.AbsTol == 0 {
		s.AbsTol = 1e-10
	}
	if s.MaxSteps == 0 {
		s.MaxSteps = 1_000_000
	}
	if s.RelTol < 0 || s.AbsTol < 0 || s.MaxStep < 0 || s.MaxSteps < 0 {
		panic("ode: negative setting")
	}
	return s
}

// Solver holds the state and workspace of one integration. Create it with
// New, start it with Reset, then call Step until it reports the end.
type Solver struct {
	f        Func
	n        int
	set      Settings
	t, h     float64
	told     float64
	y, ynew  []float64
	k        [7][]float64
	tmp      []float64
	cont     [5][]float64
	invN     float64 // 1/n
	ctl      StepControl
	started  bool
	fresh    bool // k[0] holds f(t, y)
	Accepted int  // accepted steps
	Rejected int  // rejected steps
	Evals    int  // evaluations of f
}

// New returns a solver for an n-dimensional system.
func New(f Func, n int, s Settings) *Solver {
	if n <= 0 {
		panic("ode: dimension must be positive")
	}
	s = s.Filled()
	v := &Solver{f: f, n: n, set: s, invN: 1 / float64(n)}
	// The fifteen vectors on one array, each its own part: one allocation
	// where there were fifteen (the planner makes thousands of solvers,
	// and in wasm each allocation is a call into the runtime).
	work := make([]float64, 15*n)
	part := func() []float64 {
		p := work[:n:n]
		work = work[n:]
		return p
	}
	v.y, v.ynew, v.tmp = part(), part(), part()
	for i := range v.k {
		v.k[i] = part()
	}
	for i := range v.cont {
		v.cont[i] = part()
	}
	return v
}

// Reset places the solver at (t, y). Call it at the start and after every
// point where f or its derivatives jump: the next step starts afresh from
// there. The step size guess of an earlier run is kept if there was one.
func (v *Solver) Reset(t float64, y []float64) {
	if len(y) != v.n {
		panic("ode: state length mismatch")
	}
	v.t, v.told = t, t
	copy(v.y, y)
	v.fresh = false
	v.ctl.Restart()
}

// SetState replaces the current state (for instance after projecting it onto
// a constraint) without moving in time.
func (v *Solver) SetState(y []float64) {
	copy(v.y, y)
	v.fresh = false
}

// T returns the current time.
func (v *Solver) T() float64 { return v.t }

// State returns the current state. The slice belongs to the solver. A
// caller may change it in place by a small amount (a projection onto a
// constraint, of the order of the local error): the solver then keeps the
// slope it had, which costs no evaluation and stays within the error
// control. Use SetState for anything larger.
func (v *Solver) State() []float64 { return v.y }

// LastStep returns the interval [t0, t1] of the last accepted step.
func (v *Solver) LastStep() (t0, t1 float64) { return v.told, v.t }

func (v *Solver) eval(t float64, y, dy []float64) {
	v.f(t, y, dy)
	v.Evals++
}

// errNorm is the error norm of Hairer, Norsett & Wanner: the root mean
// square of e over the tolerances AbsTol + RelTol·max(|y0_i|, |y1_i|).
func (v *Solver) errNorm(y0, y1, e []float64) float64 {
	return math.Sqrt(v.errSquare(y0, y1, e))
}

// errSquare is errNorm squared, the mean square, which the step control
// takes without the square root.
func (v *Solver) errSquare(y0, y1, e []float64) float64 {
	var sum float64
	n := v.n
	y0, y1, e = y0[:n], y1[:n], e[:n]
	for i := range n {
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
		// A product with the scale's reciprocal: the reciprocal does not
		// wait for e, the last thing a step computes (StepControl).
		r := e[i] * (1 / (v.set.AbsTol + v.set.RelTol*a))
		sum += r * r
	}
	return sum * v.invN
}

// initialStep is the starting step heuristic (InitialStep).
func (v *Solver) initialStep(tEnd float64) float64 {
	return InitialStep(v.t, tEnd, v.y, v.k[0], v.tmp, v.k[1], v.ynew, v.errNorm, v.eval)
}

// InitialStep is the starting step heuristic of Hairer, Norsett & Wanner
// (sec. II.4, "Starting step size") for a solver at (t, y) with rate
// f0 = f(t, y), integrating toward tEnd; errNorm is its error norm and
// eval its right-hand side, called once, at t + h0, writing into k2. tmp,
// k2 and diff are scratch of y's length. Solver and the steppers written
// for one model (core/sway's fastSolver and doubleSolver) share it, so
// that they start with the same step to the bit.
func InitialStep(t, tEnd float64, y, f0, tmp, k2, diff []float64,
	errNorm func(y0, y1, e []float64) float64, eval func(t float64, y, dy []float64)) float64 {
	d0 := errNorm(y, y, y)
	d1 := errNorm(y, y, f0)
	var h0 float64
	if d0 < 1e-5 || d1 < 1e-5 {
		h0 = 1e-6
	} else {
		h0 = 0.01 * d0 / d1
	}
	h0 = math.Min(h0, tEnd-t)
	for i := range y {
		tmp[i] = y[i] + h0*f0[i]
	}
	eval(t+h0, tmp, k2)
	for i := range y {
		diff[i] = k2[i] - f0[i]
	}
	d2 := errNorm(y, y, diff) / h0
	var h1 float64
	if m := math.Max(d1, d2); m <= 1e-15 {
		h1 = math.Max(1e-6, h0*1e-3)
	} else {
		h1 = math.Pow(0.01/m, 0.2)
	}
	return math.Min(100*h0, h1)
}

// Step advances by one accepted step, never beyond tEnd. It reports done
// when the solver has reached tEnd.
func (v *Solver) Step(tEnd float64) (done bool, err error) {
	if tEnd <= v.t {
		return true, nil
	}
	n := v.n
	// Every slice cut to n, so that the compiler can prove the loops' indices
	// in bounds (no checks inside them; in wasm each is a compare and branch).
	y, ynew, tmp := v.y[:n], v.ynew[:n], v.tmp[:n]
	k1, k2, k3, k4, k5, k6, k7 := v.k[0][:n], v.k[1][:n], v.k[2][:n], v.k[3][:n], v.k[4][:n], v.k[5][:n], v.k[6][:n]
	c0, c1, c2, c3, c4 := v.cont[0][:n], v.cont[1][:n], v.cont[2][:n], v.cont[3][:n], v.cont[4][:n]
	if !v.fresh {
		v.eval(v.t, y, k1)
		v.fresh = true
	}
	if !v.started || v.h <= 0 {
		v.h = v.initialStep(tEnd)
		v.started = true
	}
	span := tEnd - v.t
	for {
		if v.Accepted+v.Rejected >= v.set.MaxSteps {
			return false, fmt.Errorf("%w (%d steps at t = %.6g)", ErrTooManySteps, v.set.MaxSteps, v.t)
		}
		h := v.h
		if v.set.MaxStep > 0 && h > v.set.MaxStep {
			h = v.set.MaxStep
		}
		last := false
		if h >= span*(1-1e-12) {
			h, last = span, true
		}
		t := v.t
		for i := range n {
			tmp[i] = y[i] + h*A21*k1[i]
		}
		v.eval(t+C2*h, tmp, k2)
		for i := range n {
			tmp[i] = y[i] + h*(A31*k1[i]+A32*k2[i])
		}
		v.eval(t+C3*h, tmp, k3)
		for i := range n {
			tmp[i] = y[i] + h*(A41*k1[i]+A42*k2[i]+A43*k3[i])
		}
		v.eval(t+C4*h, tmp, k4)
		for i := range n {
			tmp[i] = y[i] + h*(A51*k1[i]+A52*k2[i]+A53*k3[i]+A54*k4[i])
		}
		v.eval(t+C5*h, tmp, k5)
		for i := range n {
			tmp[i] = y[i] + h*(A61*k1[i]+A62*k2[i]+A63*k3[i]+A64*k4[i]+A65*k5[i])
		}
		tn := t + h
		if last {
			tn = tEnd
		}
		v.eval(tn, tmp, k6)
		for i := range n {
			ynew[i] = y[i] + h*(A71*k1[i]+A73*k3[i]+A74*k4[i]+A75*k5[i]+A76*k6[i])
		}
		v.eval(tn, ynew, k7)
		for i := range n {
			tmp[i] = h * (E1*k1[i] + E3*k3[i] + E4*k4[i] + E5*k5[i] + E6*k6[i] + E7*k7[i])
		}
		ratio, accept := v.ctl.Next(v.errSquare(y, ynew, tmp))
		if accept {
			v.Accepted++
			for i := range n {
				ydiff := ynew[i] - y[i]
				bspl := h*k1[i] - ydiff
				c0[i] = y[i]
				c1[i] = ydiff
				c2[i] = bspl
				c3[i] = ydiff - h*k7[i] - bspl
				c4[i] = h * (D1*k1[i] + D3*k3[i] + D4*k4[i] + D5*k5[i] + D6*k6[i] + D7*k7[i])
			}
			copy(k1, k7) // first same as last
			copy(y, ynew)
			v.told, v.t = t, tn
			v.h = h * ratio
			return last, nil
		}
		v.Rejected++
		v.h = h * ratio
		if v.h < 1e-14*math.Max(1, math.Abs(t)) {
			return false, fmt.Errorf("ode: step size underflow at t = %.6g", t)
		}
	}
}

// Dense writes into out the continuous extension of the last accepted step
// at time t, which should lie in [t0, t1] of LastStep. Its error is of
// order 4 in the step size.
func (v *Solver) Dense(t float64, out []float64) {
	h := v.t - v.told
	var s float64
	if h > 0 {
		s = (t - v.told) / h
	}
	s1 := 1 - s
	n := v.n
	out = out[:n]
	c0, c1, c2, c3, c4 := v.cont[0][:n], v.cont[1][:n], v.cont[2][:n], v.cont[3][:n], v.cont[4][:n]
	for i := range out {
		out[i] = c0[i] + s*(c1[i]+s1*(c2[i]+s*(c3[i]+s1*c4[i])))
	}
}

// Rate returns f(t1, y1) at the end t1 of the last accepted step: the next
// step's first stage, kept by first-same-as-last (evaluated before any
// projection of the state). The slice belongs to the solver.
func (v *Solver) Rate() []float64 { return v.k[0] }

// DenseRate writes into out the time derivative of the continuous
// extension of the last accepted step at t. With
// y = c0 + s(c1 + s1(c2 + s(c3 + s1 c4))), s = (t - t0)/h, s1 = 1 - s:
// dy/ds = Q + s(s1 (c3 + (1 - 2s) c4) - P), P = c2 + s(c3 + s1 c4),
// Q = c1 + s1 P, and dy/dt = (dy/ds)/h.
func (v *Solver) DenseRate(t float64, out []float64) {
	h := v.t - v.told
	n := v.n
	out = out[:n]
	if h <= 0 {
		copy(out, v.k[0])
		return
	}
	s := (t - v.told) / h
	s1 := 1 - s
	ih := 1 / h
	c1, c2, c3, c4 := v.cont[1][:n], v.cont[2][:n], v.cont[3][:n], v.cont[4][:n]
	for i := range out {
		p := c2[i] + s*(c3[i]+s1*c4[i])
		q := c1[i] + s1*p
		out[i] = (q + s*(s1*(c3[i]+(1-2*s)*c4[i])-p)) * ih
	}
}
