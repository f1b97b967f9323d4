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
		"30 runs, seed 1; margin 0.3 m", "<th>column C4</th>",
		// The vertical section beside the plan, and the room under the load.
		`url(#sw-section-hatch)`, "along the path (m)", "room under the load over it", "not passed over", ">column C3</text>"}
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

// A crane that does not travel has no path to take a section along: the
// sheet prints the plan beside the table, and no section.
func TestSiteSectionNeedsAPath(t *testing.T) {
	sec := &clearance.Section{PathLengthM: 0, Nominal: []clearance.SectionPoint{{DistanceM: 0, LowM: 2.8, HookM: 4}}}
	if got := siteSectionPaper(sec, units.Choice{System: "si"}); got != "" {
		t.Errorf("a section along no path: %.80q", got)
	}
	if got := SiteSectionScreen(sec, units.Choice{System: "si"}, 400); got != "" {
		t.Errorf("a section along no path on screen: %.80q", got)
	}
	sec.PathLengthM = 10
	sec.Nominal = append(sec.Nominal, clearance.SectionPoint{TimeS: 5, DistanceM: 10, LowM: 2.8, HookM: 4})
	sec.Obstacles = []clearance.SectionObstacle{{Name: "wall <A>", FromM: 4, ToM: 5, TopM: 3}}
	got := siteSectionPaper(sec, units.Choice{System: "us"})
	for _, w := range []string{"along the path (ft)", ">wall &lt;A&gt;</text>", `id="sw-section-hatch"`} {
		if !strings.Contains(got, w) {
			t.Errorf("paper section lacks %q", w)
		}
	}
	if strings.Contains(got, "class=") || strings.Contains(got, "NaN") {
		t.Error("the paper section has screen classes or NaN")
	}
}

// A rope strike on the sheet: the obstacle's row and the verdict name the
// line that struck first (site-tower-rope-mast: the hoist rope).
func TestSiteSectionNamesTheFirstStrikingLine(t *testing.T) {
	s := demo(t, "site-tower-rope-mast.json")
	s.Site.Spread.Runs = 4
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	v := siteSection(s, rep, "", units.Choice{System: "us"})
	if row := v.Rows[0][2]; !strings.Contains(row, " s by the hoist rope") {
		t.Errorf("row %q", row)
	}
	if !strings.Contains(strings.Join(v.Words, " "), "first by the hoist rope, ") {
		t.Errorf("verdict %q", v.Words)
	}
}
