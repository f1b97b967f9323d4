package clearance

import "math"

// sweepOutlines marks every cell that a rigid load's outline touches as it
// moves: between two samples the outline is taken as swept over the
// convex hull of its two positions, which is exactly the area a convex
// outline sweeps moving straight without turning (and holds both ends of
// the sweep when it turns a little between samples).
// The cells are those of the lattice (see PlanPath.sweepLattice).
func sweepOutlines(outlines [][]Point2, cellM float64, i0, j0, nx, ny int, covered []bool) {
	if len(outlines) == 1 {
		fillConvex(outlines[0], cellM, i0, j0, nx, ny, covered)
	}
	var pair []Point2
	for i := 0; i+1 < len(outlines); i++ {
		pair = append(append(pair[:0], outlines[i]...), outlines[i+1]...)
		fillConvex(Hull(pair), cellM, i0, j0, nx, ny, covered)
	}
}

// fillConvex marks every cell that the convex polygon touches: on each
// row of cells, the polygon's part in the row's band of y is convex, so
// the cells it touches are those whose x range meets that part's x range
// (found from the corners inside the band and the edges' crossings of its
// two lines).
func fillConvex(poly []Point2, cellM float64, gi0, gj0, nx, ny int, covered []bool) {
	if len(poly) == 0 {
		return
	}
	ylo, yhi := math.Inf(1), math.Inf(-1)
	for _, p := range poly {
		ylo, yhi = math.Min(ylo, p.Y), math.Max(yhi, p.Y)
	}
	j0 := max(int(math.Floor(ylo/cellM)), gj0)
	j1 := min(int(math.Floor(yhi/cellM)), gj0+ny-1)
	for j := j0; j <= j1; j++ {
		y0 := float64(j) * cellM
		y1 := float64(j+1) * cellM
		xlo, xhi := math.Inf(1), math.Inf(-1)
		take := func(x float64) { xlo, xhi = math.Min(xlo, x), math.Max(xhi, x) }
		n := len(poly)
		for k, a := range poly {
			if a.Y >= y0 && a.Y <= y1 {
				take(a.X)
			}
			b := poly[(k+1)%n]
			for _, y := range []float64{y0, y1} {
				if (a.Y-y)*(b.Y-y) < 0 {
					take(a.X + (y-a.Y)*(b.X-a.X)/(b.Y-a.Y))
				}
			}
		}
		if xlo > xhi {
			continue
		}
		i0 := max(int(math.Floor(xlo/cellM)), gi0)
		i1 := min(int(math.Floor(xhi/cellM)), gi0+nx-1)
		for i := i0; i <= i1; i++ {
			covered[(j-gj0)*nx+i-gi0] = true
		}
	}
}
