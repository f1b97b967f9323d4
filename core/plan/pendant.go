package plan

import (
	"fmt"
	"math"
	"math/cmplx"
	"strings"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
)

// ownPendant times the presses of the crane's own pendant steps (fractions
// c_1 < ... < c_n = 1 of top speed, so impulses A_i = c_i - c_(i-1)). In
// linear theory the residual of presses at t_i is the shaper residual
// V(w) of the impulses (A_i, t_i) (Singer & Seering 1990); the exact times
// are chosen to make the worst V over five sway frequencies across the
// rope-length range as small as can be (coordinate search on a grid of
// T/60 up to 1.5 T; t_1 = 0; a small weight on the last time prefers short
// sequences). Two steps come out at 0 and about T/2, the operators' rule
// (common practice). Those times are the start of the search for counts a
// person can keep (timing.go), which gives the option's cues.
func (rq *request) ownPendant(pcts []float64) (*Option, error) {
	n := len(pcts)
	imps := make([]motion.Impulse, n)
	prev := 0.0
	for i, p := range pcts {
		imps[i] = motion.Impulse{A: p/100 - prev, T: float64(i) * rq.designT / 2}
		prev = p / 100
	}
	ws := rq.modeGrid(5)
	cost := func() float64 {
		worst := 0.0
		for _, w := range ws {
			worst = math.Max(worst, w.loadResidual(imps, 0))
		}
		return worst + 0.002*imps[n-1].T/rq.designT
	}
	step := rq.designT / 60
	descend := func() float64 {
		best := cost()
		for range 30 {
			improved := false
			for i := 1; i < n; i++ {
				keep := imps[i].T
				lo, hi := imps[i-1].T, 90*step
				if i+1 < n {
					hi = imps[i+1].T
				}
				for k := math.Ceil(lo/step - 1e-9); k*step <= hi+1e-9; k++ {
					imps[i].T = k * step
					if c := cost(); c < best-1e-12 {
						best, keep, improved = c, imps[i].T, true
					}
				}
				imps[i].T = keep
			}
			if !improved {
				break
			}
		}
		return best
	}
	bestCost := math.Inf(1)
	bestT := make([]float64, n)
	for m := n; m >= 2; m-- {
		for i := range imps {
			imps[i].T = float64(i) * rq.designT / float64(m)
		}
		if c := descend(); c < bestCost {
			bestCost = c
			for i := range imps {
				bestT[i] = imps[i].T
			}
		}
	}
	for i := range imps {
		imps[i].T = bestT[i]
	}
	words := make([]string, n)
	for i, p := range pcts {
		words[i] = fmt.Sprintf("%.3g %%", p)
	}
	o, err := rq.pendantCues("own_pendant", "Your pendant steps ("+strings.Join(words, ", ")+") timed for the sway", imps)
	if err != nil {
		return nil, err
	}
	if rq.multi() && rq.share2 >= MinSecondShare {
		o.TwoMode = true
	}
	return o, nil
}

// modeGrid is the sway at n rope lengths evenly over the range.
func (rq *request) modeGrid(n int) []modeSet {
	lo, hi := rq.ropeRange()
	var ws []modeSet
	for j := range n {
		ws = append(ws, rq.modesAt(lo+(hi-lo)*float64(j)/float64(max(1, n-1))))
	}
	return ws
}

// ropeRange is the shortest and longest rope planned.
func (rq *request) ropeRange() (lo, hi float64) {
	lo, hi = rq.ropes[0], rq.ropes[0]
	for _, l := range rq.ropes {
		lo, hi = math.Min(lo, l), math.Max(hi, l)
	}
	return lo, hi
}

// pendantCues lays out the cues for the steps of imps (shares A_i, exact
// times t_i): the start's counts and the stop's (the stop releases the
// steps from the top down, in the time-reversed pattern, which has the
// same |V|), each chosen by robustGaps; then the first release is placed
// so that the move covers the distance exactly, and each release gets its
// mark (distance or angle before the stop point). It also draws the
// pressed moves the option is checked with.
func (rq *request) pendantCues(key, label string, imps []motion.Impulse) (*Option, error) {
	n := len(imps)
	tm := rq.timing()
	errs := timingErrors(2 * n)
	ws := rq.modeGrid(5)
	v := rq.vmax
	share := make([]float64, n)
	for i, im := range imps {
		share[i] = im.A
	}
	rev := make([]float64, n)
	for j := range rev {
		rev[j] = share[n-1-j]
	}
	// Exact press times of each group: each ramp centred on its impulse.
	layout := func(sh []float64, ts []float64) []float64 {
		out := make([]float64, n)
		tau0 := sh[0] * v / rq.amax
		for k := range sh {
			out[k] = math.Max(0, ts[k]-sh[k]*v/rq.amax/2+tau0/2)
			if k > 0 {
				out[k] = math.Max(out[k], out[k-1])
			}
		}
		return out
	}
	tUp := make([]float64, n)
	tDown := make([]float64, n)
	for j := range imps {
		tUp[j] = imps[j].T
		tDown[j] = imps[n-1].T - imps[n-1-j].T
	}
	taus := func(sh []float64) []float64 {
		out := make([]float64, n)
		for k, a := range sh {
			out[k] = a * v / rq.amax
		}
		return out
	}
	maxS := 1.5 * rq.designT
	upC := robustGaps(group{share, taus(share)}, layout(share, tUp), maxS, ws, tm, errs)
	downErrs := make([][]float64, len(errs))
	for d := range errs {
		downErrs[d] = errs[d][n:]
	}
	downC := robustGaps(group{rev, taus(rev)}, layout(rev, tDown), maxS, ws, tm, downErrs)

	d := math.Abs(rq.dist)
	sign := math.Copysign(1, rq.dist)
	var up, down []float64
	var ts float64
	noErr := make([]float64, 2*n)
	for range 30 {
		up = counted(upC, tm.ReactionDelayS, 0, noErr, nil)
		down = counted(downC, tm.ReactionDelayS, 0, noErr, nil)
		full, lagUp, lagDown := 0.0, 0.0, 0.0
		for k := range n {
			tau := share[k] * v / rq.amax
			full = math.Max(full, up[k]+tau)
			lagUp += share[k] * (up[k] + tau/2)
			lagDown += rev[k] * (down[k] + rev[k]*v/rq.amax/2)
		}
		ts = d/v + lagUp - lagDown
		if ts >= full {
			break
		}
		v *= 0.97
	}
	cum := make([]float64, n)
	c := 0.0
	for i, a := range share {
		c += a
		cum[i] = c
	}
	o := &Option{Key: key, Label: label, Drive: scenario.DrivePendant}
	type press struct {
		t, frac float64
		release bool
		count   float64
	}
	var ps []press
	for i := range up {
		ps = append(ps, press{up[i], cum[i], false, upC[i]})
	}
	for j := range down {
		rest := 0.0
		if j+1 < n {
			rest = cum[n-2-j]
		}
		ps = append(ps, press{ts + down[j], rest, true, downC[j]})
	}
	build := func(times []float64) (scenario.Motion, motion.Profile, error) {
		var steps []scenario.SpeedStep
		var ms []motion.Step
		for k, p := range ps {
			t := times[k]
			sp := sign * p.frac * v * rq.axisUnit()
			st := scenario.SpeedStep{AtS: t}
			*crane.Pick(rq.axis.Kind, &st.SpeedMPerS, &st.RateDegPerS) = &sp
			if k := len(ms); k > 0 && t-ms[k-1].AtS < 1e-9 {
				steps, ms = steps[:k-1], ms[:k-1] // two steps at one moment: straight to the second
			}
			steps = append(steps, st)
			ms = append(ms, motion.Step{AtS: t, Speed: sign * p.frac * v})
		}
		prof, err := motion.NewSteps(ms, rq.amax, rq.amax)
		if err != nil {
			return scenario.Motion{}, nil, err
		}
		m := scenario.Motion{Axis: rq.s.Plan.Axis, Profile: scenario.ProfileSteps}
		m.Steps = steps
		a := rq.inAxis(rq.amax)
		*crane.Pick(rq.axis.Kind, &m.AccelMPerS2, &m.AccelDegPerS2) = &a
		*crane.Pick(rq.axis.Kind, &m.DecelMPerS2, &m.DecelDegPerS2) = &a
		return m, prof, nil
	}
	nominal := make([]float64, len(ps))
	for k, p := range ps {
		nominal[k] = p.t
	}
	m, prof, err := build(nominal)
	if err != nil {
		return nil, fmt.Errorf("plan: pendant steps: %w", err)
	}
	o.Motion, o.profile = m, prof
	if rq.multi() {
		// What the cues leave in each mode, the start's and the stop's
		// worst, over the rope lengths (linear theory, % of an instant
		// change to full speed).
		gu, gd := group{share, taus(share)}, group{rev, taus(rev)}
		for _, l := range rq.ropes {
			for i, w := range rq.modesAt(l).omega {
				if i >= len(o.ModeResidualPct) {
					o.ModeResidualPct = append(o.ModeResidualPct, 0)
				}
				v := math.Max(cmplx.Abs(gu.vector(up, w)), cmplx.Abs(gd.vector(down, w)))
				o.ModeResidualPct[i] = math.Max(o.ModeResidualPct[i], 100*v)
			}
		}
	}
	rq.setAccel(o, rq.amax, v)
	o.RampS = up[n-1] + share[n-1]*v/rq.amax
	o.MoveTimeS = prof.End()
	o.Timing = &tm

	// The drawn moves.
	buf := make([]float64, 0, n)
	for _, e := range errs {
		times := make([]float64, 0, 2*n)
		u := counted(upC, tm.ReactionDelayS, tm.SigmaS, e[:n], buf)
		late := 0.0
		for k := range n {
			late += share[k] * (u[k] - up[k])
		}
		times = append(times, u...)
		first := ts + late + tm.SigmaS*e[n]
		dn := counted(downC, tm.ReactionDelayS, tm.SigmaS, e[n:], buf)
		for _, x := range dn {
			times = append(times, math.Max(first+x, times[len(times)-1]))
		}
		dm, dp, err := build(times)
		if err != nil {
			return nil, fmt.Errorf("plan: pendant steps, drawn timing: %w", err)
		}
		o.draws = append(o.draws, dm)
		o.drawProfiles = append(o.drawProfiles, dp)
	}

	// Cues.
	total := math.Abs(prof.At(prof.End()).Pos)
	markAt := func(t float64) float64 { return total - math.Abs(prof.At(t).Pos) }
	pcts := make([]string, n)
	for i, c := range cum {
		pcts[i] = fmt.Sprintf("%.0f %%", 100*c)
	}
	o.add(say(fmt.Sprintf("The pendant's own speed steps at %s of {0}, with the drive's ramp of {1}. Counts are in seconds from the previous press, rounded to half a second; each release is also given as a mark before the stop point.",
		strings.Join(pcts, ", ")), rq.speedQ(v), rq.accelQ(rq.amax)))
	for k, p := range ps {
		pr := Press{AtS: p.t, Pct: 100 * p.frac, Speed: sign * p.frac * v * rq.axisUnit(), CountS: p.count, Release: p.release}
		what := fmt.Sprintf("%.0f %%", 100*p.frac)
		if p.frac < 1e-9 {
			what = "stop"
		}
		var at float64
		if p.release {
			// The person releases d late at the mark: the mark is where the
			// crane is d before the planned moment.
			at = markAt(math.Max(0, p.t-tm.ReactionDelayS))
			*crane.Pick(rq.axis.Kind, &pr.BeforeStopM, &pr.BeforeStopDeg) = rq.inAxis(at)
			if k == n {
				pr.ByMark = true
			}
		}
		o.Presses = append(o.Presses, pr)
		switch {
		case k == 0:
			o.add(plain(fmt.Sprintf("  Press to %s and start counting.", what)))
		case !p.release:
			o.add(say(fmt.Sprintf("  Count {0}, press to %s.", what), qTime(p.count).digits(3)))
		case k == n:
			o.add(say(fmt.Sprintf("  At {0} before the stop point, release to %s.", what), rq.markQ(at)))
		default:
			o.add(say(fmt.Sprintf("  Count {0}, release to %s (about {1} before the stop point).", what),
				qTime(p.count).digits(3), rq.markQ(at)))
		}
	}
	if v < rq.vmax*(1-1e-9) {
		o.add(say("The move is too short for the steps at full speed: the top step is lowered to {0}.", rq.speedQ(v)))
	}
	return o, nil
}

// markQ is a mark (SI: m or rad) as a quantity.
func (rq *request) markQ(x float64) Quantity {
	return Quantity{Value: rq.inAxis(x), Quantity: rq.axis.Kind.Quantity, Digits: 3}
}

// accelQ is an acceleration of the axis (SI in) as a quantity.
func (rq *request) accelQ(a float64) Quantity {
	return Quantity{Value: rq.inAxis(a), Quantity: rq.axis.Kind.AccelQuantity, Digits: 3}
}
