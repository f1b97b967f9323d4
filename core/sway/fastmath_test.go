package sway

import (
	"math"
	"math/rand/v2"
	"runtime"
	"testing"

	"swaysheet/core/units"
)

// TestSwingDegrees: swingDegrees gives the bits of
// math.Atan2(math.Sqrt(rx²+ry²), -rz)/units.Degree for rope directions from
// the vertical to over the top (load below, level with and above the
// suspension point) in every azimuth, rope lengths from 1 mm to 1 km,
// components from 1e-300 to 1e300 of either sign in every ratio, and the
// special values. Source: it is Go's own math/atan2.go and math/atan.go,
// which package math runs on every platform but s390x.
func TestSwingDegrees(t *testing.T) {
	if runtime.GOARCH == "s390x" {
		t.Skip("math.Atan2 is assembly on s390x")
	}
	r := rand.New(rand.NewPCG(3, 4))
	var rx, ry, rz []float64
	add := func(x, y, z float64) { rx, ry, rz = append(rx, x), append(ry, y), append(rz, z) }
	sign := func() float64 { return float64(1 - 2*r.IntN(2)) }
	for range 200000 {
		th, az := r.Float64()*math.Pi, r.Float64()*2*math.Pi // swing angle, azimuth
		l := math.Pow(10, -3+6*r.Float64())
		add(l*math.Sin(th)*math.Cos(az), l*math.Sin(th)*math.Sin(az), -l*math.Cos(th))
		mag := func() float64 { return sign() * math.Pow(10, -300+600*r.Float64()) }
		add(mag(), mag(), mag())
	}
	// The reduction's boundaries: y/x at 0.66 and at tan(3π/8), on and
	// about them.
	for _, q := range []float64{0.66, 2.41421356237309504880} {
		for _, d := range []float64{-1e-15, 0, 1e-15} {
			add(q+d, 0, -1)
		}
	}
	inf, nan := math.Inf(1), math.NaN()
	special := []float64{0, math.Copysign(0, -1), 1e-320, 1, -1, 1.5, math.MaxFloat64, inf, -inf, nan}
	for _, x := range special {
		for _, y := range special {
			for _, z := range special {
				add(x, y, z)
			}
		}
	}
	sw := make([]float64, len(rx))
	swingDegrees(sw, rx, ry, rz)
	for i := range sw {
		want := math.Atan2(math.Sqrt(rx[i]*rx[i]+ry[i]*ry[i]), -rz[i]) / units.Degree
		if math.Float64bits(sw[i]) != math.Float64bits(want) && !(math.IsNaN(sw[i]) && math.IsNaN(want)) {
			t.Fatalf("rope (%g, %g, %g): %.17g deg, math.Atan2 %.17g", rx[i], ry[i], rz[i], sw[i], want)
		}
	}
}

// maxf and minf give the built-in max's and min's bits on every pairing
// of special and ordinary values (NaN for NaN).
func TestMaxfMinfAsBuiltIn(t *testing.T) {
	vals := []float64{0, math.Copysign(0, -1), 1, -1, 2.5, -1e-310, math.MaxFloat64, math.Inf(1), math.Inf(-1), math.NaN()}
	same := func(a, b float64) bool {
		return math.Float64bits(a) == math.Float64bits(b) || math.IsNaN(a) && math.IsNaN(b)
	}
	for _, x := range vals {
		for _, y := range vals {
			if got, want := maxf(x, y), max(x, y); !same(got, want) {
				t.Errorf("maxf(%g, %g) = %g, max %g", x, y, got, want)
			}
			if got, want := minf(x, y), min(x, y); !same(got, want) {
				t.Errorf("minf(%g, %g) = %g, min %g", x, y, got, want)
			}
		}
	}
}
