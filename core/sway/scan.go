package sway

import (
	"errors"
	"fmt"
	"math"
	"sort"

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
	model     *pendulum.Model
	solver    *ode.Solver
	motionEnd float64
	maxSteps  int

	swing, excursion, resSwing, resExcursion, tension, tensionLow extremum
	constraintErr                                                 float64

	hist     *History
	sampleDt float64
	samples  int
	next     int // index of the next history sample

	y  []float64 // scratch state
	pt pendulum.Point
}

func newScanner(m *pendulum.Model, motionEnd float64) *scanner {
	return &scanner{model: m, motionEnd: motionEnd, maxSteps: maxSteps, y: make([]float64, pendulum.StateLen)}
}

// quantity is one scalar watched along the run.
type quantity int

const (
	qSwing quantity = iota
	qExcursion
	qTension
	qTensionLow
	nQuantities
)

func (s *scanner) value(q quantity, p *pendulum.Point) float64 {
	switch q {
	case qSwing:
		return p.SwingRad()
	case qExcursion:
		return p.Excursion()
	case qTension:
		return p.Tension
	default:
		return -p.Tension
	}
}

func (s *scanner) ext(q quantity, residual bool) *extremum {
	switch q {
	case qSwing:
		if residual {
			return &s.resSwing
		}
		return &s.swing
	case qExcursion:
		if residual {
			return &s.resExcursion
		}
		return &s.excursion
	case qTension:
		return &s.tension
	default:
		return &s.tensionLow
	}
}

// at evaluates the load at time t inside the last step.
func (s *scanner) at(t float64) *pendulum.Point {
	s.solver.Dense(t, s.y)
	pendulum.Project(s.y)
	s.model.Eval(t, s.y, &s.pt)
	return &s.pt
}

// interior is the number of points looked at inside each step.
const interior = 4

func (s *scanner) run(y0 []float64, breaks []float64, tEnd, relTol float64) error {
	s.solver = ode.New(s.model.Func, pendulum.StateLen, ode.Settings{
		RelTol: relTol, AbsTol: relTol * 1e-2, MaxSteps: s.maxSteps,
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
					return fmt.Errorf("%w (%d steps by t = %.4g s of %.4g s)", ErrStepLimit, s.maxSteps, s.solver.T(), tEnd)
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
				for q := range nQuantities {
					vs[q][j] = s.value(q, p)
				}
			}
			for q := range nQuantities {
				e := s.ext(q, false)
				var r *extremum
				if q <= qExcursion && residual {
					r = s.ext(q, true)
				}
				for j := 0; j < interior+2; j++ {
					v := vs[q][j]
					// Refine a sample that may be the top of a peak and may
					// beat the best so far once refined (the top lies above
					// the samples by at most an eighth of their second
					// difference; a full one is allowed). Inside the step
					// that is a sample at least as large as both its
					// neighbours. At the first or last sample the peak may
					// lie just inside the step or just outside it: look
					// which way the quantity moves at the step's end.
					lo, hi := max(j-1, 0), min(j+1, interior+1)
					localMax := v >= vs[q][lo] && v >= vs[q][hi]
					if localMax {
						k := min(max(j, 1), interior)
						slack := math.Abs(vs[q][k-1]-2*vs[q][k]+vs[q][k+1]) + 1e-12*math.Abs(v)
						localMax = v+slack >= e.max || (r != nil && v+slack >= r.max)
					}
					if localMax && (j == 0 || j == interior+1) {
						eps := 1e-6 * (t1 - t0)
						if j == 0 {
							localMax = s.value(q, s.at(t0+eps)) > v // rising out of the start
						} else {
							localMax = s.value(q, s.at(t1-eps)) > v // falling into the end
						}
					}
					if localMax {
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
			if d := pendulum.Project(y); d > s.constraintErr {
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
	// Near its top a peak is flat: narrowing the bracket to 1e-5 of its
	// width leaves the value within about 1e-10 of the variation across it.
	stop := math.Max(1e-5*(b-a), 1e-12*(1+math.Abs(b)))
	for i := 0; i < 40 && b-a > stop; i++ {
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
	for q := range nQuantities {
		v := s.value(q, p)
		s.ext(q, false).offer(v, p.T)
		if q <= qExcursion && p.T >= s.motionEnd-1e-12 {
			s.ext(q, true).offer(v, p.T)
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
	rel := p.LoadPos
	rel.X -= p.Suspension.Pos.X
	rel.Y -= p.Suspension.Pos.Y
	rel.Z -= p.Suspension.Pos.Z
	h.TimeS = append(h.TimeS, float64(s.next)*s.sampleDt)
	h.SwingDeg = append(h.SwingDeg, p.SwingRad()/units.Degree)
	h.RelXM = append(h.RelXM, rel.X)
	h.RelYM = append(h.RelYM, rel.Y)
	h.RelZM = append(h.RelZM, rel.Z)
	h.LoadXM = append(h.LoadXM, p.LoadPos.X)
	h.LoadYM = append(h.LoadYM, p.LoadPos.Y)
	h.HookXM = append(h.HookXM, p.Suspension.Pos.X)
	h.HookYM = append(h.HookYM, p.Suspension.Pos.Y)
	h.TensionN = append(h.TensionN, p.Tension)
	h.RopeM = append(h.RopeM, p.Rope)
	s.next++
}
