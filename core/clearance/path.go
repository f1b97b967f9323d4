package clearance

import "math"

// Sample is one moment of a load's path.
type Sample struct {
	TimeS float64
	At    Point3
}

// Closest is where a path comes closest to an obstacle.
type Closest struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	// ClearanceM is the smallest signed clearance over the points checked
	// (negative: the load overlaps the obstacle there).
	ClearanceM float64
	TimeS      float64
	At         Point3
	// ErrorBoundM bounds what the points checked can miss: along the
	// straight pieces between the path's samples the smallest clearance
	// lies between ClearanceM - ErrorBoundM and ClearanceM. The clearance
	// is a distance less a constant, so it changes by at most the distance
	// moved: a point of a piece is within half a sub-piece of a point
	// checked.
	ErrorBoundM float64
	// Strikes is true when a straight piece between samples passes through
	// the obstacle's outline below its top, the load's radius aside (exact
	// for the piece, so a thin wall between two samples is not missed).
	Strikes bool
	// FirstStrikeS is the moment of the first strike: the first point
	// checked where the load overlaps the obstacle, or, when only a
	// straight piece's centre line passes through it between points
	// checked, the start of that piece.
	FirstStrikeS  float64
	FirstStrikeAt Point3
	// FirstStrikeLine names the line of the hoisting gear that made the
	// first strike (AlongLines, as Line); empty for the load.
	FirstStrikeLine string
	// GapM is the smallest height of the load's lowest point above the
	// obstacle's top at the points checked where the load is over its
	// outline seen from above (+Inf when it never is), at GapAtS, GapAt.
	GapM   float64
	GapAtS float64
	GapAt  Point3
	// Line names the line of the hoisting gear nearest (AlongLines: "hoist
	// rope", "sling leg 2", "spreader leg 1"); empty for the load.
	Line string
	// Rope is the hoisting gear's Closest to the same obstacle over the
	// same run (AlongLines; its At is the nearest point of the line, its
	// GapM unused); nil when the run has no lines checked.
	Rope *Closest
}

// AlongPath checks a path, taken as straight between its samples, against
// the obstacle: the points checked are the samples and points between
// them at most stepM apart. stepM must be positive (a programmer's error
// otherwise: it panics). It gives what alongPathEvery gives, looking only
// at the points that can matter (see alongPathNear).
func (o *Obstacle) AlongPath(path []Sample, radiusM, stepM float64) Closest {
	if !(stepM > 0) {
		panic("clearance: AlongPath needs a positive step")
	}
	return o.alongPathNear(path, radiusM, stepM)
}

// alongPathEvery is AlongPath looking at every point checked: the plain
// form, kept to check alongPathNear against.
func (o *Obstacle) alongPathEvery(path []Sample, radiusM, stepM float64) Closest {
	if !(stepM > 0) {
		panic("clearance: AlongPath needs a positive step")
	}
	w := newBallWatch(o, radiusM)
	c := &w.c
	if len(path) == 0 {
		return *c
	}
	offer := w.offer
	offer(path[0].TimeS, path[0].At)
	for i := 0; i+1 < len(path); i++ {
		a, b := path[i], path[i+1]
		dx, dy, dz := b.At.X-a.At.X, b.At.Y-a.At.Y, b.At.Z-a.At.Z
		length := math.Sqrt(dx*dx + dy*dy + dz*dz)
		n := int(math.Ceil(length / stepM))
		if n < 1 {
			n = 1
		}
		for k := 1; k <= n; k++ {
			f := float64(k) / float64(n)
			offer(a.TimeS+f*(b.TimeS-a.TimeS), Point3{a.At.X + f*dx, a.At.Y + f*dy, a.At.Z + f*dz})
		}
		if half := length / float64(n) / 2; half > c.ErrorBoundM {
			c.ErrorBoundM = half
		}
		if !c.Strikes && o.SegmentStrikes(a.At, b.At) {
			c.Strikes, c.FirstStrikeS, c.FirstStrikeAt = true, a.TimeS, a.At
		}
	}
	return w.result()
}

// ballWatch gathers what a ball's points checked along a path show (see
// AlongPath): the smallest clearance, the smallest gap over the outline
// and the first overlap, each the first point with it.
type ballWatch struct {
	o            *Obstacle
	radiusM      float64
	c            Closest
	firstOverlap float64
	overlapAt    Point3
}

func newBallWatch(o *Obstacle, radiusM float64) *ballWatch {
	return &ballWatch{o: o, radiusM: radiusM, firstOverlap: math.NaN(),
		c: Closest{ClearanceM: math.Inf(1), FirstStrikeS: math.NaN(), GapM: math.Inf(1)}}
}

// offer checks the point q at the moment t.
func (w *ballWatch) offer(t float64, q Point3) {
	v, over, gap := w.o.ballClearance(q, w.radiusM)
	if v < w.c.ClearanceM {
		w.c.ClearanceM, w.c.TimeS, w.c.At = v, t, q
	}
	if over && gap < w.c.GapM {
		w.c.GapM, w.c.GapAtS, w.c.GapAt = gap, t, q
	}
	if v < 0 && math.IsNaN(w.firstOverlap) {
		w.firstOverlap, w.overlapAt = t, q
	}
}

// result is the Closest of the points offered, the strikes of the pieces
// between samples (set in c) joined with the first overlap: an overlap at
// a point checked is a strike (the load's radius reaches the obstacle
// even where its centre line does not).
func (w *ballWatch) result() Closest {
	c := w.c
	if !math.IsNaN(w.firstOverlap) {
		if !c.Strikes || w.firstOverlap < c.FirstStrikeS {
			c.FirstStrikeS, c.FirstStrikeAt = w.firstOverlap, w.overlapAt
		}
		c.Strikes = true
	}
	return c
}
