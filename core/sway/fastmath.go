package sway

import "math"

// The step-size control's exponential and logarithm for the specialised
// path. Go's math.Exp and math.Log are written in Go on js/wasm (assembly
// on amd64), each a chain of calls (Frexp, Ldexp, expmulti) that costs
// more there than a step's arithmetic. stepExp and stepLog are the same
// algorithms as those Go sources (the FreeBSD msun e_exp.c and e_log.c
// reductions and polynomials, from Sun Microsystems' fdlibm), with the
// exponent taken apart and put together by bit operations, for normal
// arguments and results; anything else goes to package math. They give
// the bits of those Go sources on every platform: on wasm the same as
// math.Exp and math.Log, elsewhere (amd64 runs assembly of its own) within
// two units in the last place of them (fastmath_test.go).

const (
	ln2Hi = 6.93147180369123816490e-01 // 3fe62e42 fee00000
	ln2Lo = 1.90821492927058770002e-10 // 3dea39ef 35793c76
	log2e = 1.44269504088896338700e+00
)

// stepLog is math.Log for positive normal x.
func stepLog(x float64) float64 {
	const (
		L1 = 6.666666666666735130e-01 // 3FE55555 55555593
		L2 = 3.999999999940941908e-01 // 3FD99999 9997FA04
		L3 = 2.857142874366239149e-01 // 3FD24924 94229359
		L4 = 2.222219843214978396e-01 // 3FCC71C5 1D8E78AF
		L5 = 1.818357216161805012e-01 // 3FC74664 96CB03DE
		L6 = 1.531383769920937332e-01 // 3FC39A09 D078C69F
		L7 = 1.479819860511658591e-01 // 3FC2F112 DF3E5244
	)
	b := math.Float64bits(x)
	e := int(b>>52) & 0x7ff
	if e == 0 || e == 0x7ff || b>>63 != 0 {
		return math.Log(x) // zero, subnormal, negative, infinite, NaN
	}
	// Frexp: x = f1 * 2^ki with f1 in [1/2, 1).
	f1 := math.Float64frombits(b&^(0x7ff<<52) | 1022<<52)
	ki := e - 1022
	if f1 < math.Sqrt2/2 {
		f1 *= 2
		ki--
	}
	f := f1 - 1
	k := float64(ki)
	s := f / (2 + f)
	s2 := s * s
	s4 := s2 * s2
	t1 := s2 * (L1 + s4*(L3+s4*(L5+s4*L7)))
	t2 := s4 * (L2 + s4*(L4+s4*L6))
	R := t1 + t2
	hfsq := 0.5 * f * f
	return k*ln2Hi - ((hfsq - (s*(hfsq+R) + k*ln2Lo)) - f)
}

// stepExp is math.Exp for results that are normal numbers.
func stepExp(x float64) float64 {
	const (
		P1 = 1.66666666666666657415e-01  // 0x3FC55555; 0x55555555
		P2 = -2.77777777770155933842e-03 // 0xBF66C16C; 0x16BEBD93
		P3 = 6.61375632143793436117e-05  // 0x3F11566A; 0xAF25DE2C
		P4 = -1.65339022054652515390e-06 // 0xBEBBBD41; 0xC5D26BF1
		P5 = 4.13813679705723846039e-08  // 0x3E663769; 0x72BEA4D0
	)
	// Well inside the normal range (|x| < 700), and not so small that
	// math.Exp returns 1 + x.
	if !(x > -700 && x < 700) || (x > -1.0/(1<<28) && x < 1.0/(1<<28)) {
		return math.Exp(x)
	}
	var k int
	if x < 0 {
		k = int(log2e*x - 0.5)
	} else {
		k = int(log2e*x + 0.5)
	}
	hi := x - float64(k)*ln2Hi
	lo := float64(k) * ln2Lo
	r := hi - lo
	t := r * r
	c := r - t*(P1+t*(P2+t*(P3+t*(P4+t*P5))))
	y := 1 - ((lo - (r*c)/(2-c)) - hi)
	// Ldexp(y, k): y is near 1 and |k| < 1010, so the result is normal
	// and the product by 2^k exact.
	return y * math.Float64frombits(uint64(k+1023)<<52)
}

// swingAtan2 is math.Atan2(y, x) written out for the history's swing
// angle, whose arguments are both positive and finite but for a load at or
// above the suspension point's height: Go's atan2 for them is
// Atan(y/x), that is satan(y/x), written here in one call instead of a
// chain of four (the same reduction and polynomial, from the Cephes
// library's atan.c by Stephen L. Moshier, as Go's math/atan.go; on every
// platform Go runs those sources for Atan2, so the bits are the same,
// fastmath_test.go). Any other argument goes to package math.
func swingAtan2(y, x float64) float64 {
	const (
		morebits = 6.123233995736765886130e-17 // pi/2 = PIO2 + morebits
		tan3pio8 = 2.41421356237309504880      // tan(3*pi/8)
	)
	if !(y > 0 && x > 0 && y <= math.MaxFloat64 && x <= math.MaxFloat64) {
		return math.Atan2(y, x)
	}
	r := y / x
	if r <= 0.66 {
		return xatan(r)
	}
	if r > tan3pio8 {
		return math.Pi/2 - xatan(1/r) + morebits
	}
	return math.Pi/4 + xatan((r-1)/(r+1)) + 0.5*morebits
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
