package sway

import (
	"errors"
	"fmt"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
)

// The specialised path. A scenario with one rope (no hook block) whose
// moves are all trapezoids, S-curves, speed steps, hard stops or series
// records, shaped or not, is integrated by fastModel and fastSolver: the
// same equation of motion, tableau, error control, restarts at every
// breakpoint and projection after every step as the general path (scanner
// with pendulum.Model and ode.Solver), written for a state of six numbers
// with the suspension point's motion as flattened span tables
// (fastaxis.go). The two agree to rounding (fast_test.go states how
// closely); Options.General selects the general path.
//
// What differs by design: the model is evaluated at the time itself with
// the segment's own spans, where the general path moves the time a hair
// (1e-12 of it) inside the segment; the step control's powers are taken
// as exponentials of a logarithm; and peaks are found from the rate of
// each quantity at the ends of every step, the top located as the root of
// that rate on the dense output (fastpeaks.go), where the general path
// samples every step at four points and interpolates parabolas.

// integrate runs the evaluation on the specialised path when the scenario
// fits it and opt allows, and on the general path otherwise. The scanner
// is returned for the general path only (rigging reads it).
func integrate(su *setup, opt Options, hist *History, tEnd, relTol float64, samples int) (*peaks, *scanner, Stats, error) {
	rec := recorder{}
	if hist != nil {
		rec = recorder{hist: hist, sampleDt: tEnd / float64(samples-1), samples: samples}
		switch m := su.model.(type) {
		case *pendulum.Rigid:
			rec.bodyHist, rec.bodyLegs = &BodyHistory{legEnds: opt.LegEnds}, m.LegCount()
			rec.hook = m.Spreader == 0
		case *pendulum.Double, *fastDouble:
			rec.hook = true
		}
		rec.reserve(opt.HistoryBuffer)
	}
	maxN := maxSteps
	if opt.MaxSteps > 0 {
		maxN = opt.MaxSteps
	}
	if su.fast != nil && !opt.General {
		// The specialised path's cost per step is fixed: the step limit
		// bounds one run; a shared budget (a plan's) is charged after it.
		if opt.Budget != nil && opt.Budget.Left() < 0 {
			return nil, nil, Stats{}, &WorkError{Message: opt.Budget.message}
		}
		if opt.kinSamples {
			su.fast.airTravel = false
		}
		fs := &fastScan{peaks: peaks{motionEnd: su.motionEnd, nq: qRigAngle}, m: su.fast, recorder: rec,
			pathOnly: opt.PathOnly && hist != nil, kinSamples: opt.kinSamples}
		fs.v = fastSolver{m: su.fast, relTol: relTol, absTol: relTol * 1e-2, maxSteps: maxN, loopedStages: opt.loopedStages}
		err := fs.run(su.y0, su.breaks, tEnd)
		if opt.Budget != nil && !opt.Budget.take(int64(fs.v.evals)*WorkPerEval) && err == nil {
			err = &WorkError{Message: opt.Budget.message}
		}
		if err != nil {
			return nil, nil, Stats{}, err
		}
		return &fs.peaks, nil, Stats{RelTol: relTol, Steps: fs.v.accepted, Rejected: fs.v.rejected,
			Evals: fs.v.evals, ConstraintError: fs.constraintErr}, nil
	}
	if d, ok := su.model.(*fastDouble); ok && !opt.General && d.k.air == nil {
		return integrateDouble(d, su, opt, rec, tEnd, relTol, maxN)
	}
	if _, concrete := su.model.(*fastDouble); su.model == nil || (concrete && opt.General) {
		su.model = su.general()
	}
	if r, ok := su.model.(*pendulum.Rigid); ok && opt.General {
		r.Travel = nil // the closures over the combined profiles
	}
	sc := newScanner(su.model, su.motionEnd)
	sc.maxSteps = maxN
	sc.recorder = rec
	sc.axes, sc.budget = su.combinedAxes(), opt.Budget // the general path's work budget (budget.go)
	if err := sc.run(su.y0, su.breaks, tEnd, relTol); err != nil {
		return nil, nil, Stats{}, err
	}
	return &sc.peaks, sc, Stats{RelTol: relTol, Steps: sc.solver.Accepted, Rejected: sc.solver.Rejected,
		Evals: sc.solver.Evals, ConstraintError: sc.constraintErr}, nil
}

// restartCuts are the ends of the segments between restarts: the
// breakpoints inside (0, tEnd), sorted, then tEnd.
func restartCuts(breaks []float64, tEnd float64) []float64 {
	var cuts []float64
	for _, b := range breaks {
		if b > 1e-12 && b < tEnd-1e-12 {
			cuts = append(cuts, b)
		}
	}
	sorts.Floats(cuts)
	return append(cuts, tEnd)
}

// fastScan is scanner for fastModel.
type fastScan struct {
	// A field that cannot be compared makes the type not comparable: Go
	// then writes no equality function for it, which nothing calls (a
	// heap object's type carries one when it is comparable). The same in
	// fastSolver, peaks, extremum, recorder, span and fastDouble: 7.2 kB
	// of the page's wasm, 1.4 kB gzipped.
	_ [0]func()
	peaks
	recorder
	m             *fastModel
	v             fastSolver
	constraintErr float64
	pathOnly      bool // no peak search (Options.PathOnly)
	kinSamples    bool // every history sample the plain way (Options.kinSamples)
}

func (s *fastScan) run(y0 []float64, breaks []float64, tEnd float64) error {
	cuts := restartCuts(breaks, tEnd)
	if s.hist != nil {
		s.hist.sized(s.samples)
	}
	var y [6]float64
	copy(y[:], y0)
	t := 0.0
	s.m.segment(0, cuts[0])
	s.v.reset(0, &y)
	var a, b measure
	var rate [6]float64
	s.m.rhs(0, &y, &rate)
	s.measureAt(0, &y, &rate, &a)
	for q := range qRigAngle {
		s.offer(q, a.v[q], 0, 0 >= s.motionEnd-1e-12)
	}
	for _, cut := range cuts {
		if cut <= t {
			continue
		}
		s.m.segment(t, cut)
		s.v.reset(t, &s.v.y)
		carry := false // the start of the step is the end of the one before
		for {
			done, err := s.v.step(cut)
			if err != nil {
				if errors.Is(err, ode.ErrTooManySteps) {
					return fmt.Errorf("%w (%d steps by t = %.4g s of %.4g s)", ErrStepLimit, s.v.maxSteps, s.v.t, tEnd)
				}
				return err
			}
			t0, t1 := s.v.told, s.v.t
			residual := t0 >= s.motionEnd-1e-12
			if s.pathOnly {
				if d := project(&s.v.y); d > s.constraintErr {
					s.constraintErr = d
				}
				s.emit(t0, t1)
				if done {
					break
				}
				continue
			}
			if !carry {
				// A new segment: the suspension point's acceleration may
				// have jumped, so the start is measured afresh.
				y0 := s.v.cont[0]
				var unused [6]float64 // the value at t0: y0, the step's start
				s.v.denseBoth(t0, &unused, &rate)
				s.measureAt(t0, &y0, &rate, &a)
				for q := range qRigAngle {
					s.offer(q, a.v[q], t0, residual)
				}
			}
			// Back onto the constraint for the next step, keeping the slope
			// at the step's end (as scanner.run does); the projected end
			// state is where the step's end is measured.
			if d := project(&s.v.y); d > s.constraintErr {
				s.constraintErr = d
			}
			// The dense output's rate at the step's end is the last stage,
			// f(t1, y1), which the solver keeps as the next step's first.
			s.measureAt(t1, &s.v.y, &s.v.k[0], &b)
			for q := range qRigAngle {
				s.offer(q, b.v[q], t1, residual)
			}
			s.stepPeaks(t0, t1, &a, &b, residual)
			if s.hist != nil {
				s.emit(t0, t1)
			}
			a = b
			carry = true
			if done {
				break
			}
		}
		t = cut
	}
	for s.hist != nil && s.next < s.samples {
		// The last sample falls on tEnd exactly.
		s.recordState(tEnd, &s.v.y)
	}
	if h := s.hist; h != nil {
		swingDegrees(h.SwingDeg, h.RelXM, h.RelYM, h.RelZM)
	}
	return nil
}
