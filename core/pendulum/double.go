package pendulum

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/units"
)

// Double is a hook block of mass M1 on the rope of length L1(t) from the
// suspension point S(t), and a rigged load of mass M2 hanging from the hook
// on rigging of fixed length L2 to the load's centre of mass: two point
// masses in 3D, nothing linearised.
//
// The state is n1, u1 = dn1/dt (rope direction, suspension point to hook)
// and n2, u2 (rigging direction, hook to load): 12 numbers. With
// P1 = S + L1*n1, P2 = P1 + L2*n2, applied accelerations A1 = g + F1/M1 and
// A2 = g + F2/M2, Newton's law for both masses
//
//	M1*P1¨ = -T1*n1 + T2*n2 + M1*A1
//	M2*P2¨ = -T2*n2 + M2*A2
//
// and the constraints n_i.n_i¨ = -|u_i|^2 give two linear equations in the
// rope tension T1 and the rigging tension T2 (c = n1.n2):
//
//	T1/M1 - c*T2/M1           = (A1 - S¨).n1 - L1¨ + L1*|u1|^2
//	-c*T1/M1 + (1/M1+1/M2)*T2 = (A2 - A1).n2 + L2*|u2|^2
//
// whose determinant ((1-c^2)/M1 + 1/M2)/M1 is positive. Then
//
//	L1*n1¨ = A1 - S¨ + (T2*n2 - T1*n1)/M1 - L1¨*n1 - 2*L1'*u1
//	L2*n2¨ = A2 - A1 - T2*n2/M2 - (T2*n2 - T1*n1)/M1
type Double struct {
	M1, M2  float64 // hook block and load masses, kg
	L2      float64 // rigging length, hook to the load's centre of mass, m
	Gravity float64 // m/s^2; zero means standard gravity

	Suspension func(t float64) Kinematics
	Rope       func(t float64) (l, dl, ddl float64) // L1 and its derivatives
	// Force is the applied force on the load (wind, drag), N; nil is none.
	Force func(t float64, pos, vel r3.Vec) r3.Vec
}

// DoubleStateLen is the length of the state vector of Double.
const DoubleStateLen = 12

// Len implements System.
func (d *Double) Len() int { return DoubleStateLen }

func (d *Double) g() float64 {
	if d.Gravity == 0 {
		return units.StandardGravity
	}
	return d.Gravity
}

func vec(y []float64) r3.Vec { return r3.Vec{X: y[0], Y: y[1], Z: y[2]} }

// eval returns n1¨ and n2¨, and fills p if it is not nil.
func (d *Double) eval(t float64, y []float64, p *Point) (acc1, acc2 r3.Vec) {
	n1, u1, n2, u2 := vec(y[0:]), vec(y[3:]), vec(y[6:]), vec(y[9:])
	s := d.Suspension(t)
	l1, dl1, ddl1 := d.Rope(t)
	l2 := d.L2
	p1 := r3.Add(s.Pos, r3.Scale(l1, n1))
	v1 := r3.Add(s.Vel, r3.Add(r3.Scale(dl1, n1), r3.Scale(l1, u1)))
	p2 := r3.Add(p1, r3.Scale(l2, n2))
	v2 := r3.Add(v1, r3.Scale(l2, u2))
	grav := r3.Vec{Z: -d.g()}
	a1, a2 := grav, grav
	if d.Force != nil {
		a2 = r3.Add(a2, r3.Scale(1/d.M2, d.Force(t, p2, v2)))
	}
	c := r3.Dot(n1, n2)
	rel1 := r3.Sub(a1, s.Acc)
	b1 := r3.Dot(rel1, n1) - ddl1 + l1*r3.Dot(u1, u1)
	b2 := r3.Dot(r3.Sub(a2, a1), n2) + l2*r3.Dot(u2, u2)
	im1, im2 := 1/d.M1, 1/d.M2
	// [im1, -c*im1; -c*im1, im1+im2] [T1; T2] = [b1; b2]
	det := im1*(im1+im2) - c*c*im1*im1
	t1 := ((im1+im2)*b1 + c*im1*b2) / det
	t2 := (im1*b2 + c*im1*b1) / det
	hook := r3.Scale(im1, r3.Sub(r3.Scale(t2, n2), r3.Scale(t1, n1))) // rope and rigging pull on the hook, per kg
	acc1 = r3.Scale(1/l1, r3.Sub(r3.Add(rel1, hook), r3.Add(r3.Scale(ddl1, n1), r3.Scale(2*dl1, u1))))
	acc2 = r3.Scale(1/l2, r3.Sub(r3.Sub(r3.Sub(a2, a1), r3.Scale(t2*im2, n2)), hook))
	if p != nil {
		*p = Point{T: t, Dir: n1, Rate: u1, Rope: l1, Suspension: s, LoadPos: p2, LoadVel: v2,
			Tension: t1, HookPos: p1, RiggingDir: n2, RiggingTension: t2}
	}
	return acc1, acc2
}

// Eval implements System.
func (d *Double) Eval(t float64, y []float64, p *Point) { d.eval(t, y, p) }

// Func implements System.
func (d *Double) Func(t float64, y, dy []float64) {
	a1, a2 := d.eval(t, y, nil)
	copy(dy[0:3], y[3:6])
	dy[3], dy[4], dy[5] = a1.X, a1.Y, a1.Z
	copy(dy[6:9], y[9:12])
	dy[9], dy[10], dy[11] = a2.X, a2.Y, a2.Z
}

// Project implements System: both directions back onto their constraints.
func (d *Double) Project(y []float64) float64 {
	return math.Max(Project(y[0:6]), Project(y[6:12]))
}

// DoubleStateFromSwing returns the state of rope and rigging in line at
// angle theta from the vertical toward azimuth phi, swinging together so
// that the load moves horizontally at (vx, vy) relative to the suspension
// point (rope to the hook l1, rigging l2).
func DoubleStateFromSwing(theta, phi, vx, vy, l1, l2 float64) []float64 {
	one := StateFromSwing(theta, phi, vx, vy, l1+l2)
	return append(one, one...)
}

// Modes are the two small-swing modes of the hook-and-rigging pendulum
// under a fixed suspension point.
type Modes struct {
	_ [0]func() // never compared: no equality code in the wasm
	// Omega are the angular frequencies, rad/s, first (slower) mode first.
	Omega [2]float64
	// Shape are the mode shapes as (rope angle, rigging angle), scaled so
	// that the rope angle is 1.
	Shape [2][2]float64
	// LoadShare is each mode's share of the load's horizontal swing after
	// a sudden suspension acceleration from rest (linear theory); the two
	// add to 1.
	LoadShare [2]float64
}

// LinearModes returns the modes of the linearised two-mass pendulum: with
// R = m2/m1,
//
//	w^2 = (g/2)*[(1+R)(1/L1+1/L2) -/+ sqrt((1+R)^2 (1/L1+1/L2)^2 - 4(1+R)/(L1*L2))]
//
// (the standard result for the double pendulum with unequal masses, from
// the eigenvalues of K v = w^2 M v with M = [[(m1+m2)L1^2, m2 L1 L2],
// [m2 L1 L2, m2 L2^2]] and K = diag((m1+m2) g L1, m2 g L2) in the absolute
// angles of rope and rigging).
func LinearModes(m1, m2, l1, l2, g float64) Modes {
	r := m2 / m1
	s := (1 + r) * (1/l1 + 1/l2)
	disc := math.Sqrt(s*s - 4*(1+r)/(l1*l2))
	// The smaller root from the product of the roots, g^2 (1+R)/(L1 L2),
	// which keeps its precision when the two are far apart.
	hi := g / 2 * (s + disc)
	w2 := [2]float64{g * g * (1 + r) / (l1 * l2) / hi, hi}
	var md Modes
	m := m1 + m2
	// Mass and stiffness matrices in (theta1, theta2).
	m11, m12, m22 := m*l1*l1, m2*l1*l2, m2*l2*l2
	k11 := m * g * l1
	var x [2]float64 // each mode's load excursion per unit rope angle
	for i := range 2 {
		md.Omega[i] = math.Sqrt(w2[i])
		// First row: (k11 - w2 m11) v1 - w2 m12 v2 = 0.
		v2 := (k11 - w2[i]*m11) / (w2[i] * m12)
		md.Shape[i] = [2]float64{1, v2}
		x[i] = l1 + l2*v2
	}
	// A sudden acceleration a leaves the static tilt -(a/g)*(1, 1) about
	// which the load swings; its modal coordinates c solve
	// c0*v0 + c1*v1 = (1, 1), using M-orthogonality: c_i = v_i.M.1 / v_i.M.v_i.
	var share [2]float64
	for i := range 2 {
		v := md.Shape[i]
		num := v[0]*(m11+m12) + v[1]*(m12+m22)
		den := v[0]*v[0]*m11 + 2*v[0]*v[1]*m12 + v[1]*v[1]*m22
		share[i] = math.Abs(num / den * x[i])
	}
	tot := share[0] + share[1]
	md.LoadShare = [2]float64{share[0] / tot, share[1] / tot}
	return md
}
