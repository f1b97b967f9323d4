// Package shaper provides input shapers for sway control: short sequences
// of impulses that, convolved with any command, cancel the residual
// vibration of a lightly damped mode of natural period T (circular
// frequency w = 2*pi/T) and damping ratio zeta.
//
// With K = exp(-zeta*pi/sqrt(1-zeta^2)) and the damped period
// Td = T/sqrt(1-zeta^2):
//
//	ZV  (zero vibration):            A = [1, K] / (1+K)          at [0, Td/2]
//	ZVD (zero vibration, derivative): A = [1, 2K, K^2] / (1+K)^2 at [0, Td/2, Td]
//
// (Singer & Seering, "Preshaping command inputs to reduce system
// vibration", ASME J. Dyn. Sys. Meas. Control 112, 1990.)
//
//	EI (extra insensitive, zeta = 0, tolerance V):
//	                                 A = [(1+V)/4, (1-V)/2, (1+V)/4] at [0, T/2, T]
//
// (Singhose, Seering & Singer, "Residual vibration reduction using vector
// diagrams to generate shaped inputs", ASME J. Mech. Design 116, 1994;
// journal and volume from memory.)
// EI leaves exactly V of the vibration at the design frequency and none at
// two frequencies either side of it, which widens the band of low residual.
//
// The percentage residual vibration of a shaper on a mode of frequency w
// and damping zeta, relative to a single unit impulse, is (Singer & Seering
// 1990)
//
//	V(w, zeta) = exp(-zeta*w*tn) * sqrt(C^2 + S^2),
//	C = sum_i A_i exp(zeta*w*t_i) cos(wd*t_i),
//	S = sum_i A_i exp(zeta*w*t_i) sin(wd*t_i),  wd = w*sqrt(1-zeta^2),
//
// tn the last impulse time. In the linear model the residual swing of any
// shaped command is V times that of the unshaped command.
//
// Two modes (hook block and rigging, package pendulum's Double): the
// convolution of a shaper designed for each mode, A*B, has an impulse
// A_i*B_j at every sum t_i + s_j. Its sum of rotating vectors factors,
// sum_ij A_i B_j e^(i w (t_i + s_j)) = (sum_i A_i e^(i w t_i)) (sum_j B_j e^(i w s_j)),
// so V_(A*B)(w) = V_A(w) * V_B(w) undamped (and with damping, the
// exponential weights factor the same way): it is zero wherever either
// shaper's is, at both design frequencies, and its duration is the sum of
// the two durations. The factoring is shown here; the convolution as a
// way to shape several modes goes back to Singer & Seering 1990, and
// Singhose, Crain & Seering, "Convolved and simultaneous two-mode input
// shapers", IEE Proc. Control Theory Appl. 144 (1997), compare it with
// shorter direct two-mode designs (both attributions from memory).
package shaper

import (
	"fmt"
	"math"
	"sort"

	"swaysheet/core/motion"
)

// Kinds of shaper.
const (
	ZV  = "zv"
	ZVD = "zvd"
	EI  = "ei"
)

// Kinds lists the shaper kinds in order of robustness.
var Kinds = []string{ZV, ZVD, EI}

// DefaultTolerance is the EI shaper's residual at the design frequency
// when none is given: 5 %, the value used as an example by Singhose,
// Seering & Singer (1994) (from memory).
const DefaultTolerance = 0.05

// Shaper is a designed shaper.
type Shaper struct {
	Kind      string  `json:"kind"`
	PeriodS   float64 `json:"period_s"` // design natural period T
	Damping   float64 `json:"damping"`  // design damping ratio zeta
	Tolerance float64 `json:"tolerance,omitempty"`
	// SecondPeriodS is the second mode's design period of a two-mode
	// shaper (Convolve), zero for a single-mode one.
	SecondPeriodS float64          `json:"second_period_s,omitempty"`
	Impulses      []motion.Impulse `json:"-"`
}

// New designs a shaper of the given kind for natural period periodS and
// damping ratio zeta (0 <= zeta < 1). tolerance is EI's V (0 < V < 1);
// zero means DefaultTolerance. EI is given here for zeta = 0 only.
func New(kind string, periodS, zeta, tolerance float64) (*Shaper, error) {
	if !(periodS > 0) || math.IsInf(periodS, 0) {
		return nil, fmt.Errorf("shaper: the design period must be positive, not %g s", periodS)
	}
	if !(zeta >= 0 && zeta < 1) {
		return nil, fmt.Errorf("shaper: the damping ratio must be from 0 to below 1, not %g", zeta)
	}
	s := &Shaper{Kind: kind, PeriodS: periodS, Damping: zeta}
	td := periodS / math.Sqrt(1-zeta*zeta)
	k := math.Exp(-zeta * math.Pi / math.Sqrt(1-zeta*zeta))
	switch kind {
	case ZV:
		s.Impulses = []motion.Impulse{{A: 1 / (1 + k), T: 0}, {A: k / (1 + k), T: td / 2}}
	case ZVD:
		d := (1 + k) * (1 + k)
		s.Impulses = []motion.Impulse{{A: 1 / d, T: 0}, {A: 2 * k / d, T: td / 2}, {A: k * k / d, T: td}}
	case EI:
		if zeta != 0 {
			return nil, fmt.Errorf("shaper: the EI shaper here is the undamped one; use damping 0 (crane sway is lightly damped)")
		}
		v := tolerance
		if v == 0 {
			v = DefaultTolerance
		}
		if !(v > 0 && v < 1) {
			return nil, fmt.Errorf("shaper: the EI tolerance must be above 0 and below 1, not %g", tolerance)
		}
		s.Tolerance = v
		s.Impulses = []motion.Impulse{{A: (1 + v) / 4, T: 0}, {A: (1 - v) / 2, T: periodS / 2}, {A: (1 + v) / 4, T: periodS}}
	default:
		return nil, fmt.Errorf("shaper: unknown kind %q: accepted %q", kind, Kinds)
	}
	return s, nil
}

// Duration is the last impulse time: how much longer the shaped move lasts.
func (s *Shaper) Duration() float64 { return s.Impulses[len(s.Impulses)-1].T }

// Residual is V(w, zeta) of the shaper, as a fraction (1 = unshaped).
func (s *Shaper) Residual(omega, zeta float64) float64 { return Residual(s.Impulses, omega, zeta) }

// Convolve returns the two-mode shaper a*b: impulses at all sums of the
// times, amplitudes the products, sorted by time, those at the same time
// (within 1e-9 s) merged. Its kind is a.Kind+"2" when both are of one
// kind, PeriodS is a's period and SecondPeriodS b's.
func Convolve(a, b *Shaper) *Shaper {
	var imps []motion.Impulse
	for _, x := range a.Impulses {
		for _, y := range b.Impulses {
			imps = append(imps, motion.Impulse{A: x.A * y.A, T: x.T + y.T})
		}
	}
	sort.SliceStable(imps, func(i, j int) bool { return imps[i].T < imps[j].T })
	out := imps[:1]
	for _, im := range imps[1:] {
		if last := &out[len(out)-1]; im.T-last.T < 1e-9 {
			last.A += im.A
			continue
		}
		out = append(out, im)
	}
	kind := a.Kind + "*" + b.Kind
	if a.Kind == b.Kind {
		kind = a.Kind + "2"
	}
	return &Shaper{Kind: kind, PeriodS: a.PeriodS, SecondPeriodS: b.PeriodS, Damping: a.Damping,
		Tolerance: a.Tolerance, Impulses: out}
}

// NewTwoMode designs the convolution of two shapers of one kind, the first
// for period periodS, the second for secondS (see Convolve).
func NewTwoMode(kind string, periodS, secondS, zeta, tolerance float64) (*Shaper, error) {
	a, err := New(kind, periodS, zeta, tolerance)
	if err != nil {
		return nil, err
	}
	b, err := New(kind, secondS, zeta, tolerance)
	if err != nil {
		return nil, fmt.Errorf("%w (second mode)", err)
	}
	return Convolve(a, b), nil
}

// Apply returns the profile p passed through the shaper.
func (s *Shaper) Apply(p motion.Profile) *motion.Shaped {
	return &motion.Shaped{Base: p, Impulses: s.Impulses}
}

// Residual is the residual vibration V(w, zeta) of an impulse sequence, as
// a fraction of that of a single unit impulse (formula in the package
// comment).
func Residual(imps []motion.Impulse, omega, zeta float64) float64 {
	wd := omega * math.Sqrt(1-zeta*zeta)
	tn := imps[len(imps)-1].T
	var c, s float64
	for _, im := range imps {
		e := im.A * math.Exp(zeta*omega*(im.T-tn))
		c += e * math.Cos(wd*im.T)
		s += e * math.Sin(wd*im.T)
	}
	return math.Hypot(c, s)
}
