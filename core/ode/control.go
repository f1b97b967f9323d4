package ode

import "math"

// The step-size control of Solver.Step, kept here for the specialised
// steppers too (core/sway's fastSolver, the bench's floor kernel), so that
// every stepper takes its steps by the same arithmetic.
//
// After a step with error norm err (the root mean square of the error
// estimate over the tolerances) the next step is h·ratio with
//
//	ratio = min(facMax, max(facMin, safe·facOld^β / err^α))   accepted (err <= 1)
//	ratio = max(facMin, safe / err^α)                          rejected
//
// α = 0.2 - 0.75β, β = 0.04, safe = 0.9, facMin = 0.2, facMax = 10, and
// facOld = max(err, 1e-4) of the last accepted step (1e-4 after a
// restart): E. Hairer, S. P. Nørsett and G. Wanner, Solving Ordinary
// Differential Equations I, 2nd ed., Springer 1993, section II.4, and
// their DOPRI5 code's step control with Lund stabilisation (its fac11,
// facold, expo1 and beta), which is written with divisions by fac =
// fac11/facold^β/safe; the ratio is 1/fac.
//
// Nothing of the next step can start before its size is known, so this
// arithmetic lies on the path from one step to the next. Written plainly,
// a square root (err), a logarithm and two exponentials (err^α and
// facOld^β) and three divisions, it took about a fifth of a travel
// step's time natively for about a twentieth of its instructions (the
// diagonal travel example's figures took 75 us, and 56 us with the same
// step sizes replayed from a list). Here the square root goes (the powers
// are taken of the mean square u = err², with halved exponents), the
// divisions become products, facOld^β/err^α is one exponential of the
// two logarithms (facOld's kept from its step), the logarithm reads a
// table and the exponential is a polynomial without the usual division:
// 65 us. The ratios agree with the DOPRI5 formulas written with math.Pow
// to 2e-15 (control_test.go), and every example takes the same steps.
//
// controlLog and controlExp are the logarithm and the exponential for
// this use: accurate to about 2e-16 absolute and to two units in the last
// place respectively, written for the step-to-step latency, not for
// general use.

const (
	ctlSafe   = 0.9
	ctlFacMin = 0.2
	ctlFacMax = 10.0
	ctlBeta   = 0.04 // the Lund stabilisation exponent
	ctlAlpha  = 0.2 - ctlBeta*0.75
)

// StepControl is the step-size control's memory from one step to the
// next. The zero value is a control after a restart (facOld = 1e-4).
type StepControl struct {
	_ [0]func() // not comparable: no equality function
	// lnOldOver is ln(facOld²) - ln(1e-8) >= 0, so that zero is the floor.
	lnOldOver float64
}

// lnFloorSq is ln(1e-8), the logarithm of the least facOld squared.
var lnFloorSq = controlLog(1e-8)

// Restart forgets the earlier steps (facOld = 1e-4).
func (c *StepControl) Restart() { c.lnOldOver = 0 }

// Next returns the ratio of the next step size to the last one's, and
// whether the last step is accepted, for u, the mean of the squares of
// the last step's error estimate over its tolerances (err²). A u that is
// NaN or infinite counts as err = 1e10: the step is rejected and the next
// one is a fifth of it.
func (c *StepControl) Next(u float64) (ratio float64, accept bool) {
	if !(u <= math.MaxFloat64) {
		u = 1e20
	}
	lu := controlLog(u)
	if u <= 1 {
		// safe·facOld^β/err^α as one exponential. Plain comparisons: the
		// builtin min and max of floats are calls in wasm, and no NaN
		// reaches here (u = 0 gives +Inf, which facMax bounds).
		r := ctlSafe * controlExp(ctlBeta/2*(lnFloorSq+c.lnOldOver)-ctlAlpha/2*lu)
		if r < ctlFacMin {
			r = ctlFacMin
		}
		if r > ctlFacMax {
			r = ctlFacMax
		}
		c.lnOldOver = 0
		if lu > lnFloorSq {
			c.lnOldOver = lu - lnFloorSq
		}
		return r, true
	}
	r := ctlSafe * controlExp(-ctlAlpha/2*lu)
	if r < ctlFacMin {
		r = ctlFacMin
	}
	return r, false
}

// logEntry is one interval of controlLog's table: the reciprocal of the
// interval's middle c, rounded, and the logarithm of 1/inv.
type logEntry struct{ inv, ln float64 }

// logTable splits the significand's range [1, 2) into 32 intervals. Its
// logarithms come from fdlibmLog, Go code on every platform, so that the
// table and with it the steps are the same natively and in wasm.
var logTable = func() (t [32]logEntry) {
	for i := range t {
		inv := 1 / (1 + (float64(i)+0.5)/32)
		t[i] = logEntry{inv, -fdlibmLog(inv)}
	}
	return t
}()

const (
	ln2Hi = 6.93147180369123816490e-01 // 3fe62e42 fee00000
	ln2Lo = 1.90821492927058770002e-10 // 3dea39ef 35793c76
	log2e = 1.44269504088896338700e+00
)

// controlLog is ln x for positive normal x (anything else goes to
// math.Log) to about 2e-16 absolute plus a unit in the last place. With
// x = m·2^e, m in [1, 2) in the table's interval of middle c:
// ln x = e ln 2 + ln(1/inv) + log1p(t), t = m·inv - 1, |t| < 1/64,
// and log1p(t) by its Taylor series to t^8 (the next term is below 1e-17).
// The rounding of m·inv, 1.1e-16, is most of the error; it is absolute,
// which is what a power taken as an exponential of it needs.
func controlLog(x float64) float64 {
	b := math.Float64bits(x)
	e := int(b>>52) & 0x7ff
	if e == 0 || e == 0x7ff || b>>63 != 0 {
		return math.Log(x) // zero, subnormal, negative, infinite, NaN
	}
	m := math.Float64frombits(b&(1<<52-1) | 1023<<52)
	en := &logTable[(b>>47)&31]
	t := m*en.inv - 1
	// Estrin's scheme: the pairs are independent of each other.
	t2 := t * t
	t4 := t2 * t2
	p := t + t2*(-1.0/2+t*(1.0/3)) + t4*((-1.0/4+t*(1.0/5))+t2*(-1.0/6+t*(1.0/7))) + t4*t4*(-1.0/8)
	k := float64(e - 1023)
	return k*ln2Hi + (en.ln + (p + k*ln2Lo))
}

// controlExp is e^x for |x| < 700 (anything else goes to math.Exp) to a
// few units in the last place: x = k ln 2 + r with k the nearest integer
// to x/ln 2 (rounded by adding 1.5·2^52) and |r| <= ln(2)/2, then e^r by
// its Taylor series to r^13 (the next term is below 1e-17 of it), in
// Estrin's scheme, times 2^k put into the exponent bits.
func controlExp(x float64) float64 {
	if !(x > -700 && x < 700) {
		return math.Exp(x) // NaN, infinite, or a result near the ends of the range
	}
	const shift = 0x1.8p52
	z := x*log2e + shift
	kf := z - shift
	k := int64(math.Float64bits(z)) - int64(math.Float64bits(shift))
	r := (x - kf*ln2Hi) - kf*ln2Lo
	r2 := r * r
	r4 := r2 * r2
	const (
		c2, c3, c4, c5     = 1.0 / 2, 1.0 / 6, 1.0 / 24, 1.0 / 120
		c6, c7, c8, c9     = 1.0 / 720, 1.0 / 5040, 1.0 / 40320, 1.0 / 362880
		c10, c11, c12, c13 = 1.0 / 3628800, 1.0 / 39916800, 1.0 / 479001600, 1.0 / 6227020800
	)
	// The small terms summed first and 1 added last: one rounding at the
	// scale of the result.
	q := r + r2*(c2+c3*r) + r4*((c4+c5*r)+r2*(c6+c7*r)) +
		r4*r4*((c8+c9*r)+r2*(c10+c11*r)+r4*(c12+c13*r))
	p := 1 + q
	return p * math.Float64frombits(uint64(k+1023)<<52)
}

// fdlibmLog is math.Log's Go source (the FreeBSD msun e_log.c reduction
// and polynomial, from Sun Microsystems' fdlibm) for positive normal x,
// the same bits on every platform; package math runs assembly of its own
// on some (amd64). It fills logTable.
func fdlibmLog(x float64) float64 {
	const (
		L1 = 6.666666666666735130e-01 // 3FE55555 55555593
		L2 = 3.999999999940941908e-01 // 3FD99999 9997FA04
		L3 = 2.857142874366239149e-01 // 3FD24924 94229359
		L4 = 2.222219843214978396e-01 // 3FCC71C5 1D8E78AF
		L5 = 1.818357216161805012e-01 // 3FC74664 96CB03DE
		L6 = 1.531383769920937332e-01 // 3FC39A09 D078C69F
		L7 = 1.479819860511658591e-01 // 3FC2F112 DF3E5244
	)
	f1, ki := math.Frexp(x)
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
