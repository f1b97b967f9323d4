package main

import (
	"bytes"
	"strings"
	"testing"

	"swaysheet/core/figures"
	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// TestFigureFromTableOnly follows DEVELOPERS.md's recipe "Adding a
// figure" for a figure the result already holds (the rope length at the
// end of the run): one entry in figures.Table, nothing else. The command
// line's summary, the check sheet and the rows the page's "figures" call
// presents (figures.Present) all show it, in the units asked for.
func TestFigureFromTableOnly(t *testing.T) {
	saved := figures.Table
	defer func() { figures.Table = saved }()
	figures.Table = append(append([]figures.Figure{}, saved...), figures.Figure{
		Key: "rope_length_end_m", Crew: "rope length when the run ends", Technical: "rope length at the end of the run",
		Unit: "m", Get: func(r *sway.Result) float64 { return r.RopeLengthEndM }})

	s := testscenario.Example(t, "hoist-during-travel")
	u := units.Choice{System: "us"}
	var out bytes.Buffer
	if err := printSummary(&out, "hoist-during-travel.json", s, u); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(out.String(), "rope length when the run ends") {
		t.Errorf("the command line's summary lacks the figure:\n%s", out.String())
	}

	r, err := sway.Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	var row *figures.Row
	rep := figures.Present(s, r, u)
	for i := range rep.Rows {
		if rep.Rows[i].Key == "rope_length_end_m" {
			row = &rep.Rows[i]
		}
	}
	if row == nil || row.Unit != "ft" || row.Text == "" {
		t.Fatalf("the figures call's rows lack the figure in feet: %+v", row)
	}

	doc := sheetFragment(t, s, u)
	if !strings.Contains(doc, "Rope length when the run ends") || !strings.Contains(doc, row.Text) {
		t.Error("the check sheet lacks the figure")
	}
}

// sheetFragment is the check sheet of s in the units of u, computed
// without a plan, as HTML.
func sheetFragment(t *testing.T, s *scenario.Scenario, u units.Choice) string {
	t.Helper()
	in := sheet.Computer{Evaluate: sway.Evaluate}.Compute(s)
	in.Units = u
	sh, err := sheet.Build(in)
	if err != nil {
		t.Fatal(err)
	}
	var doc bytes.Buffer
	if err := sh.WriteFragment(&doc); err != nil {
		t.Fatal(err)
	}
	return doc.String()
}
