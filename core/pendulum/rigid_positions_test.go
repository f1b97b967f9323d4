package pendulum

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestRigidPositionsAsEval: ProjectPositions leaves the positions as
// Project does, and EvalPositions gives the positions' quantities (load,
// suspension point, corners, corner swing, plumb line, tilt and twist)
// bit for bit as Eval does, on a load on four legs, on a spreader, on two
// hook ropes, and with a hook block on two legs, each moved off its rest and off its
// constraints.
func TestRigidPositionsAsEval(t *testing.T) {
	four := girder()
	four.Legs = fourLegs(8, 0.5, 1, 5)
	spreader := girder()
	spreader.Spreader, spreader.SpreaderZ = 4, 0.5
	hook := girder() // two legs: the hook block is a point of its own
	hook.Legs = []Leg{{Attach: r3.Vec{X: 4, Z: 0.5}, Length: 5}, {Attach: r3.Vec{X: -4, Z: 0.5}, Length: 5}}
	hook.HookMass = 800
	for name, r := range map[string]*Rigid{
		"four legs": fixedRigid(four, 6), "spreader": fixedRigid(spreader, 6),
		"two hook ropes": tandemGirder(6, [2]float64{0.2, 0}), "hook block": fixedRigid(hook, 6),
	} {
		mustPrepare(t, r)
		y0 := r.Rest(0)
		for i := 1; i < len(y0); i++ {
			y0[i] += 0.01 * float64(i%5-2) // off the rest and off the constraints, velocities too
		}
		full, pos := append([]float64(nil), y0...), append([]float64(nil), y0...)
		r.Project(full)
		r.ProjectPositions(pos)
		idx := []int{1, 2, 3, 7, 8, 9, 10}
		if len(y0) == RigidHookLen {
			idx = append(idx, 14, 15, 16) // the hook block's position
		}
		for _, i := range idx {
			if full[i] != pos[i] {
				t.Errorf("%s: y[%d] %v after Project, %v after ProjectPositions", name, i, full[i], pos[i])
			}
		}
		var pf, pp Point
		r.Eval(0.7, full, &pf)
		bf := *pf.Body // Eval's scratch, which EvalPositions writes again
		r.EvalPositions(0.7, full, &pp)
		bp := pp.Body
		if pf.LoadPos != pp.LoadPos || pf.Suspension.Pos != pp.Suspension.Pos || pf.Rope != pp.Rope || pf.Rel() != pp.Rel() {
			t.Errorf("%s: load %v, suspension %v from Eval; %v, %v from EvalPositions", name, pf.LoadPos, pf.Suspension, pp.LoadPos, pp.Suspension)
		}
		if bf.Corners != bp.Corners || bf.CornerSwing2 != bp.CornerSwing2 || bf.Plumb != bp.Plumb ||
			bf.TiltRad != bp.TiltRad || bf.TwistRad != bp.TwistRad || bf.R != bp.R {
			t.Errorf("%s: corners, tilt or twist differ: Eval %v %v %v, EvalPositions %v %v %v", name, bf.CornerSwing2, bf.TiltRad, bf.TwistRad, bp.CornerSwing2, bp.TiltRad, bp.TwistRad)
		}
		if pp.Tension != 0 || bp.NLegs != 0 {
			t.Errorf("%s: EvalPositions set the tension %v or %d legs", name, pp.Tension, bp.NLegs)
		}
	}
}
