package sway_test

import (
	"math"
	"testing"

	"swaysheet/core/scenario"
)

// TestRigidTravelAgrees holds the rigid loads' suspension point and rope
// from span tables (pendulum.Travel) against the closures over the
// combined profiles (Options.General), on every example and reference
// scenario with a rigid load, at the default and the tight accuracy, and
// on the tandem beam with a hoist and a cross-travel move added (every
// table in use). The two differ in rounding only (the motion summed as one
// polynomial per span rather than profile by profile): the bounds are
// TestFastPathAgrees', relative, 1e-9 of each figure and 1e-8 of the
// sampled histories, the load's own figures and series included; the
// largest differences seen are printed by go test -v.
func TestRigidTravelAgrees(t *testing.T) {
	worst := map[string]float64{}
	hoisted := false
	for _, acc := range []string{"default", "tight"} {
		for _, file := range fastScenarios(t) {
			s := readScenario(t, file)
			if s.Load.Body == nil {
				continue
			}
			s.Plan = nil
			check := func(s *scenario.Scenario, name string) {
				own, gen, rel := bothPaths(t, name, s, acc, "travel", worst)
				compareResults(t, name, own, gen, rel, 1e-9, 1e-8)
				b, g := own.Body, gen.Body
				deg := math.Max(g.PeakTiltDeg+g.PeakTwistDeg, 1e-3)
				rel("body peak_tilt_deg", b.PeakTiltDeg, g.PeakTiltDeg, deg, 1e-9)
				rel("body peak_twist_deg", b.PeakTwistDeg, g.PeakTwistDeg, deg, 1e-9)
				rel("body peak_corner_swing_m", b.PeakCornerSwingM, g.PeakCornerSwingM, math.Max(g.PeakCornerSwingM, 1e-3), 1e-9)
				rel("body leg_tension_max_n", b.LegTensionMaxN, g.LegTensionMaxN, g.LegTensionMaxN, 1e-9)
				rel("body leg_tension_min_n", b.LegTensionMinN, g.LegTensionMinN, g.LegTensionMaxN, 1e-9)
				h, k := b.History, g.History
				for i := range h.TiltDeg {
					rel("body history tilt_deg", h.TiltDeg[i], k.TiltDeg[i], deg, 1e-8)
					rel("body history twist_deg", h.TwistDeg[i], k.TwistDeg[i], deg, 1e-8)
					for c := range h.CornerXM {
						rel("body history corner_x_m", h.CornerXM[c][i], k.CornerXM[c][i], 1, 1e-8)
						rel("body history corner_z_m", h.CornerZM[c][i], k.CornerZM[c][i], 1, 1e-8)
					}
					for l := range h.LegTensionN {
						rel("body history leg_tension_n", h.LegTensionN[l][i], k.LegTensionN[l][i], g.LegTensionMaxN, 1e-8)
					}
				}
			}
			check(s, file)
			if len(s.Motions) > 0 && s.Load.Body.Tandem != nil {
				// The hoist and the cross-travel in use too.
				m := s.Motions[0]
				up, across := m, m
				lift, side := 0.5, 1.5
				up.Axis, up.DistanceM, up.StartS = "hoist", &lift, m.StartS+2
				across.Axis, across.DistanceM, across.StartS = "travel_y", &side, m.StartS+4
				s.Motions = append(s.Motions, up, across)
				check(s, file+" with a hoist and a cross-travel")
				hoisted = true
			}
		}
	}
	if !hoisted {
		t.Error("no rigid example with a tandem lift and a move: the hoist's table went untested")
	}
	for k, v := range worst {
		t.Logf("largest difference, %s: %.3g", k, v)
	}
}
