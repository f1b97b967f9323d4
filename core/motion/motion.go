// Package motion describes how one crane axis moves in time: travel of the
// trolley, bridge or gantry, slewing, a trolley on a jib changing the radius,
// or hoisting. A Profile gives position, speed and acceleration at any time
// and lists the times where the acceleration jumps, so that an integrator can
// restart there.
//
// Positions are in the axis' own SI unit: metres for travel, radius and
// hoist, radians for slew.
package motion

import (
	"math"

	"swaysheet/core/internal/sorts"
)

// State is position, speed and acceleration of an axis at one instant.
type State struct {
	Pos, Vel, Acc float64
}

// Profile is the motion of one axis relative to where it starts.
// At must be defined for every t; before its start a profile is at rest at
// zero, after its end it is at rest at its final position.
type Profile interface {
	At(t float64) State
	// Breakpoints lists, ascending, the times where the acceleration or its
	// derivative is not smooth.
	Breakpoints() []float64
	// End is the time from which the axis stays at rest.
	End() float64
}

// Trapezoid is a point-to-point move with a trapezoidal speed profile:
// constant acceleration up to the top speed, cruise, constant deceleration to
// rest. If the distance is too short to reach the top speed, the move is
// triangular and peaks at PeakSpeed. Its fields Start (s), Distance
// (signed, axis units), Speed (top speed), Accel and Decel (all > 0) are
// ramped's.
type Trapezoid struct {
	ramped
}

// NewTrapezoid builds a trapezoidal move. Speed, accel and decel must be
// positive; the caller validates user input before calling.
func NewTrapezoid(start, distance, speed, accel, decel float64) *Trapezoid {
	if !(speed > 0 && accel > 0 && decel > 0) {
		panic("motion: trapezoid needs positive speed, acceleration and deceleration")
	}
	return &Trapezoid{newRamped(start, distance, speed, accel, decel, 1)}
}

// ramped is what the point-to-point moves with a ramp up, a cruise and a
// ramp down share (Trapezoid, SineRamp): their fields and phase times. A
// ramp to speed v at the largest acceleration a lasts k*v/a and covers
// k*v²/(2*a): k = 1 for a linear ramp, pi/2 for a half-cosine one. When
// the distance d is shorter than the two ramps at the top speed, the move
// never cruises and peaks at v = sqrt(2*d*a*b/(k*(a + b))), b the largest
// deceleration.
type ramped struct {
	Start    float64 // s
	Distance float64 // signed, axis units
	Speed    float64 // top speed, > 0
	Accel    float64 // the largest acceleration, > 0
	Decel    float64 // the largest deceleration, > 0

	// Derived by newRamped.
	dist, sign, peak, tAcc, tCruise, tDec float64
}

func newRamped(start, distance, speed, accel, decel, k float64) ramped {
	p := ramped{Start: start, Distance: distance, Speed: speed, Accel: accel, Decel: decel}
	d := math.Abs(distance)
	p.dist, p.sign = d, 1
	if distance < 0 {
		p.sign = -1
	}
	v := speed
	// Distance covered by the two ramps at full speed.
	if ramps := k*v*v/(2*accel) + k*v*v/(2*decel); ramps > d {
		v = math.Sqrt(2 * d * accel * decel / (k * (accel + decel)))
	}
	p.peak = v
	if v > 0 {
		p.tAcc = k * v / accel
		p.tDec = k * v / decel
		p.tCruise = math.Max(0, (d-k*v*v/(2*accel)-k*v*v/(2*decel))/v)
	}
	return p
}

// Triangular reports whether the move is too short to reach its top speed.
func (p *ramped) Triangular() bool { return p.peak < p.Speed*(1-1e-12) }

// PeakSpeed is the highest speed the move reaches.
func (p *ramped) PeakSpeed() float64 { return p.peak }

// Duration is the time from start to rest.
func (p *ramped) Duration() float64 { return p.tAcc + p.tCruise + p.tDec }

// End implements Profile.
func (p *ramped) End() float64 { return p.Start + p.Duration() }

// Breakpoints implements Profile: the start and end of each ramp.
func (p *ramped) Breakpoints() []float64 {
	t1 := p.Start + p.tAcc
	t2 := t1 + p.tCruise
	return dedupe([]float64{p.Start, t1, t2, t2 + p.tDec})
}

func (p *ramped) window() (float64, bool) { return p.Start, true }

// At implements Profile.
func (p *Trapezoid) At(t float64) State {
	sign := p.sign
	tau := t - p.Start
	var s State
	switch {
	case tau <= 0:
		return State{}
	case tau < p.tAcc:
		s = State{Pos: 0.5 * p.Accel * tau * tau, Vel: p.Accel * tau, Acc: p.Accel}
	case tau < p.tAcc+p.tCruise:
		u := tau - p.tAcc
		s = State{Pos: 0.5*p.peak*p.tAcc + p.peak*u, Vel: p.peak}
	case tau < p.Duration():
		u := p.Duration() - tau // time left
		s = State{Pos: p.dist - 0.5*p.Decel*u*u, Vel: p.Decel * u, Acc: -p.Decel}
	default:
		s = State{Pos: p.dist}
	}
	return State{Pos: sign * s.Pos, Vel: sign * s.Vel, Acc: sign * s.Acc}
}

// Sum is several profiles on one axis added together: a sequence of moves,
// or moves that overlap.
type Sum []Profile

// At implements Profile.
func (m Sum) At(t float64) State {
	var s State
	for _, p := range m {
		q := p.At(t)
		s.Pos += q.Pos
		s.Vel += q.Vel
		s.Acc += q.Acc
	}
	return s
}

// Breakpoints implements Profile.
func (m Sum) Breakpoints() []float64 {
	var all []float64
	for _, p := range m {
		all = append(all, p.Breakpoints()...)
	}
	return dedupe(all)
}

// End implements Profile.
func (m Sum) End() float64 {
	e := 0.0
	for _, p := range m {
		e = math.Max(e, p.End())
	}
	return e
}

// dedupe sorts ts and drops times closer than 1e-9 s to the one before.
func dedupe(ts []float64) []float64 {
	sorts.Floats(ts)
	out := ts[:0]
	for _, t := range ts {
		if len(out) == 0 || t-out[len(out)-1] > 1e-9 {
			out = append(out, t)
		}
	}
	return out
}
