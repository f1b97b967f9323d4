package clearance

import (
	"math"
	"sort"
)

// A rigid load (load.body) is taken as its box, corners from the
// simulated attitude. Against an upright prism (outline P, top h) the box
// is taken as the upright prism that holds it: its outline seen from
// above (the convex hull Q of its eight corners) from its lowest corner's
// height zlow up. The clearance is then
//
//	apart in plan or above:  sqrt(d(Q, P)^2 + max(0, zlow - h)^2)
//	overlapping:             -min(depth, h - zlow)
//
// with d(Q, P) the plan distance between the two outlines (two polygons
// that do not meet are closest between a corner of one and an edge of
// the other) and depth the deepest corner of either outline inside the
// other. It is exact for a load hanging level and errs on the safe side
// for a tilted one (the prism holds the box: a tilt of t over a length l
// lowers zlow by up to l*sin(t) where the load is higher).

// BoxSample is one moment of a rigid load: its eight corners, z up from
// the floor, and its centre of mass.
type BoxSample struct {
	_       [0]func() // never compared: no equality code in the wasm
	TimeS   float64
	Corners [8]Point3
	Centre  Point3
}

// Hull is the convex hull of points seen from above, anticlockwise
// (Andrew's monotone chain; A. M. Andrew, "Another efficient algorithm for
// convex hulls in two dimensions", Inf. Proc. Lett. 9, 1979).
func Hull(pts []Point2) []Point2 {
	p := append([]Point2(nil), pts...)
	sort.Slice(p, func(i, j int) bool { return p[i].X < p[j].X || (p[i].X == p[j].X && p[i].Y < p[j].Y) })
	if len(p) < 3 {
		return p
	}
	h := make([]Point2, 0, 2*len(p))
	for pass := 0; pass < 2; pass++ {
		start := len(h)
		for _, q := range p {
			for len(h) >= start+2 && cross(h[len(h)-2], h[len(h)-1], q) <= 0 {
				h = h[:len(h)-1]
			}
			h = append(h, q)
		}
		h = h[:len(h)-1]
		for i, j := 0, len(p)-1; i < j; i, j = i+1, j-1 {
			p[i], p[j] = p[j], p[i]
		}
	}
	return h
}

// PolygonDistance is the plan distance between two polygons: zero when
// they meet or one holds the other.
func PolygonDistance(q, p []Point2) float64 {
	if len(q) == 0 || len(p) == 0 {
		return math.Inf(1)
	}
	if Inside(q[0], p) || Inside(p[0], q) {
		return 0
	}
	d := math.Inf(1)
	for i := range q {
		a, b := q[i], q[(i+1)%len(q)]
		for k := range p {
			c, e := p[k], p[(k+1)%len(p)]
			if segmentsCross(a, b, c, e) {
				return 0
			}
		}
		d = math.Min(d, EdgeDistance(a, p))
	}
	for _, c := range p {
		d = math.Min(d, EdgeDistance(c, q))
	}
	return d
}

// overlapDepth is the deepest corner of either polygon inside the other.
func overlapDepth(q, p []Point2) float64 {
	d := 0.0
	for _, v := range q {
		if Inside(v, p) {
			d = math.Max(d, EdgeDistance(v, p))
		}
	}
	for _, v := range p {
		if Inside(v, q) {
			d = math.Max(d, EdgeDistance(v, q))
		}
	}
	return d
}

// footprint is the box's outline seen from above and its lowest height.
func footprint(c *[8]Point3) (hull []Point2, lowM float64) {
	var pts [8]Point2
	lowM = math.Inf(1)
	for i, p := range c {
		pts[i] = p.Plan()
		lowM = math.Min(lowM, p.Z)
	}
	return Hull(pts[:]), lowM
}

// BoxClearance is the signed clearance of the box with these corners from
// the obstacle (see above), and whether the box is over (or in) the
// obstacle's outline seen from above, with the height of its lowest
// corner above the top (gapM, negative below it).
func (o *Obstacle) BoxClearance(c *[8]Point3) (clearM float64, over bool, gapM float64) {
	clearM, gapM, dxy := o.boxClearance(c)
	return clearM, dxy == 0, gapM
}

// boxClearance is BoxClearance with the plan distance dxy between the
// outlines (zero: over or in it).
func (o *Obstacle) boxClearance(c *[8]Point3) (clearM, gapM, dxy float64) {
	q, low := footprint(c)
	dxy = PolygonDistance(q, o.Outline)
	gapM = low - o.TopM
	if dxy > 0 || gapM > 0 {
		return math.Hypot(dxy, math.Max(0, gapM)), gapM, dxy
	}
	return -math.Min(overlapDepth(q, o.Outline), -gapM), gapM, dxy
}

// AlongBoxPath checks a rigid load's path against the obstacle: the
// corners are taken as moving straight between samples and checked at
// moments where no corner has moved more than stepM since the last
// (stepM positive). The clearance is then within ErrorBoundM (half that
// movement) of the smallest between the moments checked, and a strike is
// an overlap at a moment checked, so a wall thinner than stepM can be
// missed between them.
func (o *Obstacle) AlongBoxPath(path []BoxSample, stepM float64) Closest {
	if !(stepM > 0) {
		panic("clearance: AlongBoxPath needs a positive step")
	}
	c := Closest{ClearanceM: math.Inf(1), FirstStrikeS: math.NaN(), GapM: math.Inf(1)}
	// offer checks one moment; it returns the clearance and the plan
	// distance between the outlines there.
	offer := func(t float64, corners *[8]Point3, centre Point3) (float64, float64) {
		v, gap, dxy := o.boxClearance(corners)
		over := dxy == 0
		if v < c.ClearanceM {
			c.ClearanceM, c.TimeS, c.At = v, t, centre
		}
		if over && gap < c.GapM {
			c.GapM, c.GapAtS, c.GapAt = gap, t, centre
		}
		if v < 0 && !c.Strikes {
			c.Strikes, c.FirstStrikeS, c.FirstStrikeAt = true, t, centre
		}
		return v, dxy
	}
	if len(path) == 0 {
		return c
	}
	for i := 0; i+1 < len(path); i++ {
		a, b := &path[i], &path[i+1]
		va, da := offer(a.TimeS, &a.Corners, a.Centre)
		move := 0.0
		for k := range a.Corners {
			move = math.Max(move, dist3(a.Corners[k], b.Corners[k]))
		}
		n := max(int(math.Ceil(move/stepM)), 1)
		c.ErrorBoundM = math.Max(c.ErrorBoundM, move/float64(n)/2)
		// The clearance and the plan distance change by no more than the
		// corners move: a piece that stays clear of this obstacle by more
		// than the smallest clearance so far, strikes nothing and passes
		// over nothing needs no points between its ends.
		if low := va - move; low > 0 && low > c.ClearanceM && da-move > 0 {
			continue
		}
		for s := 1; s < n; s++ {
			f := float64(s) / float64(n)
			var cs [8]Point3
			for k := range cs {
				cs[k] = lerp3(a.Corners[k], b.Corners[k], f)
			}
			offer(a.TimeS+f*(b.TimeS-a.TimeS), &cs, lerp3(a.Centre, b.Centre, f))
		}
	}
	end := &path[len(path)-1]
	offer(end.TimeS, &end.Corners, end.Centre)
	return c
}

func dist3(a, b Point3) float64 { return math.Sqrt(sq(b.X-a.X) + sq(b.Y-a.Y) + sq(b.Z-a.Z)) }

func sq(v float64) float64 { return v * v }

func lerp3(a, b Point3, f float64) Point3 {
	return Point3{a.X + f*(b.X-a.X), a.Y + f*(b.Y-a.Y), a.Z + f*(b.Z-a.Z)}
}
