package scenario

import "swaysheet/core/motion"

// checkDuration reports a plan whose fastest move (at the top speed and
// the largest acceleration) already ends after the longest run simulated,
// at the field to raise.
func (p *Plan) checkDuration(c *checker) {
	dist, v, a := p.DistanceM, p.TopSpeedMPerS, p.MaxAccelMPerS2
	fd, fv, fa := "plan.distance_m", "plan.top_speed_m_per_s", "plan.max_accel_m_per_s2"
	if p.Axis == Slew {
		dist, v, a = p.AngleDeg, p.TopRateDegPerS, p.MaxAccelDegPerS2
		fd, fv, fa = "plan.angle_deg", "plan.top_rate_deg_per_s", "plan.max_accel_deg_per_s2"
	}
	if dist == nil || v == nil || a == nil {
		return
	}
	for _, k := range []struct {
		f string
		x float64
	}{{fd, *dist}, {fv, *v}, {fa, *a}} {
		r := Ranges[k.f]
		if !(k.x >= r.Min && k.x <= r.Max) || k.x == 0 {
			return // reported by its range
		}
	}
	t := motion.NewTrapezoid(0, *dist, *v, *a, *a)
	if t.Duration() <= MaxRunS {
		return
	}
	f, what := fa, "acceleration"
	if ramps := 2 * t.PeakSpeed() / *a; ramps < t.Duration()-ramps {
		f, what = fv, "speed"
	}
	c.add(f, "at this %s the fastest move lasts %.4g s: at most %g s is simulated; raise %s (%s) or shorten %s",
		what, t.Duration(), MaxRunS, f, Ranges[f].Text(), fd)
}
