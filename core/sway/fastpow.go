//go:build !wasm

package sway

import "math"

// powLog and powExp are the logarithm and exponential that math.Pow(x, y)
// takes for 0 < y < 1/2 (its Exp(y*Log(x)), with no whole part of y to
// raise to and nothing to scale): doubleSolver's step-size control takes
// its powers so, without math.Pow's own reductions around them, and gets
// math.Pow's bits. Natively they are package math's (assembly on amd64);
// under wasm, stepExp and stepLog, which give the bits of package math's
// Go sources that run there (fastpow_wasm.go).
func powLog(x float64) float64 { return math.Log(x) }

func powExp(x float64) float64 { return math.Exp(x) }
