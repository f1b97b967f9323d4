package motion

import (
	"math"
	"testing"
)

func TestSineRamp(t *testing.T) {
	for _, c := range []struct{ d, v, a, dec float64 }{
		{18, 0.5, 0.25, 0.25}, {-6, 0.8, 0.4, 0.3}, {0.5, 1, 0.5, 0.5}, {0.2, 0.3, 0.2, 0.6},
	} {
		p := NewSineRamp(2, c.d, c.v, c.a, c.dec)
		consistent(t, "sine ramp", p, 0, p.End()+2)
		if got := p.At(p.End() + 5); math.Abs(got.Pos-c.d) > 1e-12 || got.Vel != 0 || got.Acc != 0 {
			t.Errorf("%+v: end state %+v, want at rest at %g", c, got, c.d)
		}
		if p.At(1.9) != (State{}) {
			t.Errorf("%+v: moves before its start", c)
		}
		// Closed forms (the SineRamp comment): a ramp to V at peak
		// acceleration A lasts pi*V/(2*A) and covers V*Ta/2; a move too
		// short to cruise peaks at sqrt(4*d*A*D/(pi*(A+D))).
		sg := math.Copysign(1, c.d)
		v := c.v
		if math.Pi*v*v/4*(1/c.a+1/c.dec) > math.Abs(c.d) {
			v = math.Sqrt(4 * math.Abs(c.d) * c.a * c.dec / (math.Pi * (c.a + c.dec)))
			if !p.Triangular() {
				t.Errorf("%+v: not marked as too short to reach its top speed", c)
			}
		}
		if math.Abs(p.PeakSpeed()-v) > 1e-12 {
			t.Errorf("%+v: peak speed %g, want %g", c, p.PeakSpeed(), v)
		}
		ta, td := math.Pi*v/(2*c.a), math.Pi*v/(2*c.dec)
		cruise := (math.Abs(c.d) - v*ta/2 - v*td/2) / v
		if want := 2 + ta + math.Max(0, cruise) + td; math.Abs(p.End()-want) > 1e-12 {
			t.Errorf("%+v: ends at %g, want %g", c, p.End(), want)
		}
		// Half way up the ramp: peak acceleration, half the speed, and
		// x = (V/2)*(Ta/2 - Ta/pi).
		mid := p.At(2 + ta/2)
		if math.Abs(mid.Acc-sg*c.a) > 1e-12 || math.Abs(mid.Vel-sg*v/2) > 1e-12 ||
			math.Abs(mid.Pos-sg*v/2*(ta/2-ta/math.Pi)) > 1e-12 {
			t.Errorf("%+v: half way up %+v, want acc %g, vel %g", c, mid, sg*c.a, sg*v/2)
		}
		// A quarter of the way down from the end: a(u) = -D*sin(pi/4).
		q := p.At(p.End() - td/4)
		if want := -sg * c.dec * math.Sin(math.Pi/4); math.Abs(q.Acc-want) > 1e-12 {
			t.Errorf("%+v: acceleration %g a quarter before the end, want %g", c, q.Acc, want)
		}
		// The acceleration is continuous everywhere (no step at the
		// breakpoints, unlike the trapezoid).
		for _, b := range p.Breakpoints() {
			if x, y := p.At(b-1e-10).Acc, p.At(b+1e-10).Acc; math.Abs(x-y) > 1e-8 {
				t.Errorf("%+v: acceleration jumps at %g: %g to %g", c, b, x, y)
			}
		}
	}
}
