package sway

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
	"swaysheet/core/units"
)

// extremum tracks the largest value of a quantity and when it occurred.
type extremum struct {
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

// scanner integrates the model and watches every step for extremes,
// locating each to the accuracy of the dense output.
type scanner struct {
	model     pendulum.System
	solver    *ode.Solver
	motionEnd float64
	nq        quantity // quantities watched: all of them with rigging

	ext           [nQuantities]extremum
	resSwing      extremum // swing after the last motion
	resExcursion  extremum
	constraintErr float64

	hist     *History
	sampleDt float64
	samples  int
	next     int // index of the next history sample

	y  []float64 // scratch state
	pt pendulum.Point
}

func newScanner(m pendulum.System, motionEnd float64) *scanner {
	nq := qRigAngle
	if _, ok := m.(*pendulum.Double); ok {
		nq = nQuantities
	}
	return &scanner{model: m, motionEnd: motionEnd, nq: nq, y: make([]float64, m.Len())}
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
	nQuantities
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
	default:
		return -p.RiggingTension
	}
}

// oneMinusCos is 1 - cos of the angle between d and the unit vector e:
// |d x e|^2 / (|d| (|d| + d.e)) where d.e > 0, which keeps its precision
// for small angles.
func oneMinusCos(d, e r3.Vec) float64 {
	l := r3.Norm(d)
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
func (s *scanner) residualOf(q quantity) *extremum {
	switch q {
	case qSwing:
		return &s.resSwing
	case qExcursion:
		return &s.resExcursion
	}
	return nil
}

// at evaluates the load at time t inside the last step.
func (s *scanner) at(t float64) *pendulum.Point {
	s.solver.Dense(t, s.y)
	s.model.Project(s.y)
	s.model.Eval(t, s.y, &s.pt)
	return &s.pt
}

// interior is the number of points looked at inside each step.
const interior = 3

func (s *scanner) run(y0 []float64, breaks []float64, tEnd, relTol float64) error {
	s.solver = ode.New(s.model.Func, s.model.Len(), ode.Settings{
		RelTol: relTol, AbsTol: relTol * 1e-2, MaxSteps: maxSteps,
	})
	y := append([]float64(nil), y0...)
	// Segments between restarts. The breakpoints come move by move and
	// from the wind, so they are sorted here: an unsorted list would skip
	// every restart that comes after a later one.
	var cuts []float64
	for _, b := range breaks {
		if b > 1e-12 && b < tEnd-1e-12 {
			cuts = append(cuts, b)
		}
	}
	sort.Float64s(cuts)
	cuts = append(cuts, tEnd)

	t := 0.0
	s.solver.Reset(0, y)
	s.model.Eval(0, y, &s.pt)
	s.observePoint(&s.pt)
	var ts [interior + 2]float64
	var vs [nQuantities][interior + 2]float64
	for _, cut := range cuts {
		if cut <= t {
			continue
		}
		s.solver.Reset(t, s.solver.State())
		for {
			done, err := s.solver.Step(cut)
			if err != nil {
				if errors.Is(err, ode.ErrTooManySteps) {
					return fmt.Errorf("%w (%d steps by t = %.4g s of %.4g s)", ErrStepLimit, maxSteps, s.solver.T(), tEnd)
				}
				return err
			}
			t0, t1 := s.solver.LastStep()
			residual := t0 >= s.motionEnd-1e-12
			// Look at the step at evenly spaced points and refine any
			// interior maximum that beats the best so far.
			for j := 0; j < interior+2; j++ {
				tt := t0 + (t1-t0)*float64(j)/(interior+1)
				p := s.at(tt)
				ts[j] = tt
				for q := range s.nq {
					vs[q][j] = s.value(q, p)
				}
			}
			for q := range s.nq {
				e := &s.ext[q]
				var r *extremum
				if residual {
					r = s.residualOf(q)
				}
				for j := 0; j < interior+2; j++ {
					v := vs[q][j]
					// A sample at least as large as its neighbours in the
					// step brackets a maximum. At the first or last sample
					// of the step the maximum may still lie just inside
					// the step, between it and the next sample in.
					lo, hi := max(j-1, 0), min(j+1, interior+1)
					localMax := v >= vs[q][lo] && v >= vs[q][hi]
					if localMax && (v > e.max || (r != nil && v > r.max)) {
						tm, vm := s.refine(q, ts[lo], ts[hi])
						if vm > v {
							v, tt := vm, tm
							e.offer(v, tt)
							if r != nil {
								r.offer(v, tt)
							}
							continue
						}
					}
					e.offer(v, ts[j])
					if r != nil {
						r.offer(v, ts[j])
					}
				}
			}
			s.emitSamples(t0, t1)
			// Back onto the constraint for the next step.
			y := s.solver.State()
			if d := s.model.Project(y); d > s.constraintErr {
				s.constraintErr = d
			}
			s.solver.SetState(y)
			if done {
				break
			}
		}
		t = cut
	}
	if s.hist != nil {
		// The last sample falls on tEnd exactly.
		for s.next < s.samples {
			s.model.Eval(tEnd, s.solver.State(), &s.pt)
			s.record(&s.pt)
		}
	}
	return nil
}

// refine finds the maximum of quantity q in [a, b] by golden-section search
// on the dense output.
func (s *scanner) refine(q quantity, a, b float64) (float64, float64) {
	const inv = 0.6180339887498949
	c := b - inv*(b-a)
	d := a + inv*(b-a)
	fc := s.value(q, s.at(c))
	fd := s.value(q, s.at(d))
	for i := 0; i < 40 && b-a > 1e-9*(1+math.Abs(b)); i++ {
		if fc > fd {
			b, d, fd = d, c, fc
			c = b - inv*(b-a)
			fc = s.value(q, s.at(c))
		} else {
			a, c, fc = c, d, fd
			d = a + inv*(b-a)
			fd = s.value(q, s.at(d))
		}
	}
	if fc > fd {
		return c, fc
	}
	return d, fd
}

func (s *scanner) observePoint(p *pendulum.Point) {
	for q := range s.nq {
		v := s.value(q, p)
		s.ext[q].offer(v, p.T)
		if r := s.residualOf(q); r != nil && p.T >= s.motionEnd-1e-12 {
			r.offer(v, p.T)
		}
	}
}

// emitSamples records the history samples that fall in (t0, t1].
func (s *scanner) emitSamples(t0, t1 float64) {
	if s.hist == nil {
		return
	}
	for s.next < s.samples {
		tt := float64(s.next) * s.sampleDt
		if tt > t1 {
			return
		}
		if tt < t0 && s.next > 0 {
			// Cannot happen: samples are taken in order.
			tt = t0
		}
		s.record(s.at(tt))
	}
}

func (s *scanner) record(p *pendulum.Point) {
	h := s.hist
	rel := p.Rel()
	h.TimeS = append(h.TimeS, float64(s.next)*s.sampleDt)
	h.SwingDeg = append(h.SwingDeg, p.SwingRad()/units.Degree)
	h.RelXM = append(h.RelXM, rel.X)
	h.RelYM = append(h.RelYM, rel.Y)
	h.RelZM = append(h.RelZM, rel.Z)
	h.LoadXM = append(h.LoadXM, p.LoadPos.X)
	h.LoadYM = append(h.LoadYM, p.LoadPos.Y)
	h.SuspensionXM = append(h.SuspensionXM, p.Suspension.Pos.X)
	h.SuspensionYM = append(h.SuspensionYM, p.Suspension.Pos.Y)
	h.TensionN = append(h.TensionN, p.Tension)
	h.RopeM = append(h.RopeM, p.Rope)
	s.next++
}
