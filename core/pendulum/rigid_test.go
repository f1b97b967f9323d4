package pendulum

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/ode"
)

// box returns the radii of gyration of a solid box of length a, width b,
// height c about its axes through the centre of mass: k_x^2 = (b^2+c^2)/12
// and so on (any mechanics text).
func box(a, b, c float64) r3.Vec {
	return r3.Vec{X: math.Sqrt((b*b + c*c) / 12), Y: math.Sqrt((a*a + c*c) / 12), Z: math.Sqrt((a*a + b*b) / 12)}
}

// fourLegs are four legs of length l from a hook to the corners of the top
// face of a box (length a, width b, height c).
func fourLegs(a, b, c, l float64) []Leg {
	var legs []Leg
	for _, s := range [][2]float64{{1, 1}, {-1, 1}, {-1, -1}, {1, -1}} {
		legs = append(legs, Leg{Attach: r3.Vec{X: s[0] * a / 2, Y: s[1] * b / 2, Z: c / 2}, Length: l})
	}
	return legs
}

func fixedRigid(r *Rigid, l float64) *Rigid {
	r.Suspension = func(float64) Kinematics { return Kinematics{} }
	r.Rope = func(float64) (float64, float64, float64) { return l, 0, 0 }
	return r
}

func mustPrepare(t *testing.T, r *Rigid) *Rigid {
	t.Helper()
	if err := r.Prepare(); err != nil {
		t.Fatal(err)
	}
	return r
}

// girder is a 13 m by 0.5 m by 1 m load of 12 t.
func girder() *Rigid {
	return &Rigid{Mass: 12000, Size: r3.Vec{X: 13, Y: 0.5, Z: 1}, Gyration: box(13, 0.5, 1)}
}

func TestRigidRestIsStill(t *testing.T) {
	cases := map[string]*Rigid{}
	a := girder()
	a.Legs, a.HookMass, a.Heading = fourLegs(8, 0.5, 1, 5), 300, 0.4
	cases["four legs"] = a
	b := girder()
	b.Legs = []Leg{{Attach: r3.Vec{X: 4, Z: 0.5}, Length: 5}, {Attach: r3.Vec{X: -4, Z: 0.5}, Length: 5}}
	b.HookMass = 300
	cases["two legs"] = b
	c := girder()
	c.Spreader, c.SpreaderZ = 4, 0.5
	cases["parallel legs"] = c
	for name, r := range cases {
		mustPrepare(t, fixedRigid(r, 6))
		y := r.Rest(0)
		dy := make([]float64, len(y))
		r.Func(0, y, dy)
		for i := 4; i < len(y); i++ {
			if i >= 7 && i < 11 || i >= 14 && i < 17 {
				continue
			}
			if math.Abs(dy[i]) > 1e-12 {
				t.Errorf("%s: d/dt y[%d] = %g at rest", name, i, dy[i])
			}
		}
		if d := r.Project(y); d > 1e-15 {
			t.Errorf("%s: the rest state is %g off its constraints", name, d)
		}
	}
}

// Source: statics of a symmetric four-leg sling (any mechanics text; the
// same as the sling tables of rigging practice): each leg at angle beta
// from the vertical carries m g / (4 cos beta), and the vertical parts add
// up to m g.
func TestRigidFourLegSharing(t *testing.T) {
	r := girder()
	r.Legs = fourLegs(8, 0.5, 1, 5)
	mustPrepare(t, fixedRigid(r, 6))
	var p Point
	r.Eval(0, r.Rest(0), &p)
	// Hook height above the attach points: legs of 5 m to corners at
	// (4, 0.25) from the centre.
	h := math.Sqrt(25 - 16 - 0.0625)
	cb := h / 5
	want := 12000 * g / (4 * cb)
	sum := 0.0
	for i := range 4 {
		if math.Abs(p.Body.Legs[i]/want-1) > 1e-12 {
			t.Errorf("leg %d: %.9g N, want %.9g N", i, p.Body.Legs[i], want)
		}
		sum += p.Body.Legs[i] * cb
	}
	if math.Abs(sum/(12000*g)-1) > 1e-12 || math.Abs(p.Tension/(12000*g)-1) > 1e-12 {
		t.Errorf("vertical parts %g N, rope %g N, weight %g N", sum, p.Tension, 12000*g)
	}
}

// Source: compound pendulum, T = 2 pi sqrt((k^2 + d^2)/(g d)) for a rigid
// body pivoted at distance d from its centre of mass, k its radius of
// gyration about the pivot axis through the centre of mass (any mechanics
// text). Checked two ways: the modal analysis, and the simulated period of
// a free swing at 0.01 deg about the width axis.
func TestRigidCompoundPendulum(t *testing.T) {
	r := girder()
	r.Legs = fourLegs(8, 0.5, 1, 5)
	r.Pivot = true
	mustPrepare(t, fixedRigid(r, 0))
	d := 0.5 + math.Sqrt(25-16-0.0625)
	k := box(13, 0.5, 1)
	want := map[string]float64{
		"pitch": 2 * math.Pi * math.Sqrt((k.Y*k.Y+d*d)/(g*d)),
		"roll":  2 * math.Pi * math.Sqrt((k.X*k.X+d*d)/(g*d)),
	}
	modes, err := r.Modes(0)
	if err != nil {
		t.Fatal(err)
	}
	seen := 0
	for _, m := range modes {
		if m.Free {
			continue
		}
		// About the pivot every mode is a turn: about the width axis
		// (pitch) or the length axis (roll).
		axis := "roll"
		if math.Abs(m.Shape[4]) > math.Abs(m.Shape[3]) {
			axis = "pitch"
		}
		seen++
		t.Logf("%s: modal %.12g s, compound pendulum %.12g s, relative difference %.2g", axis, m.PeriodS, want[axis], m.PeriodS/want[axis]-1)
		if w := want[axis]; math.Abs(m.PeriodS/w-1) > 1e-8 {
			t.Errorf("%s mode: %.12g s, compound pendulum %.12g s", axis, m.PeriodS, w)
		}
	}
	if seen != 2 {
		t.Errorf("modes %+v: want one pitch and one roll", modes)
	}
	y := r.Initial(0.01*math.Pi/180, 0, 0, 0)
	// Pitch about the width (y) axis: the body's angular velocity about y.
	sim, err := CrossingPeriod(r, y, 12, 5, 5*want["pitch"])
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("pitch: simulated %.10g s, relative difference %.2g", sim, sim/want["pitch"]-1)
	if math.Abs(sim/want["pitch"]-1) > 1e-6 {
		t.Errorf("simulated pitch period %.10g s, compound pendulum %.10g s", sim, want["pitch"])
	}
}

// Source: bifilar suspension, T = 2 pi (k/a) sqrt(h/g) for a body hung
// from two parallel vertical legs of length h a distance 2a apart, k its
// radius of gyration about the vertical (any mechanics text).
func TestRigidBifilarTwist(t *testing.T) {
	r := girder()
	r.Spreader, r.SpreaderZ = 4, 0.5
	const h = 3.0
	mustPrepare(t, fixedRigid(r, h))
	k := box(13, 0.5, 1).Z
	want := 2 * math.Pi * (k / 4) * math.Sqrt(h/g)
	modes, err := r.Modes(h)
	if err != nil {
		t.Fatal(err)
	}
	var tw *RigidMode
	for i := range modes {
		if modes[i].Kind == "twist" {
			tw = &modes[i]
		}
	}
	if tw == nil || math.Abs(tw.PeriodS/want-1) > 1e-8 {
		t.Fatalf("twist mode %+v, bifilar formula %.10g s", tw, want)
	}
	sim := smallTwistPeriod(t, r, want)
	t.Logf("twist: modal %.10g s, simulated %.10g s, bifilar %.10g s (relative differences %.2g, %.2g)",
		tw.PeriodS, sim, want, tw.PeriodS/want-1, sim/want-1)
	// The free twist has the amplitude correction of a small swing: at
	// 0.01 deg it is far below 1e-6.
	if math.Abs(sim/want-1) > 1e-6 {
		t.Errorf("simulated twist period %.10g s, bifilar %.10g s", sim, want)
	}
}

// The total energy of a free 3D swing with twist is conserved (no
// damping in the model): a check on the equations and the multipliers.
func TestRigidEnergyConserved(t *testing.T) {
	for _, legs := range []int{2, 4} {
		r := girder()
		if legs == 4 {
			r.Legs = fourLegs(8, 0.5, 1, 5)
		} else {
			r.Legs = []Leg{{Attach: r3.Vec{X: 4, Z: 0.5}, Length: 5}, {Attach: r3.Vec{X: -4, Z: 0.5}, Length: 5}}
		}
		r.HookMass = 400
		mustPrepare(t, fixedRigid(r, 6))
		y := r.Initial(0.3, 0.7, 0.5, -0.8)
		y[13] += 0.2 // a twist rate
		r.Project(y)
		e0 := r.energy(y)
		v := ode.New(r.Func, r.Len(), ode.Settings{RelTol: 1e-11, AbsTol: 1e-13})
		v.Reset(0, y)
		for {
			done, err := v.Step(30)
			if err != nil {
				t.Fatal(err)
			}
			yy := v.State()
			r.Project(yy)
			v.SetState(yy)
			if done {
				break
			}
		}
		if e1 := r.energy(v.State()); math.Abs(e1-e0) > 1e-7*12000*g*6 {
			t.Errorf("%d legs: energy %.12g J, then %.12g J", legs, e0, e1)
		}
	}
}

// energy is the kinetic plus potential energy of a fixed-suspension run.
func (r *Rigid) energy(y []float64) float64 {
	fr := r.frameOf(y[0], y)
	f := &fr
	iw := f.R.mul3(r.geo.ib).mul3(f.R.transpose())
	e := 0.5*r.geo.m*r3.Dot(f.v, f.v) + 0.5*r3.Dot(f.w, iw.mul(f.w)) + r.geo.m*r.g()*f.x.Z
	if r.geo.hookPoint {
		e += 0.5*r.geo.mh*r3.Dot(f.Pv, f.Pv) + r.geo.mh*r.g()*f.P.Z
	}
	return e
}

// Four legs meeting off centre (the load hangs tilted): whatever the
// stiffness sharing gives each leg, the legs together hold the load up,
// sum of T_i e_i = m g upward (static equilibrium of the load), and each
// stays taut here.
func TestRigidFourLegSharingOffCentre(t *testing.T) {
	hook := r3.Vec{X: 0.6, Y: 0.2, Z: 2.8}
	var legs []Leg
	for _, l := range fourLegs(8, 1, 0.6, 0) {
		l.Length = r3.Norm(r3.Sub(hook, l.Attach))
		legs = append(legs, l)
	}
	r := &Rigid{Mass: 3000, Size: r3.Vec{X: 8, Y: 1, Z: 0.6}, Gyration: box(8, 1, 0.6), HookMass: 150, Legs: legs}
	mustPrepare(t, fixedRigid(r, 5))
	var p Point
	y := r.Rest(0)
	r.Eval(0, y, &p)
	var sum r3.Vec
	for i := range 4 {
		a := r.kinOf(&frame{x: vec(y[1:]), R: rotOf(y[7:11])}, end{kind: onBody, b: r.geo.attach[i]}, i)
		e := r3.Unit(r3.Sub(a.p, p.HookPos))
		sum = r3.Add(sum, r3.Scale(p.Body.Legs[i], e))
		if p.Body.Legs[i] <= 0 {
			t.Errorf("leg %d: %g N", i, p.Body.Legs[i])
		}
	}
	// The legs pull the hook down by the load's weight.
	want := r3.Vec{Z: -3000 * g}
	if d := r3.Norm(r3.Sub(sum, want)); d > 1e-9*3000*g {
		t.Errorf("legs' pull on the hook %v N, want %v N", sum, want)
	}
	if p.Body.TiltRad < 0.01 {
		t.Errorf("tilt at rest %v rad: the hook off centre should tilt the load", p.Body.TiltRad)
	}
}

// smallTwistPeriod is the period of a small twist, 0.01 deg, released
// from rest, simulated over about five periods (want is the expected
// period, to size the run).
func smallTwistPeriod(t *testing.T, r *Rigid, want float64) float64 {
	t.Helper()
	y := r.Rest(0)
	q := mulq(quatAxis(r3.Vec{Z: 1}, 0.01*math.Pi/180), quat{y[7], y[8], y[9], y[10]})
	copy(y[7:11], q[:])
	r.Project(y)
	sim, err := CrossingPeriod(r, y, 13, 5, 5*want)
	if err != nil {
		t.Fatal(err)
	}
	return sim
}
