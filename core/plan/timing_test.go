package plan

import (
	"math"
	"testing"
)

// The tabled cost of a group's counts (costTable, the search's fast path)
// agrees with robustCost (one exponential per press) on every count pair
// of a three-step group over five rope lengths; and with
// a bound it either agrees or says +Inf only when the cost is at least the
// bound.
func TestCostTableAgreesWithRobustCost(t *testing.T) {
	s := load(t, "plan-gantry-pendant.json")
	rq, err := newRequest(s)
	if err != nil {
		t.Fatal(err)
	}
	tm := rq.timing()
	errs := timingErrors(6)
	ws := rq.modeGrid(5)
	g := group{share: []float64{0.33, 0.34, 0.33}, tau: []float64{0.6, 0.65, 0.6}}
	const steps = 12
	ct := newCostTable(g, steps, ws, tm, errs)
	worst := 0.0
	for a := 0; a <= steps; a++ {
		for b := 0; b <= steps; b += 3 {
			c := []float64{0, float64(a) * CueStepS, float64(b) * CueStepS}
			want := robustCost(g, c, ws, tm, errs)
			got := ct.cost(c, math.Inf(1))
			worst = math.Max(worst, math.Abs(got-want))
			if math.Abs(got-want) > 1e-12 {
				t.Errorf("counts %v: table %.15g, direct %.15g", c, got, want)
			}
			bound := 0.3
			if b := ct.cost(c, bound); !(b == got || (math.IsInf(b, 1) && want >= bound-1e-12)) {
				t.Errorf("counts %v with bound %g: %g (cost %g)", c, bound, b, want)
			}
		}
	}
	t.Logf("largest difference %.3g", worst)
}
