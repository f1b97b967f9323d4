package main

import (
	"bytes"
	"strings"
	"testing"

	"swaysheet/core/figures"
	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// TestPeakTiltLimit follows DEVELOPERS.md's recipe "Adding a check" (a
// limit a result is held against) for limits.peak_tilt_deg, the largest
// tilt of a rigid load the rigging plan allows: within when the figure
// body.peak_tilt_deg is at or below it, OUTSIDE above, on the command
// line's summary, the check sheet and the page's "figures" call
// (figures.Present); a point load has no tilt, so no verdict and no
// error. The panel's tilt is the core's own figure: the test checks the
// verdict, not the physics.
func TestPeakTiltLimit(t *testing.T) {
	s := testscenario.Example(t, "precast-panel-spreader")
	s.Plan = nil // the nominal rope length alone
	r, err := sway.Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	tilt := r.Body.PeakTiltDeg
	for _, c := range []struct {
		limit  float64
		within bool
	}{{tilt, true}, {tilt + 1, true}, {tilt - 0.5, false}} {
		s.Limits = &scenario.Limits{PeakTiltDeg: &c.limit}
		if err := s.Validate(); err != nil {
			t.Fatalf("limit %g: %v", c.limit, err)
		}
		r, err := sway.Evaluate(s)
		if err != nil {
			t.Fatal(err)
		}
		if len(r.Checks) != 1 || r.Checks[0].Name != "peak_tilt_deg" || r.Checks[0].Within != c.within {
			t.Errorf("limit %g: sway's checks %+v", c.limit, r.Checks)
		}
		if warned := strings.Contains(strings.Join(r.Warnings, " "), "The load's largest tilt of"); warned == c.within {
			t.Errorf("limit %g: warnings %q", c.limit, r.Warnings)
		}
		rep := figures.Present(s, r, units.Choice{})
		var row *figures.Row
		for i := range rep.Rows {
			if rep.Rows[i].Key == "body.peak_tilt_deg" {
				row = &rep.Rows[i]
			}
		}
		if row == nil || row.LimitKey != "limits.peak_tilt_deg" || row.Check == nil || row.Check.Within != c.within {
			t.Fatalf("limit %g: the figures call's row %+v", c.limit, row)
		}
		state, word := figures.AllWithin, "within the limit of"
		if !c.within {
			state, word = figures.Outside, "OUTSIDE the limit of"
		}
		if rep.Verdict.State != state || !strings.Contains(row.Check.Words, word) {
			t.Errorf("limit %g: verdict %q, words %q", c.limit, rep.Verdict.State, row.Check.Words)
		}

		var out bytes.Buffer
		if err := printSummary(&out, "precast-panel-spreader.json", s, units.Choice{}); err != nil {
			t.Fatal(err)
		}
		line := lineWith(out.String(), "largest tilt of the load")
		if !strings.Contains(line, word) {
			t.Errorf("limit %g: the summary's line %q lacks %q", c.limit, line, word)
		}

		doc := sheetFragment(t, s, units.Choice{})
		mark := "✔ within"
		if !c.within {
			mark = "✖ OUTSIDE"
		}
		if line := lineWith(doc, "<th>Largest tilt of the load</th>"); !strings.Contains(line, mark) {
			t.Errorf("limit %g: the check sheet's line %q lacks %q", c.limit, line, mark)
		}
		if !strings.Contains(doc, "<th>Peak tilt of the load allowed</th>") {
			t.Errorf("limit %g: the check sheet's inputs lack the limit", c.limit)
		}
	}

	// A load given as a point has no tilt: the limit is accepted and
	// nothing is held against it.
	p := testscenario.Example(t, "bay-travel")
	lim := 2.0
	p.Limits = &scenario.Limits{PeakTiltDeg: &lim}
	if err := p.Validate(); err != nil {
		t.Fatal(err)
	}
	pr, err := sway.Evaluate(p)
	if err != nil {
		t.Fatal(err)
	}
	if rep := figures.Present(p, pr, units.Choice{}); len(pr.Checks) != 0 || rep.Verdict.State != figures.NoLimits {
		t.Errorf("a point load: checks %+v, verdict %q", pr.Checks, rep.Verdict.State)
	}

	// Outside the accepted range: the field is named.
	for _, bad := range []float64{0.05, 46} {
		s.Limits = &scenario.Limits{PeakTiltDeg: &bad}
		if err := s.Validate(); err == nil || !strings.Contains(err.Error(), "limits.peak_tilt_deg") {
			t.Errorf("limit %g: %v", bad, err)
		}
	}
}

func lineWith(text, part string) string {
	for _, l := range strings.Split(text, "\n") {
		if strings.Contains(l, part) {
			return l
		}
	}
	return ""
}
