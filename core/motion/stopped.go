package motion

import "math"

// Stopped is a move cut short by an emergency stop at time AtS: up to AtS
// it is Base; from AtS the axis keeps the speed v0 it had then for
// ReactionS (the operator's reaction and the control's delay), then
// brakes at the constant rate Decel to rest. From the stop command the
// axis covers
//
//	v0*t_r + v0²/(2*Decel)
//
// (constant speed, then uniform deceleration: any mechanics text), and it
// is at rest from AtS + t_r + |v0|/Decel on. An axis at rest at AtS (not
// yet started, or between steps) stays where it is.
type Stopped struct {
	Base                  Profile
	AtS, ReactionS, Decel float64
	tail                  *Piecewise
}

// NewStopped cuts base at atS. Decel must be positive and reactionS >= 0
// (a programmer's error otherwise: it panics). A move already at rest for
// good by atS is returned as it is.
func NewStopped(base Profile, atS, reactionS, decel float64) Profile {
	if !(decel > 0) || !(reactionS >= 0) || math.IsNaN(atS) {
		panic("motion: an emergency stop needs a positive deceleration and a reaction time >= 0")
	}
	if atS >= base.End() {
		return base
	}
	s0 := base.At(atS)
	b := newBuilder(atS, s0.Pos, s0.Vel)
	if s0.Vel != 0 {
		b.span(reactionS, 0, 0)
		b.span(math.Abs(s0.Vel)/decel, -math.Copysign(decel, s0.Vel), 0)
	}
	b.v = 0
	return &Stopped{Base: base, AtS: atS, ReactionS: reactionS, Decel: decel, tail: b.rest()}
}

// At implements Profile.
func (s *Stopped) At(t float64) State {
	if t < s.AtS {
		return s.Base.At(t)
	}
	return s.tail.At(t)
}

// Breakpoints implements Profile: the base's before the stop, then the
// stop's.
func (s *Stopped) Breakpoints() []float64 {
	var ts []float64
	for _, t := range s.Base.Breakpoints() {
		if t < s.AtS {
			ts = append(ts, t)
		}
	}
	return dedupe(append(ts, s.tail.Breakpoints()...))
}

// End implements Profile: the moment it comes to rest.
func (s *Stopped) End() float64 { return s.tail.End() }

// Tail is the stop's pieces from AtS on (constant speed, braking, rest).
func (s *Stopped) Tail() []Piece { return s.tail.Pieces() }

// StopDistance is the distance the axis covers from the stop command to
// rest (signed, in the axis' unit).
func (s *Stopped) StopDistance() float64 { return s.tail.At(s.tail.End()).Pos - s.tail.pieces[0].P }

func (s *Stopped) window() (float64, bool) { return windowOf(s.Base) }
