package pendulum

import (
	"math"
	"math/rand/v2"
	"testing"
)

// The null space of a rank-deficient matrix is orthonormal, g maps it
// to zero, and it has the dimension the rank leaves.
func TestNullSpace(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for _, c := range []struct{ rows, cols, rank int }{{3, 9, 3}, {2, 6, 1}, {4, 6, 4}, {0, 6, 0}} {
		g := newDense(c.rows, c.cols)
		for i := range g {
			for j := range g[i] {
				g[i][j] = rng.NormFloat64()
			}
		}
		if c.rank < c.rows { // the last rows repeat the first
			for i := c.rank; i < c.rows; i++ {
				copy(g[i], g[0])
			}
		}
		n := nullSpace(g, c.cols, 1e-10)
		if k := len(n[0]); k != c.cols-c.rank {
			t.Fatalf("%+v: null space of dimension %d", c, k)
		}
		for a := range n[0] {
			for b := range n[0] {
				dot := 0.0
				for i := range n {
					dot += n[i][a] * n[i][b]
				}
				if want := map[bool]float64{true: 1, false: 0}[a == b]; math.Abs(dot-want) > 1e-13 {
					t.Errorf("%+v: columns %d, %d: dot %g", c, a, b, dot)
				}
			}
			for _, row := range g {
				s := 0.0
				for i := range row {
					s += row[i] * n[i][a]
				}
				if math.Abs(s) > 1e-13 {
					t.Errorf("%+v: g n = %g", c, s)
				}
			}
		}
	}
}

// Jacobi's eigenpairs satisfy a v = lambda v, on a random symmetric
// matrix and on one with a repeated eigenvalue.
func TestSymEigen(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	a := newDense(7, 7)
	for i := range a {
		for j := 0; j <= i; j++ {
			a[i][j] = rng.NormFloat64()
			a[j][i] = a[i][j]
		}
	}
	rep := identity(5)
	rep[4][4] = 3
	for _, m := range []dense{a, rep} {
		keep := newDense(len(m), len(m))
		for i := range m {
			copy(keep[i], m[i])
		}
		vals, vecs := symEigen(m)
		for j, l := range vals {
			for i := range keep {
				s := 0.0
				for q := range keep {
					s += keep[i][q] * vecs[q][j]
				}
				if math.Abs(s-l*vecs[i][j]) > 1e-12 {
					t.Errorf("pair %d row %d: a v %g, lambda v %g", j, i, s, l*vecs[i][j])
				}
			}
		}
	}
}
