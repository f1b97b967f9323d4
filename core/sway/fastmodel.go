package sway

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/crane"
	"swaysheet/core/units"
)

// fastModel is the single-rope hook load of pendulum.Model written out as
// concrete code for the specialised path (fast.go): the same equation of
// motion, with the suspension point's motion and the rope length
// evaluated from flattened span tables (fastaxis.go) and
// plain fields, without closures or interfaces per evaluation.
type fastModel struct {
	x, y, slew, radius, hoist axisTable
	slewing                   bool    // the suspension point is on a slewing arm
	hoisting                  bool    // the rope length changes
	travel                    bool    // travel moves only: neither of the two above, no air
	airTravel                 bool    // travel moves only, with wind, no drag (steadyAir)
	air                       *Air    // wind and drag; nil: none
	r0, phi0, l0              float64 // radius, slew angle and rope length at rest at the start
	il                        float64 // 1/l0
	mass, g                   float64

	// The spans of the segment between restarts being integrated (set by
	// segment), and its ends.
	sx, sy, ss, sr, sh span
	segA, segB         float64
	// The air's share of the applied acceleration, when it is the same
	// over the segment (steadyAir): ax, ay and az - g, up to airTo; and
	// its share of that acceleration's rate (relDot's, with the strength's
	// rate zero).
	steady                bool
	airX, airY, rz, airTo float64
	dairX, dairY, dairZ   float64
}

// newFastModel builds the specialised model from the summed profiles of
// each role, or returns nil when a profile is of a kind it does not know
// or a role moves whose geometry it does not have (a crane type added to
// core/crane after this was written takes the general path). The
// arguments are build's: the rope length l0 and the crane's start. The
// slewing arm's geometry is crane.Drives.Suspension's; wind and drag are
// air's (nil: none).
func newFastModel(ax *crane.Drives, l0 float64, at crane.Start, mass float64, air *Air) *fastModel {
	r0 := at.RadiusM
	m := &fastModel{r0: r0, phi0: at.SlewRad, l0: l0, il: 1 / l0, mass: mass, g: units.StandardGravity, air: air,
		slewing: len(ax[crane.Turn]) > 0 || len(ax[crane.Reach]) > 0 || r0 != 0, hoisting: len(ax[crane.Rope]) > 0}
	for role, sum := range ax {
		var tab *axisTable
		switch crane.Role(role) {
		case crane.AlongX:
			tab = &m.x
		case crane.AlongY:
			tab = &m.y
		case crane.Turn:
			tab = &m.slew
		case crane.Reach:
			tab = &m.radius
		case crane.Rope:
			tab = &m.hoist
		default:
			if len(sum) > 0 {
				return nil
			}
			continue
		}
		comps, ok := flatPieces(sum, 0, 1, nil)
		if !ok {
			return nil
		}
		*tab = flatten(comps)
	}
	m.travel = !(m.slewing || m.hoisting)
	if air != nil {
		m.airTravel, m.travel = m.travel && air.DragK == 0, false
	}
	return m
}

// kin is the suspension point's and the rope's motion at one instant.
type kin struct {
	px, py, vx, vy, ax, ay float64 // suspension point (it moves horizontally)
	jx, jy                 float64 // its jerk
	l, dl, ddl, dddl       float64 // rope length and its derivatives
}

// segment selects the spans of the segment [a, b] between restarts: every
// breakpoint of every profile is a restart, so one span per axis holds
// for the whole segment.
func (m *fastModel) segment(a, b float64) {
	mid := 0.5 * (a + b)
	m.sx, m.sy = m.x.spanAt(mid), m.y.spanAt(mid)
	m.ss, m.sr, m.sh = m.slew.spanAt(mid), m.radius.spanAt(mid), m.hoist.spanAt(mid)
	m.segA, m.segB = a, b
	if m.airTravel {
		m.steadyAir()
	}
}

// airTime is t moved a hair inside the segment, as scanner.inSegment does
// for every evaluation of the general path: the wind may step at the
// segment's ends, and each segment sees its own wind.
func (m *fastModel) airTime(t float64) float64 {
	d := 1e-12 * t
	if d < 1e-12 {
		d = 1e-12
	}
	if lo := m.segA + d; t < lo {
		return lo
	}
	if hi := m.segB - d; t > hi {
		return hi
	}
	return t
}

// loadVel is the load's velocity S' + L' n + L u.
func loadVel(k *kin, y *[6]float64) r3.Vec {
	return r3.Vec{X: k.vx + (k.dl*y[0] + k.l*y[3]), Y: k.vy + (k.dl*y[1] + k.l*y[4]), Z: k.dl*y[2] + k.l*y[5]}
}

// kinAt evaluates the suspension point and the rope at t inside the
// current segment (the slewing arm as in suspension, build.go).
func (m *fastModel) kinAt(t float64) kin { return m.kinOf(t, true) }

// kinOf is kinAt without the slewing arm's share of the jerk unless jerk
// is set (only the peak search's rates need it; the right-hand side and
// the history do not).
//
// An axis without moves is left out: its span is all zero, where the
// polynomial gives +0 for every t >= 0, as the zero values do.
func (m *fastModel) kinOf(t float64, jerk bool) (k kin) {
	if len(m.x) > 0 {
		k.px, k.vx, k.ax = m.sx.At(t)
	}
	if len(m.y) > 0 {
		k.py, k.vy, k.ay = m.sy.At(t)
	}
	k.jx, k.jy = m.sx.J, m.sy.J
	var h, dh, ddh float64
	if m.hoisting {
		h, dh, ddh = m.sh.At(t)
	}
	k.l, k.dl, k.ddl, k.dddl = m.l0-h, -dh, -ddh, -m.sh.J
	if m.slewing {
		var p, w, al, q, rd, rdd float64
		if len(m.slew) > 0 {
			p, w, al = m.ss.At(t)
		}
		if len(m.radius) > 0 {
			q, rd, rdd = m.sr.At(t)
		}
		phi, r := m.phi0+p, m.r0+q
		// One argument reduction for both (Sin and Cos are written in Go, in
		// wasm too, with the same polynomials as Sincos).
		s, c := math.Sincos(phi)
		vr, vt := rd, r*w
		ar, at := rdd-r*w*w, r*al+2*rd*w
		k.px += r * c
		k.py += r * s
		k.vx += vr*c - vt*s
		k.vy += vr*s + vt*c
		k.ax += ar*c - at*s
		k.ay += ar*s + at*c
		if !jerk {
			return k
		}
		// The jerk: the rates of ar and at, and the turning of the arm.
		dar := m.sr.J - rd*w*w - 2*r*w*al
		dat := r*m.ss.J + 3*rd*al + 2*rdd*w
		jr, jt := dar-at*w, dat+ar*w
		k.jx += jr*c - jt*s
		k.jy += jr*s + jt*c
	}
	return k
}

// relDot is the time derivative of rel at state y with rate yd: the
// suspension point's jerk with its sign changed, and the rate of the air's
// force over the mass. With s the wind's strength, s' its rate (constant
// inside a segment), r = v - s V e the load's velocity relative to the
// air and a the load's acceleration S¨ + L¨ n + 2 L' u + L u' (Air's
// formula differentiated):
//
//	dF/dt = 2 s s' F_w e - k (|r| r' + (r·r'/|r|) r + 2 s s' V² e),  r' = a - s' V e.
func (m *fastModel) relDot(t float64, k *kin, y, yd *[6]float64) (dx, dy, dz float64) {
	dx, dy = -k.jx, -k.jy
	a := m.air
	if a == nil {
		return dx, dy, 0
	}
	tc := m.airTime(t)
	sv, sd := a.Strength(tc), a.strengthRate(tc)
	f := r3.Scale(2*sv*sd*a.ForceN, a.Dir)
	if a.DragK > 0 {
		v := loadVel(k, y)
		acc := r3.Vec{X: k.ax + k.ddl*y[0] + 2*k.dl*y[3] + k.l*yd[3], Y: k.ay + k.ddl*y[1] + 2*k.dl*y[4] + k.l*yd[4],
			Z: k.ddl*y[2] + 2*k.dl*y[5] + k.l*yd[5]}
		r := r3.Sub(v, r3.Scale(sv*a.AirSpeed, a.Dir))
		rd := r3.Sub(acc, r3.Scale(sd*a.AirSpeed, a.Dir))
		var d r3.Vec
		if n := r3.Norm(r); n > 0 {
			d = r3.Add(r3.Scale(n, rd), r3.Scale(r3.Dot(r, rd)/n, r))
		}
		d = r3.Add(d, r3.Scale(2*sv*sd*a.AirSpeed*a.AirSpeed, a.Dir))
		f = r3.Sub(f, r3.Scale(a.DragK, d))
	}
	im := 1 / m.mass
	return dx + im*f.X, dy + im*f.Y, im * f.Z
}

// rel is the applied acceleration seen from the suspension point, a - S¨,
// at time t and state y (as pendulum.Model.eval forms it, the air's force
// from Air.Force).
func (m *fastModel) rel(t float64, k *kin, y *[6]float64) (rx, ry, rz float64) {
	rx, ry, rz = -k.ax, -k.ay, -m.g
	if m.air == nil {
		return rx, ry, rz
	}
	f := m.air.Force(m.airTime(t), loadVel(k, y))
	im := 1 / m.mass
	return rx + im*f.X, ry + im*f.Y, rz + im*f.Z
}

// relAt is the applied acceleration seen from the suspension point,
// a - S¨, and the rope length with its first two rates, at t and y. On
// travel and hoist moves without air it reads the suspension point's
// acceleration alone.
func (m *fastModel) relAt(t float64, y *[6]float64) (rx, ry, rz, l, dl, ddl float64) {
	if m.slewing || m.air != nil {
		k := m.kinOf(t, false)
		if m.air == nil {
			rx, ry, rz = -k.ax, -k.ay, -m.g // rel without air: a call fewer a stage
		} else {
			rx, ry, rz = m.rel(t, &k, y)
		}
		return rx, ry, rz, k.l, k.dl, k.ddl
	}
	l = m.l0
	if m.hoisting {
		h, dh, ddh := m.sh.At(t)
		l, dl, ddl = m.l0-h, -dh, -ddh
	}
	rx, ry = m.travelRel(t)
	return rx, ry, -m.g, l, dl, ddl
}

// simple reports whether the model has travel moves only: no slewing, no
// hoisting, no air (relAt's shortest case).
func (m *fastModel) simple() bool { return m.travel }

// travelRel is -S¨ of a suspension point on travel moves alone.
func (m *fastModel) travelRel(t float64) (rx, ry float64) {
	return -(m.sx.A + (t-m.sx.Origin)*m.sx.J), -(m.sy.A + (t-m.sy.Origin)*m.sy.J)
}

// rhs is the right-hand side y' = f(t, y): n' = u and
// n¨ = [(I - n nᵀ)(a - S¨) - 2 L' u]/L - |u|² n.
func (m *fastModel) rhs(t float64, y, dy *[6]float64) {
	if m.travel {
		// relAt's shortest case written out: L' = 0 drops the terms in
		// u (adding -0 changes no value) and 1/L is computed once.
		rx, ry := m.travelRel(t)
		rz, il := -m.g, m.il
		cn := -(rx*y[0]+ry*y[1]+rz*y[2])*il - (y[3]*y[3] + y[4]*y[4] + y[5]*y[5])
		dy[0], dy[1], dy[2] = y[3], y[4], y[5]
		dy[3] = rx*il + cn*y[0]
		dy[4] = ry*il + cn*y[1]
		dy[5] = rz*il + cn*y[2]
		return
	}
	var rx, ry, rz, il, dl float64
	switch {
	case m.steady && t <= m.airTo:
		// Travel moves with a steady air (steadyAir): relAt's values
		// without the air evaluated, the rope's length l0 (1/l0 is il)
		// and rate -0 as relAt gives them.
		rx, ry = m.travelRel(t)
		rx, ry, rz = rx+m.airX, ry+m.airY, m.rz
		il, dl = m.il, math.Copysign(0, -1)
	case m.air == nil && !m.slewing:
		// Travel and hoist moves: relAt's values written out here (a call
		// fewer a stage, which in wasm costs more than this arithmetic).
		l := m.l0
		if m.hoisting {
			h, dh, _ := m.sh.At(t)
			l, dl = m.l0-h, -dh
		}
		rx, ry = m.travelRel(t)
		rz, il = -m.g, 1/l
	case m.air == nil:
		// A slewing arm without air: relAt's values from kinOf directly.
		k := m.kinOf(t, false)
		rx, ry, rz, il, dl = -k.ax, -k.ay, -m.g, 1/k.l, k.dl
	default:
		var l float64
		rx, ry, rz, l, dl, _ = m.relAt(t, y)
		il = 1 / l
	}
	radial := rx*y[0] + ry*y[1] + rz*y[2]
	uu := y[3]*y[3] + y[4]*y[4] + y[5]*y[5]
	cn := -radial*il - uu
	cu := -2 * dl * il
	dy[0], dy[1], dy[2] = y[3], y[4], y[5]
	dy[3] = rx*il + cn*y[0] + cu*y[3]
	dy[4] = ry*il + cn*y[1] + cu*y[4]
	dy[5] = rz*il + cn*y[2] + cu*y[5]
}

// tension is the rope tension T = m [(a - S¨)·n - L¨ + L |u|²] from the
// values relAt gives, the rope's direction n and uu = |u|².
func (m *fastModel) tension(rx, ry, rz, l, ddl, nx, ny, nz, uu float64) float64 {
	return m.mass * (rx*nx + ry*ny + rz*nz - ddl + l*uu)
}

// project puts y back onto |n| = 1, n·u = 0 and returns ||n| - 1|, as
// pendulum.Project does (projected).
func project(y *[6]float64) float64 {
	var norm float64
	y[0], y[1], y[2], y[3], y[4], y[5], norm = projected(y[0], y[1], y[2], y[3], y[4], y[5])
	return math.Abs(norm - 1)
}

// projected is pendulum.Project on a state of plain numbers, the same
// operations in the same order (TestProjectedIsProject holds the two
// together), so that it is written into its callers: n = y[0:3]/|y[0:3]|,
// u = y[3:6] - (n·y[3:6]) n; norm is |y[0:3]|.
func projected(y0, y1, y2, y3, y4, y5 float64) (n0, n1, n2, u0, u1, u2, norm float64) {
	norm = math.Sqrt(y0*y0 + y1*y1 + y2*y2)
	n0, n1, n2 = y0/norm, y1/norm, y2/norm
	d := n0*y3 + n1*y4 + n2*y5
	return n0, n1, n2, y3 - d*n0, y4 - d*n1, y5 - d*n2, norm
}

// strengthRate is the rate of Air.Strength at t: 1/ramp while the wind
// rises, -1/ramp while it falls, zero otherwise (and for steps).
func (a *Air) strengthRate(t float64) float64 {
	if a.RampS <= 0 {
		return 0
	}
	rate := func(x float64) float64 {
		if x >= 0 && x < a.RampS {
			return 1 / a.RampS
		}
		return 0
	}
	r := rate(t - a.StartS)
	if a.DurationS > 0 {
		r -= rate(t - a.StartS - a.DurationS)
	}
	return r
}
