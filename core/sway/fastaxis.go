package sway

import (
	"math"
	"slices"
	"sort"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/motion"
	"swaysheet/core/pendulum"
)

// span is one piece of an axis' flattened motion (pendulum.Span: the
// rigid loads' path evaluates the same tables).
type span = pendulum.Span

// axisTable is the sum of every profile on one axis, flattened into a
// single table of constant-jerk spans (one polynomial per interval between
// the breakpoints of all the axis' profiles and their shaper copies). The
// cost of evaluating it does not grow with the number of moves, impulses
// or record samples: the evaluation keeps the span of the current segment
// between restarts (spanAt), and every breakpoint is a restart.
type axisTable []span

// spanAt is the span that holds the open interval around t: the last one
// starting at or before t.
func (a axisTable) spanAt(t float64) span {
	if len(a) == 0 {
		return span{}
	}
	i := sort.Search(len(a), func(i int) bool { return a[i].Start > t }) - 1
	return a[max(i, 0)]
}

// flatPieces lists the constant-jerk pieces of p as independent
// components (one per summed profile and shaper impulse), shifted in time
// by shift and scaled by scale. It reports false for a profile it does not
// know, whose motion the specialised path cannot reproduce.
func flatPieces(p motion.Profile, shift, scale float64, out [][]motion.Piece) ([][]motion.Piece, bool) {
	var ps []motion.Piece
	switch q := p.(type) {
	case motion.Sum:
		for _, c := range q {
			var ok bool
			if out, ok = flatPieces(c, shift, scale, out); !ok {
				return nil, false
			}
		}
		return out, true
	case *motion.Shaped:
		for _, im := range q.Impulses {
			var ok bool
			if out, ok = flatPieces(q.Base, shift+im.T, scale*im.A, out); !ok {
				return nil, false
			}
		}
		return out, true
	case *motion.Stopped:
		return stoppedPieces(q, shift, scale, out)
	case *motion.Trapezoid:
		ps = trapezoidPieces(q)
	case *motion.Piecewise:
		ps = q.Pieces()
	case *motion.SCurve:
		ps = q.Pieces()
	case *motion.Steps:
		ps = q.Pieces()
	case *motion.HardStop:
		ps = q.Pieces()
	default:
		return nil, false
	}
	for i := range ps {
		c := &ps[i]
		c.T += shift
		c.P, c.V, c.A, c.J = c.P*scale, c.V*scale, c.A*scale, c.J*scale
	}
	return append(out, ps), true
}

// trapezoidPieces are the spans of a trapezoidal move (motion.Trapezoid's
// phases: ramp up at accel, cruise at the peak speed, ramp down at decel,
// rest).
func trapezoidPieces(q *motion.Trapezoid) []motion.Piece {
	v := q.PeakSpeed()
	sign := math.Copysign(1, q.Distance)
	if v == 0 {
		return []motion.Piece{{T: q.Start}}
	}
	d := math.Abs(q.Distance)
	tAcc, tDec := v/q.Accel, v/q.Decel
	t1 := q.Start + tAcc
	t2 := q.End() - tDec
	return []motion.Piece{
		{T: q.Start, A: sign * q.Accel},
		{T: t1, P: sign * 0.5 * q.Accel * tAcc * tAcc, V: sign * v},
		{T: t2, P: sign * (d - 0.5*q.Decel*tDec*tDec), V: sign * v, A: -sign * q.Decel},
		{T: q.End(), P: sign * d},
	}
}

// flatten sums the components into one table of spans.
func flatten(comps [][]motion.Piece) axisTable {
	if len(comps) == 0 {
		return nil
	}
	var ts []float64
	for _, c := range comps {
		for _, p := range c {
			ts = append(ts, p.T)
		}
	}
	sorts.Floats(ts)
	ts = slices.Compact(ts)
	tab := make(axisTable, 0, len(ts)+1)
	// Before the first breakpoint every component moves steadily.
	first := span{Start: math.Inf(-1), Origin: ts[0]}
	for _, c := range comps {
		p0 := c[0]
		first.P += p0.P + p0.V*(ts[0]-p0.T)
		first.V += p0.V
	}
	tab = append(tab, first)
	for _, t := range ts {
		s := span{Start: t, Origin: t}
		for _, c := range comps {
			i := sort.Search(len(c), func(i int) bool { return c[i].T > t }) - 1
			if i < 0 {
				p0 := c[0]
				s.P += p0.P + p0.V*(t-p0.T)
				s.V += p0.V
				continue
			}
			q := c[i]
			// The piece's polynomial re-expanded about t.
			u := t - q.T
			s.P += q.P + u*(q.V+u*(0.5*q.A+u*q.J*(1.0/6)))
			s.V += q.V + u*(q.A+u*0.5*q.J)
			s.A += q.A + u*q.J
			s.J += q.J
		}
		tab = append(tab, s)
	}
	return tab
}
