package clearance

import "math"

// Comparisons in place of the built-in min and max of floats where a
// clearance run spends its time: in wasm each built-in is a call into the
// runtime (fmin64, fmax64) or math.Min/Max, together about a tenth of a
// run's time there (node --cpu-prof of clearance_part). Each gives what
// the built-in gives for every number, NaN included, up to the sign of a
// zero, which its callers only square or compare.

// lower is min(a, b).
func lower(a, b float64) float64 {
	if b < a || b != b {
		return b
	}
	return a
}

// upper is max(a, b).
func upper(a, b float64) float64 {
	if b > a || b != b {
		return b
	}
	return a
}

// beyond is max(0, a, b): how far one box lies beyond another along an
// axis, from the differences of their facing sides.
func beyond(a, b float64) float64 {
	if a != a || b != b {
		return math.NaN()
	}
	if b > a {
		a = b
	}
	if a > 0 {
		return a
	}
	return 0
}
