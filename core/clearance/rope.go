package clearance

import "math"

// The hoist rope (and a rigid load's sling legs) are straight segments:
// the rope from the suspension point to the hook, each leg from the hook
// (or a spreader's top point) to its attach point on the load. Against an
// upright prism (outline P, top h, running down through the floor) the
// clearance of a segment s is
//
//	apart:    the distance between s and the prism
//	through:  -(the greatest depth of a point of s inside it)
//
// Distance between a segment and the prism, exactly. When they do not
// meet, the distance is attained at a point x of s and a point y of the
// prism's boundary. If x is an end of s, it is that end's point
// clearance (package comment). Otherwise x is inside s; if y is inside a
// face (the top, or a side: an edge of P times (-inf, h]) the distance to
// the face's plane is stationary along s at x, and being linear in the
// position along s it is constant: s runs parallel to the face, and
// sliding x along s keeps the distance until x reaches an end of s or y
// the face's border. So the distance is the least of
//
//  1. the point clearance of each end of s,
//  2. the distance from s to each top edge (a segment at height h),
//  3. the distance from s to each corner's upright line {(c, z): z <= h}
//     (taken from the lower of h and s's lowest point up to h: below
//     that, raising the point on the line brings it nearer every point
//     of s),
//
// segment to segment distances in space (Ericson, Real-Time Collision
// Detection, 2005, sec. 5.1.9). Whether s passes through the prism is
// SegmentStrikes, exact. Through it, the depth of a point is its
// distance to the boundary, min(plan distance to the outline's edges,
// h - z); the greatest depth is taken at points at most stepM apart on
// the pieces of s inside the outline (the depth is 1-Lipschitz, so it is
// within stepM/2 of the greatest), and is at least zero: a segment that
// only grazes the prism has clearance zero and strikes.

// SegmentClearance is the signed clearance of the straight segment ab
// from the obstacle (see above), with the point of ab where it is
// attained: the nearest point, or the deepest inside. stepM (positive)
// spaces the points at which the depth is taken through the obstacle.
func (o *Obstacle) SegmentClearance(a, b Point3, stepM float64) (clearM float64, at Point3, strikes bool) {
	lo, hi := outlineBox(o.Outline)
	return o.segmentClearance(a, b, stepM, lo, hi)
}

// segmentClearance is SegmentClearance with the outline's box (lo, hi:
// outlineBox) found once by the caller: a line is checked at many
// moments against the same obstacle.
func (o *Obstacle) segmentClearance(a, b Point3, stepM float64, lo, hi Point2) (clearM float64, at Point3, strikes bool) {
	if o.mayStrike(a, b, lo, hi, 1e-9) && o.SegmentStrikes(a, b) {
		d, at := o.segmentDepth(a, b, stepM)
		return -d, at, true
	}
	// Each end's point clearance (o.Clearance(a, 0), one call less).
	clearM, _, _ = o.ballClearancePlan(a, 0)
	at = a
	if v, _, _ := o.ballClearancePlan(b, 0); v < clearM {
		clearM, at = v, b
	}
	low := min(min(a.Z, b.Z), o.TopM)
	n := len(o.Outline)
	best2 := clearM * clearM
	// The distance between the boxes holding ab and an edge bounds theirs
	// from below: an edge whose box is farther than the best so far is
	// passed over.
	x0, x1, y0, y1, z0 := lower(a.X, b.X), upper(a.X, b.X), lower(a.Y, b.Y), upper(a.Y, b.Y), lower(a.Z, b.Z)
	gap2 := func(ex0, ex1, ey0, ey1, ez1 float64) float64 {
		dx, dy, dz := beyond(ex0-x1, x0-ex1), beyond(ey0-y1, y0-ey1), beyond(z0-ez1, 0)
		return dx*dx + dy*dy + dz*dz
	}
	// The outline's box holds every edge's box, so its distance is at
	// most theirs (each rounding is monotone): when it is not below the
	// best so far, no edge is (a NaN distance passes on to the edges).
	if g := gap2(lo.X, hi.X, lo.Y, hi.Y, o.TopM); g >= best2 {
		n = 0
	}
	for i := 0; i < n; i++ {
		j := i + 1 // (i+1)%n, without the division
		if j == n {
			j = 0
		}
		c, e := o.Outline[i], o.Outline[j]
		top := Point3{c.X, c.Y, o.TopM}
		if gap2(lower(c.X, e.X), upper(c.X, e.X), lower(c.Y, e.Y), upper(c.Y, e.Y), o.TopM) < best2 {
			if d2, p := segmentDist2(a, b, top, Point3{e.X, e.Y, o.TopM}); d2 < best2 {
				best2, at = d2, p
			}
		}
		if gap2(c.X, c.X, c.Y, c.Y, o.TopM) < best2 {
			if d2, p := segmentDist2(a, b, Point3{c.X, c.Y, low}, top); d2 < best2 {
				best2, at = d2, p
			}
		}
	}
	return math.Sqrt(best2), at, false
}

// segmentDepth is the greatest depth of ab inside the obstacle (zero when
// it only touches it), at points at most stepM apart on its pieces inside
// the outline, and the point where it is.
func (o *Obstacle) segmentDepth(a, b Point3, stepM float64) (float64, Point3) {
	ts := []float64{0, 1}
	n := len(o.Outline)
	pa, pb := a.Plan(), b.Plan()
	for i := 0; i < n; i++ {
		if t, ok := crossingParam(pa, pb, o.Outline[i], o.Outline[(i+1)%n]); ok {
			ts = append(ts, t)
		}
	}
	sortFloats(ts)
	length := dist3(a, b)
	deepest, at := 0.0, a
	for i := 0; i+1 < len(ts); i++ {
		t0, t1 := ts[i], ts[i+1]
		if !Inside(lerp3(a, b, (t0+t1)/2).Plan(), o.Outline) {
			continue
		}
		k := max(int(math.Ceil((t1-t0)*length/stepM)), 1)
		for j := 0; j <= k; j++ {
			q := lerp3(a, b, t0+(t1-t0)*float64(j)/float64(k))
			if d := min(EdgeDistance(q.Plan(), o.Outline), o.TopM-q.Z); d > deepest {
				deepest, at = d, q
			}
		}
	}
	if deepest == 0 {
		// Touching only: the first point of ab on the prism.
		for _, t := range ts {
			if q := lerp3(a, b, t); Inside(q.Plan(), o.Outline) && q.Z <= o.TopM {
				return 0, q
			}
		}
	}
	return deepest, at
}

// segmentDist2 is the squared distance between the segments p0p1 and
// q0q1 in space, and the point of p0p1 nearest to q0q1 (Ericson 2005,
// sec. 5.1.9: the closest points of the two lines, each parameter
// clamped to [0, 1] and the other recomputed).
func segmentDist2(p0, p1, q0, q1 Point3) (float64, Point3) {
	d1 := Point3{p1.X - p0.X, p1.Y - p0.Y, p1.Z - p0.Z}
	d2 := Point3{q1.X - q0.X, q1.Y - q0.Y, q1.Z - q0.Z}
	r := Point3{p0.X - q0.X, p0.Y - q0.Y, p0.Z - q0.Z}
	a, e, f := dot3(d1, d1), dot3(d2, d2), dot3(d2, r)
	var s, t float64
	switch {
	case a == 0 && e == 0:
	case a == 0:
		t = clamp01(f / e)
	default:
		c := dot3(d1, r)
		if e == 0 {
			s = clamp01(-c / a)
		} else {
			b := dot3(d1, d2)
			if den := a*e - b*b; den > 0 {
				s = clamp01((b*f - c*e) / den)
			}
			t = (b*s + f) / e
			if t < 0 {
				t, s = 0, clamp01(-c/a)
			} else if t > 1 {
				t, s = 1, clamp01((b-c)/a)
			}
		}
	}
	p := lerp3(p0, p1, s)
	q := lerp3(q0, q1, t)
	return sq(p.X-q.X) + sq(p.Y-q.Y) + sq(p.Z-q.Z), p
}

func dot3(a, b Point3) float64 { return a.X*b.X + a.Y*b.Y + a.Z*b.Z }

// clamp01 is min(max(v, 0), 1) by comparisons (see minmax.go), NaN and
// the sign of zero as those give.
func clamp01(v float64) float64 {
	if v > 0 {
		if v < 1 {
			return v
		}
		return 1
	}
	if v != v {
		return v
	}
	return 0
}
