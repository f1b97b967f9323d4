package plan

import (
	"math"
	"strings"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/sway"
)

// The heavy-hook example (invented demo data: a 2 t hook block, a 0.6 t
// panel on 6 m slings, rope 7.5 to 8.5 m to the hook) swings in two modes
// whose periods are the linearised two-mass pendulum's (standard result,
// pendulum.LinearModes), the second carrying about 10 % of the load's
// swing.
//
// Each two-mode ZV and ZVD option, rebuilt from its saved motion, leaves
// no vibration at either design frequency (residual vibration function
// V(w) of the convolved shaper: Singer & Seering 1990), and the nonlinear
// simulation of both masses at the default accuracy keeps its residual
// inside the limit at the nominal rope length and both range ends. The
// single-mode shapers, tuned to the first mode only, say what they leave
// in the second, and the simulation shows them over the residual limit
// here. The recommendation takes both modes into account and says so (the
// one ramp time, screened with both modes weighted by their shares).
func TestTwoModePlan(t *testing.T) {
	s := load(t, "plan-precast-hook.json")
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	if len(r.ModePeriodsS) != 2 || r.PeriodS != r.ModePeriodsS[0] || r.SecondDesignPeriodS <= 0 ||
		r.SecondModeShare < sway.SecondModeWarnShare {
		t.Fatalf("modes %v, period %v, second design %v, share %v", r.ModePeriodsS, r.PeriodS, r.SecondDesignPeriodS, r.SecondModeShare)
	}
	// Whole-period ramps and single-mode shapers use the slower mode.
	if math.Abs(r.DesignPeriodS/r.PeriodS-1) > 0.01 {
		t.Errorf("design period %v, slower mode %v", r.DesignPeriodS, r.PeriodS)
	}
	lim := *s.Limits.ResidualSwingDeg
	seen := map[string]bool{}
	for _, o := range r.Options {
		seen[o.Key] = true
		switch o.Key {
		case "zv2_variable_speed", "zvd2_variable_speed":
			spec := o.Motion.Shaper
			if !o.TwoMode || spec == nil || spec.SecondPeriodS == nil {
				t.Fatalf("%s: not a two-mode motion: %+v", o.Key, spec)
			}
			sh, err := shaper.NewTwoMode(spec.Kind, *spec.PeriodS, *spec.SecondPeriodS, spec.DampingRatio, spec.TolerancePct/100)
			if err != nil {
				t.Fatal(err)
			}
			for _, tp := range []float64{r.DesignPeriodS, r.SecondDesignPeriodS} {
				if v := sh.Residual(2*math.Pi/tp, 0); v > 1e-12 {
					t.Errorf("%s: V = %g at the design period %g s", o.Key, v, tp)
				}
			}
			for _, l := range r.RopeLengthsM {
				sc := *s
				sc.Load.RopeLengthM = &l
				sc.Plan, sc.Motions = nil, []scenario.Motion{o.Motion}
				res, err := sway.Evaluate(&sc)
				if err != nil {
					t.Fatal(err)
				}
				if res.Rigging == nil || res.ResidualSwingDeg > lim {
					t.Errorf("%s at rope %g m: residual %g deg, limit %g (rigging %v)", o.Key, l, res.ResidualSwingDeg, lim, res.Rigging != nil)
				}
			}
		case "zv_variable_speed", "zvd_variable_speed":
			if o.TwoMode || len(o.ModeResidualPct) != 2 || o.ModeResidualPct[1] < 10 {
				t.Errorf("%s: two-mode %v, mode residuals %v", o.Key, o.TwoMode, o.ModeResidualPct)
			}
			if !strings.Contains(strings.Join(o.Settings, " "), "Tuned to the first sway mode") {
				t.Errorf("%s: settings do not say it is tuned to one mode: %q", o.Key, o.Settings)
			}
			if o.Within {
				t.Errorf("%s: within the residual limit (%g deg): the example should show the second mode left ringing", o.Key, o.WorstResidualSwingDeg)
			}
		}
	}
	for _, k := range []string{"zv2_variable_speed", "zvd2_variable_speed", "ei2_variable_speed"} {
		if !seen[k] {
			t.Errorf("no option %s", k)
		}
	}
	if r.Recommended < 0 {
		t.Fatalf("nothing recommended: %v", r.Infeasible)
	}
	rec := r.Options[r.Recommended]
	if !rec.TwoMode || !strings.Contains(r.Reason, "the two sway modes") {
		t.Errorf("recommended %s (two-mode %v): %s", rec.Label, rec.TwoMode, r.Reason)
	}
	if len(r.Notes) == 0 || !strings.Contains(strings.Join(r.Notes, " "), "enough to matter") {
		t.Errorf("notes %q", r.Notes)
	}
	// The rope-error curve has a series for each two-mode shaper.
	names := map[string]bool{}
	for _, c := range r.Curves.RopeError.Series {
		names[c.Shaper] = true
	}
	if !names["zv2"] || !names["zvd2"] || !names["zv"] {
		t.Errorf("rope-error series %v", names)
	}
}

// A hook block far lighter than the load on short rigging is nearly the
// single pendulum of length rope plus rigging (the m1/m2 -> 0, L2 -> 0
// limit of the two-mass pendulum): the second mode carries almost nothing,
// the design period is within 1 % of the single pendulum's, and the
// recommendation is not pushed toward two-mode shapers.
func TestLightHookPlan(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	const rig = 0.8
	l := *s.Load.RopeLengthM - rig
	lo, hi := *s.Plan.RopeLengthMinM-rig, *s.Plan.RopeLengthMaxM-rig
	s.Load.RopeLengthM, s.Plan.RopeLengthMinM, s.Plan.RopeLengthMaxM = &l, &lo, &hi
	s.Load.Hook = &scenario.Hook{MassKg: ptr(150), RiggingLengthM: ptr(rig)}
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	single, err := Make(load(t, "plan-bay-travel.json"))
	if err != nil {
		t.Fatal(err)
	}
	for _, o := range r.Options {
		if o.TwoMode {
			t.Errorf("two-mode option %s offered for a second mode of %.2g %%", o.Key, 100*r.SecondModeShare)
		}
	}
	if r.SecondModeShare > MinSecondShare || math.Abs(r.DesignPeriodS/single.DesignPeriodS-1) > 0.01 {
		t.Errorf("share %v, design period %v, single %v", r.SecondModeShare, r.DesignPeriodS, single.DesignPeriodS)
	}
	if r.Recommended < 0 || !r.Options[r.Recommended].Within {
		t.Fatalf("recommended %d", r.Recommended)
	}
	if math.Abs(r.Options[r.Recommended].MoveTimeS-single.Options[single.Recommended].MoveTimeS) > 0.05*single.Options[single.Recommended].MoveTimeS {
		t.Errorf("light hook recommends %s (%g s), single %s (%g s)", r.Options[r.Recommended].Label, r.Options[r.Recommended].MoveTimeS,
			single.Options[single.Recommended].Label, single.Options[single.Recommended].MoveTimeS)
	}
}

func ptr(x float64) *float64 { return &x }

// The crew's own pendant steps under the heavy hook block are timed with
// both modes in view (each mode's residual vibration V, Singer & Seering
// 1990, weighted by its share of the load's swing), and four equal steps
// pressed exactly on their half-second cues then keep the simulated
// residual of both masses inside the example's limit.
func TestOwnPendantStepsTwoModes(t *testing.T) {
	s := load(t, "plan-precast-hook.json")
	s.Plan.Drive = scenario.DrivePendant
	s.Plan.PendantStepsPct = []float64{25, 50, 75, 100}
	s.Plan.TimingSigmaS = ptr(0)
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	for _, o := range r.Options {
		if o.Key != "own_pendant" {
			continue
		}
		if !o.TwoMode || len(o.ModeResidualPct) != 2 || !o.Within {
			t.Errorf("own steps: two-mode %v, mode residuals %v, outside %v", o.TwoMode, o.ModeResidualPct, o.Outside)
		}
		return
	}
	t.Fatal("no own_pendant option")
}
