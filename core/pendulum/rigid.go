package pendulum

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/units"
)

// Rigid is a load that is a rigid body, not a point: a box of given mass
// and radii of gyration hung in one of three ways.
//
//   - Four legs from one hook (Legs has four entries): the legs and the hook
//     are taken as a rigid frame fixed in the load (four inextensible legs
//     to one point are statically indeterminate and, all taut, do not move
//     relative to the load). The hook block, if any, is a point mass at the
//     hook, part of the same rigid body. The rope of length L(t) runs from
//     the suspension point S(t) to the hook.
//   - Two legs from one hook (two entries): the hook block is a point of
//     its own (mass HookMass > 0) joined to the two attach points by two
//     distance constraints, so the load can roll about the line through
//     the attach points; the rope runs from S(t) to the hook.
//   - Two parallel legs from two top points (Spreader > 0): the top points
//     are S(t) +/- a*e(t), e the load's heading turned with the crane's
//     slew (Yaw); each leg (hook rope, or leg from a spreader beam held by
//     the crane) has length L(t) and holds the load at body points
//     (+/-a, 0, SpreaderZ). This is the bifilar suspension.
//   - Two hook ropes (Tandem set; rigid_tandem.go): as the parallel legs,
//     but the top points are S(t) + Top_i e(t), each rope of its own
//     length L(t) + Extra_i to its own attach point: a tandem lift.
//
// Pivot (tests) holds the hook point fixed at S(t) instead of on a rope:
// a compound pendulum.
//
// Formulation (Newton-Euler with constraint multipliers). The rigid body
// has mass m (with four legs: load plus hook block), centre of mass x,
// orientation the unit quaternion q (body to ground, body axes: x along
// the load's length, y its width, z up) and angular velocity w in the
// ground frame; the body inertia I_b about the centre of mass is a full
// symmetric matrix (the hook block's share makes it so), in the ground
// frame I_w = R I_b R^T. With two legs the hook is a point P of mass m_h.
// The unknown accelerations z = (x”, alpha = w', P”) obey
//
//	M z = f + J^T lambda,   J z + kappa = 0
//
// with M = diag(m 1, I_w, m_h 1), f = (m g + F, r_F x F - w x I_w w,
// m_h g) (F the applied force on the load at its centre of mass, r_F its
// arm from the body's centre of mass), and one row of J per constraint.
// Every constraint is a distance c = (d.d - l^2)/2 = 0 between two points
// (d = p_A - p_B), or, for Pivot, the three coordinates of hook point
// minus S. A body point p = x + r, r = R b, has p” = x” - r x alpha +
// w x (w x r); so a distance row is d^T(A_A - A_B) in z with the body
// block (d, r x d), and kappa = d.(a0_A - a0_B) + |d'|^2 - l'^2 - l l”,
// a0 the acceleration part independent of z. The multipliers solve the
// Schur system (J M^-1 J^T) lambda = -kappa - J M^-1 f (at most 3 by 3),
// then z = M^-1 (f + J^T lambda). A distance constraint's tension is
// T = -lambda*l (positive when the leg or rope pulls).
//
// State layout (length RigidLen or RigidHookLen): y[0] = t (carried so
// that Project knows where the suspension point is), y[1:4] = x,
// y[4:7] = x', y[7:11] = q (w, x, y, z), y[11:14] = w; with two legs
// y[14:17] = P, y[17:20] = P'. q' = (0, w) * q / 2.
//
// Project puts the state back on the constraints after each step
// (|q| = 1, then Gauss-Newton on positions and one linear step on
// velocities, both along the constraint gradients), as the point model
// does for |n| = 1.
//
// Leg tensions: with two legs and with parallel legs they are the
// multipliers. With four legs the force the legs carry, Fs (hook block's
// Newton law: Fs = m_h (a_H - g) - rope pull on the hook), is shared by a
// stiffness model: each leg a linear spring of stiffness proportional to
// 1/length (same rope or chain, same EA), the hook displaced by delta
// relative to the load: K = sum k_i e_i e_i^T, T_i = k_i e_i.(K^-1 Fs),
// e_i the unit vector hook to attach point. Hanging still and symmetric,
// each of four legs at angle beta from the vertical carries
// m g / (4 cos beta).
type Rigid struct {
	Mass     float64 // load, kg
	Gyration r3.Vec  // radii of gyration of the load about its length, width and height axes through its centre of mass, m
	HookMass float64 // hook block at the hook, kg
	Legs     []Leg   // two or four legs meeting at the hook
	// Spreader is half the spacing a of two parallel legs, m; > 0 selects
	// that suspension. SpreaderZ is the height of their attach points
	// above the load's centre of mass.
	Spreader, SpreaderZ float64
	Pivot               bool    // the hook held at the suspension point (tests)
	Size                r3.Vec  // the box's length, width and height, m (its corners)
	Heading             float64 // the load's length axis at rest, rad from +x toward +y
	Gravity             float64 // m/s^2; zero means standard gravity

	Suspension func(t float64) Kinematics
	Rope       func(t float64) (l, dl, ddl float64)
	// Force on the load at its centre of mass (wind, drag), N; nil is none.
	Force func(t float64, pos, vel r3.Vec) r3.Vec
	// Yaw is the crane's slew since the start (turns the spreader's top
	// points); nil is none.
	Yaw func(t float64) (psi, dpsi, ddpsi float64)
	// Tandem, when set, hangs the load from two hook ropes (in place of
	// Legs and Spreader).
	Tandem *TandemRopes
	// Travel, when set, is the suspension point's and the rope's motion
	// the evaluations (Func, Eval, Project) take in place of Suspension
	// and Rope: the same motion as span tables, for a crane without a
	// slewing arm. Rest and Initial keep Suspension and Rope.
	Travel *Travel

	geo   *rigidGeometry // set by Prepare
	bp    BodyPoint      // scratch for Eval
	tmemo tandemMemo     // the last tandem rest solved
	sc    rigidScratch   // the evaluations' working memory
}

// rigidScratch is the working memory of Func, Project and Eval, kept
// between calls: as local variables the frame (456 bytes), the rows (312)
// and M^-1 J^T (216) were cleared at every call, each in wasm a
// memory.fill, a call out of the wasm code. frameInto and rows write
// every field, and accelInto every element it reads. Those methods do not
// call one another while they hold it (Eval's evalForces, which calls
// accelInto, uses the frame and not the rows).
type rigidScratch struct {
	_       [0]func() // not comparable: no equality function
	f       frame
	rows    [3]row
	mj      [3][9]float64
	corners [8]r3.Vec // tandemCorners' when the rest is not kept
}

// Leg is one sling leg: where it attaches on the load (from the load's
// centre of mass, in the load's axes), and its length to the hook.
type Leg struct {
	Attach r3.Vec
	Length float64
}

// State lengths of Rigid: without and with the hook as a point of its own.
const (
	RigidLen     = 14
	RigidHookLen = 20
)

// BodyPoint is what a Rigid adds to a Point.
type BodyPoint struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	R     m3         // body to ground rotation
	Omega r3.Vec     // angular velocity, ground frame, rad/s
	Legs  [4]float64 // leg tensions (parallel legs: each leg), N
	// LegsUp are the upward parts of the pulls of a spreader's legs or of
	// two hook ropes, N (they add up to the weight hanging still).
	LegsUp  [2]float64
	NLegs   int
	Corners [8]r3.Vec // the box's corners, ground frame, m
	// TiltRad is the angle of the load's height axis from the vertical;
	// TwistRad its turn about the vertical from its heading at rest,
	// turned with the slew.
	TiltRad, TwistRad float64
	// CornerSwing2 is the square of the largest horizontal distance of a
	// corner from where it hangs still under the suspension point (with a
	// spreader, turned with the slew), m^2.
	CornerSwing2 float64
	// LegTop and LegEnd are each leg's ends on the ground frame, m: the
	// hook (parallel legs: the leg's top point) and its attach point on
	// the load; NLegs of them.
	LegTop, LegEnd [4]r3.Vec
	// Plumb is where the load's centre of mass hangs still from the
	// suspension point, horizontally (turned with the slew), at the
	// present rope length: zero but with two hook ropes, whose suspension
	// point is their midpoint. Point.Rel measures from there.
	Plumb r3.Vec
}

func (r *Rigid) g() float64 {
	if r.Gravity == 0 {
		return units.StandardGravity
	}
	return r.Gravity
}

// Len implements System.
func (r *Rigid) Len() int {
	if r.geo.hookPoint {
		return RigidHookLen
	}
	return RigidLen
}

// point kinds of a constraint end.
const (
	onBody = iota // body point b (body frame, from the body's centre of mass)
	onHook        // the hook block as a point of its own
	onTop         // suspension point plus the top offset of parallel leg `leg`
)

type end struct {
	kind int
	b    r3.Vec // onBody: body frame; onTop: sign of the offset in X
}

// constraint is one distance (or, pivot, one coordinate) constraint.
type constraint struct {
	a, b  end
	rope  bool    // length L(t) + extra; else fixed length
	extra float64 // a tandem rope's length less L(t)
	l     float64 // fixed length
	coord int     // pivot: -1 for distance, else the coordinate 0..2
}

// kin is the state of a point: position, velocity, the acceleration part
// that does not depend on z, and its body arm (zero for other kinds).
type kin struct {
	p, v, a0, arm r3.Vec
	kind          int
}

// frame is one evaluation's shared quantities.
type frame struct {
	t           float64
	x, v, w     r3.Vec
	R           m3
	P, Pv       r3.Vec
	s           Kinematics
	l, dl, ddl  float64
	top         [2]r3.Vec // offsets of the parallel legs' top points: position, velocity, acceleration
	topV, topA  [2]r3.Vec
	psi         float64
	hookPresent bool
}

func (r *Rigid) frameOf(t float64, y []float64) frame {
	var f frame
	r.frameInto(t, y, &f)
	return f
}

// frameInto is frameOf written into f. The simulation's evaluations pass
// the frame, the constraint ends (kinInto, addPart) and the 9-vectors
// by pointer: a struct passed or returned by value is copied, and
// Go's wasm copies it through memory one word at a time. Every field is
// written (the frame is not cleared first: in wasm a clear of its 456
// bytes is a memory.fill, a call out of the wasm code).
func (r *Rigid) frameInto(t float64, y []float64, f *frame) {
	f.t = t
	if tr := r.Travel; tr != nil {
		// Travel.At written out: no call but a restart's seek (as a call,
		// with its 12 results through memory, bay-girder-rigid's
		// evaluation took 6 % longer as wasm; TestTravelAtAsFrame).
		if t < tr.from || t >= tr.to {
			tr.seek(t)
		}
		f.s.Pos.X, f.s.Vel.X, f.s.Acc.X = tr.x.At(t)
		f.s.Pos.Y, f.s.Vel.Y, f.s.Acc.Y = tr.y.At(t)
		f.s.Pos.Z, f.s.Vel.Z, f.s.Acc.Z = 0, 0, 0
		h, dh, ddh := tr.hoist.At(t)
		f.l, f.dl, f.ddl = tr.l0-h, -dh, -ddh
	} else {
		f.s = r.Suspension(t)
		f.l, f.dl, f.ddl = 0, 0, 0
		if r.Rope != nil {
			f.l, f.dl, f.ddl = r.Rope(t)
		}
	}
	f.psi = 0
	if r.geo.twoTop {
		var dpsi, ddpsi float64
		c, s := r.geo.headCos, r.geo.headSin // of r.Heading + 0, without a slew
		if r.Yaw != nil {
			f.psi, dpsi, ddpsi = r.Yaw(t)
			h := r.Heading + f.psi
			c, s = math.Cos(h), math.Sin(h)
		}
		e := r3.Vec{X: c, Y: s}
		et := r3.Vec{X: -s, Y: c}
		for i, a := range r.geo.top {
			f.top[i] = r3.Scale(a, e)
			f.topV[i] = r3.Scale(a*dpsi, et)
			f.topA[i] = r3.Add(r3.Scale(a*ddpsi, et), r3.Scale(-a*dpsi*dpsi, e))
		}
	} else {
		f.top, f.topV, f.topA = [2]r3.Vec{}, [2]r3.Vec{}, [2]r3.Vec{}
	}
	r.stateInto(y, f)
}

// stateInto writes into f the part of the frame that comes from the state
// y, leaving the part that comes from the time (the suspension point, the
// rope, the slew) as it is: Project's frames after the first, at the same
// time y[0], take it from there without asking the motions again.
func (r *Rigid) stateInto(y []float64, f *frame) {
	_ = y[RigidLen-1] // one length check for the reads below
	f.x = vec(y[1:])
	f.v = vec(y[4:])
	// rotInto written out (TestStateIntoAsRotInto): as a call, the rigid
	// loads' evaluations took about 3 % longer as wasm.
	w, x, yq, z := y[7], y[8], y[9], y[10]
	n := 1 / math.Sqrt(w*w+x*x+yq*yq+z*z)
	w, x, yq, z = w*n, x*n, yq*n, z*n
	R := &f.R
	R[0][0], R[0][1], R[0][2] = 1-2*(yq*yq+z*z), 2*(x*yq-w*z), 2*(x*z+w*yq)
	R[1][0], R[1][1], R[1][2] = 2*(x*yq+w*z), 1-2*(x*x+z*z), 2*(yq*z-w*x)
	R[2][0], R[2][1], R[2][2] = 2*(x*z-w*yq), 2*(yq*z+w*x), 1-2*(x*x+yq*yq)
	f.w = vec(y[11:])
	if r.geo.hookPoint {
		_ = y[RigidHookLen-1]
		f.P, f.Pv, f.hookPresent = vec(y[14:]), vec(y[17:]), true
	} else {
		f.P, f.Pv, f.hookPresent = r3.Vec{}, r3.Vec{}, false
	}
}

// topPoint is the position and velocity of parallel leg i's top point
// (twoTop), as kinInto has them.
func (f *frame) topPoint(i int) (p, v r3.Vec) {
	return r3.Add(f.s.Pos, f.top[i]), r3.Add(f.s.Vel, f.topV[i])
}

// kinOf is the state of a constraint end.
func (r *Rigid) kinOf(f *frame, e end, leg int) (k kin) {
	r.kinInto(f, &e, leg, &k)
	return k
}

// kinInto is kinOf written into k.
func (r *Rigid) kinInto(f *frame, e *end, leg int, k *kin) {
	// Field by field: a composite literal through the pointer is built
	// aside and copied (in wasm a memory.fill and a memory.copy).
	switch e.kind {
	case onBody:
		arm := f.R.mul(e.b)
		wr := r3.Cross(f.w, arm)
		k.p, k.v, k.a0, k.arm, k.kind = r3.Add(f.x, arm), r3.Add(f.v, wr), r3.Cross(f.w, wr), arm, onBody
		return
	case onHook:
		k.p, k.v, k.a0, k.arm, k.kind = f.P, f.Pv, r3.Vec{}, r3.Vec{}, onHook
		return
	}
	k.p, k.v, k.a0, k.arm, k.kind = f.s.Pos, f.s.Vel, f.s.Acc, r3.Vec{}, onTop
	if r.geo.twoTop {
		k.p = r3.Add(k.p, f.top[leg])
		k.v = r3.Add(k.v, f.topV[leg])
		k.a0 = r3.Add(k.a0, f.topA[leg])
	}
}

// row is one constraint's gradient in (x, rotation, P) and, for the
// acceleration equation, its bias kappa; phi and dphi are its value and
// rate.
type row struct {
	j                [9]float64
	kappa, phi, dphi float64
	scale            float64 // length for relative errors
}

// addPart adds s*dir^T A(k) to the row, A the map from z to k's
// acceleration.
func addPart(j *[9]float64, k *kin, dir r3.Vec, s float64) {
	switch k.kind {
	case onBody:
		c := r3.Cross(k.arm, dir)
		j[0] += s * dir.X
		j[1] += s * dir.Y
		j[2] += s * dir.Z
		j[3] += s * c.X
		j[4] += s * c.Y
		j[5] += s * c.Z
	case onHook:
		j[6] += s * dir.X
		j[7] += s * dir.Y
		j[8] += s * dir.Z
	}
}

// rows evaluates every constraint at f into out (made anew when its
// capacity is short): by plainRows when every end is of the kinds the
// arrangements have (end a on the body or the hook, end b at a top point
// or on the body: rigidGeometry.plainEnds), rowOf's sums written out on
// local variables; else by rowOf, row by row. rowOf's kin lives in memory
// and its kinInto and addPart are calls, which cost most in wasm.
// TestRowsAsRowOf holds the two to the same bits.
func (r *Rigid) rows(f *frame, out []row) []row {
	n := len(r.geo.cons)
	if cap(out) < n {
		out = make([]row, n)
	}
	out = out[:n]
	if r.geo.plainEnds {
		plainRows(f, r.geo.cons, r.geo.twoTop, out)
		return out
	}
	for i := range out {
		out[i] = row{}
		r.rowOf(f, &r.geo.cons[i], i, &out[i])
	}
	return out
}

// plainRows is rows for constraints whose ends are all of the kinds it
// writes out (rigidGeometry.plainEnds), into out (as long as cons): every
// field of each row. It calls nothing.
func plainRows(f *frame, cons []constraint, twoTop bool, out []row) {
	out = out[:len(cons)]
	_ = f.t // f's nil check once, not in the loop (see dot9)
	for i := range cons {
		c := &cons[i]
		rw := &out[i]
		aBody, bBody := c.a.kind == onBody, c.b.kind == onBody
		// The ends as kinInto has them: position, velocity, the
		// acceleration's part without z, and the body arm.
		var pa, va, a0a, arma r3.Vec
		if aBody {
			b := c.a.b
			arma = r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)} // f.R.mul(b)
			wr := r3.Cross(f.w, arma)
			pa, va, a0a = r3.Add(f.x, arma), r3.Add(f.v, wr), r3.Cross(f.w, wr)
		} else {
			pa, va = f.P, f.Pv
		}
		var pb, vb, a0b, armb r3.Vec
		if bBody {
			b := c.b.b
			armb = r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)} // f.R.mul(b)
			wr := r3.Cross(f.w, armb)
			pb, vb, a0b = r3.Add(f.x, armb), r3.Add(f.v, wr), r3.Cross(f.w, wr)
		} else {
			pb, vb, a0b = f.s.Pos, f.s.Vel, f.s.Acc
			if twoTop {
				pb = r3.Add(pb, f.top[i])
				vb = r3.Add(vb, f.topV[i])
				a0b = r3.Add(a0b, f.topA[i])
			}
		}
		d := r3.Sub(pa, pb)
		dd := r3.Sub(va, vb)
		da := r3.Sub(a0a, a0b)
		dir := d
		if c.coord >= 0 {
			dir = unit(c.coord)
		}
		// addPart(j, a, dir, 1), then addPart(j, b, dir, -1), from zero.
		var j0, j1, j2, j3, j4, j5, j6, j7, j8 float64
		if aBody {
			cr := r3.Cross(arma, dir)
			j0 += dir.X
			j1 += dir.Y
			j2 += dir.Z
			j3 += cr.X
			j4 += cr.Y
			j5 += cr.Z
		} else {
			j6 += dir.X
			j7 += dir.Y
			j8 += dir.Z
		}
		if bBody {
			cr := r3.Cross(armb, dir)
			j0 += -1 * dir.X
			j1 += -1 * dir.Y
			j2 += -1 * dir.Z
			j3 += -1 * cr.X
			j4 += -1 * cr.Y
			j5 += -1 * cr.Z
		}
		rw.j[0], rw.j[1], rw.j[2], rw.j[3], rw.j[4], rw.j[5], rw.j[6], rw.j[7], rw.j[8] = j0, j1, j2, j3, j4, j5, j6, j7, j8
		if c.coord >= 0 {
			rw.kappa = r3.Dot(dir, da)
			rw.phi, rw.dphi, rw.scale = r3.Dot(dir, d), r3.Dot(dir, dd), 1
			continue
		}
		l, dl, ddl := c.l, 0.0, 0.0
		if c.rope {
			l, dl, ddl = f.l+c.extra, f.dl, f.ddl
		}
		rw.kappa = r3.Dot(d, da) + r3.Dot(dd, dd) - dl*dl - l*ddl
		rw.phi = 0.5 * (r3.Dot(d, d) - l*l)
		rw.dphi = r3.Dot(d, dd) - l*dl
		rw.scale = l * l
	}
}

// rowOf writes constraint c (number i) at f into rw (zero before): its
// ends' states by kinInto and their parts of the gradient by addPart, for
// ends of any kind.
func (r *Rigid) rowOf(f *frame, c *constraint, i int, rw *row) {
	var ka, kb kin
	r.kinInto(f, &c.a, i, &ka)
	r.kinInto(f, &c.b, i, &kb)
	d := r3.Sub(ka.p, kb.p)
	dd := r3.Sub(ka.v, kb.v)
	da := r3.Sub(ka.a0, kb.a0)
	if c.coord >= 0 {
		e := unit(c.coord)
		addPart(&rw.j, &ka, e, 1)
		addPart(&rw.j, &kb, e, -1)
		rw.kappa = r3.Dot(e, da)
		rw.phi, rw.dphi, rw.scale = r3.Dot(e, d), r3.Dot(e, dd), 1
		return
	}
	l, dl, ddl := c.l, 0.0, 0.0
	if c.rope {
		l, dl, ddl = f.l+c.extra, f.dl, f.ddl
	}
	addPart(&rw.j, &ka, d, 1)
	addPart(&rw.j, &kb, d, -1)
	rw.kappa = r3.Dot(d, da) + r3.Dot(dd, dd) - dl*dl - l*ddl
	rw.phi = 0.5 * (r3.Dot(d, d) - l*l)
	rw.dphi = r3.Dot(d, dd) - l*dl
	rw.scale = l * l
}

func unit(i int) r3.Vec {
	switch i {
	case 0:
		return r3.Vec{X: 1}
	case 1:
		return r3.Vec{Y: 1}
	}
	return r3.Vec{Z: 1}
}

// accel solves for z = (x”, alpha, P”) and the multipliers at f.
func (r *Rigid) accel(f *frame) (z [9]float64, lam [3]float64) {
	r.accelInto(f, &z, &lam)
	return z, lam
}

// accelInto is accel written into z (wholly) and lam (its first len(rows)
// entries; the callers pass it zero): the evaluations' way, without the
// copies of results returned by value. M^-1 (minv) is written out on the
// inverse inertia's elements as locals, one constraint (four legs) is
// solved by one division and two (parallel legs, two hook ropes) by
// solve2 on locals: minv's and solve3's calls and the arrays
// they read cost most in wasm (three, two legs with the hook block, go to
// constrained). accelByParts (tests) is the same with the calls, held to
// the same bits by TestAccelAsByParts.
func (r *Rigid) accelInto(f *frame, z *[9]float64, lam *[3]float64) {
	geo := r.geo
	rws := r.rows(f, r.sc.rows[:0])
	g := r3.Vec{Z: -r.g()}
	var iw, iwInv m3
	conjugate(&f.R, &geo.ib, &iw)
	conjugate(&f.R, &geo.ibInv, &iwInv)
	// Applied generalized force.
	fx := r3.Scale(geo.m, g)
	iww := r3.Vec{X: rowDot(&iw[0], f.w), Y: rowDot(&iw[1], f.w), Z: rowDot(&iw[2], f.w)} // iw.mul(f.w)
	tq := r3.Scale(-1, r3.Cross(f.w, iww))
	if r.Force != nil {
		b := geo.loadC
		armL := r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)} // f.R.mul(b)
		pos := r3.Add(f.x, armL)
		vel := r3.Add(f.v, r3.Cross(f.w, armL))
		fl := r.Force(f.t, pos, vel)
		fx = r3.Add(fx, fl)
		tq = r3.Add(tq, r3.Cross(armL, fl))
	}
	fp := r3.Scale(geo.mh, g)
	// minv's sums: (1/m) v, iwInv v by rows, v / m_h.
	im, mh := 1/geo.m, geo.mh
	k00, k01, k02 := iwInv[0][0], iwInv[0][1], iwInv[0][2]
	k10, k11, k12 := iwInv[1][0], iwInv[1][1], iwInv[1][2]
	k20, k21, k22 := iwInv[2][0], iwInv[2][1], iwInv[2][2]
	mf := z // M^-1 fg, to which the constraints' parts are added below
	mf[0], mf[1], mf[2] = im*fx.X, im*fx.Y, im*fx.Z
	mf[3] = k00*tq.X + k01*tq.Y + k02*tq.Z
	mf[4] = k10*tq.X + k11*tq.Y + k12*tq.Z
	mf[5] = k20*tq.X + k21*tq.Y + k22*tq.Z
	mf[6], mf[7], mf[8] = 0, 0, 0
	if mh > 0 {
		mf[6], mf[7], mf[8] = fp.X/mh, fp.Y/mh, fp.Z/mh
	}
	n := len(rws)
	if n > 3 {
		panic("pendulum: more than three constraints") // Prepare makes at most three; the check lets Go drop the loops' index checks
	}
	mj := &r.sc.mj
	for i := range n {
		v, o := &rws[i].j, &mj[i]
		o[0], o[1], o[2] = im*v[0], im*v[1], im*v[2]
		o[3] = k00*v[3] + k01*v[4] + k02*v[5]
		o[4] = k10*v[3] + k11*v[4] + k12*v[5]
		o[5] = k20*v[3] + k21*v[4] + k22*v[5]
		o[6], o[7], o[8] = 0, 0, 0
		if mh > 0 {
			o[6], o[7], o[8] = v[6]/mh, v[7]/mh, v[8]/mh
		}
	}
	if n == 1 {
		// solve3 for n = 1.
		lam[0] = (-rws[0].kappa - dot9(&rws[0].j, mf)) / dot9(&rws[0].j, &mj[0])
		for k := range 9 {
			z[k] += lam[0] * mj[0][k]
		}
		return
	}
	if n == 2 {
		// Two constraints (parallel legs, two hook ropes): constrained's
		// sums for n = 2 and solve3's case 2 (solve2) on locals, no
		// loop inside another. The same operations in the same order.
		j0, j1 := &rws[0].j, &rws[1].j
		a00, a01 := dot9(j0, &mj[0]), dot9(j0, &mj[1])
		b0 := -rws[0].kappa - dot9(j0, mf)
		a10, a11 := dot9(j1, &mj[0]), dot9(j1, &mj[1])
		b1 := -rws[1].kappa - dot9(j1, mf)
		lam[0], lam[1] = solve2(a00, a01, a10, a11, b0, b1)
		for k := range 9 {
			z[k] += lam[0] * mj[0][k]
		}
		for k := range 9 {
			z[k] += lam[1] * mj[1][k]
		}
		return
	}
	constrained(rws, mj, z, lam)
}

// constrained adds the constraints' parts to z = M^-1 f (mj their
// M^-1 J^T rows) and writes their multipliers into lam: accelInto's case
// of three constraints (two legs and the hook block). It takes fewer too,
// leaving the products beyond them unused.
func constrained(rws []row, mj *[3][9]float64, z *[9]float64, lam *[3]float64) {
	n := min(len(rws), 3)
	_ = lam[2] // its nil check once, not in the last loop (see dot9)
	mf := z
	// The rows one by one and the sums written out, as in correction.
	var a [3][3]float64
	var b [3]float64
	j0 := &rws[0].j
	a[0][0], a[0][1], a[0][2] = dot9(j0, &mj[0]), dot9(j0, &mj[1]), dot9(j0, &mj[2])
	b[0] = -rws[0].kappa - dot9(j0, mf)
	if n > 1 {
		j1 := &rws[1].j
		a[1][0], a[1][1], a[1][2] = dot9(j1, &mj[0]), dot9(j1, &mj[1]), dot9(j1, &mj[2])
		b[1] = -rws[1].kappa - dot9(j1, mf)
	}
	if n > 2 {
		j2 := &rws[2].j
		a[2][0], a[2][1], a[2][2] = dot9(j2, &mj[0]), dot9(j2, &mj[1]), dot9(j2, &mj[2])
		b[2] = -rws[2].kappa - dot9(j2, mf)
	}
	solve3(&a, &b, n, lam)
	for i := range n {
		l, m := lam[i], &mj[i]
		z[0] += l * m[0]
		z[1] += l * m[1]
		z[2] += l * m[2]
		z[3] += l * m[3]
		z[4] += l * m[4]
		z[5] += l * m[5]
		z[6] += l * m[6]
		z[7] += l * m[7]
		z[8] += l * m[8]
	}
}

// Func implements System.
func (r *Rigid) Func(t float64, y, dy []float64) {
	f := &r.sc.f
	r.frameInto(t, y, f)
	var z [9]float64
	var lam [3]float64
	r.accelInto(f, &z, &lam)
	dy[0] = 1
	dy[1], dy[2], dy[3] = y[4], y[5], y[6] // copy would call memmove in wasm
	dy[4], dy[5], dy[6] = z[0], z[1], z[2]
	// q' = (0, w) * q / 2
	qw, qx, qy, qz := y[7], y[8], y[9], y[10]
	w := f.w
	dy[7] = 0.5 * (-w.X*qx - w.Y*qy - w.Z*qz)
	dy[8] = 0.5 * (w.X*qw + w.Y*qz - w.Z*qy)
	dy[9] = 0.5 * (w.Y*qw + w.Z*qx - w.X*qz)
	dy[10] = 0.5 * (w.Z*qw + w.X*qy - w.Y*qx)
	dy[11], dy[12], dy[13] = z[3], z[4], z[5]
	if r.geo.hookPoint {
		dy[14], dy[15], dy[16] = y[17], y[18], y[19]
		dy[17], dy[18], dy[19] = z[6], z[7], z[8]
	}
}
