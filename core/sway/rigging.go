package sway

import (
	"fmt"
	"math"

	"swaysheet/core/crane"
	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// Rigging reports the hook block and rigging when a scenario models them
// as a second mass.
type Rigging struct {
	_ [0]func() // never compared: no equality code in the wasm
	// ModePeriodsS are the two small-swing periods of the linearised
	// two-mass pendulum at the rope length at the end of the run, slower
	// mode first.
	ModePeriodsS [2]float64 `json:"mode_periods_s"`
	// SimulatedPeriodsS are the same periods measured on the nonlinear
	// model, released from rest in each mode shape at 0.05 deg.
	SimulatedPeriodsS [2]float64 `json:"simulated_periods_s"`
	// SecondModeShare is the second mode's share of the load's swing after
	// a sudden acceleration (linear theory), 0 to 1.
	SecondModeShare float64 `json:"second_mode_share"`
	// PeakRopeSwingDeg is the largest angle of the rope itself from the
	// vertical (peak_swing_deg is the line from suspension point to load).
	PeakRopeSwingDeg float64 `json:"peak_rope_swing_deg"`
	// PeakRiggingAngleDeg is the largest angle between rope and rigging:
	// the swing of the load relative to the hook.
	PeakRiggingAngleDeg float64 `json:"peak_rigging_angle_deg"`
	RiggingTensionMaxN  float64 `json:"rigging_tension_max_n"`
	RiggingTensionMinN  float64 `json:"rigging_tension_min_n"`
}

// SecondModeWarnShare is the second mode's share of the load's swing from
// which a warning says it matters for the plan.
const SecondModeWarnShare = 0.05

// modes returns the linear modes of a scenario with a hook block at rope
// length l1.
func modes(h *scenario.Hook, massLoad, l1 float64) pendulum.Modes {
	return pendulum.LinearModes(*h.MassKg, massLoad, l1, *h.RiggingLengthM, units.StandardGravity)
}

// modePeriod measures the period of one mode on the nonlinear model with a
// fixed suspension point: released from rest in the mode shape at a small
// angle, the time between up-crossings of the hook's horizontal speed.
//
// The model is fastDouble on a crane that does not move (no axis has a
// move: every span is zero, the rope at l1): pendulum.Double's equations
// in the same order, with a suspension point at rest, without a closure
// call for the suspension point and the rope at every evaluation
// (TestModePeriodSpecialised holds the two to the bit), integrated by
// doubleSolver in place of ode.Solver.
func modePeriod(m1, m2, l1, l2 float64, shape [2]float64, omega float64) (float64, error) {
	d := newFastDouble(newFastModel(&crane.Drives{}, l1, crane.Start{}, m2, nil), m1, m2, l2, units.StandardGravity)
	return modePeriodOf(d, shape, omega)
}

// modePeriodOf is modePeriod on the given two-mass model: fastDouble on
// doubleSolver, any other on pendulum.CrossingPeriod's ode.Solver.
func modePeriodOf(d pendulum.System, shape [2]float64, omega float64) (float64, error) {
	// Scale so that the larger of the two angles is 0.05 deg.
	a := 0.05 * units.Degree / math.Max(math.Abs(shape[0]), math.Abs(shape[1]))
	th1, th2 := a*shape[0], a*shape[1]
	y := []float64{math.Sin(th1), 0, -math.Cos(th1), 0, 0, 0, math.Sin(th2), 0, -math.Cos(th2), 0, 0, 0}
	// The rope's rate u1x crosses zero from below at the far turning point
	// of each cycle.
	tEnd := 20 * 2 * math.Pi / omega
	var p float64
	var err error
	if fd, ok := d.(*fastDouble); ok {
		v := newDoubleSolver(fd, pendulum.PeriodSettings())
		v.reset(0, (*[12]float64)(y))
		p, err = pendulum.CrossingPeriodOn(&v, fd.Project, 3, 3, tEnd)
	} else {
		p, err = pendulum.CrossingPeriod(d, y, 3, 3, tEnd)
	}
	if err != nil {
		return 0, fmt.Errorf("sway: the mode's period: %w", err)
	}
	return p, nil
}

// rigging fills the hook-and-rigging figures and their warning.
func rigging(s *scenario.Scenario, sc *peaks, ropeEnd float64, res *Result, measure bool) error {
	h := s.Load.Hook
	md := modes(h, *s.Load.MassKg, ropeEnd)
	rg := &Rigging{
		SecondModeShare:     md.LoadShare[1],
		PeakRiggingAngleDeg: swingRad(sc.ext[qRigAngle].max) / units.Degree,
		RiggingTensionMaxN:  sc.ext[qRigTension].max,
		RiggingTensionMinN:  -sc.ext[qRigTensionLow].max,
	}
	for i := range 2 {
		rg.ModePeriodsS[i] = 2 * math.Pi / md.Omega[i]
		if !measure {
			continue
		}
		p, err := modePeriod(*h.MassKg, *s.Load.MassKg, ropeEnd, *h.RiggingLengthM, md.Shape[i], md.Omega[i])
		if err != nil {
			return err
		}
		rg.SimulatedPeriodsS[i] = p
	}
	rg.PeakRopeSwingDeg = swingRad(sc.ext[qRopeSwing].max) / units.Degree
	res.Rigging = rg
	if rg.SecondModeShare >= SecondModeWarnShare {
		res.warn(words.Say(fmt.Sprintf("The hook block and rigging swing in two ways at once: a slow swing of {0} and a quick one of {1}. The quick one carries about %.0f %% of the load's swing, enough to matter: a drive setting tuned to one swing time leaves the other going.",
			100*rg.SecondModeShare), words.Time(rg.ModePeriodsS[0]), words.Time(rg.ModePeriodsS[1])))
	}
	return nil
}
