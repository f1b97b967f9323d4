package sway

import (
	"math"

	"swaysheet/core/units"
)

// swingDegrees writes into sw the swing angle of each history sample, in
// degrees, from the rope's components rx, ry, rz (load from suspension):
// math.Atan2(math.Sqrt(rx²+ry²), -rz)/units.Degree, the angle the plain
// recorder gives, to the bit. It runs once over a run's samples: in wasm a
// call a sample cost about as much as the rest of the sample's work.
//
// The arguments of the arctangent, y and x, are both positive and finite
// but for a load at or above the suspension point's height; for them Go's
// atan2 is Atan(y/x), that is satan(y/x), written out here (the same
// reduction and polynomial, from the Cephes library's atan.c by Stephen
// L. Moshier, as Go's math/atan.go; on every platform Go runs those
// sources for Atan2, so the bits are the same, fastmath_test.go). Any
// other argument goes to package math.
func swingDegrees(sw, rx, ry, rz []float64) {
	const (
		morebits = 6.123233995736765886130e-17 // pi/2 = PIO2 + morebits
		tan3pio8 = 2.41421356237309504880      // tan(3*pi/8)
	)
	rx, ry, rz = rx[:len(sw)], ry[:len(sw)], rz[:len(sw)]
	for i := range sw {
		y, x := math.Sqrt(rx[i]*rx[i]+ry[i]*ry[i]), -rz[i]
		var a float64
		switch r := y / x; {
		case !(y > 0 && x > 0 && y <= math.MaxFloat64 && x <= math.MaxFloat64):
			a = math.Atan2(y, x)
		case r <= 0.66:
			a = xatan(r)
		case r > tan3pio8:
			a = math.Pi/2 - xatan(1/r) + morebits
		default:
			a = math.Pi/4 + xatan((r-1)/(r+1)) + 0.5*morebits
		}
		sw[i] = a / units.Degree
	}
}

// xatan is math's xatan: atan(x) for x in [0, 0.66] by a rational
// function (Cephes).
func xatan(x float64) float64 {
	const (
		P0 = -8.750608600031904122785e-01
		P1 = -1.615753718733365076637e+01
		P2 = -7.500855792314704667340e+01
		P3 = -1.228866684490136173410e+02
		P4 = -6.485021904942025371773e+01
		Q0 = +2.485846490142306297962e+01
		Q1 = +1.650270098316988542046e+02
		Q2 = +4.328810604912902668951e+02
		Q3 = +4.853903996359136964868e+02
		Q4 = +1.945506571482613964425e+02
	)
	z := x * x
	z = z * ((((P0*z+P1)*z+P2)*z+P3)*z + P4) / (((((z+Q0)*z+Q1)*z+Q2)*z+Q3)*z + Q4)
	z = x*z + x
	return z
}

// maxf and minf are Go's built-in max and min of two float64s (NaN if
// either is NaN; max(-0, +0) = +0, min(-0, +0) = -0), which Go's wasm
// compiles to calls of the runtime's fmax64 and fmin64 (amd64 to
// instructions); Go inlines these. fastmath_test.go holds them to the
// built-ins' bits.
func maxf(x, y float64) float64 {
	if y != y || y > x {
		return y
	}
	if x != x || x > y || x != 0 || !math.Signbit(x) {
		return x
	}
	return y // x is -0: y, +0 or -0
}

func minf(x, y float64) float64 {
	if y != y || y < x {
		return y
	}
	if x != x || x < y || x != 0 || math.Signbit(x) {
		return x
	}
	return y // x is +0: y, +0 or -0
}
