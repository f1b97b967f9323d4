package figures

import (
	"strconv"

	"swaysheet/core/draws"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// Spread is the spread of the crew's figures over the draws, in the words,
// units and rounding of the figures table (core/figures), as the page
// shows it.
type Spread struct {
	// Runs is how many draws the figures are over; Seed selects them.
	Runs int         `json:"runs"`
	Seed uint64      `json:"seed"`
	Rows []SpreadRow `json:"rows"`
	// Spreads states the spread used, in the units shown.
	Spreads string `json:"spreads"`
	// Limits says in how many runs every figure with a limit stays
	// within the lift plan's limits; empty when the scenario sets none.
	Limits string `json:"limits,omitempty"`
	// Over is how many runs have at least one figure beyond its limit.
	Over int `json:"over"`
}

// SpreadRow is one figure over the draws: its percentiles as the figures table
// presents a value (Text in Unit), a sentence for the crew, and how many
// runs go beyond the lift plan's limit.
type SpreadRow struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Key       string `json:"key"`
	Crew      string `json:"crew"`
	Technical string `json:"technical"`
	Unit      string `json:"unit"`
	P50       Row    `json:"p50"`
	P90       Row    `json:"p90"`
	P95       Row    `json:"p95"`
	Max       Row    `json:"max"`
	Words     string `json:"words"`
	// Check is the 95th percentile held against the limit; Over the runs
	// beyond it and LimitWords says so. Nil and empty without a limit.
	Check      *Check `json:"check,omitempty"`
	Over       int    `json:"over"`
	LimitWords string `json:"limit_words,omitempty"`
}

// PresentSpread gives the spread of res's figures (draws of s under req,
// core/draws) in the units of u.
func PresentSpread(s *scenario.Scenario, req draws.Request, res *draws.Result, u units.Choice) Spread {
	n := len(res.Figures.PeakSwingDeg)
	sh := Spread{Runs: n, Seed: req.Seed, Rows: []SpreadRow{}}
	runs := count(n)
	over := make([]bool, n)
	anyLimit := false
	for _, f := range []struct {
		key string
		p   draws.Percentiles
		v   []float64
	}{
		{"peak_swing_deg", res.Summary.PeakSwingDeg, res.Figures.PeakSwingDeg},
		{"peak_excursion_m", res.Summary.PeakExcursionM, res.Figures.PeakExcursionM},
		{"residual_swing_deg", res.Summary.ResidualSwingDeg, res.Figures.ResidualSwingDeg},
		{"tension_factor", res.Summary.TensionFactor, res.Figures.TensionFactor},
	} {
		p95, ok := presentValue(s, f.key, f.p.P95, u)
		if !ok {
			continue
		}
		at := func(v float64) Row { r, _ := presentValue(s, f.key, v, u); r.Check = nil; return r }
		row := SpreadRow{Key: f.key, Crew: p95.Crew, Technical: p95.Technical, Unit: p95.Unit,
			P50: at(f.p.P50), P90: at(f.p.P90), P95: at(f.p.P95), Max: at(f.p.Max), Check: p95.Check}
		row.Words = "In 95 of 100 likely runs: " + p95.Crew + " " + p95.Text + unitText(p95.Unit) + " or less."
		if c := p95.Check; c != nil {
			anyLimit = true
			for i, v := range f.v {
				if v > c.LimitSI {
					row.Over++
					over[i] = true
				}
			}
			limit := "the lift plan's limit of " + c.LimitText + unitText(p95.Unit)
			if row.Over == 0 {
				row.LimitWords = "Within " + limit + " in all " + runs + " runs."
			} else {
				row.LimitWords = "OUTSIDE " + limit + " in " + count(row.Over) + " of " + runs + " runs."
			}
		}
		sh.Rows = append(sh.Rows, row)
	}
	for _, o := range over {
		if o {
			sh.Over++
		}
	}
	if anyLimit {
		if sh.Over == 0 {
			sh.Limits = "In all " + runs + " likely runs every figure is within the lift plan's limits."
		} else {
			sh.Limits = "In " + count(sh.Over) + " of " + runs + " likely runs at least one figure is OUTSIDE the lift plan's limits."
		}
	}
	sh.Spreads = spreadWords(s, req.Spread, u) + " Seed " + strconv.FormatUint(req.Seed, 10) + ": the same seed gives the same runs."
	return sh
}

// spreadWords states the spread used; a quantity that has none, or that
// the scenario gives nothing to draw for, is said so.
func spreadWords(s *scenario.Scenario, sp draws.Spread, u units.Choice) string {
	moves, wind := len(s.Motions) > 0, s.Wind != nil
	text := "Spread used, one standard deviation either way, cut off at three:"
	for i, x := range []struct {
		what, quantity string
		v              float64
		applies        bool
	}{
		{"rope length", "length", sp.RopeLengthM, true},
		{"depth of the load's centre", "length", sp.CentreDepthM, true},
		{"press timing", "time", sp.PressS, moves},
		{"gust strength", "", sp.GustPct, wind},
		{"gust timing", "time", sp.GustS, wind},
	} {
		v := "none"
		switch {
		case x.v != 0 && !x.applies && i == 2:
			v = "none (no crane move)"
		case x.v != 0 && !x.applies:
			v = "none (no wind in the scenario)"
		case x.v != 0 && x.quantity == "":
			v = strconv.FormatFloat(x.v, 'f', -1, 64) + " %"
		case x.v != 0:
			v = words.Quantity{Value: x.v, Quantity: x.quantity}.Show(u)
		}
		if i > 0 {
			text += ","
		}
		text += " " + x.what + " " + v
	}
	return text + "."
}

// count writes a whole number with thousands marked: 1,000.
func count(n int) string {
	s := strconv.Itoa(n)
	for i := len(s) - 3; i > 0; i -= 3 {
		s = s[:i] + "," + s[i:]
	}
	return s
}
