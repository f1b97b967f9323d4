package clearance

import (
	"errors"
	"math"
	"sort"

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
	X0M     float64 // the grid's lower left corner
	Y0M     float64
	CellM   float64
	NX, NY  int
	Covered []bool // NX*NY cells, row by row from Y0M
	// Confidence is the probability that the envelope's coverage of all
	// possible runs is at least Level: 1 - I_p(k, N+1-k).
	Confidence float64
}

// PlanPath is one run's path of the load seen from above, with the radius
// of the load around it.
type PlanPath struct {
	Points  []Point2
	RadiusM float64
}

// Stray is the largest distance of the path's points from the nominal
// path, taken as straight between its points.
func Stray(run, nominal []Point2) float64 {
	worst := 0.0
	for _, p := range run {
		d := math.Inf(1)
		if len(nominal) == 1 {
			d = math.Hypot(p.X-nominal[0].X, p.Y-nominal[0].Y)
		}
		for i := 0; i+1 < len(nominal); i++ {
			d = math.Min(d, pointSegmentDistance(p, nominal[i], nominal[i+1]))
		}
		worst = math.Max(worst, d)
	}
	return worst
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
	type scored struct {
		i     int
		stray float64
	}
	rank := make([]scored, len(runs))
	for i, r := range runs {
		if len(r.Points) == 0 {
			return nil, errors.New("clearance: a run has no points")
		}
		rank[i] = scored{i, Stray(r.Points, nominal)}
	}
	sort.SliceStable(rank, func(a, b int) bool { return rank[a].stray < rank[b].stray })
	n := len(runs)
	k := int(math.Ceil(level*float64(n) - 1e-9))
	if k < 1 {
		k = 1
	}
	e := &Envelope{Level: level, Runs: n, Inside: k, StrayM: rank[k-1].stray, CellM: cellM}
	e.Confidence = CoverageConfidence(k, n, level)

	lo, hi := Point2{math.Inf(1), math.Inf(1)}, Point2{math.Inf(-1), math.Inf(-1)}
	for _, s := range rank[:k] {
		r := runs[s.i]
		for _, p := range r.Points {
			lo.X, lo.Y = math.Min(lo.X, p.X-r.RadiusM), math.Min(lo.Y, p.Y-r.RadiusM)
			hi.X, hi.Y = math.Max(hi.X, p.X+r.RadiusM), math.Max(hi.Y, p.Y+r.RadiusM)
		}
	}
	e.X0M, e.Y0M = lo.X-cellM, lo.Y-cellM
	e.NX = int(math.Ceil((hi.X-lo.X)/cellM)) + 2
	e.NY = int(math.Ceil((hi.Y-lo.Y)/cellM)) + 2
	if e.NX*e.NY > maxCells {
		return nil, errors.New("clearance: the envelope would need more than 4 million cells: use larger cells")
	}
	e.Covered = make([]bool, e.NX*e.NY)
	for _, s := range rank[:k] {
		e.sweep(runs[s.i])
	}
	return e, nil
}

const maxCells = 4 << 20

// sweep marks every cell that comes within the radius of the path: the
// cell's centre within radius plus half the cell's diagonal.
func (e *Envelope) sweep(r PlanPath) {
	reach := r.RadiusM + e.CellM*math.Sqrt2/2
	mark := func(a, b Point2) {
		i0 := int(math.Floor((math.Min(a.X, b.X) - reach - e.X0M) / e.CellM))
		i1 := int(math.Floor((math.Max(a.X, b.X) + reach - e.X0M) / e.CellM))
		j0 := int(math.Floor((math.Min(a.Y, b.Y) - reach - e.Y0M) / e.CellM))
		j1 := int(math.Floor((math.Max(a.Y, b.Y) + reach - e.Y0M) / e.CellM))
		for j := max(j0, 0); j <= min(j1, e.NY-1); j++ {
			for i := max(i0, 0); i <= min(i1, e.NX-1); i++ {
				c := Point2{e.X0M + (float64(i)+0.5)*e.CellM, e.Y0M + (float64(j)+0.5)*e.CellM}
				if pointSegmentDistance(c, a, b) <= reach {
					e.Covered[j*e.NX+i] = true
				}
			}
		}
	}
	if len(r.Points) == 1 {
		mark(r.Points[0], r.Points[0])
	}
	for i := 0; i+1 < len(r.Points); i++ {
		mark(r.Points[i], r.Points[i+1])
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
	i := int(math.Floor((p.X - e.X0M) / e.CellM))
	j := int(math.Floor((p.Y - e.Y0M) / e.CellM))
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
			y := e.Y0M + float64(j)*e.CellM
			out = append(out, Span{e.X0M + float64(start)*e.CellM, y, e.X0M + float64(i)*e.CellM, y + e.CellM})
		}
	}
	return out
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
