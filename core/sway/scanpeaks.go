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
// a <= m <= b, by successive parabolic interpolation on the dense output
// (R. P. Brent, "Algorithms for Minimization without Derivatives", 1973,
// ch. 5, with halving in place of the golden-section fallback: the
// bracket is a small part of a step, where the quantity is smooth). When m
// is at an end of the bracket, its midpoint is looked at first.
func (s *scanner) refine(q quantity, a, fa, m, fm, b, fb float64) (float64, float64) {
	if m <= a || m >= b {
		m = 0.5 * (a + b)
		fm = s.value(q, s.atFor(q, m))
	}
	for range 30 {
		if fm < fa || fm < fb {
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
			continue
		}
		num := (m-a)*(m-a)*(fm-fb) - (m-b)*(m-b)*(fm-fa)
		den := (m-a)*(fm-fb) - (m-b)*(fm-fa)
		if den == 0 {
			break
		}
		x := m - 0.5*num/den
		if !(x > a && x < b) {
			break
		}
		fx := s.value(q, s.atFor(q, x))
		if math.Abs(x-m) <= 1e-7*(b-a) {
			if fx > fm {
				m, fm = x, fx
			}
			break
		}
		switch {
		case x < m && fx >= fm:
			b, fb, m, fm = m, fm, x, fx
		case x < m:
			a, fa = x, fx
		case fx >= fm:
			a, fa, m, fm = m, fm, x, fx
		default:
			b, fb = x, fx
		}
	}
	switch {
	case fa > fm && fa >= fb:
		return a, fa
	case fb > fm:
		return b, fb
	}
	return m, fm
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
