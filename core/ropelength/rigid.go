package ropelength

import (
	"fmt"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// A rigid load (Input.Load: the scenario's load block with load.body) is
// not a point: a crew's timed swing is its first mode, whose period the
// modal analysis of the linearised rigid-load model gives at each rope
// length to the hook (sway.RigidLoad.FirstMode; the compound pendulum
// 2*pi*sqrt((k^2 + d^2)/(g d)) when the hook is held fixed, checked in
// core/pendulum). The first mode's period grows with the rope, so the rope
// length to the hook (with a spreader: the parallel legs' length) whose
// first mode has the timed small-swing period T0 is found by bisection
// between the shortest and longest rope the model takes. The amplitude
// correction is one rope's, 2K(k)/pi with k = sin(theta0/2), theta0 the
// swing of the line from the sheave to the load's centre of mass, applied
// to the first mode: exact for a body on a fixed pivot (a compound
// pendulum is a simple pendulum of length (k^2 + d^2)/d), an approximation
// on a rope.

// Load is a rigid load: the scenario's load block without the rope length
// (mass_kg and body, as in load.body of a scenario).
type Load struct {
	MassKg *float64       `json:"mass_kg"`
	Body   *scenario.Body `json:"body"`
}

// rigidNote goes with every answer for a rigid load.
const rigidNote = "For a rigid load the rope length is to the hook (with a spreader: the length of the two legs; with two hook ropes: the length of both), as load.rope_length_m with load.body. The effective length is the single rope that swings in the same time as the load's slowest swing (its first mode); the planner shapes moves for it. The correction for the swing size is one rope's, applied to that swing: exact for a load swinging on a fixed hook, an approximation on a rope."

// rigidLoad builds the rigid load; its errors name the input's fields
// (load.mass_kg, load.body...), the same paths as in a scenario.
func (l *Load) rigidLoad() (*sway.RigidLoad, error) {
	one := 1.0
	s := &scenario.Scenario{Format: scenario.FormatName, Version: scenario.Version,
		Load: scenario.Load{MassKg: l.MassKg, RopeLengthM: &one, Body: l.Body}, Motions: []scenario.Motion{}}
	if l.Body == nil {
		return nil, scenario.Errors{{Field: "load.body", Message: "is required: the rigid load's box and sling set, as load.body in a scenario"}}
	}
	if t := l.Body.Tandem; t != nil {
		// The answer is the length of both hook ropes alike.
		for i, r := range t.Ropes {
			if r.LengthM != nil {
				return nil, scenario.Errors{{Field: fmt.Sprintf("load.body.tandem.ropes[%d].length_m", i),
					Message: "does not apply here: the rope length found is that of both hook ropes (give the ropes without their own lengths)"}}
			}
		}
	}
	return sway.NewRigidLoad(s)
}

// rigidRope is the rope length to the hook whose first mode has the
// small-swing period t0 (bisection; the error names timed.time_s when no
// rope length in the model's range gives it).
func rigidRope(b *sway.RigidLoad, t0 float64) (float64, error) {
	r := scenario.Ranges["load.rope_length_m"]
	lo, hi := r.Min, r.Max
	tlo, _, err := b.FirstMode(lo)
	if err != nil {
		return 0, err
	}
	thi, _, err := b.FirstMode(hi)
	if err != nil {
		return 0, err
	}
	if t0 < tlo*(1-1e-6) || t0 > thi*(1+1e-6) {
		return 0, scenario.Errors{{Field: "timed.time_s", Message: fmt.Sprintf(
			"a small-swing period of %.4g s is outside what this load swings with on a rope of %g to %g m to the hook (%.4g to %.4g s); check the count, the time and the load's sling set",
			t0, lo, hi, tlo, thi)}}
	}
	for range 60 {
		m := 0.5 * (lo + hi)
		p, _, err := b.FirstMode(m)
		if err != nil {
			return 0, err
		}
		if p < t0 {
			lo = m
		} else {
			hi = m
		}
		if hi-lo < 1e-9*hi {
			break
		}
	}
	return 0.5 * (lo + hi), nil
}

// rigidAnswers fills the heights' and the timed swing's answers for a
// rigid load.
func rigidAnswers(in *Input, res *Result) error {
	b, err := in.Load.rigidLoad()
	if err != nil {
		return err
	}
	depth := b.DepthM()
	if h := in.Heights; h != nil {
		rope := *h.SheaveHeightM - *h.HookHeightM
		p, _, err := b.FirstMode(rope)
		if err != nil {
			return err
		}
		res.FromHeights = &HeightsAnswer{RopeLengthM: rope + depth, RopeToHookM: rope, RiggingLengthM: depth, SmallSwingPeriodS: p,
			EffectiveLengthM: effectiveLength(p)}
	}
	if tm := in.Timed; tm != nil {
		a, err := timedAnswer(tm, func(t0 float64) (float64, error) { return rigidRope(b, t0) })
		if err != nil {
			return err
		}
		res.FromTimed = a
	}
	res.RiggingLengthM = depth
	res.Notes = append(res.Notes, rigidNote)
	return nil
}

// validateLoad checks a rigid load's question: no hook block beside it
// (its mass is load.body.hook_mass_kg), no sling or centre depths (the
// body gives them).
func (in *Input) validateLoad(c *checker) {
	if in.Hook != nil {
		c.add("hook", "does not apply with load: give the hook block's mass as load.body.hook_mass_kg")
	}
	if h := in.Heights; h != nil {
		if h.SlingDepthM != 0 {
			c.add("heights.sling_depth_m", "does not apply with load: the sling set in load.body gives the depth below the hook")
		}
		if h.CentreDepthM != 0 {
			c.add("heights.centre_depth_m", "does not apply with load: the box in load.body gives its centre of mass")
		}
	}
	if _, err := in.Load.rigidLoad(); err != nil {
		if fe, ok := err.(scenario.Errors); ok {
			c.errs = append(c.errs, fe...)
			return
		}
		c.add("load.body", "%v", err)
	}
}
