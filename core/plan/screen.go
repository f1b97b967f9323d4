package plan

import (
	"fmt"
	"math"
	"sort"

	"swaysheet/core/motion"
	"swaysheet/core/units"
)

// Screening. Options are ranked "within every limit first, then fastest",
// and the recommendation is the fastest option within the limits or one
// within 5 % of its move time (recommend, choose). Each option's move time
// is known before it is simulated, so with T the move time of the fastest
// option the simulation finds within the limits, no option slower than
// 1.05*T can change the recommendation: those are not simulated. Nor is
// one that choose's rules put behind the option it prefers among the
// faster ones whatever its figures (a single-mode design behind a two-mode
// one when the second mode matters, a programmed profile behind one
// setting of the drive: canDisplace). Nor are faster ones
// that the linear theory of the pendulum puts clearly outside a limit
// (estimate above screenFactor times the limit plus screenAbsDeg): the
// per-piece solution of the small-angle pendulum (linearSwing) for travel,
// with the outward lean's release for a slew (slewResidual) and the lean
// at the top rate added to the peak, each mode of a hook block by its
// share of the load's swing. Wind and an initial swing are not in that
// theory: with either, only the move-time screen is used. When no option
// is found within the limits every option is simulated, so the advice on
// what to change reads the simulated figures as before (unless a pendant
// option is outside: that advice is about it alone).
//
// A screened option keeps its linear-theory figures, in Estimated (not
// Verified, which holds simulated figures only), its label says "not
// simulated", and NotSimulated says why.

const (
	screenFactor = 1.25 // estimate / limit beyond which an option is clearly outside
	screenAbsDeg = 0.02 // deg, added to the angle limits (times the rope for excursions)
	windowFactor = 1.05 // recommend's window over the fastest option within the limits
)

// outsideWhy is NotSimulated for an option screened by linear theory;
// preferredWhy begins it for one the recommendation's rules put behind a
// faster option.
const (
	outsideWhy   = "linear theory puts it clearly outside the limits"
	preferredWhy = "the recommendation prefers a faster option within the limits, "
)

// checkAtOnce can be turned off by tests, to compare with every option
// simulated at RelTol first and the recommended one rechecked (atCheckTol).
var checkAtOnce = true

// screening can be turned off by tests, to compare with every option
// simulated and every drawn timing of a pendant option (verify.go decided).
var screening = true

// candidate is an option before simulation: its first form (move time and
// profile known) and how to verify it at an integrator tolerance (which
// may return another form, as the ramp search and the peak-limited
// refinement do; nil when dropped; the peak-limited search keeps RelTol).
type candidate struct {
	o      *Option
	verify func(tol float64) (*Option, []string)
}

// screen simulates the candidates that can decide the recommendation, in
// order of move time, and returns every option: verified or estimated.
func (rq *request) screen(cands []candidate) (kept []*Option, dropped []string) {
	sort.SliceStable(cands, func(i, j int) bool { return cands[i].o.MoveTimeS < cands[j].o.MoveTimeS })
	fastestWithin := math.Inf(1)
	var screened []candidate
	ests := make([][2][]Verified, len(cands)) // the linear estimates: shown, low
	for i, c := range cands {
		ests[i][0], ests[i][1] = rq.estimate(c.o)
	}
	for i, c := range cands {
		est, low := ests[i][0], ests[i][1]
		switch {
		case screening && c.o.MoveTimeS > windowFactor*fastestWithin+1e-9:
			c.o.NotSimulated = fmt.Sprintf("its move time is more than %g times that of the fastest option within the limits, so it cannot change the recommendation", windowFactor)
		case screening && rq.linearOK() && c.o.Timing == nil && rq.clearlyOutside(low):
			c.o.NotSimulated = outsideWhy
		case screening && !rq.canDisplace(c.o, kept):
			c.o.NotSimulated = preferredWhy + rq.preferWhy(c.o, kept) + ", whatever this one's figures, so it cannot change the recommendation"
		default:
			tol := RelTol
			if screening && checkAtOnce && rq.atCheckTol(i, cands, ests, kept, fastestWithin) {
				tol = CheckRelTol
			}
			o, d := c.verify(tol)
			dropped = append(dropped, d...)
			if o != nil {
				kept = append(kept, o)
				if o.Within {
					fastestWithin = math.Min(fastestWithin, o.MoveTimeS)
				}
			}
			continue
		}
		c.o.estimated = est
		screened = append(screened, c)
	}
	pendantOut := false
	for _, o := range kept {
		pendantOut = pendantOut || (o.Timing != nil && !o.Within)
	}
	if math.IsInf(fastestWithin, 1) && !pendantOut {
		// Nothing within: simulate the rest too, for the advice on what to
		// change (which, for a pendant option outside, reads that alone).
		for _, c := range screened {
			c.o.NotSimulated = ""
			o, d := c.verify(RelTol)
			dropped = append(dropped, d...)
			if o != nil {
				kept = append(kept, o)
			}
		}
		return kept, dropped
	}
	for _, c := range screened {
		c.o.setVerified(c.o.estimated, rq.lim)
		c.o.verify = func() (*Option, []string) { return c.verify(RelTol) }
		kept = append(kept, c.o)
	}
	return kept, dropped
}

// atCheckTol reports whether candidate i (of cands, in order of move
// time, with their linear estimates ests) is simulated at CheckRelTol at
// once: when, should it be within the limits, the recommendation would
// likely take it, so that the recheck at that tolerance would only repeat
// its runs (verifyWith then marks it rechecked). Likely: choose's rules
// would put it before the option preferred so far among the faster ones
// (or there is none), and before every option still to come within the
// recommendation's window that is not clearly outside (takesOver); and its
// linear estimate is within the limits (with wind or an initial swing,
// which that theory leaves out, no option is run so). A wrong
// guess costs twice the work of its runs and leaves it figures more
// accurate than RelTol's; it never changes the recommendation. Options
// with drawn timings (a pendant) and the peak-limited search are never
// run so.
func (rq *request) atCheckTol(i int, cands []candidate, ests [][2][]Verified, kept []*Option, fastestWithin float64) bool {
	o := cands[i].o
	if !rq.linearOK() || o.Timing != nil || o.Key == "peak_limited" || rq.beyond(ests[i][1], 1, 0) {
		return false // no estimate to go by, or it puts o outside a limit
	}
	res := worstResidual(ests[i][0])
	window := windowFactor * o.MoveTimeS
	if b := rq.current(kept, o.MoveTimeS); b != nil {
		if !rq.takesOver(o, res, b, b.WorstResidualSwingDeg) {
			return false
		}
		window = windowFactor * fastestWithin
	}
	for j := i + 1; j < len(cands) && cands[j].o.MoveTimeS <= window+1e-9; j++ {
		c := cands[j].o
		if c.Timing == nil && rq.clearlyOutside(ests[j][1]) {
			continue
		}
		if rq.takesOver(c, worstResidual(ests[j][0]), o, res) {
			return false
		}
	}
	return true
}

// residualGuess: an option of the same class with its residual swing
// (in linear theory, for one not simulated) below this times another's
// may have half of it, so choose may prefer it (a margin of 30 % for the
// linear theory's error).
const residualGuess = 0.65

// takesOver guesses whether choose would put a (residual swing aRes, deg)
// before b (bRes), both within the limits: by class (prefers), or of the
// same class by half the residual swing (residualGuess).
func (rq *request) takesOver(a *Option, aRes float64, b *Option, bRes float64) bool {
	return rq.prefers(a, b) || (!rq.prefers(b, a) && aRes < residualGuess*bRes)
}

// worstResidual is the largest residual swing of the figures, deg.
func worstResidual(vs []Verified) float64 {
	w := 0.0
	for _, v := range vs {
		w = math.Max(w, v.ResidualSwingDeg)
	}
	return w
}

// prefers reports whether choose's class rules put a before b whatever
// their figures: a two-mode design over a single-mode one when the second
// mode matters, then one setting of the drive over a programmed profile.
func (rq *request) prefers(a, b *Option) bool {
	single := func(x *Option) bool { return x.RampTimeS > 0 }
	switch {
	case rq.twoMode() && a.TwoMode != b.TwoMode:
		return a.TwoMode
	case single(a) != single(b):
		return single(a)
	}
	return false
}

// unscreen simulates every screened option but those clearly outside, for
// when the option to recommend was found outside at the check tolerance
// and the reasons they were screened for no longer hold.
func (rq *request) unscreen(opts []*Option) []*Option {
	var out []*Option
	for _, o := range opts {
		if o.NotSimulated == "" || o.verify == nil || o.NotSimulated == outsideWhy {
			out = append(out, o)
			continue
		}
		o.NotSimulated = ""
		if nv, _ := o.verify(); nv != nil {
			out = append(out, nv)
		}
	}
	return out
}

// current is the option choose would prefer among the simulated options
// within the limits no slower than t, nil if none.
func (rq *request) current(kept []*Option, t float64) *Option {
	var in []*Option
	for _, o := range kept {
		if o.Within && o.MoveTimeS <= t+1e-9 {
			in = append(in, o)
		}
	}
	if len(in) == 0 {
		return nil
	}
	sort.SliceStable(in, func(i, j int) bool { return in[i].MoveTimeS < in[j].MoveTimeS })
	return in[rq.choose(in)]
}

// canDisplace reports whether o, whatever its simulated figures, could
// take the recommendation from the option preferred among the faster ones
// (choose's rules: a two-mode design over a single-mode one when the
// second mode matters, then one setting of the drive over a programmed
// profile, then half the residual swing).
func (rq *request) canDisplace(o *Option, kept []*Option) bool {
	b := rq.current(kept, o.MoveTimeS)
	return b == nil || !rq.prefers(b, o)
}

// preferWhy names the rule by which the faster option is preferred to o.
func (rq *request) preferWhy(o *Option, kept []*Option) string {
	b := rq.current(kept, o.MoveTimeS)
	if rq.twoMode() && b.TwoMode && !o.TwoMode {
		return b.Label + " (designed for both sway modes)"
	}
	return b.Label + " (one setting of the drive)"
}

// finishScreened moves a screened option's linear-theory figures to
// Estimated and labels it.
func finishScreened(o *Option) {
	o.Estimated = make([]Estimate, len(o.Verified))
	for i, v := range o.Verified {
		o.Estimated[i] = Estimate{RopeLengthM: v.RopeLengthM, PeakSwingDeg: v.PeakSwingDeg, PeakExcursionM: v.PeakExcursionM,
			ResidualSwingDeg: v.ResidualSwingDeg, ResidualExcursionM: v.ResidualExcursionM}
	}
	o.Verified = []Verified{}
	o.Basis = "linear theory estimate, not simulated"
	o.Label += " (not simulated: linear-theory estimate)"
}

// clearlyOutside reports whether the linear estimate is beyond a limit by
// the screening margin.
func (rq *request) clearlyOutside(est []Verified) bool {
	return rq.beyond(est, screenFactor, screenAbsDeg)
}

// beyond reports whether a figure of est is beyond factor times its limit
// plus absDeg (times the rope for an excursion).
func (rq *request) beyond(est []Verified, factor, absDeg float64) bool {
	for _, v := range est {
		l := v.RopeLengthM + rq.rig
		ang := func(x, lim float64) bool { return lim > 0 && x > factor*lim+absDeg }
		exc := func(x, lim float64) bool {
			return lim > 0 && x > factor*lim+l*absDeg*units.Degree
		}
		if ang(v.PeakSwingDeg, rq.lim.PeakSwingDeg) || ang(v.ResidualSwingDeg, rq.lim.ResidualSwingDeg) ||
			exc(v.PeakExcursionM, rq.lim.PeakExcursionM) || exc(v.ResidualExcursionM, rq.lim.ResidualExcursionM) {
			return true
		}
	}
	return false
}

// estimate is the option's linear-theory figures at each checked rope
// length: each mode's peak and residual (linearSwing; slewResidual for a
// slew's residual) weighted by its share of the load's swing and added;
// for a slew the lean at the top rate is added to the peak (shown: the
// swing from the slew's acceleration and the lean are at right angles and
// need not peak together, so the sum is on the high side: in the tower-slew
// example it overstates the simulated peak by up to 1 deg). low is the same
// with the larger of the two for a slew's peak instead of their sum: the
// screen for "clearly outside" reads low. With a hook block the sum over
// the modes has been seen below the simulation (by a fifth in the
// precast-hook example), on the safe side for that screen.
func (rq *request) estimate(o *Option) (shown, low []Verified) {
	shown = make([]Verified, len(rq.checked))
	low = make([]Verified, len(rq.checked))
	lean := 0.0
	if rq.leans() {
		v := 0.0
		for _, t := range o.profile.Breakpoints() {
			v = math.Max(v, math.Abs(o.profile.At(t).Vel))
		}
		lean = rq.lean(v)
	}
	pieces := linearPieces(o.profile)
	for i, l := range rq.checked {
		ms := rq.modesAt(l)
		peak, res := 0.0, 0.0
		for j, w := range ms.omega {
			pk, rs := linearSwingOf(o.profile, pieces, rq.k, w)
			if rq.leans() {
				rs = rq.slewResidual(o.profile, w)
			}
			peak += ms.share[j] * pk
			res += ms.share[j] * rs
		}
		line := l + rq.rig
		fig := func(peak float64) Verified {
			return Verified{RopeLengthM: l, PeakSwingDeg: peak / units.Degree, ResidualSwingDeg: res / units.Degree,
				PeakExcursionM: line * math.Sin(math.Min(peak, math.Pi/2)), ResidualExcursionM: line * math.Sin(math.Min(res, math.Pi/2))}
		}
		shown[i], low[i] = fig(peak+lean), fig(math.Max(peak, lean))
	}
	return shown, low
}

// linearSwing is the largest swing angle (rad) and the residual amplitude
// after the move of the small-angle pendulum theta” + w^2 theta =
// -w^2*A(t)/g under the hook acceleration A = k*acc(t) of the profile p,
// from rest: on each piece of constant acceleration the solution is exact,
// theta = -A/g + R*cos(w*tau - phi) (linear theory of the pendulum with a
// moving support); a piece whose acceleration changes (an S-curve's) is cut
// into pieces of at most a sixteenth of a period at their middle
// acceleration.
func linearSwing(p motion.Profile, k, w float64) (peak, residual float64) {
	return linearSwingOf(p, linearPieces(p), k, w)
}

// linearPiece is an interval between two breakpoints of a profile and,
// when the acceleration does not change across it, that acceleration (at
// its middle).
type linearPiece struct {
	t0, t1, acc float64
	varying     bool
	_           [0]func() // not comparable: no equality function in the wasm
}

// linearPieces lists the intervals linearSwing solves piece by piece: they
// do not depend on the pendulum, so an option's estimate at every rope
// length and mode reads one list (each profile.At sums every component of
// a shaped move).
func linearPieces(p motion.Profile) []linearPiece {
	bp := append(p.Breakpoints(), p.End())
	ps := make([]linearPiece, 0, len(bp))
	for i := 0; i+1 < len(bp); i++ {
		t0, t1 := bp[i], bp[i+1]
		if t1 <= t0 {
			continue
		}
		e := 1e-9 * (t1 - t0)
		pc := linearPiece{t0: t0, t1: t1}
		if a0, a1 := p.At(t0+e).Acc, p.At(t1-e).Acc; math.Abs(a1-a0) > 1e-12*(math.Abs(a0)+math.Abs(a1)) {
			pc.varying = true
		} else {
			pc.acc = p.At(t0 + 0.5*(t1-t0)).Acc
		}
		ps = append(ps, pc)
	}
	return ps
}

// linearSwingOf is linearSwing on the pieces of p.
func linearSwingOf(p motion.Profile, pieces []linearPiece, k, w float64) (peak, residual float64) {
	g := units.StandardGravity
	th, dth := 0.0, 0.0
	piece := func(d, acc float64) {
		eq := -k * acc / g
		e0, v0 := th-eq, dth/w
		r, phi := math.Hypot(e0, v0), math.Atan2(v0, e0)
		at := func(tau float64) float64 { return eq + r*math.Cos(w*tau-phi) }
		peak = math.Max(peak, math.Max(math.Abs(at(0)), math.Abs(at(d))))
		// Turning points: w*tau - phi = m*pi for a whole m, so tau =
		// (m*pi + phi)/w; the first after tau = 0 has m = floor(-phi/pi)+1.
		if m := math.Floor(-phi/math.Pi) + 1; (m*math.Pi+phi)/w < d {
			peak = math.Max(peak, math.Abs(eq+r*math.Cos(m*math.Pi)))
			if (m*math.Pi+math.Pi+phi)/w < d {
				peak = math.Max(peak, math.Abs(eq)+r)
			}
		}
		th = at(d)
		dth = -r * w * math.Sin(w*d-phi)
	}
	for _, pc := range pieces {
		t0, t1 := pc.t0, pc.t1
		if !pc.varying {
			piece((t1-t0)/1, pc.acc)
			continue
		}
		n := int(math.Ceil((t1 - t0) * w / (2 * math.Pi) * 16))
		h := (t1 - t0) / float64(n)
		for j := range n {
			piece(h, p.At(t0+(float64(j)+0.5)*h).Acc)
		}
	}
	res := math.Hypot(th, dth/w)
	return math.Max(peak, res), res
}

// estimatedSentences state a screened option's linear-theory figures and
// why it was not simulated.
func (rq *request) estimatedSentences(o *Option) {
	lo, hi := rq.ropeRange()
	qs := []Quantity{qLen(lo).digits(4), qLen(hi).digits(4), qAngle(o.WorstPeakSwingDeg), qLen(o.WorstPeakRopeM).digits(4),
		qAngle(o.WorstResidualSwingDeg), qLen(o.WorstResidualRopeM).digits(4)}
	o.found(say(fmt.Sprintf("Not simulated: %s. Linear-theory estimate at %d rope lengths, {0} to {1}: worst peak about {2} at {3}, residual about {4} at {5}. Evaluate its move to check it.",
		o.NotSimulated, len(rq.checked)), qs...))
}
