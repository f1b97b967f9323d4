package clearance

import (
	"math/rand/v2"
	"reflect"
	"testing"
)

// TestSpanCells: a run's cells written row by row are the spans
// coveredSpans yields, written as RunPart.Cells says (the plain form):
// random grids, sparse and dense, empty, and rows covered end to end.
func TestSpanCells(t *testing.T) {
	rng := rand.New(rand.NewPCG(6, 13))
	for trial := range 500 {
		nx, ny := 1+rng.IntN(40), 1+rng.IntN(30)
		covered := make([]bool, nx*ny)
		fill := []float64{0, 0.05, 0.5, 0.95, 1}[trial%5]
		for k := range covered {
			covered[k] = rng.Float64() < fill
		}
		i0, j0 := rng.IntN(200)-100, rng.IntN(200)-100
		var want []int
		pj, pi := 0, 0
		for s := range coveredSpans(covered, nx, ny) {
			want = append(want, j0+s.J-pj, i0+s.I0-pi, s.I1-s.I0)
			pj, pi = j0+s.J, i0+s.I0
		}
		if got := spanCells(covered, i0, j0, nx, ny); !reflect.DeepEqual(got, want) {
			t.Fatalf("trial %d: %v, want %v", trial, got, want)
		}
	}
}
