package pendulum

import (
	"errors"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// RigidMode is one small-oscillation mode of a Rigid hanging from a fixed
// suspension point.
type RigidMode struct {
	_ [0]func() // never compared: no equality code in the wasm
	// PeriodS is the period, s; zero for a mode without restoring force
	// (Free: the twist of a load on one hook).
	PeriodS float64
	Free    bool
	// Kind names what moves most, by kinetic energy share: "swing along"
	// or "swing across" (the load's centre of mass moving along or across
	// its length), "pitch" (turning about its width axis), "roll" (about
	// its length axis), "twist" (about the vertical), "hook" (the hook
	// block between two legs, moving most by its own kinetic energy).
	Kind string
	// Shape is the mode in the tangent space of the constraints: the
	// body's displacement, its small rotation (ground frame) and, with two
	// legs, the hook's displacement (9 numbers).
	Shape [9]float64
	// Share is the mode's share of the load's swing along a direction
	// after a sudden start (ModesAlong; zero from Modes and for a free
	// mode).
	Share float64
}

// freeOmega2 is the largest omega^2, 1/s^2, taken as no restoring force
// (a period above about 20000 s).
const freeOmega2 = 1e-7

// Modes returns the small-oscillation modes about hanging still at rope
// length l, slowest first, free modes last. It linearises the equations
// numerically: N is an orthonormal basis of the null space of the
// constraint gradient G (the displacements the rope and legs allow; by a
// one-sided Jacobi SVD, smallmat.go); the accelerations z(eta) for a
// displacement N eta from rest, by fourth-order central differences (step
// about 1e-3; the constraint violation, even in eta, cancels), lie in the
// same space to first order, so eta” = N^T dz/deta eta = -K eta and
// omega^2 are the eigenvalues of K. Velocity terms are of second order at
// rest. K = M_N^-1 S with M_N = N^T M N the mass matrix in that space (M
// the block diagonal of the body's mass, its inertia in the ground frame
// and the hook's mass) and S the stiffness, symmetric for a conservative
// system (any mechanics text on small oscillations). So the modes come
// from the symmetric problem S x = omega^2 M_N x: with M_N = L L^T
// (Cholesky), the eigenvalues of L^-1 S L^-T by Jacobi rotations, S taken
// as the symmetric part of M_N K (its antisymmetric part is the
// differences' error). Each shape is scaled to unit length with its
// largest component positive.
func (r *Rigid) Modes(l float64) ([]RigidMode, error) { return r.modes(l, nil) }

func (r *Rigid) modes(l float64, dir *r3.Vec) ([]RigidMode, error) {
	c := r.Fixed(l)
	y0 := c.Rest(0)
	nd := 6
	if c.geo.hookPoint {
		nd = 9
	}
	f0 := c.frameOf(0, y0)
	rws := c.rows(&f0, nil)
	g := newDense(len(rws), nd)
	for i, rw := range rws {
		copy(g[i], rw.j[:nd])
	}
	nb := nullSpace(g, nd, 1e-10)
	k := len(nb[0])
	// Fourth-order central differences, f'(0) = (f(-2h) - 8 f(-h) + 8 f(h)
	// - f(2h)) / (12 h): truncation about h^4, rounding about 1e-16/h. The
	// step is 1e-3 (m and rad) times the smallest radius of gyration in m
	// when that is below 1 m: a small load's fast turning modes vary on
	// that scale.
	h := 1e-3 * math.Min(1, math.Min(c.Gyration.X, math.Min(c.Gyration.Y, c.Gyration.Z)))
	dz := newDense(nd, k)
	y := make([]float64, len(y0)) // each displaced state, made afresh from y0
	for j := range k {
		var zs [4][9]float64
		for n, step := range [4]float64{-2 * h, -h, h, 2 * h} {
			var d [9]float64
			for i := range nd {
				d[i] = step * nb[i][j]
			}
			copy(y, y0)
			c.displace(y, &d)
			f := c.frameOf(0, y)
			zs[n], _ = c.accel(&f)
		}
		for i := range nd {
			dz[i][j] = (zs[0][i] - 8*zs[1][i] + 8*zs[2][i] - zs[3][i]) / (12 * h)
		}
	}
	// The mass matrix M, then M N.
	geo := c.geo
	iw := f0.R.mul3(geo.ib).mul3(f0.R.transpose())
	mn := newDense(nd, k)
	for j := range k {
		for i := range 3 {
			mn[i][j] = geo.m * nb[i][j]
			for q := range 3 {
				mn[3+i][j] += iw[i][q] * nb[3+q][j]
			}
			if nd == 9 {
				mn[6+i][j] = geo.mh * nb[6+i][j]
			}
		}
	}
	// M_N = N^T M N and M_N K = -N^T M N N^T dz = -(M N)^T dz, as N N^T
	// projects onto the null space, where dz lies to first order; the
	// symmetric part of the latter is S.
	mk, kr := newDense(k, k), newDense(k, k)
	for a := range k {
		for b := range k {
			for i := range nd {
				mk[a][b] += nb[i][a] * mn[i][b]
				kr[a][b] -= mn[i][a] * dz[i][b]
			}
		}
	}
	ll, ok := cholesky(mk)
	if !ok {
		return nil, errors.New("pendulum: the mass matrix of the linearised model is not positive definite")
	}
	// C = L^-1 S L^-T: S's columns through L^-1, then its rows.
	sym := newDense(k, k)
	for a := range k {
		for b := range k {
			sym[a][b] = 0.5 * (kr[a][b] + kr[b][a])
		}
	}
	col := make([]float64, k)
	for b := range k {
		for a := range k {
			col[a] = sym[a][b]
		}
		lowerSolve(ll, col, false)
		for a := range k {
			sym[a][b] = col[a]
		}
	}
	for a := range k {
		lowerSolve(ll, sym[a], false)
	}
	vals, vecs := symEigen(sym)
	// The eigenvectors in the coordinates eta, x = L^-T y (columns of xs):
	// M_N-orthonormal, so xs^-1 = xs^T M_N.
	xs := newDense(k, k)
	for j := range k {
		for a := range k {
			col[a] = vecs[a][j]
		}
		lowerSolve(ll, col, true)
		for a := range k {
			xs[a][j] = col[a]
		}
	}
	out := make([]RigidMode, k)
	for j := range k {
		w2 := vals[j]
		md := &out[j]
		if w2 < freeOmega2 {
			md.Free = true
		} else {
			md.PeriodS = 2 * math.Pi / math.Sqrt(w2)
		}
		md.Shape = shapeOf(nb, xs, j)
		norm, big := 0.0, 0.0
		for _, s := range md.Shape {
			norm += s * s
			if math.Abs(s) > math.Abs(big) {
				big = s
			}
		}
		if norm > 0 {
			f := 1 / math.Copysign(math.Sqrt(norm), big)
			for i := range md.Shape {
				md.Shape[i] *= f
			}
		}
		md.Kind = c.kindOf(md.Shape)
	}
	if dir != nil {
		c.shares(out, y0, nb, xs, mk, vals, *dir)
	}
	sortModes(out)
	return out, nil
}

// sortModes sorts modes slowest first, free modes last, keeping the order
// of equal ones: an insertion sort, for the nine modes at most
// (sort.SliceStable's swapper is made by reflection, an allocation and
// calls that in wasm cost more than the sort).
func sortModes(ms []RigidMode) {
	before := func(a, b *RigidMode) bool {
		if a.Free != b.Free {
			return !a.Free
		}
		return a.PeriodS > b.PeriodS
	}
	for i := 1; i < len(ms); i++ {
		for j := i; j > 0 && before(&ms[j], &ms[j-1]); j-- {
			ms[j], ms[j-1] = ms[j-1], ms[j]
		}
	}
}

// shapeOf is N x_j, the j-th column of xs in the constraints' tangent
// space.
func shapeOf(nb, xs dense, j int) (s [9]float64) {
	for i := range nb {
		for q := range xs {
			s[i] += nb[i][q] * xs[q][j]
		}
	}
	return s
}

// kindOf names a mode shape by its largest kinetic energy share.
func (r *Rigid) kindOf(s [9]float64) string {
	geo := r.geo
	R := rotOf(geo.rest[:])
	dx := r3.Vec{X: s[0], Y: s[1], Z: s[2]}
	Rt := R.transpose()
	th := Rt.mul(r3.Vec{X: s[3], Y: s[4], Z: s[5]})
	ex := R.Col(0)
	along := r3.Dot(dx, r3.Unit(r3.Vec{X: ex.X, Y: ex.Y}))
	across := math.Sqrt(math.Max(0, dx.X*dx.X+dx.Y*dx.Y-along*along))
	names := []string{"swing along", "swing across", "roll", "pitch", "twist", "hook"}
	e := []float64{geo.m * along * along, geo.m * across * across,
		geo.ib[0][0] * th.X * th.X, geo.ib[1][1] * th.Y * th.Y, geo.ib[2][2] * th.Z * th.Z, 0}
	if geo.hookPoint {
		e[5] = geo.mh * (s[6]*s[6] + s[7]*s[7] + s[8]*s[8])
	}
	best := 0
	for i := range e {
		if e[i] > e[best] {
			best = i
		}
	}
	return names[best]
}

// Fixed is a copy of r under a still suspension point at the origin on a
// rope (or parallel legs) of constant length l, without applied force.
func (r *Rigid) Fixed(l float64) *Rigid {
	c := *r
	c.Suspension = func(float64) Kinematics { return Kinematics{} }
	c.Rope = func(float64) (float64, float64, float64) { return l, 0, 0 }
	c.Force, c.Yaw, c.Travel = nil, nil, nil
	return &c
}

// Displace moves state y along a mode shape, scaled so that its largest
// component is amp (m or rad), and puts it back on the constraints.
func (r *Rigid) Displace(y []float64, shape [9]float64, amp float64) {
	big := 0.0
	for _, v := range shape {
		big = math.Max(big, math.Abs(v))
	}
	var d [9]float64
	for i, v := range shape {
		d[i] = amp * v / big
	}
	r.displace(y, &d)
	r.Project(y)
}
