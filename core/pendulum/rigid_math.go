package pendulum

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Small dense algebra for the rigid load: 3 by 3 matrices, unit
// quaternions, and the at most 3 by 3 linear systems of its multipliers.

// m3 is a 3 by 3 matrix, rows first.
type m3 [3][3]float64

// mul is a v. Written as a loop over the rows (the same products and sums
// in the same order as written out), Go inlines it: cost 53, against 83
// written out, over the budget of 80. By pointer: a value receiver is a
// copy of the 72-byte matrix at every call, even inlined.
func (a *m3) mul(v r3.Vec) r3.Vec {
	var o [3]float64
	for i := range 3 {
		o[i] = a[i][0]*v.X + a[i][1]*v.Y + a[i][2]*v.Z
	}
	return r3.Vec{X: o[0], Y: o[1], Z: o[2]}
}

// rowDot is row r of a matrix times v, the sum m3.mul makes for that
// row. The hot paths write R.mul(v) as
//
//	r3.Vec{X: rowDot(&R[0], v), Y: rowDot(&R[1], v), Z: rowDot(&R[2], v)}
//
// (the same sums): mul keeps its loop's array in memory (Go does not keep
// an array of three in registers), and neither mul written out nor a
// function of three rowDots is within Go's inlining budget of 80 (cost
// 83 and more), while rowDot is (24).
func rowDot(r *[3]float64, v r3.Vec) float64 { return r[0]*v.X + r[1]*v.Y + r[2]*v.Z }

func (a m3) mul3(b m3) (c m3) {
	for i := range 3 {
		for j := range 3 {
			c[i][j] = a[i][0]*b[0][j] + a[i][1]*b[1][j] + a[i][2]*b[2][j]
		}
	}
	return c
}

// conjugate writes R B R^T into c, the products and sums of
// R.mul3(B).mul3(R.transpose()) in their order, on local variables: Go
// keeps an array in memory (swaybench -shapes: the same sums on arrays
// take about 4 times as long as on local variables natively, about 9
// times as wasm), and mul3 and transpose copy their matrices.
func conjugate(R, B, c *m3) {
	r00, r01, r02 := R[0][0], R[0][1], R[0][2]
	r10, r11, r12 := R[1][0], R[1][1], R[1][2]
	r20, r21, r22 := R[2][0], R[2][1], R[2][2]
	b00, b01, b02 := B[0][0], B[0][1], B[0][2]
	b10, b11, b12 := B[1][0], B[1][1], B[1][2]
	b20, b21, b22 := B[2][0], B[2][1], B[2][2]
	// T = R B
	t00, t01, t02 := r00*b00+r01*b10+r02*b20, r00*b01+r01*b11+r02*b21, r00*b02+r01*b12+r02*b22
	t10, t11, t12 := r10*b00+r11*b10+r12*b20, r10*b01+r11*b11+r12*b21, r10*b02+r11*b12+r12*b22
	t20, t21, t22 := r20*b00+r21*b10+r22*b20, r20*b01+r21*b11+r22*b21, r20*b02+r21*b12+r22*b22
	// C = T R^T: c[i][j] = t[i][0] r[j][0] + t[i][1] r[j][1] + t[i][2] r[j][2]
	c[0] = [3]float64{t00*r00 + t01*r01 + t02*r02, t00*r10 + t01*r11 + t02*r12, t00*r20 + t01*r21 + t02*r22}
	c[1] = [3]float64{t10*r00 + t11*r01 + t12*r02, t10*r10 + t11*r11 + t12*r12, t10*r20 + t11*r21 + t12*r22}
	c[2] = [3]float64{t20*r00 + t21*r01 + t22*r02, t20*r10 + t21*r11 + t22*r12, t20*r20 + t21*r21 + t22*r22}
}

func (a m3) transpose() (t m3) {
	for i := range 3 {
		for j := range 3 {
			t[i][j] = a[j][i]
		}
	}
	return t
}

func (a m3) inverse() (m3, bool) {
	c0 := r3.Cross(r3.Vec{X: a[0][1], Y: a[1][1], Z: a[2][1]}, r3.Vec{X: a[0][2], Y: a[1][2], Z: a[2][2]})
	c1 := r3.Cross(r3.Vec{X: a[0][2], Y: a[1][2], Z: a[2][2]}, r3.Vec{X: a[0][0], Y: a[1][0], Z: a[2][0]})
	c2 := r3.Cross(r3.Vec{X: a[0][0], Y: a[1][0], Z: a[2][0]}, r3.Vec{X: a[0][1], Y: a[1][1], Z: a[2][1]})
	det := a[0][0]*c0.X + a[1][0]*c0.Y + a[2][0]*c0.Z
	if det == 0 || math.IsNaN(det) {
		return m3{}, false
	}
	return m3{
		{c0.X / det, c0.Y / det, c0.Z / det},
		{c1.X / det, c1.Y / det, c1.Z / det},
		{c2.X / det, c2.Y / det, c2.Z / det},
	}, true
}

// Col is column j of the rotation: the ground-frame direction of body axis j.
func (a m3) Col(j int) r3.Vec { return r3.Vec{X: a[0][j], Y: a[1][j], Z: a[2][j]} }

// rotOf is the rotation matrix of the quaternion q = (w, x, y, z),
// normalised first.
func rotOf(q []float64) (R m3) {
	rotInto(q, &R)
	return R
}

// rotInto is rotOf written into R, element by element (the evaluations'
// frame: a matrix returned by value is copied once more).
func rotInto(q []float64, R *m3) {
	w, x, y, z := q[0], q[1], q[2], q[3]
	n := 1 / math.Sqrt(w*w+x*x+y*y+z*z)
	w, x, y, z = w*n, x*n, y*n, z*n
	R[0][0], R[0][1], R[0][2] = 1-2*(y*y+z*z), 2*(x*y-w*z), 2*(x*z+w*y)
	R[1][0], R[1][1], R[1][2] = 2*(x*y+w*z), 1-2*(x*x+z*z), 2*(y*z-w*x)
	R[2][0], R[2][1], R[2][2] = 2*(x*z-w*y), 2*(y*z+w*x), 1-2*(x*x+y*y)
}

// quat is a unit quaternion (w, x, y, z).
type quat [4]float64

// quatAxis is the rotation by angle about the unit vector axis.
func quatAxis(axis r3.Vec, angle float64) quat {
	s := math.Sin(angle / 2)
	return quat{math.Cos(angle / 2), s * axis.X, s * axis.Y, s * axis.Z}
}

// mulq is the product a*b (b first, then a).
func mulq(a, b quat) quat {
	return quat{
		a[0]*b[0] - a[1]*b[1] - a[2]*b[2] - a[3]*b[3],
		a[0]*b[1] + a[1]*b[0] + a[2]*b[3] - a[3]*b[2],
		a[0]*b[2] - a[1]*b[3] + a[2]*b[0] + a[3]*b[1],
		a[0]*b[3] + a[1]*b[2] - a[2]*b[1] + a[3]*b[0],
	}
}

// rotateTo is the smallest rotation taking unit vector a to unit vector b.
func rotateTo(a, b r3.Vec) quat {
	ax := r3.Cross(a, b)
	s := r3.Norm(ax)
	c := r3.Dot(a, b)
	if s < 1e-15 {
		if c > 0 {
			return quat{1, 0, 0, 0}
		}
		// Opposite: half a turn about any axis normal to a.
		n := r3.Cross(a, r3.Vec{X: 1})
		if r3.Norm(n) < 1e-6 {
			n = r3.Cross(a, r3.Vec{Y: 1})
		}
		return quatAxis(r3.Unit(n), math.Pi)
	}
	return quatAxis(r3.Scale(1/s, ax), math.Atan2(s, c))
}

// dot9 is the dot product of two 9-vectors, given by pointer: passed by
// value, both were copied at every call (in wasm a copy is 9 loads and 9
// stores each).
//
// The first line checks both pointers for nil before the loop. Go checks
// a pointer where it is first used on each way through the code, so
// without it the check sits in the loop: natively a free memory fault, in
// Go's wasm a test and a call to runtime.sigpanic on every round, which
// keeps the loop's values in memory across it. The same one-line checks
// (or a field read once before a loop) in plainRows, constrained,
// correction, displace, Project, eval and evalForces; -gcflags=-d=nil
// lists where Go checks.
func dot9(a, b *[9]float64) float64 {
	_, _ = a[8], b[8] // the nil checks once, before the loop
	s := 0.0
	for i := range 9 {
		s += a[i] * b[i]
	}
	return s
}

// solve2 solves [a00 a01; a10 a11] x = (b0, b1) as eliminate does
// (partial pivoting; its update of a10 is never read), on local
// variables: solve3's case 2, and accelInto's for two constraints.
func solve2(a00, a01, a10, a11, b0, b1 float64) (x0, x1 float64) {
	if math.Abs(a10) > math.Abs(a00) {
		a00, a01, a10, a11, b0, b1 = a10, a11, a00, a01, b1, b0
	}
	m := a10 / a00
	a11 -= m * a01
	b1 -= m * b0
	x1 = b1 / a11
	return (b0 - a01*x1) / a00, x1
}

// solve3 solves the leading n by n block of a x = b by Gaussian
// elimination with partial pivoting (n <= 3), into x (its first n):
// eliminate's operations, for each n written out on local variables (in
// wasm the arrays' elements are loads and stores, each index checked).
// a and b are left as they were. By pointer: in wasm a copy of an array
// is a memory.copy.
func solve3(a *[3][3]float64, b *[3]float64, n int, x *[3]float64) {
	switch n {
	case 1:
		// One constraint (four legs on one rope): what the elimination
		// comes to for n = 1, without its row swaps and loops.
		x[0] = b[0] / a[0][0]
		return
	case 2:
		// Two (parallel legs, two hook ropes): solve2, on local
		// variables; a and b are left as they were.
		x[0], x[1] = solve2(a[0][0], a[0][1], a[1][0], a[1][1], b[0], b[1])
		return
	case 3:
		// Three (two legs and the hook block): likewise; the updates of
		// the eliminated column are never read, and the rows' swaps
		// swap what is read after them.
		a00, a01, a02 := a[0][0], a[0][1], a[0][2]
		a10, a11, a12 := a[1][0], a[1][1], a[1][2]
		a20, a21, a22 := a[2][0], a[2][1], a[2][2]
		b0, b1, b2 := b[0], b[1], b[2]
		if math.Abs(a10) > math.Abs(a00) {
			if math.Abs(a20) > math.Abs(a10) {
				a00, a01, a02, b0, a20, a21, a22, b2 = a20, a21, a22, b2, a00, a01, a02, b0
			} else {
				a00, a01, a02, b0, a10, a11, a12, b1 = a10, a11, a12, b1, a00, a01, a02, b0
			}
		} else if math.Abs(a20) > math.Abs(a00) {
			a00, a01, a02, b0, a20, a21, a22, b2 = a20, a21, a22, b2, a00, a01, a02, b0
		}
		m1 := a10 / a00
		a11 -= m1 * a01
		a12 -= m1 * a02
		b1 -= m1 * b0
		m2 := a20 / a00
		a21 -= m2 * a01
		a22 -= m2 * a02
		b2 -= m2 * b0
		if math.Abs(a21) > math.Abs(a11) {
			a11, a12, b1, a21, a22, b2 = a21, a22, b2, a11, a12, b1
		}
		m := a21 / a11
		a22 -= m * a12
		b2 -= m * b1
		x2 := b2 / a22
		x1 := (b1 - a12*x2) / a11
		x[0], x[1], x[2] = (b0-a01*x1-a02*x2)/a00, x1, x2
		return
	}
	eliminate(a, b, n, x)
}

// eliminate is solve3's general form, for any n <= 3: Gaussian
// elimination with partial pivoting in place on a and b (rows swapped
// element by element), then back substitution. TestSolve3AsEliminate
// holds solve3's written-out cases to it bit for bit.
func eliminate(a *[3][3]float64, b *[3]float64, n int, x *[3]float64) {
	for c := range n {
		p := c
		for i := c + 1; i < n; i++ {
			if math.Abs(a[i][c]) > math.Abs(a[p][c]) {
				p = i
			}
		}
		for k := range 3 {
			a[c][k], a[p][k] = a[p][k], a[c][k]
		}
		b[c], b[p] = b[p], b[c]
		for i := c + 1; i < n; i++ {
			m := a[i][c] / a[c][c]
			for k := c; k < n; k++ {
				a[i][k] -= m * a[c][k]
			}
			b[i] -= m * b[c]
		}
	}
	for i := n - 1; i >= 0; i-- {
		s := b[i]
		for k := i + 1; k < n; k++ {
			s -= a[i][k] * x[k]
		}
		x[i] = s / a[i][i]
	}
}

// hypot is math.Hypot(p, q): the same operations and special cases (+Inf
// if either is infinite, else NaN if either is NaN, 0 for two zeros),
// written with comparisons; a NaN it returns may differ in its payload.
// In wasm math.Hypot is Go code, a call, where amd64 has it in assembly.
func hypot(p, q float64) float64 {
	if p < 0 {
		p = -p
	}
	if q < 0 {
		q = -q
	}
	if p < q {
		p, q = q, p
	}
	if p > math.MaxFloat64 || q > math.MaxFloat64 {
		return math.Inf(1)
	}
	if p == 0 {
		return q * q // +0, or NaN
	}
	q = q / p
	return p * math.Sqrt(1+q*q)
}

// length is |v| as the square root of v.v: the hardware square root (one
// instruction in wasm too), inlined, where norm is two scaled hypotenuses
// in a call. For the vectors of a load's evaluation (legs and ropes in
// metres, pulls in newtons: far from overflow and underflow) the two agree
// to rounding (TestLengthAsNorm); evalForces asks it four to six times an
// evaluation.
func length(v r3.Vec) float64 { return math.Sqrt(v.X*v.X + v.Y*v.Y + v.Z*v.Z) }

// norm is r3.Norm(v), hypot(v.X, hypot(v.Y, v.Z)), in one call: in wasm
// r3.Norm is three.
func norm(v r3.Vec) float64 {
	// hypot(v.Y, v.Z)
	p, q := v.Y, v.Z
	if p < 0 {
		p = -p
	}
	if q < 0 {
		q = -q
	}
	if p < q {
		p, q = q, p
	}
	var yz float64
	switch {
	case p > math.MaxFloat64 || q > math.MaxFloat64:
		yz = math.Inf(1)
	case p == 0:
		yz = q * q
	default:
		q = q / p
		yz = p * math.Sqrt(1+q*q)
	}
	// hypot(v.X, yz); yz is not negative.
	p, q = v.X, yz
	if p < 0 {
		p = -p
	}
	if p < q {
		p, q = q, p
	}
	if p > math.MaxFloat64 || q > math.MaxFloat64 {
		return math.Inf(1)
	}
	if p == 0 {
		return q * q
	}
	q = q / p
	return p * math.Sqrt(1+q*q)
}

// maxOf is math.Max(x, y): +Inf if either is, else NaN if either is
// NaN, +0 for +0 and -0, else the larger. Go inlines it (cost 78); in
// wasm math.Max is a call (amd64 has it in assembly), and the built-in
// max calls the runtime.
func maxOf(x, y float64) float64 {
	switch {
	case x > y:
		return x
	case y > x:
		return y
	case x == y:
		if math.Signbit(x) {
			return y
		}
		return x
	case x > math.MaxFloat64 || y > math.MaxFloat64:
		return math.Inf(1)
	}
	return math.NaN()
}

// unitOf is r3.Unit(v) with norm: v scaled to length 1, NaN for zero.
func unitOf(v r3.Vec) r3.Vec {
	if v.X == 0 && v.Y == 0 && v.Z == 0 {
		return r3.Vec{X: math.NaN(), Y: math.NaN(), Z: math.NaN()}
	}
	return r3.Scale(1/norm(v), v)
}
