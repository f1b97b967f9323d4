package sway_test

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/units"
)

// The double-pendulum reference results are computed independently of the
// core by testdata/reference/double.py: SciPy's solve_ivp with method
// DOP853 (Hairer, Norsett & Wanner's explicit 8(5,3) Runge-Kutta pair),
// rtol = atol = 1e-12, on a different formulation of the same physics
// (Cartesian positions of hook block and load with two distance
// constraints whose Lagrange multipliers are the rope and rigging
// tensions, Baumgarte stabilised, where the core integrates the two
// direction vectors with projection and solves for the tensions), and mode
// periods from numpy's eigenvalues of the linearised two-mass pendulum
// (where the core uses the closed form). SciPy 1.10.1 from Debian 12's
// python3-scipy; `make reference` regenerates the file.

const referenceDoubleFile = "../../testdata/reference/results_double.json"

type refDoubleSample struct {
	refSample
	RiggingTensionN float64 `json:"rigging_tension_n"`
}

type refDoubleResult struct {
	refResult
	ModePeriodsS [2]float64 `json:"mode_periods_s"`
	Rigging      struct {
		PeakRopeSwingDeg    float64 `json:"peak_rope_swing_deg"`
		PeakRiggingAngleDeg float64 `json:"peak_rigging_angle_deg"`
		RiggingTensionMaxN  float64 `json:"rigging_tension_max_n"`
		RiggingTensionMinN  float64 `json:"rigging_tension_min_n"`
	} `json:"rigging"`
	// Samples shadows the single rope's: each sample adds the rigging tension.
	Samples []refDoubleSample `json:"samples"`
}

// doubleTolerance is the largest accepted difference from the reference
// of each figure at one accuracy setting: angles in deg, lengths in m,
// tensions relative to the weight they carry.
type doubleTolerance struct {
	name, accuracy                string
	swingDeg, ropeDeg, rigDeg     float64 // line to the load; rope; rope to rigging
	excursionM                    float64
	tensionFactor, rigTension     float64
	samplePosM, sampleDeg, sample float64 // sample tension per weight
}

// Bounds: each 4 to 10 times the largest difference seen over the
// reference scenarios (go test -v -run TestReferenceDouble prints them;
// the README's validation table records them), far below anything a lift
// plan reads (0.01 deg, 1 mm, 0.1 % of the weight).
var doubleTolerances = []doubleTolerance{
	{name: "default", accuracy: "default", swingDeg: 5e-6, ropeDeg: 2e-5, rigDeg: 5e-5, excursionM: 1e-6,
		tensionFactor: 5e-8, rigTension: 2e-7, samplePosM: 2e-6, sampleDeg: 5e-6, sample: 5e-8},
	{name: "tight", accuracy: "tight", swingDeg: 5e-10, ropeDeg: 1e-9, rigDeg: 5e-9, excursionM: 1e-10,
		tensionFactor: 5e-12, rigTension: 2e-11, samplePosM: 2e-10, sampleDeg: 5e-10, sample: 5e-12},
}

// TestReferenceDouble compares the core's hook-block-and-rigging model with
// the independent SciPy solution at the default and the tight accuracy:
// peak and residual swing, peak excursion, tension factor, peak rigging
// angle and rigging tension, and sampled states.
func TestReferenceDouble(t *testing.T) {
	data, err := os.ReadFile(referenceDoubleFile)
	if err != nil {
		t.Fatalf("reading the reference results: %v", err)
	}
	var rf struct {
		Scenarios []struct {
			Scenario string          `json:"scenario"`
			Result   refDoubleResult `json:"result"`
		} `json:"scenarios"`
	}
	if err := json.Unmarshal(data, &rf); err != nil {
		t.Fatalf("decoding %s: %v", referenceDoubleFile, err)
	}
	if len(rf.Scenarios) < 3 {
		t.Fatalf("%s holds %d scenarios, want at least 3", referenceDoubleFile, len(rf.Scenarios))
	}
	for _, tol := range doubleTolerances {
		worst := map[string]float64{}
		for _, e := range rf.Scenarios {
			t.Run(tol.name+"/"+filepath.Base(e.Scenario), func(t *testing.T) {
				s := readScenario(t, e.Scenario)
				if s.Load.Hook == nil {
					t.Fatalf("%s has no hook block", e.Scenario)
				}
				res := evaluateAt(t, s, tol.accuracy)
				rg := res.Rigging
				if rg == nil {
					t.Fatal("no rigging block in the result")
				}
				ref := e.Result
				mg := res.StaticTensionN
				m2g := *s.Load.MassKg * units.StandardGravity
				check := checker(t, worst)
				// Mode periods: the core's closed form against numpy's eigenvalues.
				check("period_s", res.PeriodS, ref.PeriodS, 1e-10*ref.PeriodS)
				for i := range 2 {
					check(fmt.Sprintf("mode_periods_s[%d]", i), rg.ModePeriodsS[i], ref.ModePeriodsS[i], 1e-10*ref.ModePeriodsS[i])
				}
				check("run_s", res.RunS, ref.RunS, 1e-8)
				check("motion_end_s", res.MotionEndS, ref.MotionEndS, 1e-9)
				check("rope_length_end_m", res.RopeLengthEndM, ref.RopeLengthEndM, 1e-9)
				check("wind_force_n", res.WindForceN, ref.WindForceN, 1e-9*(1+ref.WindForceN))
				// Figures: source SciPy solve_ivp DOP853 (SciPy 1.10.1), rtol = atol = 1e-12.
				check("peak_swing_deg", res.PeakSwingDeg, ref.PeakSwingDeg, tol.swingDeg)
				check("residual_swing_deg", res.ResidualSwingDeg, ref.ResidualSwingDeg, tol.swingDeg)
				check("peak_excursion_m", res.PeakExcursionM, ref.PeakExcursionM, tol.excursionM)
				check("residual_excursion_m", res.ResidualExcursionM, ref.ResidualExcursionM, tol.excursionM)
				check("tension_factor", res.TensionFactor, ref.TensionFactor, tol.tensionFactor)
				check("tension_min/((m1+m2)*g)", res.TensionMinN/mg, ref.TensionMinN/mg, tol.tensionFactor)
				check("peak_rope_swing_deg", rg.PeakRopeSwingDeg, ref.Rigging.PeakRopeSwingDeg, tol.ropeDeg)
				check("peak_rigging_angle_deg", rg.PeakRiggingAngleDeg, ref.Rigging.PeakRiggingAngleDeg, tol.rigDeg)
				check("rigging_tension_max/(m2*g)", rg.RiggingTensionMaxN/m2g, ref.Rigging.RiggingTensionMaxN/m2g, tol.rigTension)
				check("rigging_tension_min/(m2*g)", rg.RiggingTensionMinN/m2g, ref.Rigging.RiggingTensionMinN/m2g, tol.rigTension)
				samples := make([]refSample, len(ref.Samples))
				for i, rs := range ref.Samples {
					samples[i] = rs.refSample
				}
				checkSamples(check, res.History, samples, "sample load from suspension (m)", "sample tension/((m1+m2)*g)", mg,
					tol.samplePosM, tol.sampleDeg, tol.sample)
			})
		}
		if testing.Verbose() {
			for _, k := range []string{"peak_swing_deg", "residual_swing_deg", "peak_excursion_m",
				"residual_excursion_m", "tension_factor", "tension_min/((m1+m2)*g)", "peak_rope_swing_deg",
				"peak_rigging_angle_deg", "rigging_tension_max/(m2*g)", "rigging_tension_min/(m2*g)",
				"sample load from suspension (m)", "sample swing_deg", "sample tension/((m1+m2)*g)", "mode_periods_s[1]", "run_s"} {
				t.Logf("%s accuracy: largest difference in %s: %.3g", tol.name, k, worst[k])
			}
		}
	}
}
