package ropelength

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// beam is a 12 m by 0.5 m by 1 m load of 5 t on four legs of legM from
// the hook to the corners of its top face, no hook block: the four legs
// and the hook are a rigid frame on the load, d its hook's height above
// the centre of mass and k its radius of gyration about the width axis
// (the axis it pitches about when it swings along its length).
func beam(legM float64) (l *Load, d, k float64) {
	var legs []scenario.BodyLeg
	for _, s := range [][2]float64{{1, 1}, {-1, 1}, {-1, -1}, {1, -1}} {
		legs = append(legs, scenario.BodyLeg{LengthM: f(legM), AttachXM: 6 * s[0], AttachYM: 0.25 * s[1], AttachZM: f(0.5)})
	}
	l = &Load{MassKg: f(5000), Body: &scenario.Body{LengthM: f(12), WidthM: f(0.5), HeightM: f(1), Legs: legs}}
	// Solid box: k^2 = (a^2 + c^2)/12 (any mechanics text).
	return l, 0.5 + math.Sqrt(legM*legM-36-0.0625), math.Sqrt((144.0 + 1) / 12)
}

// bodyOnString is the first mode's period of a rigid body hung by a
// massless string of length l1 from a fixed point, the string fixed to the
// body at distance d above its centre of mass, k the body's radius of
// gyration about the swing axis: the linearised Lagrange equations in the
// string's and the body's angles (any mechanics text) give
// l1 k^2 w^4 - g (d^2 + k^2 + l1 d) w^2 + g^2 d = 0, whose smaller root is
// written here in the form that keeps its precision; at l1 = 0 it is the
// compound pendulum w^2 = g d / (d^2 + k^2).
func bodyOnString(l1, d, k float64) float64 {
	s := d*d + k*k + l1*d
	w2 := 2 * g * d / (s + math.Sqrt(s*s-4*l1*k*k*d))
	return 2 * math.Pi / math.Sqrt(w2)
}

// A rigid load's timed swing gives the rope to the hook whose first mode
// has the timed period; and hung close to its pivot (the shortest rope
// the model takes, 0.3 m, against a hook 8 m above the centre of mass) it
// swings nearly as the compound pendulum on the hook.
func TestRigidTimedSwing(t *testing.T) {
	load, d, k := beam(10)
	// Source: compound pendulum, T = 2 pi sqrt((k^2 + d^2)/(g d)) for a
	// body pivoted at d above its centre of mass (any mechanics text).
	tc := 2 * math.Pi * math.Sqrt((k*k+d*d)/(g*d))
	if p := bodyOnString(0, d, k); math.Abs(p/tc-1) > 1e-14 {
		t.Fatalf("string of zero length: %.12g s, compound pendulum %.12g s", p, tc)
	}
	for _, l1 := range []float64{0.3, 1, 4, 12} {
		want := bodyOnString(l1, d, k)
		// Heights: sheave 20 m, hook l1 below it.
		r, err := Find(&Input{Load: load, Heights: &Heights{SheaveHeightM: f(20), HookHeightM: f(20 - l1)},
			Timed: &Timed{Swings: f(10), TimeS: f(10 * want)}})
		if err != nil {
			t.Fatal(err)
		}
		h, tm := r.FromHeights, r.FromTimed
		t.Logf("rope %g m: first mode %.6g s (string %.6g s, compound %.6g s); timed gives %.6g m", l1, h.SmallSwingPeriodS, want, tc, tm.RopeToHookM)
		// Source: the body on a string above (any mechanics text).
		if math.Abs(h.SmallSwingPeriodS/want-1) > 1e-6 || math.Abs(tm.RopeToHookM/l1-1) > 1e-5 || r.RopeLengthM != h.RopeToHookM {
			t.Errorf("rope %g m: first mode %.8g s, want %.8g s; timed swing gives %.8g m", l1, h.SmallSwingPeriodS, want, tm.RopeToHookM)
		}
		if math.Abs(h.RiggingLengthM-d) > 1e-9 || math.Abs(tm.EffectiveLengthM-g*math.Pow(want/(2*math.Pi), 2)) > 1e-9 ||
			math.Abs(h.EffectiveLengthM/tm.EffectiveLengthM-1) > 3e-6 {
			t.Errorf("rope %g m: depth %g m (want %g), effective length %g m", l1, h.RiggingLengthM, d, tm.EffectiveLengthM)
		}
		if l1 == 0.3 {
			// Close to its pivot: slower than the compound pendulum by
			// less than l1/d (the string's first-order effect).
			if e := h.SmallSwingPeriodS/tc - 1; e <= 0 || e > l1/d {
				t.Errorf("rope %g m: %.6g s against the compound pendulum's %.6g s (%.3g %%)", l1, h.SmallSwingPeriodS, tc, 100*e)
			}
		}
	}
	// The large-swing correction: one rope's 2K(k)/pi on the first mode.
	want := bodyOnString(2, d, k)
	r, err := Find(&Input{Load: load, Timed: &Timed{Swings: f(4), TimeS: f(4 * want * 1.0174), AmplitudeDeg: 30}})
	if err != nil {
		t.Fatal(err)
	}
	// Source: T/T0 = 1.0174 at 30 deg (Abramowitz & Stegun 17.3, from
	// SciPy's ellipk as in TestTimed), to the four digits given.
	if math.Abs(r.FromTimed.RopeToHookM/2-1) > 2e-3 || !strings.Contains(strings.Join(r.Notes, " "), "approximation on a rope") {
		t.Errorf("30 deg: rope %.6g m, want 2 m; notes %q", r.FromTimed.RopeToHookM, r.Notes)
	}
}

// Bad rigid-load questions name the field and say why.
func TestRigidBadInput(t *testing.T) {
	load, _, _ := beam(10)
	noLegs := &Load{MassKg: f(5000), Body: &scenario.Body{LengthM: f(12), WidthM: f(0.5), HeightM: f(1)}}
	short := &Load{MassKg: f(5000), Body: &scenario.Body{LengthM: f(12), WidthM: f(0.5), HeightM: f(1),
		Legs: []scenario.BodyLeg{{LengthM: f(2), AttachXM: 5, AttachZM: f(0.5)}, {LengthM: f(2), AttachXM: -5, AttachZM: f(0.5)}}, HookMassKg: 100}}
	// Two hook ropes: the answer is both ropes' length, so neither has its own.
	tandem := &Load{MassKg: f(5000), Body: &scenario.Body{LengthM: f(12), WidthM: f(0.5), HeightM: f(1),
		Tandem: &scenario.Tandem{Ropes: []scenario.HookRope{{AttachXM: f(5)}, {LengthM: f(4), AttachXM: f(-5)}}}}}
	cases := []struct {
		in    Input
		field string
	}{
		{Input{Load: noLegs, Timed: &Timed{Swings: f(5), TimeS: f(40)}}, "load.body.legs"},
		{Input{Load: &Load{MassKg: f(5000)}, Timed: &Timed{Swings: f(5), TimeS: f(40)}}, "load.body"},
		{Input{Load: short, Timed: &Timed{Swings: f(5), TimeS: f(40)}}, "load.body.legs[0].length_m"},
		{Input{Load: load, Hook: &Hook{MassKg: f(100), LoadMassKg: f(5000), RiggingLengthM: 3}, Timed: &Timed{Swings: f(5), TimeS: f(40)}}, "hook"},
		{Input{Load: load, Heights: &Heights{SheaveHeightM: f(20), HookHeightM: f(10), SlingDepthM: 2}}, "heights.sling_depth_m"},
		{Input{Load: load, Timed: &Timed{Swings: f(10), TimeS: f(20)}}, "timed.time_s"},
		{Input{Load: &Load{MassKg: f(-1), Body: load.Body}, Timed: &Timed{Swings: f(5), TimeS: f(40)}}, "load.mass_kg"},
		{Input{Load: tandem, Timed: &Timed{Swings: f(5), TimeS: f(40)}}, "load.body.tandem.ropes[1].length_m"},
	}
	for _, c := range cases {
		_, err := Find(&c.in)
		var fe scenario.Errors
		if !errors.As(err, &fe) || fe[0].Field != c.field {
			t.Errorf("want an error at %s, got %v", c.field, err)
		}
	}
}

// The large-swing correction for a rigid load: one rope's 2K(k)/pi on the
// first mode, against the nonlinear rigid-load model released from rest
// in its first mode's shape with the line from the suspension point to
// the load's centre of mass at 5, 15 and 30 deg (the 12 m beam on a 2 m
// rope to the hook), the period measured over two cycles (up-crossings of the centre of mass's speed along the swing). Source of the
// factor: the plane pendulum's period 4 sqrt(L/g) K(sin(theta0/2))
// (Abramowitz & Stegun 17.3), exact for a body on a fixed pivot; on a rope
// it is an approximation, whose size this measures.
func TestRigidAmplitudeCorrection(t *testing.T) {
	load, _, _ := beam(10)
	r := &pendulum.Rigid{Mass: *load.MassKg, Size: r3.Vec{X: 12, Y: 0.5, Z: 1},
		Gyration: r3.Vec{X: math.Sqrt((0.25 + 1) / 12), Y: math.Sqrt((144.0 + 1) / 12), Z: math.Sqrt((144 + 0.25) / 12)}}
	for _, l := range load.Body.Legs {
		r.Legs = append(r.Legs, pendulum.Leg{Length: *l.LengthM, Attach: r3.Vec{X: l.AttachXM, Y: l.AttachYM, Z: *l.AttachZM}})
	}
	const rope = 2.0
	fixed := func(float64) pendulum.Kinematics { return pendulum.Kinematics{} }
	r.Suspension, r.Rope = fixed, func(float64) (float64, float64, float64) { return rope, 0, 0 }
	if err := r.Prepare(); err != nil {
		t.Fatal(err)
	}
	modes, err := r.Modes(rope)
	if err != nil {
		t.Fatal(err)
	}
	t0 := modes[0].PeriodS
	var p pendulum.Point
	line := func(y []float64) float64 {
		r.Eval(0, y, &p)
		return math.Atan2(math.Hypot(p.LoadPos.X, p.LoadPos.Y), -p.LoadPos.Z)
	}
	for _, deg := range []float64{1, 5, 15, 30} {
		th := deg * units.Degree
		var y []float64
		lo, hi := 0.0, 50.0
		for range 60 {
			y = r.Rest(0)
			amp := (lo + hi) / 2
			r.Displace(y, modes[0].Shape, amp)
			if line(y) < th {
				lo = amp
			} else {
				hi = amp
			}
		}
		sim, err := pendulum.CrossingPeriod(r, y, 4, 3, 20*t0)
		if err != nil {
			t.Fatal(err)
		}
		k := math.Sin(th / 2)
		est := t0 * 2 * mathext.CompleteK(k*k) / math.Pi
		got, err := Find(&Input{Load: load, Timed: &Timed{Swings: f(10), TimeS: f(10 * sim), AmplitudeDeg: deg}})
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("%g deg: simulated %.6g s, first mode %.6g s times 2K/pi %.6g s (%+.3f %%); rope from the timed swing %.4g m (%+.2f %%)",
			deg, sim, t0, est, 100*(est/sim-1), got.RopeLengthM, 100*(got.RopeLengthM/rope-1))
		if math.Abs(est/sim-1) > 3e-3 {
			t.Errorf("%g deg: the corrected first mode %.6g s against the simulated %.6g s", deg, est, sim)
		}
	}
}
