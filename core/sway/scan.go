package sway

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/motion"
	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
)

// scanner integrates the model and watches every step for extremes,
// locating each to the accuracy of the dense output.
type scanner struct {
	peaks
	model    pendulum.System
	solver   *ode.Solver
	maxSteps int

	constraintErr float64

	segStart, segEnd float64 // the segment between restarts being integrated

	recorder

	y  []float64 // scratch state
	pt pendulum.Point

	watch []quantity // the quantities of this load (watched)

	pos positionModel // the model's evaluation of the positions alone, if it has one

	axes     []motion.Profile // the combined axes, for the work of a segment
	budget   *Budget
	evalWork int64 // work of one evaluation of the model itself (budget.go)
	segWork  int64 // work of one evaluation in the current segment
	work     int64 // work not yet charged to the budget
}

func newScanner(m pendulum.System, motionEnd float64) *scanner {
	nq, work := qRigAngle, int64(WorkPerEval)
	switch m.(type) {
	case *pendulum.Double, *fastDouble:
		nq = qTilt
	case *pendulum.Rigid:
		nq, work = nQuantities, WorkPerRigidEval
	}
	pos, _ := m.(positionModel)
	return &scanner{peaks: peaks{motionEnd: motionEnd, nq: nq}, model: m, pos: pos, evalWork: work,
		maxSteps: maxSteps, y: make([]float64, m.Len())}
}

// positionModel is a model that projects and evaluates the positions
// alone (pendulum.Rigid's ProjectPositions and EvalPositions), each value
// as its Project and Eval compute it.
type positionModel interface {
	ProjectPositions(y []float64) float64
	EvalPositions(t float64, y []float64, p *pendulum.Point)
}

// atFor is at for refining quantity q: for a quantity of the positions
// alone (the swing, the excursion, a rigid load's tilt, twist and corner
// swing) on a model that has positionModel, without the velocities'
// projection and the accelerations (bay-girder-rigid refines these for
// about 40 % of its evaluations of the load). The value is the same.
func (s *scanner) atFor(q quantity, t float64) *pendulum.Point {
	positional := q == qSwing || q == qExcursion || q == qTilt || q == qTwist || q == qCorner
	return s.evalAt(t, positional && s.pos != nil)
}

// at evaluates the load at time t inside the last step.
func (s *scanner) at(t float64) *pendulum.Point { return s.evalAt(t, false) }

// evalAt is at, of the positions alone (s.pos) when positions is set.
func (s *scanner) evalAt(t float64, positions bool) *pendulum.Point {
	s.work += s.segWork
	s.solver.Dense(t, s.y)
	if positions {
		s.pos.ProjectPositions(s.y)
		s.pos.EvalPositions(s.inSegment(t), s.y, &s.pt)
	} else {
		s.model.Project(s.y)
		s.model.Eval(s.inSegment(t), s.y, &s.pt)
	}
	p := &s.pt
	p.T = t
	return p
}

// inSegment moves t just inside the current segment between restarts.
// The motions' accelerations jump at the segment's ends; evaluating the
// model a hair inside makes every evaluation of a segment, the solver's
// and the scanner's, see that segment's own acceleration and not the next
// one's. The shift, 1e-12 of the time, moves positions by far less than
// the integration error.
func (s *scanner) inSegment(t float64) float64 {
	// Plain comparisons: t is never NaN here, and math.Max and math.Min,
	// which handle NaN and signed zeros, are calls of their own in wasm.
	d := 1e-12 * t
	if d < 1e-12 {
		d = 1e-12
	}
	if lo := s.segStart + d; t < lo {
		return lo
	}
	if hi := s.segEnd - d; t > hi {
		return hi
	}
	return t
}

// fn is the right-hand side the solver integrates: the model's, inside the
// current segment.
func (s *scanner) fn(t float64, y, dy []float64) {
	s.work += s.segWork
	s.model.Func(s.inSegment(t), y, dy)
}

// interior is the number of points looked at inside each step.
const interior = 2

func (s *scanner) run(y0 []float64, breaks []float64, tEnd, relTol float64) error {
	s.solver = ode.New(s.fn, s.model.Len(), ode.Settings{
		RelTol: relTol, AbsTol: relTol * 1e-2, MaxSteps: s.maxSteps,
	})
	y := append([]float64(nil), y0...)
	// Segments between restarts. The breakpoints come move by move and
	// from the wind, so restartCuts sorts them: an unsorted list would skip
	// every restart that comes after a later one.
	cuts := restartCuts(breaks, tEnd)

	t := 0.0
	s.solver.Reset(0, y)
	s.segStart, s.segEnd = 0, cuts[0]
	sg, _ := s.model.(segmented)
	if sg != nil {
		sg.segment(0, cuts[0])
	}
	s.model.Eval(s.inSegment(0), y, &s.pt)
	s.pt.T = 0
	s.watch = watched(s.nq, &s.pt)
	s.observePoint(&s.pt)
	var ts [interior + 2]float64
	var vs [nQuantities][interior + 2]float64
	for _, cut := range cuts {
		if cut <= t {
			continue
		}
		s.segStart, s.segEnd = t, cut
		if sg != nil {
			sg.segment(t, cut)
		}
		s.segWork = segmentWork(s.evalWork, s.axes, 0.5*(t+cut))
		s.solver.Reset(t, s.solver.State())
		carry := false // the first sample of the step is the last of the one before
		for {
			done, err := s.solver.Step(cut)
			if err != nil {
				if errors.Is(err, ode.ErrTooManySteps) {
					return fmt.Errorf("%w (%d steps by t = %.4g s of %.4g s)", ErrStepLimit, s.maxSteps, s.solver.T(), tEnd)
				}
				return err
			}
			if !s.budget.take(s.work) {
				return &WorkError{Message: s.budget.message}
			}
			s.work = 0
			t0, t1 := s.solver.LastStep()
			edges := stepEdges{}
			residual := t0 >= s.motionEnd-1e-12
			// Look at the step at evenly spaced points and refine any
			// interior maximum that beats the best so far.
			if carry {
				ts[0] = t0
				for _, q := range s.watch {
					vs[q][0] = vs[q][interior+1]
				}
			}
			for j := 0; j < interior+2; j++ {
				if j == 0 && carry {
					continue
				}
				tt := t0 + (t1-t0)*float64(j)/(interior+1)
				p := s.at(tt)
				ts[j] = tt
				for _, q := range s.watch {
					vs[q][j] = s.value(q, p)
				}
			}
			for _, q := range s.watch {
				e := &s.ext[q]
				var r *extremum
				if residual {
					r = s.residualOf(q)
				}
				if e.set && (r == nil || r.set) {
					if b := reach(&vs[q]); b < e.max && (r == nil || b < r.max) {
						continue // no sample nor peak in this step can beat the best so far
					}
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
						// rising out of the start, or falling into the end
						localMax = edges.value(s, j/(interior+1), t0, t1)[q] > v
					}
					if localMax {
						tm, vm := s.refine(q, ts[lo], vs[q][lo], ts[j], v, ts[hi], vs[q][hi])
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
			carry = true
			// Back onto the constraint for the next step. The slope at the
			// step's end is kept: it differs from the slope at the
			// projected state by the size of the projection, far below the
			// local error, and it saves an evaluation per step.
			y := s.solver.State()
			if d := s.model.Project(y); d > s.constraintErr {
				s.constraintErr = d
			}
			if done {
				break
			}
		}
		t = cut
	}
	if s.hist != nil {
		// The last sample falls on tEnd exactly.
		for s.next < s.samples {
			s.model.Eval(s.inSegment(tEnd), s.solver.State(), &s.pt)
			s.pt.T = tEnd
			s.record(&s.pt)
		}
		s.swings()
	}
	return nil
}

// stepEdges are the quantities just inside a step's two ends, each side
// evaluated when a quantity first asks for it. Whether a sample at an end
// may top a peak depends on which way the quantity moves there; a step
// may ask this of every quantity watched (up to 15 with a rigid load),
// and all of them read the same point (before, each evaluated it again:
// the projection and the load's evaluation, three quarters of the scan's
// evaluations on precast-beam-tandem).
type stepEdges struct {
	v   [2][nQuantities]float64 // 0: at t0 + eps, 1: at t1 - eps
	set [2]bool
}

// value are the quantities just inside the start (side 0) or the end
// (side 1) of the step from t0 to t1.
func (e *stepEdges) value(s *scanner, side int, t0, t1 float64) *[nQuantities]float64 {
	if !e.set[side] {
		eps := 1e-6 * (t1 - t0)
		t := t0 + eps
		if side == 1 {
			t = t1 - eps
		}
		p := s.at(t)
		for _, q := range s.watch {
			e.v[side][q] = s.value(q, p)
		}
		e.set[side] = true
	}
	return &e.v[side]
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

// recorder writes the evenly spaced history samples of a run.
type recorder struct {
	_        [0]func()    // not comparable: no equality function (see fastScan)
	hist     *History     // nil: no history
	bodyHist *BodyHistory // with a rigid load's history
	bodyLegs int          // its legs (pendulum.Rigid.LegCount)
	sampleDt float64
	samples  int
	next     int  // index of the next history sample
	hook     bool // record the hook (hook block or rigid load on a hook)
}

// reserve makes room for every sample at once: growing eleven slices
// (fourteen with the hook's) sample by sample costs more than the samples
// (in wasm most of all). A rigid load's body history takes its series
// from the same memory (BodyHistory.carve). With reuse set
// (Options.HistoryBuffer) its memory is used when large enough, else the
// memory made is kept there.
func (s *recorder) reserve(reuse *[]float64) {
	series := s.hist.series()
	cs := series[:]
	if s.hook {
		h := s.hist
		cs = append(cs, &h.HookRelXM, &h.HookRelYM, &h.HookRelZM)
	}
	n := s.samples
	size := len(cs) * n
	if s.bodyHist != nil {
		size += bodySeries(s.bodyLegs, s.bodyHist.legEnds) * n
	}
	var buf []float64
	if reuse != nil && cap(*reuse) >= size {
		buf = (*reuse)[:size]
	} else {
		// One allocation, each series its own part, a rigid load's body
		// history's too (bay-girder-rigid's 187 kB, where its body history
		// was an allocation of its own): each large allocation is memory
		// to zero and work for the collector.
		buf = make([]float64, size)
		if reuse != nil {
			*reuse = buf
		}
	}
	carve(buf, cs, n)
	if s.bodyHist != nil {
		s.bodyHist.carve(buf[len(cs)*n:], s.bodyLegs, n)
	}
}

// carve makes each series of cs an empty slice of buf with room for n
// samples, series k on buf[k*n:(k+1)*n] (buf holds len(cs)*n).
func carve(buf []float64, cs []*[]float64, n int) {
	for k, c := range cs {
		*c = buf[k*n : k*n : (k+1)*n]
	}
}

// series are the eleven series every history has.
func (h *History) series() [11]*[]float64 {
	return [11]*[]float64{&h.TimeS, &h.SwingDeg, &h.RelXM, &h.RelYM, &h.RelZM, &h.LoadXM,
		&h.LoadYM, &h.SuspensionXM, &h.SuspensionYM, &h.TensionN, &h.RopeM}
}

// swings writes the samples' swing angles at the end of a run, from their
// rope components, as the single-rope path does (swingDegrees): not two
// calls of package math's per sample (Atan2 and Hypot, each a call of its
// own in wasm). record leaves them out.
func (s *recorder) swings() {
	h := s.hist
	h.SwingDeg = h.SwingDeg[:len(h.TimeS)]
	swingDegrees(h.SwingDeg, h.RelXM, h.RelYM, h.RelZM)
}

func (s *recorder) record(p *pendulum.Point) {
	h := s.hist
	rel := p.Rel()
	h.TimeS = append(h.TimeS, float64(s.next)*s.sampleDt)
	h.RelXM = append(h.RelXM, rel.X)
	h.RelYM = append(h.RelYM, rel.Y)
	h.RelZM = append(h.RelZM, rel.Z)
	h.LoadXM = append(h.LoadXM, p.LoadPos.X)
	h.LoadYM = append(h.LoadYM, p.LoadPos.Y)
	h.SuspensionXM = append(h.SuspensionXM, p.Suspension.Pos.X)
	h.SuspensionYM = append(h.SuspensionYM, p.Suspension.Pos.Y)
	h.TensionN = append(h.TensionN, p.Tension)
	h.RopeM = append(h.RopeM, p.Rope)
	if s.hook {
		hk := r3.Sub(p.HookPos, p.Suspension.Pos)
		h.HookRelXM = append(h.HookRelXM, hk.X)
		h.HookRelYM = append(h.HookRelYM, hk.Y)
		h.HookRelZM = append(h.HookRelZM, hk.Z)
	}
	if s.bodyHist != nil {
		s.bodyHist.add(p, s.next, s.samples)
	}
	s.next++
}
