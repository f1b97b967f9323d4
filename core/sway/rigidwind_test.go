package sway

import (
	"math"
	"strings"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// Wind on a symmetric box on four legs, no hook block: the force
// 0.5*rho*v^2*A*c (the form used in crane standards, from memory) acts at
// the centre of the box's area facing the wind, which for a uniform box is
// its centre of mass, so it has no moment about it. The load settles with
// the line from the suspension point to its centre of mass leaning
// atan(F/(m g)) (static equilibrium of the hanging load; any mechanics
// text), the box tilted by the same angle (it hangs from its hook along
// the resultant of wind and weight) and not turned. Heavy drag damps the
// swing; the last 200 s of the run are compared. The assumption is stated
// with the results.
func TestRigidWindLeanSymmetricBox(t *testing.T) {
	for _, toward := range []float64{0, 90} {
		s := withBody(still(3000, 5), 4, 1.2, 1, 3)
		s.Load.AreaM2, s.Load.DragCoefficient = 6, 1.2
		s.Wind = &scenario.Wind{SpeedMPerS: f(20), ShapeFactor: 1.2, TowardDeg: toward}
		s.Settings = &scenario.Settings{DurationS: 600, Samples: 3000}
		r := mustEval(t, s)
		force := 0.5 * 1.25 * 20 * 20 * 6 * 1.2
		want := math.Atan(force/(3000*units.StandardGravity)) / units.Degree
		h, b := r.History, r.Body.History
		var x, y, z, tilt, twist float64
		n := 0.0
		for i, tt := range h.TimeS {
			if tt >= 400 {
				x, y, z, n = x+h.RelXM[i], y+h.RelYM[i], z+h.RelZM[i], n+1
				tilt, twist = tilt+b.TiltDeg[i], math.Max(twist, math.Abs(b.TwistDeg[i]))
			}
		}
		lean := math.Atan2(math.Hypot(x, y), -z) / units.Degree
		tilt /= n
		t.Logf("toward %g deg: force %.6g N, lean %.6g deg, tilt %.6g deg, twist %.3g deg; atan(F/(m g)) %.6g deg", toward, r.WindForceN, lean, tilt, twist, want)
		if math.Abs(r.WindForceN/force-1) > 1e-12 || math.Abs(lean-want) > 5e-4 || math.Abs(r.WindLeanDeg-want) > 1e-9 ||
			math.Abs(tilt-want) > 5e-3 || twist > 1e-6 {
			t.Errorf("toward %g deg: lean %.6g deg, tilt %.6g deg, twist %.3g deg, want %.6g deg and no twist", toward, lean, tilt, twist, want)
		}
		found := false
		for _, a := range r.Assumptions {
			found = found || strings.Contains(a, "centre of the load's area")
		}
		if !found {
			t.Errorf("the assumptions do not say where the wind acts: %q", r.Assumptions)
		}
	}
}
