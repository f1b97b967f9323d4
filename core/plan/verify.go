package plan

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"sync"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// verifyAll simulates every option at every checked rope length at the
// integrator tolerance tol, in parallel over options and rope lengths: a
// drive-timed option once, a pendant option once as planned and then for
// the drawn timings that can be its percentile (draws.go), or, where the
// linear theory does not serve, for its drawn timings in order until the
// answer at that rope length is decided (decided). An option whose
// simulation fails (the run's step limit, a rope that goes slack in a way
// the model refuses) is left out and named in the returned list with why;
// the others are kept.
func (rq *request) verifyAll(opts []*Option, tol float64) (kept []*Option, dropped []string) {
	return rq.verifyWith(opts, tol, true)
}

// verifyWith is verifyAll; linear false simulates a pendant option's draws
// in the seeded order until decided, as the recheck does.
func (rq *request) verifyWith(opts []*Option, tol float64, linear bool) (kept []*Option, dropped []string) {
	type job struct{ o, l int }
	jobs := make(chan job, len(opts)*len(rq.checked))
	exact := make([][]Verified, len(opts))
	drawn := make([][][]Verified, len(opts))
	of := make([][]int, len(opts)) // how many draws the percentile is over
	failed := make([]error, len(opts))
	for i := range opts {
		exact[i] = make([]Verified, len(rq.checked))
		drawn[i] = make([][]Verified, len(rq.checked))
		of[i] = make([]int, len(rq.checked))
	}
	var wg sync.WaitGroup
	var mu sync.Mutex
	fail := func(j job, err error) {
		mu.Lock()
		if failed[j.o] == nil {
			failed[j.o] = fmt.Errorf("at rope length %.4g m: %w", rq.checked[j.l], err)
		}
		mu.Unlock()
	}
	for o, opt := range opts {
		for l := range rq.checked {
			jobs <- job{o, l}
		}
		if linear && rq.linearDraws(opt) && opt.drawPieces == nil { // the same at every rope length: made here, before the workers
			for _, p := range opt.drawProfiles {
				opt.drawPieces = append(opt.drawPieces, linearPieces(p))
			}
		}
	}
	close(jobs)
	work := func() {
		for j := range jobs {
			mu.Lock()
			skip := failed[j.o] != nil
			mu.Unlock()
			if skip {
				continue
			}
			o, rope := opts[j.o], rq.checked[j.l]
			v, err := rq.simulate(&o.Motion, rope, tol)
			if err != nil {
				fail(j, err)
				continue
			}
			exact[j.o][j.l] = v
			var ds []Verified
			if linear && rq.linearDraws(o) {
				bound, ok, err := rq.drawnBound(o, rope, tol)
				if err != nil {
					fail(j, err)
					continue
				}
				if ok {
					drawn[j.o][j.l], of[j.o][j.l] = bound, len(o.draws)
					continue
				}
			}
			for d := range o.draws {
				v, err := rq.simulate(&o.draws[d], rope, tol)
				if err != nil {
					fail(j, err)
					break
				}
				ds = append(ds, v)
				if rq.decided(ds, len(o.draws)) {
					break
				}
			}
			drawn[j.o][j.l], of[j.o][j.l] = ds, len(ds)
		}
	}
	if procs := runtime.GOMAXPROCS(0); procs > 1 {
		for range procs {
			wg.Add(1)
			go func() {
				defer wg.Done()
				work()
			}()
		}
		wg.Wait()
	} else {
		// One processor (js/wasm always): no goroutines, whose switches
		// cost there more than they share.
		work()
	}
	for i, o := range opts {
		if failed[i] != nil {
			dropped = append(dropped, fmt.Sprintf("%s: left out, it could not be verified (%v).", o.Label, failed[i]))
			continue
		}
		vs := exact[i]
		if len(o.draws) > 0 {
			vs = make([]Verified, len(rq.checked))
			for l := range vs {
				vs[l] = p90(drawn[i][l], of[i][l], exact[i][l])
			}
			o.Basis = fmt.Sprintf("%gth percentile of a person's timing", rq.timing().Percentile)
		} else {
			o.Basis = "exact timing"
		}
		o.setVerified(vs, rq.lim)
		// An option without drawn timings simulated at the check tolerance
		// is what the recheck would make of it (with draws, the recheck
		// simulates them in the seeded order instead: linear false).
		o.rechecked = tol == CheckRelTol && (len(o.draws) == 0 || !linear)
		kept = append(kept, o)
	}
	return kept, dropped
}

// MinTimingDraws is the fewest drawn timings simulated at a rope length.
const MinTimingDraws = 20

// decided reports whether the draws so far (ds, of n) already decide the
// verdict of the percentile over all n at this rope length, and at least
// MinTimingDraws are done. The nearest-rank percentile of n is the k-th
// smallest, k = ceil(p*n) (36 of 40 for the 90th): it is beyond a limit
// exactly when n - k + 1 draws (5 of 40) are, so that many beyond any one
// limit decide "outside" whatever the others give, and k draws inside
// every limit decide "within". The figures stated are then the percentile
// over the draws made (Verified.Draws says how many): the verdict is the
// one all n draws would give, the figures an estimate from fewer draws.
func (rq *request) decided(ds []Verified, n int) bool {
	if len(ds) >= n {
		return true
	}
	if len(ds) < MinTimingDraws || !screening {
		return false
	}
	k := int(math.Ceil(float64(TimingPercentile) / 100 * float64(n))) // not 90/100: an integer constant division, 0
	lim := rq.lim
	beyond := [4]int{}
	inside := 0
	for _, v := range ds {
		figs := [4][2]float64{{v.PeakSwingDeg, lim.PeakSwingDeg}, {v.PeakExcursionM, lim.PeakExcursionM},
			{v.ResidualSwingDeg, lim.ResidualSwingDeg}, {v.ResidualExcursionM, lim.ResidualExcursionM}}
		all := true
		for f, x := range figs {
			if x[1] > 0 && x[0] > x[1] {
				beyond[f]++
				all = false
			}
		}
		if all {
			inside++
		}
	}
	for _, b := range beyond {
		if b >= n-k+1 {
			return true
		}
	}
	return inside >= k
}

// recheck simulates the option again at CheckRelTol at every checked rope
// length and takes those figures (a pendant option with its draws).
func (rq *request) recheck(o *Option) {
	if kept, _ := rq.verifyWith([]*Option{o}, CheckRelTol, false); len(kept) == 0 {
		o.rechecked = true
		o.Within = false
		o.outside(plain("could not be simulated again at the default accuracy"))
	}
}

// p90 is the percentile of each figure over n drawn runs of which vs are
// simulated (n = len(vs), or the draws left out are below the percentile:
// draws.go), with the planned run's figures as Exact.
func p90(vs []Verified, n int, exact Verified) Verified {
	pick := func(f func(Verified) float64) float64 {
		xs := make([]float64, len(vs))
		for i, v := range vs {
			xs[i] = f(v)
		}
		return percentileOf(xs, n, TimingPercentile)
	}
	out := Verified{RopeLengthM: exact.RopeLengthM,
		PeakSwingDeg:        pick(func(v Verified) float64 { return v.PeakSwingDeg }),
		PeakExcursionM:      pick(func(v Verified) float64 { return v.PeakExcursionM }),
		ResidualSwingDeg:    pick(func(v Verified) float64 { return v.ResidualSwingDeg }),
		ResidualExcursionM:  pick(func(v Verified) float64 { return v.ResidualExcursionM }),
		TensionFactor:       pick(func(v Verified) float64 { return v.TensionFactor }),
		PeakRiggingAngleDeg: pick(func(v Verified) float64 { return v.PeakRiggingAngleDeg }),
	}
	for _, v := range vs {
		out.Warnings = max(out.Warnings, v.Warnings)
	}
	out.Draws, out.simulated = n, len(vs)
	e := exact
	out.Exact = &e
	return out
}

// simulate runs one move at one rope length. The plan's scenario was
// validated before planning and the rope lengths and tolerances are the
// planner's own, within their ranges: only the move is checked each run.
func (rq *request) simulate(m *scenario.Motion, rope, tol float64) (Verified, error) {
	rq.sims.Add(1)
	if err := scenario.ValidateMotion(m, "motions[0]"); err != nil {
		return Verified{}, err
	}
	sc := *rq.s
	sc.Plan = nil
	sc.Motions = []scenario.Motion{*m}
	sc.Load.RopeLengthM = &rope
	sc.Settings = &scenario.Settings{RelTol: tol, SettlePeriods: 2}
	r, err := sway.EvaluateWith(&sc, sway.Options{NoHistory: true, NoModePeriods: true, Budget: rq.budget, Validated: true, CountedChecks: true})
	if errors.Is(err, sway.ErrStepLimit) {
		err = &sway.WorkError{Message: budgetMessage}
	}
	if err != nil {
		return Verified{}, err
	}
	v := Verified{RopeLengthM: rope, PeakSwingDeg: r.PeakSwingDeg, PeakExcursionM: r.PeakExcursionM,
		ResidualSwingDeg: r.ResidualSwingDeg, ResidualExcursionM: r.ResidualExcursionM,
		TensionFactor: r.TensionFactor, Warnings: len(r.Warnings)}
	if r.Rigging != nil {
		v.PeakRiggingAngleDeg = r.Rigging.PeakRiggingAngleDeg
	}
	return v, nil
}

func (o *Option) setVerified(vs []Verified, lim Limits) {
	o.Verified = vs
	o.WorstPeakSwingDeg, o.WorstPeakExcursionM, o.WorstResidualSwingDeg, o.WorstResidualExcM = 0, 0, 0, 0
	for _, v := range vs {
		if v.PeakSwingDeg >= o.WorstPeakSwingDeg {
			o.WorstPeakSwingDeg, o.WorstPeakRopeM = v.PeakSwingDeg, v.RopeLengthM
		}
		if v.ResidualSwingDeg >= o.WorstResidualSwingDeg {
			o.WorstResidualSwingDeg, o.WorstResidualRopeM = v.ResidualSwingDeg, v.RopeLengthM
		}
		o.WorstPeakExcursionM = math.Max(o.WorstPeakExcursionM, v.PeakExcursionM)
		o.WorstResidualExcM = math.Max(o.WorstResidualExcM, v.ResidualExcursionM)
	}
	o.Outside, o.OutsideSentences = []string{}, []Sentence{}
	out := func(what string, v, l float64, q func(float64) Quantity) {
		if l > 0 && v > l {
			o.outside(say(what+" {0} > {1}", q(v), q(l)))
		}
	}
	out("peak swing", o.WorstPeakSwingDeg, lim.PeakSwingDeg, qAngle)
	out("peak excursion", o.WorstPeakExcursionM, lim.PeakExcursionM, qLen)
	out("residual swing", o.WorstResidualSwingDeg, lim.ResidualSwingDeg, qAngle)
	out("residual excursion", o.WorstResidualExcM, lim.ResidualExcursionM, qLen)
	o.Within = len(o.Outside) == 0
}

// residualRatio is how far the option's worst residual is from the
// residual limits (1 = on the limit).
func (o *Option) residualRatio(lim Limits) float64 {
	return ratio(o.WorstResidualSwingDeg, lim.ResidualSwingDeg, o.WorstResidualExcM, lim.ResidualExcursionM)
}

// ratio is the larger of angle/angle limit and excursion/excursion limit,
// each counted when its limit is given.
func ratio(deg, limDeg, m, limM float64) float64 {
	r := 0.0
	if limDeg > 0 {
		r = math.Max(r, deg/limDeg)
	}
	if limM > 0 {
		r = math.Max(r, m/limM)
	}
	return r
}

// checkedSentences state what the simulation found (the option's
// findings), so that its words match its figures: the worst over the checked rope lengths and
// where, and for a pendant option the percentile of a person's timing.
func (rq *request) checkedSentences(o *Option) {
	lo, hi := rq.ropeRange()
	n := len(rq.checked)
	exc := ""
	qs := []Quantity{qLen(lo).digits(4), qLen(hi).digits(4), qAngle(o.WorstPeakSwingDeg), qLen(o.WorstPeakRopeM).digits(4),
		qAngle(o.WorstResidualSwingDeg), qLen(o.WorstResidualRopeM).digits(4)}
	if rq.lim.ResidualExcursionM > 0 || rq.lim.PeakExcursionM > 0 {
		exc = " (excursions {6}, {7})"
		qs = append(qs, qLen(o.WorstPeakExcursionM), qLen(o.WorstResidualExcM))
	}
	if o.Timing == nil {
		o.found(say(fmt.Sprintf("Simulated at %d rope lengths, {0} to {1}: worst peak {2} at {3}, residual {4} at {5}%s.", n, exc), qs...))
		return
	}
	tm := o.Timing
	verdict := "within the limits"
	if !o.Within {
		verdict = "NOT within the limits: {outside}. The crane's steps, pressed by a person, cannot be relied on to meet them"
	}
	qs = append(qs, qTime(tm.SigmaS), qTime(tm.ReactionDelayS))
	k := len(qs)
	dlo, dhi := tm.Draws, 0
	for _, v := range o.Verified {
		dlo, dhi = min(dlo, v.Draws), max(dhi, v.Draws)
	}
	slo, shi := tm.Draws, 0
	for _, v := range o.Verified {
		slo, shi = min(slo, v.simulated), max(shi, v.simulated)
	}
	draws := fmt.Sprintf("%d draws", tm.Draws)
	if dlo == tm.Draws && slo < tm.Draws {
		sims := fmt.Sprintf("%d", slo)
		if shi > slo {
			sims = fmt.Sprintf("%d to %d", slo, shi)
		}
		draws = fmt.Sprintf("%d draws (at each rope length the %s whose linear-theory estimate could reach the percentile simulated, the others below it by that estimate)", tm.Draws, sims)
	}
	if dlo < tm.Draws && dlo == dhi {
		draws = fmt.Sprintf("%d draws (a rope length stops drawing once the verdict of all %d is decided, after %d at least)", dlo, tm.Draws, MinTimingDraws)
	} else if dlo < tm.Draws {
		draws = fmt.Sprintf("%d to %d draws (a rope length stops drawing once the verdict of all %d is decided, after %d at least)", dlo, dhi, tm.Draws, MinTimingDraws)
	}
	o.found(say(fmt.Sprintf("Checked with a person's timing: each press and release off by a normal scatter of {%d} (standard deviation) after a reaction delay of {%d}, %s at each of %d rope lengths from {0} to {1}. 9 in 10 times the peak swing stays within {2} (worst at {3}) and the residual swing within {4} (worst at {5})%s: %s.",
		k-2, k-1, draws, n, exc, verdict), qs...).with("{outside}", list(o.OutsideSentences, "; ")))
	ex := 0.0
	for _, v := range o.Verified {
		if v.Exact != nil {
			ex = math.Max(ex, v.Exact.ResidualSwingDeg)
		}
	}
	o.found(say("Pressed exactly on the cues, the residual swing would be at most {0}.", qAngle(ex)))
}

// resLimitRad is the residual swing allowed at rope length l (to the
// hook), radians: the angle limit and the excursion limit as asin(e/L).
func (rq *request) resLimitRad(l float64) float64 {
	th := math.Inf(1)
	if rq.lim.ResidualSwingDeg > 0 {
		th = rq.lim.ResidualSwingDeg * units.Degree
	}
	if e := rq.lim.ResidualExcursionM; e > 0 {
		th = math.Min(th, math.Asin(math.Min(1, e/(l+rq.rig))))
	}
	return th
}
