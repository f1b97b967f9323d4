package pendulum

import (
	"math"
	"reflect"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// tandemGirder is the 13 m girder on two hook ropes 8 m apart attached
// 0.5 m above its centre of mass at +/-4 m, ropes of length h + extra.
func tandemGirder(h float64, extra [2]float64) *Rigid {
	r := girder()
	r.Tandem = &TandemRopes{Top: [2]float64{4, -4}, Attach: [2]r3.Vec{{X: 4, Z: 0.5}, {X: -4, Z: 0.5}}, Extra: extra}
	return fixedRigid(r, h)
}

func modeOf(t *testing.T, modes []RigidMode, kind string) RigidMode {
	t.Helper()
	for _, m := range modes {
		if m.Kind == kind {
			return m
		}
	}
	t.Fatalf("no %q mode in %+v", kind, modes)
	return RigidMode{}
}

// Two equal parallel hook ropes are the spreader's bifilar suspension:
// the same modes, the same motion.
func TestTandemParallelIsSpreader(t *testing.T) {
	const h = 3.0
	tan := mustPrepare(t, tandemGirder(h, [2]float64{}))
	sp := girder()
	sp.Spreader, sp.SpreaderZ = 4, 0.5
	mustPrepare(t, fixedRigid(sp, h))
	yt, ys := tan.Rest(0), sp.Rest(0)
	for i := range yt {
		if math.Abs(yt[i]-ys[i]) > 1e-12 {
			t.Errorf("rest state [%d]: tandem %.15g, spreader %.15g", i, yt[i], ys[i])
		}
	}
	mt, _ := tan.Modes(h)
	ms, _ := sp.Modes(h)
	for i := range ms {
		if math.Abs(mt[i].PeriodS/ms[i].PeriodS-1) > 1e-9 || mt[i].Kind != ms[i].Kind {
			t.Errorf("mode %d: tandem %+v, spreader %+v", i, mt[i], ms[i])
		}
	}
}

// Source: parallel equal ropes keep the load from turning when it swings
// in their plane (a parallelogram linkage), so that mode is a point
// pendulum of the ropes' length, 2 pi sqrt(h/g); across their plane the
// ropes and the load's roll about the attach line form a double pendulum
// whose lower link is a compound pendulum (linearised Lagrange equations,
// any mechanics text): M = m [[h^2, h d], [h d, d^2 + k^2]],
// K = m g [[h, 0], [0, d]], d the attach line's height above the centre
// of mass, k the radius of gyration about the length axis; and the
// twist is bifilar, 2 pi (k_z/a) sqrt(h/g) (any mechanics text).
func TestTandemModesHandFormulas(t *testing.T) {
	const h = 5.0
	r := mustPrepare(t, tandemGirder(h, [2]float64{}))
	modes, err := r.Modes(h)
	if err != nil {
		t.Fatal(err)
	}
	along := modeOf(t, modes, "swing along").PeriodS
	if want := 2 * math.Pi * math.Sqrt(h/g); math.Abs(along/want-1) > 1e-8 {
		t.Errorf("swing along %.10g s, 2 pi sqrt(h/g) %.10g s", along, want)
	}
	k := box(13, 0.5, 1)
	d := 0.5
	// det(K - w^2 M) = 0: (g h - w^2 h^2)(g d - w^2 (d^2 + k^2)) - w^4 h^2 d^2 = 0,
	// a quadratic in w^2: A w^4 + B w^2 + C = 0.
	A := h*h*(d*d+k.X*k.X) - h*h*d*d
	B := -(g*h*(d*d+k.X*k.X) + g*d*h*h)
	C := g * h * g * d
	disc := math.Sqrt(B*B - 4*A*C)
	slow := 2 * math.Pi / math.Sqrt((-B-disc)/(2*A))
	fast := 2 * math.Pi / math.Sqrt((-B+disc)/(2*A))
	across := modeOf(t, modes, "swing across").PeriodS
	roll := modeOf(t, modes, "roll").PeriodS
	if math.Abs(across/slow-1) > 1e-8 || math.Abs(roll/fast-1) > 1e-8 {
		t.Errorf("across %.10g s and roll %.10g s; double pendulum %.10g s and %.10g s", across, roll, slow, fast)
	}
	twist := modeOf(t, modes, "twist").PeriodS
	if want := 2 * math.Pi * (k.Z / 4) * math.Sqrt(h/g); math.Abs(twist/want-1) > 1e-8 {
		t.Errorf("twist %.10g s, bifilar %.10g s", twist, want)
	}
	t.Logf("along %.8g s, across %.8g s, roll %.8g s, twist %.8g s", along, across, roll, twist)
}

// Source: bifilar suspension (any mechanics text), as for the spreader:
// a free twist of 0.01 deg on two equal parallel hook ropes, simulated.
func TestTandemBifilarTwistSimulated(t *testing.T) {
	const h = 3.0
	r := mustPrepare(t, tandemGirder(h, [2]float64{}))
	want := 2 * math.Pi * (box(13, 0.5, 1).Z / 4) * math.Sqrt(h/g)
	sim := smallTwistPeriod(t, r, want)
	t.Logf("twist: simulated %.10g s, bifilar %.10g s, relative difference %.2g", sim, want, sim/want-1)
	if math.Abs(sim/want-1) > 1e-6 {
		t.Errorf("simulated twist period %.10g s, bifilar %.10g s", sim, want)
	}
}

// Unequal ropes: the rest found is still (no acceleration), on its
// constraints, and the ropes together hold the load's weight; the rope
// and the load tilt toward the short rope; the moments balance (source:
// statics, any mechanics text: the ropes' lines and the vertical through
// the centre of mass meet in one point).
func TestTandemUnequalRest(t *testing.T) {
	r := tandemGirder(5, [2]float64{0.6, -0.2})
	r.Tandem.Top = [2]float64{4.5, -3.5}
	r.Tandem.Attach[1].Y = 0.1
	mustPrepare(t, r)
	y := r.Rest(0)
	if d := r.Project(y); d > 1e-14 {
		t.Errorf("rest %g off its constraints", d)
	}
	dy := make([]float64, len(y))
	r.Func(0, y, dy)
	for i := 4; i < 14; i++ {
		if i >= 7 && i < 11 {
			continue
		}
		if math.Abs(dy[i]) > 1e-9 {
			t.Errorf("d/dt y[%d] = %g at rest", i, dy[i])
		}
	}
	var p Point
	r.Eval(0, y, &p)
	w := 12000 * g
	if math.Abs(p.Tension/w-1) > 0.2 || p.Body.Legs[0] <= 0 || p.Body.Legs[1] <= 0 {
		t.Errorf("rope tensions %.6g N and %.6g N for a weight of %.6g N", p.Body.Legs[0], p.Body.Legs[1], w)
	}
	// The vertical parts of the rope pulls add up to the weight.
	f := r.frameOf(0, y)
	up := 0.0
	for i := range 2 {
		a := r.kinOf(&f, end{kind: onBody, b: r.geo.attach[i]}, i)
		top := r.kinOf(&f, end{kind: onTop}, i)
		d := r3.Sub(top.p, a.p)
		up += p.Body.Legs[i] * d.Z / r3.Norm(d)
	}
	if math.Abs(up/w-1) > 1e-9 {
		t.Errorf("ropes hold %.10g N up, weight %.10g N", up, w)
	}
	t.Logf("tilt %.4g deg, ropes %.6g N and %.6g N", p.Body.TiltRad*180/math.Pi, p.Body.Legs[0], p.Body.Legs[1])
}

// tandemCorners keeps the corners and heading of the rest it comes from:
// asked at one rope length, another, and the first again, each answer is
// the one made afresh from that length's rest, bit for bit; and an
// evaluation after the corners were kept (the second at a length) gives
// the body point of the one that made them.
func TestTandemCornersKept(t *testing.T) {
	r := tandemGirder(5, [2]float64{0.6, -0.2})
	mustPrepare(t, r)
	y := r.Rest(0)
	for _, l := range []float64{5, 6.5, 5, 5} {
		rc, h, c := r.tandemCorners(l)
		q, c0 := r.tandemRest(l)
		var want [8]r3.Vec
		h0 := r.restCornersInto(q, c0, &want)
		if *rc != want || h != h0 || c != c0 {
			t.Errorf("l = %g m: corners %v, heading %g, centre %v; made afresh %v, %g, %v", l, *rc, h, c, want, h0, c0)
		}
		var first, again Point
		r.Eval(0.3, y, &first) // at the load's own rope length, 5 m
		b := *first.Body
		r.Eval(0.3, y, &again)
		if !reflect.DeepEqual(*again.Body, b) {
			t.Errorf("after l = %g m: body point %+v, then %+v", l, b, *again.Body)
		}
	}
}
