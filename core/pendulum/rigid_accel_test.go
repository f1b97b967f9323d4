package pendulum

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// accelByParts is accelInto with M^-1 applied by minv and every system
// solved by solve3: the general form it was written out from.
func (r *Rigid) accelByParts(f *frame, z *[9]float64, lam *[3]float64) {
	geo := r.geo
	var buf [3]row
	rws := r.rows(f, buf[:0])
	g := r3.Vec{Z: -r.g()}
	var iw, iwInv m3
	conjugate(&f.R, &geo.ib, &iw)
	conjugate(&f.R, &geo.ibInv, &iwInv)
	fx := r3.Scale(geo.m, g)
	tq := r3.Scale(-1, r3.Cross(f.w, iw.mul(f.w)))
	if r.Force != nil {
		armL := f.R.mul(geo.loadC)
		pos := r3.Add(f.x, armL)
		vel := r3.Add(f.v, r3.Cross(f.w, armL))
		fl := r.Force(f.t, pos, vel)
		fx = r3.Add(fx, fl)
		tq = r3.Add(tq, r3.Cross(armL, fl))
	}
	fp := r3.Scale(geo.mh, g)
	var fg [9]float64
	fg[0], fg[1], fg[2], fg[3], fg[4], fg[5], fg[6], fg[7], fg[8] = fx.X, fx.Y, fx.Z, tq.X, tq.Y, tq.Z, fp.X, fp.Y, fp.Z
	mf := z
	geo.minv(&iwInv, &fg, mf)
	n := len(rws)
	var a [3][3]float64
	var b [3]float64
	var mj [3][9]float64
	for i := range n {
		geo.minv(&iwInv, &rws[i].j, &mj[i])
	}
	for i := range n {
		for k := range n {
			a[i][k] = dot9(&rws[i].j, &mj[k])
		}
		b[i] = -rws[i].kappa - dot9(&rws[i].j, mf)
	}
	solve3(&a, &b, n, lam)
	for i := range n {
		for k := range 9 {
			z[k] += lam[i] * mj[i][k]
		}
	}
}

// minv writes M^-1 v into o: the generalized mass matrix's inverse
// applied to a generalized vector, iwInv the inverse inertia in the
// ground frame.
func (geo *rigidGeometry) minv(iwInv *m3, v, o *[9]float64) {
	a := r3.Scale(1/geo.m, r3.Vec{X: v[0], Y: v[1], Z: v[2]})
	b := iwInv.mul(r3.Vec{X: v[3], Y: v[4], Z: v[5]})
	o[0], o[1], o[2], o[3], o[4], o[5] = a.X, a.Y, a.Z, b.X, b.Y, b.Z
	if geo.mh > 0 {
		o[6], o[7], o[8] = v[6]/geo.mh, v[7]/geo.mh, v[8]/geo.mh
	} else {
		o[6], o[7], o[8] = 0, 0, 0
	}
}

// accelInto (minv written out, one constraint by a division) and
// accelByParts give the same bits for every arrangement, moving, with and
// without an applied force.
func TestAccelAsByParts(t *testing.T) {
	for name, r := range movingArrangements() {
		for _, force := range []bool{false, true} {
			r.Force = nil
			if force {
				r.Force = func(t float64, pos, vel r3.Vec) r3.Vec {
					return r3.Vec{X: 900 - 40*vel.X, Y: 300 * pos.Z, Z: -20 * vel.Z}
				}
			}
			mustPrepare(t, r)
			y := offRest(r)
			for _, tm := range []float64{0.7, 2.3} {
				f := r.frameOf(tm, y)
				var z, zw [9]float64
				var lam, lamw [3]float64
				r.accelInto(&f, &z, &lam)
				r.accelByParts(&f, &zw, &lamw)
				if z != zw || lam != lamw {
					t.Errorf("%s, force %v, t = %g s: accelInto %v %v, accelByParts %v %v", name, force, tm, z, lam, zw, lamw)
				}
			}
		}
	}
}
