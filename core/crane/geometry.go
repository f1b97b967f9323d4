package crane

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/motion"
	"swaysheet/core/pendulum"
)

// Start is where the crane's axes stand at time zero, in the model's SI
// units (the scenario's crane block gives it: scenario.Crane.Start).
type Start struct {
	// RadiusM is the hook radius from the slew axis; SlewRad the jib's
	// direction, from +x toward +y.
	RadiusM, SlewRad float64
}

// Drives holds the summed motion profile of each role, in the model's SI
// units (m, rad), relative to where the axis starts.
type Drives [roles]motion.Sum

// Of is the summed profile of the axis' role.
func (d *Drives) Of(a Axis) *motion.Sum { return &d[a.Role] }

// Suspension returns the motion of the point the rope hangs from: travel
// on x and y plus a point at radius r on a jib turned by phi about the
// vertical axis through the origin, r = r0 + reach, phi = phi0 + turn
// (r0 and phi0 from at).
// Radial and tangential unit vectors er = (cos phi, sin phi),
// et = (-sin phi, cos phi): position r*er; velocity r'*er + r*phi'*et;
// acceleration (r¨ - r*phi'^2)*er + (r*phi¨ + 2*r'*phi')*et (plane
// polar coordinates; any dynamics text, e.g. Meriam & Kraige,
// Engineering Mechanics: Dynamics, ch. 2).
func (d *Drives) Suspension(at Start) func(float64) pendulum.Kinematics {
	r0, phi0 := at.RadiusM, at.SlewRad
	// Combined: evaluated at a cost that does not grow with the moves.
	x, y, turn, reach := motion.Combine(d[AlongX]...), motion.Combine(d[AlongY]...),
		motion.Combine(d[Turn]...), motion.Combine(d[Reach]...)
	if len(d[Turn]) == 0 && len(d[Reach]) == 0 && r0 == 0 {
		// An axis without moves is at zero (+0, as its Combined gives):
		// not asked, the evaluation is one call fewer.
		if len(d[AlongY]) == 0 {
			return func(t float64) pendulum.Kinematics {
				a := x.At(t)
				return pendulum.Kinematics{Pos: r3.Vec{X: a.Pos}, Vel: r3.Vec{X: a.Vel}, Acc: r3.Vec{X: a.Acc}}
			}
		}
		if len(d[AlongX]) == 0 {
			return func(t float64) pendulum.Kinematics {
				b := y.At(t)
				return pendulum.Kinematics{Pos: r3.Vec{Y: b.Pos}, Vel: r3.Vec{Y: b.Vel}, Acc: r3.Vec{Y: b.Acc}}
			}
		}
		return func(t float64) pendulum.Kinematics {
			a, b := x.At(t), y.At(t)
			return pendulum.Kinematics{
				Pos: r3.Vec{X: a.Pos, Y: b.Pos},
				Vel: r3.Vec{X: a.Vel, Y: b.Vel},
				Acc: r3.Vec{X: a.Acc, Y: b.Acc},
			}
		}
	}
	return func(t float64) pendulum.Kinematics {
		a, b := x.At(t), y.At(t)
		p, q := turn.At(t), reach.At(t)
		phi, w, al := phi0+p.Pos, p.Vel, p.Acc
		r, rd, rdd := r0+q.Pos, q.Vel, q.Acc
		c, s := math.Cos(phi), math.Sin(phi)
		vr, vt := rd, r*w
		ar, at := rdd-r*w*w, r*al+2*rd*w
		return pendulum.Kinematics{
			Pos: r3.Vec{X: a.Pos + r*c, Y: b.Pos + r*s},
			Vel: r3.Vec{X: a.Vel + vr*c - vt*s, Y: b.Vel + vr*s + vt*c},
			Acc: r3.Vec{X: a.Acc + ar*c - at*s, Y: b.Acc + ar*s + at*c},
		}
	}
}

// RopeLength returns the rope length in time from its length l0 at the
// start: the hoist shortens it (rope length, its rate, its acceleration).
func (d *Drives) RopeLength(l0 float64) func(float64) (float64, float64, float64) {
	hoist := motion.Combine(d[Rope]...)
	if len(d[Rope]) == 0 {
		// No hoist: what the closure below gives for a hoist at rest
		// (the negated zeros are -0), without asking it.
		negZero := math.Copysign(0, -1)
		return func(float64) (float64, float64, float64) { return l0, negZero, negZero }
	}
	return func(t float64) (float64, float64, float64) {
		h := hoist.At(t)
		return l0 - h.Pos, -h.Vel, -h.Acc
	}
}

// HookPerUnit is how far the hook moves sideways per SI unit of the axis
// (m per m, or m per rad) with the crane standing at at, as linear theory
// sees a move of the axis alone: 1 for a travel or the trolley, the hook
// radius for a slew (arc length = radius × angle), 0 for the hoist.
func (a Axis) HookPerUnit(at Start) float64 {
	switch a.Role {
	case Turn:
		return at.RadiusM
	case Rope:
		return 0
	}
	return 1
}

// OutwardAccel is the acceleration (m/s²) that leans the load away from
// the centre of the hook's path while the axis moves at speed v (SI) with
// the crane standing at at: r·v² for a slew at hook radius r (the
// centripetal acceleration of circular motion; any dynamics text), 0 for
// an axis that moves the hook in a straight line. The lean is
// atan(r·v²/g).
func (a Axis) OutwardAccel(at Start, v float64) float64 {
	if a.Role == Turn {
		return at.RadiusM * v * v
	}
	return 0
}

// HookDirection is the unit vector, in the ground plane, along which the
// hook starts to move when the axis moves forward from at: +x or +y for
// a travel, the jib's tangent (-sin phi0, cos phi0) for a slew, its
// radial (cos phi0, sin phi0) for the trolley; zero for the hoist.
func (a Axis) HookDirection(at Start) r3.Vec {
	switch a.Role {
	case AlongX:
		return r3.Vec{X: 1}
	case AlongY:
		return r3.Vec{Y: 1}
	case Turn:
		return r3.Vec{X: -math.Sin(at.SlewRad), Y: math.Cos(at.SlewRad)}
	case Reach:
		return r3.Vec{X: math.Cos(at.SlewRad), Y: math.Sin(at.SlewRad)}
	}
	return r3.Vec{}
}
