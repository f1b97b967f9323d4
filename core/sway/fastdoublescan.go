package sway

import (
	"errors"
	"fmt"
	"math"

	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
)

// The hook block's own scan (issue 16: the peak scanner was about a third
// of the two-mode plan). A run of fastDouble without air is integrated by
// doubleSolver (ode.Solver on the twelve numbers, fastdoubleode.go), and its
// peaks are found from the rates as on the single-rope path
// (fastpeaks.go): each watched quantity of the two masses (swing and
// excursion of the line from the suspension point to the load, the rope
// tension and its negative, the angle between rope and rigging, the rope's
// own swing, the rigging tension and its negative) is known at both ends
// of every step with its time derivative, from the projected end state
// and the rate f(t1, y1) the solver keeps; a top inside a step is the
// root of the derivative on the dense output (rateRoot, to rootTol of the
// value), a hidden top and trough pair is caught from the cubic Hermite
// interpolant of the ends. The general scanner (scan.go: four samples a
// step and parabolic refinement) stays for Options.General and for a hook
// block in wind; TestFastDoubleAgrees (fastdouble_test.go) holds the two
// together.

// dmeasure is the two masses' watched quantities and their rates at one
// instant.
type dmeasure struct {
	v, g [qTilt]float64
}

// doubleScan integrates fastDouble and watches its peaks.
type doubleScan struct {
	peaks
	recorder
	d             *fastDouble
	v             doubleSolver
	constraintErr float64
	pathOnly      bool
	maxSteps      int
	pt            pendulum.Point
	_             [0]func() // not comparable: no equality function in the wasm
}

// measureAt fills m from time t, the projected state y (n1, u1, n2, u2)
// and its rate yd (yd[3:6] = n1¨, yd[9:12] = n2¨), without air. With
// d = L1 n1 + L2 n2 the load seen from the suspension point,
// d' = L1' n1 + L1 u1 + L2 u2, and for the two tensions of
// pendulum.Double (c = n1·n2, r = -S¨ + g, b1 = r·n1 - L1¨ + L1|u1|²,
// b2 = L2|u2|², D = (1/M1)(1/M1 + 1/M2) - c²/M1²):
//
//	d(1 - cos theta)/dt = (d_z' |d|² - d_z (d·d')) / |d|³
//	d(d_x² + d_y²)/dt   = 2 (d_x d_x' + d_y d_y')
//	T1' = ((1/M1 + 1/M2) b1' + (c' b2 + c b2')/M1 - T1 D') / D
//	T2' = (b2'/M1 + (c' b1 + c b1')/M1 - T2 D') / D
//
// with c' = u1·n2 + n1·u2, b1' = -S⃛·n1 + r·u1 - L1⃛ + L1'|u1|² + 2 L1 u1·n1¨,
// b2' = 2 L2 u2·n2¨, D' = -2 c c'/M1²; the angle between rope and rigging
// has rate -c' and the rope's own swing u1_z (unit directions).
func (s *doubleScan) measureAt(t float64, y, yd *[12]float64, out *dmeasure) {
	k := s.d.k.kinAt(t)
	s.line(&k, y, out)
	ropeAngles(y, out)
	s.tensions(&k, y, yd, out)
}

// line fills the swing and the excursion of the line to the load.
func (s *doubleScan) line(k *kin, y *[12]float64, out *dmeasure) {
	l1, dl1, l2 := k.l, k.dl, s.d.l2
	dx, dy, dz := l1*y[0]+l2*y[6], l1*y[1]+l2*y[7], l1*y[2]+l2*y[8]
	ex, ey, ez := dl1*y[0]+l1*y[3]+l2*y[9], dl1*y[1]+l1*y[4]+l2*y[10], dl1*y[2]+l1*y[5]+l2*y[11]
	h2 := dx*dx + dy*dy
	dd := h2 + dz*dz
	dl := math.Sqrt(dd)
	out.v[qSwing] = oneMinusCosDown(h2, dz, dl)
	out.g[qSwing] = (ez*dd - dz*(dx*ex+dy*ey+dz*ez)) / (dd * dl)
	out.v[qExcursion] = h2
	out.g[qExcursion] = 2 * (dx*ex + dy*ey)
}

// ropeAngles fills the rope's own swing and the angle between rope and
// rigging.
func ropeAngles(y *[12]float64, out *dmeasure) {
	n1x, n1y, n1z, u1x, u1y, u1z := y[0], y[1], y[2], y[3], y[4], y[5]
	n2x, n2y, n2z, u2x, u2y, u2z := y[6], y[7], y[8], y[9], y[10], y[11]
	r2 := n1x*n1x + n1y*n1y
	out.v[qRopeSwing] = oneMinusCosDown(r2, n1z, math.Sqrt(r2+n1z*n1z))
	out.g[qRopeSwing] = u1z
	c := n1x*n2x + n1y*n2y + n1z*n2z
	cx, cy, cz := n2y*n1z-n2z*n1y, n2z*n1x-n2x*n1z, n2x*n1y-n2y*n1x
	nl := math.Sqrt(n2x*n2x + n2y*n2y + n2z*n2z)
	if c > 0 {
		out.v[qRigAngle] = (cx*cx + cy*cy + cz*cz) / (nl * (nl + c))
	} else {
		out.v[qRigAngle] = 1 - c/nl
	}
	out.g[qRigAngle] = -(u1x*n2x + u1y*n2y + u1z*n2z + n1x*u2x + n1y*u2y + n1z*u2z)
}

// tensions fills the rope and rigging tensions, as fastDouble.eval forms
// them, their negatives and the rates.
func (s *doubleScan) tensions(k *kin, y, yd *[12]float64, out *dmeasure) {
	dm := s.d
	l1, dl1, ddl1, l2 := k.l, k.dl, k.ddl, dm.l2
	n1x, n1y, n1z, u1x, u1y, u1z := y[0], y[1], y[2], y[3], y[4], y[5]
	n2x, n2y, n2z, u2x, u2y, u2z := y[6], y[7], y[8], y[9], y[10], y[11]
	c := n1x*n2x + n1y*n2y + n1z*n2z
	dc := u1x*n2x + u1y*n2y + u1z*n2z + n1x*u2x + n1y*u2y + n1z*u2z
	g := -dm.g
	r1x, r1y, r1z := 0-k.ax, 0-k.ay, g-0
	uu1 := u1x*u1x + u1y*u1y + u1z*u1z
	uu2 := u2x*u2x + u2y*u2y + u2z*u2z
	b1 := (r1x*n1x + r1y*n1y + r1z*n1z) - ddl1 + l1*uu1
	b2 := l2 * uu2
	im1, im12 := dm.im1, dm.im1im2
	det := im1*im12 - c*c*im1*im1
	t1 := (im12*b1 + c*im1*b2) / det
	t2 := (im1*b2 + c*im1*b1) / det
	db1 := -(k.jx*n1x + k.jy*n1y) + (r1x*u1x + r1y*u1y + r1z*u1z) - k.dddl + dl1*uu1 +
		2*l1*(u1x*yd[3]+u1y*yd[4]+u1z*yd[5])
	db2 := 2 * l2 * (u2x*yd[9] + u2y*yd[10] + u2z*yd[11])
	ddet := -2 * c * dc * im1 * im1
	dt1 := (im12*db1 + im1*(dc*b2+c*db2) - t1*ddet) / det
	dt2 := (im1*db2 + im1*(dc*b1+c*db1) - t2*ddet) / det
	out.v[qTension], out.g[qTension] = t1, dt1
	out.v[qTensionLow], out.g[qTensionLow] = -t1, -dt1
	out.v[qRigTension], out.g[qRigTension] = t2, dt2
	out.v[qRigTensionLow], out.g[qRigTensionLow] = -t2, -dt2
}

// oneMinusCosDown is 1 - cos of the angle of a vector from the downward
// vertical, from the square h2 of its horizontal part, its vertical part
// z and its length l (oneMinusCos with e = -z, written out).
func oneMinusCosDown(h2, z, l float64) float64 {
	if z < 0 {
		return h2 / (l * (l - z))
	}
	return 1 + z/l
}

// probe is q's value and rate on the dense output at t: the projected
// dense state, and for the tensions its rate too (the other quantities'
// rates are of the state alone).
func (s *doubleScan) probe(q quantity, t float64) (v, g float64) {
	var y, yd [12]float64
	var m dmeasure
	s.v.dense(t, &y)
	s.d.Project(y[:])
	switch q {
	case qSwing, qExcursion:
		k := s.d.k.kinAt(t)
		s.line(&k, &y, &m)
	case qRopeSwing, qRigAngle:
		ropeAngles(&y, &m)
	default:
		k := s.d.k.kinAt(t)
		s.v.denseRate(t, &yd)
		s.tensions(&k, &y, &yd, &m)
	}
	return m.v[q], m.g[q]
}

// integrateDouble is integrate's hook-block case (fast.go): the
// specialised path's budget rule (checked before the run, charged after
// it with its evaluations) and its statistics.
func integrateDouble(d *fastDouble, su *setup, opt Options, rec recorder, tEnd, relTol float64, maxN int) (*peaks, *scanner, Stats, error) {
	if opt.Budget != nil && opt.Budget.Left() < 0 {
		return nil, nil, Stats{}, &WorkError{Message: opt.Budget.message}
	}
	s := &doubleScan{peaks: peaks{motionEnd: su.motionEnd, nq: qTilt}, recorder: rec, d: d,
		pathOnly: opt.PathOnly && rec.hist != nil}
	s.v = newDoubleSolver(d, ode.Settings{RelTol: relTol, AbsTol: relTol * 1e-2, MaxSteps: maxN})
	s.maxSteps = maxN
	err := s.run(su.y0, su.breaks, tEnd)
	if opt.Budget != nil && !opt.Budget.take(int64(s.v.evals)*WorkPerEval) && err == nil {
		err = &WorkError{Message: opt.Budget.message}
	}
	if err != nil {
		return nil, nil, Stats{}, err
	}
	return &s.peaks, nil, Stats{RelTol: relTol, Steps: s.v.accepted, Rejected: s.v.rejected,
		Evals: s.v.evals, ConstraintError: s.constraintErr}, nil
}

func (s *doubleScan) run(y0 []float64, breaks []float64, tEnd float64) error {
	cuts := restartCuts(breaks, tEnd)
	d := s.d
	var y, rate [12]float64
	copy(y[:], y0)
	t := 0.0
	d.segment(0, cuts[0])
	s.v.reset(0, &y)
	var a, b dmeasure
	d.rhs(0, &y, &rate)
	s.measureAt(0, &y, &rate, &a)
	for q := range qTilt {
		s.watch(q, a.v[q], 0, 0 >= s.motionEnd-1e-12)
	}
	for _, cut := range cuts {
		if cut <= t {
			continue
		}
		d.segment(t, cut)
		s.v.reset(t, s.v.state())
		carry := false // the start of the step is the end of the one before
		for {
			done, err := s.v.Step(cut)
			if err != nil {
				if errors.Is(err, ode.ErrTooManySteps) {
					return fmt.Errorf("%w (%d steps by t = %.4g s of %.4g s)", ErrStepLimit, s.maxSteps, s.v.t, tEnd)
				}
				return err
			}
			t0, t1 := s.v.LastStep()
			residual := t0 >= s.motionEnd-1e-12
			if !s.pathOnly && !carry {
				// A new segment: the suspension point's acceleration may
				// have jumped, so the start is measured afresh.
				s.v.dense(t0, &y)
				d.Project(y[:])
				s.v.denseRate(t0, &rate)
				s.measureAt(t0, &y, &rate, &a)
				for q := range qTilt {
					s.watch(q, a.v[q], t0, residual)
				}
			}
			// Back onto the constraint for the next step, keeping the slope
			// at the step's end (as scanner.run does).
			if e := d.Project(s.v.state()[:]); e > s.constraintErr {
				s.constraintErr = e
			}
			if !s.pathOnly {
				// The rate at the step's end is the last stage, f(t1, y1),
				// kept as the next step's first.
				s.measureAt(t1, s.v.state(), s.v.rate(), &b)
				for q := range qTilt {
					s.watch(q, b.v[q], t1, residual)
				}
				s.stepPeaks(t0, t1, &a, &b, residual)
				a = b
			}
			s.emit(t0, t1)
			carry = true
			if done {
				break
			}
		}
		t = cut
	}
	for s.hist != nil && s.next < s.samples {
		// The last sample falls on tEnd exactly.
		d.Eval(tEnd, s.v.state()[:], &s.pt)
		s.pt.T = tEnd
		s.record(&s.pt)
	}
	if s.hist != nil {
		s.swings()
	}
	return nil
}

// emit records the history samples that fall in (t0, t1].
func (s *doubleScan) emit(t0, t1 float64) {
	var y [12]float64
	for s.hist != nil && s.next < s.samples {
		tt := float64(s.next) * s.sampleDt
		if tt > t1 {
			return
		}
		s.v.dense(maxf(tt, t0), &y)
		s.d.Project(y[:])
		s.d.Eval(tt, y[:], &s.pt)
		s.pt.T = tt
		s.record(&s.pt)
	}
}

// watch gives a value of q at t to its trackers.
func (s *doubleScan) watch(q quantity, v, t float64, residual bool) {
	s.ext[q].offer(v, t)
	if residual && q <= qExcursion {
		s.residualOf(q).offer(v, t)
	}
}

// stepPeaks looks for a top of every quantity inside the step [t0, t1]
// with the measures a and b at its ends.
func (s *doubleScan) stepPeaks(t0, t1 float64, a, b *dmeasure, residual bool) {
	for q := range qTilt {
		v0, v1, g0, g1 := a.v[q], b.v[q], a.g[q], b.g[q]
		if g0 > 0 && g1 < 0 {
			s.top(q, t0, v0, g0, t1, v1, g1, residual)
			continue
		}
		tm, ok := hiddenTurn(t1-t0, v0, v1, g0, g1)
		if !ok {
			continue
		}
		tm = t0 + tm*(t1-t0)
		vm, gm := s.probe(q, tm)
		if g0 > 0 && gm < 0 {
			s.top(q, t0, v0, g0, tm, vm, gm, residual)
		} else if g0 < 0 && gm > 0 {
			s.top(q, tm, vm, gm, t1, v1, g1, residual)
		}
	}
}

// hiddenTurn reports, for a step of length h whose ends both rise or both
// fall (values v0, v1, rates g0, g1), whether the derivative of the cubic
// Hermite interpolant, A s² + B s + C in s = (t - t0)/h, changes sign
// twice inside: its vertex s = -B/(2A) in (0, 1) on the other side of
// zero (A has the sign of C = h g0, B² > 4AC). It returns that vertex.
func hiddenTurn(h, v0, v1, g0, g1 float64) (float64, bool) {
	if !(g0*g1 > 0) {
		return 0, false
	}
	d := v0 - v1
	A := 6*d + 3*h*(g0+g1)
	B := -6*d - h*(4*g0+2*g1)
	C := h * g0
	if A*C <= 0 || B*B <= 4*A*C || B*A >= 0 || B*B >= 4*A*A {
		return 0, false
	}
	return -B / (2 * A), true
}

// top locates the top of q between ta and tb, where its rate goes from
// ga > 0 to gb < 0, if it may beat the best so far (bounded by the
// tangents at both ends, with the same again as a margin), and offers it.
func (s *doubleScan) top(q quantity, ta, va, ga, tb, vb, gb float64, residual bool) {
	tx := minf(maxf((vb-va+ga*ta-gb*tb)/(ga-gb), ta), tb)
	top := maxf(maxf(va+ga*(tx-ta), va), vb)
	bound := top + (top - maxf(va, vb)) + 1e-12*math.Abs(top)
	e := &s.ext[q]
	var r *extremum
	if residual {
		r = s.residualOf(q)
	}
	if e.set && bound < e.max && (r == nil || (r.set && bound < r.max)) {
		return
	}
	x, v := rateRoot(ta, ga, tb, gb, rootTol, func(t float64) (float64, float64) { return s.probe(q, t) })
	s.watch(q, v, x, residual)
}

// rateRoot finds the root of a rate g between ta and tb (ga > 0 > gb) by
// regula falsi with the Illinois modification (M. Dowell and P. Jarratt,
// BIT 11 (1971) 168-174), from f, which gives the value and the rate at t;
// it returns the root and the value there. It stops at 1e-9 of the
// bracket, at a zero rate, after 60 probes, and with valueTol > 0 once the
// value is within valueTol of the top (relative): near a top of curvature
// -c, a point whose rate is g lies g²/(2c) below it, with c taken as the
// rate's secant over the first bracket, (ga - gb)/(tb - ta). The
// single-rope path's peaks use it without valueTol (fastpeaks.go).
func rateRoot(ta, ga, tb, gb, valueTol float64, f func(float64) (v, g float64)) (x, v float64) {
	tol := 1e-9 * (tb - ta)
	c2 := 2 * (ga - gb) / (tb - ta)
	x = ta
	side := 0
	for range 60 {
		xn := (ta*gb - tb*ga) / (gb - ga)
		if !(xn > ta && xn < tb) {
			xn = 0.5 * (ta + tb)
		}
		vx, gx := f(xn)
		done := math.Abs(xn-x) <= tol || tb-ta <= tol || gx == 0 || (valueTol > 0 && gx*gx <= valueTol*c2*math.Abs(vx))
		x, v = xn, vx
		if done {
			break
		}
		if gx > 0 {
			ta, ga = x, gx
			if side == -1 {
				gb *= 0.5
			}
			side = -1
		} else {
			tb, gb = x, gx
			if side == 1 {
				ga *= 0.5
			}
			side = 1
		}
	}
	return x, v
}

// rootTol is how close to the top of the dense output rateRoot places a
// peak's value, relative to the value: a few units in the last place.
const rootTol = 1e-14
