package sway

import "gonum.org/v1/gonum/spatial/r3"

// The specialised path on travel moves alone with a steady air: a load
// carried along the runway in a wind that is off or full over a segment
// between restarts, without drag (fastModel.airTravel, fastModel.steady;
// the clearance check's runs of a gust). The air's share of the applied
// acceleration is then one constant of the segment, which rhs, the
// history (fastScan.emit) and the step ends' measures (fastScan.measureAt,
// with the share of its rate) add to the suspension point's -S¨ (and its
// jerk) without evaluating the air: the same operations on the same
// values as the general way through relAt, kinOf, rel, relDot and
// Air.Force (calls at every evaluation and step end, each dear in wasm),
// which TestAirTravelAsKin holds them to, bit for bit. Ramps and drag
// take the general way.

// steadyAir finds whether the air's force is the same at every time of
// the segment [A, B] (set by segment) at which the model is evaluated,
// and if so keeps its share of the applied acceleration, im*(s² F_w e)
// as rel adds it to -S¨ (and -g), for times up to airTo = B + 1: the
// solver's (its stages are at most at the segment's end, rounded) and the
// history's (inside the last step).
//
// For t <= B + 1 airTime gives tc = t, A + d or B - d with
// d = max(1e-12, 1e-12 t) <= D = 1e-12 (B + 1), each sum rounded: on a
// segment longer than D + 1e-12 (B - D >= A + 1e-12, A + D <= B - 1e-12)
// tc lies in [A + 1e-12, B - 1e-12] (rounding is monotone). Air.Strength
// takes one branch of rise for each of its terms, on x = tc - start and
// x - duration, both non-decreasing in tc: the term is 0 (x < 0) over
// the segment when it is at its end, 1 (x >= ramp) when it is at its
// start, and the strength is then one value over the segment.
func (m *fastModel) steadyAir() {
	a, lo, hi := m.air, m.segA+1e-12, m.segB-1e-12
	m.airTo = m.segB + 1
	d := 1e-12 * m.airTo
	x0, x1, x2, x3 := lo-a.StartS, hi-a.StartS, lo-a.StartS-a.DurationS, hi-a.StartS-a.DurationS
	m.steady = m.segB-d >= lo && m.segA+d <= hi && (x1 < 0 || x0 >= a.RampS) &&
		(a.DurationS <= 0 || x3 < 0 || x2 >= a.RampS)
	if m.steady {
		// Air.Strength's value over the segment, from its branches there.
		sv := 0.0
		if x0 >= a.RampS {
			sv = 1
		}
		if a.DurationS > 0 && x2 >= a.RampS {
			sv--
		}
		f, im := sv*sv*a.ForceN, 1/m.mass
		m.airX, m.airY, m.rz = im*(f*a.Dir.X), im*(f*a.Dir.Y), -m.g+im*(f*a.Dir.Z)
		// relDot's share, 2 s s' F_w e over the mass with s' zero (no ramp
		// over the segment), in relDot's operations: zeros with their signs.
		fd := r3.Scale(2*sv*a.strengthRate(lo)*a.ForceN, a.Dir)
		m.dairX, m.dairY, m.dairZ = im*fd.X, im*fd.Y, im*fd.Z
	}
}
