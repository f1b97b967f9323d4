package sway

import (
	"math"
	"math/rand/v2"
	"runtime"
	"testing"
)

// ulps is how many representable numbers lie between a and b.
func ulps(a, b float64) int64 {
	d := int64(math.Float64bits(a)) - int64(math.Float64bits(b))
	if d < 0 {
		d = -d
	}
	return d
}

// TestStepExpLog: stepExp and stepLog against package math over the
// arguments the step control gives them (error norms from 1e-300 to 1e10,
// their logarithms times the control's exponents) and the special cases.
// Source: they are Go's own math.Exp and math.Log algorithms: on wasm,
// where package math runs those Go sources, the same bits; elsewhere
// package math may run assembly of its own (amd64 does), which agrees to
// two units in the last place.
func TestStepExpLog(t *testing.T) {
	tol := int64(2)
	if runtime.GOARCH == "wasm" {
		tol = 0
	}
	r := rand.New(rand.NewPCG(1, 2))
	for range 200000 {
		x := math.Pow(10, -300+310*r.Float64())
		if d := ulps(stepLog(x), math.Log(x)); d > tol {
			t.Fatalf("stepLog(%g) = %.17g, math.Log %.17g", x, stepLog(x), math.Log(x))
		}
		y := (r.Float64() - 0.5) * 1400
		if d := ulps(stepExp(y), math.Exp(y)); d > tol {
			t.Fatalf("stepExp(%g) = %.17g, math.Exp %.17g", y, stepExp(y), math.Exp(y))
		}
		y = 0.17 * math.Log(x)
		if d := ulps(stepExp(y), math.Exp(y)); d > tol {
			t.Fatalf("stepExp(%g) = %.17g, math.Exp %.17g", y, stepExp(y), math.Exp(y))
		}
	}
	for _, x := range []float64{0, -1, math.Inf(1), math.NaN(), 5e-324, 1, 2, 0.5, math.MaxFloat64} {
		if a, b := stepLog(x), math.Log(x); a != b && !(math.IsNaN(a) && math.IsNaN(b)) {
			t.Errorf("stepLog(%g) = %g, math.Log %g", x, a, b)
		}
	}
	for _, x := range []float64{0, 1e-300, -1e-10, 1e-9, 709, 710, -745, -746, math.Inf(1), math.Inf(-1), math.NaN()} {
		if a, b := stepExp(x), math.Exp(x); ulps(a, b) > tol && !(math.IsNaN(a) && math.IsNaN(b)) {
			t.Errorf("stepExp(%g) = %g, math.Exp %g", x, a, b)
		}
	}
}

// TestSwingAtan2: swingAtan2 gives math.Atan2's bits for swing angles from
// the vertical to over the top (load below, level with and above the
// suspension point), horizontal and vertical parts from 1e-300 to 1e300
// in every ratio, and the special cases. Source: it is Go's own
// math/atan2.go and math/atan.go, which package math runs on every
// platform but s390x.
func TestSwingAtan2(t *testing.T) {
	if runtime.GOARCH == "s390x" {
		t.Skip("math.Atan2 is assembly on s390x")
	}
	r := rand.New(rand.NewPCG(3, 4))
	check := func(y, x float64) {
		a, b := swingAtan2(y, x), math.Atan2(y, x)
		if math.Float64bits(a) != math.Float64bits(b) && !(math.IsNaN(a) && math.IsNaN(b)) {
			t.Fatalf("swingAtan2(%g, %g) = %.17g, math.Atan2 %.17g", y, x, a, b)
		}
	}
	for range 200000 {
		th := r.Float64() * math.Pi // the swing angle
		l := math.Pow(10, -3+6*r.Float64())
		check(l*math.Sin(th), l*math.Cos(th))
		check(math.Pow(10, -300+600*r.Float64()), math.Pow(10, -300+600*r.Float64()))
	}
	inf, nan := math.Inf(1), math.NaN()
	for _, y := range []float64{0, math.Copysign(0, -1), 1e-320, 1, -1, 0.66, 2.41421356237309504880, math.MaxFloat64, inf, -inf, nan} {
		for _, x := range []float64{0, math.Copysign(0, -1), 1e-320, 1, -1, 1.5, math.MaxFloat64, inf, -inf, nan} {
			check(y, x)
		}
	}
}
