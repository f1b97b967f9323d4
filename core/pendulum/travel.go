package pendulum

import "math"

// Span is one piece of an axis' motion of constant jerk: from Start on
// (up to the next span's Start) the axis is at
//
//	pos = P + V u + A u²/2 + J u³/6,  vel = V + A u + J u²/2,
//	acc = A + J u,  jerk = J,  with u = t - Origin.
//
// A table of spans (core/sway flattens each axis' moves and shaper copies
// into one) is evaluated at a cost that does not grow with the moves; its
// first span starts at -Inf.
type Span struct {
	_             [0]func() // not comparable: no equality function (page wasm size)
	Start, Origin float64
	P, V, A, J    float64
}

// At evaluates the span at t (Horner form).
func (s *Span) At(t float64) (pos, vel, acc float64) {
	u := t - s.Origin
	return s.P + u*(s.V+u*(0.5*s.A+u*s.J*(1.0/6))), s.V + u*(s.A+u*0.5*s.J), s.A + u*s.J
}

// Travel is a suspension point that travels horizontally without a
// slewing arm (overhead and gantry cranes: trolley and bridge), and its
// rope, as span tables per axis: the same motion as Rigid's Suspension and
// Rope closures over the combined profiles, summed as one polynomial per
// span rather than profile by profile (it agrees to rounding), without a
// closure or an interface per evaluation. An axis without moves has no
// spans and is at +0; the rope is its length at the start less the
// hoist's travel. Made by NewTravel.
type Travel struct {
	x, y, hoist Span    // each axis' span holding the times from to to
	from, to    float64 // the times they all hold (to excluded)
	tabs        [3][]Span
	at          [3]int // the index of each axis' span
	l0          float64
}

// NewTravel is the motion of span tables x and y (the suspension point's
// two horizontal axes) and hoist (how far the hook has been hoisted; the
// rope is l0 less that), each sorted by Start, the first from -Inf.
func NewTravel(x, y, hoist []Span, l0 float64) *Travel {
	tr := &Travel{tabs: [3][]Span{x, y, hoist}, l0: l0}
	tr.seek(0)
	return tr
}

// At is the suspension point's motion and the rope's length with its two
// rates at t.
func (tr *Travel) At(t float64) (s Kinematics, l, dl, ddl float64) {
	if t < tr.from || t >= tr.to {
		tr.seek(t)
	}
	s.Pos.X, s.Vel.X, s.Acc.X = tr.x.At(t)
	s.Pos.Y, s.Vel.Y, s.Acc.Y = tr.y.At(t)
	h, dh, ddh := tr.hoist.At(t)
	return s, tr.l0 - h, -dh, -ddh
}

// seek makes the spans holding t current: in each table the last one
// starting at or before t (the first for a t before every start; an empty
// table is one span of zeros over all time, +0 at every t >= 0). The
// solver's evaluations move forward a step at a time and every span's
// start is a restart, so Rigid.frameInto calls it once a segment between
// restarts, and the search is a span or two.
func (tr *Travel) seek(t float64) {
	tr.from, tr.to = math.Inf(-1), math.Inf(1)
	for a, tab := range tr.tabs {
		cur := Span{Start: math.Inf(-1)}
		if len(tab) > 0 {
			k := min(tr.at[a], len(tab)-1)
			for k+1 < len(tab) && tab[k+1].Start <= t {
				k++
			}
			for k > 0 && tab[k].Start > t {
				k--
			}
			tr.at[a], cur = k, tab[k]
			if k > 0 {
				tr.from = max(tr.from, cur.Start)
			}
			if k+1 < len(tab) {
				tr.to = min(tr.to, tab[k+1].Start)
			}
		}
		switch a {
		case 0:
			tr.x = cur
		case 1:
			tr.y = cur
		default:
			tr.hoist = cur
		}
	}
}
