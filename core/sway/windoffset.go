package sway

import (
	"math"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// WindOffsetM is how far the load of a validated scenario hangs off plumb
// under a steady horizontal force F on it: the horizontal distance of the
// load from the point under the suspension point once the swing has died
// out, for a rope of length rope. Static equilibrium of the hanging mass
// (Meriam & Kraige, Engineering Mechanics: Statics, equilibrium of a
// particle): the rope leans atan(F/(m*g)), so the offset is
// rope*F/sqrt(F^2 + (m*g)^2). With a hook block of mass m1 the rope to
// the hook carries (m1+m2)*g and leans atan(F/((m1+m2)*g)), the rigging
// leans atan(F/(m2*g)) (the force acts on the load), and the offsets of
// rope and rigging add.
func WindOffsetM(s *scenario.Scenario, force, rope float64) float64 {
	g := units.StandardGravity
	m2 := *s.Load.MassKg
	h := s.Load.Hook
	if h == nil {
		return rope * force / math.Hypot(force, m2*g)
	}
	l2 := *h.RiggingLengthM
	return rope*force/math.Hypot(force, (m2+*h.MassKg)*g) + l2*force/math.Hypot(force, m2*g)
}
