package clearance

import (
	"cmp"
	"math"

	"swaysheet/core/internal/sorts"
)

// stray is the largest distance of the run's points from the polyline
// (see Stray), finding few points' distances exactly. A point's squared
// distance to the polyline is at most its squared distance to any one
// segment: that of the segment reached by walking along the polyline
// from the previous point's, while a neighbouring segment is nearer (or
// as near, going on: a load at rest gives segments of no length), bounds
// it. The points are then taken by bound, largest first, each
// one's distance found exactly (nearest.dist2), until the next bound is
// no more than the largest found: no point left can lie farther. The
// answer is strayEvery's (TestStrayMatchesEvery).
func (n *nearest) stray(run []Point2) float64 {
	if n.single || len(run) < 2 {
		return n.strayEvery(run)
	}
	pts, last := n.pts, len(n.pts)-2 // segments 0 to last
	d := func(p Point2, s int) float64 { return pointSegmentDist2(p, pts[s], pts[s+1]) }
	bound := make([]float64, len(run))
	_, s := n.closest(run[0])
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
	}
	order := make([]int, len(run))
	for i := range order {
		order[i] = i
	}
	sorts.By(order, func(a, b int) bool { return cmp.Compare(bound[b], bound[a]) < 0 })
	worst := 0.0
	for _, i := range order {
		if !(bound[i] > worst) {
			break
		}
		worst = max(worst, n.dist2(run[i]))
	}
	return math.Sqrt(worst)
}
