package sway

import (
	"math"
	"math/rand/v2"
	"runtime"
	"testing"
)

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
