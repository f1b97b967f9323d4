package plan

import (
	"math"

	"swaysheet/core/motion"
	"swaysheet/core/units"
)

// linearPeak is the largest swing angle (rad) of the small-angle pendulum
// of length l under the trapezoid's hook acceleration k*acc, from rest,
// the free swing after the move included (linearSwing). It is the
// planner's first guess; simulation decides.
func linearPeak(p *motion.Trapezoid, k, l float64) float64 {
	pk, _ := linearSwing(p, k, math.Sqrt(units.StandardGravity/l))
	return pk
}

// linearRatio is the worst linear-theory peak of a trapezoid with
// acceleration a over the rope lengths, against the peak limits (1 = on
// the limit). For a slew the lean at the top rate is added to the angle.
func (rq *request) linearRatio(a float64) float64 {
	p := motion.NewTrapezoid(0, rq.dist, rq.vmax, a, a)
	lean := 0.0
	if rq.leans() {
		lean = rq.lean(p.PeakSpeed())
	}
	worst := 0.0
	pieces := linearPieces(p) // one list for every rope length
	for _, l := range rq.ropes {
		l += rq.rig // a hook block's rigging: one pendulum to the load, a first guess
		pk, _ := linearSwingOf(p, pieces, rq.k, math.Sqrt(units.StandardGravity/l))
		th := pk + lean
		if rq.lim.PeakSwingDeg > 0 {
			worst = math.Max(worst, th/(rq.lim.PeakSwingDeg*units.Degree))
		}
		if rq.lim.PeakExcursionM > 0 {
			worst = math.Max(worst, l*math.Sin(math.Min(th, math.Pi/2))/rq.lim.PeakExcursionM)
		}
	}
	return worst
}
