package figures

import (
	"reflect"
	"strings"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// Row is one figure of a result as it is presented.
type Row struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Key       string `json:"key"`
	Crew      string `json:"crew"`
	Technical string `json:"technical"`
	Quantity  string `json:"quantity"`
	// ValueSI is the figure as the core computed it, in UnitSI.
	ValueSI float64 `json:"value_si"`
	UnitSI  string  `json:"unit_si"`
	// Text is the value in Unit, rounded as people read it
	// (units.Round): "1.3", never "1.3e+00".
	Text string `json:"text"`
	Unit string `json:"unit"`
	// LimitKey is the limit the figure can be held against
	// ("limits.peak_swing_deg"); empty when it has none.
	LimitKey string `json:"limit_key,omitempty"`
	// Detail: a figure for engineers, shown apart from the crew's lines.
	Detail bool `json:"detail,omitempty"`
	// Check is the verdict against the plan's limit; nil when the figure
	// has no limit, the scenario sets none, or nothing was simulated.
	Check *Check `json:"check,omitempty"`
}

// Check is one figure held against the lift plan's limit.
type Check struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	LimitSI   float64 `json:"limit_si"`
	LimitText string  `json:"limit_text"` // in the row's Unit, rounded
	Within    bool    `json:"within"`     // ValueSI <= LimitSI, unrounded
	// Margin is how far the figure is inside the limit (within) or
	// beyond it (OUTSIDE), in the row's Unit, rounded; "less than 0.1"
	// when rounding would say 0.
	Margin string `json:"margin"`
	// Words say it all: "within the limit of 2.0 deg, 0.6 deg to spare",
	// "OUTSIDE the limit of 2.0 deg by 0.4 deg".
	Words string `json:"words"`
	// Over several rope lengths (PresentRopes): the worst value, held
	// against the limit, in SI and as text in the row's Unit, and the
	// rope length it is at (as text with its unit).
	WorstSI          float64 `json:"worst_si,omitempty"`
	WorstText        string  `json:"worst_text,omitempty"`
	WorstRopeLengthM float64 `json:"worst_rope_length_m,omitempty"`
	WorstRope        string  `json:"worst_rope,omitempty"`
}

// Verdict states.
const (
	AllWithin    = "within"        // every limit set is met
	Outside      = "outside"       // at least one figure is beyond its limit
	NoLimits     = "no_limits"     // the scenario sets no limit
	NotSimulated = "not_simulated" // no move, no wind, no swing at the start
	NotComputed  = "not_computed"  // no result
)

// Verdict is the result held against the lift plan as a whole.
type Verdict struct {
	State string `json:"state"`
	// Outside are the keys of the figures beyond their limits.
	Outside []string `json:"outside"`
	Text    string   `json:"text"`
	// RopeLengthsM are the rope lengths the verdict is over, shortest
	// first, when more than one (PresentRopes).
	RopeLengthsM []float64 `json:"rope_lengths_m,omitempty"`
}

// Report is what the "figures" bridge call returns.
type Report struct {
	Rows    []Row   `json:"rows"`
	Verdict Verdict `json:"verdict"`
	// ResultFor says what the figures are of when that is not the
	// scenario's own moves ("the recommended drive setting (below)").
	ResultFor string `json:"result_for,omitempty"`
}

// Present gives the rows of every figure r has, in the units of u, and
// the verdict against s's limits. r may be nil (not computed).
func Present(s *scenario.Scenario, r *sway.Result, u units.Choice) Report {
	rep := Report{Rows: []Row{}, Verdict: Verdict{Outside: []string{}}}
	if r == nil {
		rep.Verdict.State = NotComputed
		rep.Verdict.Text = "Not computed: there are no figures to hold against the lift plan's limits."
		return rep
	}
	moved := simulated(s)
	anyLimit := false
	var out []string
	for _, f := range Table {
		v, ok := f.Value(r)
		if !ok {
			continue
		}
		row := f.row(v, u)
		if f.Named != nil {
			row.Technical = f.Named(r)
		}
		if r.Body != nil && r.Body.Suspension == sway.Spreader {
			// The legs under a spreader are spreader legs (sway.LegName).
			row.Crew = strings.Replace(row.Crew, "sling leg", "spreader leg", 1)
		}
		if f.Limit != "" && moved {
			if lim := limitOf(s.Limits, f.Limit); lim != nil {
				anyLimit = true
				row.Check = check(v, *lim, u.Unit(row.Quantity), row.Unit)
				if !row.Check.Within {
					rep.Verdict.Outside = append(rep.Verdict.Outside, f.Key)
					out = append(out, row.Crew+" "+row.Text+unitText(row.Unit)+" is "+row.Check.Words)
				}
			}
		}
		rep.Rows = append(rep.Rows, row)
	}
	switch {
	case !moved:
		rep.Verdict.State = NotSimulated
		rep.Verdict.Text = "Nothing was simulated: the scenario has no crane move, no wind and no swing at the start. Add a move to hold it against the lift plan's limits."
	case len(out) > 0:
		rep.Verdict.State = Outside
		rep.Verdict.Text = "OUTSIDE the lift plan's limits: " + strings.Join(out, "; ") + ". Do not lift as planned."
	case !anyLimit:
		rep.Verdict.State = NoLimits
		rep.Verdict.Text = "No limits are set: the figures are not held against a lift plan."
	default:
		rep.Verdict.State = AllWithin
		rep.Verdict.Text = "All figures are within the lift plan's limits."
	}
	if len(s.Motions) == 0 && moved {
		rep.Verdict.Text += " No crane move was simulated: these are the figures of the wind and the swing at the start alone."
	}
	return rep
}

// row is the figure's value v (SI) as it is presented in the units of u.
func (f Figure) row(v float64, u units.Choice) Row {
	q := f.Quantity
	if q == "" {
		q = units.QuantityOf(f.Unit)
	}
	un := u.Unit(q)
	shown, sym := u.Show(q, v)
	if un.ToSI == 0 {
		sym = f.Unit
	}
	if q == "ratio" {
		sym = "×" // times the static value
	}
	_, text := units.Round(shown, un)
	row := Row{Key: f.Key, Crew: f.Crew, Technical: f.Technical, Quantity: q, ValueSI: v, UnitSI: f.Unit,
		Text: text, Unit: sym, Detail: f.Detail}
	if f.Limit != "" {
		row.LimitKey = "limits." + f.Limit
	}
	return row
}

// check holds v against lim (both SI); un is the display unit, sym its
// symbol as shown.
func check(v, lim float64, un units.Unit, sym string) *Check {
	show := func(x float64) float64 {
		if un.ToSI == 0 {
			return x
		}
		return x / un.ToSI
	}
	_, limText := units.Round(show(lim), un)
	c := &Check{LimitSI: lim, LimitText: limText, Within: v <= lim}
	diff := v - lim
	if c.Within {
		diff = lim - v
	}
	r, m := units.Round(show(diff), un)
	if r == 0 && diff > 0 {
		_, step := units.Round(un.Step, un)
		m = "less than " + step
	}
	c.Margin = m
	if c.Within {
		c.Words = "within the limit of " + limText + unitText(sym) + ", " + m + unitText(sym) + " to spare"
	} else {
		c.Words = "OUTSIDE the limit of " + limText + unitText(sym) + " by " + m + unitText(sym)
	}
	return c
}

func unitText(sym string) string {
	if sym == "" {
		return ""
	}
	return " " + sym
}

// simulated says whether anything moves the load: a crane move, wind, or
// a swing at the start.
func simulated(s *scenario.Scenario) bool {
	if len(s.Motions) > 0 || s.Wind != nil {
		return true
	}
	in := s.Initial
	return in != nil && (in.SwingDeg != 0 || in.VelocityXMPerS != 0 || in.VelocityYMPerS != 0)
}

// limitOf reads the limit with the given JSON name from l; nil when not
// set. Every scenario.Limits field is found by its name, so a new limit
// needs no change here.
func limitOf(l *scenario.Limits, name string) *float64 {
	if l == nil {
		return nil
	}
	v := reflect.ValueOf(l).Elem()
	t := v.Type()
	for i := 0; i < t.NumField(); i++ {
		tag, _, _ := strings.Cut(t.Field(i).Tag.Get("json"), ",")
		if tag != name {
			continue
		}
		if p, ok := v.Field(i).Interface().(*float64); ok {
			return p
		}
	}
	return nil
}

// presentValue presents v (SI) as the figure key of the table would be in
// a result of s: its words, unit and rounding, and, when s sets the
// figure's limit, the check against it. False when the table has no such
// figure. For figures gathered outside one result (the spread over many
// runs, core/draws).
func presentValue(s *scenario.Scenario, key string, v float64, u units.Choice) (Row, bool) {
	for _, f := range Table {
		if f.Key != key {
			continue
		}
		row := f.row(v, u)
		if f.Limit != "" && s != nil {
			if lim := limitOf(s.Limits, f.Limit); lim != nil {
				row.Check = check(v, *lim, u.Unit(row.Quantity), row.Unit)
			}
		}
		return row, true
	}
	return Row{}, false
}
