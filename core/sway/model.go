package sway

import "swaysheet/core/scenario"

// ModelName names the model an evaluation of s uses, for the methods line
// of the check sheet and anyone else who states it: the one place these
// words are kept.
//
//   - No hook block and no body: a point load on one rope, the full
//     nonlinear 3D pendulum (core/pendulum Model).
//   - load.hook: the hook block and the load as two masses, a 3D double
//     pendulum (core/pendulum Double).
//   - load.body: a rigid load on its sling set, a 3D rigid body with the
//     legs as constraints (core/pendulum Rigid): four legs from the hook
//     as a rigid frame, two legs from the hook block, two parallel
//     spreader legs from a spreader beam held by the crane, or two hook
//     ropes each to its own lifting point.
func ModelName(s *scenario.Scenario) string {
	switch b := s.Load.Body; {
	case b != nil && b.Spreader != nil:
		return "rigid load on two parallel spreader legs from a spreader beam held by the crane (3D rigid body, Newton-Euler with constraint forces)"
	case b != nil && b.Tandem != nil:
		return "rigid load on two hook ropes, each to its own lifting point (3D rigid body, Newton-Euler with constraint forces)"
	case b != nil && len(b.Legs) == 2:
		return "rigid load on a two-leg sling set from the hook block (3D rigid body and hook block, Newton-Euler with constraint forces)"
	case b != nil:
		return "rigid load on a four-leg sling set from the hook, legs taken as a rigid frame (3D rigid body, Newton-Euler with constraint forces)"
	case s.Load.Hook != nil:
		return "hook block and load as two masses (full nonlinear 3D double pendulum)"
	}
	return "point load on one rope (full nonlinear 3D pendulum)"
}
