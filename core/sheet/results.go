package sheet

import (
	"encoding/json"
	"strings"

	"swaysheet/core/figures"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// figureRow is one figure on the sheet: the crew's words, the value and
// its unit in their own columns (the values line up), and, for a figure
// the plan can limit, the limit and the verdict.
type figureRow struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Label, Value, Unit string
	Limit, Verdict     string
	Limited            bool // the plan can limit it
	Outside            bool
	Technical          string
}

// fillResults puts the result's figures on the sheet as the figures table
// presents them (ev is the scenario r is of; ropes the evaluations at
// every rope length, the verdict is the worst over them): the verdict
// band, the figures (those the plan can limit first), the warnings in the
// units shown, and the plots.
func fillResults(v *view, ev *scenario.Scenario, r *sway.Result, ropes []figures.Evaluation, u units.Choice) {
	if len(ropes) == 0 {
		ropes = []figures.Evaluation{{RopeLengthM: r.RopeLengthStartM, Result: r}}
	}
	rep := figures.PresentRopes(ev, ropes, u)
	v.Verdict, v.VerdictState = rep.Verdict.Text, rep.Verdict.State
	v.Simulated = rep.Verdict.State != figures.NotSimulated
	lim := []PlotLine{}
	var limited, others []figureRow
	for _, row := range rep.Rows {
		fr := figureRow{Label: capital(row.Crew), Value: row.Text, Unit: row.Unit, Technical: row.Technical}
		if row.Detail {
			v.DetailFigures = append(v.DetailFigures, row.Crew+" "+row.Text+unitText(row.Unit)+" ("+row.Technical+")")
			continue
		}
		if row.LimitKey == "" {
			others = append(others, fr)
			continue
		}
		fr.Limited = true
		switch k := row.Check; {
		case k != nil:
			fr.Limit, fr.Outside = k.LimitText, !k.Within
			if k.Within {
				fr.Verdict = "✔ within, " + k.Margin + unitText(row.Unit) + " to spare"
			} else {
				fr.Verdict = "✖ OUTSIDE by " + k.Margin + unitText(row.Unit)
			}
			if k.WorstRope != "" && len(rep.Verdict.RopeLengthsM) > 1 {
				// The worst over the rope lengths, as the verdict is.
				fr.Value = k.WorstText
				fr.Verdict += ", at rope " + k.WorstRope
				v.WorstNote = "Figures with a limit are the worst over the rope lengths checked; the others are at the rope length of the inputs (" +
					words.Length(ropes[0].RopeLengthM).Show(u) + ")."
			}
			if row.Key == "peak_swing_deg" {
				lim = append(lim, PlotLine{Y: k.LimitSI, Text: "limit " + k.LimitText + " deg"})
			}
		case !v.Simulated:
			fr.Verdict = "nothing simulated"
		default:
			fr.Verdict = "no limit set"
		}
		limited = append(limited, fr)
	}
	v.Figures = append(limited, others...)
	v.Warnings = words.FormatAll(r.WarningSentences, u)
	if len(r.WarningSentences) != len(r.Warnings) {
		v.Warnings = r.Warnings
	}
	h := r.History
	v.AnglePlot = markup((&Plot{ID: "sheet-angle", Title: "Rope angle from the vertical", XLabel: "time, s", YLabel: "rope angle, deg",
		Series: []PlotSeries{{X: h.TimeS, Y: h.SwingDeg, Width: 1.3, Name: "rope angle"}}, Lines: lim}).SVG())
	v.PathPlot, v.PathCaption = swingOutPlot(&h, u)
}

func unitText(sym string) string {
	if sym == "" {
		return ""
	}
	return " " + sym
}

func capital(s string) string {
	if s == "" {
		return s
	}
	r := []rune(s)
	return strings.ToUpper(string(r[0])) + string(r[1:])
}

// jsonField decodes the JSON field name of v (a planner value) into
// into; false when v has no such field or it does not decode. The
// planner's marked sentences have the JSON of core/words.Sentence, so the
// sheet reads them without naming the planner's type.
func jsonField(v any, name string, into any) bool {
	b, err := json.Marshal(v)
	if err != nil {
		return false
	}
	var m map[string]json.RawMessage
	if json.Unmarshal(b, &m) != nil {
		return false
	}
	raw, ok := m[name]
	return ok && json.Unmarshal(raw, into) == nil
}

// marked is the sentences of v's field name, with their quantities
// marked, in the units of u; v's plain texts when it has none.
func (pv *planView) marked(v any, name string, plainText []string, u units.Choice) []string {
	var ss []words.Sentence
	if jsonField(v, name, &ss) && len(ss) == len(plainText) {
		return words.FormatAll(ss, u)
	}
	if len(plainText) > 0 {
		pv.Unmarked = true
	}
	return plainText
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
	var reason words.Sentence
	if jsonField(r, "reason_sentence", &reason) && reason.Text != "" {
		pv.Reason = reason.Format(u)
	} else if r.Reason != "" {
		pv.Unmarked = true
	}
	ls := make([]string, len(r.RopeLengthsM))
	for i, l := range r.RopeLengthsM {
		ls[i] = words.Length(l).Show(u)
	}
	pv.Ropes = strings.Join(ls, ", ")
	pv.Infeasible = pv.marked(r, "infeasible_sentences", r.Infeasible, u)
	pv.Notes = pv.marked(r, "note_sentences", r.Notes, u)
	if r.Recommended >= 0 && r.Recommended < len(r.Options) {
		o := r.Options[r.Recommended]
		pv.Recommended = &o
		pv.Settings = pv.marked(o, "sentences", o.Settings, u)
		pv.Outside = pv.marked(o, "outside_sentences", o.Outside, u)
		pv.Summary = words.Say("The move takes {0} ({1} more than at the drive's limits).",
			words.Time(o.MoveTimeS), words.Time(o.PenaltyS)).Format(u)
	}
	for i, o := range r.Options {
		if i != r.Recommended && len(pv.Others) < 3 {
			pv.Others = append(pv.Others, o)
		}
	}
	return pv
}
