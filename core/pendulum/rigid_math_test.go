package pendulum

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// solve3's written-out cases for one, two and three constraints give
// eliminate's bits, through every row swap of the pivoting.
func TestSolve3AsEliminate(t *testing.T) {
	for seed := range 40 {
		v := func(k int) float64 { return math.Sin(float64(7*seed+k)) * math.Exp(float64((seed+k)%5-2)) }
		a := [3][3]float64{{v(1), v(2), v(3)}, {v(4), v(5), v(6)}, {v(7), v(8), v(9)}}
		b := [3]float64{v(10), v(11), v(12)}
		for n := 1; n <= 3; n++ {
			a1, b1, a2, b2 := a, b, a, b
			var got, want [3]float64
			solve3(&a1, &b1, n, &got)
			eliminate(&a2, &b2, n, &want)
			if got != want {
				t.Errorf("seed %d, n = %d: solve3 %v, eliminate %v", seed, n, got, want)
			}
		}
	}
}

// hypot, norm, unitOf and maxOf give math.Hypot's, r3.Norm's, r3.Unit's
// and math.Max's bits (NaN for NaN) on every pairing of special and
// ordinary values.
func TestHypotNormMaxAsMath(t *testing.T) {
	vals := []float64{0, math.Copysign(0, -1), 1, -1, 3, -4, 1e-310, -2.5e-308, 1e300, -1e300,
		math.MaxFloat64, math.Inf(1), math.Inf(-1), math.NaN(), 0.1, -7.25}
	same := func(a, b float64) bool {
		return math.Float64bits(a) == math.Float64bits(b) || math.IsNaN(a) && math.IsNaN(b)
	}
	for _, x := range vals {
		for _, y := range vals {
			if got, want := hypot(x, y), math.Hypot(x, y); !same(got, want) {
				t.Errorf("hypot(%g, %g) = %g, math.Hypot %g", x, y, got, want)
			}
			if got, want := maxOf(x, y), math.Max(x, y); !same(got, want) {
				t.Errorf("maxOf(%g, %g) = %g, math.Max %g", x, y, got, want)
			}
			for _, z := range vals {
				v := r3.Vec{X: x, Y: y, Z: z}
				if got, want := norm(v), r3.Norm(v); !same(got, want) {
					t.Errorf("norm(%v) = %g, r3.Norm %g", v, got, want)
				}
				if got, want := unitOf(v), r3.Unit(v); !same(got.X, want.X) || !same(got.Y, want.Y) || !same(got.Z, want.Z) {
					t.Errorf("unitOf(%v) = %v, r3.Unit %v", v, got, want)
				}
			}
		}
	}
}

// length, the square root of the dot product, agrees with r3.Norm (two
// hypotenuses, each rounded) to within four units in the last place on
// vectors of the sizes a load's evaluation meets (1e-6 m to 1e7 N), every
// sign and direction (the largest seen over 20,000: 3).
func TestLengthAsNorm(t *testing.T) {
	rnd := rand.New(rand.NewPCG(7, 11))
	for range 20000 {
		scale := math.Pow(10, -6+13*rnd.Float64())
		v := r3.Vec{X: scale * rnd.NormFloat64(), Y: scale * rnd.NormFloat64(), Z: scale * rnd.NormFloat64()}
		if got, want := length(v), r3.Norm(v); math.Abs(got-want) > 4*ulp(want) {
			t.Fatalf("length(%v) = %.17g, r3.Norm %.17g", v, got, want)
		}
	}
	if length(r3.Vec{}) != 0 || length(r3.Vec{Z: -3}) != 3 {
		t.Error("length of the zero vector or an axis wrong")
	}
}

func ulp(x float64) float64 { return math.Nextafter(x, math.Inf(1)) - x }

// twistRemainder gives math.Remainder(tw, 2 pi)'s bits, at and around
// the ends of its shortcut and far from them.
func TestTwistRemainderAsMath(t *testing.T) {
	pi := math.Pi
	vals := []float64{0, math.Copysign(0, -1), 1e-300, 0.3, -2.9, pi, -pi, math.Nextafter(pi, 4), math.Nextafter(-pi, -4),
		math.Nextafter(pi, 0), 3 * pi, -3 * pi, 2 * pi, 5.5, -7.1, 1e6, math.Inf(1), math.NaN()}
	for _, tw := range vals {
		got, want := twistRemainder(tw), math.Remainder(tw, 2*pi)
		if math.Float64bits(got) != math.Float64bits(want) && !(math.IsNaN(got) && math.IsNaN(want)) {
			t.Errorf("twistRemainder(%g) = %g, math.Remainder %g", tw, got, want)
		}
	}
}

// stateInto writes rotInto out: the frame's rotation is rotInto's, bit for
// bit, for quaternions of any length and sign.
func TestStateIntoAsRotInto(t *testing.T) {
	r := girder()
	r.Legs = fourLegs(8, 0.5, 1, 5)
	mustPrepare(t, fixedRigid(r, 6))
	rnd := rand.New(rand.NewPCG(3, 5))
	y := r.Rest(0)
	for range 1000 {
		for i := 7; i < 11; i++ {
			y[i] = rnd.NormFloat64() * math.Pow(10, rnd.Float64()*4-2)
		}
		var f frame
		r.stateInto(y, &f)
		var want m3
		rotInto(y[7:11], &want)
		for i := range 3 {
			for j := range 3 {
				if math.Float64bits(f.R[i][j]) != math.Float64bits(want[i][j]) {
					t.Fatalf("q %v: stateInto's R %v, rotInto's %v", y[7:11], f.R, want)
				}
			}
		}
	}
}
