package clearance

import "math"

// sweepGroups marks the cells sweepBallCells marks (a cell whose centre is
// within reach of a piece of the path), with far fewer tests on paths of
// many short pieces (a simulated run: hundreds of samples a few cm apart,
// a ball of a metre or more, where sweepCapsules worked out the same row
// of cells again for every piece).
//
// The path is cut into groups of consecutive points that stay within δ of
// the chord q from the group's first point to its last (at most
// 33 points, δ at most a quarter cell). Then:
//
//   - Every point within reach-δ of q is within reach of the group's
//     pieces: the path runs from one end of q to the other, so its
//     projection on q's line passes every point of q, at a distance of at
//     most δ from it. The cells whose centres are that close (less a
//     micrometre, far above the rounding) are marked row by row at once
//     (capsule.row), with no test.
//   - Every point within reach of a piece is within reach+δ of q (each
//     piece's points are within δ of q: the distance to a segment is
//     convex along a piece). Only the cells of that wider capsule not yet
//     marked are tested, each with the test sweepBallCells makes
//     (pointSegmentDist2 against reach²) on the group's pieces.
//
// So a cell is marked exactly when the cell by cell sweep marks it
// (TestGroupSweepMatchesCellSweep), and the tests are left to a band
// about δ wide on either side of the envelope's edge. All groups' sure
// cells are marked first, so the band's cells that another group covers
// are not tested.
func sweepGroups(points []Point2, reach, cellM float64, i0, j0, nx, ny int, covered []bool) {
	sweepGroupsInto(points, reach, cellM, i0, j0, nx, ny, covered, new(scratch))
}

// sweepGroupsInto is sweepGroups with its groups, and the inner
// capsules' cells of each row that the first pass goes over (sc.inner,
// see markInner), in sc's memory: the second pass reads them there
// rather than working each row out again (in wasm the rows were a third
// of the sweep's time, node --cpu-prof of clearance_part).
func sweepGroupsInto(points []Point2, reach, cellM float64, i0, j0, nx, ny int, covered []bool, sc *scratch) {
	if len(points) == 0 || nx <= 0 || ny <= 0 {
		return
	}
	groups := pathGroupsInto(points, cellM/4, sc.groups[:0])
	sc.groups = groups
	const sure = 1e-6 // m, kept off each side of the exact boundary
	in := sc.inner[:0]
	for k := range groups {
		g := &groups[k]
		g.at = len(in)
		if rin := reach - g.dev - 2*sure; rin > 0 {
			c := newCapsule(points[g.first], points[g.last], rin)
			in = markInner(&c, reach, cellM, i0, j0, nx, ny, covered, in)
		}
	}
	sc.inner = in
	reach2 := reach * reach
	for _, g := range groups {
		a, b := points[g.first], points[g.last]
		outer := newCapsule(a, b, reach+g.dev+sure)
		rin := reach - g.dev - 2*sure
		inner := newCapsule(a, b, max(rin, 0))
		mlo, mhi := innerRows(a, b, reach, cellM, j0, ny)
		jlo, jhi := latticeRange(lower(a.Y, b.Y), upper(a.Y, b.Y), reach+g.dev+sure, cellM)
		for j := max(jlo, j0); j <= min(jhi, j0+ny-1); j++ {
			cy := (float64(j) + 0.5) * cellM
			xl, xr, ok := outer.row(cy)
			if !ok {
				continue
			}
			// Only the cells whose centres are in the wider capsule: one
			// beyond it is more than reach+δ from q (less the rounding of
			// the interval, far below the micrometre kept off), so more
			// than reach from every piece. (A cell more each side, tested
			// as well, was three in four of the tests, each failing.)
			l := max(int(math.Ceil(xl/cellM-0.5)), i0)
			r := min(int(math.Floor(xr/cellM-0.5)), i0+nx-1)
			// The cells marked in the first pass are skipped: as it
			// found them in its rows, as the inner capsule gives them in
			// the others.
			il, ir := r+1, r
			if rin > 0 {
				if j >= mlo && j <= mhi {
					k := g.at + 2*(j-mlo)
					il, ir = in[k], in[k+1]
				} else if xl, xr, ok := inner.row(cy); ok {
					il, ir = int(math.Ceil(xl/cellM-0.5)), int(math.Floor(xr/cellM-0.5))
				}
			}
			row := covered[(j-j0)*nx : (j-j0+1)*nx]
			for i := l; i <= r; i++ {
				if i >= il && i <= ir {
					i = ir
					continue
				}
				if row[i-i0] {
					continue
				}
				cx := (float64(i) + 0.5) * cellM
				if g.first == g.last {
					row[i-i0] = pointSegmentDist2(Point2{cx, cy}, a, a) <= reach2
					continue
				}
				// pointSegmentDist2 of each piece till one is within
				// reach, inlined.
				for k := g.first; k < g.last; k++ {
					p, q := points[k], points[k+1]
					if segDist2(cx-p.X, cy-p.Y, q.X-p.X, q.Y-p.Y) <= reach2 {
						row[i-i0] = true
						break
					}
				}
			}
		}
	}
}

// groupPieces is the most pieces (points less one) a group holds.
const groupPieces = 32

// pathGroup is the points first to last of a path (each group's last
// point is the next one's first) and how far they stray from the chord
// between its ends.
type pathGroup struct {
	_           [0]func() // not comparable: no equality function (page wasm size)
	first, last int
	dev         float64
	at          int // where its inner capsule's rows start in scratch.inner
}

// pathGroupsInto cuts the path into groups whose points are within devM
// of their chords, appended to out; a group of one point is a path of one
// point.
func pathGroupsInto(points []Point2, devM float64, out []pathGroup) []pathGroup {
	if len(points) == 1 {
		return append(out, pathGroup{})
	}
	for s := 0; s+1 < len(points); {
		// Groups of 2, 3, 5, 9, 17 or 33 points: the longest that keeps
		// to devM, found with a few looks at each point.
		g := pathGroup{first: s, last: s + 1}
		for w := 2; w <= groupPieces && s+w < len(points); w *= 2 {
			d := chordDev(points, s, s+w)
			if d > devM {
				break
			}
			g.last, g.dev = s+w, d
		}
		out = append(out, g)
		s = g.last
	}
	return out
}

// chordDev is the largest distance of points s to e from the segment
// between the two: pointSegmentDist2 with the segment's run worked out
// once and segDist2 inlined (in wasm the call a point was most of
// chordDev's time; chordDevEvery in the tests is the plain form).
func chordDev(points []Point2, s, e int) float64 {
	a, b := points[s], points[e]
	dx, dy := b.X-a.X, b.Y-a.Y
	d2 := 0.0
	for _, p := range points[s+1 : e] {
		d2 = upper(d2, segDist2(p.X-a.X, p.Y-a.Y, dx, dy))
	}
	return math.Sqrt(d2)
}

// innerRows is the rows, mlo to mhi, that markInner goes over for the
// capsule about the segment ab (within reach of it, on the grid's ny
// rows from j0).
func innerRows(a, b Point2, reach, cellM float64, j0, ny int) (mlo, mhi int) {
	jlo, jhi := latticeRange(lower(a.Y, b.Y), upper(a.Y, b.Y), reach, cellM)
	return max(jlo, j0), min(jhi, j0+ny-1)
}

// markInner marks the cells whose centres are in the capsule, row by row
// over the rows within reach of its segment (innerRows), and appends
// each row's first and last such cell to in (off the grid too; 1 and 0
// for a row the capsule misses): the cells capsule.row gives, rounded to
// cells as sweepGroups rounds them (TestMarkInnerIsTheRows).
func markInner(c *capsule, reach, cellM float64, i0, j0, nx, ny int, covered []bool, in []int) []int {
	mlo, mhi := innerRows(c.a, c.b, reach, cellM, j0, ny)
	for j := mlo; j <= mhi; j++ {
		cy := (float64(j) + 0.5) * cellM
		xl, xr, ok := c.row(cy)
		if !ok {
			in = append(in, 1, 0)
			continue
		}
		il, ir := int(math.Ceil(xl/cellM-0.5)), int(math.Floor(xr/cellM-0.5))
		in = append(in, il, ir)
		if l, r := max(il, i0), min(ir, i0+nx-1); l <= r {
			fillTrue(covered[(j-j0)*nx+l-i0 : (j-j0)*nx+r-i0+1])
		}
	}
	return in
}
