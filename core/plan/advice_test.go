package plan

import (
	"math"
	"math/rand/v2"
	"sort"
	"strings"
	"testing"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// accelOf is a steps move's ramp in its axis' unit (m/s² or deg/s²).
func accelOf(m scenario.Motion) float64 {
	if m.AccelDegPerS2 != nil {
		return *m.AccelDegPerS2
	}
	return *m.AccelMPerS2
}

// pressed draws one way a person carries out a pendant option's cues,
// independently of the planner's own draws (another generator and seed,
// and the mark found on the drawn move itself): the first press at 0;
// each press on a count at the previous press + count + delay + a normal
// error; the release at the mark when the drawn move reaches the mark's
// position, + delay + a normal error. Scatter 0.25 s: a person pressing
// on a count is off by roughly 0.2 to 0.3 s (standard deviation; from
// memory).
func pressed(t *testing.T, o *Option, dist, amax, sigma, delay float64, r *rand.Rand, slew bool) scenario.Motion {
	// Positions in the axis' unit: m, or deg for a slew.
	t.Helper()
	m := o.Motion
	steps := make([]scenario.SpeedStep, len(m.Steps))
	copy(steps, m.Steps)
	var ms []motion.Step
	speed := func(st scenario.SpeedStep) float64 {
		if slew {
			return *st.RateDegPerS
		}
		return *st.SpeedMPerS
	}
	// Presses merged into one step (count 0) come out as one step in the
	// motion; map presses to steps by their planned moments.
	prev := 0.0
	k := 0
	for i, p := range o.Presses {
		var at float64
		switch {
		case i == 0:
			at = 0
		case p.ByMark:
			mark := p.BeforeStopM
			if slew {
				mark = p.BeforeStopDeg
			}
			target := math.Abs(dist) - mark
			// The drawn start, held at its top step: when does it reach the mark?
			prof, err := motion.NewSteps(append(append([]motion.Step{}, ms...), motion.Step{AtS: 1e5, Speed: 0}), amax, amax)
			if err != nil {
				t.Fatal(err)
			}
			lo, hi := prev, 1e5
			for range 100 {
				mid := (lo + hi) / 2
				if math.Abs(prof.At(mid).Pos) < target {
					lo = mid
				} else {
					hi = mid
				}
			}
			at = hi + delay + sigma*r.NormFloat64()
		default:
			at = prev + p.CountS + delay + sigma*r.NormFloat64()
		}
		at = math.Max(at, prev)
		prev = at
		for k < len(steps) && steps[k].AtS < p.AtS-1e-9 {
			k++
		}
		if k < len(steps) && math.Abs(steps[k].AtS-p.AtS) < 1e-9 {
			steps[k].AtS = at
			ms = append(ms, motion.Step{AtS: at, Speed: speed(steps[k])}) // m/s or deg/s
			k++
		}
	}
	m.Steps = steps
	return m
}

// Per planning example: the recommended option, carried out as a person
// would (each cue drawn with the stated scatter, 40 draws, re-simulated at
// the default accuracy at every checked rope length), stays within the
// residual limit 9 in 10 times at every rope length; drive-timed options
// run exactly. The gantry example's own pendant steps cannot meet it with
// the default scatter: the plan recommends nothing and says so, and this
// test measures the figures it states (logged; see the README).
func TestPendantP90(t *testing.T) {
	type example struct {
		name  string
		steps []float64 // to plan the example for a pendant with these steps
	}
	for _, ex := range []example{{"plan-bay-travel.json", nil}, {"plan-tower-slew.json", nil}, {"plan-precast-hook.json", nil},
		{"plan-gantry-pendant.json", nil}, {"plan-bay-travel.json", []float64{50, 100}}} {
		s := load(t, ex.name)
		if ex.steps != nil {
			s.Plan.Drive, s.Plan.PendantStepsPct = scenario.DrivePendant, ex.steps
		}
		r, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		var o *Option
		switch {
		case r.Recommended >= 0:
			o = &r.Options[r.Recommended]
		default:
			for i := range r.Options {
				if r.Options[i].Presses != nil {
					o = &r.Options[i]
				}
			}
		}
		if o == nil {
			t.Fatalf("%s: no option to check", ex.name)
		}
		lim := *s.Limits.ResidualSwingDeg
		rnd := rand.New(rand.NewPCG(2026, 12))
		for _, l := range r.CheckedRopeLengthsM {
			sc := *s
			sc.Plan = nil
			sc.Load.RopeLengthM = &l
			var res []float64
			draws := 1
			if o.Presses != nil {
				draws = 160 // more than the planner's 40, to judge its estimate
			}
			for range draws {
				m := o.Motion
				if o.Presses != nil {
					m = pressed(t, o, r.DistanceM+r.AngleDeg, accelOf(o.Motion), scenario.DefaultTimingSigmaS, 0, rnd, r.Axis == "slew")
				}
				sc.Motions = []scenario.Motion{m}
				e, err := sway.EvaluateWith(&sc, sway.Options{NoHistory: true})
				if err != nil {
					t.Fatal(err)
				}
				res = append(res, e.ResidualSwingDeg)
			}
			sort.Float64s(res)
			p90 := res[int(math.Ceil(0.9*float64(len(res))))-1]
			var stated float64
			for _, v := range o.Verified {
				if v.RopeLengthM == l {
					stated = v.ResidualSwingDeg
				}
			}
			t.Logf("%s %v %s at %g m: 90th percentile of the residual %.3f deg (this test's draws), planner %.3f deg, limit %g", ex.name, ex.steps, o.Key, l, p90, stated, lim)
			if r.Recommended >= 0 && p90 > lim {
				t.Errorf("%s %s at %g m: 90th percentile of the residual %.3f deg > limit %g", ex.name, o.Key, l, p90, lim)
			}
			if r.Recommended < 0 && o.Presses != nil && math.Abs(p90-stated) > 0.35*stated {
				t.Errorf("%s %s at %g m: this test's p90 %.3f deg, the planner's %.3f deg", ex.name, o.Key, l, p90, stated)
			}
		}
		if r.Recommended < 0 && !strings.Contains(strings.Join(r.Infeasible, " "), "9 in 10 times") {
			t.Errorf("%s: infeasible %q", ex.name, r.Infeasible)
		}
	}
}

// optionByKey finds an option of a plan.
func optionByKey(t *testing.T, r *Result, key string) *Option {
	t.Helper()
	for i := range r.Options {
		if r.Options[i].Key == key {
			return &r.Options[i]
		}
	}
	t.Fatalf("no option %s", key)
	return nil
}

// The variable-speed drive's one ramp time keeps the bay-travel example
// (invented demo data) inside its limits across the whole rope range, at
// nine rope lengths (more than the planner checks), and for moves of other
// lengths with the same setting: each ramp alone leaves at most half the
// residual limit in linear theory, so wherever the stop is called the
// start's and the stop's swings cannot add past it. Simulated at the
// default accuracy.
func TestSingleRampAcrossRange(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	o := optionByKey(t, r, "ramp_time")
	if o.RampTimeS <= 0 || math.Abs(o.AccelMPerS2-r.TopSpeedMPerS/o.RampTimeS) > 1e-12 || math.Abs(o.RampTimeS*10-math.Round(o.RampTimeS*10)) > 1e-9 {
		t.Fatalf("ramp time %g s, acceleration %g m/s²", o.RampTimeS, o.AccelMPerS2)
	}
	lo, hi := *s.Plan.RopeLengthMinM, *s.Plan.RopeLengthMaxM
	for _, dist := range []float64{18, 7, 31.3} {
		for i := range 9 {
			l := lo + (hi-lo)*float64(i)/8
			sc := *s
			sc.Plan = nil
			m := o.Motion
			m.DistanceM = &dist
			sc.Motions = []scenario.Motion{m}
			sc.Load.RopeLengthM = &l
			e, err := sway.EvaluateWith(&sc, sway.Options{NoHistory: true})
			if err != nil {
				t.Fatal(err)
			}
			if e.ResidualSwingDeg > *s.Limits.ResidualSwingDeg || e.PeakSwingDeg > *s.Limits.PeakSwingDeg || e.PeakExcursionM > *s.Limits.PeakExcursionM {
				t.Errorf("ramp %g s, %g m move, rope %.4g m: residual %.3f deg, peak %.3f deg, %.3f m", o.RampTimeS, dist, l, e.ResidualSwingDeg, e.PeakSwingDeg, e.PeakExcursionM)
			}
		}
	}
	// With an S-curve on the drive a rounded setting is offered too, and
	// checked the same way by the planner.
	s.Plan.SCurveMaxRoundingS = 6
	r, err = Make(s)
	if err != nil {
		t.Fatal(err)
	}
	for _, o := range r.Options {
		if o.Key == "ramp_time_s_curve" && (o.SCurveRoundingS <= 0 || !o.Within || o.Motion.Profile != scenario.ProfileSCurve) {
			t.Errorf("S-curve option: rounding %g s, within %v %v", o.SCurveRoundingS, o.Within, o.Outside)
		}
	}
}

// Every option of the tower-slew plan (invented demo data) states its
// simulated worst peak and residual swing and the rope lengths where they
// occur; re-simulated here at the default accuracy, the figures match
// (within 2e-3 deg: the planner's tolerance). No slew option claims that a
// whole number of periods leaves no swing: the outward lean R*w^2/g is
// released as the slew slows.
func TestSlewStatementsMatchSimulation(t *testing.T) {
	s := load(t, "plan-tower-slew.json")
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	for _, o := range r.Options {
		if o.NotSimulated != "" {
			continue // linear-theory estimates, labelled (TestRecommendedWithinLimits)
		}
		var st *Sentence
		for i := range o.FindingSentences {
			if strings.HasPrefix(o.FindingSentences[i].Text, "Simulated at") {
				st = &o.FindingSentences[i]
			}
		}
		for _, x := range append(o.Settings, o.Findings...) {
			if strings.Contains(x, "leaves no residual swing") {
				t.Errorf("%s claims no residual swing: %q", o.Key, x)
			}
		}
		if st == nil {
			t.Fatalf("%s: no simulated figures stated: %q", o.Key, o.Settings)
		}
		peak, res := 0.0, 0.0
		peakAt, resAt := 0.0, 0.0
		for _, l := range r.CheckedRopeLengthsM {
			sc := *s
			sc.Plan = nil
			sc.Motions = []scenario.Motion{o.Motion}
			sc.Load.RopeLengthM = &l
			e, err := sway.EvaluateWith(&sc, sway.Options{NoHistory: true})
			if err != nil {
				t.Fatal(err)
			}
			if e.PeakSwingDeg > peak {
				peak, peakAt = e.PeakSwingDeg, l
			}
			if e.ResidualSwingDeg > res {
				res, resAt = e.ResidualSwingDeg, l
			}
		}
		q := st.Quantities
		if math.Abs(q[2].Value-peak) > 2e-3 || math.Abs(q[4].Value-res) > 2e-3 || q[3].Value != peakAt || q[5].Value != resAt {
			t.Errorf("%s: states peak %.4f deg at %g m, residual %.4f deg at %g m; simulated %.4f at %g, %.4f at %g",
				o.Key, q[2].Value, q[3].Value, q[4].Value, q[5].Value, peak, peakAt, res, resAt)
		}
		if q[4].Value != o.WorstResidualSwingDeg || q[5].Value != o.WorstResidualRopeM {
			t.Errorf("%s: sentence and fields differ", o.Key)
		}
	}
}

// The drive is the crane's: an empty plan.drive (files from before) reads
// as a variable-speed drive, or a pendant when its steps are given, and
// the plan says what it assumed; a pendant without its steps is refused;
// the planner never invents steps.
func TestDriveIsTheCranes(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	s.Plan.Drive = ""
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Drive != scenario.DriveVariableSpeed || !r.DriveAssumed || !strings.Contains(strings.Join(r.Notes, " "), "plan.drive is not given") {
		t.Errorf("empty drive: %s, assumed %v, notes %q", r.Drive, r.DriveAssumed, r.Notes)
	}
	for _, o := range r.Options {
		if o.Presses != nil {
			t.Errorf("variable-speed plan offers pendant presses: %s", o.Key)
		}
	}
	s.Plan.PendantStepsPct = []float64{40, 100}
	r, err = Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Drive != scenario.DrivePendant || len(r.Options) != 2 {
		t.Errorf("empty drive with steps: %s, %d options", r.Drive, len(r.Options))
	}
	for _, o := range r.Options {
		for _, p := range o.Presses {
			if p.Pct != 0 && p.Pct != 40 && p.Pct != 100 {
				t.Errorf("%s presses to %g %%: not one of the crane's steps", o.Key, p.Pct)
			}
		}
	}
	s.Plan.Drive, s.Plan.PendantStepsPct = scenario.DrivePendant, nil
	if _, err := Make(s); err == nil || !strings.Contains(err.Error(), "plan.pendant_steps_pct: is required for a pendant") {
		t.Errorf("pendant without steps: %v", err)
	}
}

// A residual limit in metres (a landing tolerance) is used by the planner
// and by the evaluation's checks; it may stand instead of the angle limit.
func TestResidualExcursionLimit(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	s.Limits.ResidualSwingDeg = nil
	s.Limits.ResidualExcursionM = ptr(0.01)
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Limits.ResidualExcursionM != 0.01 {
		t.Errorf("limits %+v", r.Limits)
	}
	for _, o := range r.Options {
		if o.Within != (o.WorstResidualExcM <= 0.01 && o.peakRatio(r.Limits) <= 1) {
			t.Errorf("%s: within %v with residual excursion %g m", o.Key, o.Within, o.WorstResidualExcM)
		}
		if o.WorstResidualExcM > 0.01 && !strings.Contains(strings.Join(o.Outside, " "), "residual excursion") {
			t.Errorf("%s: outside %q", o.Key, o.Outside)
		}
	}
	if r.Recommended >= 0 && r.Options[0].WorstResidualExcM > 0.01 {
		t.Errorf("recommended %s leaves %g m", r.Options[0].Key, r.Options[0].WorstResidualExcM)
	}
	sc := *s
	sc.Plan = nil
	sc.Motions = []scenario.Motion{r.Options[len(r.Options)-1].Motion}
	e, err := sway.Evaluate(&sc)
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, c := range e.Checks {
		if c.Name == "residual_excursion_m" {
			found = c.Limit == 0.01 && c.Within == (e.ResidualExcursionM <= 0.01)
		}
	}
	if !found {
		t.Errorf("no residual_excursion_m check: %+v", e.Checks)
	}
}

// An option that cannot be verified (here a move the evaluation refuses)
// is left out and named; the others are kept.
func TestUnverifiableOptionDropped(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	rq, _ := newRequest(s)
	good := rq.trapezoidOption("good", "Good", 0.1, rq.vmax)
	bad := rq.trapezoidOption("bad", "Too long", 0.1, rq.vmax)
	far := 1999.0
	slow := 0.01
	bad.Motion.DistanceM, bad.Motion.SpeedMPerS = &far, &slow // 200,000 s: past the longest run
	kept, dropped := rq.verifyAll([]*Option{good, bad}, RelTol)
	if len(kept) != 1 || kept[0] != good || len(dropped) != 1 || !strings.HasPrefix(dropped[0], "Too long: left out") {
		t.Errorf("kept %d, dropped %q", len(kept), dropped)
	}
}

// A known reaction delay is planned for: the cues are counted that much
// shorter (the press lands at count + delay), the marks sit that much
// earlier, and with exact timing the move is as good as without delay.
func TestReactionDelayPlannedFor(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	s.Plan.Drive, s.Plan.PendantStepsPct = scenario.DrivePendant, []float64{50, 100}
	s.Plan.TimingSigmaS, s.Plan.ReactionDelayS = ptr(0), 0.5
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	o := optionByKey(t, r, "own_pendant")
	if p := o.Presses[1]; math.Abs(p.AtS-(p.CountS+0.5)) > 1e-9 || !o.Within {
		t.Errorf("second press at %g s, count %g s; within %v %v", p.AtS, p.CountS, o.Within, o.Outside)
	}
}

// A move too short to lay the crane's pendant steps out leaves that
// option out, named, and the plan still comes back.
func TestPendantTooShortDropped(t *testing.T) {
	s := load(t, "plan-gantry-pendant.json")
	d := 0.3
	s.Plan.DistanceM = &d
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Dropped) != 1 || !strings.Contains(r.Dropped[0], "too short for these steps") || len(r.Options) != 1 {
		t.Errorf("dropped %q, %d options", r.Dropped, len(r.Options))
	}
}
