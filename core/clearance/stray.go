package clearance

import "math"

// stray is the largest distance of the run's points from the polyline
// (see Stray), finding few points' distances exactly. A point's squared
// distance to the polyline is at most its squared distance to any one
// segment: that of the segment reached by walking along the polyline
// from the previous point's, while a neighbouring segment is nearer (or
// as near, going on: a load at rest gives segments of no length), bounds
// it. The point of largest bound has its distance found exactly
// (nearest.dist2), then, in run order, each point whose bound is above
// the largest distance found so far: a point passed over lies no farther
// than its bound, so no farther than a point found. The answer is
// strayEvery's (TestStrayMatchesEvery). No sort: ordering every point by
// bound cost more than the few distances it saved.
func (n *nearest) stray(run []Point2) float64 { return n.strayInto(run, new(scratch)) }

// strayInto is stray in sc's memory.
func (n *nearest) strayInto(run []Point2, sc *scratch) float64 {
	if n.single || len(run) < 2 {
		return n.strayEvery(run)
	}
	pts, last := n.pts, len(n.pts)-2 // segments 0 to last
	d := func(p Point2, s int) float64 { return pointSegmentDist2(p, pts[s], pts[s+1]) }
	sc.bound = grow(sc.bound, len(run))
	bound := sc.bound
	_, s := n.closest(run[0])
	top := 0
	for i, p := range run {
		b := d(p, s)
		for s < last && d(p, s+1) <= b {
			s++
			b = d(p, s)
		}
		for s > 0 && d(p, s-1) < b {
			s--
			b = d(p, s)
		}
		bound[i] = b
		if b > bound[top] {
			top = i
		}
	}
	worst := 0.0
	if bound[top] > 0 {
		worst = n.dist2(run[top])
	}
	for i, b := range bound {
		if b > worst && i != top {
			if d2 := n.dist2(run[i]); d2 > worst {
				worst = d2
			}
		}
	}
	return math.Sqrt(worst)
}
