package plan

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// withoutScreening plans s with every option simulated and every drawn
// timing of a pendant option used (as the planner did before screening).
func withoutScreening(t *testing.T, s *scenario.Scenario) *Result {
	t.Helper()
	screening = false
	defer func() { screening = true }()
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// screeningCases are the planning examples (invented demo data) and
// variants of them: a pendant, an S-curve drive, a narrower rope range, a
// looser residual limit, a steady wind.
func screeningCases(t *testing.T) map[string]*scenario.Scenario {
	cases := map[string]*scenario.Scenario{}
	for _, n := range []string{"plan-bay-travel.json", "plan-tower-slew.json", "plan-precast-hook.json", "plan-gantry-pendant.json"} {
		cases[n] = load(t, n)
	}
	s := load(t, "plan-bay-travel.json")
	s.Plan.Drive, s.Plan.PendantStepsPct = scenario.DrivePendant, []float64{50, 100}
	cases["bay travel, pendant 50/100"] = s
	s = load(t, "plan-bay-travel.json")
	s.Plan.SCurveMaxRoundingS = 6
	cases["bay travel, S-curve drive"] = s
	s = load(t, "plan-tower-slew.json")
	lo, hi := 27.0, 29.0
	s.Plan.RopeLengthMinM, s.Plan.RopeLengthMaxM = &lo, &hi
	cases["tower slew, narrow range"] = s
	s = load(t, "plan-precast-hook.json")
	s.Limits.ResidualSwingDeg = ptr(1)
	cases["precast hook, 1 deg residual"] = s
	s = load(t, "plan-bay-travel.json")
	s.Wind = &scenario.Wind{ForceN: ptr(150)} // no linear screen: move time and the rules only
	cases["bay travel, steady wind"] = s
	return cases
}

// Screening (screen.go) changes what is simulated, never the advice: on
// every example and variant the recommended option (its move and its
// verdict) is the one planning with every option simulated gives; every
// option screened out by linear theory as clearly outside is outside in
// that plan's simulation; every simulated option has the same verdict; and
// a screened option is slower than the window of the recommendation,
// clearly outside, or of a kind the recommendation's rules put behind a
// faster option within the limits.
func TestScreeningKeepsRecommendation(t *testing.T) {
	for name, s := range screeningCases(t) {
		full := withoutScreening(t, s)
		r, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		if r.Recommended != full.Recommended {
			t.Fatalf("%s: recommended %d, without screening %d", name, r.Recommended, full.Recommended)
		}
		if r.Recommended >= 0 {
			a, b := r.Options[0], full.Options[0]
			ma, _ := json.Marshal(a.Motion)
			mb, _ := json.Marshal(b.Motion)
			if a.Key != b.Key || string(ma) != string(mb) || a.NotSimulated != "" {
				t.Errorf("%s: recommends %s, without screening %s", name, a.Key, b.Key)
			}
		}
		if len(r.Options) != len(full.Options) {
			t.Errorf("%s: %d options, without screening %d", name, len(r.Options), len(full.Options))
		}
		byKey := map[string]Option{}
		for _, o := range full.Options {
			byKey[o.Key] = o
		}
		screened := 0
		fastestWithin := math.Inf(1)
		for _, o := range r.Options {
			if o.Within && o.NotSimulated == "" {
				fastestWithin = math.Min(fastestWithin, o.MoveTimeS)
			}
		}
		for _, o := range r.Options {
			f, ok := byKey[o.Key]
			if !ok {
				t.Errorf("%s: option %s not in the plan without screening", name, o.Key)
				continue
			}
			switch {
			case o.NotSimulated == outsideWhy:
				screened++
				if f.Within {
					t.Errorf("%s %s: screened as clearly outside, but within when simulated", name, o.Key)
				}
			case strings.HasPrefix(o.NotSimulated, preferredWhy):
				screened++ // choose's class rules: checked by the same recommendation above
			case o.NotSimulated != "":
				screened++
				if r.Recommended < 0 || o.MoveTimeS <= windowFactor*fastestWithin {
					t.Errorf("%s %s: screened by its move time %g s", name, o.Key, o.MoveTimeS)
				}
			case o.Within != f.Within:
				t.Errorf("%s %s: within %v, without screening %v", name, o.Key, o.Within, f.Within)
			}
		}
		t.Logf("%s: %d of %d options screened; %d simulations, %d without screening", name, screened, len(r.Options), r.Simulations, full.Simulations)
	}
}

// The linear-theory estimate of a screened option is near its simulation
// on the bay-travel example (per-piece exact solution of the small-angle
// pendulum; the simulation is the core's nonlinear model): within 0.05 deg
// on peak and residual swing at every rope length.
func TestEstimateNearSimulation(t *testing.T) {
	s := load(t, "plan-bay-travel.json")
	full := withoutScreening(t, s)
	r, err := Make(s)
	if err != nil {
		t.Fatal(err)
	}
	for _, o := range r.Options {
		if o.NotSimulated == "" {
			continue
		}
		f := optionByKey(t, full, o.Key)
		for i, e := range o.Estimated {
			v := f.Verified[i]
			if math.Abs(e.PeakSwingDeg-v.PeakSwingDeg) > 0.05 || math.Abs(e.ResidualSwingDeg-v.ResidualSwingDeg) > 0.05 {
				t.Errorf("%s at %g m: estimate peak %.4f residual %.4f deg, simulated %.4f, %.4f", o.Key, e.RopeLengthM,
					e.PeakSwingDeg, e.ResidualSwingDeg, v.PeakSwingDeg, v.ResidualSwingDeg)
			}
		}
	}
}

// A pendant option's drawn timings: on one rope without wind only those
// whose linear-theory estimate can reach the 90th percentile are simulated
// (draws.go), and the figures are then the percentile of all 40 exactly,
// the same as with every draw simulated; fewer than 40 are simulated, the
// findings say so, and planning twice gives the same figures (seeded
// draws).
func TestTimingDrawsByLinearTheory(t *testing.T) {
	for _, name := range []string{"plan-gantry-pendant.json", "bay travel, pendant 50/100"} {
		s := screeningCases(t)[name]
		full := withoutScreening(t, s)
		r, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		again, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		o, f, o2 := optionByKey(t, r, "own_pendant"), optionByKey(t, full, "own_pendant"), optionByKey(t, again, "own_pendant")
		if o.Within != f.Within {
			t.Errorf("%s: within %v, with all draws %v", name, o.Within, f.Within)
		}
		for i, v := range o.Verified {
			w := f.Verified[i]
			if v.Draws != TimingDraws || w.Draws != TimingDraws || v.simulated >= TimingDraws || v.simulated < TimingDraws/10 {
				t.Errorf("%s at %g m: %d draws, %d simulated (all: %d)", name, v.RopeLengthM, v.Draws, v.simulated, w.Draws)
			}
			if v.PeakSwingDeg != w.PeakSwingDeg || v.ResidualSwingDeg != w.ResidualSwingDeg ||
				v.PeakExcursionM != w.PeakExcursionM || v.ResidualExcursionM != w.ResidualExcursionM {
				t.Errorf("%s at %g m: p90 peak %.4f deg, residual %.4f deg from %d draws simulated; %.4f, %.4f with all 40",
					name, v.RopeLengthM, v.PeakSwingDeg, v.ResidualSwingDeg, v.simulated, w.PeakSwingDeg, w.ResidualSwingDeg)
			}
			// The tension factor (no limit) follows the swing's draws: seen
			// low by up to 4e-5 (draws.go).
			if d := w.TensionFactor - v.TensionFactor; d < 0 || d > 1e-4 {
				t.Errorf("%s at %g m: p90 tension factor %.6f, %.6f with all 40", name, v.RopeLengthM, v.TensionFactor, w.TensionFactor)
			}
			if o2.Verified[i].ResidualSwingDeg != v.ResidualSwingDeg || o2.Verified[i].simulated != v.simulated {
				t.Errorf("%s at %g m: not reproducible", name, v.RopeLengthM)
			}
			t.Logf("%s at %g m: residual p90 %.4f deg, tension factor %.6f, %d of 40 draws simulated; %.4f, %.6f with all 40", name, v.RopeLengthM, v.ResidualSwingDeg, v.TensionFactor, v.simulated, w.ResidualSwingDeg, w.TensionFactor)
		}
		if !strings.Contains(strings.Join(o.Findings, " "), "whose linear-theory estimate could reach the percentile simulated") {
			t.Errorf("%s: findings do not say which draws were simulated: %q", name, o.Findings)
		}
	}
}
