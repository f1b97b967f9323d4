package sway_test

import (
	"math"
	"path/filepath"
	"testing"
)

// TestFastDoubleAgrees holds the hook block's specialised path (the
// concrete two-mass model, fastdouble.go, on its own scan,
// fastdoublescan.go) against pendulum.Double on the general scanner
// (Options.General) on every example and reference scenario with a hook
// block, at the default and the tight accuracy. Both take the same steps
// of the same solver on the same equations in the same order of
// operations; they differ in how the suspension point's motion is summed
// (one polynomial per span rather than profile by profile, evaluated at
// the time itself rather than 1e-12 of it inside the segment), which
// moves the last bits, and in how a peak is found (the root of the rate on
// the dense output, rather than four samples a step and parabolic
// refinement, both on the same dense output). The steps taken must be
// the same, and the figures and sampled histories agree within 1e-11 of
// each figure's scale, millions of times below the reference tolerances
// of reference_double_test.go; the largest differences seen are 1.5e-12
// (a peak rigging angle) on the figures and 1.2e-13 on a sampled swing
// angle (go test -v prints them).
func TestFastDoubleAgrees(t *testing.T) {
	files := fastScenarios(t)
	more, err := filepath.Glob(filepath.Join("..", "..", "testdata", "reference", "double", "*.json"))
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range more {
		files = append(files, filepath.Join("testdata", "reference", "double", filepath.Base(f)))
	}
	worst := map[string]float64{}
	n := 0
	for _, acc := range []string{"default", "tight"} {
		for _, file := range files {
			s := readScenario(t, file)
			s.Plan = nil
			if s.Load.Hook == nil || s.Load.Body != nil {
				continue
			}
			if len(s.Motions) == 0 {
				continue // a planning request without moves of its own
			}
			n++
			fast, gen, rel := bothPaths(t, file, s, acc, "concrete", worst)
			if fast.Solver.Steps != gen.Solver.Steps || fast.Solver.Rejected != gen.Solver.Rejected {
				t.Errorf("%s (%s): concrete model took %d+%d steps, general %d+%d", file, acc,
					fast.Solver.Steps, fast.Solver.Rejected, gen.Solver.Steps, gen.Solver.Rejected)
			}
			compareResults(t, file, fast, gen, rel, 1e-11, 1e-11)
			fr, gr := fast.Rigging, gen.Rigging
			if fr == nil || gr == nil {
				t.Fatalf("%s: no rigging figures", file)
			}
			rel("peak_rope_swing_deg", fr.PeakRopeSwingDeg, gr.PeakRopeSwingDeg, math.Max(gr.PeakRopeSwingDeg, 1e-3), 1e-11)
			rel("peak_rigging_angle_deg", fr.PeakRiggingAngleDeg, gr.PeakRiggingAngleDeg, math.Max(gr.PeakRiggingAngleDeg, 1e-3), 1e-11)
			rel("rigging_tension_max_n", fr.RiggingTensionMaxN, gr.RiggingTensionMaxN, gen.StaticTensionN, 1e-11)
			rel("rigging_tension_min_n", fr.RiggingTensionMinN, gr.RiggingTensionMinN, gen.StaticTensionN, 1e-11)
		}
	}
	if n < 10 {
		t.Fatalf("only %d runs with a hook block compared", n)
	}
	for k, v := range worst {
		t.Logf("largest difference, %s: %.3g", k, v)
	}
}
