package sway

// What the scanner watches along a run: the quantities (swing, excursion,
// tensions, and with rigging or a rigid load their own), the largest value
// of each, and the refinement of a top between the samples of a step.

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/pendulum"
)

// extremum tracks the largest value of a quantity and when it occurred.
type extremum struct {
	_       [0]func() // not comparable: no equality function (see fastScan)
	max, at float64
	set     bool
}

func (e *extremum) offer(v, t float64) bool {
	if !e.set || v > e.max {
		e.max, e.at, e.set = v, t, true
		return true
	}
	return false
}

// peaks tracks the largest value of every watched quantity over a run,
// and after the last motion that of the swing and the excursion (the
// general and the specialised path's scans share it).
type peaks struct {
	_            [0]func()
	motionEnd    float64
	nq           quantity // quantities watched: all of them with rigging
	ext          [nQuantities]extremum
	resSwing     extremum // swing after the last motion
	resExcursion extremum
}

// quantity is one scalar watched along the run.
type quantity int

const (
	qSwing quantity = iota
	qExcursion
	qTension
	qTensionLow
	// With a hook block and rigging:
	qRigAngle  // angle between rope and rigging
	qRopeSwing // the rope's own angle from the vertical
	qRigTension
	qRigTensionLow
	// With a rigid load (values from Point.Body):
	qTilt                  // the load's tilt, rad
	qTwist                 // |twist|, rad
	qCorner                // square of the largest corner swing
	qLeg                   // tension of legs 0 to 3
	qLegLow     = qLeg + 4 // minus the tension of legs 0 to 3
	nQuantities = qLegLow + 4
)

// value is the quantity q at p, or a cheaper quantity that rises and falls
// with it: for an angle theta from the vertical, 1 - cos(theta) (written
// so that it keeps its precision near the vertical); for the excursion,
// its square. swingRad and excursionM turn them back.
func (s *scanner) value(q quantity, p *pendulum.Point) float64 {
	switch q {
	case qSwing:
		return oneMinusCos(p.Rel(), r3.Vec{Z: -1})
	case qExcursion:
		d := p.Rel()
		return d.X*d.X + d.Y*d.Y
	case qTension:
		return p.Tension
	case qTensionLow:
		return -p.Tension
	case qRigAngle:
		return oneMinusCos(p.RiggingDir, p.Dir)
	case qRopeSwing:
		return oneMinusCos(p.Dir, r3.Vec{Z: -1})
	case qRigTension:
		return p.RiggingTension
	case qRigTensionLow:
		return -p.RiggingTension
	}
	return bodyValue(q, p.Body)
}

// oneMinusCos is 1 - cos of the angle between d and the unit vector e:
// |d x e|^2 / (|d| (|d| + d.e)) where d.e > 0, which keeps its precision
// for small angles.
func oneMinusCos(d, e r3.Vec) float64 {
	l := math.Sqrt(r3.Dot(d, d))
	c := r3.Dot(d, e)
	if c > 0 {
		x := r3.Cross(d, e)
		return r3.Dot(x, x) / (l * (l + c))
	}
	return 1 - c/l
}

// swingRad turns the swing value back into the angle:
// 1 - cos(theta) = 2*sin^2(theta/2).
func swingRad(v float64) float64 { return 2 * math.Asin(math.Sqrt(math.Max(0, math.Min(1, v/2)))) }

// excursionM turns the excursion value back into metres.
func excursionM(v float64) float64 { return math.Sqrt(math.Max(0, v)) }

// residualOf is the residual tracker of q, or nil.
func (s *peaks) residualOf(q quantity) *extremum {
	switch q {
	case qSwing:
		return &s.resSwing
	case qExcursion:
		return &s.resExcursion
	}
	return nil
}

// refine finds the maximum of quantity q near m, given its values at
// a <= m <= b, on the dense output. When m is at an end of the bracket,
// its midpoint is looked at first; while the middle value is below an
// end's, the bracket is halved toward the larger end. Once bracketed, the
// top is located by Brent's method for a local extremum: parabolic
// interpolation through the best three points, with a golden-section step
// whenever the parabola's step is not less than half the step before last
// or leaves the bracket (R. P. Brent, "Algorithms for Minimization without
// Derivatives", Prentice-Hall 1973, ch. 5, procedure localmin), to
// tol1 = sqrt(eps)|x| + tolX/3 in time, tolX = 1e-7 of the first bracket
// (near a top the value is flat to second order, so its error is of the
// order of eps times the value), or until the three best values agree to
// 1e-14 of the value plus valueFloor(q). Successive parabolic
// interpolation alone, as refine had it, crept toward some tops from one
// side, each step a little shorter than the one before, and followed the
// rounding of quantities at rest: 10 to 11 probes a refinement on
// bay-girder-rigid and precast-beam-tandem, 7 on precast-panel-spreader,
// some to their cap of 30; now 3.5 to 3.7 and 1.6.
func (s *scanner) refine(q quantity, a, fa, m, fm, b, fb float64) (float64, float64) {
	if m <= a || m >= b {
		m = 0.5 * (a + b)
		fm = s.value(q, s.atFor(q, m))
	}
	tolV := valueFloor(q)
	for fm < fa || fm < fb {
		if spreadWithin(fa, fm, fb, tolV) {
			break // flat to the tolerance: the best of the three is the top
		}
		// Not bracketed: the top lies toward the larger end, between
		// it and m. Halve toward it and look again.
		if fa > fb {
			b, fb = m, fm
		} else {
			a, fa = m, fm
		}
		if b-a <= 1e-9*(1+math.Abs(b)) {
			break
		}
		m = 0.5 * (a + b)
		fm = s.value(q, s.atFor(q, m))
	}
	if fm < fa || fm < fb {
		if fa > fb {
			return a, fa
		}
		return b, fb
	}
	return brentMax(a, fa, m, fm, b, fb, 1e-7*(b-a), tolV, func(t float64) float64 { return s.value(q, s.atFor(q, t)) })
}

// valueFloor is the absolute part of refine's value tolerance for q, at
// the level of rounding in the quantity as the model computes it (a
// quantity at rest wanders at that level from one instant to the next,
// and refining it would follow the rounding): 1e-9 N for the tensions,
// 1e-14 rad for the tilt and twist, 1e-28 for 1 - cos of an angle and for
// a square in m² (an angle or a distance of about 1e-14).
func valueFloor(q quantity) float64 {
	switch {
	case q == qTension || q == qTensionLow || q == qRigTension || q == qRigTensionLow || q >= qLeg:
		return 1e-9
	case q == qTilt || q == qTwist:
		return 1e-14
	}
	return 1e-28
}

// spreadWithin reports whether three values of a quantity lie within
// 1e-14 of the largest (relative) plus floor of each other: hi - lo <=
// 1e-14*|hi| + floor with hi and lo math.Max's and math.Min's of the
// three, written with comparisons (math.Max and math.Min are calls in
// wasm, four each probe of a refinement). Without a NaN the comparisons
// give hi and lo but for the sign of a zero, which changes neither side;
// with one, math.Max and Min give NaN (false) unless a +Inf and a -Inf
// make the spread +Inf <= +Inf. TestSpreadWithin holds the two to the
// same answers.
func spreadWithin(x, y, z, floor float64) bool {
	if x != x || y != y || z != z {
		return (x > math.MaxFloat64 || y > math.MaxFloat64 || z > math.MaxFloat64) &&
			(x < -math.MaxFloat64 || y < -math.MaxFloat64 || z < -math.MaxFloat64)
	}
	hi, lo := x, x
	if y > hi {
		hi = y
	}
	if z > hi {
		hi = z
	}
	if y < lo {
		lo = y
	}
	if z < lo {
		lo = z
	}
	return hi-lo <= 1e-14*math.Abs(hi)+floor
}

// sqrtEps is the square root of the float64 epsilon, Brent's relative
// tolerance for the place of an extremum.
const sqrtEps = 1.4901161193847656e-08

// goldenStep is (3 - sqrt(5))/2, the golden section's shorter part.
const goldenStep = 0.3819660112501051

// brentMax is Brent's localmin (see refine) for the maximum of f inside
// [a, b], given a < x < b with f(x) = fx at least f(a) = fa and
// f(b) = fb; tolX is the absolute tolerance in x. It starts from the
// parabola through the three points (the better end as the second best
// point) and returns the best point found and its value; at most 40
// evaluations of f.
func brentMax(a, fa, x, fx, b, fb, tolX, tolV float64, f func(float64) float64) (float64, float64) {
	w, fw, v, fv := a, fa, b, fb
	if fb > fa {
		w, fw, v, fv = b, fb, a, fa
	}
	e := b - a // the step before last: the first parabola is taken if it is inside
	var d float64
	for range 40 {
		xm := 0.5 * (a + b)
		tol1 := sqrtEps*math.Abs(x) + tolX/3
		tol2 := 2 * tol1
		if math.Abs(x-xm) <= tol2-0.5*(b-a) || spreadWithin(fx, fw, fv, tolV) {
			break // converged in time or in value
		}
		golden := true
		if math.Abs(e) > tol1 {
			// The parabola through (x, fx), (w, fw), (v, fv): its vertex is
			// x + p/q.
			r := (x - w) * (fx - fv)
			qq := (x - v) * (fx - fw)
			p := (x-v)*qq - (x-w)*r
			qq = 2 * (qq - r)
			if qq > 0 {
				p = -p
			} else {
				qq = -qq
			}
			last := e
			e = d
			if math.Abs(p) < math.Abs(0.5*qq*last) && p > qq*(a-x) && p < qq*(b-x) {
				d = p / qq
				golden = false
				if u := x + d; u-a < tol2 || b-u < tol2 {
					d = math.Copysign(tol1, xm-x)
				}
			}
		}
		if golden {
			if x >= xm {
				e = a - x
			} else {
				e = b - x
			}
			d = goldenStep * e
		}
		u := x + d
		if math.Abs(d) < tol1 {
			u = x + math.Copysign(tol1, d)
		}
		fu := f(u)
		if fu > fx {
			if u >= x {
				a = x
			} else {
				b = x
			}
			v, fv, w, fw, x, fx = w, fw, x, fx, u, fu
			continue
		}
		if u < x {
			a = u
		} else {
			b = u
		}
		if fu >= fw || w == x {
			v, fv, w, fw = w, fw, u, fu
		} else if fu >= fv || v == x || v == w {
			v, fv = u, fu
		}
	}
	return x, fx
}

func (s *scanner) observePoint(p *pendulum.Point) {
	for _, q := range s.watch {
		v := s.value(q, p)
		s.ext[q].offer(v, p.T)
		if r := s.residualOf(q); r != nil && p.T >= s.motionEnd-1e-12 {
			r.offer(v, p.T)
		}
	}
}

// watched are the quantities below nq that the load at p has: a rigid
// load (p.Body set) has no hook block's rigging (its angle, rope swing and
// tensions: the rigid load's results report its legs instead) and only
// p.Body.NLegs legs. Left unwatched, they stay unset and are not
// reported; watched, they were constant and each asked the scan for
// evaluations of its own (the rigging's tension, always zero, for the
// quantities just inside 94 % of precast-beam-tandem's steps).
func watched(nq quantity, p *pendulum.Point) []quantity {
	var w []quantity
	for q := range nq {
		if b := p.Body; b != nil {
			unused := q >= qRigAngle && q <= qRigTensionLow ||
				q >= qLeg && q < qLegLow && int(q-qLeg) >= b.NLegs ||
				q >= qLegLow && int(q-qLegLow) >= b.NLegs
			if unused {
				continue
			}
		}
		w = append(w, q)
	}
	return w
}

// reach bounds from above every sample of a step plus the slack that run
// allows a peak between samples (a second difference and 1e-12 of the
// value): when it stays below the best so far, the step changes nothing
// for that quantity. Written out for interior = 2.
func reach(v *[interior + 2]float64) float64 {
	// Plain comparisons: math.Max, math.Min and the built-in max handle NaN
	// and signed zeros at a cost; a NaN sample is never a new best anyway.
	a, b, c, d := v[0], v[1], v[2], v[3]
	top, size := a, math.Abs(a)
	if b > top {
		top = b
	}
	if c > top {
		top = c
	}
	if d > top {
		top = d
	}
	if x := math.Abs(b); x > size {
		size = x
	}
	if x := math.Abs(c); x > size {
		size = x
	}
	if x := math.Abs(d); x > size {
		size = x
	}
	slack, x := math.Abs(a-2*b+c), math.Abs(b-2*c+d)
	if x > slack {
		slack = x
	}
	return top + slack + 1e-12*size
}
