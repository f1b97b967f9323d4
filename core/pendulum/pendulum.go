// Package pendulum is the equation of motion of a hook load: a point mass m
// on a massless, inextensible rope of length L(t) hung from a suspension
// point S(t) that moves in three dimensions. Nothing is linearised.
//
// The state is the rope direction n (a unit vector from the suspension point
// to the load) and its rate u = dn/dt, so the load sits at P = S + L*n. The
// axes are x and y horizontal, z up; gravity is -g*z.
//
// With x' = dx/dt and x¨ = d²x/dt² (written so, not with two primes,
// which go doc would print as a closing quote), Newton's law for the load,
// m*P¨ = -T*n + m*g_vec + F, with
// P¨ = S¨ + L¨*n + 2*L'*u + L*n¨, and the constraint n.n = 1 (so n.u = 0
// and n.n¨ = -|u|^2) give
//
//	n¨ = [ (I - n n^T)(a - S¨) - 2 L' u ] / L - |u|^2 n
//	T  = m * [ (a - S¨).n - L¨ + L |u|^2 ]
//
// where a = g_vec + F/m is the applied acceleration (gravity, wind, drag).
// The rope tension T is thus an algebraic function of the state at each
// instant. The rope is assumed taut: where T would be negative the model no
// longer holds (the load would be in free flight and snatch the rope).
//
// Integrating n¨ directly lets |n| drift from 1 by the integrator's local
// error; Project puts the state back onto the constraint after each step, so
// the rope length error stays at rounding level over any run.
package pendulum

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/units"
)

// Kinematics gives position, velocity and acceleration of a point.
type Kinematics struct {
	_             [0]func() // never compared: no equality code in the wasm
	Pos, Vel, Acc r3.Vec
}

// Model is one hook load and the motions imposed on it.
type Model struct {
	Mass    float64 // kg, > 0
	Gravity float64 // m/s^2; zero means standard gravity

	// Suspension gives the suspension point's motion at time t.
	Suspension func(t float64) Kinematics
	// Rope gives rope length L, dL/dt and d2L/dt2 at time t (L > 0).
	Rope func(t float64) (l, dl, ddl float64)
	// Force is the applied force on the load besides gravity and rope
	// tension (wind, air drag), N, given time and the load's position and
	// velocity. Nil means none.
	Force func(t float64, pos, vel r3.Vec) r3.Vec
}

// StateLen is the length of the state vector: n then u.
const StateLen = 6

// System is a hook-load model that an evaluation integrates: the single
// pendulum Model or the hook-and-rigging Double.
type System interface {
	// Len is the length of the state vector.
	Len() int
	// Func is the right-hand side y' = f(t, y).
	Func(t float64, y, dy []float64)
	// Project puts y back onto the rope constraints and returns the
	// largest relative length error it removed.
	Project(y []float64) float64
	// Eval fills p from time t and state y.
	Eval(t float64, y []float64, p *Point)
}

// Point is everything known about the load at one instant.
type Point struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	T          float64 // time, s
	Dir, Rate  r3.Vec  // rope direction n and dn/dt
	Rope       float64 // rope length L, m
	Suspension Kinematics
	LoadPos    r3.Vec  // P, m
	LoadVel    r3.Vec  // dP/dt, m/s
	Tension    float64 // rope tension, N

	// With a hook block and rigging (Double) only:
	HookPos        r3.Vec  // hook block, m
	RiggingDir     r3.Vec  // unit vector hook to load
	RiggingTension float64 // N

	// With a rigid-body load (Rigid) only.
	Body *BodyPoint
}

// Rel is the load's position relative to the suspension point (with two
// hook ropes, relative to the point above where the load hangs still:
// BodyPoint.Plumb).
func (p *Point) Rel() r3.Vec {
	d := r3.Sub(p.LoadPos, p.Suspension.Pos)
	if p.Body != nil && p.Body.Plumb != (r3.Vec{}) {
		d = r3.Sub(d, p.Body.Plumb)
	}
	return d
}

// SwingRad is the angle from the downward vertical of the line from the
// suspension point to the load, radians. For a single rope it is the rope
// angle.
func (p *Point) SwingRad() float64 {
	d := p.Rel()
	return math.Atan2(math.Hypot(d.X, d.Y), -d.Z)
}

func (m *Model) g() float64 {
	if m.Gravity == 0 {
		return units.StandardGravity
	}
	return m.Gravity
}

// Len implements System.
func (m *Model) Len() int { return StateLen }

// Eval implements System.
func (m *Model) Eval(t float64, y []float64, p *Point) { m.eval(t, y, p) }

// Project implements System.
func (m *Model) Project(y []float64) float64 { return Project(y) }

// eval fills p (if not nil) from time t and state y, and returns n¨.
func (m *Model) eval(t float64, y []float64, p *Point) (acc r3.Vec) {
	n := r3.Vec{X: y[0], Y: y[1], Z: y[2]}
	u := r3.Vec{X: y[3], Y: y[4], Z: y[5]}
	s := m.Suspension(t)
	l, dl, ddl := m.Rope(t)
	// Position and velocity of the load: only the applied force and the
	// caller's point need them.
	var pos, vel r3.Vec
	if m.Force != nil || p != nil {
		pos = r3.Add(s.Pos, r3.Scale(l, n))
		vel = r3.Add(s.Vel, r3.Add(r3.Scale(dl, n), r3.Scale(l, u)))
	}
	// Applied acceleration seen from the suspension point, a - S¨.
	rel := r3.Vec{X: -s.Acc.X, Y: -s.Acc.Y, Z: -m.g() - s.Acc.Z}
	if m.Force != nil {
		rel = r3.Add(rel, r3.Scale(1/m.Mass, m.Force(t, pos, vel)))
	}
	radial := r3.Dot(rel, n)
	uu := r3.Dot(u, u)
	il := 1 / l
	// n¨ = [rel - radial*n - 2 L' u]/L - |u|^2 n
	cn := -radial*il - uu
	cu := -2 * dl * il
	acc = r3.Vec{
		X: rel.X*il + cn*n.X + cu*u.X,
		Y: rel.Y*il + cn*n.Y + cu*u.Y,
		Z: rel.Z*il + cn*n.Z + cu*u.Z,
	}
	if p != nil {
		*p = Point{T: t, Dir: n, Rate: u, Rope: l, Suspension: s, LoadPos: pos, LoadVel: vel,
			Tension: m.Mass * (radial - ddl + l*uu)}
	}
	return acc
}

// Func is the right-hand side y' = f(t, y) for an ODE solver.
func (m *Model) Func(t float64, y, dy []float64) {
	acc := m.eval(t, y, nil)
	dy[0], dy[1], dy[2] = y[3], y[4], y[5]
	dy[3], dy[4], dy[5] = acc.X, acc.Y, acc.Z
}

// Project puts y back onto the constraint |n| = 1, n.u = 0 and returns how
// far |n| was from 1 before.
func Project(y []float64) float64 {
	y = y[:6] // one bounds check for all six
	norm := math.Sqrt(y[0]*y[0] + y[1]*y[1] + y[2]*y[2])
	y[0], y[1], y[2] = y[0]/norm, y[1]/norm, y[2]/norm
	d := y[0]*y[3] + y[1]*y[4] + y[2]*y[5]
	y[3] -= d * y[0]
	y[4] -= d * y[1]
	y[5] -= d * y[2]
	return math.Abs(norm - 1)
}

// StateFromSwing returns the state for a rope at angle theta from the
// downward vertical, leaning toward azimuth phi (radians from +x toward +y),
// with the load moving horizontally relative to the suspension point at
// velocity (vx, vy) m/s on a rope of length l. The vertical part of the
// velocity follows from the constraint.
func StateFromSwing(theta, phi, vx, vy, l float64) []float64 {
	st, ct := math.Sin(theta), math.Cos(theta)
	n := r3.Vec{X: st * math.Cos(phi), Y: st * math.Sin(phi), Z: -ct}
	// Velocity of the load relative to the suspension point is l*u with
	// u.n = 0: take the horizontal part given and solve for u_z.
	ux, uy := vx/l, vy/l
	uz := 0.0
	if n.Z != 0 {
		uz = -(n.X*ux + n.Y*uy) / n.Z
	}
	y := []float64{n.X, n.Y, n.Z, ux, uy, uz}
	Project(y)
	return y
}
