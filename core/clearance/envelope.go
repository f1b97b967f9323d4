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
			lo.X, lo.Y, hi.X, hi.Y = lower(lo.X, p.X), lower(lo.Y, p.Y), upper(hi.X, p.X), upper(hi.Y, p.Y)
		}
	}
	for _, o := range r.Outlines {
		for _, p := range o {
			lo.X, lo.Y, hi.X, hi.Y = lower(lo.X, p.X), lower(lo.Y, p.Y), upper(hi.X, p.X), upper(hi.Y, p.Y)
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
	r.sweepLatticeInto(cellM, i0, j0, nx, ny, covered, new(scratch))
}

// sweepLatticeInto is sweepLattice with what the sweep needs meanwhile
// in sc's memory.
func (r *PlanPath) sweepLatticeInto(cellM float64, i0, j0, nx, ny int, covered []bool, sc *scratch) {
	if r.Outlines != nil {
		sweepOutlines(r.Outlines, cellM, i0, j0, nx, ny, covered)
		return
	}
	sweepGroupsInto(r.Points, r.RadiusM+cellM*math.Sqrt2/2, cellM, i0, j0, nx, ny, covered, sc)
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
