package sway

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
)

// The specialised path. A scenario with one rope (no hook block) whose
// moves are all trapezoids, S-curves, speed steps, hard stops or series
// records, shaped or not, is integrated by fastModel and fastSolver: the
// same equation of motion, tableau, error control, restarts at every
// breakpoint, projection after every step and peak search (peaks.
// observeStep) as the general path (scanner with pendulum.Model and
// ode.Solver), written for a state of six numbers with the suspension
// point's motion as flattened span tables. The two agree to rounding
// (fast_test.go states how closely); Options.General selects the general
// path.
//
// Two things differ by design. The model is evaluated at the time itself
// with the segment's own spans, where the general path moves the time a
// hair (1e-12 of it) inside the segment; and the top of a swing or
// excursion peak is found as the root of the quantity's time derivative
// on the dense output (fastScan.refine) rather than by parabolic
// interpolation of its values.

// integrate runs the evaluation on the specialised path when the scenario
// fits it and opt allows, and on the general path otherwise. The scanner
// is returned for the general path only (rigging reads it).
func integrate(su *setup, opt Options, hist *History, tEnd, relTol float64, samples int) (*peaks, *scanner, Stats, error) {
	rec := recorder{}
	if hist != nil {
		rec = recorder{hist: hist, sampleDt: tEnd / float64(samples-1), samples: samples}
		rec.reserve()
	}
	maxN := maxSteps
	if opt.MaxSteps > 0 {
		maxN = opt.MaxSteps
	}
	if su.fast != nil && !opt.General {
		fs := &fastScan{peaks: peaks{motionEnd: su.motionEnd, nq: qRigAngle}, m: su.fast, recorder: rec}
		fs.v = fastSolver{m: su.fast, relTol: relTol, absTol: relTol * 1e-2, maxSteps: maxN}
		if err := fs.run(su.y0, su.breaks, tEnd); err != nil {
			return nil, nil, Stats{}, err
		}
		return &fs.peaks, nil, Stats{RelTol: relTol, Steps: fs.v.accepted, Rejected: fs.v.rejected,
			Evals: fs.v.evals, ConstraintError: fs.constraintErr}, nil
	}
	sc := newScanner(su.model, su.motionEnd)
	sc.maxSteps = maxN
	sc.recorder = rec
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
	slices.Sort(cuts)
	return append(cuts, tEnd)
}

// fastScan is scanner for fastModel.
type fastScan struct {
	peaks
	recorder
	m             *fastModel
	v             fastSolver
	constraintErr float64
	pt            pendulum.Point // scratch for the history
}

// state is the dense output at t inside the last step, projected.
func (s *fastScan) state(t float64) (y [6]float64) {
	s.v.dense(t, &y)
	project(&y)
	return y
}

// values fills the watched quantities at time t and state y: the swing as
// 1 - cos(theta) of the rope direction, the excursion squared, the
// tension and its negative (scanner.value for one rope).
func (s *fastScan) values(t float64, y *[6]float64, out *[nQuantities][interior + 2]float64, j int) {
	var rx, ry, rz, l, ddl float64
	if s.m.simple() {
		rx, ry = s.m.travelRel(t)
		rz, l = -s.m.g, s.m.l0
	} else {
		rx, ry, rz, l, _, ddl = s.m.relAt(t, y)
	}
	h2 := y[0]*y[0] + y[1]*y[1]
	nl := math.Sqrt(h2 + y[2]*y[2])
	if y[2] < 0 {
		out[qSwing][j] = h2 / (nl * (nl - y[2]))
	} else {
		out[qSwing][j] = 1 + y[2]/nl
	}
	out[qExcursion][j] = l * l * h2
	tn := s.m.tension(rx, ry, rz, l, ddl, y)
	out[qTension][j], out[qTensionLow][j] = tn, -tn
}

// probe implements stepProbe.
func (s *fastScan) probe(q quantity, t float64) float64 {
	y := s.state(t)
	var v [nQuantities][interior + 2]float64
	s.values(t, &y, &v, 0)
	return v[q][0]
}

// slope is the time derivative of the swing or excursion value at t on
// the dense output: for a unit n with n·u = 0, d(1 - cos theta)/dt = u_z
// and d(L²(n_x² + n_y²))/dt = 2 L L' (n_x² + n_y²) + 2 L² (n_x u_x + n_y u_y).
func (s *fastScan) slope(q quantity, t float64) float64 {
	y := s.state(t)
	if q == qSwing {
		return y[5]
	}
	_, _, _, l, dl, _ := s.m.relAt(t, &y)
	return 2*l*dl*(y[0]*y[0]+y[1]*y[1]) + 2*l*l*(y[0]*y[3]+y[1]*y[4])
}

// refine implements stepProbe. A swing or excursion peak is the root of
// the quantity's slope inside the bracket, found by regula falsi with the
// Illinois modification (M. Dowell and P. Jarratt, BIT 11 (1971) 168-174)
// until the bracket or the step in t is below 1e-9 of the bracket's
// width; the tension, whose slope would need the drive's jerk and the
// drag's derivative, by parabolic interpolation (parabolicMax).
func (s *fastScan) refine(q quantity, a, fa, m, fm, b, fb float64) (float64, float64) {
	if q != qSwing && q != qExcursion {
		return parabolicMax(s, q, a, fa, m, fm, b, fb)
	}
	ga, gb := s.slope(q, a), s.slope(q, b)
	if m > a && m < b {
		// The bracket with the top inside: the slope goes from rising to
		// falling.
		if gm := s.slope(q, m); ga > 0 && gm <= 0 {
			b, gb = m, gm
		} else {
			a, ga = m, gm
		}
	}
	if !(ga > 0 && gb <= 0) {
		return parabolicMax(s, q, a, fa, m, fm, b, fb)
	}
	tol := 1e-9 * (b - a)
	x := a
	side := 0
	for range 60 {
		xn := (a*gb - b*ga) / (gb - ga)
		if !(xn > a && xn < b) {
			xn = 0.5 * (a + b)
		}
		gx := s.slope(q, xn)
		done := math.Abs(xn-x) <= tol || b-a <= tol || gx == 0
		x = xn
		if done {
			break
		}
		if gx > 0 {
			a, ga = x, gx
			if side == -1 {
				gb *= 0.5
			}
			side = -1
		} else {
			b, gb = x, gx
			if side == 1 {
				ga *= 0.5
			}
			side = 1
		}
	}
	fx := s.probe(q, x)
	if fm > fx {
		return m, fm
	}
	return x, fx
}

func (s *fastScan) run(y0 []float64, breaks []float64, tEnd float64) error {
	cuts := restartCuts(breaks, tEnd)
	var y [6]float64
	copy(y[:], y0)
	t := 0.0
	s.m.segment(0, cuts[0])
	s.v.reset(0, &y)
	var ts [interior + 2]float64
	var vs [nQuantities][interior + 2]float64
	s.values(0, &y, &vs, 0)
	for q := range s.nq {
		s.ext[q].offer(vs[q][0], 0)
		if r := s.residualOf(q); r != nil && 0 >= s.motionEnd-1e-12 {
			r.offer(vs[q][0], 0)
		}
	}
	for _, cut := range cuts {
		if cut <= t {
			continue
		}
		s.m.segment(t, cut)
		s.v.reset(t, &s.v.y)
		carry := false
		for {
			done, err := s.v.step(cut)
			if err != nil {
				if errors.Is(err, ode.ErrTooManySteps) {
					return fmt.Errorf("%w (%d steps by t = %.4g s of %.4g s)", ErrStepLimit, s.v.maxSteps, s.v.t, tEnd)
				}
				return err
			}
			t0, t1 := s.v.told, s.v.t
			if carry {
				ts[0] = t0
				for q := range s.nq {
					vs[q][0] = vs[q][interior+1]
				}
			}
			// Back onto the constraint for the next step, keeping the slope
			// at the step's end (as scanner.run does). The projected end
			// state is the last sample: the dense output there is the end
			// state to rounding.
			if d := project(&s.v.y); d > s.constraintErr {
				s.constraintErr = d
			}
			for j := 0; j < interior+1; j++ {
				if j == 0 && carry {
					continue
				}
				tt := t0 + (t1-t0)*float64(j)/(interior+1)
				yy := s.state(tt)
				s.values(tt, &yy, &vs, j)
				ts[j] = tt
			}
			ts[interior+1] = t1
			s.values(t1, &s.v.y, &vs, interior+1)
			if !s.settled(t0, &vs) {
				s.observeStep(s, t0, t1, &ts, &vs)
			}
			s.emit(t0, t1)
			carry = true
			if done {
				break
			}
		}
		t = cut
	}
	for s.hist != nil && s.next < s.samples {
		// The last sample falls on tEnd exactly.
		s.record(s.point(tEnd, &s.v.y))
	}
	return nil
}

// settled reports whether no quantity can beat its best so far in the
// step starting at t0 (observeStep's early rejection for all of them at
// once: observeStep would change nothing).
func (s *fastScan) settled(t0 float64, vs *[nQuantities][interior + 2]float64) bool {
	residual := t0 >= s.motionEnd-1e-12
	for q := range qRigAngle {
		b := reach(&vs[q])
		if !(s.ext[q].set && b < s.ext[q].max) {
			return false
		}
		if residual {
			if r := s.residualOf(q); r != nil && !(r.set && b < r.max) {
				return false
			}
		}
	}
	return true
}

// emit records the history samples that fall in (t0, t1].
func (s *fastScan) emit(t0, t1 float64) {
	for s.hist != nil && s.next < s.samples {
		tt := float64(s.next) * s.sampleDt
		if tt > t1 {
			return
		}
		y := s.state(max(tt, t0))
		s.record(s.point(tt, &y))
	}
}

// point is the pendulum.Point of a state, for the history (in the scratch
// point: a returned new one would be an allocation per sample).
func (s *fastScan) point(t float64, y *[6]float64) *pendulum.Point {
	k := s.m.kinAt(t)
	rx, ry, rz := s.m.rel(&k, y)
	p := &s.pt
	p.T, p.Rope, p.Tension = t, k.l, s.m.tension(rx, ry, rz, k.l, k.ddl, y)
	p.Dir = r3.Vec{X: y[0], Y: y[1], Z: y[2]}
	p.Rate = r3.Vec{X: y[3], Y: y[4], Z: y[5]}
	p.Suspension.Pos = r3.Vec{X: k.px, Y: k.py}
	p.Suspension.Vel = r3.Vec{X: k.vx, Y: k.vy}
	p.Suspension.Acc = r3.Vec{X: k.ax, Y: k.ay}
	p.LoadPos = r3.Vec{X: k.px + k.l*y[0], Y: k.py + k.l*y[1], Z: k.l * y[2]}
	p.LoadVel = r3.Vec{X: k.vx + (k.dl*y[0] + k.l*y[3]), Y: k.vy + (k.dl*y[1] + k.l*y[4]), Z: k.dl*y[2] + k.l*y[5]}
	return p
}
