package sorts

import (
	"cmp"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"
	"testing"
)

// TestSameOrderAsSlices sorts the same data both ways and compares bit for
// bit: many equal values (where the positions of equal elements show
// any difference of algorithm), both zeros, NaN, and lengths either side
// of the insertion-sort cutoff (12) and of the pattern breaking.
func TestSameOrderAsSlices(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for _, n := range []int{0, 1, 2, 5, 11, 12, 13, 50, 51, 200, 1000, 5000} {
		for trial := 0; trial < 4; trial++ {
			x := make([]float64, n)
			for i := range x {
				switch r.IntN(8) {
				case 0:
					x[i] = math.Copysign(0, -1)
				case 1:
					x[i] = 0
				case 2:
					x[i] = math.NaN()
				case 3:
					x[i] = float64(r.IntN(3))
				default:
					x[i] = r.NormFloat64()
				}
			}
			if trial == 3 { // nearly sorted: the pattern-defeating paths
				slices.Sort(x)
				if n > 2 {
					x[0], x[n-1] = x[n-1], x[0]
				}
			}
			a, b := slices.Clone(x), slices.Clone(x)
			slices.Sort(a)
			Floats(b)
			for i := range a {
				if math.Float64bits(a[i]) != math.Float64bits(b[i]) {
					t.Fatalf("n=%d trial %d: element %d is %v, slices.Sort gives %v", n, trial, i, b[i], a[i])
				}
			}
			// By on indices with many ties, against slices.SortFunc.
			ia, ib := make([]int, n), make([]int, n)
			for i := range ia {
				ia[i], ib[i] = i, i
			}
			slices.SortFunc(ia, func(p, q int) int { return cmp.Compare(x[q], x[p]) })
			By(ib, func(p, q int) bool { return cmp.Compare(x[q], x[p]) < 0 })
			if !slices.Equal(ia, ib) {
				t.Fatalf("n=%d trial %d: By gives %v, slices.SortFunc %v", n, trial, ib, ia)
			}
			s := make([]string, n)
			for i := range s {
				s[i] = strconv.Itoa(r.IntN(n + 1))
			}
			sa, sb := slices.Clone(s), slices.Clone(s)
			slices.Sort(sa)
			Strings(sb)
			if !slices.Equal(sa, sb) {
				t.Fatalf("n=%d: Strings differs from slices.Sort", n)
			}
		}
	}
}
