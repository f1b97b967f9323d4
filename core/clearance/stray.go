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

// nearest finds the distance from a point to a polyline with a uniform
// grid of buckets: each segment is listed in the buckets its bounding box
// meets, and the search widens ring by ring until no unsearched bucket
// can hold a nearer segment, so the answer is exact.
type nearest struct {
	pts       []Point2
	x0, y0, g float64
	nx, ny    int
	bucket    [][]int32
	single    bool
}

func newNearest(poly []Point2) *nearest {
	n := &nearest{pts: poly, single: len(poly) == 1}
	if n.single {
		return n
	}
	lo, hi := poly[0], poly[0]
	length := 0.0
	for i, p := range poly {
		lo.X, lo.Y, hi.X, hi.Y = min(lo.X, p.X), min(lo.Y, p.Y), max(hi.X, p.X), max(hi.Y, p.Y)
		if i > 0 {
			length += math.Hypot(p.X-poly[i-1].X, p.Y-poly[i-1].Y)
		}
	}
	// About four segments' length per bucket, and at most 256 a side.
	n.g = max(4*length/float64(len(poly)), (hi.X-lo.X)/256, (hi.Y-lo.Y)/256, 1e-3)
	n.x0, n.y0 = lo.X, lo.Y
	n.nx = int((hi.X-lo.X)/n.g) + 1
	n.ny = int((hi.Y-lo.Y)/n.g) + 1
	n.bucket = make([][]int32, n.nx*n.ny)
	for i := 0; i+1 < len(poly); i++ {
		a, b := poly[i], poly[i+1]
		i0, j0 := n.cell(min(a.X, b.X), min(a.Y, b.Y))
		i1, j1 := n.cell(max(a.X, b.X), max(a.Y, b.Y))
		for j := j0; j <= j1; j++ {
			for k := i0; k <= i1; k++ {
				n.bucket[j*n.nx+k] = append(n.bucket[j*n.nx+k], int32(i))
			}
		}
	}
	return n
}

func (n *nearest) cell(x, y float64) (int, int) {
	i := min(max(int((x-n.x0)/n.g), 0), n.nx-1)
	j := min(max(int((y-n.y0)/n.g), 0), n.ny-1)
	return i, j
}

// dist2 is the squared distance from p to the polyline.
func (n *nearest) dist2(p Point2) float64 {
	d, _ := n.closest(p)
	return d
}

// closest is the squared distance from p to the polyline and the first
// segment at that distance (0 for a single point).
func (n *nearest) closest(p Point2) (float64, int) {
	if n.single {
		dx, dy := p.X-n.pts[0].X, p.Y-n.pts[0].Y
		return dx*dx + dy*dy, 0
	}
	ci, cj := n.cell(p.X, p.Y)
	// Distance from p to the grid's box, for points outside it.
	ox := outsideBy(p.X, n.x0, n.x0+float64(n.nx)*n.g)
	oy := outsideBy(p.Y, n.y0, n.y0+float64(n.ny)*n.g)
	outside := 0.0
	if ox != 0 || oy != 0 {
		outside = math.Hypot(ox, oy)
	}
	best, seg := math.Inf(1), 0
	for ring := 0; ; ring++ {
		// Every bucket not yet searched is at least ring-1 buckets from
		// p's own along some axis, and no nearer than the grid's box.
		reach := outside
		if r := float64(ring-1) * n.g; r > reach {
			reach = r
		}
		if ring > 0 && reach > 0 && reach*reach >= best {
			return best, seg
		}
		// Nearer: every bucket not yet searched lies beyond the square of
		// rings searched, whose sides are at p's own cell's edges plus
		// ring-1 cells (a side at the grid's edge has nothing beyond).
		// Less a rounding allowance (a segment's cells come from a
		// division), and strictly, so no segment as near is left out.
		if ring > 0 {
			if wall := n.wall(p, ci, cj, ring-1) - 1e-9*n.g; wall > 0 && wall*wall > best {
				return best, seg
			}
		}
		if ring > n.nx && ring > n.ny {
			return best, seg
		}
		// The ring's buckets on the grid: its top and bottom rows whole,
		// its sides between (the order does not matter: ties go to the
		// first segment).
		if ring == 0 {
			best, seg = n.look(p, ci, cj, best, seg)
			continue
		}
		i0, i1 := max(ci-ring, 0), min(ci+ring, n.nx-1)
		for _, j := range [2]int{cj - ring, cj + ring} {
			for i := i0; j >= 0 && j < n.ny && i <= i1; i++ {
				best, seg = n.look(p, i, j, best, seg)
			}
		}
		j0, j1 := max(cj-ring+1, 0), min(cj+ring-1, n.ny-1)
		for _, i := range [2]int{ci - ring, ci + ring} {
			for j := j0; i >= 0 && i < n.nx && j <= j1; j++ {
				best, seg = n.look(p, i, j, best, seg)
			}
		}
	}
}

// wall is the distance from p to the nearest side of the square of
// buckets within r of (ci, cj) beyond which the grid has buckets
// (+Inf when it has none beyond any side).
func (n *nearest) wall(p Point2, ci, cj, r int) float64 {
	w := math.Inf(1)
	if ci+r+1 < n.nx {
		w = n.x0 + float64(ci+r+1)*n.g - p.X
	}
	if ci-r-1 >= 0 {
		if v := p.X - (n.x0 + float64(ci-r)*n.g); v < w {
			w = v
		}
	}
	if cj+r+1 < n.ny {
		if v := n.y0 + float64(cj+r+1)*n.g - p.Y; v < w {
			w = v
		}
	}
	if cj-r-1 >= 0 {
		if v := p.Y - (n.y0 + float64(cj-r)*n.g); v < w {
			w = v
		}
	}
	return w
}

// look searches bucket (i, j) for a segment nearer p than best (or as
// near with a lower index than seg), when the bucket is on the grid.
func (n *nearest) look(p Point2, i, j int, best float64, seg int) (float64, int) {
	if i < 0 || i >= n.nx || j < 0 || j >= n.ny {
		return best, seg
	}
	for _, s := range n.bucket[j*n.nx+i] {
		if d := pointSegmentDist2(p, n.pts[s], n.pts[s+1]); d < best || (d == best && int(s) < seg) {
			best, seg = d, int(s)
		}
	}
	return best, seg
}

// outsideBy is how far x lies outside [lo, hi] (zero inside), with
// comparisons rather than max (a call in wasm).
func outsideBy(x, lo, hi float64) float64 {
	if x < lo {
		return lo - x
	}
	if x > hi {
		return x - hi
	}
	return 0
}

// strayEvery is stray finding every point's distance: the plain form,
// kept to check stray against.
func (n *nearest) strayEvery(run []Point2) float64 {
	worst := 0.0
	for _, p := range run {
		worst = max(worst, n.dist2(p))
	}
	return math.Sqrt(worst)
}
