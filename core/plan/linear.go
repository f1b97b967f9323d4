package plan

import (
	"math"

	"swaysheet/core/motion"
	"swaysheet/core/units"
)

// linearPeak is the largest swing angle (rad) of the small-angle pendulum
// theta” + w^2 theta = -A(t)/L, w^2 = g/L, under the piecewise constant
// hook acceleration A = k*acc of a trapezoidal move, from rest, including
// the free swing after the move. On each piece the solution is exact:
// theta = -A/g + R*cos(w*tau - phi) (linear theory of the pendulum with a
// moving support). It is the planner's first guess; simulation decides.
func linearPeak(p *motion.Trapezoid, k, l float64) float64 {
	g := units.StandardGravity
	w := math.Sqrt(g / l)
	bp := p.Breakpoints()
	th, dth, peak := 0.0, 0.0, 0.0
	for i := 0; i+1 < len(bp); i++ {
		d := bp[i+1] - bp[i]
		eq := -k * p.At(0.5*(bp[i]+bp[i+1])).Acc / g
		e0, v0 := th-eq, dth/w
		r, phi := math.Hypot(e0, v0), math.Atan2(v0, e0)
		at := func(tau float64) float64 { return eq + r*math.Cos(w*tau-phi) }
		peak = math.Max(peak, math.Max(math.Abs(at(0)), math.Abs(at(d))))
		// Turning points: w*tau - phi = m*pi for a whole m, so tau =
		// (m*pi + phi)/w; the first after tau = 0 has m = floor(-phi/pi)+1.
		// The swing reaches |eq| + r there only if it falls inside the piece.
		if m := math.Floor(-phi/math.Pi) + 1; (m*math.Pi+phi)/w < d {
			th := eq + r*math.Cos(m*math.Pi)
			peak = math.Max(peak, math.Abs(th))
			if (m*math.Pi+math.Pi+phi)/w < d {
				peak = math.Max(peak, math.Abs(eq)+r)
			}
		}
		th = at(d)
		dth = -r * w * math.Sin(w*d-phi)
	}
	// Free swing after the move.
	return math.Max(peak, math.Hypot(th, dth/w))
}

// linearRatio is the worst linear-theory peak of a trapezoid with
// acceleration a over the rope lengths, against the peak limits (1 = on
// the limit). For a slew the lean at the top rate is added to the angle.
func (rq *request) linearRatio(a float64) float64 {
	p := motion.NewTrapezoid(0, rq.dist, rq.vmax, a, a)
	lean := 0.0
	if rq.slew {
		v := p.PeakSpeed()
		lean = math.Atan(rq.radius * v * v / units.StandardGravity)
	}
	worst := 0.0
	for _, l := range rq.ropes {
		l += rq.rig // a hook block's rigging: one pendulum to the load, a first guess
		th := linearPeak(p, rq.k, l) + lean
		if rq.lim.PeakSwingDeg > 0 {
			worst = math.Max(worst, th/(rq.lim.PeakSwingDeg*units.Degree))
		}
		if rq.lim.PeakExcursionM > 0 {
			worst = math.Max(worst, l*math.Sin(math.Min(th, math.Pi/2))/rq.lim.PeakExcursionM)
		}
	}
	return worst
}
