package pendulum

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// Source: the linearised two-mass pendulum (standard result, LinearModes,
// itself checked against the Lagrange equations in double_test.go). A
// small compact box on two legs under a hook block, swinging in the plane
// of the legs, is the hook on its rope and the load on a rigid link from
// the hook: the same two modes, with the same shares of the load's swing
// after a sudden start, to about (k/L2)^2 (k the box's radius of
// gyration, L2 the hook's height above its centre of mass).
func TestRigidSharesTwoMassPendulum(t *testing.T) {
	const side, rise, l1, m1, m2 = 0.1, 2.5, 4.0, 1500.0, 2000.0
	attach := []r3.Vec{{X: side / 2, Z: side / 2}, {X: -side / 2, Z: side / 2}}
	leg := math.Hypot(side/2, rise)
	r := &Rigid{Mass: m2, HookMass: m1, Size: r3.Vec{X: side, Y: side, Z: side}, Gyration: box(side, side, side),
		Legs: []Leg{{Attach: attach[0], Length: leg}, {Attach: attach[1], Length: leg}}}
	mustPrepare(t, fixedRigid(r, l1))
	modes, err := r.ModesAlong(l1, r3.Vec{X: 1})
	if err != nil {
		t.Fatal(err)
	}
	want := LinearModes(m1, m2, l1, rise+side/2, g)
	var got []RigidMode
	sum := 0.0
	for _, m := range modes {
		sum += m.Share
		if m.Share > 1e-6 {
			got = append(got, m)
		}
	}
	if math.Abs(sum-1) > 1e-9 || len(got) != 2 {
		t.Fatalf("shares add to %g over %d modes with a share: %+v", sum, len(got), modes)
	}
	for i, m := range got {
		p := 2 * math.Pi / want.Omega[i]
		t.Logf("mode %d (%s): %.6g s share %.6f; two-mass %.6g s share %.6f", i, m.Kind, m.PeriodS, m.Share, p, want.LoadShare[i])
		if math.Abs(m.PeriodS/p-1) > 2e-3 || math.Abs(m.Share/want.LoadShare[i]-1) > 1e-2 {
			t.Errorf("mode %d: %.5g s, share %.5f; two-mass pendulum %.5g s, share %.5f", i, m.PeriodS, m.Share, p, want.LoadShare[i])
		}
	}
}
