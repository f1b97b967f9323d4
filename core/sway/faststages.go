package sway

import (
	"runtime"

	"swaysheet/core/ode"
)

// The stages of a step: from y and its rate k1 at t, the rates k2 to k7,
// the new state ynew at tn = t + h (tEnd on a segment's last step) and
// the error estimate in tmp, by ode.Solver.Step's sums (the same
// expressions, so the same bits).
//
// stagesWrittenOut picks how fastSolver.step writes the sums. As six
// lines, one per component (stages, below), they take about a quarter
// fewer instructions natively than as loops over the six: no index
// arithmetic, and each coefficient and h loaded once (callgrind on the
// travel examples). In wasm the loops, written in step itself, are the
// faster: the diagonal travel example's full evaluation takes 5 to 10 %
// less time under node with them, and a call more per step would cost
// that again; the error norm's sum as a loop (errSquare) saves about 3 %
// more. A wasm program holds the loops alone; natively
// Options.loopedStages takes them for TestStagesAgree, which holds the
// two to the bit.
const stagesWrittenOut = runtime.GOARCH != "wasm"

// stages writes the sums out component by component. The right-hand side
// of each stage is fastModel.rhs, whose travel case (the commonest) is
// written out here, where the compiler puts it into each stage (a closure
// called directly has twice a function's inlining budget; the method is
// beyond it): in wasm a call costs more than that arithmetic. Same
// operations in the same order as rhs.
func (v *fastSolver) stages(t, h, tn float64) {
	y, ynew, tmp := &v.y, &v.ynew, &v.tmp
	k1, k2, k3, k4, k5, k6, k7 := &v.k[0], &v.k[1], &v.k[2], &v.k[3], &v.k[4], &v.k[5], &v.k[6]
	m := v.m
	travel := m.travel
	ax, ay, jx, jy := m.sx.A, m.sy.A, m.sx.J, m.sy.J
	ox, oy, il, rz := m.sx.Origin, m.sy.Origin, m.il, -m.g
	travelRHS := func(t float64, y, dy *[6]float64) {
		rx, ry := -(ax + (t-ox)*jx), -(ay + (t-oy)*jy)
		cn := -(rx*y[0]+ry*y[1]+rz*y[2])*il - (y[3]*y[3] + y[4]*y[4] + y[5]*y[5])
		dy[0], dy[1], dy[2] = y[3], y[4], y[5]
		dy[3] = rx*il + cn*y[0]
		dy[4] = ry*il + cn*y[1]
		dy[5] = rz*il + cn*y[2]
	}
	tmp[0] = y[0] + h*ode.A21*k1[0]
	tmp[1] = y[1] + h*ode.A21*k1[1]
	tmp[2] = y[2] + h*ode.A21*k1[2]
	tmp[3] = y[3] + h*ode.A21*k1[3]
	tmp[4] = y[4] + h*ode.A21*k1[4]
	tmp[5] = y[5] + h*ode.A21*k1[5]
	if travel {
		travelRHS(t+ode.C2*h, tmp, k2)
	} else {
		m.rhs(t+ode.C2*h, tmp, k2)
	}
	tmp[0] = y[0] + h*(ode.A31*k1[0]+ode.A32*k2[0])
	tmp[1] = y[1] + h*(ode.A31*k1[1]+ode.A32*k2[1])
	tmp[2] = y[2] + h*(ode.A31*k1[2]+ode.A32*k2[2])
	tmp[3] = y[3] + h*(ode.A31*k1[3]+ode.A32*k2[3])
	tmp[4] = y[4] + h*(ode.A31*k1[4]+ode.A32*k2[4])
	tmp[5] = y[5] + h*(ode.A31*k1[5]+ode.A32*k2[5])
	if travel {
		travelRHS(t+ode.C3*h, tmp, k3)
	} else {
		m.rhs(t+ode.C3*h, tmp, k3)
	}
	tmp[0] = y[0] + h*(ode.A41*k1[0]+ode.A42*k2[0]+ode.A43*k3[0])
	tmp[1] = y[1] + h*(ode.A41*k1[1]+ode.A42*k2[1]+ode.A43*k3[1])
	tmp[2] = y[2] + h*(ode.A41*k1[2]+ode.A42*k2[2]+ode.A43*k3[2])
	tmp[3] = y[3] + h*(ode.A41*k1[3]+ode.A42*k2[3]+ode.A43*k3[3])
	tmp[4] = y[4] + h*(ode.A41*k1[4]+ode.A42*k2[4]+ode.A43*k3[4])
	tmp[5] = y[5] + h*(ode.A41*k1[5]+ode.A42*k2[5]+ode.A43*k3[5])
	if travel {
		travelRHS(t+ode.C4*h, tmp, k4)
	} else {
		m.rhs(t+ode.C4*h, tmp, k4)
	}
	tmp[0] = y[0] + h*(ode.A51*k1[0]+ode.A52*k2[0]+ode.A53*k3[0]+ode.A54*k4[0])
	tmp[1] = y[1] + h*(ode.A51*k1[1]+ode.A52*k2[1]+ode.A53*k3[1]+ode.A54*k4[1])
	tmp[2] = y[2] + h*(ode.A51*k1[2]+ode.A52*k2[2]+ode.A53*k3[2]+ode.A54*k4[2])
	tmp[3] = y[3] + h*(ode.A51*k1[3]+ode.A52*k2[3]+ode.A53*k3[3]+ode.A54*k4[3])
	tmp[4] = y[4] + h*(ode.A51*k1[4]+ode.A52*k2[4]+ode.A53*k3[4]+ode.A54*k4[4])
	tmp[5] = y[5] + h*(ode.A51*k1[5]+ode.A52*k2[5]+ode.A53*k3[5]+ode.A54*k4[5])
	if travel {
		travelRHS(t+ode.C5*h, tmp, k5)
	} else {
		m.rhs(t+ode.C5*h, tmp, k5)
	}
	tmp[0] = y[0] + h*(ode.A61*k1[0]+ode.A62*k2[0]+ode.A63*k3[0]+ode.A64*k4[0]+ode.A65*k5[0])
	tmp[1] = y[1] + h*(ode.A61*k1[1]+ode.A62*k2[1]+ode.A63*k3[1]+ode.A64*k4[1]+ode.A65*k5[1])
	tmp[2] = y[2] + h*(ode.A61*k1[2]+ode.A62*k2[2]+ode.A63*k3[2]+ode.A64*k4[2]+ode.A65*k5[2])
	tmp[3] = y[3] + h*(ode.A61*k1[3]+ode.A62*k2[3]+ode.A63*k3[3]+ode.A64*k4[3]+ode.A65*k5[3])
	tmp[4] = y[4] + h*(ode.A61*k1[4]+ode.A62*k2[4]+ode.A63*k3[4]+ode.A64*k4[4]+ode.A65*k5[4])
	tmp[5] = y[5] + h*(ode.A61*k1[5]+ode.A62*k2[5]+ode.A63*k3[5]+ode.A64*k4[5]+ode.A65*k5[5])
	if travel {
		travelRHS(tn, tmp, k6)
	} else {
		m.rhs(tn, tmp, k6)
	}
	ynew[0] = y[0] + h*(ode.A71*k1[0]+ode.A73*k3[0]+ode.A74*k4[0]+ode.A75*k5[0]+ode.A76*k6[0])
	ynew[1] = y[1] + h*(ode.A71*k1[1]+ode.A73*k3[1]+ode.A74*k4[1]+ode.A75*k5[1]+ode.A76*k6[1])
	ynew[2] = y[2] + h*(ode.A71*k1[2]+ode.A73*k3[2]+ode.A74*k4[2]+ode.A75*k5[2]+ode.A76*k6[2])
	ynew[3] = y[3] + h*(ode.A71*k1[3]+ode.A73*k3[3]+ode.A74*k4[3]+ode.A75*k5[3]+ode.A76*k6[3])
	ynew[4] = y[4] + h*(ode.A71*k1[4]+ode.A73*k3[4]+ode.A74*k4[4]+ode.A75*k5[4]+ode.A76*k6[4])
	ynew[5] = y[5] + h*(ode.A71*k1[5]+ode.A73*k3[5]+ode.A74*k4[5]+ode.A75*k5[5]+ode.A76*k6[5])
	if travel {
		travelRHS(tn, ynew, k7)
	} else {
		m.rhs(tn, ynew, k7)
	}
	tmp[0] = h * (ode.E1*k1[0] + ode.E3*k3[0] + ode.E4*k4[0] + ode.E5*k5[0] + ode.E6*k6[0] + ode.E7*k7[0])
	tmp[1] = h * (ode.E1*k1[1] + ode.E3*k3[1] + ode.E4*k4[1] + ode.E5*k5[1] + ode.E6*k6[1] + ode.E7*k7[1])
	tmp[2] = h * (ode.E1*k1[2] + ode.E3*k3[2] + ode.E4*k4[2] + ode.E5*k5[2] + ode.E6*k6[2] + ode.E7*k7[2])
	tmp[3] = h * (ode.E1*k1[3] + ode.E3*k3[3] + ode.E4*k4[3] + ode.E5*k5[3] + ode.E6*k6[3] + ode.E7*k7[3])
	tmp[4] = h * (ode.E1*k1[4] + ode.E3*k3[4] + ode.E4*k4[4] + ode.E5*k5[4] + ode.E6*k6[4] + ode.E7*k7[4])
	tmp[5] = h * (ode.E1*k1[5] + ode.E3*k3[5] + ode.E4*k4[5] + ode.E5*k5[5] + ode.E6*k6[5] + ode.E7*k7[5])
}
