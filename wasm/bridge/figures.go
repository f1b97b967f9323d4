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
	// The verdict is over every rope length the scenario names.
	evals, err := figures.EvaluateRopes(s, func(x *scenario.Scenario) (*sway.Result, error) {
		return evaluated(x, x == s)
	})
	if err != nil {
		return nil, err
	}
	return figures.PresentRopes(s, evals, in.choice()), nil
}

// plotCall draws a line chart with the check sheet's plotter (core/sheet
// Plot): input the Plot JSON, result {"svg": "<svg ...>"}.
func plotCall(_ *Env, input []byte) (any, error) {
	var p sheet.Plot
	if err := json.Unmarshal(input, &p); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"title\", \"x_label\", \"y_label\", \"series\": [{\"x\": [...], \"y\": [...]}], \"lines\": [...]}: " + err.Error()}}
	}
	return map[string]string{"svg": p.SVG()}, nil
}
