package figures

import (
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// TestResidualExcursionLimit: limits.residual_excursion_m (a landing
// tolerance) is held against the swing-out left after stopping, within
// when the figure is at or under it, OUTSIDE above, and the verdict says
// so. Before, the limit was checked in the evaluate call's checks but the
// table had no Limit for it, so the summary, sheet and page ignored it.
func TestResidualExcursionLimit(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	r, err := sway.EvaluateWith(s, sway.Options{})
	if err != nil {
		t.Fatal(err)
	}
	v := r.ResidualExcursionM
	if !(v > 0.001) {
		t.Fatalf("the example leaves %g m: the test needs some swing-out", v)
	}
	for _, c := range []struct {
		limit  float64
		within bool
	}{{v, true}, {2 * v, true}, {v / 2, false}} {
		lim := c.limit
		s.Limits.ResidualExcursionM = &lim
		rep := Present(s, r, units.Choice{})
		var found bool
		for _, row := range rep.Rows {
			if row.Key != "residual_excursion_m" {
				continue
			}
			found = true
			if row.Check == nil || row.Check.Within != c.within {
				t.Errorf("limit %g m, figure %g m: check %+v, want within %v", lim, v, row.Check, c.within)
			}
		}
		if !found {
			t.Fatalf("no residual_excursion_m row")
		}
		named := false
		for _, k := range rep.Verdict.Outside {
			named = named || k == "residual_excursion_m"
		}
		if named == c.within {
			t.Errorf("limit %g m: the verdict's figures outside are %v", lim, rep.Verdict.Outside)
		}
	}
}
