package clearance

import (
	"math"
	"math/rand/v2"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/sway"
)

// sameClosest is c == w, NaN equal to NaN.
func sameClosest(c, w Closest) bool {
	same := func(a, b float64) bool { return a == b || (math.IsNaN(a) && math.IsNaN(b)) }
	return same(c.ClearanceM, w.ClearanceM) && same(c.TimeS, w.TimeS) && c.At == w.At &&
		same(c.ErrorBoundM, w.ErrorBoundM) && c.Strikes == w.Strikes && same(c.FirstStrikeS, w.FirstStrikeS) &&
		c.FirstStrikeAt == w.FirstStrikeAt && same(c.GapM, w.GapM) && same(c.GapAtS, w.GapAtS) && c.GapAt == w.GapAt
}

func TestAlongPathNearMatchesEvery(t *testing.T) {
	// Looking only at the points that can matter gives what looking at
	// every point gives, exactly: the examples' runs past their obstacles
	// (and the same obstacles moved onto the path, struck and passed
	// over), and random wandering paths by a random obstacle.
	for _, name := range []string{"site-bay-columns", "site-tower-hoarding"} {
		s := testscenario.Example(t, name)
		res, err := sway.EvaluateWith(s, sway.Options{LegEnds: true})
		if err != nil {
			t.Fatal(err)
		}
		run := RunOf(res)
		site := SiteOf(s.Site)
		path := run.Path(site.SuspensionHeightM)
		mid := path[len(path)/2].At
		for k, o := range site.Obstacles {
			moved := o
			moved.Outline = nil
			for _, p := range o.Outline {
				moved.Outline = append(moved.Outline, Point2{p.X - o.Outline[0].X + mid.X, p.Y - o.Outline[0].Y + mid.Y})
			}
			for _, ob := range []Obstacle{o, moved} {
				for _, step := range []float64{0.02, 0.3} {
					want := ob.alongPathEvery(path, site.LoadRadiusM, step)
					got := ob.alongPathNear(path, site.LoadRadiusM, step)
					if !sameClosest(got, want) {
						t.Fatalf("%s obstacle %d step %g: got %+v, want %+v", name, k, step, got, want)
					}
				}
			}
		}
	}
	rng := rand.New(rand.NewPCG(3, 5))
	for trial := range 200 {
		o := Obstacle{Outline: Rectangle(rng.Float64()*4-2, rng.Float64()*4-2, 0.2+rng.Float64()*3, 0.2+rng.Float64(), rng.Float64()*180),
			TopM: 1 + rng.Float64()*3}
		path := make([]Sample, 1+rng.IntN(300))
		p := Point3{rng.Float64()*8 - 4, rng.Float64()*8 - 4, rng.Float64() * 5}
		for i := range path {
			path[i] = Sample{TimeS: float64(i) * 0.1, At: p}
			p.X += (rng.Float64() - 0.5) * 0.4
			p.Y += (rng.Float64() - 0.5) * 0.4
			p.Z += (rng.Float64() - 0.5) * 0.2
		}
		r := rng.Float64()
		want := o.alongPathEvery(path, r, 0.02)
		got := o.alongPathNear(path, r, 0.02)
		if !sameClosest(got, want) {
			t.Fatalf("trial %d: got %+v, want %+v", trial, got, want)
		}
	}
}

func TestStrayMatchesEvery(t *testing.T) {
	// The stray found from a few points' distances is the stray found
	// from every point's: wandering runs about winding nominal paths.
	rng := rand.New(rand.NewPCG(11, 13))
	for trial := range 300 {
		nominal := make([]Point2, 1+rng.IntN(200))
		p := Point2{}
		for i := range nominal {
			nominal[i] = p
			p.X += rng.Float64() * 0.3
			p.Y += (rng.Float64() - 0.5) * []float64{0.05, 0.5, 3}[trial%3]
		}
		run := make([]Point2, 1+rng.IntN(300))
		for i := range run {
			q := nominal[min(i*len(nominal)/len(run), len(nominal)-1)]
			run[i] = Point2{q.X + rng.NormFloat64()*0.3, q.Y + rng.NormFloat64()*0.3}
		}
		n := newNearest(nominal)
		if got, want := n.stray(run), n.strayEvery(run); got != want {
			t.Fatalf("trial %d: stray %g, every point %g", trial, got, want)
		}
	}
}

func TestNearestMatchesEverySegment(t *testing.T) {
	// The grid's search gives the least squared distance and the first
	// segment with it, as looking at every segment does: winding and
	// straight polylines (a travel track: one row of buckets), points
	// near them, far off the grid and on their corners.
	rng := rand.New(rand.NewPCG(19, 23))
	for trial := range 300 {
		poly := make([]Point2, 2+rng.IntN(300))
		p := Point2{rng.Float64() * 10, rng.Float64() * 10}
		for i := range poly {
			poly[i] = p
			switch trial % 3 {
			case 0: // straight along x, some points standing
				p.X += float64(rng.IntN(2)) * rng.Float64() * 0.1
			case 1: // a slew's arc
				a := float64(i) * 0.01
				p = Point2{20 * math.Cos(a), 20 * math.Sin(a)}
			default:
				p.X += rng.Float64() * 0.3
				p.Y += (rng.Float64() - 0.5) * 0.5
			}
		}
		n := newNearest(poly)
		for k := range 200 {
			q := poly[rng.IntN(len(poly))]
			if k%4 != 0 {
				q.X += rng.NormFloat64() * []float64{0.05, 0.5, 5}[k%3]
				q.Y += rng.NormFloat64() * []float64{0.05, 0.5, 5}[k%3]
			}
			best, seg := math.Inf(1), 0
			for s := 0; s+1 < len(poly); s++ {
				if d := pointSegmentDist2(q, poly[s], poly[s+1]); d < best {
					best, seg = d, s
				}
			}
			if d, s := n.closest(q); d != best || s != seg {
				t.Fatalf("trial %d point %v: grid (%g, segment %d), every segment (%g, segment %d)", trial, q, d, s, best, seg)
			}
		}
	}
}
