package sway

import (
	"errors"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// RigidLoad is a scenario's rigid load (load.body) under a still
// suspension point, for a planner to tune to the modes it has.
type RigidLoad struct {
	r     *pendulum.Rigid
	ropeM float64 // load.rope_length_m
}

// RigidSwing is the linear sway of a rigid load at one rope length: its
// swinging modes (free ones left out), slowest first, with each mode's
// share of the load's swing along a direction after a sudden start
// (pendulum.Rigid.ModesAlong), and the depth of the load's centre of mass
// below the hook hanging still (below the parallel legs' lower ends with a
// spreader), so that rope + depth is the line from the suspension point to
// the load.
type RigidSwing struct {
	PeriodsS []float64
	Kinds    []string
	Shares   []float64
	DepthM   float64
}

// NewRigidLoad builds the rigid load of a scenario with load.body; the
// scenario is validated first.
func NewRigidLoad(s *scenario.Scenario) (*RigidLoad, error) {
	if err := s.Validate(); err != nil {
		return nil, err
	}
	if s.Load.Body == nil {
		return nil, scenario.Errors{{Field: "load.body", Message: "is required: the modes of a rigid load"}}
	}
	still := func(float64) pendulum.Kinematics { return pendulum.Kinematics{} }
	rope := func(float64) (float64, float64, float64) { return *s.Load.RopeLengthM, 0, 0 }
	r, _, err := rigidModel(s, still, rope, nil, nil)
	if err != nil {
		return nil, err
	}
	return &RigidLoad{r: r, ropeM: *s.Load.RopeLengthM}, nil
}

// Swing is the linear sway at rope length ropeM (to the hook; with a
// spreader, the parallel legs' length) for a move along the horizontal
// direction dir.
func (b *RigidLoad) Swing(ropeM float64, dir r3.Vec) (RigidSwing, error) {
	modes, err := b.r.ModesAlong(ropeM, dir)
	if err != nil {
		return RigidSwing{}, err
	}
	out := RigidSwing{DepthM: b.depthAt(ropeM)}
	for _, m := range modes {
		if m.Free {
			continue
		}
		out.PeriodsS = append(out.PeriodsS, m.PeriodS)
		out.Kinds = append(out.Kinds, m.Kind)
		out.Shares = append(out.Shares, m.Share)
	}
	if len(out.PeriodsS) == 0 {
		return RigidSwing{}, errors.New("sway: the rigid load has no swinging mode")
	}
	return out, nil
}

// FirstMode is the slowest swinging mode's period at rope length ropeM
// and the effective length of the single rope with that period,
// g (T / (2 pi))^2.
func (b *RigidLoad) FirstMode(ropeM float64) (periodS, effectiveLengthM float64, err error) {
	_, p, err := bodyModes(b.r, ropeM)
	if err != nil {
		return 0, 0, err
	}
	w := 2 * math.Pi / p
	return p, units.StandardGravity / (w * w), nil
}

// DepthM is the depth of the load's centre of mass below the hook hanging
// still (with a spreader, below the parallel legs' lower ends: their
// attach height above it).
func (b *RigidLoad) DepthM() float64 { return b.depthAt(b.ropeM) }

// depthAt is DepthM at rope length ropeM (two hook ropes: below the
// suspension point less load.rope_length_m's value ropeM, which includes
// the ropes' own lengths less it and changes a little with the rope
// length when the ropes are not parallel).
func (b *RigidLoad) depthAt(ropeM float64) float64 {
	if b.r.TwoTops() {
		return b.r.TopDepthM(ropeM)
	}
	return b.r.HookDepthM()
}

// WindLeanRad is the steady lean of the line from the suspension point to
// the load's centre of mass under a steady horizontal force on the load at
// rope length ropeM (static equilibrium, as the evaluation's
// wind_lean_deg for a rigid load).
func (b *RigidLoad) WindLeanRad(forceN, ropeM float64) float64 {
	lean, _ := bodyWind(b.r, forceN, ropeM)
	return lean
}
