//go:build !nofetch

package bridge

import (
	"bytes"
	"encoding/json"

	"swaysheet/core/draws"
	"swaysheet/core/scenario"
)

// The draws call is in the page's build only: no page uses it yet, and the
// single file (-tags nofetch) is at its size budget (about 11 KB gzipped
// for this call and math/rand/v2).
func init() { Calls["draws"] = runDraws }

// drawsInput is the input of the draws call: a scenario and the draws to
// run on it. First and Count in the request select a share of the runs,
// so that the page can split one request over several workers and merge
// the figures (each draw is the same wherever it runs).
type drawsInput struct {
	Scenario json.RawMessage `json:"scenario"`
	Draws    draws.Request   `json:"draws"`
}

// runDraws evaluates the scenario over the draws; the result is the
// draws.Result JSON (percentiles and each draw's figures). Field errors
// name the scenario's own paths, or draws.* for the request.
func runDraws(_ *Env, input []byte) (any, error) {
	var in drawsInput
	dec := json.NewDecoder(bytes.NewReader(input))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&in); err != nil {
		return nil, scenario.Errors{{Field: "draws", Message: "the input must be {\"scenario\": {...}, \"draws\": {\"runs\", \"seed\", \"spread\", \"first\", \"count\"}}: " + err.Error()}}
	}
	if len(in.Scenario) == 0 {
		return nil, scenario.Errors{{Field: "scenario", Message: "the scenario is missing"}}
	}
	s, err := scenario.Parse(in.Scenario)
	if err != nil {
		return nil, err
	}
	return draws.Run(s, in.Draws, 0)
}
