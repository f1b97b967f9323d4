package sway

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// The specialised path on travel moves alone with air (fastModel.airTravel:
// a gust, wind and drag on a load carried along the runway, as in the
// clearance check's runs): the applied acceleration written out from the
// segment's spans and the air's fields, the same operations in the same
// order as the general way through kinOf, rel and Air.Force, which
// TestAirTravelAsKin holds it to, bit for bit.

// airRel is rel on travel moves alone with air (fastModel.airTravel),
// in the same operations in the same order as kinOf, loadVel, rel and
// Air.Force, read from the segment's spans: without the kin made and
// returned and four calls for every evaluation (in wasm a call, and a
// struct returned through memory, cost more than this arithmetic). The
// rope is at l0 (l0 - 0) with the rate -0 (-(0)), as kinOf gives it; the
// load's velocity is made only with drag, where Air.Force reads it.
// TestAirTravelAsKin holds the two ways to the same bits.
func (m *fastModel) airRel(t float64, y *[6]float64) (rx, ry, rz float64) {
	rx, ry = m.travelRel(t)
	a := m.air
	sv := a.Strength(m.airTime(t))
	c := sv * sv * a.ForceN
	fx, fy, fz := c*a.Dir.X, c*a.Dir.Y, c*a.Dir.Z
	if a.DragK != 0 {
		var vx, vy float64
		if len(m.x) > 0 {
			_, vx, _ = m.sx.at(t)
		}
		if len(m.y) > 0 {
			_, vy, _ = m.sy.at(t)
		}
		dl, l := math.Copysign(0, -1), m.l0
		sa := sv * a.AirSpeed
		r := r3.Vec{X: vx + (dl*y[0] + l*y[3]) - sa*a.Dir.X, Y: vy + (dl*y[1] + l*y[4]) - sa*a.Dir.Y,
			Z: dl*y[2] + l*y[5] - sa*a.Dir.Z}
		n, ss := r3.Norm(r), sv*sv*a.AirSpeed*a.AirSpeed
		fx -= a.DragK * (n*r.X + ss*a.Dir.X)
		fy -= a.DragK * (n*r.Y + ss*a.Dir.Y)
		fz -= a.DragK * (n*r.Z + ss*a.Dir.Z)
	}
	im := m.im
	return rx + im*fx, ry + im*fy, -m.g + im*fz
}
