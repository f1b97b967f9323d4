//go:build !linux

package cputime

// Seconds is not measured here: the benchmark reports wall time only.
func Seconds() float64 { return 0 }
