package clearance

import (
	"math"
	"math/rand/v2"
	"testing"
)

func TestCapsuleSweepMatchesCellSweep(t *testing.T) {
	// The row by row sweep and the sweep by groups of pieces
	// (sweepGroups, what runs use) mark exactly the cells the cell by cell
	// sweep marks: random paths (short wobbly steps, long straight pieces,
	// a standing point, level and upright pieces, and paths of hundreds of
	// short steps as a run's), radii and cell sizes; and paths on the
	// cells' centres with a reach of whole cells, so that many centres
	// lie at the reach exactly (up to the rounding; there only the group
	// sweep is held to it: the row sweep, unused by runs, can mark a
	// centre that the cell test, rounded otherwise, leaves out).
	rng := rand.New(rand.NewPCG(7, 17))
	for trial := range 460 {
		n := 1 + rng.IntN(40)
		if trial >= 300 {
			n = 100 + rng.IntN(500)
		}
		pts := make([]Point2, n)
		p := Point2{rng.Float64()*20 - 10, rng.Float64()*20 - 10}
		step := []float64{0.01, 0.3, 3}[trial%3]
		for i := range pts {
			pts[i] = p
			switch rng.IntN(5) {
			case 0:
				p.X += step // level
			case 1:
				p.Y -= step // upright
			case 2: // standing
			default:
				p.X += (rng.Float64() - 0.5) * 2 * step
				p.Y += (rng.Float64() - 0.5) * 2 * step
			}
		}
		cellM := []float64{0.1, 0.05, 0.37}[trial%3]
		r := PlanPath{Points: pts, RadiusM: rng.Float64() * 2}
		if trial%7 == 0 {
			r.RadiusM = 0
		}
		reach := r.RadiusM + cellM*math.Sqrt2/2
		if trial >= 400 {
			for i := range pts {
				pts[i] = Point2{(math.Round(pts[i].X/cellM) + 0.5) * cellM, (math.Round(pts[i].Y/cellM) + 0.5) * cellM}
			}
			reach = float64(1+rng.IntN(12)) * cellM
			r.RadiusM = reach - cellM*math.Sqrt2/2
		}
		i0, i1, j0, j1 := r.latticeBox(cellM)
		nx, ny := i1-i0+1, j1-j0+1
		want, got := make([]bool, nx*ny), make([]bool, nx*ny)
		sweepBallCells(pts, reach, cellM, i0, j0, nx, ny, want)
		sweepCapsules(pts, reach, cellM, i0, j0, nx, ny, got)
		grouped := make([]bool, nx*ny)
		sweepGroups(pts, reach, cellM, i0, j0, nx, ny, grouped)
		// A window that cuts the path off on every side too.
		cw, cg, cgr := make([]bool, (nx/2+1)*(ny/2+1)), make([]bool, (nx/2+1)*(ny/2+1)), make([]bool, (nx/2+1)*(ny/2+1))
		sweepBallCells(pts, reach, cellM, i0+nx/4, j0+ny/4, nx/2+1, ny/2+1, cw)
		sweepCapsules(pts, reach, cellM, i0+nx/4, j0+ny/4, nx/2+1, ny/2+1, cg)
		sweepGroups(pts, reach, cellM, i0+nx/4, j0+ny/4, nx/2+1, ny/2+1, cgr)
		for k := range want {
			if (trial < 400 && want[k] != got[k]) || want[k] != grouped[k] {
				t.Fatalf("trial %d: cell %d: cell sweep %v, row sweep %v, group sweep %v", trial, k, want[k], got[k], grouped[k])
			}
		}
		for k := range cw {
			if (trial < 400 && cw[k] != cg[k]) || cw[k] != cgr[k] {
				t.Fatalf("trial %d (window): cell %d: cell sweep %v, row sweep %v, group sweep %v", trial, k, cw[k], cg[k], cgr[k])
			}
		}
	}
}

// TestChordDevMatchesEvery: chordDev, with the chord's figures worked out
// once, is the plain largest pointSegmentDist2, bit for bit: wandering
// paths, standing points (a chord of no length) and a NaN point.
func TestChordDevMatchesEvery(t *testing.T) {
	rng := rand.New(rand.NewPCG(9, 2))
	for trial := range 300 {
		pts := make([]Point2, 2+rng.IntN(40))
		p := Point2{rng.Float64()*20 - 10, rng.Float64()*20 - 10}
		for i := range pts {
			pts[i] = p
			if rng.IntN(4) > 0 {
				p.X += (rng.Float64() - 0.5) * 0.2
				p.Y += (rng.Float64() - 0.5) * 0.2
			}
		}
		if trial%25 == 0 {
			pts[rng.IntN(len(pts))].X = math.NaN()
		}
		s := rng.IntN(len(pts) - 1)
		e := s + 1 + rng.IntN(len(pts)-s-1)
		got, want := chordDev(pts, s, e), chordDevEvery(pts, s, e)
		if !(got == want || (math.IsNaN(got) && math.IsNaN(want))) {
			t.Fatalf("trial %d: %g, want %g", trial, got, want)
		}
	}
}

// chordDevEvery is chordDev point by point, the plain form.
func chordDevEvery(points []Point2, s, e int) float64 {
	d2 := 0.0
	for k := s + 1; k < e; k++ {
		d2 = upper(d2, pointSegmentDist2(points[k], points[s], points[e]))
	}
	return math.Sqrt(d2)
}

// TestMarkInnerIsTheRows: the cells markInner finds in each row (for the
// second pass of sweepGroupsInto) are those capsule.row gives, rounded to
// cells, and it marks them: random segments (level, upright, of no
// length), radii and cell sizes, windows that cut the capsule off, and
// rows the capsule misses.
func TestMarkInnerIsTheRows(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 31))
	for trial := range 2000 {
		a := Point2{rng.Float64()*10 - 5, rng.Float64()*10 - 5}
		b := Point2{a.X + rng.Float64()*2 - 1, a.Y + rng.Float64()*2 - 1}
		switch trial % 5 {
		case 0:
			b.Y = a.Y // level
		case 1:
			b.X = a.X // upright
		case 2:
			b = a // a standing point
		}
		cellM := []float64{0.1, 0.05, 0.37}[trial%3]
		reach := rng.Float64() * 2
		c := newCapsule(a, b, reach*rng.Float64())
		i0, j0, nx, ny := int(math.Floor((a.X-8)/cellM)), int(math.Floor((a.Y-8)/cellM)), int(16/cellM), int(16/cellM)
		if trial%4 == 0 {
			i0, nx = int(math.Floor(a.X/cellM)), 3
		}
		covered := make([]bool, nx*ny)
		got := markInner(&c, reach, cellM, i0, j0, nx, ny, covered, nil)
		mlo, mhi := innerRows(a, b, reach, cellM, j0, ny)
		if len(got) != 2*max(mhi-mlo+1, 0) {
			t.Fatalf("trial %d: %d numbers for rows %d to %d", trial, len(got), mlo, mhi)
		}
		for j := mlo; j <= mhi; j++ {
			l, r := 1, 0
			if xl, xr, ok := c.row((float64(j) + 0.5) * cellM); ok {
				l, r = int(math.Ceil(xl/cellM-0.5)), int(math.Floor(xr/cellM-0.5))
			}
			if g := got[2*(j-mlo):]; g[0] != l || g[1] != r {
				t.Fatalf("trial %d row %d: cells %d to %d, want %d to %d", trial, j, g[0], g[1], l, r)
			}
			for i := i0; i < i0+nx; i++ {
				if covered[(j-j0)*nx+i-i0] != (i >= l && i <= r) {
					t.Fatalf("trial %d row %d: cell %d marked %v", trial, j, i, covered[(j-j0)*nx+i-i0])
				}
			}
		}
	}
}
