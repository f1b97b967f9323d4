package bridge

import (
	"encoding/json"

	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

func init() {
	Calls["figures"] = figuresCall
	Calls["plot"] = plotCall
}

// ShownInput is a scenario and the units it is shown in: the input of the
// "figures" call, and the start of the "sheet" call's.
type ShownInput struct {
	Scenario json.RawMessage `json:"scenario"`
	// Units are the page's display units by quantity; System the unit
	// system for quantities not listed ("si" or "us").
	Units  map[string]string `json:"units"`
	System string            `json:"system"`
}

// read decodes the input and parses (and validates) its scenario.
func (in *ShownInput) read(input []byte, into any) (*scenario.Scenario, error) {
	if err := json.Unmarshal(input, into); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"scenario\": {...}, \"units\": {...}, \"system\": \"si\"}: " + err.Error()}}
	}
	return scenario.Parse(in.Scenario)
}

func (in *ShownInput) choice() units.Choice { return units.Choice{Chosen: in.Units, System: in.System} }

// figuresCall presents the scenario's result (the last evaluation when it
// is of the same scenario) from the figures table: figures.Report JSON.
func figuresCall(_ *Env, input []byte) (any, error) {
	var in ShownInput
	s, err := in.read(input, &in)
	if err != nil {
		return nil, err
	}
	// As on the sheet: a planning request without moves of its own that
	// the page has planned is presented for the recommended move, and the
	// verdict is over every rope length the scenario names. The plan is
	// only taken from the memo, never made here.
	c := sheet.Computer{Plan: keptPlan, Evaluate: func(x *scenario.Scenario) (*sway.Result, error) {
		return evaluated(x, x == s)
	}}.Compute(s)
	if c.ResultErr != "" {
		_, err := evaluated(c.Evaluated, c.Evaluated == s) // the error as it came, fields and all
		if err == nil {
			err = scenario.Errors{{Field: "(scenario)", Message: c.ResultErr}}
		}
		return nil, err
	}
	rep := figures.PresentRopes(c.Evaluated, c.Ropes, in.choice())
	rep.ResultFor = c.ResultFor
	out := FiguresReply{Report: rep}
	if out.ResultFingerprint, err = scenario.Fingerprint(c.Evaluated); err != nil {
		return nil, err
	}
	if c.Evaluated != s {
		if out.ResultScenario, err = scenario.Canonical(c.Evaluated); err != nil {
			return nil, err
		}
	}
	return out, nil
}

// FiguresReply is the "figures" call's result: the report, and which
// scenario its figures are of (the scenario's fingerprint), so that the
// page draws its plots and the sheet prints the same move. A planning
// request without moves that has been planned is presented for the
// recommended drive setting: ResultScenario is then that scenario (the
// request with the recommended move), for the page to ask the evaluate
// call for (from the memo) and plot.
type FiguresReply struct {
	figures.Report
	ResultFingerprint string          `json:"result_fingerprint"`
	ResultScenario    json.RawMessage `json:"result_scenario,omitempty"`
}

// plotCall draws a line chart with the check sheet's plotter (core/sheet
// Plot): input a plotInput (the Plot JSON), result {"svg": "<svg ...>"}.
func plotCall(_ *Env, input []byte) (any, error) {
	var p plotInput
	if err := json.Unmarshal(input, &p); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"title\", \"x_label\", \"y_label\", \"series\": [{\"x\": [...], \"y\": [...]}], \"lines\", \"bands\", \"circles\", \"width_px\", ...}: " + err.Error()}}
	}
	if p.HistoryKey != "" && !p.fromHistory() {
		return nil, scenario.Errors{{Field: "history_key", Message: "no evaluation of this key with these series is kept: send the series' numbers"}}
	}
	return map[string]string{"svg": p.SVG()}, nil
}

// plotInput is the plot call's input: a chart, whose series' numbers may
// instead be a kept evaluation's histories, named (HistoryKey and
// SeriesOf). The page's worker draws the rope-angle chart of the
// evaluation it has just answered that way: the numbers are those the
// evaluate reply wrote (sway.History.Shown), bit for bit, without the
// worker sending them back and this call reading them (about two thirds
// of the call's work).
type plotInput struct {
	sheet.Plot
	// HistoryKey is an evaluate reply's key.
	HistoryKey string `json:"history_key"`
	// SeriesOf[i] names series i's x and y by their JSON names in the
	// evaluate reply's history (["time_s", "swing_deg"]).
	SeriesOf [][2]string `json:"series_of"`
}

// fromHistory sets the series' numbers from the kept evaluation; false
// when it is not kept or has no such series (one name pair a series).
func (p *plotInput) fromHistory() bool {
	r := keptByKey(p.HistoryKey)
	if r == nil || len(p.SeriesOf) != len(p.Series) {
		return false
	}
	digits := sway.HistoryDigits(r.Solver.RelTol)
	ok := true
	for i := range p.Series {
		var okX, okY bool
		s, of := &p.Series[i], p.SeriesOf[i]
		s.X, okX = r.History.Shown(of[0], digits)
		s.Y, okY = r.History.Shown(of[1], digits)
		ok = ok && okX && okY
	}
	return ok
}
