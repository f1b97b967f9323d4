package motion

import "math"

// SineRamp is a point-to-point move whose speed rises along a half cosine
// (a sine ramp: the smooth ramp many variable-frequency crane drives offer,
// common practice), cruises, and falls along a half cosine to rest. Over
// the ramp up, of duration Ta to the peak speed V, with u = t - Start,
//
//	a(u) = A*sin(pi*u/Ta),                 A = pi*V/(2*Ta),
//	v(u) = (V/2)*(1 - cos(pi*u/Ta)) = V*sin²(pi*u/(2*Ta)),
//	x(u) = (V/2)*(u - (Ta/pi)*sin(pi*u/Ta)),
//
// so the acceleration starts and ends at zero and peaks at A half way up;
// the jerk, (pi*A/Ta)*cos(pi*u/Ta), is bounded (2*A²/V at the ends of the
// ramp) but jumps there. The ramp down mirrors it with peak deceleration
// D over Td = pi*V/(2*D). Accel and Decel are the peak values A and D: for
// the same largest acceleration a sine ramp takes pi/2 times as long as a
// linear one, and covers V*Ta/2 = pi*V²/(4*A), as a linear ramp of the same
// duration does. When the distance d is shorter than the two ramps at the
// top speed, the move never cruises and peaks at
//
//	V = sqrt(4*d*A*D / (pi*(A + D))).
//
// It is not piecewise polynomial, so it implements Profile itself.
type SineRamp struct {
	Start    float64 // s
	Distance float64 // signed, axis units
	Speed    float64 // top speed, > 0
	Accel    float64 // peak acceleration, > 0
	Decel    float64 // peak deceleration, > 0

	// Derived by NewSineRamp.
	dist, sign, peak, tAcc, tCruise, tDec float64
}

// NewSineRamp builds a sine-ramp move. Speed, accel and decel must be
// positive; the caller validates user input before calling.
func NewSineRamp(start, distance, speed, accel, decel float64) *SineRamp {
	if !(speed > 0 && accel > 0 && decel > 0) {
		panic("motion: sine ramp needs positive speed, acceleration and deceleration")
	}
	p := &SineRamp{Start: start, Distance: distance, Speed: speed, Accel: accel, Decel: decel}
	d := math.Abs(distance)
	p.dist, p.sign = d, 1
	if distance < 0 {
		p.sign = -1
	}
	v := speed
	if ramps := math.Pi * v * v / 4 * (1/accel + 1/decel); ramps > d {
		v = math.Sqrt(4 * d * accel * decel / (math.Pi * (accel + decel)))
	}
	p.peak = v
	if v > 0 {
		p.tAcc = math.Pi * v / (2 * accel)
		p.tDec = math.Pi * v / (2 * decel)
		p.tCruise = math.Max(0, (d-v*p.tAcc/2-v*p.tDec/2)/v)
	}
	return p
}

// Triangular reports whether the move is too short to reach its top speed.
func (p *SineRamp) Triangular() bool { return p.peak < p.Speed*(1-1e-12) }

// PeakSpeed is the highest speed the move reaches.
func (p *SineRamp) PeakSpeed() float64 { return p.peak }

// Duration is the time from start to rest.
func (p *SineRamp) Duration() float64 { return p.tAcc + p.tCruise + p.tDec }

// End implements Profile.
func (p *SineRamp) End() float64 { return p.Start + p.Duration() }

// Breakpoints implements Profile: the start and end of each ramp, where
// the jerk jumps.
func (p *SineRamp) Breakpoints() []float64 {
	t1 := p.Start + p.tAcc
	t2 := t1 + p.tCruise
	return dedupe([]float64{p.Start, t1, t2, t2 + p.tDec})
}

// At implements Profile.
func (p *SineRamp) At(t float64) State {
	tau := t - p.Start
	v := p.peak
	var s State
	switch {
	case tau <= 0:
		return State{}
	case tau < p.tAcc:
		s = halfCosine(tau, p.tAcc, v)
	case tau < p.tAcc+p.tCruise:
		s = State{Pos: 0.5*v*p.tAcc + v*(tau-p.tAcc), Vel: v}
	case tau < p.Duration():
		u := p.Duration() - tau // time left
		r := halfCosine(u, p.tDec, v)
		s = State{Pos: p.dist - r.Pos, Vel: r.Vel, Acc: -r.Acc}
	default:
		s = State{Pos: p.dist}
	}
	return State{Pos: p.sign * s.Pos, Vel: p.sign * s.Vel, Acc: p.sign * s.Acc}
}

// halfCosine is the ramp from rest to speed v over duration T at time u
// into it (the formulas in the SineRamp comment; 1 - cos written as
// 2*sin² to keep its digits near u = 0).
func halfCosine(u, T, v float64) State {
	w := math.Pi / T
	h := math.Sin(w * u / 2)
	return State{Pos: 0.5 * v * (u - math.Sin(w*u)/w), Vel: v * h * h, Acc: 0.5 * v * w * math.Sin(w*u)}
}

func (p *SineRamp) window() (float64, bool) { return p.Start, true }
