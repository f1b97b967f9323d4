package sheet

import (
	"strings"

	"swaysheet/core/figures"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// fillResults puts the result's figures on the sheet as the figures table
// presents them (ev is the scenario r is of): figures without a limit in
// the results table, figures the plan can limit in the checks table,
// then the verdict, the warnings and the plots. On paper the crew's words
// alone keep each figure on one line; the technical names are in the
// command line's summary and the page's figures.
func fillResults(v *view, ev *scenario.Scenario, r *sway.Result, u units.Choice) {
	rep := figures.Present(ev, r, u)
	v.Verdict = rep.Verdict.Text
	v.AnyOutside = rep.Verdict.State == figures.Outside
	v.Simulated = rep.Verdict.State != figures.NotSimulated
	lim := []hline{}
	for _, row := range rep.Rows {
		if row.LimitKey == "" {
			v.Results = append(v.Results, Row{Label: capital(row.Crew), Value: row.Text, Unit: row.Unit})
			continue
		}
		c := check{Label: capital(row.Crew), Value: row.Text, Unit: row.Unit}
		if k := row.Check; k != nil {
			c.HasLimit, c.Limit, c.Within, c.Margin = true, k.LimitText, k.Within, k.Margin
			if row.Key == "peak_swing_deg" {
				lim = append(lim, hline{Y: k.LimitSI, Text: "limit " + k.LimitText + " deg"})
			}
		}
		v.Checks = append(v.Checks, c)
	}
	v.Warnings = r.Warnings
	h := r.History
	v.AnglePlot = markup(chart("Rope angle from the vertical", "time, s", "rope angle, deg",
		[]series{{X: h.TimeS, Y: h.SwingDeg, Width: 1.3, Name: "rope angle"}}, lim))
	_, ls := u.Show("length", 1)
	conv := func(xs []float64) []float64 {
		out := make([]float64, len(xs))
		for i, x := range xs {
			out[i], _ = u.Show("length", x)
		}
		return out
	}
	v.PathPlot = markup(chart("Load path seen from above", "x, "+ls, "y, "+ls, []series{
		{X: conv(h.SuspensionXM), Y: conv(h.SuspensionYM), Dash: "4 2.5", Width: 1, Name: "suspension point"},
		{X: conv(h.LoadXM), Y: conv(h.LoadYM), Width: 1.4, Name: "load"},
	}, nil))
}

func capital(s string) string {
	if s == "" {
		return s
	}
	r := []rune(s)
	return strings.ToUpper(string(r[0])) + string(r[1:])
}

func planSection(r *plan.Result, planErr string, u units.Choice) *planView {
	pv := &planView{}
	if r == nil {
		pv.Err = planErr
		if pv.Err == "" {
			pv.Err = "no plan was given to the sheet"
		}
		return pv
	}
	pv.Axis = r.Axis
	pv.Reason = r.Reason
	ls := make([]string, len(r.RopeLengthsM))
	for i, l := range r.RopeLengthsM {
		x, _ := u.Show("length", l)
		ls[i] = Num(x, 4)
	}
	_, sym := u.Show("length", 1)
	pv.Ropes = strings.Join(ls, ", ") + " " + sym
	pv.Infeasible = r.Infeasible
	pv.Notes = r.Notes
	if r.Recommended >= 0 && r.Recommended < len(r.Options) {
		o := r.Options[r.Recommended]
		pv.Recommended = &o
	}
	for i, o := range r.Options {
		if i != r.Recommended && len(pv.Others) < 3 {
			pv.Others = append(pv.Others, o)
		}
	}
	return pv
}
