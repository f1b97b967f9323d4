package plan

import (
	"math"

	"swaysheet/core/units"
)

// peakLimited finds the largest acceleration whose simulated peak is inside
// the peak limits at every rope length. The first guess is the largest
// acceleration, from g*tan(theta/2) (less the slew lean) down in steps of
// 2 %, whose linear-theory peak (linearPeak) is inside the limits; the
// simulation then corrects it (scaling by limit/peak). It returns nil when
// the answer is the drive's largest acceleration, which the drive-limits
// option already is.
func (rq *request) peakLimited() *Option {
	a0, a := rq.peakGuess()
	var best *Option
	for range 6 {
		o := rq.trapezoidOption("peak_limited", "Acceleration for the peak limit", a, rq.vmax)
		kept, _ := rq.verifyAll([]*Option{o}, RelTol)
		if len(kept) == 0 {
			break // not verifiable: left out
		}
		r := o.peakRatio(rq.lim)
		if r <= 1 {
			if best == nil || o.accel() > best.accel() {
				best = o
			}
			if r > 0.95 || a >= rq.amax {
				break
			}
		}
		// The peak grows about in proportion to the acceleration.
		next := math.Min(rq.amax, a*0.985/r)
		if best != nil && next <= best.accel()*1.01 {
			break
		}
		a = next
	}
	if best == nil || best.accel() >= rq.amax*(1-1e-9) {
		return nil
	}
	best.add(say("Found from g*tan(theta_lim/2) = {0} (one sudden ramp), lowered until the linear theory of the whole move keeps inside the limits, then corrected by simulation at every rope length.",
		rq.accelQ(a0)))
	return best
}

// peakGuess is g*tan(theta_lim/2) (less the slew lean) and the largest
// acceleration from it down in steps of 2 % whose linear-theory peak is
// inside the limits.
func (rq *request) peakGuess() (a0, a float64) {
	g := units.StandardGravity
	th := rq.angleLimit()
	th -= rq.lean(rq.vmax)
	a0 = math.Min(rq.amax, g*math.Tan(th/2)/rq.k)
	a = a0
	for range 200 {
		if rq.linearRatio(a) <= 0.99 {
			break
		}
		a *= 0.98
	}
	return a0, a
}

// peakCandidate is the peak-limited option at its linear first guess, to
// be refined by simulation (peakLimited) only if it can decide the
// recommendation; nil when the guess is the drive's largest acceleration.
func (rq *request) peakCandidate() *candidate {
	a0, a := rq.peakGuess()
	if a >= rq.amax*(1-1e-9) {
		return nil
	}
	o := rq.trapezoidOption("peak_limited", "Acceleration for the peak limit", a, rq.vmax)
	o.add(say("First guess from g*tan(theta_lim/2) = {0} (one sudden ramp), lowered until the linear theory of the whole move keeps inside the limits; not corrected by simulation.",
		rq.accelQ(a0)))
	return &candidate{o: o, verify: func(float64) (*Option, []string) { return rq.peakLimited(), nil }}
}

// fixed is the candidate of an option simulated as it is.
func (rq *request) fixed(o *Option) candidate {
	return candidate{o: o, verify: func(tol float64) (*Option, []string) {
		kept, dropped := rq.verifyAll([]*Option{o}, tol)
		if len(kept) == 0 {
			return nil, dropped
		}
		return kept[0], dropped
	}}
}
