package plan

import (
	"math"
	"testing"
)

// The curves are drawn, not read: every point is rounded to 1e-4 of its
// unit (s, deg, %), within half of that of the unrounded theory, whose
// ramp times are the design period times the whole-number grid.
func TestCurvesRounded(t *testing.T) {
	for _, name := range []string{"plan-bay-travel.json", "plan-tower-slew.json", "plan-precast-hook.json"} {
		r, err := Make(load(t, name))
		if err != nil {
			t.Fatal(err)
		}
		c := r.Curves
		check := func(what string, xs []float64) {
			for i, x := range xs {
				if k := x * 1e4; math.Abs(k-math.Round(k)) > 1e-6 {
					t.Errorf("%s: %s[%d] = %v is not a whole number of 1e-4", name, what, i, x)
					return
				}
			}
		}
		check("ramp_s", c.AccelTime.RampS)
		for i, q := range c.AccelTime.Periods {
			if d := math.Abs(c.AccelTime.RampS[i] - q*r.DesignPeriodS); d > 0.5e-4+1e-12 {
				t.Errorf("%s: ramp_s[%d] = %v, %v from periods*design period", name, i, c.AccelTime.RampS[i], d)
			}
		}
		for _, s := range c.AccelTime.Series {
			check("residual_deg", s.ResidualDeg)
		}
		for _, s := range c.RopeError.Series {
			check("residual_pct", s.ResidualPct)
		}
	}
}
