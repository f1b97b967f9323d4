package pendulum

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Project implements System: |q| = 1, then positions and velocities back
// onto the constraints along their gradients (Gauss-Newton, unweighted:
// it removes drift at the integrator's error level). It returns the
// largest relative length error it removed.
func (r *Rigid) Project(y []float64) float64 {
	f, buf := &r.sc.f, &r.sc.rows
	worst := r.projectPositions(y, f, buf)
	r.stateInto(y, f) // f's time part is y[0]'s
	rws := r.rows(f, buf[:0])
	var d [9]float64
	r.correction(rws, true, &d)
	hook := r.geo.hookPoint
	for i := range 3 {
		y[4+i] += d[i]
		y[11+i] += d[3+i]
		if hook {
			y[17+i] += d[6+i]
		}
	}
	return worst
}

// ProjectPositions is the first part of Project: |q| = 1, then the
// positions back onto the constraints; the velocities are left as they
// are. It returns the largest relative length error it removed.
func (r *Rigid) ProjectPositions(y []float64) float64 {
	return r.projectPositions(y, &r.sc.f, &r.sc.rows)
}

// projectPositions is ProjectPositions in the caller's frame and rows,
// which Project uses again for the velocities, so that it clears them
// once (frameInto and rows overwrite what they hold). It leaves in f the
// time part of the frame at y[0] (the state part is of the last
// iteration's y).
func (r *Rigid) projectPositions(y []float64, f *frame, buf *[3]row) float64 {
	n := math.Sqrt(y[7]*y[7] + y[8]*y[8] + y[9]*y[9] + y[10]*y[10])
	for i := 7; i < 11; i++ {
		y[i] /= n
	}
	worst := 0.0
	for it := range 3 {
		if it == 0 {
			r.frameInto(y[0], y, f)
		} else {
			r.stateInto(y, f) // the same time: displace moves the state alone
		}
		rws := r.rows(f, buf[:0])
		big := 0.0
		for i := range rws {
			big = maxOf(big, math.Abs(rws[i].phi)/rws[i].scale)
		}
		if it == 0 {
			worst = big
		}
		if big < 1e-15 {
			break
		}
		var d [9]float64
		r.correction(rws, false, &d)
		r.displace(y, &d)
		if big < 1e-8 {
			break // one Newton step from there leaves rounding
		}
	}
	return worst
}

// correction writes -G^T (G G^T)^-1 v into d (zero before), v each row's
// value phi, or its rate dphi when rates is set.
func (r *Rigid) correction(rws []row, rates bool, d *[9]float64) {
	n := len(rws)
	if n > 3 {
		panic("pendulum: more than three constraints") // Prepare makes at most three; the check lets Go drop the loops' index checks
	}
	// G G^T is symmetric to the bit (the same products, summed in the
	// same order): each pair's dot product once. The pairs and the
	// corrections' sums written out, no loop inside another (dot9 is a
	// loop): the rigid loads 3 to 5 % faster natively and as wasm than
	// with the loops over the constraints nested.
	if n == 0 {
		return
	}
	_ = d[8] // its nil check once, not in the loop below (see dot9)
	var a [3][3]float64
	var b [3]float64
	j0 := &rws[0].j
	a[0][0] = dot9(j0, j0)
	if n > 1 {
		j1 := &rws[1].j
		a[0][1] = dot9(j0, j1)
		a[1][0] = a[0][1]
		if n > 2 {
			j2 := &rws[2].j
			a[0][2] = dot9(j0, j2)
			a[2][0] = a[0][2]
			a[1][1] = dot9(j1, j1)
			a[1][2] = dot9(j1, j2)
			a[2][1] = a[1][2]
			a[2][2] = dot9(j2, j2)
		} else {
			a[1][1] = dot9(j1, j1)
		}
	}
	for i := range n {
		if rates {
			b[i] = -rws[i].dphi
		} else {
			b[i] = -rws[i].phi
		}
	}
	var lam [3]float64
	solve3(&a, &b, n, &lam)
	for i := range n {
		l, j := lam[i], &rws[i].j
		d[0] += l * j[0]
		d[1] += l * j[1]
		d[2] += l * j[2]
		d[3] += l * j[3]
		d[4] += l * j[4]
		d[5] += l * j[5]
		d[6] += l * j[6]
		d[7] += l * j[7]
		d[8] += l * j[8]
	}
}

// displace moves the body by d = (dx, dtheta, dP): x += dx, q turned by
// the small rotation dtheta (ground frame), P += dP.
func (r *Rigid) displace(y []float64, d *[9]float64) {
	_, hook := d[8], r.geo.hookPoint // the nil checks once, not in the loop (see dot9)
	for i := range 3 {
		y[1+i] += d[i]
		if hook {
			y[14+i] += d[6+i]
		}
	}
	th := r3.Vec{X: d[3], Y: d[4], Z: d[5]}
	if a := norm(th); a > 0 {
		q := mulq(quatAxis(r3.Scale(1/a, th), a), quat{y[7], y[8], y[9], y[10]})
		y[7], y[8], y[9], y[10] = q[0], q[1], q[2], q[3]
	}
}

// Eval implements System. Dir is the rope's direction (with parallel legs,
// the mean of the two), LoadPos the load's centre of mass, Tension the
// rope's (parallel legs: both legs together), HookPos the hook,
// RiggingDir hook to load, RiggingTension the pull of the sling set;
// Body the rest.
func (r *Rigid) Eval(t float64, y []float64, p *Point) { r.eval(t, y, p, true) }

// EvalPositions is Eval of what depends on the positions alone, each
// computed as Eval computes it: Suspension, Rope, LoadPos, LoadVel and the
// Body's rotation, corners, corner swing, plumb line, tilt and twist. The
// tensions, legs, directions, rates and the hook stay zero: no
// accelerations are solved for. The scan refines the tops of the
// positions' quantities with it.
func (r *Rigid) EvalPositions(t float64, y []float64, p *Point) { r.eval(t, y, p, false) }

// eval is Eval, with the accelerations and what needs them (evalForces)
// only when forces is set.
func (r *Rigid) eval(t float64, y []float64, p *Point, forces bool) {
	geo := r.geo
	f := &r.sc.f
	r.frameInto(t, y, f)
	// The body point and the point field by field (the corners, tilt and
	// twist below): a composite literal through a pointer is built aside
	// and copied, in wasm a memory.fill and a memory.copy of 584 and 256
	// bytes, each a call out of the wasm code.
	bp := &r.bp
	bp.R, bp.Omega = f.R, f.w
	bp.Legs, bp.LegsUp, bp.NLegs, bp.CornerSwing2 = [4]float64{}, [2]float64{}, 0, 0
	bp.LegTop, bp.LegEnd, bp.Plumb = [4]r3.Vec{}, [4]r3.Vec{}, r3.Vec{}
	b := geo.loadC
	armL := r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)} // f.R.mul(b)
	load := r3.Add(f.x, armL)
	loadV := r3.Add(f.v, r3.Cross(f.w, armL))
	p.T, p.Rope, p.Suspension, p.LoadPos, p.LoadVel, p.Body = t, f.l, f.s, load, loadV, bp
	p.Dir, p.Rate, p.Tension = r3.Vec{}, r3.Vec{}, 0
	p.HookPos, p.RiggingDir, p.RiggingTension = r3.Vec{}, r3.Vec{}, 0
	if forces {
		r.evalForces(f, load, p)
	}
	cs, sn := 1.0, 0.0 // math.Cos(+0) and math.Sin(+0): no slew
	if math.Float64bits(f.psi) != 0 {
		cs, sn = math.Cos(f.psi), math.Sin(f.psi)
	}
	restCorner, restHeading := &geo.restCorner, geo.restHeading
	if r.Tandem != nil {
		// Hanging still at the present rope length.
		var c r3.Vec
		restCorner, restHeading, c = r.tandemCorners(f.l)
		bp.Plumb = r3.Vec{X: cs*c.X - sn*c.Y, Y: sn*c.X + cs*c.Y}
	}
	_ = restCorner[7] // its nil check here, once, not in the loop
	for i := range 8 {
		b := geo.cornerArm[i]
		bp.Corners[i] = r3.Add(f.x, r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)}) // f.R.mul(b)
		rc := restCorner[i]
		dx := bp.Corners[i].X - f.s.Pos.X - (cs*rc.X - sn*rc.Y)
		dy := bp.Corners[i].Y - f.s.Pos.Y - (sn*rc.X + cs*rc.Y)
		bp.CornerSwing2 = maxOf(bp.CornerSwing2, dx*dx+dy*dy)
	}
	ez := f.R.Col(2)
	bp.TiltRad = math.Atan2(hypot(ez.X, ez.Y), ez.Z)
	ex := f.R.Col(0)
	tw := math.Atan2(ex.Y, ex.X) - restHeading - f.psi
	bp.TwistRad = twistRemainder(tw)
}

// LegCount is how many leg tensions Eval reports (BodyPoint.NLegs): two
// for a spreader's two legs and for a tandem lift's two hook ropes, two
// for two sling legs under a hook block, four for four sling legs. Call it
// after Prepare.
func (r *Rigid) LegCount() int {
	if r.geo.twoTop || r.geo.hookPoint {
		return 2
	}
	return 4
}

// evalForces is the part of Eval that needs the accelerations z and the
// constraints' multipliers lam (accel): the tensions, the rope's
// direction and rate, the hook and the legs' ends. The hook's and the
// legs' ends are kinInto's sums, written out without its kin and calls.
func (r *Rigid) evalForces(f *frame, load r3.Vec, p *Point) {
	geo, bp := r.geo, p.Body
	_ = f.t // f's nil check once, not in each case and the legs' loop (see dot9)
	var z [9]float64
	var lam [3]float64
	r.accelInto(f, &z, &lam)
	var hook, hookV, pull r3.Vec
	bp.NLegs = r.LegCount()
	switch {
	case geo.twoTop:
		var dir, rate r3.Vec
		for i := range 2 {
			bp.Legs[i] = -lam[i] * (f.l + geo.extra[i])
			p.Tension += bp.Legs[i]
			b := geo.attach[i]
			arm := r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)} // f.R.mul(b)
			ap, av := r3.Add(f.x, arm), r3.Add(f.v, r3.Cross(f.w, arm))
			tp, tv := f.topPoint(i)
			d := r3.Sub(ap, tp)
			bp.LegsUp[i] = -bp.Legs[i] * d.Z / length(d)
			dir = r3.Add(dir, d)
			rate = r3.Add(rate, r3.Sub(av, tv))
		}
		n := length(dir)
		p.Dir = r3.Scale(1/n, dir)
		p.Rate = r3.Scale(1/n, r3.Sub(rate, r3.Scale(r3.Dot(rate, p.Dir), p.Dir)))
		hook, hookV = f.s.Pos, f.s.Vel
	case geo.hookPoint:
		hook, hookV = f.P, f.Pv
		p.Tension = -lam[0] * f.l
		for i := range 2 {
			bp.Legs[i] = -lam[i+1] * r.Legs[i].Length
			b := geo.attach[i]
			ap := r3.Add(f.x, r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)})
			pull = r3.Add(pull, r3.Scale(bp.Legs[i]/r.Legs[i].Length, r3.Sub(ap, hook)))
		}
	default:
		b := geo.hook
		arm := r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)} // f.R.mul(b)
		wr := r3.Cross(f.w, arm)
		hook, hookV = r3.Add(f.x, arm), r3.Add(f.v, wr)
		var rope r3.Vec // the rope's (or pivot's) pull on the hook
		if r.Pivot {
			rope = r3.Vec{X: lam[0], Y: lam[1], Z: lam[2]}
			p.Tension = length(rope)
		} else {
			rope = r3.Scale(lam[0], r3.Sub(hook, f.s.Pos))
			p.Tension = -lam[0] * f.l
		}
		aH := r3.Add(r3.Add(r3.Vec{X: z[0], Y: z[1], Z: z[2]}, r3.Cross(r3.Vec{X: z[3], Y: z[4], Z: z[5]}, arm)), r3.Cross(f.w, wr))
		pull = r3.Sub(r3.Scale(r.HookMass, r3.Add(aH, r3.Vec{Z: r.g()})), rope)
		Rt := f.R.transpose()
		pb := Rt.mul(pull)
		for i := range 4 {
			bp.Legs[i] = r3.Dot(geo.share[i], pb)
		}
		pull = r3.Scale(-1, pull)
	}
	if !geo.twoTop {
		d := r3.Sub(hook, f.s.Pos)
		if r.Pivot {
			d = r3.Sub(load, f.s.Pos)
		}
		n := length(d)
		p.Dir = r3.Scale(1/n, d)
		rel := r3.Sub(hookV, f.s.Vel)
		p.Rate = r3.Scale(1/n, r3.Sub(rel, r3.Scale(r3.Dot(rel, p.Dir), p.Dir)))
		p.RiggingTension = length(pull)
	}
	p.HookPos = hook
	p.RiggingDir = unitOf(r3.Sub(load, hook))
	for i := range bp.NLegs {
		b := geo.attach[i]
		bp.LegTop[i], bp.LegEnd[i] = hook, r3.Add(f.x, r3.Vec{X: rowDot(&f.R[0], b), Y: rowDot(&f.R[1], b), Z: rowDot(&f.R[2], b)})
		if geo.twoTop { // parallel legs from a spreader, or two hook ropes: from their top points
			bp.LegTop[i], _ = f.topPoint(i)
		}
	}
}

// Rest is the state hanging still at time t with the suspension point at
// rest, rope length L(t).
func (r *Rigid) Rest(t float64) []float64 {
	geo := r.geo
	y := make([]float64, r.Len())
	y[0] = t
	copy(y[7:11], geo.rest[:])
	R := rotOf(geo.rest[:])
	s := r.Suspension(t)
	var l float64
	if r.Rope != nil {
		l, _, _ = r.Rope(t)
	}
	var x r3.Vec
	switch {
	case r.Tandem != nil:
		q, c := r.tandemRest(l)
		copy(y[7:11], q[:])
		x = r3.Add(s.Pos, c)
	case r.Spreader > 0:
		x = r3.Sub(s.Pos, r3.Vec{Z: l + r.SpreaderZ})
	case r.Pivot:
		x = r3.Sub(s.Pos, R.mul(geo.hook))
	default:
		h := r3.Sub(s.Pos, r3.Vec{Z: l})
		x = r3.Sub(h, R.mul(geo.hook))
		if geo.hookPoint {
			copy(y[14:17], []float64{h.X, h.Y, h.Z})
		}
	}
	copy(y[1:4], []float64{x.X, x.Y, x.Z})
	return y
}

// Initial is the state at t = 0: hanging still, then the rope (or the
// parallel legs) turned by theta from the vertical toward azimuth phi —
// with one hook the whole assembly turned rigidly about the suspension
// point, with parallel legs the load moved without turning — and the load
// moving horizontally at (vx, vy) relative to the suspension point (the
// vertical part from the constraints), plus the suspension point's own
// velocity.
func (r *Rigid) Initial(theta, phi, vx, vy float64) []float64 {
	y := r.Rest(0)
	s := r.Suspension(0)
	k := r3.Vec{X: math.Sin(phi), Y: -math.Cos(phi)}
	turn := quatAxis(k, theta)
	Q := rotOf(turn[:])
	x := vec(y[1:])
	if r.geo.twoTop {
		l, _, _ := r.Rope(0)
		l += (r.geo.extra[0] + r.geo.extra[1]) / 2
		dn := r3.Sub(Q.mul(r3.Vec{Z: -l}), r3.Vec{Z: -l})
		x = r3.Add(x, dn)
		n := r3.Unit(Q.mul(r3.Vec{Z: -1}))
		w := r3.Vec{X: vx, Y: vy, Z: -(n.X*vx + n.Y*vy) / n.Z}
		v := r3.Add(s.Vel, w)
		copy(y[1:7], []float64{x.X, x.Y, x.Z, v.X, v.Y, v.Z})
		r.Project(y)
		return y
	}
	// One hook: turn everything about S.
	move := func(p r3.Vec) r3.Vec { return r3.Add(s.Pos, Q.mul(r3.Sub(p, s.Pos))) }
	x = move(x)
	q := mulq(turn, quat{y[7], y[8], y[9], y[10]})
	copy(y[7:11], q[:])
	R := rotOf(q[:])
	load := r3.Add(x, R.mul(r.geo.loadC))
	rl := r3.Sub(load, s.Pos)
	// Angular velocity about S giving the load the horizontal velocity
	// (vx, vy): w tangent to the sphere about S, omega = rl x w / |rl|^2.
	w := r3.Vec{X: vx, Y: vy, Z: -(rl.X*vx + rl.Y*vy) / rl.Z}
	om := r3.Scale(1/r3.Dot(rl, rl), r3.Cross(rl, w))
	v := r3.Add(s.Vel, r3.Cross(om, r3.Sub(x, s.Pos)))
	copy(y[1:7], []float64{x.X, x.Y, x.Z, v.X, v.Y, v.Z})
	copy(y[11:14], []float64{om.X, om.Y, om.Z})
	if r.geo.hookPoint {
		h := move(vec(y[14:]))
		hv := r3.Add(s.Vel, r3.Cross(om, r3.Sub(h, s.Pos)))
		copy(y[14:20], []float64{h.X, h.Y, h.Z, hv.X, hv.Y, hv.Z})
	}
	r.Project(y)
	return y
}

// twistRemainder is math.Remainder(tw, 2 pi): tw itself when |tw| <= pi
// (the quotient rounds to zero, a half to even), without the library's
// reduction (in wasm a chain of calls through Mod and Frexp); the
// library's otherwise.
func twistRemainder(tw float64) float64 {
	if math.Abs(tw) <= math.Pi {
		return tw
	}
	return math.Remainder(tw, 2*math.Pi)
}
