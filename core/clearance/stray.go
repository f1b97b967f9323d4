package clearance

import "math"

// stray is the largest distance of the run's points from the polyline
// (see Stray), finding few points' distances exactly. A point's squared
// distance to the polyline is at most its squared distance to any one
// segment: that of the segment reached by walking along the polyline
// from the previous point's, while a neighbouring segment is nearer (or
// as near, going on: a load at rest gives segments of no length), bounds
// it (walk). The point of largest bound has its distance found exactly
// (closestFrom, begun at the segment its walk ended at), then, in run
// order, each point whose bound is above the largest distance found so
// far: a point passed over lies no farther than its bound, so no
// farther than a point found. The answer is
// strayEvery's (TestStrayMatchesEvery). No sort: ordering every point by
// bound cost more than the few distances it saved.
func (n *nearest) stray(run []Point2) float64 { return n.strayInto(run, new(scratch)) }

// strayInto is stray in sc's memory.
func (n *nearest) strayInto(run []Point2, sc *scratch) float64 {
	if n.single || len(run) < 2 {
		return n.strayEvery(run)
	}
	sc.bound, sc.seg = grow(sc.bound, len(run)), grow(sc.seg, len(run))
	bound, seg := sc.bound, sc.seg
	_, s := n.closest(run[0])
	top := 0
	for i, p := range run {
		bound[i], s = n.walk(p, s)
		seg[i] = int32(s)
		if bound[i] > bound[top] {
			top = i
		}
	}
	worst := 0.0
	if bound[top] > 0 {
		worst, _ = n.closestFrom(run[top], int(seg[top]))
	}
	for i, b := range bound {
		if b > worst && i != top {
			if d2, _ := n.closestFrom(run[i], int(seg[i])); d2 > worst {
				worst = d2
			}
		}
	}
	return math.Sqrt(worst)
}

// nearest finds the distance from a point to a polyline with a uniform
// grid of buckets: each segment is listed in the buckets its bounding box
// (box) meets. A search (closestFrom) walks along the polyline to a
// segment no farther than its neighbours, then measures only the
// segments whose boxes lie as near as that one, in the buckets that
// near, so the answer is exact.
type nearest struct {
	pts       []Point2
	box       [][4]float64 // each segment's bounding box: x from [0] to [2], y from [1] to [3]
	x0, y0, g float64
	x1, y1    float64 // the top corner of the polyline's box (x0, y0 the bottom)
	nx, ny    int
	bucket    [][]int32
	tolM      float64 // rounding allowance: 1e-9 of a bucket's side, 1e-12 of the coordinates (see closestFrom)
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
		lo.X, lo.Y, hi.X, hi.Y = lower(lo.X, p.X), lower(lo.Y, p.Y), upper(hi.X, p.X), upper(hi.Y, p.Y)
		if i > 0 {
			length += math.Hypot(p.X-poly[i-1].X, p.Y-poly[i-1].Y)
		}
	}
	// About four segments' length per bucket, and at most 256 a side.
	n.g = max(4*length/float64(len(poly)), (hi.X-lo.X)/256, (hi.Y-lo.Y)/256, 1e-3)
	n.x0, n.y0, n.x1, n.y1 = lo.X, lo.Y, hi.X, hi.Y
	n.nx = int((hi.X-lo.X)/n.g) + 1
	n.ny = int((hi.Y-lo.Y)/n.g) + 1
	n.tolM = 1e-9*n.g + 1e-12*max(-lo.X, -lo.Y, hi.X, hi.Y, 0)
	n.bucket = make([][]int32, n.nx*n.ny)
	n.box = make([][4]float64, len(poly)-1)
	for i := range n.box {
		a, b := poly[i], poly[i+1]
		n.box[i] = [4]float64{lower(a.X, b.X), lower(a.Y, b.Y), upper(a.X, b.X), upper(a.Y, b.Y)}
		i0, j0 := n.cell(n.box[i][0], n.box[i][1])
		i1, j1 := n.cell(n.box[i][2], n.box[i][3])
		for j := j0; j <= j1; j++ {
			for k := i0; k <= i1; k++ {
				n.bucket[j*n.nx+k] = append(n.bucket[j*n.nx+k], int32(i))
			}
		}
	}
	return n
}

// cell is the bucket holding (x, y), the nearest for a point off the
// grid. The clamp is made before the conversion to int, which is
// undefined beyond int's range (and for NaN).
func (n *nearest) cell(x, y float64) (int, int) {
	return onGrid((x-n.x0)/n.g, n.nx), onGrid((y-n.y0)/n.g, n.ny)
}

// onGrid is v's whole part held to [0, size-1].
func onGrid(v float64, size int) int {
	if !(v >= 0) {
		return 0
	}
	if v >= float64(size-1) {
		return size - 1
	}
	return int(v)
}

// closest is the squared distance from p to the polyline and the first
// segment at that distance (0 for a single point).
func (n *nearest) closest(p Point2) (float64, int) { return n.closestFrom(p, -1) }

// closestFrom is closest with the search begun at segment s: a cursor,
// the segment of the point before when points come in order along a
// path (s < 0: none). The walk from s (walk) ends at a segment at some
// squared distance best. A segment k at best or nearer has a point
// within sqrt(best) of p, inside k's box; so the point q of that box
// nearest p is as near, and k is listed in the bucket holding q (a
// segment's buckets run from its box's corners' cells, and cell is
// monotone). q also lies in the polyline's box. So only the buckets
// whose square, cut to the polyline's box, lies within sqrt(best) of p
// are searched, and in them only the segments whose box does, each
// measured exactly (segDist2); ties go to the lowest index. A box's gap
// is taken as (|x-lo| + |x-hi| - (hi-lo))/2 along each axis, with no
// branch: in Go's wasm each branch taken is a jump through a table, and
// this form took 13 % less time there than comparisons (16 % more
// instructions natively). Every bound is widened by a rounding
// allowance, tolM plus 1e-12 of p's coordinates (a distance's rounding
// is some 1e-16 of the coordinates, a cell's some 1e-13 of a bucket's
// side, from a division), a bucket's twice, and kept strictly, so no
// segment as near is left out. The plain form is trying every segment
// (TestClosestSegmentIsTheFirstNearest, TestNearestMatchesEverySegment:
// bit for bit). For the runs of the bay example about their straight
// track it measures about two and a half segments and the boxes of six,
// where the search ring by ring from p's bucket (all of p's bucket,
// then all the buckets round it while p was nearer its bucket's side
// than the best) measured about nine segments.
func (n *nearest) closestFrom(p Point2, s int) (float64, int) {
	if n.single {
		dx, dy := p.X-n.pts[0].X, p.Y-n.pts[0].Y
		return dx*dx + dy*dy, 0
	}
	if s < 0 { // the first segment listed in p's bucket, else the first
		ci, cj := n.cell(p.X, p.Y)
		if b := n.bucket[cj*n.nx+ci]; len(b) > 0 {
			s = int(b[0])
		}
	}
	best, seg := n.walk(p, s)
	tol := n.tolM + 1e-12*(math.Abs(p.X)+math.Abs(p.Y))
	r := math.Sqrt(best)*(1+1e-12) + tol
	near, wide := 4*r*r, (r+tol)*(r+tol) // a segment's box (twice its gap, below), a bucket's square
	i0, j0 := n.cell(p.X-r-tol, p.Y-r-tol)
	i1, j1 := n.cell(p.X+r+tol, p.Y+r+tol)
	for j := j0; j <= j1; j++ {
		gy := outsideBy(p.Y, n.y0+float64(j)*n.g, lower(n.y0+float64(j+1)*n.g, n.y1))
		for i := i0; i <= i1; i++ {
			gx := outsideBy(p.X, n.x0+float64(i)*n.g, lower(n.x0+float64(i+1)*n.g, n.x1))
			if gx*gx+gy*gy > wide {
				continue
			}
			for _, k := range n.bucket[j*n.nx+i] {
				// Twice the box's gap from p along each axis,
				// |x-lo| + |x-hi| - (hi-lo), with no branch.
				b := &n.box[k]
				ex := math.Abs(p.X-b[0]) + math.Abs(p.X-b[2]) - (b[2] - b[0])
				ey := math.Abs(p.Y-b[1]) + math.Abs(p.Y-b[3]) - (b[3] - b[1])
				if ex*ex+ey*ey > near || int(k) == seg {
					continue
				}
				a, c := n.pts[k], n.pts[k+1]
				if d := segDist2(p.X-a.X, p.Y-a.Y, c.X-a.X, c.Y-a.Y); d < best || (d == best && int(k) < seg) {
					best, seg = d, int(k)
				}
			}
		}
	}
	if !(best < math.Inf(1)) {
		// No segment at a finite distance (p not finite, or so far off
		// the squares overflow; then r was infinite and every bucket was
		// searched): as trying every segment gives.
		return math.Inf(1), 0
	}
	return best, seg
}

// walk goes along the polyline from segment s (held to the segments)
// while the next segment is as near p or nearer (going on over ties: a
// load at rest gives segments of no length), else back while the one
// before is nearer, and gives the squared distance to the segment it
// ends at and that segment. After a step on, none back is taken: the
// segment behind was the farther (what stray's walk did, found with a
// third fewer distances).
func (n *nearest) walk(p Point2, s int) (float64, int) {
	pts, last := n.pts, len(n.pts)-2 // segments 0 to last
	s = min(max(s, 0), last)
	a, b := pts[s], pts[s+1]
	best := segDist2(p.X-a.X, p.Y-a.Y, b.X-a.X, b.Y-a.Y)
	from := s
	for s < last {
		c := pts[s+2]
		d := segDist2(p.X-b.X, p.Y-b.Y, c.X-b.X, c.Y-b.Y)
		if !(d <= best) {
			break
		}
		s, best, a, b = s+1, d, b, c
	}
	if s > from {
		return best, s
	}
	for s > 0 {
		z := pts[s-1]
		d := segDist2(p.X-z.X, p.Y-z.Y, a.X-z.X, a.Y-z.Y)
		if !(d < best) {
			break
		}
		s, best, a = s-1, d, z
	}
	return best, s
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
		d, _ := n.closest(p)
		worst = max(worst, d)
	}
	return math.Sqrt(worst)
}
