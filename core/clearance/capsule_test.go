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
