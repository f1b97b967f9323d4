package scenario

import "swaysheet/core/motion"

// checkDuration reports a plan whose fastest move (at the top speed and
// the largest acceleration) already ends after the longest run simulated,
// at the field to raise.
func (p *Plan) checkDuration(c *checker) {
	ax, dist, v, a, ok := p.Move()
	if !ok {
		return
	}
	k := ax.Kind
	fd, fv, fa := "plan."+k.Distance, "plan."+k.TopSpeed, "plan."+k.MaxAccel
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
