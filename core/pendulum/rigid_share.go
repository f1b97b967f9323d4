package pendulum

import (
	"errors"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// ModesAlong is Modes with each mode's Share of the load's swing along the
// horizontal unit vector dir after a sudden start of the suspension point
// along dir (what a crane's move does).
//
// Linear theory (modal superposition; any vibration text): in the tangent
// coordinates eta of Modes, measured from the suspension point, a
// suspension acceleration a gives eta” = -K eta + b a, b = N^T (z_a - u),
// z_a the accelerations at rest when the suspension point accelerates at
// a unit rate along dir (the constraint forces included) and u the same
// translation of every point (the frame's own acceleration, taken off so
// that eta is relative to the suspension point). With K = V Lambda V^-1
// the modal coordinates xi = V^-1 eta obey xi_i” = -lambda_i xi_i + c_i a,
// c = V^-1 b: from rest a sudden a swings mode i about its static
// deflection c_i a / lambda_i with that amplitude. The load's swing is the
// horizontal motion of its centre of mass along dir, y_i per unit of mode
// i, so mode i carries |c_i y_i / lambda_i| of it; Share is that over the
// sum of all modes. This is what pendulum.LinearModes computes for the
// hook block (its LoadShare). A free mode (twist on one hook) has no
// share: a sudden start along a symmetric load does not turn it. Modes'
// eigenvectors are M_N-orthonormal, so V^-1 = V^T M_N: no system to solve.
func (r *Rigid) ModesAlong(l float64, dir r3.Vec) ([]RigidMode, error) {
	if n := r3.Norm(dir); n == 0 || dir.Z != 0 {
		return nil, errors.New("pendulum: ModesAlong needs a horizontal direction")
	}
	d := r3.Unit(dir)
	return r.modes(l, &d)
}

// shares fills the modes' Share (c is r.Fixed(l); y0 its rest state; nb
// the tangent basis; xs the eigenvectors of K in eta, M_N-orthonormal, and
// vals their eigenvalues, in the order of out; mk is M_N).
func (c *Rigid) shares(out []RigidMode, y0 []float64, nb, xs, mk dense, vals []float64, dir r3.Vec) {
	nd, k := len(nb), len(xs)
	// z at rest with the suspension point accelerating along dir, less
	// the same at rest (zero to rounding).
	still := c.frameOf(0, y0)
	z0, _ := c.accel(&still)
	pushed := *c
	pushed.Suspension = func(float64) Kinematics { return Kinematics{Acc: dir} }
	f := pushed.frameOf(0, y0)
	za, _ := pushed.accel(&f)
	u := [9]float64{dir.X, dir.Y, dir.Z, 0, 0, 0, dir.X, dir.Y, dir.Z}
	b := make([]float64, k)
	for j := range k {
		for i := range nd {
			b[j] += nb[i][j] * (za[i] - z0[i] - u[i])
		}
	}
	// The load's centre of mass from the body's, hanging still.
	R := rotOf(c.geo.rest[:])
	arm := R.mul(c.geo.loadC)
	tot := 0.0
	for j := range out {
		m := &out[j]
		lam := vals[j]
		if m.Free || lam <= 0 {
			continue
		}
		cj := 0.0 // (V^T M_N b)_j
		for a := range k {
			for q := range k {
				cj += xs[a][j] * mk[a][q] * b[q]
			}
		}
		s := shapeOf(nb, xs, j) // the same scale as cj's eigenvector
		dx := r3.Vec{X: s[0], Y: s[1], Z: s[2]}
		th := r3.Vec{X: s[3], Y: s[4], Z: s[5]}
		y := r3.Dot(dir, r3.Add(dx, r3.Cross(th, arm)))
		m.Share = math.Abs(cj * y / lam)
		tot += m.Share
	}
	if tot == 0 {
		return
	}
	for j := range out {
		out[j].Share /= tot
	}
}
