package shaper

import (
	"math"
	"testing"

	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
	"swaysheet/core/units"
)

// The convolved shaper's residual vibration is the product of its two
// factors' at every frequency and damping (the rotating-vector sum of the
// residual vibration function of Singer & Seering 1990 factors for a
// convolution; two-mode convolved shapers: Singhose, Crain & Seering 1997,
// from memory), so
// the two-mode ZV and ZVD leave nothing at either design frequency and the
// two-mode EI at most its tolerance.
func TestTwoModeResidualFunction(t *testing.T) {
	const t1, t2 = 6.4, 2.3
	for _, zeta := range []float64{0, 0.05} {
		for _, kind := range Kinds {
			if kind == EI && zeta != 0 {
				continue
			}
			a, _ := New(kind, t1, zeta, 0)
			b, _ := New(kind, t2, zeta, 0)
			c, err := NewTwoMode(kind, t1, t2, zeta, 0)
			if err != nil {
				t.Fatal(err)
			}
			if c.Kind != kind+"2" || c.PeriodS != t1 || c.SecondPeriodS != t2 {
				t.Errorf("%s: two-mode shaper %q %g %g", kind, c.Kind, c.PeriodS, c.SecondPeriodS)
			}
			sum := 0.0
			for i, im := range c.Impulses {
				sum += im.A
				if i > 0 && !(im.T > c.Impulses[i-1].T) {
					t.Errorf("%s: impulse times not ascending: %+v", kind, c.Impulses)
				}
			}
			if !near(sum, 1, 1e-14) || !near(c.Duration(), a.Duration()+b.Duration(), 1e-12) {
				t.Errorf("%s: amplitudes sum to %v, duration %v", kind, sum, c.Duration())
			}
			for _, w := range []float64{0.3, 2 * math.Pi / t1, 1.7, 2 * math.Pi / t2, 4.1} {
				got, want := c.Residual(w, zeta), a.Residual(w, zeta)*b.Residual(w, zeta)
				if !near(got, want, 1e-13) {
					t.Errorf("%s zeta %g w %g: V = %g, product of the factors %g", kind, zeta, w, got, want)
				}
			}
			for _, tm := range []float64{t1, t2} {
				v := c.Residual(2*math.Pi/tm, zeta)
				limit := 1e-13
				if kind == EI {
					limit = DefaultTolerance
				}
				if v > limit {
					t.Errorf("%s zeta %g: V = %g at the design period %g s", kind, zeta, v, tm)
				}
			}
		}
	}
	// ZV*ZV undamped: 1/4 at 0, T2/2, T1/2, (T1+T2)/2.
	c, _ := NewTwoMode(ZV, 6, 2, 0, 0)
	want := [][2]float64{{0.25, 0}, {0.25, 1}, {0.25, 3}, {0.25, 4}}
	for i, im := range c.Impulses {
		if !near(im.A, want[i][0], 1e-15) || !near(im.T, want[i][1], 1e-12) {
			t.Errorf("ZV*ZV impulse %d = %+v, want %v", i, im, want[i])
		}
	}
}

// In the linearised hook-and-rigging pendulum (the standard two-mass
// pendulum, pendulum.LinearModes) with its suspension point accelerated by
// a shaped unit step, the two-mode ZV and ZVD shapers leave no swing in
// either mode after the last impulse, where each single-mode shaper tuned
// to the first mode leaves the second ringing. The linear equations are
// integrated numerically here, independently of the formula for V:
//
//	M q¨ + K q = -b a(t),  M = [[m L1^2, m2 L1 L2], [m2 L1 L2, m2 L2^2]],
//	K = diag(m g L1, m2 g L2),  b = (m L1, m2 L2),  m = m1 + m2,
//
// in the absolute angles q of rope and rigging (Lagrange's equations of the
// double pendulum on a moving support, linearised).
func TestTwoModeLinearDoublePendulum(t *testing.T) {
	g := units.StandardGravity
	const m1, m2, l1, l2 = 1400.0, 1600.0, 9.0, 6.0
	md := pendulum.LinearModes(m1, m2, l1, l2, g)
	t1, t2 := 2*math.Pi/md.Omega[0], 2*math.Pi/md.Omega[1]
	m := m1 + m2
	mm := [2][2]float64{{m * l1 * l1, m2 * l1 * l2}, {m2 * l1 * l2, m2 * l2 * l2}}
	kk := [2]float64{m * g * l1, m2 * g * l2}
	bb := [2]float64{m * l1, m2 * l2}
	det := mm[0][0]*mm[1][1] - mm[0][1]*mm[1][0]
	// energy is the swing energy left about the equilibrium under a unit
	// acceleration after the impulses (A_i at t_i) of a shaped step.
	energy := func(imps []float64, times []float64) float64 {
		f := func(tt float64, y, dy []float64) {
			a := 0.0
			for i, ti := range times {
				if tt >= ti {
					a += imps[i]
				}
			}
			r0 := -bb[0]*a - kk[0]*y[0]
			r1 := -bb[1]*a - kk[1]*y[1]
			dy[0], dy[1] = y[2], y[3]
			dy[2] = (mm[1][1]*r0 - mm[0][1]*r1) / det
			dy[3] = (-mm[1][0]*r0 + mm[0][0]*r1) / det
		}
		s := ode.New(f, 4, ode.Settings{RelTol: 1e-12, AbsTol: 1e-14})
		s.Reset(0, []float64{0, 0, 0, 0})
		for _, c := range append(append([]float64{}, times[1:]...), times[len(times)-1]+1e-9) {
			if c <= s.T() {
				continue
			}
			for {
				done, err := s.Step(c)
				if err != nil {
					t.Fatal(err)
				}
				if done {
					break
				}
			}
			s.Reset(c, s.State())
		}
		y := s.State()
		// Equilibrium under unit acceleration: K q = -b, q = -(1/g)(1, 1).
		e := [2]float64{y[0] + 1/g, y[1] + 1/g}
		v := [2]float64{y[2], y[3]}
		ke := 0.5 * (v[0]*(mm[0][0]*v[0]+mm[0][1]*v[1]) + v[1]*(mm[1][0]*v[0]+mm[1][1]*v[1]))
		return ke + 0.5*(kk[0]*e[0]*e[0]+kk[1]*e[1]*e[1])
	}
	split := func(s *Shaper) ([]float64, []float64) {
		var a, ts []float64
		for _, im := range s.Impulses {
			a, ts = append(a, im.A), append(ts, im.T)
		}
		return a, ts
	}
	unshaped := energy([]float64{1}, []float64{0})
	for _, kind := range []string{ZV, ZVD} {
		two, _ := NewTwoMode(kind, t1, t2, 0, 0)
		if e := energy(split(two)); e > 1e-9*unshaped {
			t.Errorf("two-mode %s leaves %.3g of the unshaped swing energy", kind, e/unshaped)
		}
		one, _ := New(kind, t1, 0, 0)
		if e := energy(split(one)); e < 1e-4*unshaped {
			t.Errorf("%s tuned to the first mode only leaves %.3g of the energy: the second mode should ring", kind, e/unshaped)
		}
	}
}
