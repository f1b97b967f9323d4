package sway

import (
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// A residual limit in metres (a landing tolerance) is checked like the
// others: the result's residual excursion against it, with a warning when
// it is outside.
func TestResidualExcursionCheck(t *testing.T) {
	s := still(1000, 5)
	s.Motions = []scenario.Motion{move(0, 4, 1, 0.5, 0.5)}
	s.Limits = &scenario.Limits{ResidualExcursionM: f(0.01)}
	r := mustEval(t, s)
	var c *Check
	for i := range r.Checks {
		if r.Checks[i].Name == "residual_excursion_m" {
			c = &r.Checks[i]
		}
	}
	if c == nil || c.Value != r.ResidualExcursionM || c.Limit != 0.01 || c.Unit != "m" || c.Within != (r.ResidualExcursionM <= 0.01) {
		t.Fatalf("check %+v, residual excursion %g m", c, r.ResidualExcursionM)
	}
	if c.Within || !strings.Contains(strings.Join(r.Warnings, " "), "swing-out left after stopping of") {
		t.Errorf("warnings %q", r.Warnings)
	}
}
