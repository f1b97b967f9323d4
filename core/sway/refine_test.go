package sway

import (
	"math"
	"testing"
)

// TestBrentMax: the general scan's refinement (brentMax, Brent's localmin
// for a maximum) finds the top of smooth functions to its tolerance in few
// evaluations, including those on which parabolic interpolation alone
// creeps toward the top from one side (a flat quartic top, a top near an
// end of the bracket); it stops at once on a flat function and on one
// whose three values lie within the value tolerance, and never takes more
// than 40 evaluations.
func TestBrentMax(t *testing.T) {
	for _, c := range []struct {
		name       string
		f          func(float64) float64
		a, m, b    float64
		top        float64 // where the top is: f's derivative is zero there (by hand)
		tolV       float64
		maxEvals   int
		wantFlat   bool
		placeTol   float64 // how close to top the answer must lie
		valueExact bool    // the value at the answer must be f's at the top to 1e-14
	}{
		{"parabola", func(t float64) float64 { return 2 - 3*(t-0.37)*(t-0.37) }, 0, 0.5, 1, 0.37, 0, 10, false, 1e-7, true},
		{"cosine", func(t float64) float64 { return math.Cos(2 * (t - 4.1)) }, 3.9, 4.0, 4.6, 4.1, 0, 12, false, 1e-7, true},
		{"quartic top", func(t float64) float64 { return 1 - math.Pow(t-0.3, 4) }, 0, 0.5, 1, 0.3, 0, 40, false, 1e-3, true},
		{"top near an end", func(t float64) float64 { return -(t - 0.999) * (t - 0.999) }, 0, 0.9, 1, 0.999, 0, 20, false, 1e-7, true},
		{"skewed", func(t float64) float64 { return t * math.Exp(-8*t) }, 0, 0.2, 1, 0.125, 0, 15, false, 1e-7, true},
		{"flat", func(float64) float64 { return 73059.5425 }, 0, 0.5, 1, 0.5, 0, 0, true, 0, false},
		{"within the value tolerance", func(t float64) float64 { return 1e-33 * (1 + 0.1*math.Sin(50*t)) }, 0, 0.5, 1, 0.5, 1e-28, 0, true, 0, false},
	} {
		n := 0
		f := func(t float64) float64 { n++; return c.f(t) }
		x, v := brentMax(c.a, c.f(c.a), c.m, c.f(c.m), c.b, c.f(c.b), 1e-7*(c.b-c.a), c.tolV, f)
		if n > c.maxEvals || n > 40 {
			t.Errorf("%s: %d evaluations, want at most %d", c.name, n, c.maxEvals)
		}
		if c.wantFlat {
			if x != c.m || v != c.f(c.m) {
				t.Errorf("%s: (%v, %v), want the middle point back", c.name, x, v)
			}
			continue
		}
		if math.Abs(x-c.top) > c.placeTol {
			t.Errorf("%s: top at %.12g, want %.12g within %g", c.name, x, c.top, c.placeTol)
		}
		if want := c.f(c.top); c.valueExact && math.Abs(v-want) > 1e-14*math.Max(1, math.Abs(want)) {
			t.Errorf("%s: top %.17g, want %.17g", c.name, v, want)
		}
		if v != c.f(x) {
			t.Errorf("%s: value %v is not f at %v", c.name, v, x)
		}
		t.Logf("%s: %d evaluations", c.name, n)
	}
}

// spreadWithin written with comparisons answers as its definition with
// math.Max and math.Min does, for every triple of a set of values that
// holds zeros of both signs, infinities, NaN and values 1e-14 apart.
func TestSpreadWithin(t *testing.T) {
	vals := []float64{0, math.Copysign(0, -1), 1, 1 + 1e-14, 1 - 2e-14, -1, 1e300, -1e-300,
		math.Inf(1), math.Inf(-1), math.NaN(), 5e-324}
	for _, x := range vals {
		for _, y := range vals {
			for _, z := range vals {
				for _, floor := range []float64{0, 1e-28, 1e-9} {
					hi, lo := math.Max(x, math.Max(y, z)), math.Min(x, math.Min(y, z))
					want := hi-lo <= 1e-14*math.Abs(hi)+floor
					if got := spreadWithin(x, y, z, floor); got != want {
						t.Errorf("spreadWithin(%g, %g, %g, %g) = %v, want %v", x, y, z, floor, got, want)
					}
				}
			}
		}
	}
}
