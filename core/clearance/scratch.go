package clearance

import "sync"

// scratch holds what one run's check needs only while it is made (the
// load's path, its hoisting gear's lines with what they prepare, the
// path's lengths, its plan points, its section), kept for the next run
// on the same goroutine: a run made its own, about 170 kB, and in wasm
// the allocation and its collection were about a sixth of a run's time
// (node --cpu-prof of clearance_part). Nothing a run returns points into
// it, and the run's time histories are read only while it is made.
type scratch struct {
	path   []Sample
	lines  []RopeLine
	cum    []float64
	plan   []float64
	coarse []int
	vsds   []float64 // an obstacle's figures at the coarse samples (pathLengths.vs, ds)
	points []Point2
	d, low []float64
	bound  []float64
	seg    []int32
	cover  []bool
	groups []pathGroup // the sweep's groups of the path's pieces
	inner  []int       // the sweep's inner capsules' cells, row by row
	hist   []float64   // the run's time histories (sway.Options.HistoryBuffer)
}

var scratches = sync.Pool{New: func() any { return new(scratch) }}

// grow is buf with length n, its contents unspecified (reused when its
// capacity allows).
func grow[T any](buf []T, n int) []T {
	if cap(buf) >= n {
		return buf[:n]
	}
	return make([]T, n)
}
