package pendulum

import (
	"errors"
	"math"

	"gonum.org/v1/gonum/mat"
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
// share: a sudden start along a symmetric load does not turn it.
func (r *Rigid) ModesAlong(l float64, dir r3.Vec) ([]RigidMode, error) {
	if n := r3.Norm(dir); n == 0 || dir.Z != 0 {
		return nil, errors.New("pendulum: ModesAlong needs a horizontal direction")
	}
	d := r3.Unit(dir)
	return r.modes(l, &d)
}

// shares fills the modes' Share (c is r.Fixed(l); y0 its rest state; nb
// the tangent basis; vecs, vals the eigenvectors and eigenvalues of K in
// the order of out).
func (c *Rigid) shares(out []RigidMode, y0 []float64, nb *mat.Dense, vecs *mat.CDense, vals []complex128, dir r3.Vec) error {
	nd, k := nb.RawMatrix().Rows, nb.RawMatrix().Cols
	// z at rest with the suspension point accelerating along dir, less
	// the same at rest (zero to rounding).
	still := c.frameOf(0, y0)
	z0, _ := c.accel(&still)
	pushed := *c
	pushed.Suspension = func(float64) Kinematics { return Kinematics{Acc: dir} }
	f := pushed.frameOf(0, y0)
	za, _ := pushed.accel(&f)
	u := [9]float64{dir.X, dir.Y, dir.Z, 0, 0, 0, dir.X, dir.Y, dir.Z}
	b := mat.NewVecDense(k, nil)
	for j := range k {
		s := 0.0
		for i := range nd {
			s += nb.At(i, j) * (za[i] - z0[i] - u[i])
		}
		b.SetVec(j, s)
	}
	v := mat.NewDense(k, k, nil)
	for i := range k {
		for j := range k {
			v.Set(i, j, real(vecs.At(i, j)))
		}
	}
	var cm mat.VecDense
	if err := cm.SolveVec(v, b); err != nil {
		return errors.New("pendulum: the modes of the rigid load do not span its motion")
	}
	// The load's centre of mass from the body's, hanging still.
	arm := rotOf(c.geo.rest[:]).mul(c.geo.loadC)
	tot := 0.0
	for j := range out {
		m := &out[j]
		lam := real(vals[j])
		if m.Free || lam <= 0 {
			continue
		}
		dx := r3.Vec{X: m.Shape[0], Y: m.Shape[1], Z: m.Shape[2]}
		th := r3.Vec{X: m.Shape[3], Y: m.Shape[4], Z: m.Shape[5]}
		y := r3.Dot(dir, r3.Add(dx, r3.Cross(th, arm)))
		m.Share = math.Abs(cm.AtVec(j) * y / lam)
		tot += m.Share
	}
	if tot == 0 {
		return nil
	}
	for j := range out {
		out[j].Share /= tot
	}
	return nil
}
