package clearance

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	"swaysheet/core/draws"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/words"
)

// PlanWork is the work budget of the planner's site check, shared by all
// its runs (see sway.Budget): about 5 s of one core, as a plan's own.
const PlanWork = 400_000_000

const planBudgetMessage = "Checking the plan's options against the site needs more computing than allowed: use fewer runs (site.spread.runs) or shorten the move (plan.distance_m or plan.angle_deg)."

// bisections is how many times the top speed's bracket (between two
// grid speeds) is halved.
const bisections = 3

// PlanSite checks a plan's options against the scenario's site (see
// SitePlan): each option's move replaces the scenario's motions and is
// run with the site's spreads, RunsPerCheck runs with the site's seed.
// Every check draws on one work budget (opt.Budget, or PlanWork); when it
// is spent the options left are marked so and Messages says what to
// shorten.
func PlanSite(s *scenario.Scenario, res *plan.Result, opt Options) (*SitePlan, error) {
	if s.Site == nil {
		return nil, ErrNoSite
	}
	if s.Plan == nil || res == nil {
		return nil, scenario.Errors{{Field: "plan", Message: "is required: the site check of a plan needs a plan block"}}
	}
	if opt.Budget == nil {
		opt.Budget = sway.NewBudget(PlanWork, planBudgetMessage)
	}
	n, seed, spread := planRuns(s.Site)
	out := &SitePlan{RunsPerCheck: n, Seed: seed, Fastest: -1, Options: make([]SiteOption, len(res.Options)),
		Words: []string{}, WordSentences: []words.Sentence{}, Messages: []string{}}
	spent := false
	check := func(m scenario.Motion) (*Report, error) {
		d := *s
		d.Motions = []scenario.Motion{m}
		rep, err := Evaluate(&d, n, seed, drawn(&d, spread, seed), opt)
		if errors.Is(err, sway.ErrWorkLimit) {
			spent = true
		}
		return rep, err
	}
	order := make([]int, len(res.Options))
	for i := range order {
		order[i] = i
		o := &res.Options[i]
		out.Options[i] = SiteOption{Index: i, Key: o.Key, Label: o.Label, MoveTimeS: o.MoveTimeS}
	}
	sort.SliceStable(order, func(a, b int) bool { return res.Options[order[a]].MoveTimeS < res.Options[order[b]].MoveTimeS })
	var limits *Report
	for _, i := range order {
		so := &out.Options[i]
		switch {
		case spent:
			so.Skipped = "the work budget ran out"
			continue
		case out.Fastest >= 0 && i != res.Recommended:
			so.Skipped = "a faster option clears"
			continue
		}
		rep, err := check(res.Options[i].Motion)
		if err != nil {
			if spent {
				so.Skipped = "the work budget ran out"
				continue
			}
			so.Skipped = err.Error()
			continue
		}
		so.Checked, so.Clears = true, rep.Clears
		if w := worst(rep); w != nil {
			so.Worst, so.ShareKeepMargin, so.SmallestM = w.Name, w.ShareKeepMargin, w.SmallestM
			so.Strikes, so.FirstStrikeBy, so.FirstStrikeLine = w.Strikes, w.FirstStrikeBy, w.FirstStrikeLine
		} else {
			so.ShareKeepMargin = 1
		}
		if rep.Clears && out.Fastest < 0 {
			out.Fastest = i
		}
		if res.Options[i].Key == "drive_limits" {
			limits = rep
		}
	}
	if !spent {
		out.TopSpeed = topSpeed(res, limits, check)
	}
	out.WordSentences = planWords(s.Site.MarginM, res, out)
	out.Words = words.Strings(out.WordSentences)
	if spent {
		out.Messages = append(out.Messages, planBudgetMessage)
	}
	return out, nil
}

// planRuns is the runs of each check: the site's spread's (at most
// MaxPlanRuns; DefaultSiteRuns when it gives none), or one run without a
// spread.
func planRuns(st *scenario.Site) (int, int, draws.Spread) {
	sp := st.Spread
	if sp == nil {
		return 1, 0, draws.Spread{}
	}
	n := sp.Runs
	if n == 0 {
		n = scenario.DefaultSiteRuns
	}
	return min(n, MaxPlanRuns), sp.Seed, draws.Spread{RopeLengthM: sp.RopeLengthM, CentreDepthM: sp.CentreDepthM,
		PressS: sp.PressS, GustPct: sp.GustPct, GustS: sp.GustS, EmergencyStop: sp.EmergencyStop}
}

// drawn gives run i of s under the spread (nil without one).
func drawn(s *scenario.Scenario, sp draws.Spread, seed int) Variant {
	if sp == (draws.Spread{}) {
		return nil
	}
	return func(i int) *scenario.Scenario { return draws.Draw(s, sp, uint64(seed), i) }
}

// worst is the obstacle kept clear in the fewest runs (then the one the
// load comes closest to), nil when the site has none.
func worst(rep *Report) *ObstacleReport {
	var w *ObstacleReport
	for i := range rep.Obstacles {
		o := &rep.Obstacles[i]
		if w == nil || o.ShareKeepMargin < w.ShareKeepMargin || (o.ShareKeepMargin == w.ShareKeepMargin && o.SmallestM < w.SmallestM) {
			w = o
		}
	}
	return w
}

// topSpeed searches the drive-limits move's top speed (see TopSpeed).
//
// The swing a move leaves is not monotonic in its top speed: at a given
// acceleration a, the ramp to top speed v lasts t_a = v/a, and in linear
// theory one ramp leaves a swing of amplitude 2(a/g)|sin(pi*t_a/T)|
// (T the sway period; any mechanics text): none when the ramp lasts a
// whole number of periods, the most when it lasts an odd number of half
// periods. A slower top speed can so swing more than a faster one, and a
// bisection that takes "slower never swings more" can report a speed
// above one that fails. The search is therefore: check a grid of
// speedGrid top speeds evenly from a tenth of the plan's top speed to
// the top speed itself; the answer lies below the slowest grid speed
// that fails, and is bisected (bisections halvings) between it and the
// grid speed below it, which clears. Every speed checked at or below the
// answer clears (Tested lists them all); grid speeds above the first
// failure that clear again are named (FasterClears), not advised.
func topSpeed(res *plan.Result, limits *Report, check func(scenario.Motion) (*Report, error)) *TopSpeed {
	var base *plan.Option
	for i := range res.Options {
		if res.Options[i].Key == "drive_limits" {
			base = &res.Options[i]
		}
	}
	if base == nil || (base.Motion.Profile != "" && base.Motion.Profile != scenario.ProfileTrapezoid) {
		return nil
	}
	speed, unit := base.Motion.SpeedMPerS, "m/s"
	if speed == nil {
		speed, unit = base.Motion.RateDegPerS, "deg/s"
	}
	if speed == nil {
		return nil
	}
	ts := &TopSpeed{Unit: unit, Tested: []SpeedTried{}}
	// clears checks top speed v (the plan's own from its report when
	// given); done is false when the check could not be made.
	clears := func(v float64, rep *Report) (ok, done bool) {
		if rep == nil {
			m := base.Motion
			if unit == "m/s" {
				m.SpeedMPerS = &v
			} else {
				m.RateDegPerS = &v
			}
			ts.Checks++
			var err error
			if rep, err = check(m); err != nil {
				return false, false
			}
		}
		share := 1.0
		if w := worst(rep); w != nil {
			share = w.ShareKeepMargin
		}
		ts.Tested = append(ts.Tested, SpeedTried{Speed: v, Clears: rep.Clears, ShareKeepMargin: share})
		return rep.Clears, true
	}
	top := *speed
	fail := -1 // the slowest grid speed that fails
	grid := make([]float64, speedGrid)
	for j := range grid {
		grid[j] = top * (0.1 + 0.9*float64(j)/float64(speedGrid-1))
		if j == speedGrid-1 {
			grid[j] = top
		}
		var rep *Report
		if j == speedGrid-1 {
			rep = limits
		}
		ok, done := clears(grid[j], rep)
		if !done {
			return nil
		}
		if !ok && fail < 0 {
			fail = j
		}
		if ok && fail >= 0 {
			ts.FasterClears = append(ts.FasterClears, grid[j])
		}
	}
	switch fail {
	case -1:
		ts.Speed, ts.Clears = top, true
		sortTried(ts.Tested)
		return ts
	case 0:
		ts.Above = grid[0]
		sortTried(ts.Tested)
		return ts
	}
	lo, hi := grid[fail-1], grid[fail]
	for range bisections {
		mid := (lo + hi) / 2
		ok, done := clears(mid, nil)
		if !done {
			break
		}
		if ok {
			lo = mid
		} else {
			hi = mid
		}
	}
	ts.Speed, ts.Above, ts.Clears = lo, hi, true
	sortTried(ts.Tested)
	return ts
}

// speedGrid is how many top speeds the search checks evenly from a tenth
// of the plan's top speed to the top speed.
const speedGrid = 5

// sortTried puts the speeds tried slowest first.
func sortTried(v []SpeedTried) {
	sort.SliceStable(v, func(a, b int) bool { return v[a].Speed < v[b].Speed })
}

// planWords says the outcome, the quantities marked (core/words).
func planWords(marginM float64, res *plan.Result, sp *SitePlan) []words.Sentence {
	var w []words.Sentence
	margin := words.Length(marginM)
	if sp.Fastest >= 0 {
		o := &res.Options[sp.Fastest]
		w = append(w, words.Say(fmt.Sprintf("Fastest option that keeps {0} from every obstacle in %.0f %% of %d runs: %s ({1}).",
			100*Required, sp.RunsPerCheck, braces(o.Label)), margin, words.Time(o.MoveTimeS)))
	} else {
		w = append(w, words.Say(fmt.Sprintf("No option checked keeps {0} from every obstacle in %.0f %% of %d runs.", 100*Required, sp.RunsPerCheck), margin))
	}
	if r := res.Recommended; r >= 0 && r < len(sp.Options) && sp.Options[r].Checked {
		so := sp.Options[r]
		if so.Clears {
			w = append(w, words.Plain(fmt.Sprintf("The planner's recommended option (%s) keeps it.", so.Label)))
		} else {
			struck := ""
			if so.Strikes > 0 {
				struck = fmt.Sprintf(", and struck in %d of %d (first by %s)", so.Strikes, sp.RunsPerCheck, StruckBy(so.FirstStrikeBy, so.FirstStrikeLine))
			}
			w = append(w, words.Plain(fmt.Sprintf("The planner's recommended option (%s) does not: %s is kept clear in %.0f %% of the runs%s.", so.Label, so.Worst, 100*so.ShareKeepMargin, struck)))
		}
	}
	if ts := sp.TopSpeed; ts != nil {
		speed, above := words.Of(ts.Speed, ts.Unit), words.Of(ts.Above, ts.Unit)
		switch {
		case ts.Clears && ts.Above == 0:
			w = append(w, words.Say(fmt.Sprintf("The plan's top speed of {0} keeps the margin, and so does every slower top speed tested (%d, from {1}).",
				len(ts.Tested)), speed, words.Of(ts.Tested[0].Speed, ts.Unit)))
		case ts.Clears:
			w = append(w, words.Say(fmt.Sprintf("Largest top speed tested that keeps the margin at the drive's acceleration, every slower one tested keeping it too: {0} ({1} does not; %d speeds tested, %d runs each).",
				len(ts.Tested), sp.RunsPerCheck), speed, above))
		default:
			w = append(w, words.Say("Even a tenth of the top speed ({0}) does not keep the margin at the drive's acceleration: the path, the obstacles or the load must change.", above))
		}
		if len(ts.FasterClears) > 0 {
			qs := make([]words.Quantity, len(ts.FasterClears))
			var marks []string
			for i, v := range ts.FasterClears {
				qs[i] = words.Of(v, ts.Unit)
				marks = append(marks, fmt.Sprintf("{%d}", i))
			}
			w = append(w, words.Say("Faster top speeds tested keep it again ("+strings.Join(marks, ", ")+"): the swing a ramp leaves depends on its time against the sway period, so speeds between may not; they are not advised.", qs...))
		}
	}
	return w
}
