package pendulum

import (
	"math"
	"testing"
)

// solve3's written-out cases for one, two and three constraints give
// eliminate's bits, through every row swap of the pivoting.
func TestSolve3AsEliminate(t *testing.T) {
	for seed := range 40 {
		v := func(k int) float64 { return math.Sin(float64(7*seed+k)) * math.Exp(float64((seed+k)%5-2)) }
		a := [3][3]float64{{v(1), v(2), v(3)}, {v(4), v(5), v(6)}, {v(7), v(8), v(9)}}
		b := [3]float64{v(10), v(11), v(12)}
		for n := 1; n <= 3; n++ {
			a1, b1, a2, b2 := a, b, a, b
			var got, want [3]float64
			solve3(&a1, &b1, n, &got)
			eliminate(&a2, &b2, n, &want)
			if got != want {
				t.Errorf("seed %d, n = %d: solve3 %v, eliminate %v", seed, n, got, want)
			}
		}
	}
}
