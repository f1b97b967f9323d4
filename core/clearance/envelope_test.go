package clearance

import (
	"math"
	"math/rand/v2"
	"testing"
)

// line is a straight run along x from 0 to 20 m at height y, sampled every
// half metre.
func line(y, r float64) PlanPath {
	var p []Point2
	for x := 0.0; x <= 20; x += 0.5 {
		p = append(p, Point2{x, y})
	}
	return PlanPath{Points: p, RadiusM: r}
}

func TestEnvelopeOfIdenticalRunsIsTheRun(t *testing.T) {
	// With every spread at zero all runs are the nominal one: the
	// envelope at any level is that run's swept area alone.
	nominal := line(0, 0.5)
	runs := []PlanPath{nominal, nominal, nominal}
	one, err := NewEnvelope(runs[:1], nominal.Points, 1, 0.1)
	if err != nil {
		t.Fatal(err)
	}
	for _, level := range []float64{0.5, 0.95, 1} {
		e, err := NewEnvelope(runs, nominal.Points, level, 0.1)
		if err != nil {
			t.Fatal(err)
		}
		if e.StrayM != 0 || e.AreaM2() != one.AreaM2() {
			t.Errorf("level %g: stray %g, area %g, want 0 and %g", level, e.StrayM, e.AreaM2(), one.AreaM2())
		}
	}
	// The swept area of a 20 m run with a 0.5 m radius is a 21 m x 1 m
	// stadium, 20 + pi/4 m^2; the cells cover it with at most a cell's
	// diagonal all round.
	a, exact := one.AreaM2(), 20+math.Pi/4
	if a < exact || a > (20+2*(0.5+0.15))*(1+2*0.15) {
		t.Errorf("area %g m^2 against the stadium's %g", a, exact)
	}
	if !one.Contains(Point2{10, 0.45}) || one.Contains(Point2{10, 0.75}) {
		t.Error("the envelope's edge is not within a cell of the stadium's")
	}
}

func TestEnvelopeLevelsTakeTheLeastStrayingRuns(t *testing.T) {
	// Ten runs offset sideways by 0 to 9 m (a spread in one input only):
	// at level 0.5 the envelope holds the five that stray least (0 to
	// 4 m) and reaches 4 m + the radius; at level 1 it reaches the run at
	// 9 m, the range end.
	nominal := line(0, 0.25)
	var runs []PlanPath
	for i := 9; i >= 0; i-- {
		runs = append(runs, line(float64(i), 0.25))
	}
	half, err := NewEnvelope(runs, nominal.Points, 0.5, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	if half.Inside != 5 || half.StrayM != 4 {
		t.Fatalf("level 0.5: %d runs inside, stray %g; want 5 and 4", half.Inside, half.StrayM)
	}
	if !half.Contains(Point2{10, 4.2}) || half.Contains(Point2{10, 4.4}) || half.Contains(Point2{10, 6}) {
		t.Error("level 0.5 does not end at 4.25 m")
	}
	all, _ := NewEnvelope(runs, nominal.Points, 1, 0.05)
	if !all.Contains(Point2{10, 9.2}) || all.Contains(Point2{10, 9.4}) {
		t.Error("level 1 does not end at the outermost run's edge, 9.25 m")
	}
}

func TestEnvelopeConfidence(t *testing.T) {
	// With k = N the coverage of the largest of N scores is Beta(N, 1):
	// P(coverage >= p) = 1 - p^N; for p = 0.95 and N = 59 that is 0.9515,
	// the classic 59 runs for a one-sided 95 %/95 % tolerance limit
	// (Wilks 1941; closed form of the Beta(N, 1) distribution).
	if got, want := CoverageConfidence(59, 59, 0.95), 1-math.Pow(0.95, 59); math.Abs(got-want) > 1e-12 {
		t.Errorf("59 of 59: %g, want %g", got, want)
	}
	// In general P(Beta(k, N+1-k) >= p) = P(Binomial(N, p) <= k-1), the
	// identity between the incomplete beta function and the binomial sum
	// (Abramowitz & Stegun 26.5.24): summed here term by term.
	binomLE := func(n, k int, p float64) float64 {
		s := 0.0
		for j := 0; j <= k; j++ {
			lc, _ := math.Lgamma(float64(n + 1))
			l1, _ := math.Lgamma(float64(j + 1))
			l2, _ := math.Lgamma(float64(n - j + 1))
			s += math.Exp(lc - l1 - l2 + float64(j)*math.Log(p) + float64(n-j)*math.Log1p(-p))
		}
		return s
	}
	for _, c := range []struct {
		k, n int
		p    float64
	}{{57, 59, 0.95}, {95, 100, 0.95}, {960, 1000, 0.95}, {50, 100, 0.5}} {
		if got, want := CoverageConfidence(c.k, c.n, c.p), binomLE(c.n, c.k-1, c.p); math.Abs(got-want) > 1e-10 {
			t.Errorf("k %d of %d at %g: %g, want %g", c.k, c.n, c.p, got, want)
		}
	}
	// The envelope carries it for its own k and N.
	nominal := line(0, 0.25)
	var runs []PlanPath
	for i := 0; i < 59; i++ {
		runs = append(runs, line(float64(i)*0.01, 0.25))
	}
	e, err := NewEnvelope(runs, nominal.Points, 0.95, 0.5)
	if err != nil {
		t.Fatal(err)
	}
	if e.Inside != 57 || e.Confidence != CoverageConfidence(57, 59, 0.95) {
		t.Errorf("envelope: %d inside, confidence %g", e.Inside, e.Confidence)
	}
}

func TestShareLowerBoundClosedForms(t *testing.T) {
	// Clopper-Pearson with every run a success: the lower bound solves
	// p^n = 1 - conf, so p = (1 - conf)^(1/n) (closed form of Beta(n, 1)).
	for _, n := range []int{10, 59, 1000} {
		got, want := ShareLowerBound(n, n, 0.95), math.Pow(0.05, 1/float64(n))
		if math.Abs(got-want) > 1e-12 {
			t.Errorf("n = %d: %g, want %g", n, got, want)
		}
	}
	// One success in n: Beta(1, n) has CDF 1 - (1-p)^n, so the bound is
	// 1 - conf^(1/n).
	if got, want := ShareLowerBound(1, 20, 0.95), 1-math.Pow(0.95, 1.0/20); math.Abs(got-want) > 1e-12 {
		t.Errorf("1 in 20: %g, want %g", got, want)
	}
	if ShareLowerBound(0, 20, 0.95) != 0 {
		t.Error("no success: the bound is 0")
	}
}

func TestStrayGridAgreesWithBruteForce(t *testing.T) {
	// The bucketed search is exact: the same distances as trying every
	// segment, on wandering paths (a slewing arc with a wobble, and a
	// zig-zag), for points near and far; and the stray of whole runs
	// (walked from point to point, few points measured: nearest.stray) is
	// the largest of every point's distance to every segment, bit for
	// bit, on the hard cases (hardPolylines) with runs wandering about
	// them, standing still, and through their vertices.
	rng := rand.New(rand.NewPCG(1, 2))
	var arc, zig []Point2
	for i := 0; i <= 600; i++ {
		a := float64(i) / 600 * math.Pi / 2
		r := 35 + 0.3*math.Sin(7*a)
		arc = append(arc, Point2{r * math.Cos(a), r * math.Sin(a)})
		zig = append(zig, Point2{float64(i) * 0.05, float64(i%40) * 0.1})
	}
	for _, nominal := range [][]Point2{arc, zig} {
		for k := 0; k < 2000; k++ {
			p := Point2{rng.Float64()*80 - 20, rng.Float64()*80 - 20}
			brute := math.Inf(1)
			for i := 0; i+1 < len(nominal); i++ {
				brute = math.Min(brute, pointSegmentDistance(p, nominal[i], nominal[i+1]))
			}
			if got := Stray([]Point2{p}, nominal); got != brute {
				t.Fatalf("point %v: %g, brute force %g", p, got, brute)
			}
		}
	}
	for name, nominal := range hardPolylines(rng) {
		for trial := range 20 {
			run := make([]Point2, 2+rng.IntN(150))
			for i := range run {
				q := nominal[min(i*len(nominal)/len(run), len(nominal)-1)]
				switch trial % 4 {
				case 0: // through the vertices
				case 1: // standing still
					q = run[0]
					if i == 0 {
						q = nominal[rng.IntN(len(nominal))]
					}
				default:
					q.X += rng.NormFloat64() * 0.3 * float64(trial%4)
					q.Y += rng.NormFloat64() * 0.3 * float64(trial%4)
				}
				run[i] = q
			}
			worst := 0.0
			for _, p := range run {
				d, _ := everySegment(p, nominal)
				worst = max(worst, d)
			}
			if got, want := Stray(run, nominal), math.Sqrt(worst); math.Float64bits(got) != math.Float64bits(want) {
				t.Fatalf("%s trial %d: stray %g, every point to every segment %g", name, trial, got, want)
			}
		}
	}
}

func TestExclusionZoneIsA95By95Region(t *testing.T) {
	// With 59 runs the smallest region that is 95 % sure to hold 95 % of
	// all runs holds all 59: 1 - 0.95^59 = 0.9515 (Wilks 1941); with 58
	// it could not be (0.9490), so it holds all and says so.
	mk := func(n int) ([]PlanPath, []float64) {
		var runs []PlanPath
		var strays []float64
		for i := 0; i < n; i++ {
			runs = append(runs, line(float64(i)*0.01, 0.25))
			strays = append(strays, float64(i)*0.01)
		}
		return runs, strays
	}
	runs, strays := mk(59)
	e, _ := newEnvelope(runs, strays, 0.95, 0.95, 0.5)
	if e.Inside != 59 || e.Confidence < 0.95 {
		t.Errorf("59 runs: %d inside, confidence %g", e.Inside, e.Confidence)
	}
	runs, strays = mk(58)
	e, _ = newEnvelope(runs, strays, 0.95, 0.95, 0.5)
	if e.Inside != 58 || math.Abs(e.Confidence-(1-math.Pow(0.95, 58))) > 1e-12 {
		t.Errorf("58 runs: %d inside, confidence %g", e.Inside, e.Confidence)
	}
	// With 200 runs it takes the fewest k whose confidence reaches 95 %.
	runs, strays = mk(200)
	e, _ = newEnvelope(runs, strays, 0.95, 0.95, 0.5)
	if CoverageConfidence(e.Inside, 200, 0.95) < 0.95 || CoverageConfidence(e.Inside-1, 200, 0.95) >= 0.95 {
		t.Errorf("200 runs: %d inside", e.Inside)
	}
}

func TestClosestSegmentIsTheFirstNearest(t *testing.T) {
	// The bucketed search measures only the segments whose boxes lie as
	// near as the one its walk ends at (nearest.closestFrom): the
	// distance and the first segment at it are those of trying every
	// segment, bit for bit, with no cursor and from cursors anywhere, for
	// points near the path and far from it, on a path that comes back
	// over itself (a trolley run out and back) and a zig-zag, and on the
	// hard cases (hardPolylines: collinear segments, segments of no
	// length, exact ties; hardPoints: on vertices, far off the grid).
	rng := rand.New(rand.NewPCG(3, 4))
	var back, zig []Point2
	for i := 0; i <= 400; i++ {
		x := float64(i) * 0.05
		if i > 200 {
			x = float64(400-i) * 0.05
		}
		back = append(back, Point2{x, 0.01 * math.Sin(float64(i))})
		zig = append(zig, Point2{float64(i) * 0.05, float64(i%40) * 0.1})
	}
	for _, path := range [][]Point2{back, zig} {
		n := newNearest(path)
		for k := 0; k < 4000; k++ {
			q := path[rng.IntN(len(path))]
			p := Point2{q.X + rng.NormFloat64()*0.3, q.Y + rng.NormFloat64()*0.3}
			if k%4 == 0 {
				p = Point2{rng.Float64()*40 - 10, rng.Float64()*40 - 10}
			}
			checkNearest(t, "out and back or zig-zag", path, n, p, rng)
		}
	}
	for name, poly := range hardPolylines(rng) {
		n := newNearest(poly)
		for _, p := range hardPoints(poly, rng) {
			checkNearest(t, name, poly, n, p, rng)
		}
	}
}
