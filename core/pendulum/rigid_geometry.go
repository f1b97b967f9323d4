package pendulum

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// rigidGeometry is what Prepare derives from a Rigid's inputs.
type rigidGeometry struct {
	hookPoint bool // two legs: the hook is a point of its own
	// twoTop: two ropes or legs from two top points S + top_i e (a
	// spreader's parallel legs, or tandem hook ropes), of lengths
	// L(t) + extra_i.
	twoTop     bool
	top, extra [2]float64
	m, mh      float64 // body mass (with four legs: load and hook block), hook point mass
	ib, ibInv  m3      // body inertia about the body's centre of mass, body frame
	loadC      r3.Vec  // the load's centre of mass from the body's
	hook       r3.Vec  // the hook from the body's centre of mass (single hook)
	attach     []r3.Vec
	cons       []constraint
	// plainEnds: every constraint's end a is on the body or the hook and
	// its end b at a top point or on the body (plainRows).
	plainEnds bool
	rest      quat // orientation hanging still
	// Four legs: the stiffness sharing, T_i = share_i . Fs.
	share [4]r3.Vec
	// restCorner are the corners' horizontal offsets from the suspension
	// point hanging still (with a spreader, before any slew).
	restCorner [8]r3.Vec
	// cornerArm are the corners from the body's centre of mass, body
	// frame: loadC + corner(i), each evaluation's sums made once.
	cornerArm [8]r3.Vec
	// restHeading is the direction of the load's length axis hanging
	// still, rad from +x toward +y.
	restHeading float64
	// restOffset is a tandem load's centre of mass from the suspension
	// point hanging still, horizontal part.
	restOffset r3.Vec
	// headCos and headSin are the cosine and sine of Heading + 0: the
	// parallel legs' direction without a slew (frameInto).
	headCos, headSin float64
}

// GeometryError is a hanging arrangement the model cannot take; Leg is
// the leg it concerns, or -1.
type GeometryError struct {
	Leg int
	Msg string
}

func (e *GeometryError) Error() string { return e.Msg }

// Prepare checks the arrangement and derives the geometry (hook point,
// inertia, constraints, the orientation hanging still); call it once
// before any other method.
func (r *Rigid) Prepare() error {
	geo := &rigidGeometry{m: r.Mass}
	k := r.Gyration
	iLoad := m3{{r.Mass * k.X * k.X}, {0, r.Mass * k.Y * k.Y}, {0, 0, r.Mass * k.Z * k.Z}}
	rest := quatAxis(r3.Vec{Z: 1}, r.Heading)
	switch {
	case r.Tandem != nil:
		if err := r.prepareTandem(geo, iLoad, rest); err != nil {
			return err
		}
	case r.Spreader > 0:
		a := r.Spreader
		geo.twoTop, geo.top = true, [2]float64{a, -a}
		geo.attach = []r3.Vec{{X: a, Z: r.SpreaderZ}, {X: -a, Z: r.SpreaderZ}}
		for i := range 2 {
			geo.cons = append(geo.cons, constraint{a: end{kind: onBody, b: geo.attach[i]}, b: end{kind: onTop}, rope: true, coord: -1})
		}
		geo.ib = iLoad
		geo.rest = rest
	case len(r.Legs) == 2:
		if r.HookMass <= 0 {
			return &GeometryError{Leg: -1, Msg: "two legs need the hook block's mass (above 0)"}
		}
		h, err := twoLegHook(r.Legs)
		if err != nil {
			return err
		}
		geo.hookPoint, geo.mh, geo.hook, geo.ib = true, r.HookMass, h, iLoad
		geo.cons = []constraint{{a: end{kind: onHook}, b: end{kind: onTop}, rope: true, coord: -1}}
		for _, l := range r.Legs {
			geo.attach = append(geo.attach, l.Attach)
			geo.cons = append(geo.cons, constraint{a: end{kind: onHook}, b: end{kind: onBody, b: l.Attach}, l: l.Length, coord: -1})
		}
		geo.rest = mulq(rotateTo(quatRot(rest, r3.Scale(-1, r3.Unit(h))), r3.Vec{Z: -1}), rest)
	case len(r.Legs) == 4:
		h, err := fourLegHook(r.Legs)
		if err != nil {
			return err
		}
		// Body: load plus hook block at h; its centre of mass c.
		m := r.Mass + r.HookMass
		c := r3.Scale(r.HookMass/m, h)
		geo.m, geo.loadC, geo.hook = m, r3.Scale(-1, c), r3.Sub(h, c)
		geo.ib = addPoint(addPoint(iLoad, r.Mass, geo.loadC), r.HookMass, geo.hook)
		for _, l := range r.Legs {
			geo.attach = append(geo.attach, r3.Sub(l.Attach, c))
		}
		if !r.Pivot {
			geo.cons = []constraint{{a: end{kind: onBody, b: geo.hook}, b: end{kind: onTop}, rope: true, coord: -1}}
		}
		geo.rest = mulq(rotateTo(quatRot(rest, r3.Scale(-1, r3.Unit(geo.hook))), r3.Vec{Z: -1}), rest)
		if err := geo.sharing(r.Legs); err != nil {
			return err
		}
	default:
		return &GeometryError{Leg: -1, Msg: fmt.Sprintf("%d legs: give two or four legs, or parallel legs", len(r.Legs))}
	}
	if r.Pivot {
		if len(r.Legs) != 4 {
			return &GeometryError{Leg: -1, Msg: "a pivot needs four legs"}
		}
		for c := range 3 {
			geo.cons = append(geo.cons, constraint{a: end{kind: onBody, b: geo.hook}, b: end{kind: onTop}, coord: c})
		}
	}
	geo.plainEnds = true
	for _, c := range geo.cons {
		if c.a.kind != onBody && c.a.kind != onHook || c.b.kind != onTop && c.b.kind != onBody {
			geo.plainEnds = false
		}
	}
	inv, ok := geo.ib.inverse()
	if !ok {
		return &GeometryError{Leg: -1, Msg: "the load's inertia is singular: give radii of gyration above 0"}
	}
	geo.ibInv = inv
	h := r.Heading + 0 // as frameInto adds a slew of zero
	geo.headCos, geo.headSin = math.Cos(h), math.Sin(h)
	r.geo = geo
	R := rotOf(geo.rest[:])
	geo.restHeading = math.Atan2(R[1][0], R[0][0])
	for i := range 8 {
		geo.cornerArm[i] = r3.Add(geo.loadC, r.corner(i))
		c := r3.Sub(r3.Add(geo.loadC, r.corner(i)), geo.hook)
		if geo.twoTop {
			c = r.corner(i)
		}
		geo.restCorner[i] = R.mul(c)
		if r.Tandem != nil {
			geo.restCorner[i] = r3.Add(geo.restCorner[i], geo.restOffset)
		}
		geo.restCorner[i].Z = 0
	}
	return nil
}

// corner i of the box from the load's centre of mass, load axes.
func (r *Rigid) corner(i int) r3.Vec {
	c := r3.Scale(0.5, r.Size)
	if i&1 != 0 {
		c.X = -c.X
	}
	if i&2 != 0 {
		c.Y = -c.Y
	}
	if i&4 != 0 {
		c.Z = -c.Z
	}
	return c
}

// quatRot rotates v by the unit quaternion q.
func quatRot(q quat, v r3.Vec) r3.Vec {
	R := rotOf(q[:])
	return R.mul(v)
}

// addPoint adds to inertia i (about the origin) a mass m whose centre of
// mass is at b: m (|b|^2 1 - b b^T), the parallel axis theorem.
func addPoint(i m3, m float64, b r3.Vec) m3 {
	bb := r3.Dot(b, b)
	v := [3]float64{b.X, b.Y, b.Z}
	for p := range 3 {
		for q := range 3 {
			d := 0.0
			if p == q {
				d = bb
			}
			i[p][q] += m * (d - v[p]*v[q])
		}
	}
	return i
}

// twoLegHook is the hook of two legs hanging still: in the plane through
// the attach line and the load's centre of mass, on the side of the line
// away from it.
func twoLegHook(legs []Leg) (r3.Vec, error) {
	a1, a2 := legs[0].Attach, legs[1].Attach
	span := r3.Norm(r3.Sub(a2, a1))
	if span < 1e-3 {
		return r3.Vec{}, &GeometryError{Leg: 1, Msg: "the two legs attach at the same point: give attach points apart"}
	}
	if legs[0].Length+legs[1].Length <= span*(1+1e-9) {
		return r3.Vec{}, &GeometryError{Leg: 0, Msg: fmt.Sprintf("the two legs (%.4g m and %.4g m) cannot reach a hook between attach points %.4g m apart", legs[0].Length, legs[1].Length, span)}
	}
	u := r3.Scale(1/span, r3.Sub(a2, a1))
	q0 := r3.Sub(a1, r3.Scale(r3.Dot(a1, u), u)) // foot of the centre of mass on the line
	d := r3.Norm(q0)
	if d < 1e-3 || q0.Z <= 0 {
		return r3.Vec{}, &GeometryError{Leg: 0, Msg: "the line through the two attach points must pass above the load's centre of mass, or the load turns over"}
	}
	w := r3.Scale(1/d, q0)
	s1, s2 := r3.Dot(a1, u), r3.Dot(a2, u)
	l1, l2 := legs[0].Length, legs[1].Length
	s := (l1*l1 - l2*l2 + s2*s2 - s1*s1) / (2 * (s2 - s1))
	e2 := l1*l1 - (s-s1)*(s-s1)
	if e2 <= 0 {
		return r3.Vec{}, &GeometryError{Leg: 0, Msg: "the two legs cannot meet above the line between their attach points"}
	}
	return r3.Add(r3.Scale(s, u), r3.Scale(d+math.Sqrt(e2), w)), nil
}

// FourLegMissM is how far four legs may miss one common hook point, m.
const FourLegMissM = 1e-3

// fourLegHook is the point at the legs' lengths from their attach points
// (Gauss-Newton from above their centroid); an error when the legs miss
// it by more than FourLegMissM.
func fourLegHook(legs []Leg) (r3.Vec, error) {
	var c r3.Vec
	lmax := 0.0
	for _, l := range legs {
		c = r3.Add(c, r3.Scale(0.25, l.Attach))
		lmax = math.Max(lmax, l.Length)
	}
	h := r3.Add(c, r3.Vec{Z: lmax})
	for range 60 {
		var jtj m3
		var jtr r3.Vec
		for _, l := range legs {
			d := r3.Sub(h, l.Attach)
			n := r3.Norm(d)
			e := r3.Scale(1/n, d)
			res := n - l.Length
			jtj = addOuter(jtj, e)
			jtr = r3.Add(jtr, r3.Scale(res, e))
		}
		inv, ok := jtj.inverse()
		if !ok {
			return r3.Vec{}, &GeometryError{Leg: 0, Msg: "the four attach points do not fix a hook point: give them at the corners of a rectangle or similar"}
		}
		h = r3.Sub(h, inv.mul(jtr))
	}
	for i, l := range legs {
		if miss := r3.Norm(r3.Sub(h, l.Attach)) - l.Length; math.Abs(miss) > FourLegMissM || math.IsNaN(miss) {
			return r3.Vec{}, &GeometryError{Leg: i, Msg: fmt.Sprintf("the four legs do not meet at one hook: this leg misses the others' meeting point by %.3g m (the model takes the four legs as a rigid frame and needs them to meet within %g m)", miss, FourLegMissM)}
		}
	}
	if h.Z <= 0 {
		return r3.Vec{}, &GeometryError{Leg: 0, Msg: "the hook must be above the load's centre of mass"}
	}
	return h, nil
}

func addOuter(a m3, e r3.Vec) m3 {
	v := [3]float64{e.X, e.Y, e.Z}
	for p := range 3 {
		for q := range 3 {
			a[p][q] += v[p] * v[q]
		}
	}
	return a
}

// sharing sets the stiffness sharing of four legs (legs from the body's
// hook to their attach points, as in the load frame).
func (geo *rigidGeometry) sharing(legs []Leg) error {
	var k m3
	var es [4]r3.Vec
	var ks [4]float64
	for i := range legs {
		d := r3.Sub(geo.attach[i], geo.hook)
		es[i] = r3.Unit(d)
		ks[i] = 1 / legs[i].Length
		for p, vp := range [3]float64{es[i].X, es[i].Y, es[i].Z} {
			for q, vq := range [3]float64{es[i].X, es[i].Y, es[i].Z} {
				k[p][q] += ks[i] * vp * vq
			}
		}
	}
	inv, ok := k.inverse()
	if !ok {
		return &GeometryError{Leg: 0, Msg: "the four legs lie in one plane: they cannot share the load"}
	}
	invT := inv.transpose()
	for i := range legs {
		// T_i = k_i e_i . K^-1 Fs = (k_i K^-T e_i) . Fs
		geo.share[i] = r3.Scale(ks[i], invT.mul(es[i]))
	}
	return nil
}

// HookDepthM is the distance from the hook (where the legs meet) to the
// load's centre of mass hanging still; zero with a spreader.
func (r *Rigid) HookDepthM() float64 {
	if r.geo.twoTop {
		return 0
	}
	return r3.Norm(r3.Sub(r.geo.hook, r.geo.loadC))
}
