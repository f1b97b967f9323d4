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
// It is not piecewise polynomial, so it implements Profile itself. Its
// fields are the Trapezoid's (ramped's), Accel and Decel the peaks.
type SineRamp struct {
	ramped
}

// NewSineRamp builds a sine-ramp move. Speed, accel and decel must be
// positive; the caller validates user input before calling.
func NewSineRamp(start, distance, speed, accel, decel float64) *SineRamp {
	if !(speed > 0 && accel > 0 && decel > 0) {
		panic("motion: sine ramp needs positive speed, acceleration and deceleration")
	}
	return &SineRamp{newRamped(start, distance, speed, accel, decel, math.Pi/2)}
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
