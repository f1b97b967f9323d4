package plan

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// TestPlannerAgainstReference checks the planner's own verification runs
// (tolerance RelTol, two periods of settling) against the independent SciPy
// solution of the same moves: testdata/reference/planned.py wrote the
// recommended option and one other shaped option of each planning example
// as testdata/reference/scenarios/planned-*.json at the nominal rope length
// and both range ends, and reference.py / double.py solved them
// (results.json, results_double.json; SciPy 1.10.1 solve_ivp DOP853, rtol =
// atol = 1e-12, Cartesian load with the rope tension as a Lagrange
// multiplier). The saved move must still be the planner's: a planner change
// needs `make planned` and `make reference`.
func TestPlannerAgainstReference(t *testing.T) {
	ref := map[string]map[string]float64{}
	for _, file := range []string{"results.json", "results_double.json"} {
		data, err := os.ReadFile("../../testdata/reference/" + file)
		if err != nil {
			t.Fatal(err)
		}
		var rf struct {
			Scenarios []struct {
				Scenario string         `json:"scenario"`
				Result   map[string]any `json:"result"`
			} `json:"scenarios"`
		}
		if err := json.Unmarshal(data, &rf); err != nil {
			t.Fatal(err)
		}
		for _, e := range rf.Scenarios {
			m := map[string]float64{}
			for k, v := range e.Result {
				if f, ok := v.(float64); ok {
					m[k] = f
				}
			}
			ref[filepath.Base(e.Scenario)] = m
		}
	}
	// Bounds for the recommended option's runs at CheckRelTol (the default
	// accuracy), about 10 times the largest differences seen at the
	// planner's former 1e-6 (1.1e-5 deg, 1.7e-6 m, 1.3e-8), and for the
	// other options' runs at RelTol = 1e-5, about 10 times the largest seen
	// there (1.2e-4 deg, 1.9e-5 m, 1.2e-7; printed with -v, recorded in the
	// README); all far below the plan limits they decide (0.5 deg and more).
	type bounds struct{ swingDeg, excursionM, tensionFactor float64 }
	checkTol, looseTol := bounds{1e-4, 1e-5, 1e-7}, bounds{1.5e-3, 2e-4, 2e-6}
	worst := map[string]float64{}
	compared := 0
	examples, err := filepath.Glob("../../testdata/scenarios/plan-*.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, ex := range examples {
		base := filepath.Base(ex)
		stem := strings.TrimSuffix(strings.TrimPrefix(base, "plan-"), ".json")
		s := load(t, base)
		res, err := Make(s)
		if err != nil {
			t.Fatalf("%s: %v", base, err)
		}
		for i, o := range res.Options {
			b := looseTol
			if i == res.Recommended {
				b = checkTol
			}
			vs := o.Verified
			if o.NotSimulated != "" {
				// Screened (screen.go): its move run here as the planner
				// would have run it, at RelTol.
				rq, _ := newRequest(s)
				for _, e := range o.Estimated {
					v, err := rq.simulate(&o.Motion, e.RopeLengthM, RelTol)
					if err != nil {
						t.Fatalf("%s %s: %v", base, o.Key, err)
					}
					vs = append(vs, v)
				}
			}
			for _, v := range vs {
				if v.Exact != nil {
					v = *v.Exact // a pendant option's move as planned (its Verified are percentiles)
				}
				name := fmt.Sprintf("planned-%s-%s-%sm.json", stem, strings.ReplaceAll(o.Key, "_", "-"),
					strings.ReplaceAll(fmt.Sprintf("%g", v.RopeLengthM), ".", "p"))
				path := "../../testdata/reference/scenarios/" + name
				if _, err := os.Stat(path); err != nil {
					continue // not one of the options written out
				}
				r, ok := ref[name]
				if !ok {
					t.Errorf("%s has no reference result: run make reference", name)
					continue
				}
				f, err := os.Open(path)
				if err != nil {
					t.Fatal(err)
				}
				sc, err := scenario.Decode(f)
				f.Close()
				if err != nil {
					t.Fatalf("%s: %v", name, err)
				}
				saved, _ := json.Marshal(sc.Motions[0])
				now, _ := json.Marshal(o.Motion)
				if string(saved) != string(now) {
					t.Errorf("%s: the saved move is no longer the planner's option %s: run make planned, then make reference", name, o.Key)
					continue
				}
				compared++
				check := func(what string, got, want, tol float64) {
					t.Helper()
					d := math.Abs(got - want)
					worst[what] = math.Max(worst[what], d)
					if !(d <= tol) {
						t.Errorf("%s, %s: planner %.9g, SciPy DOP853 reference %.9g: differ by %.3g, tolerance %.3g",
							name, what, got, want, d, tol)
					}
				}
				// Source: SciPy solve_ivp DOP853 (SciPy 1.10.1), rtol = atol = 1e-12.
				pre := "loose "
				if b == checkTol {
					pre = "check "
				}
				check(pre+"peak_swing_deg", v.PeakSwingDeg, r["peak_swing_deg"], b.swingDeg)
				check(pre+"residual_swing_deg", v.ResidualSwingDeg, r["residual_swing_deg"], b.swingDeg)
				check(pre+"peak_excursion_m", v.PeakExcursionM, r["peak_excursion_m"], b.excursionM)
				check(pre+"tension_factor", v.TensionFactor, r["tension_factor"], b.tensionFactor)
			}
		}
	}
	if compared < 12 {
		t.Errorf("compared %d planner runs with the reference, want at least 12", compared)
	}
	for _, pre := range []string{"check ", "loose "} {
		t.Logf("%d planner verification runs compared; largest differences (%sruns): peak swing %.3g deg, residual swing %.3g deg, peak excursion %.3g m, tension factor %.3g",
			compared, pre, worst[pre+"peak_swing_deg"], worst[pre+"residual_swing_deg"], worst[pre+"peak_excursion_m"], worst[pre+"tension_factor"])
	}
}
