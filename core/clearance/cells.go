package clearance

import (
	"errors"
	"iter"
)

// The lattice cells a run sweeps, as a part carries them (RunPart.Cells)
// and as the join unions them into an envelope (EnvelopeOut.Spans).

// runCells sweeps one run onto a grid of its own and lists the cells.
func runCells(r *PlanPath, cellM float64) []int { return runCellsInto(r, cellM, new(scratch)) }

// runCellsInto is runCells with its grid in sc's memory.
func runCellsInto(r *PlanPath, cellM float64, sc *scratch) []int {
	i0, i1, j0, j1 := r.latticeBox(cellM)
	nx, ny := i1-i0+1, j1-j0+1
	if nx <= 0 || ny <= 0 || nx*ny > maxCells {
		return nil
	}
	sc.cover = grow(sc.cover, nx*ny)
	covered := sc.cover
	clear(covered)
	r.sweepLatticeInto(cellM, i0, j0, nx, ny, covered, sc)
	return spanCells(covered, i0, j0, nx, ny)
}

// spanCells is the spans of coveredSpans, rows from the lowest, each row
// from the left, as a run's cells (RunPart.Cells; nil for none), the
// grid's lower left cell at lattice index (i0, j0). It scans each row in
// a loop of its own rather than through coveredSpans' yield (a call a
// span in wasm) and indexes the row, not the grid: TestSpanCells checks
// it against the spans coveredSpans yields.
func spanCells(covered []bool, i0, j0, nx, ny int) []int {
	var out []int
	pj, pi := 0, 0
	for j := 0; j < ny; j++ {
		row := covered[j*nx : (j+1)*nx]
		for i := 0; i < nx; {
			if !row[i] {
				i++
				continue
			}
			start := i
			for i < nx && row[i] {
				i++
			}
			if out == nil {
				out = make([]int, 0, 3*(ny-j)) // most rows of a run's sweep hold one span
			}
			out = append(out, j0+j-pj, i0+start-pi, i-start)
			pj, pi = j0+j, i0+start
		}
	}
	return out
}

// coveredSpans yields the runs of covered cells of an nx by ny grid
// (covered[j*nx+i] for cell i of row j) as spans in the grid's own
// indices: rows from the lowest, each row from the left.
func coveredSpans(covered []bool, nx, ny int) iter.Seq[cellSpan] {
	return func(yield func(cellSpan) bool) {
		for j := 0; j < ny; j++ {
			for i := 0; i < nx; {
				if !covered[j*nx+i] {
					i++
					continue
				}
				start := i
				for i < nx && covered[j*nx+i] {
					i++
				}
				if !yield(cellSpan{j, start, i}) {
					return
				}
			}
		}
	}
}

// cellSpan is one row span of lattice cells: row J, cells I0 to I1-1.
type cellSpan struct{ J, I0, I1 int }

func decodeCells(c []int) ([]cellSpan, error) {
	if len(c)%3 != 0 {
		return nil, errors.New("clearance: a run's cells are not whole spans")
	}
	out := make([]cellSpan, 0, len(c)/3)
	j, i := 0, 0
	for k := 0; k < len(c); k += 3 {
		j, i = j+c[k], i+c[k+1]
		if c[k+2] < 1 {
			return nil, errors.New("clearance: a run's cells hold an empty span")
		}
		out = append(out, cellSpan{j, i, i + c[k+2]})
	}
	return out, nil
}

// unionSpans is the envelope drawn from the union of the runs' cells: row
// spans in rows from the lowest, each row from the left, and the area.
// Each span adds one at its first cell and takes one away past its last
// (a difference row), so the union costs a few steps a span and one a
// cell of the rows' width, not one a cell of every span: with 1,000 runs
// of thousands of cells each, marking cell by cell was most of the join.
func unionSpans(spans []cellSpan, cellM float64) (EnvelopeOut, error) {
	out := EnvelopeOut{CellM: cellM}
	if len(spans) == 0 {
		return out, nil
	}
	i0, i1, j0, j1 := spans[0].I0, spans[0].I1, spans[0].J, spans[0].J
	for _, s := range spans {
		i0, i1, j0, j1 = min(i0, s.I0), max(i1, s.I1), min(j0, s.J), max(j1, s.J)
	}
	nx, ny := i1-i0, j1-j0+1
	if nx*ny > maxCells {
		return out, errors.New("clearance: the envelope would need more than 4 million cells: use larger cells")
	}
	w := nx + 1
	diff := make([]int32, w*ny)
	for _, s := range spans {
		row := diff[(s.J-j0)*w:]
		row[s.I0-i0]++
		row[s.I1-i0]--
	}
	covered := make([]bool, nx*ny)
	for j := 0; j < ny; j++ {
		var c int32
		for i, d := range diff[j*w : j*w+nx] {
			c += d
			covered[j*nx+i] = c > 0
		}
	}
	n := 0
	for s := range coveredSpans(covered, nx, ny) {
		n += s.I1 - s.I0
		out.Spans = append(out.Spans, latticeSpan(j0+s.J, i0+s.I0, i0+s.I1, cellM))
	}
	out.AreaM2 = float64(n) * cellM * cellM
	return out, nil
}
