package clearance

import (
	"math"
	"math/rand/v2"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/sway"
)

// wanderingLine is a line of n samples whose ends wander at random about
// (x, y), the lower end 4 to 8 m below the upper; nan puts a NaN end at
// one sample.
func wanderingLine(rng *rand.Rand, n int, x, y float64, nan bool) RopeLine {
	l := RopeLine{Name: "hoist rope"}
	a := Point3{x, y, 10}
	b := Point3{x, y, 10 - 4 - 4*rng.Float64()}
	for i := range n {
		l.TimeS = append(l.TimeS, float64(i)*0.1)
		l.A, l.B = append(l.A, a), append(l.B, b)
		a.X += (rng.Float64() - 0.5) * 0.3
		a.Y += (rng.Float64() - 0.5) * 0.1
		b.X = a.X + (rng.Float64()-0.5)*2
		b.Y = a.Y + (rng.Float64()-0.5)*2
		b.Z += (rng.Float64() - 0.5) * 0.2
	}
	if nan {
		l.B[rng.IntN(n)].Y = math.NaN()
	}
	return l
}

// TestLinePrepareIsThePlainBoxes: each stretch's box is the box of its
// four ends (the same numbers, a zero's sign aside), its movement the
// larger of its ends' bit for bit (max, not upper), and each block's box
// holds its stretches' boxes.
func TestLinePrepareIsThePlainBoxes(t *testing.T) {
	rng := rand.New(rand.NewPCG(17, 4))
	same := func(a, b float64) bool { return a == b || (math.IsNaN(a) && math.IsNaN(b)) }
	same3 := func(a, b Point3) bool { return same(a.X, b.X) && same(a.Y, b.Y) && same(a.Z, b.Z) }
	for trial := range 50 {
		l := wanderingLine(rng, 2+rng.IntN(100), 0, 0, trial%5 == 0)
		l.prepare(0.02)
		for i := range len(l.TimeS) - 1 {
			a0, b0, a1, b1 := l.A[i], l.B[i], l.A[i+1], l.B[i+1]
			lo := Point3{lower(lower(a0.X, b0.X), lower(a1.X, b1.X)), lower(lower(a0.Y, b0.Y), lower(a1.Y, b1.Y)), lower(lower(a0.Z, b0.Z), lower(a1.Z, b1.Z))}
			hi := Point3{upper(upper(a0.X, b0.X), upper(a1.X, b1.X)), upper(upper(a0.Y, b0.Y), upper(a1.Y, b1.Y)), upper(upper(a0.Z, b0.Z), upper(a1.Z, b1.Z))}
			if slo, shi := l.stretchBox(i); !same3(slo, lo) || !same3(shi, hi) || !same(l.move[i], max(dist3(a0, a1), dist3(b0, b1))) {
				t.Fatalf("trial %d stretch %d: box %v %v move %g, want %v %v %g", trial, i, slo, shi, l.move[i], lo, hi, max(dist3(a0, a1), dist3(b0, b1)))
			}
			k := i / lineBlock
			b := l.blocks[k]
			if !(b.lo.X <= lo.X && b.lo.Y <= lo.Y && b.lo.Z <= lo.Z && b.hi.X >= hi.X && b.hi.Y >= hi.Y && b.hi.Z >= hi.Z) &&
				!math.IsNaN(b.lo.Y+b.hi.Y) {
				t.Fatalf("trial %d: block %d's box %v %v does not hold stretch %d's %v %v", trial, k, b.lo, b.hi, i, lo, hi)
			}
		}
	}
}

// TestFirstStretchOpensWhatMatters: the first stretch with the least box
// gap, found opening only the blocks that can hold it, is the one found
// from every stretch's gap: lines wandering near and far from a post, a
// few with a NaN end.
func TestFirstStretchOpensWhatMatters(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 23))
	for trial := range 300 {
		o := Obstacle{Outline: Rectangle(rng.Float64()*6-3, rng.Float64()*6-3, 0.3+rng.Float64(), 0.3+rng.Float64(), rng.Float64()*90), TopM: 2 + rng.Float64()*8}
		l := wanderingLine(rng, 2+rng.IntN(200), rng.Float64()*6-3, rng.Float64()*6-3, trial%7 == 0)
		l.prepare(0.02)
		lo, hi := outlineBox(o.Outline)
		l.gen++
		got := l.firstStretch(lo, hi, o.TopM, false)
		l.gen++
		want := l.firstStretch(lo, hi, o.TopM, true)
		if got != want {
			t.Fatalf("trial %d: first stretch %d, want %d", trial, got, want)
		}
	}
}

// TestAlongLinesMatchesEvery: the lines' check that opens only the
// blocks of stretches that can matter gives, field for field, what
// checking every stretch gives: the examples' runs (a hoist rope past
// columns, ropes past a tower and a mast) and wandering lines by a post.
func TestAlongLinesMatchesEvery(t *testing.T) {
	check := func(what string, o *Obstacle, lines []RopeLine) {
		t.Helper()
		got := o.AlongLines(lines, 0.02)
		want := Closest{ClearanceM: math.Inf(1), FirstStrikeS: math.NaN(), GapM: math.Inf(1)}
		lo, hi := outlineBox(o.Outline)
		for k := range lines {
			o.alongLine(&lines[k], 0.02, lo, hi, &want, true)
		}
		if !sameClosest(got, want) || got.Line != want.Line || got.FirstStrikeLine != want.FirstStrikeLine {
			t.Fatalf("%s: got %+v, want %+v", what, got, want)
		}
	}
	for _, name := range []string{"site-bay-columns", "site-tower-rope-mast"} {
		s := testscenario.Example(t, name)
		res, err := sway.EvaluateWith(s, sway.Options{LegEnds: true})
		if err != nil {
			t.Fatal(err)
		}
		run := RunOf(res)
		site := SiteOf(s.Site)
		lines := run.Lines(site.SuspensionHeightM, site.LoadRadiusM)
		for k := range site.Obstacles {
			check(name+" "+site.Obstacles[k].Name, &site.Obstacles[k], lines)
		}
	}
	rng := rand.New(rand.NewPCG(8, 1))
	for trial := range 100 {
		o := Obstacle{Outline: Rectangle(rng.Float64()*4-2, rng.Float64()*4-2, 0.3+rng.Float64(), 0.3+rng.Float64(), rng.Float64()*90), TopM: 2 + rng.Float64()*8}
		lines := []RopeLine{wanderingLine(rng, 2+rng.IntN(150), 0, 0, false), wanderingLine(rng, 2+rng.IntN(150), 0.5, 0, trial%9 == 0)}
		lines[1].Name = "sling leg 1"
		check("wandering", &o, lines)
	}
}
