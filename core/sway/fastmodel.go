package sway

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/crane"
	"swaysheet/core/pendulum"
	"swaysheet/core/units"
)

// fastModel is the single-rope hook load of pendulum.Model written out as
// concrete code for the specialised path (fast.go): the same equation of
// motion, with the suspension point's motion, the rope length, the wind
// and the drag evaluated from flattened span tables (fastaxis.go) and
// plain fields, without closures or interfaces per evaluation.
type fastModel struct {
	x, y, slew, radius, hoist axisTable
	slewing                   bool    // the suspension point is on a slewing arm
	hoisting                  bool    // the rope length changes
	travel                    bool    // travel moves only: none of the three above nor force
	r0, phi0, l0              float64 // radius, slew angle and rope length at rest at the start
	il                        float64 // 1/l0
	mass, g                   float64
	force                     bool    // wind or drag act on the load
	windOn, windOff           float64 // the wind blows for windOn <= t < windOff
	windX, windY              float64 // its force, N
	dragK                     float64 // N per (m/s)^2

	// The spans of the segment between restarts being integrated (set by
	// segment); the wind force in it.
	sx, sy, ss, sr, sh span
	fx, fy             float64
}

// newFastModel builds the specialised model from the summed profiles of
// each role, or returns nil when a profile is of a kind it does not know
// or a role moves whose geometry it does not have (a crane type added to
// core/crane after this was written takes the general path). The
// arguments are build's: rope length l0, the crane's start, the wind's
// time span and force, the drag factor, and whether wind or drag act at
// all. The slewing arm's geometry is crane.Drives.Suspension's.
func newFastModel(ax *crane.Drives, l0 float64, at crane.Start, mass, windOn, windOff float64, wind r3.Vec, dragK float64, force bool) *fastModel {
	r0 := at.RadiusM
	m := &fastModel{r0: r0, phi0: at.SlewRad, l0: l0, il: 1 / l0, mass: mass, g: units.StandardGravity, force: force,
		windOn: windOn, windOff: windOff, windX: wind.X, windY: wind.Y, dragK: dragK,
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
	m.travel = !(m.slewing || m.force || m.hoisting)
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
	m.fx, m.fy = 0, 0
	if mid >= m.windOn && mid < m.windOff {
		m.fx, m.fy = m.windX, m.windY
	}
}

// kinAt evaluates the suspension point and the rope at t inside the
// current segment (the slewing arm as in suspension, build.go).
func (m *fastModel) kinAt(t float64) (k kin) {
	k.px, k.vx, k.ax = m.sx.at(t)
	k.py, k.vy, k.ay = m.sy.at(t)
	k.jx, k.jy = m.sx.j, m.sy.j
	h, dh, ddh := m.sh.at(t)
	k.l, k.dl, k.ddl, k.dddl = m.l0-h, -dh, -ddh, -m.sh.j
	if m.slewing {
		p, w, al := m.ss.at(t)
		q, rd, rdd := m.sr.at(t)
		phi, r := m.phi0+p, m.r0+q
		c, s := math.Cos(phi), math.Sin(phi)
		vr, vt := rd, r*w
		ar, at := rdd-r*w*w, r*al+2*rd*w
		k.px += r * c
		k.py += r * s
		k.vx += vr*c - vt*s
		k.vy += vr*s + vt*c
		k.ax += ar*c - at*s
		k.ay += ar*s + at*c
		// The jerk: the rates of ar and at, and the turning of the arm.
		dar := m.sr.j - rd*w*w - 2*r*w*al
		dat := r*m.ss.j + 3*rd*al + 2*rdd*w
		jr, jt := dar-at*w, dat+ar*w
		k.jx += jr*c - jt*s
		k.jy += jr*s + jt*c
	}
	return k
}

// relDot is the time derivative of rel at state y with rate yd = dy/dt:
// the suspension point's jerk with its sign changed, and the rate of the
// drag (wind is steady inside a segment): d(-c|v|v)/dt = -c (|v| a +
// (v·a/|v|) v), a the load's acceleration S¨ + L¨ n + 2 L' u + L u'.
func (m *fastModel) relDot(k *kin, y, yd *[6]float64) (dx, dy, dz float64) {
	dx, dy = -k.jx, -k.jy
	if m.dragK > 0 {
		vx := k.vx + (k.dl*y[0] + k.l*y[3])
		vy := k.vy + (k.dl*y[1] + k.l*y[4])
		vz := k.dl*y[2] + k.l*y[5]
		ax := k.ax + k.ddl*y[0] + 2*k.dl*y[3] + k.l*yd[3]
		ay := k.ay + k.ddl*y[1] + 2*k.dl*y[4] + k.l*yd[4]
		az := k.ddl*y[2] + 2*k.dl*y[5] + k.l*yd[5]
		v := math.Sqrt(vx*vx + vy*vy + vz*vz)
		if v > 0 {
			c, va := m.dragK/m.mass, (vx*ax+vy*ay+vz*az)/v
			dx -= c * (v*ax + va*vx)
			dy -= c * (v*ay + va*vy)
			dz -= c * (v*az + va*vz)
		}
	}
	return dx, dy, dz
}

// rel is the applied acceleration seen from the suspension point, a - S¨,
// with wind and drag (as pendulum.Model.eval forms it).
func (m *fastModel) rel(k *kin, y *[6]float64) (rx, ry, rz float64) {
	rx, ry, rz = -k.ax, -k.ay, -m.g
	if !m.force {
		return rx, ry, rz
	}
	fx, fy, fz := m.fx, m.fy, 0.0
	if m.dragK > 0 {
		// The load's velocity S' + L' n + L u.
		vx := k.vx + (k.dl*y[0] + k.l*y[3])
		vy := k.vy + (k.dl*y[1] + k.l*y[4])
		vz := k.dl*y[2] + k.l*y[5]
		c := m.dragK * math.Sqrt(vx*vx+vy*vy+vz*vz)
		fx -= c * vx
		fy -= c * vy
		fz -= c * vz
	}
	im := 1 / m.mass
	return rx + im*fx, ry + im*fy, rz + im*fz
}

// relAt is the applied acceleration seen from the suspension point,
// a - S¨, and the rope length with its first two rates, at t and y. On
// travel and hoist moves without wind or drag it reads the suspension
// point's acceleration alone.
func (m *fastModel) relAt(t float64, y *[6]float64) (rx, ry, rz, l, dl, ddl float64) {
	if m.slewing || m.force {
		k := m.kinAt(t)
		rx, ry, rz = m.rel(&k, y)
		return rx, ry, rz, k.l, k.dl, k.ddl
	}
	l = m.l0
	if m.hoisting {
		h, dh, ddh := m.sh.at(t)
		l, dl, ddl = m.l0-h, -dh, -ddh
	}
	rx, ry = m.travelRel(t)
	return rx, ry, -m.g, l, dl, ddl
}

// simple reports whether the model has travel moves only: no slewing, no
// hoisting, no wind or drag (relAt's shortest case).
func (m *fastModel) simple() bool { return m.travel }

// travelRel is -S¨ of a suspension point on travel moves alone.
func (m *fastModel) travelRel(t float64) (rx, ry float64) {
	return -(m.sx.a + (t-m.sx.origin)*m.sx.j), -(m.sy.a + (t-m.sy.origin)*m.sy.j)
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
	rx, ry, rz, l, dl, _ := m.relAt(t, y)
	radial := rx*y[0] + ry*y[1] + rz*y[2]
	uu := y[3]*y[3] + y[4]*y[4] + y[5]*y[5]
	il := 1 / l
	cn := -radial*il - uu
	cu := -2 * dl * il
	dy[0], dy[1], dy[2] = y[3], y[4], y[5]
	dy[3] = rx*il + cn*y[0] + cu*y[3]
	dy[4] = ry*il + cn*y[1] + cu*y[4]
	dy[5] = rz*il + cn*y[2] + cu*y[5]
}

// tension is the rope tension T = m [(a - S¨)·n - L¨ + L |u|²] from the
// values relAt gives.
func (m *fastModel) tension(rx, ry, rz, l, ddl float64, y *[6]float64) float64 {
	uu := y[3]*y[3] + y[4]*y[4] + y[5]*y[5]
	return m.mass * (rx*y[0] + ry*y[1] + rz*y[2] - ddl + l*uu)
}

// project puts y back onto |n| = 1, n·u = 0 (pendulum.Project).
func project(y *[6]float64) float64 { return pendulum.Project(y[:]) }
