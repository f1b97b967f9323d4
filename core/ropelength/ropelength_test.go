package ropelength

import (
	"errors"
	"math"
	"strings"
	"testing"

	"swaysheet/core/ode"
	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

const g = units.StandardGravity

func f(v float64) *float64 { return &v }

// simulatedPeriod releases the load from rest with the line from the
// suspension point to the load at theta0 from the vertical and measures
// the mean time between the turning points on the far side (up-crossings
// of the rope's rate) over three cycles, on the full nonlinear model with
// a fixed suspension point. With a hook block (m1 > 0) the rope and
// rigging start in the first linear mode's shape, scaled so that the line
// to the load is at theta0.
func simulatedPeriod(t *testing.T, l1, m1, m2, l2, theta0 float64) float64 {
	t.Helper()
	fixed := func(float64) pendulum.Kinematics { return pendulum.Kinematics{} }
	rope := func(float64) (float64, float64, float64) { return l1, 0, 0 }
	var sys pendulum.System
	var y []float64
	if m1 == 0 {
		sys = &pendulum.Model{Mass: 1, Suspension: fixed, Rope: rope}
		y = pendulum.StateFromSwing(theta0, 0, 0, 0, l1)
	} else {
		sys = &pendulum.Double{M1: m1, M2: m2, L2: l2, Suspension: fixed, Rope: rope}
		v := pendulum.LinearModes(m1, m2, l1, l2, g).Shape[0]
		// Scale a so that atan2(l1 sin(a v0) + l2 sin(a v1), l1 cos + l2 cos) = theta0.
		line := func(a float64) float64 {
			return math.Atan2(l1*math.Sin(a*v[0])+l2*math.Sin(a*v[1]), l1*math.Cos(a*v[0])+l2*math.Cos(a*v[1]))
		}
		lo, hi := 0.0, 2*theta0/math.Max(v[0], v[1])
		for range 100 {
			if c := (lo + hi) / 2; line(c) < theta0 {
				lo = c
			} else {
				hi = c
			}
		}
		a := (lo + hi) / 2
		th1, th2 := a*v[0], a*v[1]
		y = []float64{math.Sin(th1), 0, -math.Cos(th1), 0, 0, 0, math.Sin(th2), 0, -math.Cos(th2), 0, 0, 0}
	}
	s := ode.New(sys.Func, sys.Len(), ode.Settings{RelTol: 1e-11, AbsTol: 1e-13})
	s.Reset(0, y)
	buf := make([]float64, sys.Len())
	var ups []float64
	for len(ups) < 4 {
		done, err := s.Step(1e4)
		if err != nil || done {
			t.Fatalf("no period found: %v", err)
		}
		t0, t1 := s.LastStep()
		s.Dense(t0, buf)
		if f0, f1 := buf[3], s.State()[3]; f0 < 0 && f1 >= 0 {
			a, b := t0, t1
			for range 60 {
				c := (a + b) / 2
				if s.Dense(c, buf); buf[3] < 0 {
					a = c
				} else {
					b = c
				}
			}
			ups = append(ups, (a+b)/2)
		}
		yy := s.State()
		sys.Project(yy)
		s.SetState(yy)
	}
	return (ups[3] - ups[0]) / 3
}

// Source: large-amplitude period T = 4*sqrt(L/g)*K(k), k = sin(theta0/2)
// (Abramowitz & Stegun 17.3; gonum mathext.CompleteK takes m = k^2), with
// T/T0 about 1.0174 at 30 deg (checked with SciPy's ellipk). The length
// found from a timed swing at 5, 15 and 30 deg gives back that period by
// the formula, and the simulated swing of that length at that amplitude
// has the timed period (round trip).
func TestTimedSwingSingleRope(t *testing.T) {
	// Source: SciPy 1.10.1, 2*scipy.special.ellipk(sin(theta0/2)**2)/pi.
	for amp, want := range map[float64]float64{5: 1.000476172485987, 15: 1.0043005791734652, 30: 1.017408797595956} {
		r, err := Find(&Input{Timed: &Timed{Swings: f(1), TimeS: f(8), AmplitudeDeg: amp}})
		if err != nil {
			t.Fatal(err)
		}
		if got := r.FromTimed.AmplitudeFactor; math.Abs(got-want) > 1e-14 {
			t.Errorf("T/T0 at %g deg = %.16f, SciPy's ellipk gives %.16f", amp, got, want)
		}
		if got := 2 * ellipK(math.Pow(math.Sin(amp*units.Degree/2), 2)) / math.Pi; math.Abs(got-want) > 1e-14 {
			t.Errorf("T/T0 at %g deg by the AGM = %.16f, SciPy's ellipk gives %.16f", amp, got, want)
		}
	}
	for _, amp := range []float64{5, 15, 30} {
		// 10 swings of a load on about 18 m of rope, timed.
		r, err := Find(&Input{Timed: &Timed{Swings: f(10), TimeS: f(86.0), AmplitudeDeg: amp}})
		if err != nil {
			t.Fatal(err)
		}
		l := r.RopeLengthM
		k := math.Sin(amp * units.Degree / 2)
		formula := 4 * math.Sqrt(l/g) * ellipK(k*k)
		if math.Abs(formula/8.6-1) > 1e-12 {
			t.Errorf("%g deg: L = %.6f m gives T = %.12f s by the elliptic integral, timed 8.6 s", amp, l, formula)
		}
		sim := simulatedPeriod(t, l, 0, 0, 0, amp*units.Degree)
		t.Logf("%g deg: L = %.6f m, T/T0 = %.7f, simulated period %.9f s (timed 8.6 s, %.2e relative)", amp, l, r.FromTimed.AmplitudeFactor, sim, sim/8.6-1)
		if math.Abs(sim/8.6-1) > 1e-10 {
			t.Errorf("%g deg: simulated period %.9f s, timed 8.6 s", amp, sim)
		}
	}
}

func ellipK(m float64) float64 {
	// The arithmetic-geometric mean, K = pi/(2*AGM(1, sqrt(1-m)))
	// (Abramowitz & Stegun 17.6), independent of gonum's series.
	a, b := 1.0, math.Sqrt(1-m)
	for range 40 {
		a, b = (a+b)/2, math.Sqrt(a*b)
	}
	return math.Pi / (2 * a)
}

// Source: the linearised two-mass pendulum's first mode (core/pendulum
// LinearModes; the standard closed form of the linearised two-mass
// pendulum, checked against eigenvalues there). The rope to the hook found from a small timed swing gives that
// period back; the simulated first mode at 5, 15 and 30 deg, with the one-
// rope amplitude correction, comes back within the differences logged.
func TestTimedSwingHookBlock(t *testing.T) {
	for _, c := range []struct{ m1, m2, l2, period float64 }{
		{1500, 3000, 4, 8},  // hook block of half the load, 4 m of slings
		{2000, 2000, 8, 9},  // heavy block, long slings: the second mode matters
		{300, 6000, 2, 7.5}, // light hook on short chokers
	} {
		for _, amp := range []float64{0, 5, 15, 30} {
			r, err := Find(&Input{Timed: &Timed{Swings: f(5), TimeS: f(5 * c.period), AmplitudeDeg: amp},
				Hook: &Hook{MassKg: f(c.m1), LoadMassKg: f(c.m2), RiggingLengthM: c.l2}})
			if err != nil {
				t.Fatal(err)
			}
			l1 := r.RopeLengthM
			md := pendulum.LinearModes(c.m1, c.m2, l1, c.l2, g)
			if t0 := 2 * math.Pi / md.Omega[0]; math.Abs(t0/r.FromTimed.SmallSwingPeriodS-1) > 1e-12 {
				t.Errorf("%g deg: first mode at L1 = %.6f m has period %.12f s, want %.12f s", amp, l1, t0, r.FromTimed.SmallSwingPeriodS)
			}
			if amp == 0 {
				continue
			}
			sim := simulatedPeriod(t, l1, c.m1, c.m2, c.l2, amp*units.Degree)
			t.Logf("m1 %g kg, m2 %g kg, rigging %g m, %g deg: L1 = %.4f m (effective %.4f m), simulated first mode %.5f s against %g s timed (%.3f %%)",
				c.m1, c.m2, c.l2, amp, l1, r.FromTimed.EffectiveLengthM, sim, c.period, 100*(sim/c.period-1))
			if math.Abs(sim/c.period-1) > tolHook[amp] {
				t.Errorf("%g deg: simulated first mode %.5f s, timed %g s", amp, sim, c.period)
			}
		}
	}
}

// tolHook is what the one-rope amplitude correction is allowed to miss
// the two-mass pendulum's period by (the measured differences, rounded up,
// are in the README's validation table).
var tolHook = map[float64]float64{5: 5e-5, 15: 3e-4, 30: 3e-3}

// From heights: L = sheave - hook + sling + centre; with a hook block the
// rope to the hook and the rigging, and the period a timed swing should
// give; both together agree when they should.
func TestHeights(t *testing.T) {
	h := &Heights{SheaveHeightM: f(32.5), HookHeightM: f(14), SlingDepthM: 3, CentreDepthM: 0.5}
	r, err := Find(&Input{Heights: h})
	if err != nil {
		t.Fatal(err)
	}
	// Source: T = 2*pi*sqrt(L/g) (any mechanics text); one rope is its
	// own effective length.
	if r.RopeLengthM != 22 || math.Abs(r.FromHeights.SmallSwingPeriodS-2*math.Pi*math.Sqrt(22/g)) > 1e-12 ||
		math.Abs(r.FromHeights.EffectiveLengthM-22) > 1e-12 {
		t.Errorf("heights: %+v", r.FromHeights)
	}
	r, err = Find(&Input{Heights: h, Hook: &Hook{MassKg: f(800), LoadMassKg: f(5000)},
		Timed: &Timed{Swings: f(4), TimeS: f(4 * 2 * math.Pi / pendulum.LinearModes(800, 5000, 18.5, 3.5, g).Omega[0])}})
	if err != nil {
		t.Fatal(err)
	}
	if r.RopeLengthM != 18.5 || r.RiggingLengthM != 3.5 {
		t.Errorf("hook from heights: rope %g m, rigging %g m; want 18.5 and 3.5", r.RopeLengthM, r.RiggingLengthM)
	}
	// The effective length is the one rope with the first mode's period,
	// the same from heights as from the timed swing of that period
	// (T = 2*pi*sqrt(L/g), any mechanics text); it lies between the rope
	// to the hook and the whole line, as a slower mode than the rope's alone.
	if he, te := r.FromHeights.EffectiveLengthM, r.FromTimed.EffectiveLengthM; math.Abs(he/te-1) > 1e-12 || he <= 18.5 {
		t.Errorf("hook from heights: effective length %g m, timed %g m", he, te)
	}
	t.Logf("heights %.4f m, timed %.4f m, %.2f %%; notes %q", r.FromHeights.RopeToHookM, r.FromTimed.RopeToHookM, *r.DifferencePct, r.Notes)
	if len(r.Notes) != 0 {
		t.Errorf("agreeing answers got notes %q", r.Notes)
	}
	r, _ = Find(&Input{Heights: h, Timed: &Timed{Swings: f(4), TimeS: f(30)}})
	if len(r.Notes) == 0 || !strings.Contains(r.Notes[0], "disagree") {
		t.Errorf("disagreeing answers: notes %q", r.Notes)
	}
}

// Bad input names the field and the accepted range (README "Bad input").
func TestBadInput(t *testing.T) {
	for _, c := range []struct {
		name  string
		in    Input
		field string
		says  string
	}{
		{"nothing", Input{}, "heights", "give heights"},
		{"no hook height", Input{Heights: &Heights{SheaveHeightM: f(30)}}, "heights.hook_height_m", "is required"},
		{"hook above sheave", Input{Heights: &Heights{SheaveHeightM: f(10), HookHeightM: f(12)}}, "heights.hook_height_m", "must be below the sheave"},
		{"negative sling", Input{Heights: &Heights{SheaveHeightM: f(30), HookHeightM: f(12), SlingDepthM: -1}}, "heights.sling_depth_m", "-1 is out of range: accepted from 0 up to 100 m"},
		{"zero swings", Input{Timed: &Timed{Swings: f(0), TimeS: f(30)}}, "timed.swings", "0 is out of range: accepted above 0"},
		{"no time", Input{Timed: &Timed{Swings: f(3)}}, "timed.time_s", "is required"},
		{"amplitude", Input{Timed: &Timed{Swings: f(3), TimeS: f(30), AmplitudeDeg: 80}}, "timed.amplitude_deg", "accepted from 0 up to 60 deg"},
		{"NaN", Input{Timed: &Timed{Swings: f(3), TimeS: f(math.NaN())}}, "timed.time_s", "out of range"},
		{"too short", Input{Timed: &Timed{Swings: f(10), TimeS: f(5)}}, "timed.time_s", "rope length of"},
		{"hook without rigging", Input{Timed: &Timed{Swings: f(3), TimeS: f(30)}, Hook: &Hook{MassKg: f(500), LoadMassKg: f(2000)}}, "hook.rigging_length_m", "is required"},
		{"faster than the rigging", Input{Timed: &Timed{Swings: f(10), TimeS: f(30)}, Hook: &Hook{MassKg: f(500), LoadMassKg: f(2000), RiggingLengthM: 5}}, "timed.time_s", "too short for 5 m of rigging"},
	} {
		_, err := Find(&c.in)
		var es scenario.Errors
		if !errors.As(err, &es) || es[0].Field != c.field || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %v; want %s: ...%s...", c.name, err, c.field, c.says)
		}
	}
}
