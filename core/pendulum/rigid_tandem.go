package pendulum

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// TandemRopes hangs a Rigid from two hook ropes: a tandem lift by two
// hoists or trolleys on one crane.
//
// Formulation. The two suspension points are S(t) + Top_i e(t), e the
// load's heading turned with the crane's slew (Yaw), so both move with
// the crane's suspension point S(t) and keep their spacing Top_0 - Top_1
// along that line. Rope i is one distance constraint of length
// L(t) + Extra_i from its suspension point to its attach point Attach_i
// (load axes, from the load's centre of mass): the hoists work together,
// so hoisting changes both ropes alike. The load is the same rigid body
// as for the other suspensions (Newton-Euler with constraint multipliers,
// rigid.go), with two rows in J; a rope's tension is -lambda l_i. With
// Top_i = +/-a, Attach_i = (+/-a, 0, z) and Extra = 0 it is the
// spreader's bifilar suspension, to the last bit.
//
// Assumptions: the ropes do not stretch and stay taut (a constraint
// pulls and pushes alike; a tension at or below zero means a slack rope
// and the model no longer holds: the evaluation flags it); the ropes are
// straight and massless; the hook blocks are lumped with the load; each
// rope turns freely at its suspension point and its attach point.
//
// Hanging still. The attach points carry the ropes' forces, which have no
// moment about the line through them, so the load's centre of mass hangs
// in the vertical plane through that line, below it; and with the two
// suspension points on a horizontal line, the ropes, the attach line and
// the centre of mass all lie in the vertical plane through the
// suspension points (a planar four-bar linkage with the load as its
// coupler). The rest is the minimum of the centre of mass's height over
// the linkage's one degree of freedom, the angle alpha of rope 1 from
// the vertical (potential energy; any mechanics text on statics): a scan
// over alpha in (-90, 90) deg, golden-section search in the best
// interval, then the secant method on dE/dalpha (fourth-order central
// differences), to about 1e-12 rad.
type TandemRopes struct {
	_      [0]func()  // never compared: no equality code in the wasm
	Top    [2]float64 // the suspension points along the heading from S, m (Top[0] > Top[1])
	Attach [2]r3.Vec  // attach points, load axes from its centre of mass, m
	Extra  [2]float64 // rope i's length is L(t) + Extra[i], m
}

// prepareTandem sets the two-rope geometry and the orientation hanging
// still at the rope length at t = 0.
func (r *Rigid) prepareTandem(geo *rigidGeometry, iLoad m3, heading quat) error {
	t := r.Tandem
	if r.Spreader > 0 || len(r.Legs) > 0 || r.Pivot {
		return &GeometryError{Leg: -1, Msg: "two hook ropes replace the legs and the spreader"}
	}
	if !(t.Top[0] > t.Top[1]) {
		return &GeometryError{Leg: -1, Msg: "rope 0's suspension point must lie toward the load's heading from rope 1's"}
	}
	geo.twoTop, geo.top, geo.extra, geo.ib = true, t.Top, t.Extra, iLoad
	geo.attach = []r3.Vec{t.Attach[0], t.Attach[1]}
	for i := range 2 {
		geo.cons = append(geo.cons, constraint{a: end{kind: onBody, b: t.Attach[i]}, b: end{kind: onTop}, rope: true, extra: t.Extra[i], coord: -1})
	}
	span := r3.Norm(r3.Sub(t.Attach[0], t.Attach[1]))
	if span < 1e-3 {
		return &GeometryError{Leg: 1, Msg: "the two ropes attach at the same point: give attach points apart"}
	}
	u := r3.Scale(1/span, r3.Sub(t.Attach[0], t.Attach[1]))
	foot := r3.Add(t.Attach[1], r3.Scale(-r3.Dot(t.Attach[1], u), u))
	if r3.Norm(foot) < 1e-3 || foot.Z <= 0 {
		return &GeometryError{Leg: -1, Msg: "the line through the two attach points must pass above the load's centre of mass, or the load turns over"}
	}
	l := 0.0
	if r.Rope != nil {
		l, _, _ = r.Rope(0)
	}
	for i := range 2 {
		if l+t.Extra[i] <= 0 {
			return &GeometryError{Leg: i, Msg: fmt.Sprintf("rope %d has no length", i)}
		}
	}
	q, c, _, ok := tandemRestAt(t, heading, l, 0, false)
	if !ok {
		return &GeometryError{Leg: 0, Msg: fmt.Sprintf("the two ropes (%.4g m and %.4g m, %.4g m apart at the crane) cannot hold the attach points %.4g m apart below their suspension points", l+t.Extra[0], l+t.Extra[1], t.Top[0]-t.Top[1], span)}
	}
	geo.rest = q
	geo.restOffset = r3.Vec{X: c.X, Y: c.Y}
	return nil
}

// tandemMemo is the last rest solved, the start of the next.
type tandemMemo struct {
	_        [0]func() // never compared: no equality code in the wasm
	l, alpha float64
	q        quat
	c        r3.Vec
	ok       bool
	// The corners' horizontal offsets hanging still and the heading at
	// l (tandemCorners), once cornersSet.
	corners    [8]r3.Vec
	heading    float64
	cornersSet bool
}

// tandemCorners are the corners' horizontal offsets from the suspension
// point and the load's heading hanging still at rope length l, and its
// centre of mass there (tandemRest): the evaluation's corner swing and
// twist measure from them. Kept with the rest they come from (they
// change with l alone: on a run without a hoist every evaluation asked
// for the same ones); when the rest is not kept (its solve failed) they
// are made into the scratch.
func (r *Rigid) tandemCorners(l float64) (*[8]r3.Vec, float64, r3.Vec) {
	q, c := r.tandemRest(l)
	m := &r.tmemo
	if m.ok && m.l == l {
		if !m.cornersSet {
			m.heading = r.restCornersInto(q, c, &m.corners)
			m.cornersSet = true
		}
		return &m.corners, m.heading, c
	}
	h := r.restCornersInto(q, c, &r.sc.corners)
	return &r.sc.corners, h, c
}

// restCornersInto writes into rc the corners' horizontal offsets from
// the suspension point of the load at orientation q with its centre of
// mass at c from it, and returns the heading of its length axis.
func (r *Rigid) restCornersInto(q quat, c r3.Vec, rc *[8]r3.Vec) float64 {
	R := rotOf(q[:])
	for i := range 8 {
		rc[i] = r3.Add(R.mul(r.corner(i)), c)
		rc[i].Z = 0
	}
	return math.Atan2(R[1][0], R[0][0])
}

// tandemRest is the orientation and the centre of mass (from a still
// suspension point) hanging still at rope length l; the last answer is
// kept, and the next solve starts from it.
func (r *Rigid) tandemRest(l float64) (quat, r3.Vec) {
	m := &r.tmemo
	if m.ok && m.l == l {
		return m.q, m.c
	}
	q, c, alpha, ok := tandemRestAt(r.Tandem, quatAxis(r3.Vec{Z: 1}, r.Heading), l, m.alpha, m.ok)
	if !ok {
		return r.geo.rest, r3.Vec{Z: -l}
	}
	*m = tandemMemo{l: l, alpha: alpha, q: q, c: c, ok: true}
	return q, c
}

// fourBar is the planar linkage of a tandem lift in the vertical plane
// through the suspension points: coordinates (u, z), u along the heading.
type fourBar struct {
	t0, t1   float64 // suspension points' u
	l0, l1   float64 // rope lengths
	d        float64 // attach points apart
	along, p float64 // the centre of mass's foot on the attach line from attach point 1, and its distance below it
}

// at is the centre of mass (u, z) and the attach line's direction with
// rope 1 at angle alpha from the vertical; ok false when the linkage does
// not close there.
func (b *fourBar) at(alpha float64) (cu, cz, su, sz float64, ok bool) {
	a1u, a1z := b.t1+b.l1*math.Sin(alpha), -b.l1*math.Cos(alpha)
	wu, wz := b.t0-a1u, -a1z // from attach point 1 to suspension point 0
	dd := math.Hypot(wu, wz)
	if dd == 0 {
		return 0, 0, 0, 0, false
	}
	a := (b.d*b.d - b.l0*b.l0 + dd*dd) / (2 * dd)
	h2 := b.d*b.d - a*a
	if h2 < 0 {
		return 0, 0, 0, 0, false
	}
	h := math.Sqrt(h2)
	// Attach point 0 on the clockwise side of the line from attach point
	// 1 to suspension point 0 (the uncrossed linkage).
	a0u := a1u + (a*wu+h*wz)/dd
	a0z := a1z + (a*wz-h*wu)/dd
	su, sz = (a0u-a1u)/b.d, (a0z-a1z)/b.d
	// The normal (sz, -su) points below the attach line.
	cu = a1u + b.along*su + b.p*sz
	cz = a1z + b.along*sz - b.p*su
	return cu, cz, su, sz, a0z < 0
}

// tandemRestAt solves the four-bar for the state hanging still at rope
// length l (see TandemRopes), and returns its angle alpha; warm starts
// the secant steps at alpha0, without the scan and the search (the rest
// moves little between two nearby rope lengths).
func tandemRestAt(t *TandemRopes, heading quat, l, alpha0 float64, warm bool) (quat, r3.Vec, float64, bool) {
	a0, a1 := t.Attach[0], t.Attach[1]
	d := r3.Norm(r3.Sub(a0, a1))
	ub := r3.Scale(1/d, r3.Sub(a0, a1))
	along := -r3.Dot(a1, ub)
	foot := r3.Add(a1, r3.Scale(along, ub))
	pb := r3.Scale(-1, foot) // from the attach line to the centre of mass
	b := fourBar{t0: t.Top[0], t1: t.Top[1], l0: l + t.Extra[0], l1: l + t.Extra[1], d: d, along: along, p: r3.Norm(pb)}
	height := func(alpha float64) float64 {
		_, cz, _, _, ok := b.at(alpha)
		if !ok {
			return math.Inf(1)
		}
		return cz
	}
	start := alpha0
	if !warm {
		var ok bool
		if start, ok = searchRest(height); !ok {
			return quat{}, r3.Vec{}, 0, false
		}
	}
	// Secant on dE/dalpha, fourth-order central differences.
	const hd = 1e-3
	slope := func(x float64) float64 {
		return (height(x-2*hd) - 8*height(x-hd) + 8*height(x+hd) - height(x+2*hd)) / (12 * hd)
	}
	xa, xb := start, start+1e-7
	fa, fb := slope(xa), slope(xb)
	for range 20 {
		if fb == fa || math.IsInf(fb, 0) || math.IsNaN(fb) {
			break
		}
		xn := xb - fb*(xb-xa)/(fb-fa)
		if math.Abs(xn-xb) > 1e-3 {
			break // left the minimum's neighbourhood: keep the search's answer
		}
		xa, fa, xb = xb, fb, xn
		fb = slope(xb)
		if math.Abs(xb-xa) < 1e-15 {
			break
		}
	}
	cu, cz, su, sz, ok := b.at(xb)
	if !ok {
		return quat{}, r3.Vec{}, 0, false
	}
	// The rotation taking the body's frame (ub, pb/|pb|, ub x pb) to the
	// ground's (s, n, s x n), s the attach line, n below it, in the
	// vertical plane along the heading e.
	e := quatRot(heading, r3.Vec{X: 1})
	sg := r3.Add(r3.Scale(su, e), r3.Vec{Z: sz})
	ng := r3.Add(r3.Scale(sz, e), r3.Vec{Z: -su})
	pn := r3.Unit(pb)
	B := frameCols(ub, pn, r3.Cross(ub, pn))
	G := frameCols(sg, ng, r3.Cross(sg, ng))
	q := quatOf(G.mul3(B.transpose()))
	return q, r3.Add(r3.Scale(cu, e), r3.Vec{Z: cz}), xb, true
}

// searchRest is the lowest point of height(alpha) over (-90, 90) deg: a
// scan in 2000 steps, then golden-section search between the best
// sample's neighbours.
func searchRest(height func(float64) float64) (float64, bool) {
	const n = 2000
	best, bi := math.Inf(1), -1
	for i := 1; i < n; i++ {
		if e := height(math.Pi * (float64(i)/n - 0.5)); e < best {
			best, bi = e, i
		}
	}
	if bi < 0 {
		return 0, false
	}
	lo, hi := math.Pi*(float64(bi-1)/n-0.5), math.Pi*(float64(bi+1)/n-0.5)
	const gr = 0.6180339887498949
	x1, x2 := hi-gr*(hi-lo), lo+gr*(hi-lo)
	f1, f2 := height(x1), height(x2)
	for range 80 {
		if f1 < f2 {
			hi, x2, f2 = x2, x1, f1
			x1 = hi - gr*(hi-lo)
			f1 = height(x1)
		} else {
			lo, x1, f1 = x1, x2, f2
			x2 = lo + gr*(hi-lo)
			f2 = height(x2)
		}
	}
	return (lo + hi) / 2, true
}

// frameCols is the matrix with columns a, b, c.
func frameCols(a, b, c r3.Vec) m3 {
	return m3{{a.X, b.X, c.X}, {a.Y, b.Y, c.Y}, {a.Z, b.Z, c.Z}}
}

// quatOf is the unit quaternion of rotation matrix m (Shepperd's method:
// from the largest of the four squared components).
func quatOf(m m3) quat {
	tr := m[0][0] + m[1][1] + m[2][2]
	var q quat
	switch {
	case tr >= m[0][0] && tr >= m[1][1] && tr >= m[2][2]:
		w := math.Sqrt(1+tr) / 2
		q = quat{w, (m[2][1] - m[1][2]) / (4 * w), (m[0][2] - m[2][0]) / (4 * w), (m[1][0] - m[0][1]) / (4 * w)}
	case m[0][0] >= m[1][1] && m[0][0] >= m[2][2]:
		x := math.Sqrt(1+m[0][0]-m[1][1]-m[2][2]) / 2
		q = quat{(m[2][1] - m[1][2]) / (4 * x), x, (m[0][1] + m[1][0]) / (4 * x), (m[0][2] + m[2][0]) / (4 * x)}
	case m[1][1] >= m[2][2]:
		y := math.Sqrt(1+m[1][1]-m[0][0]-m[2][2]) / 2
		q = quat{(m[0][2] - m[2][0]) / (4 * y), (m[0][1] + m[1][0]) / (4 * y), y, (m[1][2] + m[2][1]) / (4 * y)}
	default:
		z := math.Sqrt(1+m[2][2]-m[0][0]-m[1][1]) / 2
		q = quat{(m[1][0] - m[0][1]) / (4 * z), (m[0][2] + m[2][0]) / (4 * z), (m[1][2] + m[2][1]) / (4 * z), z}
	}
	return q
}

// TwoTops tells whether the load hangs from two top points (a spreader's
// parallel legs or two hook ropes).
func (r *Rigid) TwoTops() bool { return r.geo.twoTop }

// TopDepthM is the depth of the load's centre of mass hanging still below
// the suspension point less the rope length l (with two hook ropes l is
// L(t), each rope's length less its Extra): with a spreader the attach
// points' height above the centre of mass.
func (r *Rigid) TopDepthM(l float64) float64 {
	if r.Tandem == nil {
		return r.SpreaderZ
	}
	// Solved afresh, not through the memo: a planner calls this from
	// several goroutines on one Rigid.
	_, c, _, ok := tandemRestAt(r.Tandem, quatAxis(r3.Vec{Z: 1}, r.Heading), l, 0, false)
	if !ok {
		return 0
	}
	return -c.Z - l
}
