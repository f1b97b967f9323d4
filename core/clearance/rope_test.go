package clearance

import (
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// TestSegmentClearanceHandCases checks the rope's clearance from a prism
// against cases worked by hand (each hand computation beside its check).
func TestSegmentClearanceHandCases(t *testing.T) {
	square := &Obstacle{Name: "stack", Outline: Rectangle(1, 1, 2, 2, 0), TopM: 3} // x, y in [0, 2], top 3 m
	wall := &Obstacle{Name: "hoarding", Outline: []Point2{{0, 0}, {0.2, 0}, {0.2, 10}, {0, 10}}, TopM: 2.4}
	ell := &Obstacle{Name: "L", Outline: []Point2{{0, 0}, {3, 0}, {3, 3}, {2, 3}, {2, 1}, {0, 1}}, TopM: 4}
	diamond := &Obstacle{Name: "turned box", Outline: Rectangle(0, 0, 2, 2, 45), TopM: 3}
	cases := []struct {
		name    string
		o       *Obstacle
		a, b    Point3
		want    float64
		strikes bool
		at      Point3
	}{
		// Hand computation: a plumb rope over the middle of the stack ends
		// 5 m up; the top is at 3 m, so 5 - 3 = 2 m, at the hook.
		{"plumb over the top", square, Point3{1, 1, 10}, Point3{1, 1, 5}, 2, false, Point3{1, 1, 5}},
		// Hand computation: a plumb rope at (3, 3) hanging down to 1 m,
		// beside the corner (2, 2) below its top: the corner's upright
		// line is sqrt(1^2 + 1^2) = 1.41421 m away, at any height up to 3 m.
		{"beside the corner", square, Point3{3, 3, 10}, Point3{3, 3, 1}, math.Sqrt2, false, Point3{3, 3, 0}},
		// Hand computation: a slanted rope over the hoarding, in the plane
		// y = 5 from (-2, 6) to (2, 2) in (x, z): the line x + z = 4. The
		// wall's far top edge (x, z) = (0.2, 2.4) has x + z = 2.6, so it
		// is |2.6 - 4|/sqrt(2) = 0.98995 m from the line, nearest at
		// (0.2, 2.4) + (0.7, 0.7) = (0.9, 3.1), inside the rope's span
		// (the near edge (0, 2.4): 1.6/sqrt(2) = 1.131 m, farther).
		{"slanted over the hoarding", wall, Point3{-2, 5, 6}, Point3{2, 5, 2}, 1.4 / math.Sqrt2, false, Point3{0.9, 5, 3.1}},
		// Hand computation: the rope from (1.2, 1.2, 10) down to
		// (1.5, 1.5, 4), wholly over the stack's top (3 m): its lowest end
		// is the nearest, 4 - 3 = 1 m.
		{"over the top, slanted", square, Point3{1.2, 1.2, 10}, Point3{1.5, 1.5, 4}, 1, false, Point3{1.5, 1.5, 4}},
		// Hand computation: the rope from (-2, 5, 3) to (2, 5, 1) crosses
		// the hoarding (x in [0, 0.2]) at heights 2.0 to 1.9 m, below its
		// 2.4 m top: it passes through. Inside, a point's depth is
		// min(distance to the nearer face, 2.4 - z): at most 0.1 m, the
		// wall's half thickness, at x = 0.1 (z = 1.95, 0.45 m under the
		// top). Clearance -0.1 m, at (0.1, 5, 1.95).
		{"through the hoarding", wall, Point3{-2, 5, 3}, Point3{2, 5, 1}, -0.1, true, Point3{0.1, 5, 1.95}},
		// Hand computation: a rope whose lower end rests on the stack's
		// top edge touches it: clearance 0, a strike.
		{"touching the edge", square, Point3{3, 1, 6}, Point3{2, 1, 3}, 0, true, Point3{2, 1, 3}},
		// Hand computation: a plumb rope ending 0.5 m beyond the stack's
		// side (x = 2.5) and 1 m below its top (z = 2): 0.5 m, square to
		// the side face at the hook's height or above up to the top.
		{"beside the side face", square, Point3{2.5, 1, 8}, Point3{2.5, 1, 2}, 0.5, false, Point3{2.5, 1, 2}},
		// Hand computation: a plumb rope down to 1 m in the notch of an L
		// (outline (0,0) (3,0) (3,3) (2,3) (2,1) (0,1), top 4 m) at
		// (1, 2): 1 m from the face x = 2 and from the face y = 1 (the
		// re-entrant corner (2, 1) is sqrt(2) m away): 1 m, not a strike.
		{"in the notch of an L", ell, Point3{1, 2, 10}, Point3{1, 2, 1}, 1, false, Point3{1, 2, 1}},
		// Hand computation: the rope from (1, 2, 10) to (2.5, 2, 2) comes
		// over the L's arm (x = 2) at 10 - 8/1.5 = 4.67 m, above its 4 m
		// top, and ends inside it 2 m up, 0.5 m from both faces x = 2 and
		// x = 3 (1 m from y = 3, 2 m under the top): through it, deepest
		// at its end, -0.5 m.
		{"into the arm of an L", ell, Point3{1, 2, 10}, Point3{2.5, 2, 2}, -0.5, true, Point3{2.5, 2, 2}},
		// Hand computation: a box of 2 by 2 m turned 45 deg about the
		// origin has its corners at (+/-sqrt(2), 0) and (0, +/-sqrt(2));
		// a plumb rope at (2, 0) down to 1 m is 2 - sqrt(2) = 0.5858 m
		// from the corner's upright edge, below the 3 m top.
		{"beside a turned box's corner", diamond, Point3{2, 0, 9}, Point3{2, 0, 1}, 2 - math.Sqrt2, false, Point3{2, 0, 1}},
	}
	for _, c := range cases {
		v, at, strikes := c.o.SegmentClearance(c.a, c.b, 0.02)
		if math.Abs(v-c.want) > 1e-9 || strikes != c.strikes {
			t.Errorf("%s: clearance %.9f strikes %v, want %.9f %v (hand computation)", c.name, v, strikes, c.want, c.strikes)
		}
		// Beside an upright face or edge every height below the top is as
		// near: the point is not checked there.
		beside := strings.HasPrefix(c.name, "beside") || c.name == "in the notch of an L"
		if !beside && dist3(at, c.at) > 1e-9 {
			t.Errorf("%s: nearest at %+v, want %+v (hand computation)", c.name, at, c.at)
		}
		// Reversed, the same segment.
		if v2, _, s2 := c.o.SegmentClearance(c.b, c.a, 0.02); math.Abs(v2-v) > 1e-9 || s2 != strikes {
			t.Errorf("%s reversed: %g %v, want %g %v", c.name, v2, s2, v, strikes)
		}
	}
}

// TestSegmentClearanceMatchesSampling compares the exact clearance with
// the least point clearance over points 1 mm apart along random segments
// near random polygons (convex and not): the exact one is never above the
// sampled one and at most half a millimetre below it (the point
// clearance is 1-Lipschitz); through the prism the depth is within half
// a millimetre of the sampled one.
func TestSegmentClearanceMatchesSampling(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 17))
	obs := []*Obstacle{
		{Outline: Rectangle(0, 0, 3, 1, 30), TopM: 2},
		{Outline: []Point2{{0, 0}, {3, 0}, {3, 3}, {2, 3}, {2, 1}, {0, 1}}, TopM: 4}, // an L
	}
	for n := 0; n < 400; n++ {
		o := obs[n%2]
		pt := func() Point3 { return Point3{rng.Float64()*8 - 3, rng.Float64()*8 - 3, rng.Float64() * 8} }
		a, b := pt(), pt()
		exact, _, strikes := o.SegmentClearance(a, b, 0.001)
		k := int(math.Ceil(dist3(a, b)/0.001)) + 1
		least := math.Inf(1)
		for j := 0; j <= k; j++ {
			least = math.Min(least, o.Clearance(lerp3(a, b, float64(j)/float64(k)), 0))
		}
		if strikes != o.SegmentStrikes(a, b) {
			t.Fatalf("case %d: strikes %v", n, strikes)
		}
		if strikes {
			// Through it, the depth is itself taken at points 1 mm apart.
			if least = math.Min(least, 0); math.Abs(exact-least) > 0.0005+1e-9 {
				t.Fatalf("case %d %+v %+v: depth %.6f, sampled %.6f", n, a, b, exact, least)
			}
			continue
		}
		if exact > least+1e-9 || exact < least-0.0005-1e-9 {
			t.Fatalf("case %d %+v %+v: exact %.6f, sampled %.6f", n, a, b, exact, least)
		}
	}
}

// TestAlongLinesSkipsNothing: the moving lines' check that skips the
// stretches that cannot matter gives what checking every stretch gives.
func TestAlongLinesSkipsNothing(t *testing.T) {
	wall := &Obstacle{Outline: []Point2{{0, 0}, {0.2, 0}, {0.2, 10}, {0, 10}}, TopM: 2.4}
	for _, hookLow := range []float64{3.5, 2.6, 1.5} {
		// A rope from a suspension point moving along x at 12 m, its hook
		// swinging, past the hoarding.
		var l RopeLine
		l.Name = "hoist rope"
		for i := 0; i <= 200; i++ {
			ts := float64(i) * 0.1
			sx := -5 + 0.5*ts
			l.TimeS = append(l.TimeS, ts)
			l.A = append(l.A, Point3{sx, 5, 12})
			l.B = append(l.B, Point3{sx + 1.5*math.Sin(1.3*ts), 5 + 0.3*math.Cos(ts), hookLow})
		}
		got := wall.AlongLines([]RopeLine{l}, 0.02)
		want := Closest{ClearanceM: math.Inf(1), FirstStrikeS: math.NaN(), GapM: math.Inf(1)}
		lo, hi := outlineBox(wall.Outline)
		wall.alongLine(&l, 0.02, lo, hi, &want, true)
		if got.ClearanceM != want.ClearanceM || got.TimeS != want.TimeS || got.Strikes != want.Strikes ||
			(got.Strikes && got.FirstStrikeS != want.FirstStrikeS) || got.Line != "hoist rope" {
			t.Errorf("hook at %g m: got %+v, want %+v", hookLow, got, want)
		}
		if strikes := hookLow < 2.4; got.Strikes != strikes {
			t.Errorf("hook at %g m: strikes %v", hookLow, got.Strikes)
		}
	}
}

// TestAlongLinesNamesTheFirstStriker: two sling legs moving along x at
// 0.5 m/s past a block 2 m thick from x = 0, top 2.4 m; leg 2, 1 m ahead
// of leg 1, reaches its face first, at t = (0 - 1 - (-5))/0.5 = 8 s, leg
// 1 at 10 s (hand computation). Leg 1 hangs lower (to 0.5 m, leg 2 to
// 2 m) and passes deepest: 1 m (half the block) against 0.4 m.
func TestAlongLinesNamesTheFirstStriker(t *testing.T) {
	block := &Obstacle{Outline: []Point2{{0, 0}, {2, 0}, {2, 10}, {0, 10}}, TopM: 2.4}
	leg := func(name string, ahead, lowM float64) RopeLine {
		l := RopeLine{Name: name}
		for i := 0; i <= 200; i++ {
			ts := float64(i) * 0.1
			x := -5 + 0.5*ts + ahead
			l.TimeS = append(l.TimeS, ts)
			l.A = append(l.A, Point3{x, 5, 6})
			l.B = append(l.B, Point3{x, 5, lowM})
		}
		return l
	}
	got := block.AlongLines([]RopeLine{leg("sling leg 1", 0, 0.5), leg("sling leg 2", 1, 2)}, 0.02)
	if !got.Strikes || got.FirstStrikeLine != "sling leg 2" || math.Abs(got.FirstStrikeS-8) > 0.051 || got.Line != "sling leg 1" || math.Abs(got.ClearanceM+1) > 0.02 {
		t.Errorf("first strike %v by %q at %g s (want sling leg 2 at 8 s); deepest %q, %g m (want sling leg 1, -1 m)", got.Strikes, got.FirstStrikeLine, got.FirstStrikeS, got.Line, got.ClearanceM)
	}
}

// TestSegmentClearanceSkipsNothing: the line's clearance with the
// outline's box (skipping the edges when the box is not nearer than the
// ends, and the strike test when the line passes clear of it) is, bit for
// bit, the clearance with a box holding everything (nothing skipped):
// random lines by random posts, some through them, some above.
func TestSegmentClearanceSkipsNothing(t *testing.T) {
	rng := rand.New(rand.NewPCG(12, 6))
	everywhere0, everywhere1 := Point2{math.Inf(-1), math.Inf(-1)}, Point2{math.Inf(1), math.Inf(1)}
	for trial := range 3000 {
		o := Obstacle{Outline: Rectangle(rng.Float64()*4-2, rng.Float64()*4-2, 0.2+rng.Float64()*2, 0.2+rng.Float64()*2, rng.Float64()*180), TopM: 1 + rng.Float64()*5}
		a := Point3{rng.Float64()*8 - 4, rng.Float64()*8 - 4, rng.Float64() * 9}
		b := Point3{a.X + rng.Float64()*4 - 2, a.Y + rng.Float64()*4 - 2, rng.Float64() * 9}
		lo, hi := outlineBox(o.Outline)
		v, at, s := o.segmentClearance(a, b, 0.02, lo, hi)
		w, wat, ws := o.segmentClearance(a, b, 0.02, everywhere0, everywhere1)
		if v != w || at != wat || s != ws {
			t.Fatalf("trial %d: %g at %v (%v), every edge %g at %v (%v)", trial, v, at, s, w, wat, ws)
		}
	}
}
