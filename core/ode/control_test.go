package ode

import (
	"math"
	"math/rand/v2"
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

// TestControlLog: controlLog against math.Log over positive numbers from
// 1e-300 to 1e10 (the mean squares a step can have) and near 1 on both
// sides, where the error is absolute, and the special cases, which go to
// math.Log.
func TestControlLog(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	worst := 0.0
	check := func(x float64) {
		got, want := controlLog(x), math.Log(x)
		d := math.Abs(got - want)
		ulp := math.Nextafter(math.Abs(want), math.Inf(1)) - math.Abs(want)
		if d > 2.5e-16+ulp {
			t.Fatalf("controlLog(%g) = %.17g, math.Log %.17g", x, got, want)
		}
		if d-ulp > worst {
			worst = d - ulp
		}
	}
	for range 300000 {
		check(math.Pow(10, -300+310*r.Float64()))
		check(1 + (r.Float64()-0.5)*1e-3)
		check(math.Float64frombits(math.Float64bits(1) - 1 - uint64(r.IntN(1000))))
	}
	for _, x := range []float64{0, -1, math.Inf(1), math.NaN(), 5e-324, 2.2250738585072014e-308, 1, 2, 0.5, math.MaxFloat64} {
		if a, b := controlLog(x), math.Log(x); math.Abs(a-b) > 2.5e-16+1e-15*math.Abs(b) && !(math.IsNaN(a) && math.IsNaN(b)) {
			t.Errorf("controlLog(%g) = %g, math.Log %g", x, a, b)
		}
	}
	t.Logf("largest error beyond a unit in the last place: %.3g", worst)
}

// TestControlExp: controlExp against math.Exp over [-700, 700], over the
// arguments the step control gives it, and at the special cases, which
// go to math.Exp.
func TestControlExp(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	worst := int64(0)
	check := func(x float64) {
		got, want := controlExp(x), math.Exp(x)
		d := ulps(got, want)
		if d > 2 {
			t.Fatalf("controlExp(%g) = %.17g, math.Exp %.17g (%d units in the last place)", x, got, want, d)
		}
		worst = max(worst, d)
	}
	for range 300000 {
		check((r.Float64() - 0.5) * 1400)
		lu := math.Log(math.Pow(10, -300+310*r.Float64()))
		check(-ctlAlpha / 2 * lu)
		check(ctlBeta / 2 * lu)
		check((r.Float64() - 0.5) * 1e-6)
	}
	for _, x := range []float64{0, math.Copysign(0, -1), 1e-300, -1e-10, 1e-9, 699.9, -699.9, 709, 710, -745, -746, math.Inf(1), math.Inf(-1), math.NaN()} {
		if a, b := controlExp(x), math.Exp(x); ulps(a, b) > 2 && !(math.IsNaN(a) && math.IsNaN(b)) {
			t.Errorf("controlExp(%g) = %g, math.Exp %g", x, a, b)
		}
	}
	t.Logf("largest difference: %d units in the last place", worst)
}

// TestStepControl: the ratios StepControl gives over long runs of errors
// (accepted and rejected, at the floor 1e-4, zero, NaN and infinite) are
// those of the DOPRI5 code's control written as it is, with math.Pow, a
// square root and divisions (E. Hairer, S. P. Norsett and G. Wanner,
// Solving Ordinary Differential Equations I, 2nd ed., sec. II.4; their
// DOPRI5: fac11 = err^expo1, fac = fac11/facold^beta, fac = max(facc2,
// min(facc1, fac/safe)), hnew = h/fac, and after a rejection
// hnew = h/min(facc1, fac11/safe); facold = max(err, 1e-4) after an
// accepted step), to 2e-15 relative, and accept the same steps.
func TestStepControl(t *testing.T) {
	const safe, facc1, facc2, beta = 0.9, 1 / 0.2, 1 / 10.0, 0.04
	const expo1 = 0.2 - beta*0.75
	r := rand.New(rand.NewPCG(5, 6))
	var c StepControl
	c.Restart()
	facold := 1e-4
	worst := 0.0
	for i := range 500000 {
		var err float64
		switch i % 50 {
		case 7:
			err = 0
		case 8:
			err = 1e-4
		case 9:
			err = math.NaN()
		case 10:
			err = math.Inf(1)
		case 11:
			err = 1
		default:
			err = math.Pow(10, -12+14*r.Float64())
		}
		if i%997 == 0 {
			c.Restart()
			facold = 1e-4
		}
		u := err * err
		e := err
		if math.IsNaN(e) || math.IsInf(e, 0) {
			e = 1e10
		}
		fac11 := math.Pow(e, expo1)
		var want float64
		accepted := e <= 1
		if accepted {
			fac := fac11 / math.Pow(facold, beta)
			fac = math.Max(facc2, math.Min(facc1, fac/safe))
			want = 1 / fac
			facold = math.Max(e, 1e-4)
		} else {
			want = 1 / math.Min(facc1, fac11/safe)
		}
		got, acc := c.Next(u)
		if acc != accepted {
			t.Fatalf("error %g: accepted %v, DOPRI5 %v", err, acc, accepted)
		}
		d := math.Abs(got/want - 1)
		if d > 2e-15 {
			t.Fatalf("error %g: ratio %.17g, DOPRI5 %.17g", err, got, want)
		}
		worst = max(worst, d)
	}
	t.Logf("largest relative difference: %.3g", worst)
}
