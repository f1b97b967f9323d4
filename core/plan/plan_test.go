package plan

import (
	"math"
	"os"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mathext"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

func load(t testing.TB, name string) *scenario.Scenario {
	t.Helper()
	f, err := os.Open("../../testdata/scenarios/" + name)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	s, err := scenario.Decode(f)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// The recommended option of each example plan, simulated again here at the
// default accuracy of package sway (not the planner's looser tolerance),
// stays inside the plan's limits at the nominal rope length and at both
// ends of the range. The limits are the invented examples' own (demo
// data); the check is of the planner against the simulation.
func TestRecommendedWithinLimits(t *testing.T) {
	for _, name := range []string{"plan-bay-travel.json", "plan-tower-slew.json", "plan-gantry-pendant.json", "plan-precast-hook.json"} {
		s := load(t, name)
		r, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		// Every option carries its verified figures and crew settings,
		// the plain text being the sentences filled in.
		for _, o := range r.Options {
			if len(o.Settings) == 0 || o.MoveTimeS <= 0 || len(o.Settings) != len(o.Sentences) {
				t.Errorf("%s %s: settings %v move time %g", name, o.Label, o.Settings, o.MoveTimeS)
			}
			for i, st := range o.Settings {
				if strings.ContainsAny(st, "{}") || st != o.Sentences[i].String() {
					t.Errorf("%s %s: settings line %q", name, o.Label, st)
				}
			}
			if len(o.Findings) == 0 || len(o.Findings) != len(o.FindingSentences) || strings.ContainsAny(strings.Join(o.Findings, ""), "{}") {
				t.Errorf("%s %s: findings %q", name, o.Label, o.Findings)
			}
			if o.Within != (len(o.Outside) == 0) {
				t.Errorf("%s %s: within %v but outside %v", name, o.Label, o.Within, o.Outside)
			}
			// The limits broken, marked one for one (the page and sheet
			// show them in the units shown).
			if len(o.OutsideSentences) != len(o.Outside) || strings.Join(texts(o.OutsideSentences), "; ") != strings.Join(o.Outside, "; ") {
				t.Errorf("%s %s: outside %q, marked %v", name, o.Label, o.Outside, o.OutsideSentences)
			}
			for _, f := range o.FindingSentences {
				if strings.Contains(f.String(), "{") || strings.Contains(f.String(), " m >") {
					t.Errorf("%s %s: finding %q", name, o.Label, f.String())
				}
			}
			n := len(o.Verified)
			if o.NotSimulated != "" {
				// Screened (screen.go): linear-theory figures, labelled.
				n = len(o.Estimated)
				if len(o.Verified) != 0 || !strings.Contains(o.Label, "not simulated") || !strings.HasPrefix(o.Findings[0], "Not simulated") {
					t.Errorf("%s %s: screened option with %d verified figures, findings %q", name, o.Label, len(o.Verified), o.Findings)
				}
			}
			if n != len(r.CheckedRopeLengthsM) || len(r.CheckedRopeLengthsM) != 5 {
				t.Errorf("%s %s: figures at %d rope lengths, want 5", name, o.Label, n)
			}
		}
		if name == "plan-gantry-pendant.json" {
			// The crane's own steps, pressed by a person with the default
			// scatter, cannot meet the example's residual limit 9 in 10
			// times: the plan says so (TestPendantP90 reports the figures).
			if r.Recommended != -1 || len(r.Infeasible) == 0 || !strings.Contains(r.Infeasible[0], "pressed by a person") {
				t.Errorf("%s: recommended %d, infeasible %q", name, r.Recommended, r.Infeasible)
			}
			continue
		}
		if r.Recommended != 0 || r.Options[0].Rank != 1 {
			t.Fatalf("%s: recommended %d (want the first, rank 1): %v", name, r.Recommended, r.Infeasible)
		}
		if !strings.Contains(r.Reason, "Recommended") || r.Reason != r.ReasonSentence.String() {
			t.Errorf("%s: reason %q", name, r.Reason)
		}
		o := r.Options[r.Recommended]
		for _, l := range r.CheckedRopeLengthsM {
			sc := *s
			sc.Plan = nil
			sc.Motions = []scenario.Motion{o.Motion}
			sc.Load.RopeLengthM = &l
			res, err := sway.Evaluate(&sc)
			if err != nil {
				t.Fatal(err)
			}
			lim := s.Limits
			if res.ResidualSwingDeg > *lim.ResidualSwingDeg {
				t.Errorf("%s %s at %g m: residual %g deg > limit %g", name, o.Label, l, res.ResidualSwingDeg, *lim.ResidualSwingDeg)
			}
			if lim.PeakSwingDeg != nil && res.PeakSwingDeg > *lim.PeakSwingDeg {
				t.Errorf("%s %s at %g m: peak %g deg > limit %g", name, o.Label, l, res.PeakSwingDeg, *lim.PeakSwingDeg)
			}
			if lim.PeakExcursionM != nil && res.PeakExcursionM > *lim.PeakExcursionM {
				t.Errorf("%s %s at %g m: excursion %g m > limit %g", name, o.Label, l, res.PeakExcursionM, *lim.PeakExcursionM)
			}
			// The planner's figures agree with the default accuracy.
			for _, v := range o.Verified {
				if v.RopeLengthM == l && math.Abs(v.ResidualSwingDeg-res.ResidualSwingDeg) > 2e-3 {
					t.Errorf("%s at %g m: planner residual %g, default accuracy %g", name, l, v.ResidualSwingDeg, res.ResidualSwingDeg)
				}
			}
		}
	}
}

// Linear theory of one constant-acceleration ramp of time t_a: residual
// amplitude 2*(a/g)*|sin(pi*t_a/T)| rad, zero at whole periods (field
// notes; any text on the pendulum with a moving support). The planner's
// curve has its zeros there, and the full nonlinear simulation of a single
// ramp (a hard stop from speed V at deceleration V/t_a) agrees with it
// within 0.01 deg (0.2 % of the 5 deg scale of the test; measured: below
// 0.001 deg), and is below 0.05 deg at the
// whole periods.
func TestResidualAgainstRampTime(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	c := r.Curves.AccelTime
	for i, p := range c.Periods {
		if math.Abs(p-math.Round(p)) < 1e-9 && p > 0 {
			// Series 0 is the nominal rope; the design length is within
			// 0.3 % of it, so check the curve at its own period too.
			if v := c.Series[0].ResidualDeg[i]; v > 0.05 {
				t.Errorf("curve at %g periods: %g deg, want about 0", p, v)
			}
		}
	}
	if len(c.RampS) < 2 || c.Periods[len(c.Periods)-1] < 3 {
		t.Errorf("curve reaches %g periods, want at least 3", c.Periods[len(c.Periods)-1])
	}

	g := units.StandardGravity
	l := 5.0
	T := 2 * math.Pi * math.Sqrt(l/g)
	// V so that the step-speed residual V*w/g is 5 deg.
	v := 5 * units.Degree * g * T / (2 * math.Pi)
	mass, brake := 1000.0, 1.0
	for _, q := range []float64{0.25, 0.5, 0.75, 1, 1.5, 2, 2.5, 3} {
		ta := q * T
		dec := v / ta
		sc := &scenario.Scenario{Format: scenario.FormatName, Version: 1, Name: "single ramp",
			Load:     scenario.Load{MassKg: &mass, RopeLengthM: &l},
			Settings: &scenario.Settings{Accuracy: "tight"}}
		m := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileHardStop}
		m.SpeedMPerS, m.DecelMPerS2, m.BrakeAtS = &v, &dec, &brake
		sc.Motions = []scenario.Motion{m}
		res, err := sway.Evaluate(sc)
		if err != nil {
			t.Fatal(err)
		}
		lin := 2 * (dec / g) * math.Abs(math.Sin(math.Pi*ta/T)) / units.Degree
		t.Logf("ramp %4.2f periods: nonlinear %.4f deg, linear %.4f deg", q, res.ResidualSwingDeg, lin)
		if d := math.Abs(res.ResidualSwingDeg - lin); d > 0.01 {
			t.Errorf("ramp %g periods: nonlinear residual %.4f deg, linear %.4f deg", q, res.ResidualSwingDeg, lin)
		}
		if q == math.Round(q) && res.ResidualSwingDeg > 0.05 {
			t.Errorf("ramp of %g whole periods: residual %.4f deg, want about 0", q, res.ResidualSwingDeg)
		}
	}
}

// The shaper curves: zero at no error for ZV and ZVD, the EI tolerance at
// no error (formulas of package shaper, Singer & Seering 1990; Singhose,
// Seering & Singer 1994).
func TestRopeErrorCurve(t *testing.T) {
	r, err := Make(load(t, "plan-bay-travel.json"))
	if err != nil {
		t.Fatal(err)
	}
	c := r.Curves.RopeError
	zero := -1
	for i, e := range c.ErrorPct {
		if e == 0 {
			zero = i
		}
	}
	for _, s := range c.Series {
		want := 0.0
		if s.Shaper == "ei" {
			want = 5
		}
		if math.Abs(s.ResidualPct[zero]-want) > 1e-9 {
			t.Errorf("%s at no error: %g %%, want %g", s.Shaper, s.ResidualPct[zero], want)
		}
	}
	if !(c.RangePct[0] < 0 && c.RangePct[1] > 0) {
		t.Errorf("range on the error axis %v", c.RangePct)
	}
}

func TestInfeasible(t *testing.T) {
	// Slew rate whose outward lean atan(R w^2/g) passes the limit.
	s := load(t, "plan-tower-slew.json")
	fast := 12.0
	s.Plan.TopRateDegPerS = &fast
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Recommended != -1 || len(r.Infeasible) == 0 || !strings.Contains(r.Infeasible[0], "Lower plan.top_rate_deg_per_s below") {
		t.Errorf("fast slew: %v", r.Infeasible)
	}
	// Wind that leans the rope past the swing limit.
	s = load(t, "plan-bay-travel.json")
	f := 7200 * units.StandardGravity * math.Tan(4*units.Degree)
	s.Wind = &scenario.Wind{ForceN: &f}
	r, err = Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Recommended != -1 || len(r.Infeasible) == 0 || !strings.Contains(r.Infeasible[0], "The wind alone leans the rope") {
		t.Errorf("windy: %v", r.Infeasible)
	}
	// A residual limit no option meets over a wide rope range.
	s = load(t, "plan-bay-travel.json")
	lo, hi, tight := 5.0, 12.0, 0.05
	s.Plan.RopeLengthMinM, s.Plan.RopeLengthMaxM = &lo, &hi
	s.Limits.ResidualSwingDeg = &tight
	r, err = Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if r.Recommended != -1 || len(r.Infeasible) == 0 || !strings.Contains(r.Infeasible[0], "Narrow the rope-length range") {
		t.Errorf("wide range: %v", r.Infeasible)
	}
}

func TestPlanValidation(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	lo := 9.0
	s.Plan.RopeLengthMinM = &lo
	s.Limits.ResidualSwingDeg = nil
	s.Plan.Drive = "crank"
	_, err := Make(s)
	if err == nil {
		t.Fatal("no error")
	}
	for _, want := range []string{"plan.rope_length_min_m: the range 9 to 9 m must contain load.rope_length_m = 8.5 m",
		"limits.residual_swing_deg: is required for a plan", "plan.drive: is \"crank\""} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("error %q lacks %q", err, want)
		}
	}
}

// Each option's move, saved as a scenario motion, reads back through the
// scenario format and evaluates.
func TestOptionMotionsRoundTrip(t *testing.T) {
	s := load(t, "plan-tower-slew.json")
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	for _, o := range r.Options {
		sc := *s
		sc.Plan = nil
		sc.Motions = []scenario.Motion{o.Motion}
		var buf strings.Builder
		if err := scenario.Encode(&buf, &sc); err != nil {
			t.Fatal(err)
		}
		back, err := scenario.Parse([]byte(buf.String()))
		if err != nil {
			t.Fatalf("%s: %v", o.Label, err)
		}
		res, err := sway.EvaluateWith(back, sway.Options{NoHistory: true})
		if err != nil {
			t.Fatalf("%s: %v", o.Label, err)
		}
		if math.Abs(res.MotionEndS-o.MoveTimeS) > 1e-9 {
			t.Errorf("%s: saved move ends at %g s, option says %g s", o.Label, res.MotionEndS, o.MoveTimeS)
		}
	}
}

// From rest, a suspension point accelerating uniformly at a swings the rope
// between 0 and 2*atan(a/g): the pendulum swings with amplitude atan(a/g)
// about the apparent gravity g' = sqrt(g^2 + a^2) tilted by atan(a/g)
// (exact, not a small-angle result: the pendulum under the tilted
// apparent gravity, any mechanics text). Its period there is
// 4*sqrt(L/g')*K(k), k = sin(atan(a/g)/2) (large-amplitude pendulum; K the
// complete elliptic integral, Abramowitz & Stegun 17.3). So the planner's
// starting value a = g*tan(theta/2) peaks at exactly theta for one sudden
// ramp, and a ramp lasting exactly that period leaves the load at rest.
func TestSuddenAccelerationPeak(t *testing.T) {
	g := units.StandardGravity
	l, mass, brake := 6.0, 1000.0, 1.0
	for _, thDeg := range []float64{2, 5, 10} {
		a := g * math.Tan(thDeg*units.Degree/2)
		k := math.Sin(thDeg * units.Degree / 4)
		T := 4 * math.Sqrt(l/math.Hypot(g, a)) * mathext.CompleteK(k*k)
		v := a * T
		m := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileHardStop}
		m.SpeedMPerS, m.DecelMPerS2, m.BrakeAtS = &v, &a, &brake
		sc := &scenario.Scenario{Format: scenario.FormatName, Version: 1, Name: "sudden ramp",
			Load: scenario.Load{MassKg: &mass, RopeLengthM: &l}, Motions: []scenario.Motion{m},
			Settings: &scenario.Settings{Accuracy: "tight"}}
		res, err := sway.EvaluateWith(sc, sway.Options{NoHistory: true})
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("theta %g: peak %.8f residual %.2e", thDeg, res.PeakSwingDeg, res.ResidualSwingDeg)
		if math.Abs(res.PeakSwingDeg-thDeg) > 1e-5 {
			t.Errorf("theta %g: peak %.7f deg, want 2*atan(a/g) = %g", thDeg, res.PeakSwingDeg, thDeg)
		}
		if res.ResidualSwingDeg > 1e-4 {
			t.Errorf("theta %g: ramp of one exact period leaves %g deg", thDeg, res.ResidualSwingDeg)
		}
	}
}

// The crew's own pendant steps: with a half-speed first step and exact
// timing (scatter 0) the planner counts about half a period to the second
// press (the operators' rule, common practice; it is the undamped ZV
// shaper, Singer & Seering 1990), rounded to the half second people
// count, and releases the same way; five equal steps come out inside the
// limits too, and the simulation confirms each option. With a person's
// scatter the same steps leave more (checked by the 90th percentile).
func TestOwnPendantSteps(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	s.Plan.PendantStepsPct = []float64{50, 100}
	s.Plan.Drive = scenario.DrivePendant
	s.Plan.TimingSigmaS = ptr(0)
	own := func(r *Result) *Option {
		for i := range r.Options {
			if r.Options[i].Key == "own_pendant" {
				return &r.Options[i]
			}
		}
		t.Fatalf("no own_pendant option")
		return nil
	}
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	o := own(r)
	if len(o.Presses) != 4 {
		t.Fatalf("own pendant option: %+v", o.Presses)
	}
	for _, p := range o.Presses {
		if c := p.CountS / CueStepS; math.Abs(c-math.Round(c)) > 1e-9 {
			t.Errorf("count %g s is not whole half seconds", p.CountS)
		}
	}
	if got := o.Presses[1].CountS; math.Abs(got-r.DesignPeriodS/2) > CueStepS/2+1e-9 {
		t.Errorf("second press counted %g s, want half the period %g s rounded to %g s", got, r.DesignPeriodS/2, CueStepS)
	}
	if !o.Presses[2].ByMark || o.Presses[2].BeforeStopM <= 0 || !o.Presses[3].Release || o.Presses[3].BeforeStopM >= o.Presses[2].BeforeStopM {
		t.Errorf("releases: %+v", o.Presses[2:])
	}
	if !o.Within {
		t.Errorf("half-speed steps half a period apart, exact timing: %v", o.Outside)
	}
	s.Plan.TimingSigmaS = nil
	r, err = Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if p := own(r); p.WorstResidualSwingDeg <= o.WorstResidualSwingDeg || p.Timing == nil || p.Timing.SigmaS != scenario.DefaultTimingSigmaS {
		t.Errorf("with a person's scatter: p90 %g deg, exact %g deg, timing %+v", p.WorstResidualSwingDeg, o.WorstResidualSwingDeg, p.Timing)
	}
	s.Plan.TimingSigmaS = ptr(0)
	s.Plan.PendantStepsPct = []float64{20, 40, 60, 80, 100}
	r, err = Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if o := own(r); !o.Within || len(o.Presses) < 6 {
		t.Errorf("five steps: %v, %d presses", o.Outside, len(o.Presses))
	}
	s.Plan.PendantStepsPct = []float64{60, 30, 90}
	_, err = Make(s)
	if err == nil || !strings.Contains(err.Error(), "plan.pendant_steps_pct[1]: 30 % is not above the step before (60 %)") ||
		!strings.Contains(err.Error(), "plan.pendant_steps_pct[2]: is 90: the last step is the top speed, 100 %") {
		t.Errorf("bad steps: %v", err)
	}
}

// linearPeak is the small-angle pendulum's largest swing under the
// trapezoid's piecewise constant acceleration (the exact solution of the
// linear equation on each piece; any text on the pendulum with a moving
// support). Against the full nonlinear simulation of the same moves at
// these small angles (up to about 5 deg) it agrees within 2 % (measured:
// within 0.3 %): it used to count a turning point that fell outside its
// piece, which overestimated the drive-limits move of the bay-travel
// example at 8 m as 6.24 deg against 4.93 deg simulated.
func TestLinearPeak(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	rq, _ := newRequest(s)
	for _, a := range []float64{0.3, 0.15, 0.0856} {
		o := rq.trapezoidOption("x", "x", a, rq.vmax)
		for _, l := range []float64{8, 8.5, 9} {
			v, err := rq.simulate(&o.Motion, l, RelTol)
			if err != nil {
				t.Fatal(err)
			}
			lin := linearPeak(o.profile.(*motion.Trapezoid), 1, l) / units.Degree
			t.Logf("a %g, rope %g m: linear %.4f deg, simulated %.4f deg", a, l, lin, v.PeakSwingDeg)
			if math.Abs(lin-v.PeakSwingDeg) > 0.02*v.PeakSwingDeg {
				t.Errorf("a %g m/s², rope %g m: linear peak %.4f deg, simulated %.4f deg", a, l, lin, v.PeakSwingDeg)
			}
		}
	}
}
