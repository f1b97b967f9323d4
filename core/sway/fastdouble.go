package sway

import (
	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/pendulum"
)

// fastDouble is the hook block and rigging of pendulum.Double written out
// as concrete code: the same equations in the same order of operations
// (see pendulum.Double for the mathematics: two point masses, the rope and
// rigging tensions from the 2x2 system of the constraints), with the
// suspension point's motion and the rope length from the flattened span
// tables of fastModel (fastaxis.go) in place of the closures over the
// combined profiles, and plain numbers in place of r3 vectors. Without air
// it runs on its own scan (fastdoublescan.go: peaks from the rates); in
// wind on the general path's scanner and solver, which tells it each
// segment between restarts (segmented) and moves the time a hair inside
// it as for every model. The two differ by rounding only: the suspension
// point's motion summed as one polynomial per span rather than profile by
// profile (fastdouble_test.go states how closely they agree);
// Options.General selects pendulum.Double.
type fastDouble struct {
	_             [0]func()  // not comparable: no equality function (see fastScan)
	k             *fastModel // suspension point, rope length, air
	m1, m2, l2, g float64
	im1, im2, il2 float64
	im1im2        float64 // im1+im2
}

// segmented is a model that wants to know the segment between restarts
// the scanner integrates (scanner.run calls it before the segment's first
// evaluation).
type segmented interface{ segment(a, b float64) }

func newFastDouble(k *fastModel, m1, m2, l2, g float64) *fastDouble {
	im1, im2 := 1/m1, 1/m2
	return &fastDouble{k: k, m1: m1, m2: m2, l2: l2, g: g, im1: im1, im2: im2, il2: 1 / l2, im1im2: im1 + im2}
}

// Len implements pendulum.System.
func (d *fastDouble) Len() int { return pendulum.DoubleStateLen }

func (d *fastDouble) segment(a, b float64) { d.k.segment(a, b) }

// eval is pendulum.Double's eval: it writes the rate of y into dy (n1',
// u1 = n1¨, n2', u2 = n2¨) and fills p when it is not nil.
func (d *fastDouble) eval(t float64, y, dy *[12]float64, p *pendulum.Point) {
	var k kin
	if m := d.k; !m.slewing && !m.hoisting {
		// Travel alone: the two axes' spans, the rope at its length.
		k.px, k.vx, k.ax = m.sx.At(t)
		k.py, k.vy, k.ay = m.sy.At(t)
		k.l = m.l0
	} else {
		k = m.kinAt(t)
	}
	l1, dl1, ddl1 := k.l, k.dl, k.ddl
	l2 := d.l2
	n1x, n1y, n1z := y[0], y[1], y[2]
	u1x, u1y, u1z := y[3], y[4], y[5]
	n2x, n2y, n2z := y[6], y[7], y[8]
	u2x, u2y, u2z := y[9], y[10], y[11]
	// The load's applied acceleration less gravity's: the air's force.
	var fx, fy, fz float64
	if d.k.air != nil || p != nil {
		v1x, v1y, v1z := k.vx+(dl1*n1x+l1*u1x), k.vy+(dl1*n1y+l1*u1y), dl1*n1z+l1*u1z
		v2 := r3.Vec{X: v1x + l2*u2x, Y: v1y + l2*u2y, Z: v1z + l2*u2z}
		if d.k.air != nil {
			f := d.k.air.Force(t, v2)
			fx, fy, fz = d.im2*f.X, d.im2*f.Y, d.im2*f.Z
		}
		if p != nil {
			// Field by field: the fields pendulum.Double sets (the others
			// stay zero), without a whole Point copied in (it holds a
			// pointer, so a copy also runs write barriers).
			p1 := r3.Vec{X: k.px + l1*n1x, Y: k.py + l1*n1y, Z: l1 * n1z}
			p.T, p.Dir, p.Rate, p.Rope = t, r3.Vec{X: n1x, Y: n1y, Z: n1z}, r3.Vec{X: u1x, Y: u1y, Z: u1z}, l1
			p.Suspension = pendulum.Kinematics{Pos: r3.Vec{X: k.px, Y: k.py}, Vel: r3.Vec{X: k.vx, Y: k.vy}, Acc: r3.Vec{X: k.ax, Y: k.ay}}
			p.LoadPos, p.LoadVel = r3.Vec{X: p1.X + l2*n2x, Y: p1.Y + l2*n2y, Z: p1.Z + l2*n2z}, v2
			p.HookPos, p.RiggingDir = p1, r3.Vec{X: n2x, Y: n2y, Z: n2z}
		}
	}
	g := -d.g
	// a2 - a1 is the air's part alone: (g + f) - g, as pendulum.Double forms it.
	dax, day, daz := (0+fx)-0, (0+fy)-0, (g+fz)-g
	c := n1x*n2x + n1y*n2y + n1z*n2z
	r1x, r1y, r1z := 0-k.ax, 0-k.ay, g-0
	b1 := (r1x*n1x + r1y*n1y + r1z*n1z) - ddl1 + l1*(u1x*u1x+u1y*u1y+u1z*u1z)
	b2 := (dax*n2x + day*n2y + daz*n2z) + l2*(u2x*u2x+u2y*u2y+u2z*u2z)
	im1, im2 := d.im1, d.im2
	det := im1*d.im1im2 - c*c*im1*im1
	t1 := (d.im1im2*b1 + c*im1*b2) / det
	t2 := (im1*b2 + c*im1*b1) / det
	hx, hy, hz := im1*(t2*n2x-t1*n1x), im1*(t2*n2y-t1*n1y), im1*(t2*n2z-t1*n1z)
	il1 := 1 / l1
	dy[0], dy[1], dy[2] = u1x, u1y, u1z
	dy[6], dy[7], dy[8] = u2x, u2y, u2z
	dy[3] = il1 * ((r1x + hx) - (ddl1*n1x + 2*dl1*u1x))
	dy[4] = il1 * ((r1y + hy) - (ddl1*n1y + 2*dl1*u1y))
	dy[5] = il1 * ((r1z + hz) - (ddl1*n1z + 2*dl1*u1z))
	t2m := t2 * im2
	il2 := d.il2
	dy[9] = il2 * ((dax - t2m*n2x) - hx)
	dy[10] = il2 * ((day - t2m*n2y) - hy)
	dy[11] = il2 * ((daz - t2m*n2z) - hz)
	if p != nil {
		p.Tension, p.RiggingTension = t1, t2
	}
}

// Eval implements pendulum.System.
func (d *fastDouble) Eval(t float64, y []float64, p *pendulum.Point) {
	var dy [12]float64
	d.eval(t, (*[12]float64)(y), &dy, p)
}

// Func implements pendulum.System.
func (d *fastDouble) Func(t float64, y, dy []float64) {
	d.rhs(t, (*[12]float64)(y), (*[12]float64)(dy))
}

// rhs is the right-hand side y' = f(t, y) on the state's array.
func (d *fastDouble) rhs(t float64, y, dy *[12]float64) { d.eval(t, y, dy, nil) }

// Project implements pendulum.System: both directions back onto their
// constraints (pendulum.Double.Project).
func (d *fastDouble) Project(y []float64) float64 {
	// A plain comparison for math.Max (a call of its own, for NaN and
	// signed zeros; the sizes of two corrections are neither).
	a, b := pendulum.Project(y[0:6]), pendulum.Project(y[6:12])
	if b > a {
		return b
	}
	return a
}
