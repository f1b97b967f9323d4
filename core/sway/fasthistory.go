package sway

import "math"

// The specialised path's time histories (the plots' series and the
// clearance check's path): 601 samples by default, each a point of the
// dense output put back onto the constraint, with the suspension point
// and the rope where they are and the tension the state gives.
//
// The plain way takes each sample through three calls: fastSolver.dense
// into an array, project on it, and recordState, which evaluates the
// suspension point and the applied acceleration through kinOf and rel as
// for any move. On travel moves alone (with a steady air or none, the
// commonest case) emit makes the same samples in one loop over the
// samples of a step, with the dense output, the projection and the
// series' writes written out on plain numbers and the suspension point
// read from the segment's spans: the same operations in the same order,
// so the same bits (TestSamplesAsPlain holds the two ways together;
// Options.kinSamples selects the plain way). Hoists without air take the
// loop too (the rope's length and its second rate from the hoist's span,
// as kinOf gives them: three lines; under node the plain way's samples
// cost about three times their native time). Slews take the plain way:
// written out for them too, the loop saved under 2 % of a slew's
// evaluation for about 0.5 kB of the page's gzipped wasm.
// On the full evaluation of the diagonal travel example the plain way
// takes about 200 instructions a sample more, a tenth of the evaluation
// (callgrind, natively). Either way leaves the swing angle to the end of
// the run (swingDegrees, from the rope's components the samples hold).

// emit records the history samples that fall in (t0, t1], the last step.
//
// A sample at time tt is the dense output at max(tt, t0) (a sample can
// fall a rounding before the step's start), that is, with h = t1 - t0 and
// s = (max(tt, t0) - t0)/h, y = c0 + s(c1 + (1-s)(c2 + s(c3 + (1-s) c4)))
// (fastSolver.dense), then projected: n = y[0:3]/|y[0:3]| and
// u = y[3:6] - (n·y[3:6]) n (pendulum.Project).
//
// On travel moves alone the rope length is l0 (l0 - 0) and its second
// rate -0 (-(0)), with a hoist l0 - h and -h¨ of the hoist's span; a - S¨
// is -S¨ of the segment's spans, plus the air's share kept by steadyAir
// when the air is steady (up to airTo, beyond the step's end t1), as
// kinOf and rel give them: the same bits without their calls and the
// whole kin made for every sample.
func (s *fastScan) emit(t0, t1 float64) {
	h := s.hist
	if h == nil || s.next >= s.samples {
		return
	}
	v, m := &s.v, s.m
	if s.kinSamples || !(m.travel || m.steady && t1 <= m.airTo || m.air == nil && !m.slewing) {
		s.emitPlain(t0, t1)
		return
	}
	i, dt := s.next, s.sampleDt
	if float64(i)*dt > t1 {
		return // no sample in this step: the dense output is not needed
	}
	if !v.contDone {
		v.contTail()
	}
	c := &v.cont
	told, hs := v.told, v.t-v.told
	hasX, hasY := len(m.x) > 0, len(m.y) > 0
	// The series as local slices of one length, so that writing sample i
	// needs one bounds check, not eleven loads of each slice's header.
	ts := h.TimeS[:s.samples]
	rx3, ry3, rz3 := h.RelXM[:len(ts)], h.RelYM[:len(ts)], h.RelZM[:len(ts)]
	lx3, ly3, sx3, sy3 := h.LoadXM[:len(ts)], h.LoadYM[:len(ts)], h.SuspensionXM[:len(ts)], h.SuspensionYM[:len(ts)]
	tn3, rp3 := h.TensionN[:len(ts)], h.RopeM[:len(ts)]
	for ; i < len(ts); i++ {
		tt := float64(i) * dt
		if tt > t1 {
			break
		}
		at := tt // a plain comparison, as the builtin max of floats is a call in wasm
		if at < t0 {
			at = t0
		}
		var sf float64
		if hs > 0 {
			sf = (at - told) / hs
		}
		s1 := 1 - sf
		y0, y1, y2 := densePoly(c, 0, sf, s1), densePoly(c, 1, sf, s1), densePoly(c, 2, sf, s1)
		y3, y4, y5 := densePoly(c, 3, sf, s1), densePoly(c, 4, sf, s1), densePoly(c, 5, sf, s1)
		y0, y1, y2, y3, y4, y5, _ = projected(y0, y1, y2, y3, y4, y5)
		var px, py, ax, ay float64
		if hasX {
			px, _, ax = m.sx.At(tt)
		}
		if hasY {
			py, _, ay = m.sy.At(tt)
		}
		l, ddl := m.l0, math.Copysign(0, -1)
		if m.hoisting {
			h, _, ddh := m.sh.At(tt)
			l, ddl = m.l0-h, -ddh
		}
		rx, ry, rz := -ax, -ay, -m.g
		if m.steady {
			rx, ry, rz = rx+m.airX, ry+m.airY, m.rz
		}
		lx, ly, lz := px+l*y0, py+l*y1, l*y2
		dx, dy := lx-px, ly-py
		ts[i] = tt
		rx3[i], ry3[i], rz3[i] = dx, dy, lz
		lx3[i], ly3[i] = lx, ly
		sx3[i], sy3[i] = px, py
		tn3[i] = m.tension(rx, ry, rz, l, ddl, y0, y1, y2, y3*y3+y4*y4+y5*y5)
		rp3[i] = l
	}
	s.next = i
}

// emitPlain is emit the plain way: each sample through fastSolver.dense,
// project and recordState.
func (s *fastScan) emitPlain(t0, t1 float64) {
	for s.next < s.samples {
		tt := float64(s.next) * s.sampleDt
		if tt > t1 {
			return
		}
		at := tt
		if at < t0 {
			at = t0
		}
		var y [6]float64
		s.v.dense(at, &y)
		project(&y)
		s.recordState(tt, &y)
	}
}

// recordState writes the history sample of state y at t: the fields of
// recorder.record, computed from the state as point does, without the
// pendulum.Point between, but for the swing angle, which swingDegrees
// works out at the run's end (with the horizontal part by a square root
// rather than math.Hypot: Go code in wasm; the two differ in the last
// bits). It is emit's plain way, and takes the last sample at the run's
// end from the end state.
func (s *fastScan) recordState(t float64, y *[6]float64) {
	m := s.m
	k := m.kinOf(t, false)
	rx, ry, rz := m.rel(t, &k, y)
	px, py, l, ddl := k.px, k.py, k.l, k.ddl
	h, i := s.hist, s.next
	lx, ly, lz := px+l*y[0], py+l*y[1], l*y[2]
	dx, dy := lx-px, ly-py
	// Written in place (the series are at full length from the start,
	// sized): an append writes each slice's length back besides.
	h.TimeS[i] = float64(i) * s.sampleDt
	h.RelXM[i], h.RelYM[i], h.RelZM[i] = dx, dy, lz
	h.LoadXM[i], h.LoadYM[i] = lx, ly
	h.SuspensionXM[i], h.SuspensionYM[i] = px, py
	h.TensionN[i] = m.tension(rx, ry, rz, l, ddl, y[0], y[1], y[2], y[3]*y[3]+y[4]*y[4]+y[5]*y[5])
	h.RopeM[i] = l
	s.next++
}

// sized puts every series of the history at n samples (reserve made the
// room), for emit and recordState to write in place.
func (h *History) sized(n int) {
	for _, c := range h.series() {
		*c = (*c)[:n]
	}
}
