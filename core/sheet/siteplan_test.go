package sheet

import (
	"bytes"
	"strings"
	"testing"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// The clearance section renders the report it is given: the verdict in
// the core's words, the plan view (exclusion zone hatched, each obstacle
// with its top), each obstacle's row and the spreads used; without a
// report it says the check was not run, and runs none.
func TestSiteSectionRendersTheReport(t *testing.T) {
	s := demo(t, "site-bay-columns.json")
	s.Site.Spread.Runs = 30
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	ran := 0
	c := direct
	c.Clearance = func(*scenario.Scenario) (*clearance.Report, error) { ran++; return rep, nil }
	in := c.Compute(s)
	in.Units = units.Choice{System: "si"}
	sh, err := Build(in)
	if err != nil {
		t.Fatal(err)
	}
	var b bytes.Buffer
	if err := sh.WriteDocument(&b); err != nil {
		t.Fatal(err)
	}
	page := b.String()
	want := []string{"Clearances along the path", "DOES NOT CLEAR", rep.Words[0], `url(#sw-hatch)`,
		"column C3, top 8 m", "panel stack, top 2.2 m", "nobody stands here during the lift",
		"30 runs, seed 1; margin 0.3 m", "<th>column C4</th>"}
	for _, w := range want {
		if !strings.Contains(page, w) {
			t.Errorf("sheet lacks %q", w)
		}
	}
	if ran != 1 {
		t.Errorf("the clearance function was asked %d times", ran)
	}
	// In feet: the plan's axes and the tops follow the units shown.
	in.Units = units.Choice{System: "us"}
	sh, _ = Build(in)
	frag, _ := sh.Fragment()
	if !strings.Contains(frag, "x (ft)") || !strings.Contains(frag, "column C3, top 26.2 ft") {
		t.Error("the plan view is not in the units shown")
	}
	// No report: said, not computed.
	in.Clearance, in.ClearanceErr = nil, "the check was stopped"
	sh, _ = Build(in)
	frag, _ = sh.Fragment()
	if !strings.Contains(frag, "Not checked: the check was stopped.") || strings.Contains(frag, "sw-hatch") {
		t.Error("a sheet without the report does not say so")
	}
}
