package pendulum

import "math"

// Small dense linear algebra for the modal analysis (at most 9 by 9):
// the null space by one-sided Jacobi SVD, and the symmetric eigenproblem
// by cyclic Jacobi rotations (Golub & Van Loan, Matrix Computations, 4th
// ed., sections 8.5 and 8.6.3; Demmel & Veselic 1992 for their accuracy).
// Both are a few dozen lines, converge quadratically, and keep the page's
// wasm free of a general LAPACK.

// dense is a small matrix, row by row.
type dense [][]float64

func newDense(r, c int) dense {
	m := make(dense, r)
	buf := make([]float64, r*c) // the rows on one array: two allocations, not r+1
	for i := range m {
		m[i] = buf[i*c : (i+1)*c : (i+1)*c]
	}
	return m
}

func identity(n int) dense {
	m := newDense(n, n)
	for i := range m {
		m[i][i] = 1
	}
	return m
}

// rotateCols replaces columns p and q of m by c p - s q and s p + c q.
func rotateCols(m dense, p, q int, c, s float64) {
	for _, row := range m {
		a, b := row[p], row[q]
		row[p], row[q] = c*a-s*b, s*a+c*b
	}
}

// jacobiAngle is the rotation (c, s) that zeroes the off-diagonal entry
// gamma of the 2x2 symmetric matrix [alpha gamma; gamma beta] (the
// smaller of the two angles, Golub & Van Loan algorithm 8.5.1).
func jacobiAngle(alpha, beta, gamma float64) (c, s float64) {
	zeta := (beta - alpha) / (2 * gamma)
	t := 1 / (math.Abs(zeta) + math.Sqrt(1+zeta*zeta))
	if zeta < 0 {
		t = -t
	}
	c = 1 / math.Sqrt(1+t*t)
	return c, c * t
}

// nullSpace returns an orthonormal basis, as the columns of an n by k
// matrix, of the vectors x with g x = 0, g having n columns: the right
// singular vectors whose singular value is at most tol times the largest.
// One-sided Jacobi orthogonalises g's columns by rotations, accumulated
// in V; the columns' norms are then the singular values.
func nullSpace(g dense, n int, tol float64) dense {
	a := newDense(len(g), n)
	for i := range g {
		copy(a[i], g[i])
	}
	v := identity(n)
	for sweep := 0; sweep < 60; sweep++ {
		rotated := false
		for p := 0; p < n-1; p++ {
			for q := p + 1; q < n; q++ {
				var alpha, beta, gamma float64
				for _, row := range a {
					alpha += row[p] * row[p]
					beta += row[q] * row[q]
					gamma += row[p] * row[q]
				}
				if gamma == 0 || math.Abs(gamma) <= 1e-15*math.Sqrt(alpha*beta) {
					continue
				}
				rotated = true
				c, s := jacobiAngle(alpha, beta, gamma)
				rotateCols(a, p, q, c, s)
				rotateCols(v, p, q, c, s)
			}
		}
		if !rotated {
			break
		}
	}
	norms := make([]float64, n)
	big := 0.0
	for j := range norms {
		for _, row := range a {
			norms[j] += row[j] * row[j]
		}
		norms[j] = math.Sqrt(norms[j])
		big = math.Max(big, norms[j])
	}
	var keep []int
	for j, s := range norms {
		if len(g) == 0 || s <= tol*big {
			keep = append(keep, j)
		}
	}
	out := newDense(n, len(keep))
	for i := range out {
		for k, j := range keep {
			out[i][k] = v[i][j]
		}
	}
	return out
}

// symEigen returns the eigenvalues of the symmetric matrix a and its
// eigenvectors as the columns of a matrix, by cyclic Jacobi rotations
// (a is overwritten).
func symEigen(a dense) ([]float64, dense) {
	n := len(a)
	v := identity(n)
	for sweep := 0; sweep < 60; sweep++ {
		off, diag := 0.0, 0.0
		for i := range a {
			diag += a[i][i] * a[i][i]
			for j := i + 1; j < n; j++ {
				off += a[i][j] * a[i][j]
			}
		}
		if off <= 1e-32*diag || off == 0 {
			break
		}
		for p := 0; p < n-1; p++ {
			for q := p + 1; q < n; q++ {
				if a[p][q] == 0 {
					continue
				}
				c, s := jacobiAngle(a[p][p], a[q][q], a[p][q])
				// a = J^T a J with J the rotation in the (p, q) plane.
				rotateCols(a, p, q, c, s)
				for k := 0; k < n; k++ {
					x, y := a[p][k], a[q][k]
					a[p][k], a[q][k] = c*x-s*y, s*x+c*y
				}
				rotateCols(v, p, q, c, s)
			}
		}
	}
	vals := make([]float64, n)
	for i := range vals {
		vals[i] = a[i][i]
	}
	return vals, v
}

// cholesky returns the lower triangular l with l l^T = a, for a
// symmetric positive definite; false when a is not.
func cholesky(a dense) (dense, bool) {
	n := len(a)
	l := newDense(n, n)
	for j := 0; j < n; j++ {
		d := a[j][j]
		for k := 0; k < j; k++ {
			d -= l[j][k] * l[j][k]
		}
		if !(d > 0) {
			return nil, false
		}
		l[j][j] = math.Sqrt(d)
		for i := j + 1; i < n; i++ {
			s := a[i][j]
			for k := 0; k < j; k++ {
				s -= l[i][k] * l[j][k]
			}
			l[i][j] = s / l[j][j]
		}
	}
	return l, true
}

// lowerSolve solves l x = b in place (l lower triangular); with trans,
// l^T x = b.
func lowerSolve(l dense, b []float64, trans bool) {
	n := len(l)
	if !trans {
		for i := 0; i < n; i++ {
			for k := 0; k < i; k++ {
				b[i] -= l[i][k] * b[k]
			}
			b[i] /= l[i][i]
		}
		return
	}
	for i := n - 1; i >= 0; i-- {
		for k := i + 1; k < n; k++ {
			b[i] -= l[k][i] * b[k]
		}
		b[i] /= l[i][i]
	}
}
