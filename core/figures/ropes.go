package figures

import (
	"strings"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// RopeLengths are the rope lengths a scenario names, in metres: the
// load's own (the nominal) first, then the ends of the plan's rope-length
// range when it has one and they differ from it. The verdict is the worst
// over all of them.
func RopeLengths(s *scenario.Scenario) []float64 {
	if s.Load.RopeLengthM == nil {
		return nil
	}
	out := []float64{*s.Load.RopeLengthM}
	if p := s.Plan; p != nil && p.RopeLengthMinM != nil && p.RopeLengthMaxM != nil {
		for _, l := range []float64{*p.RopeLengthMinM, *p.RopeLengthMaxM} {
			if l != out[0] && (len(out) < 2 || l != out[1]) {
				out = append(out, l)
			}
		}
	}
	return out
}

// AtRope is s with the rope length l (the hook's, with a hook block);
// everything else is shared with s and must not be changed.
func AtRope(s *scenario.Scenario, l float64) *scenario.Scenario {
	c := *s
	c.Load.RopeLengthM = &l
	return &c
}

// Evaluation is one of the evaluations a verdict is over: the result at
// one rope length, or why there is none.
type Evaluation struct {
	RopeLengthM float64
	Result      *sway.Result
	Err         string
}

// EvaluateRopes evaluates s at each of its rope lengths with the
// caller's evaluate (the command line's sway.Evaluate, the bridge's memo),
// nominal first. The nominal's error is returned; the others' are kept in
// their Evaluation.
func EvaluateRopes(s *scenario.Scenario, evaluate func(*scenario.Scenario) (*sway.Result, error)) ([]Evaluation, error) {
	ls := RopeLengths(s)
	out := make([]Evaluation, 0, len(ls))
	for i, l := range ls {
		x := s
		if i > 0 {
			x = AtRope(s, l)
		}
		r, err := evaluate(x)
		if err != nil {
			if i == 0 {
				return nil, err
			}
			out = append(out, Evaluation{RopeLengthM: l, Err: err.Error()})
			continue
		}
		out = append(out, Evaluation{RopeLengthM: l, Result: r})
	}
	return out, nil
}

// PresentRopes is Present over the evaluations at every rope length the
// scenario names (evals[0] the nominal, as EvaluateRopes gives them): the
// rows are the nominal's, each limit is held against the worst value over
// all rope lengths, and the verdict says at which rope length the worst
// is. One evaluation: Present.
func PresentRopes(s *scenario.Scenario, evals []Evaluation, u units.Choice) Report {
	if len(evals) == 0 || evals[0].Result == nil {
		return Present(s, nil, u)
	}
	if len(evals) == 1 {
		return Present(s, evals[0].Result, u)
	}
	nominal := AtRope(s, evals[0].RopeLengthM)
	rep := Present(nominal, evals[0].Result, u)
	ropeText := func(l float64) string { return words.Length(l).Show(u) }
	var checked []float64
	var failed []string
	for _, e := range evals {
		if e.Result == nil {
			failed = append(failed, "at rope "+ropeText(e.RopeLengthM)+": "+e.Err)
			continue
		}
		checked = append(checked, e.RopeLengthM)
	}
	rep.Verdict.Outside = []string{}
	var out []string
	for i := range rep.Rows {
		row := &rep.Rows[i]
		if row.Check == nil {
			continue
		}
		f, _ := ByKey(row.Key)
		worst, at := row.ValueSI, evals[0].RopeLengthM
		for _, e := range evals[1:] {
			if e.Result == nil {
				continue
			}
			if v, ok := f.Value(e.Result); ok && v > worst {
				worst, at = v, e.RopeLengthM
			}
		}
		q := u.Unit(row.Quantity)
		row.Check = check(worst, row.Check.LimitSI, q, row.Unit)
		row.Check.WorstSI = worst
		row.Check.WorstText = roundText(worst, q)
		row.Check.WorstRopeLengthM = at
		row.Check.WorstRope = ropeText(at)
		row.Check.Words += " (worst at rope " + row.Check.WorstRope + ")"
		if !row.Check.Within {
			rep.Verdict.Outside = append(rep.Verdict.Outside, row.Key)
			out = append(out, row.Crew+" "+row.Check.WorstText+unitText(row.Unit)+" at rope "+row.Check.WorstRope+" is "+
				strings.TrimSuffix(row.Check.Words, " (worst at rope "+row.Check.WorstRope+")"))
		}
	}
	sorts.Floats(checked)
	ls := make([]string, len(checked))
	for i, l := range checked {
		ls[i] = ropeText(l)
	}
	rep.Verdict.RopeLengthsM = checked
	over := " at every rope length checked (" + strings.Join(ls, ", ") + ")"
	switch rep.Verdict.State {
	case Outside, AllWithin:
		if len(out) > 0 {
			rep.Verdict.State = Outside
			rep.Verdict.Text = "OUTSIDE the lift plan's limits: " + strings.Join(out, "; ") + ". Do not lift as planned."
		} else {
			rep.Verdict.State = AllWithin
			rep.Verdict.Text = "All figures are within the lift plan's limits" + over + "."
		}
	}
	if len(failed) > 0 {
		rep.Verdict.Text += " Not checked " + strings.Join(failed, "; ") + "."
	}
	return rep
}

// roundText is v (SI) in the display unit q, rounded.
func roundText(v float64, q units.Unit) string {
	if q.ToSI == 0 {
		_, t := units.Round(v, q)
		return t
	}
	_, t := units.Round(v/q.ToSI, q)
	return t
}
