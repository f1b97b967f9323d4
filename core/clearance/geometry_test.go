package clearance

import (
	"math"
	"math/rand/v2"
	"testing"
)

// Every expected value below is worked by hand from the figure in the
// comment beside it (plane geometry: Pythagoras, distances to lines).

func TestPlanDistanceHandCases(t *testing.T) {
	// A 4 m x 2 m column footing centred at (10, 0), sides along the axes:
	// x from 8 to 12, y from -1 to 1.
	sq := Rectangle(10, 0, 4, 2, 0)
	cases := []struct {
		name string
		p    Point2
		want float64
	}{
		{"inside", Point2{10, 0}, 0},
		{"on an edge", Point2{12, 0.5}, 0},
		{"level with a side, 3 m off", Point2{15, 0}, 3},
		{"above the top side, 2 m off", Point2{9, 3}, 2},
		{"off a corner by (3, 4): 5 m", Point2{15, 5}, 5},
	}
	for _, c := range cases {
		if got := PlanDistance(c.p, sq); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("%s: distance %g, want %g", c.name, got, c.want)
		}
	}
	// Turned by 45 deg, a 2 m x 2 m square at the origin has its corner at
	// sqrt(2) on the x axis: a point at x = 3 is 3 - sqrt(2) from it.
	d := Rectangle(0, 0, 2, 2, 45)
	if got, want := PlanDistance(Point2{3, 0}, d), 3-math.Sqrt2; math.Abs(got-want) > 1e-12 {
		t.Errorf("turned square: %g, want %g", got, want)
	}
}

func TestConcaveOutline(t *testing.T) {
	// An L-shaped stack: the 4 x 4 square at the origin less its top-right
	// 2 x 2 quarter. The notch's inner corner is (2, 2); the point (3, 3)
	// lies in the notch, sqrt(2) from that corner, and outside the stack.
	l := []Point2{{0, 0}, {4, 0}, {4, 2}, {2, 2}, {2, 4}, {0, 4}}
	if Inside(Point2{3, 3}, l) {
		t.Fatal("the notch is outside the outline")
	}
	if got := PlanDistance(Point2{3, 3}, l); math.Abs(got-1) > 1e-12 {
		// (3, 3) is 1 m above the edge y = 2 for x in [2, 4]: 1 m, closer
		// than the corner.
		t.Errorf("notch distance %g, want 1", got)
	}
	if !Inside(Point2{1, 3}, l) {
		t.Error("(1, 3) is in the stack's upright arm")
	}
}

func TestClearanceOfABall(t *testing.T) {
	// A hoarding 2.4 m high along y = 0..0.1, x from 0 to 20.
	o := Obstacle{Name: "hoarding", Outline: Rectangle(10, 0.05, 20, 0.1, 0), TopM: 2.4}
	// A load of radius 0.5 m centred 3 m above the top, over the hoarding:
	// 3 - 0.5 = 2.5 m.
	if got := o.Clearance(Point3{5, 0.05, 5.4}, 0.5); math.Abs(got-2.5) > 1e-12 {
		t.Errorf("above: %g, want 2.5", got)
	}
	// 3 m beside it (from y = 0.1 to 3.1) and 4 m above its top: 5 - 0.5.
	if got := o.Clearance(Point3{5, 3.1, 6.4}, 0.5); math.Abs(got-4.5) > 1e-12 {
		t.Errorf("beside and above: %g, want 4.5", got)
	}
	// Below the top, 1 m to its side: 1 - 0.5.
	if got := o.Clearance(Point3{5, -1, 1}, 0.5); math.Abs(got-0.5) > 1e-12 {
		t.Errorf("beside: %g, want 0.5", got)
	}
	// Inside it, 0.05 m from its long faces, 0.4 m below its top: it
	// overlaps by 0.05 + 0.5.
	if got := o.Clearance(Point3{5, 0.05, 2.0}, 0.5); math.Abs(got+0.55) > 1e-12 {
		t.Errorf("inside: %g, want -0.55", got)
	}
}

func TestSweptPathAgainstRectangle(t *testing.T) {
	// A column 0.4 m square at (10, 0), 6 m high.
	col := Obstacle{Name: "column", Outline: Rectangle(10, 0, 0.4, 0.4, 0), TopM: 6}
	// Two samples either side of the column, 3 m above the floor: the
	// straight piece between them passes through it though both samples
	// are clear of it by 4.8 m.
	path := []Sample{{0, Point3{5, 0, 3}}, {1, Point3{15, 0, 3}}}
	if !col.SegmentStrikes(path[0].At, path[1].At) {
		t.Fatal("the piece through the column must strike it")
	}
	c := col.AlongPath(path, 0.1, 0.05)
	if !c.Strikes || c.FirstStrikeS != 0 || c.ClearanceM > -0.1 {
		t.Errorf("through the column: %+v", c)
	}
	// The same piece 1 m above the top: no strike, clearance 1 m less the
	// radius, over the column's top.
	high := []Sample{{0, Point3{5, 0, 7}}, {1, Point3{15, 0, 7}}}
	c = col.AlongPath(high, 0.1, 0.05)
	if c.Strikes || math.Abs(c.ClearanceM-0.9) > 1e-12 {
		t.Errorf("over the column: %+v", c)
	}
	// Passing 1 m to the side (y = 1.2, the column's face at y = 0.2), and
	// descending through the column's height: clearance 1 m less radius.
	side := []Sample{{0, Point3{5, 1.2, 8}}, {2, Point3{15, 1.2, 1}}}
	c = col.AlongPath(side, 0.1, 0.05)
	if c.Strikes || math.Abs(c.ClearanceM-0.9) > 1e-12 {
		t.Errorf("beside the column: %+v", c)
	}
	// A descent that enters the column from above, 1 m before its far
	// side: the piece from (5, 0, 8) to (15, 0, 2) is at height
	// 8 - 0.6*(x-5) and drops below 6 m at x = 8.33, before reaching the
	// column (x from 9.8 to 10.2) at heights 5.08 to 4.84: a strike.
	dive := []Sample{{0, Point3{5, 0, 8}}, {1, Point3{15, 0, 2}}}
	if !col.SegmentStrikes(dive[0].At, dive[1].At) {
		t.Error("the dive passes through the column below its top")
	}
	// The error bound is half the sub-piece: 10 m in pieces of at most
	// 0.05 m is 200 pieces of 0.05 m.
	if c := col.AlongPath(high, 0.1, 0.05); math.Abs(c.ErrorBoundM-0.025) > 1e-12 {
		t.Errorf("error bound %g, want 0.025", c.ErrorBoundM)
	}
}

func TestValidateOutline(t *testing.T) {
	bad := []Obstacle{
		{Outline: []Point2{{0, 0}, {1, 0}}, TopM: 1},
		{Outline: []Point2{{0, 0}, {1, 0}, {2, 0}}, TopM: 1},                 // no area
		{Outline: []Point2{{0, 0}, {2, 2}, {2, 0}, {0, 2}}, TopM: 1},         // bow tie
		{Outline: Rectangle(0, 0, 1, 1, 0), TopM: 0},                         // no height
		{Outline: []Point2{{0, 0}, {math.NaN(), 0}, {1, 1}}, TopM: 1},        // not finite
		{Outline: []Point2{{0, 0}, {1, 0}, {1, 0}, {1, 1}, {0, 1}}, TopM: 1}, // repeated corner
	}
	for i, o := range bad {
		if err := o.Validate(); err == nil {
			t.Errorf("case %d: accepted %+v", i, o)
		}
	}
	good := Obstacle{Outline: []Point2{{0, 0}, {4, 0}, {4, 2}, {2, 2}, {2, 4}, {0, 4}}, TopM: 3}
	if err := good.Validate(); err != nil {
		t.Errorf("L-shape: %v", err)
	}
}

func TestInsideEdgeMatches(t *testing.T) {
	// The one-pass form gives what Inside and EdgeDistance give, exactly:
	// points about a concave outline, on its corners and edges, and not
	// finite.
	poly := []Point2{{0, 0}, {4, 0}, {4, 2}, {2, 2}, {2, 4}, {0, 4}}
	var pts []Point2
	for x := -1.0; x <= 5; x += 0.25 {
		for y := -1.0; y <= 5; y += 0.125 {
			pts = append(pts, Point2{x, y})
		}
	}
	pts = append(pts, poly...)
	pts = append(pts, Point2{1, 0}, Point2{4, 1.3}, Point2{math.NaN(), 1}, Point2{math.Inf(1), 2}, Point2{1, math.Inf(-1)})
	for _, p := range pts {
		in, d := insideEdge(p, poly)
		wi, wd := insideEvery(p, poly), edgeEvery(p, poly)
		if in != wi || !(d == wd || (math.IsNaN(d) && math.IsNaN(wd))) {
			t.Fatalf("%v: one pass (%v, %g), two passes (%v, %g)", p, in, d, wi, wd)
		}
	}
	// Turned rectangles, points about them.
	rng := rand.New(rand.NewPCG(2, 11))
	for range 2000 {
		poly := Rectangle(rng.Float64()*4-2, rng.Float64()*4-2, rng.Float64()*3, rng.Float64()*3, rng.Float64()*360)
		p := Point2{rng.Float64()*8 - 4, rng.Float64()*8 - 4}
		in, d := insideEdge(p, poly)
		if wi, wd := insideEvery(p, poly), edgeEvery(p, poly); in != wi || d != wd {
			t.Fatalf("%v in %v: one pass (%v, %g), two passes (%v, %g)", p, poly, in, d, wi, wd)
		}
	}
}

// insideEvery is the crossing-number test with its own test for a point
// on an edge, the plain form kept to check insideEdge against.
func insideEvery(p Point2, poly []Point2) bool {
	in := false
	n := len(poly)
	for i, j := 0, n-1; i < n; j, i = i, i+1 {
		a, b := poly[j], poly[i]
		if pointSegmentDistance(p, a, b) == 0 {
			return true
		}
		if (a.Y > p.Y) != (b.Y > p.Y) && p.X < a.X+(p.Y-a.Y)*(b.X-a.X)/(b.Y-a.Y) {
			in = !in
		}
	}
	return in
}

// edgeEvery is the least of the edges' distances, the plain form kept to
// check insideEdge against.
func edgeEvery(p Point2, poly []Point2) float64 {
	d := math.Inf(1)
	for i := range poly {
		d = math.Min(d, pointSegmentDistance(p, poly[i], poly[(i+1)%len(poly)]))
	}
	return d
}
