// Package clearance measures how close a hook load comes to what stands on
// site, and how far a spread of runs sweeps.
//
// An obstacle is seen from above as a simple polygon (a column, a stack of
// panels, a parapet, a site hoarding) standing on the floor up to a top
// height: an upright prism. The load is a ball of a stated radius (a point
// load of a stated size) or a set of such balls (the corners of a rigid
// load). Heights are measured up from the floor, in metres; x and y are the
// scenario's horizontal axes.
//
// The clearance of a ball of radius r centred at q is the signed distance
// from q to the prism, less r:
//
//	outside:  sqrt(dxy^2 + dz^2) - r,  dxy = plan distance from q to the
//	          polygon (0 inside it), dz = max(0, q.z - top)
//	inside:   -min(distance to the polygon's edges, top - q.z) - r
//
// a negative clearance is an overlap (the load strikes the obstacle). The
// prism is taken to run down through the floor, so a ball below the top and
// inside the outline is inside it at any depth. The signed distance to a
// set is 1-Lipschitz, which bounds the clearance between two samples of a
// path (see PathClearance).
package clearance

import (
	"errors"
	"fmt"
	"math"
)

// Point2 is a point in the horizontal plane, m.
type Point2 struct{ X, Y float64 }

// Point3 is a point in space: X, Y horizontal, Z up from the floor, m.
type Point3 struct{ X, Y, Z float64 }

// Plan drops the height.
func (p Point3) Plan() Point2 { return Point2{p.X, p.Y} }

// Obstacle is an upright prism: Outline seen from above, from the floor up
// to TopM.
type Obstacle struct {
	Name    string
	Outline []Point2
	TopM    float64
}

// Rectangle is the outline of a rectangle centred at (cx, cy), lengthM
// along a direction angleDeg anticlockwise from x, widthM across it.
func Rectangle(cx, cy, lengthM, widthM, angleDeg float64) []Point2 {
	s, c := math.Sincos(angleDeg * math.Pi / 180)
	hl, hw := lengthM/2, widthM/2
	corner := func(u, v float64) Point2 { return Point2{cx + u*c - v*s, cy + u*s + v*c} }
	return []Point2{corner(-hl, -hw), corner(hl, -hw), corner(hl, hw), corner(-hl, hw)}
}

// Validate reports an outline that is not a simple polygon of positive
// area with finite corners, or a top that is not positive and finite.
func (o *Obstacle) Validate() error {
	n := len(o.Outline)
	if n < 3 {
		return fmt.Errorf("the outline needs at least 3 corners, has %d", n)
	}
	for i, p := range o.Outline {
		if !finite(p.X) || !finite(p.Y) {
			return fmt.Errorf("corner %d is not a finite point", i+1)
		}
	}
	if !(o.TopM > 0) || !finite(o.TopM) {
		return errors.New("the top height must be a positive number of metres")
	}
	if math.Abs(area(o.Outline)) < 1e-6 {
		return errors.New("the outline encloses no area")
	}
	for i := 0; i < n; i++ {
		a, b := o.Outline[i], o.Outline[(i+1)%n]
		if a == b {
			return fmt.Errorf("corners %d and %d are the same point", i+1, (i+1)%n+1)
		}
		for j := i + 2; j < n; j++ {
			if i == 0 && j == n-1 {
				continue // adjacent through the closing edge
			}
			if segmentsCross(a, b, o.Outline[j], o.Outline[(j+1)%n]) {
				return fmt.Errorf("edges %d and %d cross: the outline must not cross itself", i+1, j+1)
			}
		}
	}
	return nil
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// area is the polygon's signed area (shoelace formula).
func area(poly []Point2) float64 {
	s := 0.0
	for i, p := range poly {
		q := poly[(i+1)%len(poly)]
		s += p.X*q.Y - q.X*p.Y
	}
	return s / 2
}

// Inside reports whether p lies inside the polygon or on its boundary
// (see insideEdge).
func Inside(p Point2, poly []Point2) bool {
	in, _ := insideEdge(p, poly)
	return in
}

// pointSegmentDistance is the distance from p to the segment ab.
func pointSegmentDistance(p, a, b Point2) float64 { return math.Sqrt(pointSegmentDist2(p, a, b)) }

// pointSegmentDist2 is the squared distance from p to the segment ab.
func pointSegmentDist2(p, a, b Point2) float64 {
	return segDist2(p.X-a.X, p.Y-a.Y, b.X-a.X, b.Y-a.Y)
}

// segDist2 is the squared distance from a point to a segment, the point
// (px, py) and the segment's far end (dx, dy) taken from its near end:
// with t = (p.d)/|d|^2 held to [0, 1], |p - t d|^2 (Ericson 2005,
// sec. 5.1.2); p itself when |d|^2 is zero, where t would be 0. Small
// enough for Go to inline in the nearest-segment searches, where a call
// per segment cost more than the arithmetic (in wasm most); comparisons,
// not the builtin min and max, which are runtime calls in wasm.
// TestSegDist2IsThePlainForm holds it to the form with t held first.
func segDist2(px, py, dx, dy float64) float64 {
	if l2 := dx*dx + dy*dy; !(l2 <= 0) {
		t := (px*dx + py*dy) / l2
		if t < 0 {
			t = 0
		} else if t > 1 {
			t = 1
		}
		px, py = px-t*dx, py-t*dy
	}
	return px*px + py*py
}

// EdgeDistance is the distance from p to the polygon's boundary (see
// insideEdge).
func EdgeDistance(p Point2, poly []Point2) float64 {
	_, d := insideEdge(p, poly)
	return d
}

// PlanDistance is the distance from p to the polygon seen from above: zero
// inside or on it.
func PlanDistance(p Point2, poly []Point2) float64 {
	if in, d := insideEdge(p, poly); !in {
		return d
	}
	return 0
}

// insideEdge is whether p lies inside the polygon or on its boundary
// (crossing-number test; Haines, "Point in polygon strategies", Graphics
// Gems IV, 1994), and the distance from p to the boundary, in one pass
// over the edges: each edge's distance is found once, and a distance of
// zero is a point on the boundary. A clearance needs both (in wasm the
// two passes were a sixth of a run's obstacle check). The square root of
// the least squared distance is the least distance (the root is monotone
// and correctly rounded); a NaN distance is kept, as math.Min keeps it
// (TestInsideEdgeMatches: the same as an edge by edge pass of each).
// Each edge's squared distance is pointSegmentDist2's, through the
// segDist2 that Go inlines: in wasm the call to pointSegmentDist2,
// which Go does not inline, was half of insideEdge's time (node
// --cpu-prof of clearance_part), and a point's clearance from an
// obstacle is one insideEdge.
func insideEdge(p Point2, poly []Point2) (in bool, edgeM float64) {
	on := false
	d2 := math.Inf(1)
	n := len(poly)
	if n == 0 {
		return false, d2
	}
	a := poly[n-1]
	for _, b := range poly {
		e := segDist2(p.X-a.X, p.Y-a.Y, b.X-a.X, b.Y-a.Y) // pointSegmentDist2(p, a, b)
		if e < d2 || e != e {
			d2 = e
		}
		on = on || e == 0
		if (a.Y > p.Y) != (b.Y > p.Y) && p.X < a.X+(p.Y-a.Y)*(b.X-a.X)/(b.Y-a.Y) {
			in = !in
		}
		a = b
	}
	return in || on, math.Sqrt(d2)
}

// cross is the z component of (b-a) x (c-a).
func cross(a, b, c Point2) float64 { return (b.X-a.X)*(c.Y-a.Y) - (b.Y-a.Y)*(c.X-a.X) }

// segmentsCross reports whether segments ab and cd share a point.
func segmentsCross(a, b, c, d Point2) bool {
	d1, d2 := cross(c, d, a), cross(c, d, b)
	d3, d4 := cross(a, b, c), cross(a, b, d)
	if ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0)) {
		return true
	}
	return pointSegmentDistance(a, c, d) == 0 || pointSegmentDistance(b, c, d) == 0 ||
		pointSegmentDistance(c, a, b) == 0 || pointSegmentDistance(d, a, b) == 0
}

// Clearance is the signed clearance of a ball of radius radiusM centred
// at q from the obstacle (see the package comment): negative when they
// overlap.
func (o *Obstacle) Clearance(q Point3, radiusM float64) float64 {
	v, _, _ := o.ballClearance(q, radiusM)
	return v
}

// ballClearance is Clearance, and whether the ball is over (or in) the
// outline seen from above (its centre within its radius of it), with the
// height of its lowest point above the top (gapM, negative below it).
func (o *Obstacle) ballClearance(q Point3, radiusM float64) (clearM float64, over bool, gapM float64) {
	clearM, gapM, dxy := o.ballClearancePlan(q, radiusM)
	return clearM, dxy <= radiusM, gapM
}

// ballClearancePlan is ballClearance with the plan distance dxy from the
// centre to the outline (zero inside it); the ball is over it when dxy is
// at most its radius.
func (o *Obstacle) ballClearancePlan(q Point3, radiusM float64) (clearM, gapM, dxy float64) {
	in, edge := insideEdge(q.Plan(), o.Outline)
	gapM = q.Z - radiusM - o.TopM
	if in && q.Z <= o.TopM {
		return -math.Min(edge, o.TopM-q.Z) - radiusM, gapM, 0
	}
	if !in {
		dxy = edge
	}
	if q.Z <= o.TopM {
		// Level with the top or below it: hypot(dxy, 0) is dxy, exactly.
		return dxy - radiusM, gapM, dxy
	}
	return math.Hypot(dxy, q.Z-o.TopM) - radiusM, gapM, dxy
}

// SegmentStrikes reports whether the straight segment from a to b passes
// through the obstacle (below its top inside its outline). It is exact for
// the segment: the plan segment is cut where it crosses the outline, and
// on each piece inside it the height, linear along the segment, is lowest
// at an end of the piece.
func (o *Obstacle) SegmentStrikes(a, b Point3) bool {
	pa, pb := a.Plan(), b.Plan()
	ts := []float64{0, 1}
	n := len(o.Outline)
	for i := 0; i < n; i++ {
		c, e := o.Outline[i], o.Outline[(i+1)%n]
		if t, ok := crossingParam(pa, pb, c, e); ok {
			ts = append(ts, t)
		}
	}
	sortFloats(ts)
	at := func(t float64) Point3 {
		return Point3{a.X + t*(b.X-a.X), a.Y + t*(b.Y-a.Y), a.Z + t*(b.Z-a.Z)}
	}
	for i := 0; i+1 < len(ts); i++ {
		t0, t1 := ts[i], ts[i+1]
		mid := at((t0 + t1) / 2)
		if !Inside(mid.Plan(), o.Outline) {
			continue
		}
		if math.Min(at(t0).Z, at(t1).Z) <= o.TopM {
			return true
		}
	}
	// A segment that only touches the outline at one point.
	for _, t := range ts {
		if q := at(t); Inside(q.Plan(), o.Outline) && q.Z <= o.TopM {
			return true
		}
	}
	return false
}

// crossingParam is the parameter t in [0, 1] along ab where it crosses the
// segment ce, when they cross at one point.
func crossingParam(a, b, c, e Point2) (float64, bool) {
	rx, ry := b.X-a.X, b.Y-a.Y
	sx, sy := e.X-c.X, e.Y-c.Y
	den := rx*sy - ry*sx
	if den == 0 {
		return 0, false
	}
	t := ((c.X-a.X)*sy - (c.Y-a.Y)*sx) / den
	u := ((c.X-a.X)*ry - (c.Y-a.Y)*rx) / den
	if t < 0 || t > 1 || u < 0 || u > 1 {
		return 0, false
	}
	return t, true
}

// sortFloats is an insertion sort: the lists are a handful long.
func sortFloats(v []float64) {
	for i := 1; i < len(v); i++ {
		for j := i; j > 0 && v[j] < v[j-1]; j-- {
			v[j], v[j-1] = v[j-1], v[j]
		}
	}
}
