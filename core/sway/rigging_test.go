package sway

import (
	"math"
	"strings"
	"testing"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

func withHook(s *scenario.Scenario, mHook, rigging float64) *scenario.Scenario {
	s.Load.Hook = &scenario.Hook{MassKg: f(mHook), RiggingLengthM: f(rigging)}
	return s
}

// Source: linearised two-mass pendulum (closed form in pendulum.LinearModes,
// checked there against gonum eigenvalues); the nonlinear model's free
// small-amplitude periods in each mode agree with it.
func TestRiggingModePeriods(t *testing.T) {
	s := withHook(still(6000, 10), 1200, 4)
	s.Motions = []scenario.Motion{move(0, 10, 0.5, 0.3, 0.3)}
	r := mustEval(t, s)
	rg := r.Rigging
	if rg == nil {
		t.Fatal("no rigging block in the result")
	}
	for i := range 2 {
		if rel := math.Abs(rg.SimulatedPeriodsS[i]/rg.ModePeriodsS[i] - 1); rel > 1e-4 {
			t.Errorf("mode %d: simulated %.6g s, linear %.6g s", i, rg.SimulatedPeriodsS[i], rg.ModePeriodsS[i])
		}
	}
	if r.PeriodS != rg.ModePeriodsS[0] {
		t.Errorf("period_s %v should be the slower mode %v", r.PeriodS, rg.ModePeriodsS[0])
	}
	if math.Abs(r.StaticTensionN/(7200*g)-1) > 1e-15 {
		t.Errorf("static tension %v", r.StaticTensionN)
	}
	if rg.PeakRiggingAngleDeg <= 0 || rg.RiggingTensionMaxN <= 6000*g*0.99 {
		t.Errorf("rigging figures %+v", rg)
	}
}

// A hook block far lighter than the load on short rigging behaves as a
// single pendulum of length rope plus rigging (the limit of the two-mass
// pendulum as m1/m2 -> 0 and L2 -> 0 with the sum fixed).
func TestLightHookTendsToSinglePendulum(t *testing.T) {
	single := still(8000, 8.5)
	single.Motions = []scenario.Motion{move(1, 18, 0.5, 0.25, 0.25)}
	a := mustEval(t, single)
	double := withHook(still(8000, 8.2), 2, 0.3)
	double.Motions = single.Motions
	b := mustEval(t, double)
	compareFigures(t, a, b, 4, 0.01)
	if b.Rigging.SecondModeShare > 0.01 {
		t.Errorf("second mode share %v", b.Rigging.SecondModeShare)
	}
	for _, w := range b.Warnings {
		if strings.Contains(w, "two ways at once") {
			t.Errorf("unexpected warning %q", w)
		}
	}
}

// A heavy hook block with a light load on long slings brings in the second
// mode, and the result says so.
func TestHeavyHookWarnsOfSecondMode(t *testing.T) {
	s := withHook(still(800, 6), 1500, 5)
	s.Motions = []scenario.Motion{move(0, 10, 0.5, 0.3, 0.3)}
	r := mustEval(t, s)
	found := false
	for _, w := range r.Warnings {
		found = found || strings.Contains(w, "two ways at once")
	}
	if r.Rigging.SecondModeShare < SecondModeWarnShare || !found {
		t.Errorf("share %v, warnings %q", r.Rigging.SecondModeShare, r.Warnings)
	}
}

// Source: static equilibrium of the two-mass pendulum under a steady
// horizontal force F on the load: the rigging leans atan(F/(m2 g)), the
// rope atan(F/((m1+m2) g)). After a gust from calm the load swings about
// that equilibrium; over many periods the mean lean of the line from the
// suspension point to the load is wind_lean_deg (to first order in the
// swing, which is symmetric about the equilibrium in linear theory).
func TestRiggingWindLean(t *testing.T) {
	s := withHook(still(3000, 10), 1000, 4)
	s.Wind = &scenario.Wind{ForceN: f(2000)}
	s.Settings = &scenario.Settings{DurationS: 900, Samples: 4501}
	r := mustEval(t, s)
	h := r.History
	var sum float64
	var n int
	for i := range h.TimeS {
		if h.TimeS[i] >= 300 {
			sum += math.Atan2(math.Hypot(h.RelXM[i], h.RelYM[i]), -h.RelZM[i]) * 180 / math.Pi
			n++
		}
	}
	if got := sum / float64(n); math.Abs(got-r.WindLeanDeg) > 0.02 {
		t.Errorf("mean lean %.5f deg, wind_lean_deg %.5f deg", got, r.WindLeanDeg)
	}
	if single := math.Atan(2000/(3000*g)) * 180 / math.Pi; r.WindLeanDeg >= single {
		t.Errorf("lean %.4f deg should be below the load-only lean %.4f deg", r.WindLeanDeg, single)
	}
}

// TestModePeriodSpecialised: the mode periods measured on fastDouble at
// rest are pendulum.Double's to the bit (the same equations in the same
// order; the suspension point's spans are all zero). Invented hook blocks
// and loads, demo values only.
func TestModePeriodSpecialised(t *testing.T) {
	for _, c := range []struct{ m1, m2, l1, l2 float64 }{
		{1200, 800, 24, 6}, {300, 5000, 12, 2.5}, {2500, 2500, 40, 9},
	} {
		md := pendulum.LinearModes(c.m1, c.m2, c.l1, c.l2, units.StandardGravity)
		for i := range 2 {
			fast, err := modePeriod(c.m1, c.m2, c.l1, c.l2, md.Shape[i], md.Omega[i])
			if err != nil {
				t.Fatal(err)
			}
			general := &pendulum.Double{M1: c.m1, M2: c.m2, L2: c.l2,
				Suspension: func(float64) pendulum.Kinematics { return pendulum.Kinematics{} },
				Rope:       func(float64) (float64, float64, float64) { return c.l1, 0, 0 },
			}
			want, err := modePeriodOf(general, md.Shape[i], md.Omega[i])
			if err != nil {
				t.Fatal(err)
			}
			if fast != want {
				t.Errorf("%+v mode %d: specialised %.17g s, pendulum.Double %.17g s", c, i, fast, want)
			}
		}
	}
}
