// Package sorts sorts the core's slices of numbers and words through the
// sort package's one non-generic copy of pattern-defeating quicksort
// (sort.Sort on sort.Float64Slice and sort.StringSlice, sort.Slice),
// instead of slices.Sort, slices.SortFunc, sort.Float64s and sort.Strings,
// which the compiler copies once for each element type: those copies are
// about 13 kB of the page's gzipped wasm.
//
// The order is the same, element for element: the sort package's and the
// slices package's sorts are generated from one template
// (sort/gen_sort_variants.go in Go's source), so they compare and swap the
// same positions in the same sequence, given a less function equal to
// "compare < 0" (Float64Slice.Less orders NaN first, as slices.Sort does;
// TestSameOrderAsSlices checks it, equal values and signed zeros
// included).
package sorts

import "sort"

// Floats sorts x in increasing order, NaN first, as slices.Sort(x).
func Floats(x []float64) { sort.Sort(sort.Float64Slice(x)) }

// Strings sorts x in increasing byte order, as slices.Sort(x).
func Strings(x []string) { sort.Sort(sort.StringSlice(x)) }

// By sorts x by less(x[i], x[j]), as slices.SortFunc(x, cmp) for a cmp
// with cmp(a, b) < 0 exactly when less(a, b).
func By[E any](x []E, less func(a, b E) bool) {
	sort.Slice(x, func(i, j int) bool { return less(x[i], x[j]) })
}
