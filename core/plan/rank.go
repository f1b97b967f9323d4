package plan

import (
	"fmt"
	"math"
	"sort"
)

// rank sorts options: those within every limit first, fastest first;
// then the others, fastest first. Pendant options are checked by the 90th
// percentile of a person's timing (their Verified figures), so that is
// what ranks them.
func rank(opts []*Option, fastest float64) {
	sort.SliceStable(opts, func(i, j int) bool {
		a, b := opts[i], opts[j]
		if a.Within != b.Within {
			return a.Within
		}
		if math.Abs(a.MoveTimeS-b.MoveTimeS) > 1e-6 {
			return a.MoveTimeS < b.MoveTimeS
		}
		return a.WorstResidualSwingDeg < b.WorstResidualSwingDeg
	})
	for _, o := range opts {
		o.PenaltyS = o.MoveTimeS - fastest
	}
}

// recommend picks the recommended option, moves it to the front (rank 1)
// and states why, or says what to change when no option keeps inside the
// limits. The fastest option within the limits is recommended unless one
// within 5 % of its move time is less than half as sensitive to the rope
// length, or (hook block) designed for both modes where it is not.
func (rq *request) recommend(res *Result, opts []*Option) {
	ropes := make([]Quantity, 0, 2)
	lo, hi := rq.ropeRange()
	ropes = append(ropes, qLen(lo).digits(4), qLen(hi).digits(4))
	number := func() {
		res.Options = make([]Option, len(opts))
		for i, o := range opts {
			o.Rank = i + 1
			res.Options[i] = *o
		}
	}
	if len(opts) == 0 || !opts[0].Within {
		number()
		for _, m := range rq.whatToChange(opts) {
			res.InfeasibleSentences = append(res.InfeasibleSentences, m)
		}
		res.ReasonSentence = say(fmt.Sprintf("No option keeps the load inside every limit at the %d rope lengths checked from {0} to {1}.", len(rq.checked)), ropes...)
		return
	}
	best := rq.choose(opts)
	both := rq.twoMode()
	o := opts[best]
	why := "fastest option that keeps peak and residual swing inside the limits at every rope length checked"
	if best != 0 {
		why = "within 5 % of the fastest option's move time and less sensitive to the rope length; it keeps inside the limits at every rope length checked"
		switch {
		case both && o.TwoMode && !opts[0].TwoMode:
			why = "within 5 % of the fastest option's move time and designed for both sway modes, where the faster one is tuned to the first only; it keeps inside the limits at every rope length checked"
		case o.RampTimeS > 0 && opts[0].RampTimeS == 0:
			why = "within 5 % of the fastest option's move time and one setting of the drive (its ramp time), where the faster one needs a programmed speed profile; it keeps inside the limits at every rope length checked"
		}
		copy(opts[1:best+1], opts[:best])
		opts[0] = o
	}
	number()
	res.Recommended = 0
	how := ""
	if o.Timing != nil {
		how = " 9 in 10 times, with a person's timing,"
	}
	qs := append(ropes, qTime(o.MoveTimeS), qTime(o.PenaltyS), qAngle(o.WorstResidualSwingDeg), qLen(o.WorstResidualRopeM).digits(4))
	lim := ""
	if rq.lim.ResidualSwingDeg > 0 {
		lim = fmt.Sprintf(" (limit {%d})", len(qs))
		qs = append(qs, qAngle(rq.lim.ResidualSwingDeg).digits(3))
	}
	if rq.lim.ResidualExcursionM > 0 {
		lim += fmt.Sprintf("; worst residual excursion {%d} (limit {%d})", len(qs), len(qs)+1)
		qs = append(qs, qLen(o.WorstResidualExcM), qLen(rq.lim.ResidualExcursionM))
	}
	text := fmt.Sprintf("Recommended: %s — %s%s (%d from {0} to {1}). Move time {2}, {3} longer than at the drive limits; worst residual swing {4} at {5}%s.",
		o.Label, why, how, len(rq.checked), lim)
	res.ReasonSentence = say(text, qs...)
	if rq.multi() {
		res.ReasonSentence = res.ReasonSentence.join(rq.modeReason(o))
	}
}

// choose is the index of the option to recommend among the ranked
// options, or -1 when none is within the limits: the fastest within them
// unless one within 5 % of its move time is less than half as sensitive to
// the rope length, one setting of the drive where the fastest is a
// programmed profile, or (hook block) designed for both modes where it is
// not.
func (rq *request) choose(opts []*Option) int {
	if len(opts) == 0 || !opts[0].Within {
		return -1
	}
	best := 0
	both := rq.twoMode()
	for i := 1; i < len(opts); i++ {
		o := opts[i]
		if !o.Within || o.MoveTimeS > opts[0].MoveTimeS*windowFactor {
			break
		}
		b := opts[best]
		single := func(x *Option) bool { return x.RampTimeS > 0 }
		switch {
		case both && o.TwoMode != b.TwoMode:
			if o.TwoMode {
				best = i
			}
		case single(o) != single(b):
			if single(o) {
				best = i
			}
		case o.WorstResidualSwingDeg < 0.5*b.WorstResidualSwingDeg:
			best = i
		}
	}
	return best
}

// nominalResidualDeg is the option's residual swing at the nominal rope
// length (the first checked): simulated, or for a screened option its
// linear-theory estimate; false when it has neither.
func (o *Option) nominalResidualDeg() (float64, bool) {
	switch {
	case len(o.Verified) > 0:
		return o.Verified[0].ResidualSwingDeg, true
	case len(o.Estimated) > 0:
		return o.Estimated[0].ResidualSwingDeg, true
	}
	return 0, false
}

// whatToChange explains, from the options' failures, what would make the
// request feasible.
func (rq *request) whatToChange(opts []*Option) []Sentence {
	var msgs []Sentence
	peakOK, resOK, resNominal := false, false, false
	var pendant *Option
	for _, o := range opts {
		if o.Timing != nil {
			pendant = o
		}
		if o.peakRatio(rq.lim) <= 1 {
			peakOK = true
			if o.residualRatio(rq.lim) <= 1 {
				resOK = true
			}
			if r, ok := o.nominalResidualDeg(); ok && (r <= rq.lim.ResidualSwingDeg || rq.lim.ResidualSwingDeg == 0) {
				resNominal = true
			}
		}
	}
	if pendant != nil && !pendant.Within {
		ex := 0.0
		for _, v := range pendant.Verified {
			ex = math.Max(ex, v.Exact.ResidualSwingDeg)
		}
		msgs = append(msgs, say("The crane's pendant steps, pressed by a person (scatter {0}), leave up to {1} of residual swing 9 in 10 times ({2} if pressed exactly on the cues): {outside}. With these steps the limits cannot be relied on. Use a variable-speed drive's ramp (the drive does the timing), a lower top step, or other limits if the lift allows.",
			qTime(pendant.Timing.SigmaS), qAngle(pendant.WorstResidualSwingDeg), qAngle(ex)).with("{outside}", list(pendant.OutsideSentences, "; ")))
		// What timing would do: a straight line between the exact and the
		// drawn figure (an estimate; the residual does not grow exactly in
		// proportion to the scatter).
		lim, sig := rq.lim.ResidualSwingDeg, pendant.Timing.SigmaS
		if p := pendant.WorstResidualSwingDeg; lim > 0 && ex < lim && p > lim && sig > 0 {
			msgs = append(msgs, say("A straight line between the exact and the drawn figures puts the scatter that would meet the residual limit at about {0} (an estimate: plan again with plan.timing_sigma_s to check).",
				qTime(sig*(lim-ex)/(p-ex)).digits(2)))
		}
		return msgs
	}
	switch {
	case !peakOK:
		msgs = append(msgs, plain("No option keeps the peak swing inside the limit. Lower the top speed (a shaped move's peak grows with the speed), give more acceleration room, or raise limits.peak_swing_deg / limits.peak_excursion_m if the clearance allows."))
	case !resOK && resNominal && len(rq.ropes) > 1:
		msgs = append(msgs, plain("Options meet the residual limit at the nominal rope length but not over the whole range. Narrow the rope-length range (measure the rope to the load's centre of mass, or plan hoisting before or after the move), or raise limits.residual_swing_deg."))
	case !resOK:
		msgs = append(msgs, plain("No option that keeps the peak inside the limit also leaves the residual swing inside its limit. Lower the top speed, narrow the rope-length range, or raise limits.residual_swing_deg."))
	}
	if len(msgs) == 0 {
		msgs = append(msgs, plain("No single option meets every limit together; change the limits or the move."))
	}
	return msgs
}
