package sway

import (
	"math"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
)

// TestStoppedFastPathAgrees: a move cut by an emergency stop keeps the
// specialised single-rope path, and it agrees with the general one (as
// TestFastPathAgrees, 1e-8 of the rope on the load's path), for a plain
// move, a shaped one (several components frozen at the stop) and two
// moves at once.
func TestStoppedFastPathAgrees(t *testing.T) {
	for _, name := range []string{"bay-travel", "tower-slew", "diagonal-travel", "hoist-during-travel", "hard-stop", "pendant-steps"} {
		s := testscenario.Example(t, name)
		s.Plan, s.Site = nil, nil
		for _, at := range []float64{0.5, 3, 9} {
			d := *s
			d.Motions = append([]scenario.Motion(nil), s.Motions...)
			if at == 3 {
				d.Motions[0].Shaper = &scenario.ShaperSpec{Kind: "zvd"}
			}
			for i := range d.Motions {
				d.Motions[i].Stop = &scenario.StopCut{AtS: at, ReactionS: 1}
			}
			su, err := build(&d, true)
			if err != nil {
				t.Fatal(err)
			}
			if su.fast == nil {
				t.Fatalf("%s, stop at %g s: the specialised path was not taken", name, at)
			}
			fast, err := EvaluateWith(&d, Options{})
			if err != nil {
				t.Fatal(err)
			}
			gen, err := EvaluateWith(&d, Options{General: true})
			if err != nil {
				t.Fatal(err)
			}
			l := gen.RopeLengthStartM
			for i := range fast.History.TimeS {
				for _, p := range [][2]float64{{fast.History.RelXM[i], gen.History.RelXM[i]},
					{fast.History.RelYM[i], gen.History.RelYM[i]},
					{fast.History.SuspensionXM[i], gen.History.SuspensionXM[i]},
					{fast.History.SuspensionYM[i], gen.History.SuspensionYM[i]}} {
					if math.Abs(p[0]-p[1]) > 1e-8*l {
						t.Fatalf("%s, stop at %g s, sample %d: fast %g, general %g", name, at, i, p[0], p[1])
					}
				}
			}
		}
	}
}

// TestEmergencyStopPastTheCommand: a trolley running steadily at
// 0.67 m/s with the load hanging still, stopped with 1 s of reaction and
// 1.18 m/s² of braking: the trolley runs 0.67 m + 0.67²/(2*1.18) = 0.19 m
// past the stop command (any mechanics text), and the load swings on past
// the trolley by the residual of one braking phase of t_b = v/a,
// L*2*(a/g)*|sin(pi*t_b/T)|, T = 2*pi*sqrt(L/g) (linear theory of a
// constant-acceleration phase: standard result): on a 9.5 m rope 0.65 m,
// about 1.5 m in all. The simulation holds the trolley to 1e-9 m and the
// load to 1 % (the linear theory is a small-angle one; 0.1 % seen).
func TestEmergencyStopPastTheCommand(t *testing.T) {
	v, a, L, g := 0.67, 1.18, 9.5, 9.80665
	speed, brake, decel := v, 100.0, 1.0
	s := &scenario.Scenario{Format: "swaysheet-scenario", Version: 1, Name: "stop",
		Load: scenario.Load{MassKg: ptr(3000), RopeLengthM: &L}, Crane: scenario.Crane{Kind: "overhead"},
		Motions: []scenario.Motion{{Axis: "travel_x", Profile: scenario.ProfileHardStop, SpeedMPerS: &speed,
			DecelMPerS2: &decel, ProfileFields: scenario.ProfileFields{BrakeAtS: &brake},
			Stop: &scenario.StopCut{AtS: 2, ReactionS: 1, Decel: a}}},
		Settings: &scenario.Settings{DurationS: 30}}
	res, err := Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	h := res.History
	atCommand := v * 2
	trolley := h.SuspensionXM[len(h.SuspensionXM)-1] - atCommand
	if want := v*1 + v*v/(2*a); math.Abs(trolley-want) > 1e-9 {
		t.Errorf("the trolley runs %.6f m past the command, want %.6f", trolley, want)
	}
	load := math.Inf(-1)
	for _, x := range h.LoadXM {
		load = math.Max(load, x-atCommand)
	}
	tb, T := v/a, 2*math.Pi*math.Sqrt(L/g)
	swing := L * 2 * (a / g) * math.Abs(math.Sin(math.Pi*tb/T))
	if want := v*1 + v*v/(2*a) + swing; math.Abs(load-want) > 0.01*want {
		t.Errorf("the load reaches %.3f m past the command, want %.3f (swing %.3f)", load, want, swing)
	}
	t.Logf("trolley %.3f m, load %.3f m past the stop command (linear theory %.3f)", trolley, load, v+v*v/(2*a)+swing)
}

func ptr(v float64) *float64 { return &v }
