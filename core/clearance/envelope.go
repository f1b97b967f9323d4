package clearance

import (
	"errors"
	"math"

	"gonum.org/v1/gonum/mathext"
)

// Envelope is the area seen from above that the load sweeps in a chosen
// share of a set of runs, on a grid of square cells.
//
// The runs are ranked by how far they stray from the nominal path (the
// largest distance of any of their points from it); the envelope at level
// p is the union of the areas swept by the k = ceil(p*N) runs that stray
// least. In k of the N runs the load stays inside it, by construction.
// The share of all possible runs that stay inside (its coverage) is itself
// uncertain with N runs: with the runs drawn independently, the coverage
// of the k-th smallest of N scores follows a Beta(k, N+1-k) distribution
// whatever the scores' own distribution (distribution-free tolerance
// limits; Wilks, "Determination of sample sizes for setting tolerance
// limits", Ann. Math. Statist. 12, 1941; from memory), which gives
// Confidence.
//
// A cell is marked when any part of it is within the load's radius of a
// run's path, so the cells drawn cover the swept area (they overstate it
// by at most one cell's diagonal).
type Envelope struct {
	Level   float64 // p
	Runs    int     // N
	Inside  int     // k
	StrayM  float64 // the k-th smallest stray: the envelope's own
	X0M     float64 // the grid's lower left corner, I0*CellM, J0*CellM
	Y0M     float64
	I0, J0  int // the lattice index of the grid's lower left cell
	CellM   float64
	NX, NY  int
	Covered []bool // NX*NY cells, row by row from Y0M
	// Members are the indices of the runs inside, least straying first.
	Members []int
	// Confidence is the probability that the envelope's coverage of all
	// possible runs is at least Level: 1 - I_p(k, N+1-k).
	Confidence float64
}

// PlanPath is one run's path of the load seen from above, with the radius
// of the load around it.
type PlanPath struct {
	Points  []Point2
	RadiusM float64
	// Outlines, when set, are a rigid load's outline seen from above at
	// each point (the convex hull of its box's corners): the envelope then
	// sweeps these outlines rather than a ball.
	Outlines [][]Point2
}

// Stray is the largest distance of the path's points from the nominal
// path, taken as straight between its points.
func Stray(run, nominal []Point2) float64 { return newNearest(nominal).stray(run) }

// nearest finds the distance from a point to a polyline with a uniform
// grid of buckets: each segment is listed in the buckets its bounding box
// meets, and the search widens ring by ring until no unsearched bucket
// can hold a nearer segment, so the answer is exact.
type nearest struct {
	pts       []Point2
	x0, y0, g float64
	nx, ny    int
	bucket    [][]int32
	single    bool
}

func newNearest(poly []Point2) *nearest {
	n := &nearest{pts: poly, single: len(poly) == 1}
	if n.single {
		return n
	}
	lo, hi := poly[0], poly[0]
	length := 0.0
	for i, p := range poly {
		lo.X, lo.Y, hi.X, hi.Y = min(lo.X, p.X), min(lo.Y, p.Y), max(hi.X, p.X), max(hi.Y, p.Y)
		if i > 0 {
			length += math.Hypot(p.X-poly[i-1].X, p.Y-poly[i-1].Y)
		}
	}
	// About four segments' length per bucket, and at most 256 a side.
	n.g = max(4*length/float64(len(poly)), (hi.X-lo.X)/256, (hi.Y-lo.Y)/256, 1e-3)
	n.x0, n.y0 = lo.X, lo.Y
	n.nx = int((hi.X-lo.X)/n.g) + 1
	n.ny = int((hi.Y-lo.Y)/n.g) + 1
	n.bucket = make([][]int32, n.nx*n.ny)
	for i := 0; i+1 < len(poly); i++ {
		a, b := poly[i], poly[i+1]
		i0, j0 := n.cell(min(a.X, b.X), min(a.Y, b.Y))
		i1, j1 := n.cell(max(a.X, b.X), max(a.Y, b.Y))
		for j := j0; j <= j1; j++ {
			for k := i0; k <= i1; k++ {
				n.bucket[j*n.nx+k] = append(n.bucket[j*n.nx+k], int32(i))
			}
		}
	}
	return n
}

func (n *nearest) cell(x, y float64) (int, int) {
	i := min(max(int((x-n.x0)/n.g), 0), n.nx-1)
	j := min(max(int((y-n.y0)/n.g), 0), n.ny-1)
	return i, j
}

// dist2 is the squared distance from p to the polyline.
func (n *nearest) dist2(p Point2) float64 {
	d, _ := n.closest(p)
	return d
}

// closest is the squared distance from p to the polyline and the first
// segment at that distance (0 for a single point).
func (n *nearest) closest(p Point2) (float64, int) {
	if n.single {
		dx, dy := p.X-n.pts[0].X, p.Y-n.pts[0].Y
		return dx*dx + dy*dy, 0
	}
	ci, cj := n.cell(p.X, p.Y)
	// Distance from p to the grid's box, for points outside it.
	ox := outsideBy(p.X, n.x0, n.x0+float64(n.nx)*n.g)
	oy := outsideBy(p.Y, n.y0, n.y0+float64(n.ny)*n.g)
	outside := 0.0
	if ox != 0 || oy != 0 {
		outside = math.Hypot(ox, oy)
	}
	best, seg := math.Inf(1), 0
	for ring := 0; ; ring++ {
		// Every bucket not yet searched is at least ring-1 buckets from
		// p's own along some axis, and no nearer than the grid's box.
		reach := outside
		if r := float64(ring-1) * n.g; r > reach {
			reach = r
		}
		if ring > 0 && reach > 0 && reach*reach >= best {
			return best, seg
		}
		// Nearer: every bucket not yet searched lies beyond the square of
		// rings searched, whose sides are at p's own cell's edges plus
		// ring-1 cells (a side at the grid's edge has nothing beyond).
		// Less a rounding allowance (a segment's cells come from a
		// division), and strictly, so no segment as near is left out.
		if ring > 0 {
			if wall := n.wall(p, ci, cj, ring-1) - 1e-9*n.g; wall > 0 && wall*wall > best {
				return best, seg
			}
		}
		if ring > n.nx && ring > n.ny {
			return best, seg
		}
		// The ring's buckets: its top and bottom rows whole, its sides
		// between (the order does not matter: ties go to the first
		// segment).
		if ring == 0 {
			best, seg = n.look(p, ci, cj, best, seg)
			continue
		}
		for i := max(ci-ring, 0); i <= min(ci+ring, n.nx-1); i++ {
			best, seg = n.look(p, i, cj-ring, best, seg)
			best, seg = n.look(p, i, cj+ring, best, seg)
		}
		for j := max(cj-ring+1, 0); j <= min(cj+ring-1, n.ny-1); j++ {
			best, seg = n.look(p, ci-ring, j, best, seg)
			best, seg = n.look(p, ci+ring, j, best, seg)
		}
	}
}

// wall is the distance from p to the nearest side of the square of
// buckets within r of (ci, cj) beyond which the grid has buckets
// (+Inf when it has none beyond any side).
func (n *nearest) wall(p Point2, ci, cj, r int) float64 {
	w := math.Inf(1)
	if ci+r+1 < n.nx {
		w = n.x0 + float64(ci+r+1)*n.g - p.X
	}
	if ci-r-1 >= 0 {
		if v := p.X - (n.x0 + float64(ci-r)*n.g); v < w {
			w = v
		}
	}
	if cj+r+1 < n.ny {
		if v := n.y0 + float64(cj+r+1)*n.g - p.Y; v < w {
			w = v
		}
	}
	if cj-r-1 >= 0 {
		if v := p.Y - (n.y0 + float64(cj-r)*n.g); v < w {
			w = v
		}
	}
	return w
}

// look searches bucket (i, j) for a segment nearer p than best (or as
// near with a lower index than seg), when the bucket is on the grid.
func (n *nearest) look(p Point2, i, j int, best float64, seg int) (float64, int) {
	if i < 0 || i >= n.nx || j < 0 || j >= n.ny {
		return best, seg
	}
	for _, s := range n.bucket[j*n.nx+i] {
		if d := pointSegmentDist2(p, n.pts[s], n.pts[s+1]); d < best || (d == best && int(s) < seg) {
			best, seg = d, int(s)
		}
	}
	return best, seg
}

// outsideBy is how far x lies outside [lo, hi] (zero inside), with
// comparisons rather than max (a call in wasm).
func outsideBy(x, lo, hi float64) float64 {
	if x < lo {
		return lo - x
	}
	if x > hi {
		return x - hi
	}
	return 0
}

// strayEvery is stray finding every point's distance: the plain form,
// kept to check stray against.
func (n *nearest) strayEvery(run []Point2) float64 {
	worst := 0.0
	for _, p := range run {
		worst = max(worst, n.dist2(p))
	}
	return math.Sqrt(worst)
}

// NewEnvelope builds the envelope at level (0 < level <= 1) of the runs
// on cells of cellM (positive). It is an error to give no runs, a run
// with no points, or a level or cell size out of range.
func NewEnvelope(runs []PlanPath, nominal []Point2, level, cellM float64) (*Envelope, error) {
	if len(runs) == 0 || len(nominal) == 0 {
		return nil, errors.New("clearance: an envelope needs at least one run and the nominal path")
	}
	if !(level > 0 && level <= 1) || !(cellM > 0) || !finite(cellM) {
		return nil, errors.New("clearance: the level must be above 0 and at most 1, the cell size positive")
	}
	strays, err := Strays(runs, nominal)
	if err != nil {
		return nil, err
	}
	return newEnvelope(runs, strays, level, 0, cellM)
}

// Strays is each run's Stray from the nominal path.
func Strays(runs []PlanPath, nominal []Point2) ([]float64, error) {
	if len(nominal) == 0 {
		return nil, errors.New("clearance: an envelope needs the nominal path")
	}
	near := newNearest(nominal)
	out := make([]float64, len(runs))
	for i, r := range runs {
		if len(r.Points) == 0 {
			return nil, errors.New("clearance: a run has no points")
		}
		out[i] = near.stray(r.Points)
	}
	return out, nil
}

// newEnvelope is NewEnvelope with each run's stray given.
// With conf above zero it holds more runs where needed, the fewest k for
// which the confidence that its coverage is at least level reaches conf
// (all N when none does).
func newEnvelope(runs []PlanPath, strays []float64, level, conf, cellM float64) (*Envelope, error) {
	order, k := keep(strays, level, conf)
	n := len(runs)
	e := &Envelope{Level: level, Runs: n, Inside: k, StrayM: strays[order[k-1]], CellM: cellM}
	e.Confidence = CoverageConfidence(k, n, level)
	e.Members = append([]int(nil), order[:k]...)

	// The grid is a window on the lattice of cells [I*cellM, (I+1)*cellM)
	// shared by every envelope of this cell size, wide enough that no
	// cell a run marks falls outside it (see latticeRange); so the cells
	// marked do not depend on which runs share the grid.
	i0, i1, j0, j1 := math.MaxInt, math.MinInt, math.MaxInt, math.MinInt
	for _, i := range order[:k] {
		a0, a1, b0, b1 := runs[i].latticeBox(cellM)
		i0, i1, j0, j1 = min(i0, a0), max(i1, a1), min(j0, b0), max(j1, b1)
	}
	e.I0, e.J0 = i0, j0
	e.X0M, e.Y0M = float64(i0)*cellM, float64(j0)*cellM
	e.NX, e.NY = i1-i0+1, j1-j0+1
	if e.NX <= 0 || e.NY <= 0 || e.NX*e.NY > maxCells {
		return nil, errors.New("clearance: the envelope would need more than 4 million cells: use larger cells")
	}
	e.Covered = make([]bool, e.NX*e.NY)
	for _, i := range order[:k] {
		e.sweep(runs[i])
	}
	return e, nil
}

const maxCells = 4 << 20

// sweep marks every cell the run's load comes over.
func (e *Envelope) sweep(r PlanPath) { r.sweepLattice(e.CellM, e.I0, e.J0, e.NX, e.NY, e.Covered) }

// latticeBox is the range of lattice indices (i0 to i1 across, j0 to j1
// up) whose cells the run can mark.
func (r *PlanPath) latticeBox(cellM float64) (i0, i1, j0, j1 int) {
	lo, hi := Point2{math.Inf(1), math.Inf(1)}, Point2{math.Inf(-1), math.Inf(-1)}
	reach := 0.0
	if r.Outlines == nil {
		reach = r.RadiusM + cellM*math.Sqrt2/2
		for _, p := range r.Points {
			lo.X, lo.Y, hi.X, hi.Y = math.Min(lo.X, p.X), math.Min(lo.Y, p.Y), math.Max(hi.X, p.X), math.Max(hi.Y, p.Y)
		}
	}
	for _, o := range r.Outlines {
		for _, p := range o {
			lo.X, lo.Y, hi.X, hi.Y = math.Min(lo.X, p.X), math.Min(lo.Y, p.Y), math.Max(hi.X, p.X), math.Max(hi.Y, p.Y)
		}
	}
	i0, i1 = latticeRange(lo.X, hi.X, reach, cellM)
	j0, j1 = latticeRange(lo.Y, hi.Y, reach, cellM)
	return i0, i1, j0, j1
}

// latticeRange is the range of lattice indices, from i0 to i1, whose
// cells can come within reach of coordinates from lo to hi: a cell
// [I*c, (I+1)*c) marked has its centre (I+1/2)*c within reach, or meets
// [lo, hi] itself; one more cell each side keeps the rounding of the
// division inside.
func latticeRange(lo, hi, reach, cellM float64) (int, int) {
	return int(math.Floor((lo-reach)/cellM)) - 1, int(math.Floor((hi+reach)/cellM)) + 1
}

// sweepLattice marks the cells of the lattice the run's load comes over
// on the grid of nx by ny cells whose lower left cell has the lattice
// index (i0, j0) (covered, row by row); cells off the grid are left out.
// A ball of radius RadiusM about the points, taken as straight between
// them: a cell is marked when its centre ((I+1/2)*cellM, (J+1/2)*cellM)
// is within the radius plus half the cell's diagonal of a piece (see
// sweepGroups, which marks the cells well inside at once and tests only
// those near the edge). Outlines: see sweepOutlines.
func (r *PlanPath) sweepLattice(cellM float64, i0, j0, nx, ny int, covered []bool) {
	if r.Outlines != nil {
		sweepOutlines(r.Outlines, cellM, i0, j0, nx, ny, covered)
		return
	}
	sweepGroups(r.Points, r.RadiusM+cellM*math.Sqrt2/2, cellM, i0, j0, nx, ny, covered)
}

// sweepBallCells is sweepLattice for a ball, cell by cell: the plain form
// of sweepCapsules, kept to check it against.
func sweepBallCells(points []Point2, reach, cellM float64, i0, j0, nx, ny int, covered []bool) {
	reach2 := reach * reach
	piece := func(a, b Point2) {
		lo, hi := latticeRange(math.Min(a.X, b.X), math.Max(a.X, b.X), reach, cellM)
		jlo, jhi := latticeRange(math.Min(a.Y, b.Y), math.Max(a.Y, b.Y), reach, cellM)
		for j := max(jlo, j0); j <= min(jhi, j0+ny-1); j++ {
			cy := (float64(j) + 0.5) * cellM
			base := (j-j0)*nx - i0
			for i := max(lo, i0); i <= min(hi, i0+nx-1); i++ {
				if covered[base+i] {
					continue
				}
				if pointSegmentDist2(Point2{(float64(i) + 0.5) * cellM, cy}, a, b) <= reach2 {
					covered[base+i] = true
				}
			}
		}
	}
	if len(points) == 1 {
		piece(points[0], points[0])
	}
	for i := 0; i+1 < len(points); i++ {
		piece(points[i], points[i+1])
	}
}

// AreaM2 is the area of the cells covered.
func (e *Envelope) AreaM2() float64 {
	n := 0
	for _, c := range e.Covered {
		if c {
			n++
		}
	}
	return float64(n) * e.CellM * e.CellM
}

// Contains reports whether the cell holding p is covered.
func (e *Envelope) Contains(p Point2) bool {
	i := int(math.Floor(p.X/e.CellM)) - e.I0
	j := int(math.Floor(p.Y/e.CellM)) - e.J0
	return i >= 0 && j >= 0 && i < e.NX && j < e.NY && e.Covered[j*e.NX+i]
}

// Span is a run of covered cells along one row, for drawing: the
// rectangle from (X0M, Y0M) to (X1M, Y1M).
type Span struct{ X0M, Y0M, X1M, Y1M float64 }

// Spans lists the covered cells as row runs.
func (e *Envelope) Spans() []Span {
	var out []Span
	for j := 0; j < e.NY; j++ {
		for i := 0; i < e.NX; {
			if !e.Covered[j*e.NX+i] {
				i++
				continue
			}
			start := i
			for i < e.NX && e.Covered[j*e.NX+i] {
				i++
			}
			out = append(out, latticeSpan(e.J0+j, e.I0+start, e.I0+i, e.CellM))
		}
	}
	return out
}

// latticeSpan is the rectangle of lattice cells i0 to i1-1 in row j.
func latticeSpan(j, i0, i1 int, cellM float64) Span {
	return Span{float64(i0) * cellM, float64(j) * cellM, float64(i1) * cellM, float64(j+1) * cellM}
}

// CoverageConfidence is the probability that the k-th smallest of n
// independent scores has a coverage (the probability that one more run
// scores no more) of at least p: 1 - I_p(k, n+1-k) (see Envelope).
func CoverageConfidence(k, n int, p float64) float64 {
	if k < 1 || k > n {
		return 0
	}
	return 1 - mathext.RegIncBeta(float64(k), float64(n+1-k), p)
}

// ShareLowerBound is the one-sided lower confidence bound, at confidence
// conf (for example 0.95), on the probability of an outcome seen in m of
// n independent runs: the Clopper-Pearson bound B^-1(1 - conf; m, n-m+1)
// (Clopper & Pearson, "The use of confidence or fiducial limits
// illustrated in the case of the binomial", Biometrika 26, 1934; from
// memory). Zero when m is zero.
func ShareLowerBound(m, n int, conf float64) float64 {
	if m <= 0 || n <= 0 {
		return 0
	}
	if m > n {
		m = n
	}
	return mathext.InvRegIncBeta(float64(m), float64(n-m+1), 1-conf)
}
