package motion

import (
	"math"
	"sort"
)

// Piece is one span of a Piecewise profile: from time T the axis starts at
// position P with speed V and acceleration A and moves with constant jerk J,
// so that at T+u
//
//	pos = P + V*u + A*u²/2 + J*u³/6,  vel = V + A*u + J*u²/2,  acc = A + J*u.
type Piece struct {
	T, P, V, A, J float64
}

// Piecewise is a motion made of spans of constant jerk: position is a
// piecewise cubic in time, continuous with its first derivative; the
// acceleration may jump from one span to the next. Before the first span
// the axis moves steadily at the first span's starting speed (at rest for a
// move from standstill); the last span covers all later times. Every profile in this package except Shaped and Sum is
// one of these, so that each gives exact position, speed and acceleration.
type Piecewise struct {
	pieces []Piece
	end    float64
}

// At implements Profile.
func (p *Piecewise) At(t float64) State {
	ps := p.pieces
	// Last piece that starts at or before t.
	i := sort.Search(len(ps), func(i int) bool { return ps[i].T > t }) - 1
	if i < 0 {
		// Before the first span: steady at the starting speed.
		return State{Pos: ps[0].P + ps[0].V*(t-ps[0].T), Vel: ps[0].V}
	}
	q := &ps[i]
	u := t - q.T
	return State{
		Pos: q.P + u*(q.V+u*(q.A/2+u*q.J/6)),
		Vel: q.V + u*(q.A+u*q.J/2),
		Acc: q.A + u*q.J,
	}
}

// Breakpoints implements Profile: the start of every span.
func (p *Piecewise) Breakpoints() []float64 {
	ts := make([]float64, len(p.pieces))
	for i, q := range p.pieces {
		ts[i] = q.T
	}
	return dedupe(ts)
}

// End implements Profile.
func (p *Piecewise) End() float64 { return p.end }

// builder appends spans one after the other, carrying position and speed
// across each boundary.
type builder struct {
	t, p, v float64
	pieces  []Piece
}

func newBuilder(t, p, v float64) *builder { return &builder{t: t, p: p, v: v} }

// span adds a span of duration d starting at acceleration a with jerk j.
// Spans shorter than 1e-12 s are dropped.
func (b *builder) span(d, a, j float64) {
	if d < 1e-12 {
		return
	}
	b.pieces = append(b.pieces, Piece{T: b.t, P: b.p, V: b.v, A: a, J: j})
	b.p += d * (b.v + d*(a/2+d*j/6))
	b.v += d * (a + d*j/2)
	b.t += d
}

// rest ends the profile at rest at the current position.
func (b *builder) rest() *Piecewise {
	b.pieces = append(b.pieces, Piece{T: b.t, P: b.p})
	return &Piecewise{pieces: b.pieces, end: b.t}
}

// PeakSpeed is the largest |speed| of a piecewise profile, found at span
// ends and at the turning points of the speed inside spans.
func (p *Piecewise) PeakSpeed() float64 {
	v, _ := p.PeakSpeedAt()
	return v
}

// PeakSpeedAt is PeakSpeed and the first time it is reached.
func (p *Piecewise) PeakSpeedAt() (float64, float64) {
	m, at := 0.0, 0.0
	offer := func(v, t float64) {
		if v > m {
			m, at = v, t
		}
	}
	for i, q := range p.pieces {
		offer(math.Abs(q.V), q.T)
		if q.J != 0 {
			u := -q.A / q.J
			if u > 0 && (i+1 >= len(p.pieces) || q.T+u < p.pieces[i+1].T) {
				offer(math.Abs(p.At(q.T+u).Vel), q.T+u)
			}
		}
	}
	return m, at
}

// PeakAccel is the largest |acceleration| of a piecewise profile.
func (p *Piecewise) PeakAccel() float64 {
	a, _ := p.PeakAccelAt()
	return a
}

// PeakAccelAt is PeakAccel and the start of the first span reaching it.
func (p *Piecewise) PeakAccelAt() (float64, float64) {
	m, at := 0.0, 0.0
	for i, q := range p.pieces {
		a := math.Abs(q.A)
		if i+1 < len(p.pieces) {
			a = math.Max(a, math.Abs(q.A+q.J*(p.pieces[i+1].T-q.T)))
		}
		if a > m {
			m, at = a, q.T
		}
	}
	return m, at
}
