package motion

import (
	"errors"
	"fmt"
	"math"
	"sync"
)

// SCurve is a jerk-limited point-to-point move: the trapezoidal move of the
// same distance, top speed, acceleration and deceleration, averaged over a
// sliding window of the rounding time Tr (a moving-average filter):
//
//	x_s(t) = (1/Tr) * integral from t-Tr to t of x_trap(s) ds.
//
// Its acceleration is the trapezoid's acceleration averaged the same way,
// so each acceleration step becomes a ramp of duration Tr with jerk
// accel/Tr (decel/Tr on the braking side). The distance is unchanged and the
// move lasts Tr longer. If a ramp of the trapezoid is shorter than Tr the
// peak acceleration drops below accel; if its cruise is shorter than Tr the
// peak speed drops below the top speed. Given a jerk limit J instead, the
// rounding time is Tr = accel/J.
type SCurve struct {
	*Piecewise
	Base     *Trapezoid
	Rounding float64 // Tr, s
}

// NewSCurve builds a jerk-limited move; rounding zero gives the trapezoid.
// Speed, accel and decel must be positive and rounding not negative.
func NewSCurve(start, distance, speed, accel, decel, rounding float64) *SCurve {
	if !(rounding >= 0) {
		panic("motion: S-curve needs a rounding time >= 0")
	}
	base := NewTrapezoid(start, distance, speed, accel, decel)
	return &SCurve{Piecewise: Rounded(base, rounding), Base: base, Rounding: rounding}
}

// Rounded averages a profile with piecewise constant acceleration (a
// Trapezoid, or a Piecewise whose spans have no jerk) over a sliding window
// of w seconds, as described for SCurve. The result is exact.
func Rounded(p Profile, w float64) *Piecewise {
	bp := p.Breakpoints()
	if len(bp) == 0 {
		return newBuilder(0, 0, 0).rest()
	}
	st := p.At(bp[0] - 1)
	if w <= 0 {
		b := newBuilder(bp[0], p.At(bp[0]).Pos, st.Vel)
		for i := 0; i+1 < len(bp); i++ {
			b.span(bp[i+1]-bp[i], p.At(0.5*(bp[i]+bp[i+1])).Acc, 0)
		}
		return b.rest()
	}
	knots := make([]float64, 0, 2*len(bp))
	for _, t := range bp {
		knots = append(knots, t, t+w)
	}
	knots = dedupe(knots)
	// Before the first knot the window holds only the steady state before
	// the move: position P0 + v*(s - t0), whose average is P0 - v*w/2.
	b := newBuilder(knots[0], average(p, knots[0], w), st.Vel)
	acc := st.Acc
	for i := 0; i+1 < len(knots); i++ {
		m := 0.5 * (knots[i] + knots[i+1])
		j := (p.At(m).Acc - p.At(m-w).Acc) / w
		d := knots[i+1] - knots[i]
		b.span(d, acc, j)
		acc += j * d
	}
	return b.rest()
}

// average is (1/w) * integral of p's position over [t-w, t] for a profile
// at constant speed before t (used for the starting position only).
func average(p Profile, t, w float64) float64 {
	s := p.At(t)
	return s.Pos - s.Vel*w/2
}

// Step is one speed step of a step-speed move: from time AtS the drive
// heads for Speed (signed, axis units per second).
type Step struct {
	AtS   float64
	Speed float64
}

// Steps is a step-speed move as a multi-step pendant or a two-speed drive
// gives it: at each step time the drive heads for the step's speed with its
// own ramp, accelerating at Accel while the speed grows in size and
// decelerating at Decel while it shrinks, then holds it. A step that comes
// before the last speed is reached starts from the speed reached so far.
// The last step must be to speed zero, so the move ends at rest.
type Steps struct {
	*Piecewise
	List         []Step
	Accel, Decel float64
}

// NewSteps builds a step-speed move. Step times must not decrease, the last
// step must be to speed zero and the ramps must be positive.
func NewSteps(steps []Step, accel, decel float64) (*Steps, error) {
	if len(steps) == 0 {
		return nil, errors.New("a step-speed move needs at least one step")
	}
	if !(accel > 0 && decel > 0) || math.IsInf(accel, 0) || math.IsInf(decel, 0) {
		return nil, errors.New("a step-speed move needs positive ramp acceleration and deceleration")
	}
	for i, s := range steps {
		if math.IsNaN(s.AtS) || math.IsInf(s.AtS, 0) || math.IsNaN(s.Speed) || math.IsInf(s.Speed, 0) {
			return nil, fmt.Errorf("step %d is not a finite time and speed", i+1)
		}
		if i > 0 && s.AtS < steps[i-1].AtS {
			return nil, fmt.Errorf("step %d at %g s comes before step %d at %g s: steps must be in time order", i+1, s.AtS, i, steps[i-1].AtS)
		}
	}
	if steps[len(steps)-1].Speed != 0 {
		return nil, errors.New("the last step must be to speed 0, so that the move ends at rest")
	}
	b := newBuilder(steps[0].AtS, 0, 0)
	target := 0.0
	// ramp moves b toward target for at most d seconds, then holds.
	ramp := func(d float64) {
		for d > 1e-12 && b.v != target {
			a, stop := math.Copysign(decel, target-b.v), target
			switch {
			case b.v*target < 0: // reversing: brake to zero first
				stop = 0
			case math.Abs(target) > math.Abs(b.v): // speed grows in size
				a = math.Copysign(accel, target-b.v)
			}
			full := (stop - b.v) / a
			dt := math.Min(d, full)
			b.span(dt, a, 0)
			if dt == full {
				b.v = stop // exactly, without rounding
			}
			d -= dt
		}
		if d > 1e-12 && !math.IsInf(d, 1) {
			b.span(d, 0, 0)
		}
	}
	for i, s := range steps {
		if i > 0 {
			ramp(s.AtS - steps[i-1].AtS)
		}
		target = s.Speed
	}
	ramp(math.Inf(1))
	return &Steps{Piecewise: b.rest(), List: append([]Step(nil), steps...), Accel: accel, Decel: decel}, nil
}

// HardStop is an axis already moving at Speed from time zero (and before),
// that brakes at Decel from time BrakeS to rest: a stop by the brake or the
// emergency stop. Before BrakeS the suspension point moves steadily; the
// load, hanging still at time zero, only feels the braking.
type HardStop struct {
	*Piecewise
	Speed, BrakeS, Decel float64
}

// NewHardStop builds a hard stop. Decel must be positive and brake >= 0.
func NewHardStop(speed, brake, decel float64) *HardStop {
	if !(decel > 0) || !(brake >= 0) {
		panic("motion: hard stop needs positive deceleration and brake time >= 0")
	}
	b := newBuilder(0, 0, speed)
	b.span(brake, 0, 0)
	b.span(math.Abs(speed)/decel, -math.Copysign(decel, speed), 0)
	b.v = 0
	return &HardStop{Piecewise: b.rest(), Speed: speed, BrakeS: brake, Decel: decel}
}

// Impulse is one impulse of an input shaper: amplitude A at time T (s).
type Impulse struct {
	A, T float64
}

// Shaped is a profile passed through an input shaper: the convolution of
// the base command with the shaper's impulses,
//
//	x(t) = sum_i A_i * x_base(t - T_i),
//
// and the same sum for speed and acceleration. With amplitudes that add to
// one the shaped move covers the same distance, and lasts the last impulse
// time longer (Singer & Seering, ASME J. Dyn. Sys. Meas. Control 112, 1990).
// An evaluation looks only at the impulses whose copy of the base is
// moving at t (see index); Base and Impulses must not change after the
// first call of At.
type Shaped struct {
	Base     Profile
	Impulses []Impulse

	once sync.Once
	idx  *index
}

func (s *Shaped) index() *index {
	s.once.Do(func() {
		terms := make([]term, len(s.Impulses))
		for i, im := range s.Impulses {
			terms[i] = term{p: s.Base, a: im.A, shift: im.T}
		}
		s.idx = newIndex(terms)
	})
	return s.idx
}

// At implements Profile.
func (s *Shaped) At(t float64) State { return s.index().at(t) }

// Breakpoints implements Profile.
func (s *Shaped) Breakpoints() []float64 {
	var ts []float64
	for _, im := range s.Impulses {
		for _, b := range s.Base.Breakpoints() {
			ts = append(ts, b+im.T)
		}
	}
	return dedupe(ts)
}

// End implements Profile.
func (s *Shaped) End() float64 {
	last := 0.0
	for _, im := range s.Impulses {
		last = math.Max(last, im.T)
	}
	return s.Base.End() + last
}
