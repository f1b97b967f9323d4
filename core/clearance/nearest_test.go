package clearance

import (
	"math"
	"math/rand/v2"
	"testing"
)

// plainSegDist2 is the squared distance from p to the segment ab as
// first written (t held to [0, 1] before the foot of the perpendicular is
// taken; Ericson 2005, sec. 5.1.2): the plain form segDist2 is held to.
func plainSegDist2(p, a, b Point2) float64 {
	dx, dy := b.X-a.X, b.Y-a.Y
	t := 0.0
	if l2 := dx*dx + dy*dy; l2 > 0 {
		t = ((p.X-a.X)*dx + (p.Y-a.Y)*dy) / l2
		if t < 0 {
			t = 0
		} else if t > 1 {
			t = 1
		}
	}
	ex, ey := p.X-a.X-t*dx, p.Y-a.Y-t*dy
	return ex*ex + ey*ey
}

// everySegment is the least squared distance from p to the polyline and
// the first segment at it, trying every segment (the plain form of
// nearest.closest).
func everySegment(p Point2, poly []Point2) (float64, int) {
	if len(poly) == 1 {
		dx, dy := p.X-poly[0].X, p.Y-poly[0].Y
		return dx*dx + dy*dy, 0
	}
	best, seg := math.Inf(1), 0
	for s := 0; s+1 < len(poly); s++ {
		if d := plainSegDist2(p, poly[s], poly[s+1]); d < best {
			best, seg = d, s
		}
	}
	return best, seg
}

// checkNearest holds the grid's search, begun with no cursor and from
// cursors at the ends, in the middle and at random, to trying every
// segment, bit for bit.
func checkNearest(t *testing.T, what string, poly []Point2, n *nearest, p Point2, rng *rand.Rand) {
	t.Helper()
	best, seg := everySegment(p, poly)
	last := max(len(poly)-2, 0)
	for _, s := range []int{-1, 0, last, last / 2, rng.IntN(last + 1), seg} {
		if d, k := n.closestFrom(p, s); math.Float64bits(d) != math.Float64bits(best) || k != seg {
			t.Fatalf("%s, point %v from segment %d: %g at segment %d, every segment %g at %d", what, p, s, d, k, best, seg)
		}
	}
}

// hardPolylines are polylines where a search can go wrong: a straight
// travel track sampled unevenly (collinear segments, some of no length),
// the same track run out and back over the same points (every segment
// twice: exact ties), a zig-zag whose corners touch one line, a square
// run round twice, a track far from the origin, a single segment, and
// random walks on a coarse lattice (many equal distances).
func hardPolylines(rng *rand.Rand) map[string][]Point2 {
	out := map[string][]Point2{}
	var line, back, zig, square, far []Point2
	x := 0.0
	for i := 0; i < 200; i++ {
		line = append(line, Point2{x, 0})
		x += float64(rng.IntN(3)) * 0.05
	}
	back = append(back, line...)
	for i := len(line) - 2; i >= 0; i-- {
		back = append(back, line[i])
	}
	for i := 0; i <= 60; i++ {
		zig = append(zig, Point2{float64(i) * 0.5, float64(i%2) * 0.5})
	}
	for k := 0; k < 2; k++ {
		for _, c := range []Point2{{0, 0}, {4, 0}, {4, 4}, {0, 4}} {
			square = append(square, c)
		}
	}
	square = append(square, Point2{0, 0})
	for _, p := range line {
		far = append(far, Point2{p.X + 5e4, -3e4 + 0.3*p.X})
	}
	out["line"], out["back"], out["zig"], out["square"], out["far"] = line, back, zig, square, far
	out["one segment"] = []Point2{{1, 1}, {3, 2}}
	for w := 0; w < 4; w++ {
		walk := []Point2{{0, 0}}
		for i := 0; i < 150; i++ {
			q := walk[len(walk)-1]
			walk = append(walk, Point2{q.X + float64(rng.IntN(3)-1)*0.25, q.Y + float64(rng.IntN(3)-1)*0.25})
		}
		out["lattice walk "+string(rune('a'+w))] = walk
	}
	return out
}

// hardPoints are points to look from: on every vertex, at the middle of
// every segment, on the lattice near the polyline (equal distances to
// several segments), near it at random, far outside the grid, so far
// the squares overflow, and not finite.
func hardPoints(poly []Point2, rng *rand.Rand) []Point2 {
	var pts []Point2
	for i, q := range poly {
		pts = append(pts, q)
		if i+1 < len(poly) {
			pts = append(pts, Point2{(q.X + poly[i+1].X) / 2, (q.Y + poly[i+1].Y) / 2})
		}
	}
	for k := 0; k < 300; k++ {
		q := poly[rng.IntN(len(poly))]
		pts = append(pts,
			Point2{q.X + float64(rng.IntN(9)-4)*0.125, q.Y + float64(rng.IntN(9)-4)*0.125},
			Point2{q.X + rng.NormFloat64()*0.5, q.Y + rng.NormFloat64()*0.5},
			Point2{q.X + rng.NormFloat64()*1e3, q.Y + rng.NormFloat64()*1e3})
	}
	return append(pts, Point2{1e9, -1e9}, Point2{-1e12, 3}, Point2{1e200, -1e200}, Point2{math.NaN(), 0},
		Point2{math.Inf(1), 2}, Point2{0, math.Inf(-1)})
}

func TestSegDist2IsThePlainForm(t *testing.T) {
	// The squared distance the searches use is that of the plain form,
	// bit for bit (NaN for NaN): random points and segments, segments of
	// no length or so short their length squared is zero, points on the
	// ends, signed zeros, and infinities.
	rng := rand.New(rand.NewPCG(37, 41))
	vals := []float64{0, math.Copysign(0, -1), 1, -1, 1e-170, -1e-170, 1e300, math.Inf(1), math.Inf(-1), math.NaN()}
	pick := func() float64 {
		if rng.IntN(3) == 0 {
			return vals[rng.IntN(len(vals))]
		}
		return rng.NormFloat64() * math.Pow(10, float64(rng.IntN(9)-4))
	}
	for k := 0; k < 200000; k++ {
		p, a, b := Point2{pick(), pick()}, Point2{pick(), pick()}, Point2{pick(), pick()}
		switch k % 4 {
		case 1:
			b = a
		case 2:
			p = a
		case 3:
			p = b
		}
		got, want := pointSegmentDist2(p, a, b), plainSegDist2(p, a, b)
		if math.Float64bits(got) != math.Float64bits(want) && !(math.IsNaN(got) && math.IsNaN(want)) {
			t.Fatalf("p %v a %v b %v: %g, plain form %g", p, a, b, got, want)
		}
	}
}

func TestRunSectionCursorMatchesSearch(t *testing.T) {
	// Each sample's distance along the track found from the sample
	// before's segment is the one found with no cursor: wandering runs
	// about tracks that go out and back.
	rng := rand.New(rand.NewPCG(43, 47))
	for trial := range 100 {
		run := &Run{}
		x, y := 0.0, 0.0
		for i := 0; i < 300; i++ {
			dir := 1.0
			if trial%2 == 0 && i >= 150 {
				dir = -1
			}
			x += dir * rng.Float64() * 0.1
			y += (rng.Float64() - 0.5) * 0.02 * float64(trial%5)
			run.TimeS = append(run.TimeS, float64(i)*0.1)
			run.SuspensionXM = append(run.SuspensionXM, x)
			run.SuspensionYM = append(run.SuspensionYM, y)
			run.RelXM = append(run.RelXM, rng.NormFloat64()*0.3)
			run.RelYM = append(run.RelYM, rng.NormFloat64()*0.3)
			run.RelZM = append(run.RelZM, -5)
		}
		k := newTrack(run)
		d, _ := k.runSection(run, 10, 0.5)
		for i := range run.TimeS {
			if want := k.distance(run.centre(i, 10).Plan()); math.Float64bits(d[i]) != math.Float64bits(want) {
				t.Fatalf("trial %d sample %d: %g from the cursor, %g without", trial, i, d[i], want)
			}
		}
	}
}
