package sway

import "math"

// The specialised path's peak search. Each watched quantity q (swing as
// 1 - cos theta, excursion squared, tension and its negative) is known at
// both ends of every step with its time derivative, from the end state and
// the dense output's rate. A peak inside the step is where the derivative
// goes from positive to negative: at most one such change is looked for
// directly, and a second pair of extremes inside one step (the derivative
// changing sign twice) is caught from the cubic Hermite interpolant of the
// two ends. The top is then the root of the derivative on the dense
// output, found by regula falsi with the Illinois modification (M. Dowell
// and P. Jarratt, BIT 11 (1971) 168-174) to 1e-9 of the bracket, and its
// value is offered. A peak that cannot beat the best so far (bounded by
// the tangents at the bracket's ends, with the same again as a margin) is
// not located.
//
// The general path samples each step at four points and locates a peak
// by parabolic interpolation (scanner.run, peaks.observeStep). Both find
// the largest value of the same dense output; fast_test.go holds them
// together.

// measure is the watched quantities and their rates at one instant.
type measure struct {
	v, g [qRigAngle]float64
}

// measureAt fills m from time t, the projected state y and its rate yd
// (yd[3:6] is u' = n¨). For a unit n with n·u = 0:
//
//	d(1 - cos theta)/dt = u_z
//	d(L² (n_x² + n_y²))/dt = 2 L L' (n_x² + n_y²) + 2 L² (n_x u_x + n_y u_y)
//	dT/dt = m [rel'·n + rel·u - L⃛ + L' |u|² + 2 L u·u']
//
// with rel = a - S¨ and T = m [rel·n - L¨ + L |u|²].
func (s *fastScan) measureAt(t float64, y, yd *[6]float64, out *measure) {
	md := s.m
	var rx, ry, rz, l, dl, ddl, dddl, jx, jy, jz float64
	if md.simple() {
		rx, ry = md.travelRel(t)
		rz, l = -md.g, md.l0
		jx, jy = -md.sx.J, -md.sy.J
	} else {
		k := md.kinAt(t)
		switch {
		case md.air == nil && !s.kinSamples:
			// rel and relDot without air, written out: -S¨ and -g, -S⃛ and 0
			// (Options.kinSamples takes them through the calls, for
			// TestSamplesAsPlain).
			rx, ry, rz = -k.ax, -k.ay, -md.g
			jx, jy = -k.jx, -k.jy
		case md.steady && t <= md.airTo:
			// rel and relDot in a steady air (steadyAir): the same sums
			// on the air's shares kept for the segment.
			rx, ry, rz = -k.ax+md.airX, -k.ay+md.airY, md.rz
			jx, jy, jz = -k.jx+md.dairX, -k.jy+md.dairY, md.dairZ
		default:
			rx, ry, rz = md.rel(t, &k, y)
			jx, jy, jz = md.relDot(t, &k, y, yd)
		}
		l, dl, ddl, dddl = k.l, k.dl, k.ddl, k.dddl
	}
	out.v[qSwing], out.g[qSwing] = swingMeasure(y)
	out.v[qExcursion], out.g[qExcursion] = excursionMeasure(l, dl, y)
	uu := y[3]*y[3] + y[4]*y[4] + y[5]*y[5]
	tn := md.tension(rx, ry, rz, l, ddl, y[0], y[1], y[2], uu)
	gt := md.mass * (jx*y[0] + jy*y[1] + jz*y[2] + rx*y[3] + ry*y[4] + rz*y[5] - dddl + dl*uu +
		2*l*(y[3]*yd[3]+y[4]*yd[4]+y[5]*yd[5]))
	out.v[qTension], out.g[qTension] = tn, gt
	out.v[qTensionLow], out.g[qTensionLow] = -tn, -gt
}

// swingMeasure is the swing's watched value 1 - cos theta of the unit
// rope direction n = y[0:3] (written as (nx² + ny²)/(|n| (|n| - nz))
// below the suspension point, which keeps its precision near the
// vertical) and its rate u_z.
func swingMeasure(y *[6]float64) (v, g float64) {
	h2 := y[0]*y[0] + y[1]*y[1]
	nl := math.Sqrt(h2 + y[2]*y[2])
	if y[2] < 0 {
		v = h2 / (nl * (nl - y[2]))
	} else {
		v = 1 + y[2]/nl
	}
	return v, y[5]
}

// excursionMeasure is the excursion's watched value L² (nx² + ny²) and
// its rate, for the rope length l and its rate dl.
func excursionMeasure(l, dl float64, y *[6]float64) (v, g float64) {
	h2 := y[0]*y[0] + y[1]*y[1]
	return l * l * h2, 2*l*dl*h2 + 2*l*l*(y[0]*y[3]+y[1]*y[4])
}

// measureDense is quantity q of measureAt, with its rate, on the dense
// output at t inside the last step (the peak search's refinement). The
// swing and the excursion with their rates come from the state alone, so
// for them the dense output's rate is not made (dense and denseBoth give
// the state the same bits) and only the quantity itself is worked out:
// the swing from the state, the excursion with the rope length and its
// rate as measureAt has them (l0 and +0 on travel moves alone, kinOf's
// otherwise, which kinAt's are).
func (s *fastScan) measureDense(t float64, q quantity) (v, g float64) {
	var y, yd [6]float64
	if q <= qExcursion {
		s.v.dense(t, &y)
	} else {
		s.v.denseBoth(t, &y, &yd)
	}
	project(&y)
	switch q {
	case qSwing:
		return swingMeasure(&y)
	case qExcursion:
		md := s.m
		l, dl := md.l0, 0.0
		if !md.simple() {
			k := md.kinOf(t, false)
			l, dl = k.l, k.dl
		}
		return excursionMeasure(l, dl, &y)
	}
	var m measure
	s.measureAt(t, &y, &yd, &m)
	return m.v[q], m.g[q]
}

// offer gives a value of q at t to its trackers.
func (s *fastScan) offer(q quantity, v, t float64, residual bool) {
	if e := &s.ext[q]; v > e.max || !e.set {
		e.max, e.at, e.set = v, t, true
	}
	if residual && q <= qExcursion {
		r := &s.resSwing
		if q == qExcursion {
			r = &s.resExcursion
		}
		r.offer(v, t)
	}
}

// stepPeaks looks for peaks of every quantity inside the step [t0, t1]
// with the measures a and b at its ends.
func (s *fastScan) stepPeaks(t0, t1 float64, a, b *measure, residual bool) {
	h := t1 - t0
	for q := range qRigAngle {
		v0, v1, g0, g1 := a.v[q], b.v[q], a.g[q], b.g[q]
		switch {
		case g0 > 0 && g1 < 0:
			s.peakIn(q, t0, v0, g0, t1, v1, g1, residual)
		case g0*g1 > 0:
			// Both ends rise or both fall: a top and a trough may hide
			// inside. The Hermite cubic's derivative, a quadratic
			// A s² + B s + C in s = (t - t0)/h, tells.
			// It changes sign twice inside when its vertex s = -B/(2A)
			// lies in (0, 1) on the other side of zero: A has the sign of
			// C = h g0 and B² > 4AC (no division until then).
			d := v0 - v1
			A := 6*d + 3*h*(g0+g1)
			C := h * g0
			if A*C <= 0 {
				continue // the derivative keeps its sign
			}
			B := -6*d - h*(4*g0+2*g1)
			if B*B <= 4*A*C || B*A >= 0 || B*B >= 4*A*A {
				continue
			}
			tm := t0 - B/(2*A)*h
			vm, gm := s.measureDense(tm, q)
			if g0 > 0 && gm < 0 {
				s.peakIn(q, t0, v0, g0, tm, vm, gm, residual)
			} else if g0 < 0 && gm > 0 {
				s.peakIn(q, tm, vm, gm, t1, v1, g1, residual)
			}
		}
	}
}

// peakIn locates the top of q between ta and tb, where its rate goes
// from ga > 0 to gb < 0, if it may beat the best so far.
func (s *fastScan) peakIn(q quantity, ta, va, ga, tb, vb, gb float64, residual bool) {
	// The tangents at both ends meet above a concave top.
	tx := (vb - va + ga*ta - gb*tb) / (ga - gb)
	// Plain comparisons: the builtin min and max of floats are calls in
	// wasm (runtime.fmin64, fmax64), and no NaN reaches here.
	if tx < ta {
		tx = ta
	}
	if tx > tb {
		tx = tb
	}
	hi := va
	if vb > hi {
		hi = vb
	}
	top := va + ga*(tx-ta)
	if hi > top {
		top = hi
	}
	bound := top + (top - hi) + 1e-12*math.Abs(top)
	e := &s.ext[q]
	r := (*extremum)(nil)
	if residual {
		r = s.residualOf(q)
	}
	if e.set && bound < e.max && (r == nil || (r.set && bound < r.max)) {
		return
	}
	x, v := rateRoot(ta, ga, tb, gb, 0, func(t float64) (float64, float64) {
		return s.measureDense(t, q)
	})
	s.offer(q, v, x, residual)
}
