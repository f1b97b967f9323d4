//go:build !linux

package clearance

// cpuSeconds is not measured here: the benchmark reports wall time only.
func cpuSeconds() float64 { return 0 }
