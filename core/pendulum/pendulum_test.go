package pendulum

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/ode"
	"swaysheet/core/units"
)

const g = units.StandardGravity

// fixed is a load on a rope of length l under a fixed suspension point.
func fixed(l float64) *Model {
	return &Model{
		Mass:       1000,
		Suspension: func(float64) Kinematics { return Kinematics{} },
		Rope:       func(float64) (float64, float64, float64) { return l, 0, 0 },
	}
}

// simulate integrates m from y0 over [0, tEnd], projecting after every
// step, and calls step with the solver after each accepted step.
func simulate(t *testing.T, m *Model, y0 []float64, tEnd, tol float64, step func(v *ode.Solver)) []float64 {
	t.Helper()
	v := ode.New(m.Func, StateLen, ode.Settings{RelTol: tol, AbsTol: tol * 1e-2})
	v.Reset(0, y0)
	for {
		done, err := v.Step(tEnd)
		if err != nil {
			t.Fatal(err)
		}
		if step != nil {
			step(v)
		}
		y := v.State()
		Project(y)
		v.SetState(y)
		if done {
			return append([]float64(nil), y...)
		}
	}
}

// upCrossings returns the times where component i of the state crosses
// zero from below, located by bisection on the dense output.
func upCrossings(t *testing.T, m *Model, y0 []float64, i int, tEnd, tol float64) []float64 {
	var out []float64
	buf := make([]float64, StateLen)
	simulate(t, m, y0, tEnd, tol, func(v *ode.Solver) {
		a, b := v.LastStep()
		v.Dense(a, buf)
		fa := buf[i]
		v.Dense(b, buf)
		if !(fa < 0 && buf[i] >= 0) {
			return
		}
		for range 60 {
			c := 0.5 * (a + b)
			v.Dense(c, buf)
			if buf[i] < 0 {
				a = c
			} else {
				b = c
			}
		}
		out = append(out, 0.5*(a+b))
	})
	return out
}

func meanPeriod(ts []float64) float64 {
	return (ts[len(ts)-1] - ts[0]) / float64(len(ts)-1)
}

// Source: small-amplitude period T0 = 2*pi*sqrt(L/g) with standard gravity
// g_n = 9.80665 m/s^2 (ISO 80000-3). At 0.5 deg the amplitude correction
// (1 + theta^2/16) is below 5e-6.
func TestSmallAmplitudePeriod(t *testing.T) {
	for _, l := range []float64{2, 8.5, 30} {
		m := fixed(l)
		y0 := StateFromSwing(0.5*units.Degree, 0, 0, 0, l)
		// Release at +x: n_x falls, so the rate u_x crosses zero from
		// below once per period at the far turning point.
		ts := upCrossings(t, m, y0, 3, 20*2*math.Pi*math.Sqrt(l/g), 1e-10)
		got := meanPeriod(ts)
		want := 2 * math.Pi * math.Sqrt(l/g)
		if rel := math.Abs(got/want - 1); rel > 1e-5 {
			t.Errorf("L = %g m: period %.8g s, want %.8g s (rel %.2g)", l, got, want, rel)
		}
	}
}

// Source: exact period of the plane pendulum T = 4*sqrt(L/g)*K(k),
// k = sin(theta0/2) (Abramowitz & Stegun 17.3), with gonum's
// mathext.CompleteK, which takes the parameter m = k^2, as the reference
// library.
func TestLargeAmplitudePeriod(t *testing.T) {
	const l = 10.0
	for _, deg := range []float64{10, 30, 60, 90} {
		th := deg * units.Degree
		m := fixed(l)
		y0 := StateFromSwing(th, 0, 0, 0, l)
		ts := upCrossings(t, m, y0, 3, 12*2*math.Pi*math.Sqrt(l/g)*1.2, 1e-11)
		got := meanPeriod(ts)
		k := math.Sin(th / 2)
		want := 4 * math.Sqrt(l/g) * mathext.CompleteK(k*k)
		if rel := math.Abs(got/want - 1); rel > 1e-7 {
			t.Errorf("%g deg: period %.9g s, want %.9g s (rel %.2g)", deg, got, want, rel)
		}
	}
}

// Source: under a constant suspension acceleration a the apparent gravity
// tilts by beta = atan(a/g); released from rest the load swings between 0
// and 2*beta, symmetrically about beta (exact result of the pendulum in a
// uniformly accelerated frame; any classical mechanics text).
func TestSuddenAccelerationPeakAndLean(t *testing.T) {
	const l, a = 6.0, 3.0 // 3 m/s^2 makes the swing clearly nonlinear
	m := fixed(l)
	m.Suspension = func(t float64) Kinematics {
		return Kinematics{Pos: r3.Vec{X: 0.5 * a * t * t}, Vel: r3.Vec{X: a * t}, Acc: r3.Vec{X: a}}
	}
	beta := math.Atan(a / g)
	y0 := StateFromSwing(0, 0, 0, 0, l)
	peak, low := 0.0, math.Inf(1)
	buf := make([]float64, StateLen)
	var p Point
	simulate(t, m, y0, 30, 1e-11, func(v *ode.Solver) {
		t0, t1 := v.LastStep()
		for j := 0; j <= 20; j++ {
			tt := t0 + (t1-t0)*float64(j)/20
			v.Dense(tt, buf)
			Project(buf)
			m.Eval(tt, buf, &p)
			// The load trails the acceleration: the rope leans toward -x.
			th := math.Atan2(-p.Dir.X, -p.Dir.Z)
			peak = math.Max(peak, th)
			if tt > 1 {
				low = math.Min(low, th)
			}
		}
	})
	if d := math.Abs(peak - 2*beta); d > 1e-6 {
		t.Errorf("peak %.8f deg, want 2*atan(a/g) = %.8f deg", peak/units.Degree, 2*beta/units.Degree)
	}
	if mid := 0.5 * (peak + low); math.Abs(mid-beta) > 1e-6 {
		t.Errorf("mean lean %.8f deg, want atan(a/g) = %.8f deg", mid/units.Degree, beta/units.Degree)
	}
}

// Source: conical pendulum at cone angle alpha: period
// 2*pi*sqrt(L*cos(alpha)/g), tension m*g/cos(alpha) (any mechanics text).
func TestConicalPendulum(t *testing.T) {
	const l = 12.0
	for _, deg := range []float64{5, 20, 45} {
		al := deg * units.Degree
		m := fixed(l)
		// Circular motion needs v^2 = g*L*sin(alpha)*tan(alpha), tangential.
		v := math.Sqrt(g * l * math.Sin(al) * math.Tan(al))
		y0 := StateFromSwing(al, 0, 0, v, l)
		want := 2 * math.Pi * math.Sqrt(l*math.Cos(al)/g)
		// Revolutions: n_y crosses zero from below once per turn.
		ts := upCrossings(t, m, y0, 1, 10*want, 1e-11)
		if got := meanPeriod(ts); math.Abs(got/want-1) > 1e-7 {
			t.Errorf("%g deg: period %.9g s, want %.9g s", deg, got, want)
		}
		var p Point
		buf := make([]float64, StateLen)
		simulate(t, m, y0, 3*want, 1e-11, func(v *ode.Solver) {
			_, t1 := v.LastStep()
			v.Dense(t1, buf)
			Project(buf)
			m.Eval(t1, buf, &p)
			if tw := m.Mass * g / math.Cos(al); math.Abs(p.Tension/tw-1) > 1e-7 {
				t.Fatalf("%g deg: tension %.9g N, want m*g/cos(alpha) = %.9g N", deg, p.Tension, tw)
			}
			if th := p.SwingRad(); math.Abs(th-al) > 1e-7 {
				t.Fatalf("%g deg: cone angle drifted to %.9g deg", deg, th/units.Degree)
			}
		})
	}
}

// Source: conservation of energy for a conservative system (any mechanics
// text); E = m*|v|^2/2 + m*g*z with a fixed suspension point and no drag.
// Issue requirement: relative drift below 1e-9 over 600 s.
func TestEnergyConserved(t *testing.T) {
	const l = 7.0
	m := fixed(l)
	// A 3D swing: 25 deg out, with a sideways push.
	y0 := StateFromSwing(25*units.Degree, 0.3, 0.2, 1.1, l)
	energy := func(y []float64) float64 {
		var p Point
		m.Eval(0, y, &p)
		return 0.5*m.Mass*r3.Dot(p.LoadVel, p.LoadVel) + m.Mass*g*p.LoadPos.Z
	}
	e0 := energy(y0)
	worst := 0.0
	// Energy is measured against the swing's energy scale m*g*L.
	scale := m.Mass * g * l
	yEnd := simulate(t, m, y0, 600, 1e-12, func(v *ode.Solver) {
		y := append([]float64(nil), v.State()...)
		Project(y)
		worst = math.Max(worst, math.Abs(energy(y)-e0)/scale)
	})
	if worst > 1e-9 {
		t.Errorf("energy drift %.3g of m*g*L over 600 s", worst)
	}
	if d := math.Abs(math.Sqrt(yEnd[0]*yEnd[0]+yEnd[1]*yEnd[1]+yEnd[2]*yEnd[2]) - 1); d > 1e-12 {
		t.Errorf("rope length error %.3g after 600 s", d)
	}
}

// Source: energy plus radial equation of the plane pendulum (any
// mechanics text): tension m*g*(3 - 2*cos(theta0)) at the bottom and
// m*g*cos(theta0) at the ends of a free swing of amplitude theta0.
func TestTensionOfFreeSwing(t *testing.T) {
	const l = 9.0
	th := 40 * units.Degree
	m := fixed(l)
	var p Point
	m.Eval(0, StateFromSwing(th, 0, 0, 0, l), &p)
	if want := m.Mass * g * math.Cos(th); math.Abs(p.Tension/want-1) > 1e-14 {
		t.Errorf("tension at the end of the swing %.12g N, want %.12g N", p.Tension, want)
	}
	// At the bottom, from energy: v^2 = 2*g*L*(1 - cos(theta0)).
	v := math.Sqrt(2 * g * l * (1 - math.Cos(th)))
	m.Eval(0, StateFromSwing(0, 0, v, 0, l), &p)
	if want := m.Mass * g * (3 - 2*math.Cos(th)); math.Abs(p.Tension/want-1) > 1e-14 {
		t.Errorf("tension at the bottom %.12g N, want %.12g N", p.Tension, want)
	}
}

// Source: a hoist accelerating the load upward at a adds m*a to the rope
// pull (Newton's second law).
func TestHoistAccelerationAddsToTension(t *testing.T) {
	m := fixed(5)
	m.Rope = func(float64) (float64, float64, float64) { return 5, -0.5, -0.4 } // shortening, faster
	var p Point
	m.Eval(0, StateFromSwing(0, 0, 0, 0, 5), &p)
	if want := m.Mass * (g + 0.4); math.Abs(p.Tension/want-1) > 1e-14 {
		t.Errorf("tension %.12g N, want m*(g + a) = %.12g N", p.Tension, want)
	}
}

func TestProject(t *testing.T) {
	y := []float64{0.3, 0.1, -1.2, 0.5, 0.2, 0.4}
	Project(y)
	if n := math.Sqrt(y[0]*y[0] + y[1]*y[1] + y[2]*y[2]); math.Abs(n-1) > 1e-15 {
		t.Errorf("|n| = %v", n)
	}
	if d := y[0]*y[3] + y[1]*y[4] + y[2]*y[5]; math.Abs(d) > 1e-15 {
		t.Errorf("n.u = %v", d)
	}
}
