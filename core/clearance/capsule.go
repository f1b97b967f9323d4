package clearance

import "math"

// A ball of radius R moving straight from a to b sweeps a capsule: the
// points within R of the segment ab. The distance from a point to a
// segment is a convex function of the point (the distance to a convex
// set), so the points of one row of cell centres (y = cy) within R of ab
// are one interval of x. It is the union of three intervals: the two end
// discs, |x - a.x| <= sqrt(R^2 - (cy - a.y)^2) and the same about b, and
// the band between them, where the point's projection falls on the
// segment, 0 <= (p-a).d <= |d|^2, and its distance across it is at most
// R, |d x (p-a)| <= R|d| (d = b - a): each condition is linear in x.
//
// sweepCapsules marks, row by row, the cells of that interval, so each
// piece costs a few tests per row instead of one per cell. The interval's
// end cells are settled with the same test the cell by cell sweep
// (sweepBallCells) makes on each cell, pointSegmentDist2 against reach^2:
// the cells marked are the cells that sweep marks
// (TestCapsuleSweepMatchesCellSweep), as long as the interval and the
// test, each exact to within a few units in the last place, agree to
// within a cell.

// sweepCapsules is sweepBallCells marking each row's interval at once.
// The interval found, cells l to r (those whose centres are in the
// capsule a nanometre wider), holds the cells that pass the test and is
// within a cell of them at each end (the two differ only by rounding and
// the nanometre): the cells from l+1 to r-1 are marked, and each of l and
// r not yet marked is tested.
func sweepCapsules(points []Point2, reach, cellM float64, i0, j0, nx, ny int, covered []bool) {
	reach2 := reach * reach
	piece := func(a, b Point2) {
		lo, hi := latticeRange(math.Min(a.X, b.X), math.Max(a.X, b.X), reach, cellM)
		jlo, jhi := latticeRange(math.Min(a.Y, b.Y), math.Max(a.Y, b.Y), reach, cellM)
		lo, hi = max(lo, i0), min(hi, i0+nx-1)
		if lo > hi {
			return
		}
		seg := newCapsule(a, b, reach)
		for j := max(jlo, j0); j <= min(jhi, j0+ny-1); j++ {
			cy := (float64(j) + 0.5) * cellM
			row := covered[(j-j0)*nx : (j-j0+1)*nx]
			xl, xr, ok := seg.row(cy)
			if !ok {
				continue
			}
			l := max(int(math.Ceil(xl/cellM-0.5)), lo-1)
			r := min(int(math.Floor(xr/cellM-0.5)), hi+1)
			if m0, m1 := max(l+1, lo), min(r-1, hi); m0 <= m1 {
				fillTrue(row[m0-i0 : m1-i0+1])
			}
			test := func(i int) {
				if i >= lo && i <= hi && !row[i-i0] &&
					pointSegmentDist2(Point2{(float64(i) + 0.5) * cellM, cy}, a, b) <= reach2 {
					row[i-i0] = true
				}
			}
			test(l)
			test(r)
		}
	}
	if len(points) == 1 {
		piece(points[0], points[0])
	}
	for i := 0; i+1 < len(points); i++ {
		piece(points[i], points[i+1])
	}
}

// capsule is the segment ab with radius R, with what each row needs.
type capsule struct {
	a, b       Point2
	dx, dy, l2 float64
	R2, rl     float64
	hasBand    bool
}

// newCapsule takes the radius a nanometre wider, so that the intervals
// found hold every cell the test passes (rounding aside) and a row found
// empty has none.
func newCapsule(a, b Point2, R float64) capsule {
	R += 1e-9
	c := capsule{a: a, b: b, dx: b.X - a.X, dy: b.Y - a.Y, R2: R * R}
	c.l2 = c.dx*c.dx + c.dy*c.dy
	c.rl = R * math.Sqrt(c.l2)
	c.hasBand = c.l2 > 0
	return c
}

// row is the interval [xl, xr] of x on the line y = cy within R of the
// segment ab (see above); ok is false when the line misses it.
func (c *capsule) row(cy float64) (xl, xr float64, ok bool) {
	// Plain comparisons rather than min and max: in wasm those are calls
	// (for NaN and the sign of zero, neither of which arises here).
	xl, xr = math.Inf(1), math.Inf(-1)
	if h := c.R2 - (cy-c.a.Y)*(cy-c.a.Y); h >= 0 {
		w := math.Sqrt(h)
		xl, xr = c.a.X-w, c.a.X+w
	}
	if h := c.R2 - (cy-c.b.Y)*(cy-c.b.Y); h >= 0 {
		w := math.Sqrt(h)
		if x := c.b.X - w; x < xl {
			xl = x
		}
		if x := c.b.X + w; x > xr {
			xr = x
		}
	}
	if !c.hasBand {
		return xl, xr, xl <= xr
	}
	// u = x - a.x, py = cy - a.y: dx*u in [-py*dy, l2 - py*dy] and
	// -dy*u in [-rl - dx*py, rl - dx*py].
	py := cy - c.a.Y
	ul, ur := math.Inf(-1), math.Inf(1)
	if m1, m2 := -py*c.dy, c.l2-py*c.dy; c.dx > 0 {
		ul, ur = m1/c.dx, m2/c.dx
	} else if c.dx < 0 {
		ul, ur = m2/c.dx, m1/c.dx
	} else if m1 > 0 || m2 < 0 {
		return xl, xr, xl <= xr
	}
	if m1, m2 := -c.rl-c.dx*py, c.rl-c.dx*py; c.dy != 0 {
		lo, hi := m1/-c.dy, m2/-c.dy
		if c.dy > 0 {
			lo, hi = hi, lo
		}
		if lo > ul {
			ul = lo
		}
		if hi < ur {
			ur = hi
		}
	} else if m1 > 0 || m2 < 0 {
		return xl, xr, xl <= xr
	}
	if ul <= ur {
		if x := c.a.X + ul; x < xl {
			xl = x
		}
		if x := c.a.X + ur; x > xr {
			xr = x
		}
	}
	return xl, xr, xl <= xr
}

// trues is a row of marked cells to copy from.
var trues [256]bool

func init() {
	for i := range trues {
		trues[i] = true
	}
}

// fillTrue marks every cell of row.
func fillTrue(row []bool) {
	for len(row) > 0 {
		row = row[copy(row, trues[:]):]
	}
}
