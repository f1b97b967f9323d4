package pendulum

import (
	"math"
	"sort"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/ode"
	"swaysheet/core/units"
)

// Source: the linearised two-mass pendulum. Its Lagrange equations in the
// absolute angles (theta1, theta2) are M theta¨ + K theta = 0 with
// M = [[(m1+m2) L1^2, m2 L1 L2], [m2 L1 L2, m2 L2^2]] and
// K = diag((m1+m2) g L1, m2 g L2); the squared frequencies are the
// eigenvalues of M^-1 K, computed here with gonum's mat.Eigen as the
// reference library and compared with the closed form of LinearModes.
func TestLinearModesAgainstEigenvalues(t *testing.T) {
	for _, c := range []struct{ m1, m2, l1, l2 float64 }{
		{500, 8000, 10, 3},  // light hook, long slings
		{2000, 1000, 15, 1}, // heavy block, light load
		{300, 300, 4, 4},    // equal masses and lengths
		{50, 20000, 20, 0.5},
	} {
		md := LinearModes(c.m1, c.m2, c.l1, c.l2, g)
		m := c.m1 + c.m2
		M := mat.NewDense(2, 2, []float64{m * c.l1 * c.l1, c.m2 * c.l1 * c.l2, c.m2 * c.l1 * c.l2, c.m2 * c.l2 * c.l2})
		K := mat.NewDense(2, 2, []float64{m * g * c.l1, 0, 0, c.m2 * g * c.l2})
		var minv, a mat.Dense
		if err := minv.Inverse(M); err != nil {
			t.Fatal(err)
		}
		a.Mul(&minv, K)
		var eig mat.Eigen
		if !eig.Factorize(&a, mat.EigenNone) {
			t.Fatal("eigen failed")
		}
		vals := eig.Values(nil)
		w2 := []float64{real(vals[0]), real(vals[1])}
		sort.Float64s(w2)
		for i := range 2 {
			if got := md.Omega[i] * md.Omega[i]; math.Abs(got/w2[i]-1) > 1e-12 {
				t.Errorf("%+v mode %d: w^2 %.12g, eigenvalue %.12g", c, i, got, w2[i])
			}
			// The shape satisfies (K - w^2 M) v = 0 in both rows.
			v := md.Shape[i]
			r2 := -w2[i]*M.At(1, 0)*v[0] + (K.At(1, 1)-w2[i]*M.At(1, 1))*v[1]
			if math.Abs(r2) > 1e-9*K.At(1, 1) {
				t.Errorf("%+v mode %d: shape residual %g", c, i, r2)
			}
		}
		if s := md.LoadShare[0] + md.LoadShare[1]; math.Abs(s-1) > 1e-12 {
			t.Errorf("shares add to %v", s)
		}
	}
}

func fixedDouble(m1, m2, l1, l2 float64) *Double {
	return &Double{M1: m1, M2: m2, L2: l2,
		Suspension: func(float64) Kinematics { return Kinematics{} },
		Rope:       func(float64) (float64, float64, float64) { return l1, 0, 0 },
	}
}

// Source: conservation of energy with a fixed suspension point and no
// drag (any mechanics text): E = sum of m|v|^2/2 + m g z over both masses.
func TestDoubleEnergyConserved(t *testing.T) {
	d := fixedDouble(800, 3000, 9, 4)
	y := append(StateFromSwing(20*units.Degree, 0, 0, 0.5, 1), StateFromSwing(35*units.Degree, 1.2, 0.4, -0.8, 1)...)
	energy := func(y []float64) float64 {
		var p Point
		d.Eval(0, y, &p)
		vh := r3.Add(p.Suspension.Vel, r3.Scale(9, p.Rate))
		return 0.5*d.M1*r3.Dot(vh, vh) + d.M1*g*p.HookPos.Z + 0.5*d.M2*r3.Dot(p.LoadVel, p.LoadVel) + d.M2*g*p.LoadPos.Z
	}
	e0 := energy(y)
	scale := (d.M1 + d.M2) * g * 13
	v := ode.New(d.Func, DoubleStateLen, ode.Settings{RelTol: 1e-12, AbsTol: 1e-14})
	v.Reset(0, y)
	worst := 0.0
	for {
		done, err := v.Step(300)
		if err != nil {
			t.Fatal(err)
		}
		yy := v.State()
		d.Project(yy)
		v.SetState(yy)
		worst = math.Max(worst, math.Abs(energy(yy)-e0)/scale)
		if done {
			break
		}
	}
	if worst > 1e-9 {
		t.Errorf("energy drift %.3g of (m1+m2) g (L1+L2) over 300 s", worst)
	}
}

// Source: static equilibrium (Newton's law): hanging still, the rope
// carries (m1+m2) g and the rigging m2 g.
func TestDoubleStaticTensions(t *testing.T) {
	d := fixedDouble(700, 5000, 8, 3)
	var p Point
	d.Eval(0, DoubleStateFromSwing(0, 0, 0, 0, 8, 3), &p)
	if want := (d.M1 + d.M2) * g; math.Abs(p.Tension/want-1) > 1e-14 {
		t.Errorf("rope tension %v, want %v", p.Tension, want)
	}
	if want := d.M2 * g; math.Abs(p.RiggingTension/want-1) > 1e-14 {
		t.Errorf("rigging tension %v, want %v", p.RiggingTension, want)
	}
}
