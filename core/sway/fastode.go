package sway

import (
	"fmt"
	"math"

	"swaysheet/core/ode"
)

// fastSolver is ode.Solver's Dormand-Prince 5(4) pair written for the
// six-element state of fastModel: the same tableau, error norm, step-size
// control (ode.StepControl itself), starting step, restarts and dense
// output, in the same order of operations (core/ode/dopri.go cites the
// sources), on fixed-size arrays, with the right-hand side called
// directly.
//
// The stages' sums and the error norm's are written out component by
// component natively and loops in wasm (faststages.go). The
// dense output's coefficients stay loops: written out they saved about
// 1.5 % of the instructions of a full evaluation, for about 1 kB of the
// page's gzipped wasm.
type fastSolver struct {
	_              [0]func() // not comparable: no equality function (see fastScan)
	m              *fastModel
	relTol, absTol float64
	maxSteps       int

	t, h, told float64
	y, ynew    [6]float64
	k          [7][6]float64
	tmp        [6]float64
	cont       [5][6]float64
	d1k1       [6]float64 // ode.D1*k1 of the last step
	hLast      float64    // its step size
	contDone   bool       // cont[4] is computed
	// loopedStages takes the stages' sums as loops on every platform
	// (Options.loopedStages, for tests; stagesWrittenOut).
	loopedStages bool
	ctl          ode.StepControl
	started      bool
	fresh        bool

	accepted, rejected, evals int
}

func (v *fastSolver) eval(t float64, y, dy *[6]float64) {
	v.m.rhs(t, y, dy)
	v.evals++
}

// reset places the solver at (t, y); the next step starts afresh.
func (v *fastSolver) reset(t float64, y *[6]float64) {
	v.t, v.told = t, t
	v.y = *y
	v.fresh = false
	v.ctl.Restart()
}

// errNorm is ode's error norm, the root mean square of e over the
// tolerances, sqrt(sum_i (e_i/(absTol + relTol max(|y0_i|, |y1_i|)))² / 6).
func (v *fastSolver) errNorm(y0, y1, e *[6]float64) float64 {
	return math.Sqrt(v.errSquare(y0, y1, e))
}

// errSquare is errNorm squared, which the step control takes (ode's
// errSquare): its sum written out natively, a loop in wasm, in the same
// order (stagesWrittenOut).
func (v *fastSolver) errSquare(y0, y1, e *[6]float64) float64 {
	sum := 0.0
	if stagesWrittenOut && !v.loopedStages {
		sum += v.errTerm(y0[0], y1[0], e[0])
		sum += v.errTerm(y0[1], y1[1], e[1])
		sum += v.errTerm(y0[2], y1[2], e[2])
		sum += v.errTerm(y0[3], y1[3], e[3])
		sum += v.errTerm(y0[4], y1[4], e[4])
		sum += v.errTerm(y0[5], y1[5], e[5])
	} else {
		for i := range 6 {
			sum += v.errTerm(y0[i], y1[i], e[i])
		}
	}
	return sum * (1.0 / 6)
}

// errTerm is one component's share of errNorm: the square of e over the
// tolerance at the larger of |a| and |b|, e times the tolerance's
// reciprocal as ode's errSquare has it. Plain comparisons keep it small
// enough for the compiler to write into errNorm (math.Abs counts as two
// calls there); a zero's sign does not matter here: the larger is added
// to absTol > 0.
func (v *fastSolver) errTerm(a, b, e float64) float64 {
	if a < 0 {
		a = -a
	}
	if b < 0 {
		b = -b
	}
	if b > a {
		a = b
	}
	r := e * (1 / (v.absTol + v.relTol*a))
	return r * r
}

// initialStep is ode's starting step heuristic (ode.InitialStep).
func (v *fastSolver) initialStep(tEnd float64) float64 {
	return ode.InitialStep(v.t, tEnd, v.y[:], v.k[0][:], v.tmp[:], v.k[1][:], v.ynew[:],
		func(y0, y1, e []float64) float64 {
			return v.errNorm((*[6]float64)(y0), (*[6]float64)(y1), (*[6]float64)(e))
		},
		func(t float64, y, dy []float64) { v.eval(t, (*[6]float64)(y), (*[6]float64)(dy)) })
}

// step advances by one accepted step, never beyond tEnd (ode.Solver.Step).
func (v *fastSolver) step(tEnd float64) (done bool, err error) {
	if tEnd <= v.t {
		return true, nil
	}
	y, ynew, tmp := &v.y, &v.ynew, &v.tmp
	k1, k2, k3, k4, k5, k6, k7 := &v.k[0], &v.k[1], &v.k[2], &v.k[3], &v.k[4], &v.k[5], &v.k[6]
	if !v.fresh {
		v.eval(v.t, y, k1)
		v.fresh = true
	}
	if !v.started || v.h <= 0 {
		v.h = v.initialStep(tEnd)
		v.started = true
	}
	// The right-hand side as stages has it, for the sums as loops (in
	// wasm; stagesWrittenOut).
	m := v.m
	travel := m.travel
	ax, ay, jx, jy := m.sx.A, m.sy.A, m.sx.J, m.sy.J
	ox, oy, il, rz := m.sx.Origin, m.sy.Origin, m.il, -m.g
	travelRHS := func(t float64, y, dy *[6]float64) {
		rx, ry := -(ax + (t-ox)*jx), -(ay + (t-oy)*jy)
		cn := -(rx*y[0]+ry*y[1]+rz*y[2])*il - (y[3]*y[3] + y[4]*y[4] + y[5]*y[5])
		dy[0], dy[1], dy[2] = y[3], y[4], y[5]
		dy[3] = rx*il + cn*y[0]
		dy[4] = ry*il + cn*y[1]
		dy[5] = rz*il + cn*y[2]
	}
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
		tn := t + h
		if last {
			tn = tEnd
		}
		if stagesWrittenOut && !v.loopedStages {
			v.stages(t, h, tn)
		} else {
			for i := range 6 {
				tmp[i] = y[i] + h*ode.A21*k1[i]
			}
			if travel {
				travelRHS(t+ode.C2*h, tmp, k2)
			} else {
				m.rhs(t+ode.C2*h, tmp, k2)
			}
			for i := range 6 {
				tmp[i] = y[i] + h*(ode.A31*k1[i]+ode.A32*k2[i])
			}
			if travel {
				travelRHS(t+ode.C3*h, tmp, k3)
			} else {
				m.rhs(t+ode.C3*h, tmp, k3)
			}
			for i := range 6 {
				tmp[i] = y[i] + h*(ode.A41*k1[i]+ode.A42*k2[i]+ode.A43*k3[i])
			}
			if travel {
				travelRHS(t+ode.C4*h, tmp, k4)
			} else {
				m.rhs(t+ode.C4*h, tmp, k4)
			}
			for i := range 6 {
				tmp[i] = y[i] + h*(ode.A51*k1[i]+ode.A52*k2[i]+ode.A53*k3[i]+ode.A54*k4[i])
			}
			if travel {
				travelRHS(t+ode.C5*h, tmp, k5)
			} else {
				m.rhs(t+ode.C5*h, tmp, k5)
			}
			for i := range 6 {
				tmp[i] = y[i] + h*(ode.A61*k1[i]+ode.A62*k2[i]+ode.A63*k3[i]+ode.A64*k4[i]+ode.A65*k5[i])
			}
			if travel {
				travelRHS(tn, tmp, k6)
			} else {
				m.rhs(tn, tmp, k6)
			}
			for i := range 6 {
				ynew[i] = y[i] + h*(ode.A71*k1[i]+ode.A73*k3[i]+ode.A74*k4[i]+ode.A75*k5[i]+ode.A76*k6[i])
			}
			if travel {
				travelRHS(tn, ynew, k7)
			} else {
				m.rhs(tn, ynew, k7)
			}
			for i := range 6 {
				tmp[i] = h * (ode.E1*k1[i] + ode.E3*k3[i] + ode.E4*k4[i] + ode.E5*k5[i] + ode.E6*k6[i] + ode.E7*k7[i])
			}
		}
		v.evals += 6
		ratio, accept := v.ctl.Next(v.errSquare(y, ynew, tmp))
		if accept {
			v.accepted++
			for i := range 6 {
				ydiff := ynew[i] - y[i]
				bspl := h*k1[i] - ydiff
				v.cont[0][i] = y[i]
				v.cont[1][i] = ydiff
				v.cont[2][i] = bspl
				v.cont[3][i] = ydiff - h*k7[i] - bspl
				v.d1k1[i] = ode.D1 * k1[i] // the rest of cont[4] when it is needed
			}
			v.contDone, v.hLast = false, h
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

// contTail computes the last dense output coefficients of the step
// (cont[4], in the order of ode.Solver's), only when the dense output is
// used: most steps of a run without histories never are. k3 to k7 hold
// the last step's stages until the next step.
func (v *fastSolver) contTail() {
	h := v.hLast
	k := &v.k
	for i := range 6 {
		v.cont[4][i] = h * (v.d1k1[i] + ode.D3*k[2][i] + ode.D4*k[3][i] + ode.D5*k[4][i] + ode.D6*k[5][i] + ode.D7*k[6][i])
	}
	v.contDone = true
}

// dense writes the continuous extension of the last step at t into out.
func (v *fastSolver) dense(t float64, out *[6]float64) {
	h := v.t - v.told
	var s float64
	if h > 0 {
		s = (t - v.told) / h
	}
	s1 := 1 - s
	if !v.contDone {
		v.contTail()
	}
	c := &v.cont
	for i := range 6 {
		out[i] = densePoly(c, i, s, s1)
	}
}

// densePoly is component i of the continuous extension with coefficients
// c at s in [0, 1] of the step, s1 = 1 - s:
// c0 + s(c1 + s1(c2 + s(c3 + s1 c4))).
func densePoly(c *[5][6]float64, i int, s, s1 float64) float64 {
	return c[0][i] + s*(c[1][i]+s1*(c[2][i]+s*(c[3][i]+s1*c[4][i])))
}

// denseBoth writes the continuous extension of the last step at t into y
// (the numbers dense gives) and its time derivative into yd, in one pass:
// with y = c0 + s(c1 + s1(c2 + s(c3 + s1 c4))), s1 = 1 - s,
// P = c2 + s(c3 + s1 c4) and Q = c1 + s1 P (so y = c0 + s Q),
// dy/ds = Q + s(s1 (c3 + (1 - 2s) c4) - P); dy/dt = (dy/ds)/h.
func (v *fastSolver) denseBoth(t float64, y, yd *[6]float64) {
	h := v.t - v.told
	if h <= 0 {
		v.dense(t, y)
		*yd = v.k[0]
		return
	}
	s := (t - v.told) / h
	s1 := 1 - s
	if !v.contDone {
		v.contTail()
	}
	c := &v.cont
	ih := 1 / h
	for i := range 6 {
		p := c[2][i] + s*(c[3][i]+s1*c[4][i])
		q := c[1][i] + s1*p
		y[i] = c[0][i] + s*q
		yd[i] = (q + s*(s1*(c[3][i]+(1-2*s)*c[4][i])-p)) * ih
	}
}
