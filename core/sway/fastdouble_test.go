package sway_test

import (
	"math"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestFastDoubleAgrees holds the concrete two-mass model (fastdouble.go)
// against pendulum.Double (Options.General) on every example and
// reference scenario with a hook block, at the default and the tight
// accuracy. Both run on the same scanner and solver with the same
// equations in the same order of operations; they differ only in how the
// suspension point's motion is summed (one polynomial per span rather
// than profile by profile), which moves the last bits of its position,
// speed and acceleration. The steps taken must be the same, and the
// figures and sampled histories agree within 1e-11 of each figure's
// scale, millions of times below the reference tolerances of
// reference_double_test.go; the largest differences seen are 5.9e-13 (a
// peak rigging angle) on the figures and 1.2e-13 on a sampled swing angle
// (go test -v prints them).
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
			if s.Settings == nil {
				s.Settings = &scenario.Settings{}
			}
			s.Settings.Accuracy = acc
			fast, err := sway.EvaluateWith(s, sway.Options{})
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			gen, err := sway.EvaluateWith(s, sway.Options{General: true})
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			rel := func(name string, a, b, scale, bound float64) {
				d := math.Abs(a-b) / scale
				worst[acc+" "+name] = math.Max(worst[acc+" "+name], d)
				if !(d <= bound) {
					t.Errorf("%s (%s): %s concrete %.17g, general %.17g: differ by %.3g of %.3g, above %.3g", file, acc, name, a, b, d, scale, bound)
				}
			}
			if fast.Solver.Steps != gen.Solver.Steps || fast.Solver.Rejected != gen.Solver.Rejected {
				t.Errorf("%s (%s): concrete model took %d+%d steps, general %d+%d", file, acc,
					fast.Solver.Steps, fast.Solver.Rejected, gen.Solver.Steps, gen.Solver.Rejected)
			}
			swing := math.Max(gen.PeakSwingDeg, 1e-3)
			rel("peak_swing_deg", fast.PeakSwingDeg, gen.PeakSwingDeg, swing, 1e-11)
			rel("residual_swing_deg", fast.ResidualSwingDeg, gen.ResidualSwingDeg, swing, 1e-11)
			exc := math.Max(gen.PeakExcursionM, 1e-3)
			rel("peak_excursion_m", fast.PeakExcursionM, gen.PeakExcursionM, exc, 1e-11)
			rel("residual_excursion_m", fast.ResidualExcursionM, gen.ResidualExcursionM, exc, 1e-11)
			rel("tension_max_n", fast.TensionMaxN, gen.TensionMaxN, gen.StaticTensionN, 1e-11)
			rel("tension_min_n", fast.TensionMinN, gen.TensionMinN, gen.StaticTensionN, 1e-11)
			fr, gr := fast.Rigging, gen.Rigging
			if fr == nil || gr == nil {
				t.Fatalf("%s: no rigging figures", file)
			}
			rel("peak_rope_swing_deg", fr.PeakRopeSwingDeg, gr.PeakRopeSwingDeg, math.Max(gr.PeakRopeSwingDeg, 1e-3), 1e-11)
			rel("peak_rigging_angle_deg", fr.PeakRiggingAngleDeg, gr.PeakRiggingAngleDeg, math.Max(gr.PeakRiggingAngleDeg, 1e-3), 1e-11)
			rel("rigging_tension_max_n", fr.RiggingTensionMaxN, gr.RiggingTensionMaxN, gen.StaticTensionN, 1e-11)
			rel("rigging_tension_min_n", fr.RiggingTensionMinN, gr.RiggingTensionMinN, gen.StaticTensionN, 1e-11)
			h, g := fast.History, gen.History
			if len(h.TimeS) != len(g.TimeS) {
				t.Fatalf("%s: %d history samples, general %d", file, len(h.TimeS), len(g.TimeS))
			}
			for i := range h.TimeS {
				l := gen.RopeLengthStartM
				rel("history rel_x_m", h.RelXM[i], g.RelXM[i], l, 1e-11)
				rel("history rel_y_m", h.RelYM[i], g.RelYM[i], l, 1e-11)
				rel("history rel_z_m", h.RelZM[i], g.RelZM[i], l, 1e-11)
				rel("history swing_deg", h.SwingDeg[i], g.SwingDeg[i], swing, 1e-11)
				rel("history tension_n", h.TensionN[i], g.TensionN[i], gen.StaticTensionN, 1e-11)
				rel("history suspension_x_m", h.SuspensionXM[i], g.SuspensionXM[i], 1, 1e-11)
				rel("history suspension_y_m", h.SuspensionYM[i], g.SuspensionYM[i], 1, 1e-11)
			}
		}
	}
	if n < 10 {
		t.Fatalf("only %d runs with a hook block compared", n)
	}
	for k, v := range worst {
		t.Logf("largest difference, %s: %.3g", k, v)
	}
}
