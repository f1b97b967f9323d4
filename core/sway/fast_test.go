package sway_test

import (
	"math"
	"path/filepath"
	"reflect"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// fastScenarios are every example and every reference scenario.
func fastScenarios(t *testing.T) []string {
	var files []string
	for _, dir := range []string{"testdata/scenarios", "testdata/reference/scenarios"} {
		fs, err := filepath.Glob(filepath.Join("..", "..", dir, "*.json"))
		if err != nil {
			t.Fatal(err)
		}
		for _, f := range fs {
			files = append(files, filepath.Join(dir, filepath.Base(f)))
		}
	}
	return files
}

// TestFastPathAgrees holds the specialised single-rope path (fast.go)
// against the general path on every example and reference scenario, at
// the default and the tight accuracy. The two take the same steps on the
// same equations; they differ in rounding (the suspension point's motion
// summed as one polynomial per span rather than profile by profile; the
// model evaluated at the time itself rather than 1e-12 of it inside the
// segment; the step control's powers) and in how a peak is found (from
// the rate at the ends of each step and the root of the rate, rather than
// four samples per step and parabolic interpolation, both on the same
// dense output). The bounds are relative, 1e-9 of each figure and 1e-8 of
// the sampled histories, thousands of times below the reference
// tolerances of reference_test.go; the largest differences seen are
// 7.5e-11 on the figures and 3.4e-10 on a sampled swing angle (go test -v
// prints them).
func TestFastPathAgrees(t *testing.T) {
	worst := map[string]float64{}
	for _, acc := range []string{"default", "tight"} {
		for _, file := range fastScenarios(t) {
			s := readScenario(t, file)
			if s.Plan != nil {
				s.Plan = nil
			}
			if s.Load.Hook != nil {
				continue // the general path only
			}
			fast, gen, rel := bothPaths(t, file, s, acc, "fast", worst)
			// Step sizes follow the error estimate continuously, so rounding
			// moves a segment's last steps now and then (at the tight
			// accuracy, a few steps in a thousand).
			if d := fast.Solver.Steps - gen.Solver.Steps; d*d > (3+gen.Solver.Steps/200)*(3+gen.Solver.Steps/200) {
				t.Errorf("%s (%s): fast path took %d+%d steps, general %d+%d", file, acc, fast.Solver.Steps, fast.Solver.Rejected, gen.Solver.Steps, gen.Solver.Rejected)
			}
			compareResults(t, file, fast, gen, rel, 1e-9, 1e-8)
		}
	}
	for k, v := range worst {
		t.Logf("largest difference, %s: %.3g", k, v)
	}
}

// TestPathOnlyKeepsTheHistories: with Options.PathOnly (the clearance
// runs) the specialised path skips the peak search and gives the same time
// histories, bit for bit, as the full evaluation, on every example and
// reference scenario.
func TestPathOnlyKeepsTheHistories(t *testing.T) {
	for _, file := range fastScenarios(t) {
		s := readScenario(t, file)
		s.Plan = nil
		full, err := sway.EvaluateWith(s, sway.Options{})
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		path, err := sway.EvaluateWith(s, sway.Options{PathOnly: true})
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		if !reflect.DeepEqual(full.History, path.History) || !reflect.DeepEqual(full.Body, path.Body) || len(full.History.TimeS) == 0 {
			t.Errorf("%s: the histories differ with PathOnly", file)
		}
	}
}

// compareResults holds two results of one scenario together through rel
// (name, the two values, the scale the difference is taken against, the
// bound): the figures within figBound of their scale, every history
// sample within histBound.
func compareResults(t *testing.T, file string, fast, gen *sway.Result, rel func(name string, a, b, scale, bound float64), figBound, histBound float64) {
	t.Helper()
	swing := math.Max(gen.PeakSwingDeg, 1e-3)
	rel("peak_swing_deg", fast.PeakSwingDeg, gen.PeakSwingDeg, swing, figBound)
	rel("residual_swing_deg", fast.ResidualSwingDeg, gen.ResidualSwingDeg, swing, figBound)
	exc := math.Max(gen.PeakExcursionM, 1e-3)
	rel("peak_excursion_m", fast.PeakExcursionM, gen.PeakExcursionM, exc, figBound)
	rel("residual_excursion_m", fast.ResidualExcursionM, gen.ResidualExcursionM, exc, figBound)
	rel("tension_max_n", fast.TensionMaxN, gen.TensionMaxN, gen.StaticTensionN, figBound)
	rel("tension_min_n", fast.TensionMinN, gen.TensionMinN, gen.StaticTensionN, figBound)
	h, g := fast.History, gen.History
	if len(h.TimeS) != len(g.TimeS) {
		t.Fatalf("%s: %d history samples, general %d", file, len(h.TimeS), len(g.TimeS))
	}
	for i := range h.TimeS {
		l := gen.RopeLengthStartM
		rel("history rel_x_m", h.RelXM[i], g.RelXM[i], l, histBound)
		rel("history rel_y_m", h.RelYM[i], g.RelYM[i], l, histBound)
		rel("history rel_z_m", h.RelZM[i], g.RelZM[i], l, histBound)
		rel("history swing_deg", h.SwingDeg[i], g.SwingDeg[i], swing, histBound)
		rel("history tension_n", h.TensionN[i], g.TensionN[i], gen.StaticTensionN, histBound)
		rel("history suspension_x_m", h.SuspensionXM[i], g.SuspensionXM[i], 1, histBound)
		rel("history suspension_y_m", h.SuspensionYM[i], g.SuspensionYM[i], 1, histBound)
	}
}

// bothPaths evaluates s at the accuracy acc on its own path and on the
// general path, and returns both with the comparison compareResults
// uses: the relative difference of a figure against its scale, kept in
// worst by accuracy and name, an error above the bound (what names the
// own path in the message).
func bothPaths(t *testing.T, file string, s *scenario.Scenario, acc, what string, worst map[string]float64) (own, gen *sway.Result, rel func(name string, a, b, scale, bound float64)) {
	t.Helper()
	if s.Settings == nil {
		s.Settings = &scenario.Settings{}
	}
	s.Settings.Accuracy = acc
	own, err := sway.EvaluateWith(s, sway.Options{})
	if err != nil {
		t.Fatalf("%s: %v", file, err)
	}
	gen, err = sway.EvaluateWith(s, sway.Options{General: true})
	if err != nil {
		t.Fatalf("%s: %v", file, err)
	}
	rel = func(name string, a, b, scale, bound float64) {
		d := math.Abs(a-b) / scale
		if d > worst[acc+" "+name] {
			worst[acc+" "+name] = d
		}
		if !(d <= bound) {
			t.Errorf("%s (%s): %s %s %.17g, general %.17g: differ by %.3g of %.3g, above %.3g", file, acc, name, what, a, b, d, scale, bound)
		}
	}
	return own, gen, rel
}
