//go:build !nofetch

package bridge

import (
	"bytes"
	"encoding/json"

	"swaysheet/core/draws"
	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// The draws call is in the page's build only: no page uses it yet, and the
// single file (-tags nofetch) is at its size budget (about 11 KB gzipped
// for this call and math/rand/v2).
func init() {
	Calls["draws"] = runDraws
	Calls["draws_join"] = joinDraws
}

// drawsInput is the input of the draws call: a scenario, the draws to
// run on it and the units shown (for the messages; SI when not given).
// First and Count in the request select a share of the runs, so that the
// page can split one request over several workers and merge the figures
// (each draw is the same wherever it runs).
type drawsInput struct {
	Scenario json.RawMessage   `json:"scenario"`
	Draws    draws.Request     `json:"draws"`
	Units    map[string]string `json:"units"`
	System   string            `json:"system"`
}

// runDraws evaluates the scenario over the draws; the result is the
// draws.Result JSON (percentiles and each draw's figures). Field errors
// name the scenario's own paths, or draws.* for the request with the
// accepted range in the units shown.
func runDraws(_ *Env, input []byte) (any, error) {
	var in drawsInput
	dec := json.NewDecoder(bytes.NewReader(input))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&in); err != nil {
		return nil, scenario.Errors{{Field: "draws", Message: "the input must be {\"scenario\": {...}, \"draws\": {\"runs\", \"seed\", \"spread\", \"first\", \"count\"}, \"units\", \"system\"}: " + err.Error()}}
	}
	if len(in.Scenario) == 0 {
		return nil, scenario.Errors{{Field: "scenario", Message: "the scenario is missing"}}
	}
	s, err := scenario.Parse(in.Scenario)
	if err != nil {
		return nil, err
	}
	if err := draws.Check(s, in.Draws, units.Choice{Chosen: in.Units, System: in.System}); err != nil {
		return nil, err
	}
	return draws.Run(s, in.Draws, 0)
}

// joinInput is the input of the draws_join call: the request, the parts
// received so far (draws results of runs [first, first+runs)) and the
// units shown.
type joinInput struct {
	drawsInput
	Parts []draws.Result `json:"parts"`
}

// JoinedDraws is the draws_join call's result: the parts' draws in order
// (Runs of them, from First), their percentiles, and the spread as the
// page shows it (figures.PresentSpread).
type JoinedDraws struct {
	draws.Result
	Shown figures.Spread `json:"shown"`
}

// joinDraws merges the parts of a request split over workers (in the
// order of their first draw, so that the answer does not depend on which
// worker answered first) and presents the percentiles over them.
func joinDraws(_ *Env, input []byte) (any, error) {
	var in joinInput
	if err := json.Unmarshal(input, &in); err != nil {
		return nil, scenario.Errors{{Field: "draws", Message: "the input must be {\"scenario\", \"draws\", \"parts\": [...], \"units\", \"system\"}: " + err.Error()}}
	}
	s, err := scenario.Parse(in.Scenario)
	if err != nil {
		return nil, err
	}
	ps := in.Parts
	for i := 1; i < len(ps); i++ { // a few parts: insertion sort
		for j := i; j > 0 && ps[j].First < ps[j-1].First; j-- {
			ps[j], ps[j-1] = ps[j-1], ps[j]
		}
	}
	var out JoinedDraws
	f := &out.Figures
	for i, p := range in.Parts {
		if i == 0 {
			out.First = p.First
		}
		f.PeakSwingDeg = append(f.PeakSwingDeg, p.Figures.PeakSwingDeg...)
		f.PeakExcursionM = append(f.PeakExcursionM, p.Figures.PeakExcursionM...)
		f.ResidualSwingDeg = append(f.ResidualSwingDeg, p.Figures.ResidualSwingDeg...)
		f.TensionFactor = append(f.TensionFactor, p.Figures.TensionFactor...)
	}
	n := len(f.PeakSwingDeg)
	if n == 0 || len(f.PeakExcursionM) != n || len(f.ResidualSwingDeg) != n || len(f.TensionFactor) != n {
		return nil, scenario.Errors{{Field: "parts", Message: "the parts hold no runs, or not every figure for each run"}}
	}
	out.Runs = n
	out.Summary = draws.Summarise(f)
	out.Shown = figures.PresentSpread(s, in.Draws, &out.Result, units.Choice{Chosen: in.Units, System: in.System})
	return out, nil
}
