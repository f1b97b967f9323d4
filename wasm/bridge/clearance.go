package bridge

import (
	"encoding/json"
	"sync"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
)

// The clearance check is registered here, beside its code, so that the
// table in bridge.go stays as it is.
func init() {
	Calls["clearance"] = checkClearance
	Calls["clearance_part"] = clearancePart
	Calls["clearance_join"] = clearanceJoin
}

// checkClearance runs the clearance check of the scenario's site block:
// input is the scenario JSON, the result the clearance.Report JSON
// (verdict, each obstacle, the 50 % and 95 % envelopes as cell spans).
// A scenario without a site block gets a field error at "site".
func checkClearance(_ *Env, input []byte) (any, error) {
	s, err := siteScenario(input)
	if err != nil {
		return nil, err
	}
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		return nil, err
	}
	keepClearance(s, rep)
	return rep, nil
}

// PartInput is the input of "clearance_part": the scenario and the runs
// from From to To-1 of its check (the page splits the runs over workers).
type PartInput struct {
	Scenario json.RawMessage `json:"scenario"`
	From     int             `json:"from"`
	To       int             `json:"to"`
}

// clearancePart evaluates some runs of the check: the result is a
// clearance.Part, to be joined by "clearance_join".
func clearancePart(_ *Env, input []byte) (any, error) {
	var in PartInput
	if err := json.Unmarshal(input, &in); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "not a clearance_part request: " + err.Error()}}
	}
	s, err := siteScenario(in.Scenario)
	if err != nil {
		return nil, err
	}
	return clearance.CheckPart(s, in.From, in.To, clearance.Options{})
}

// JoinInput is the input of "clearance_join": the scenario and the parts
// received so far.
type JoinInput struct {
	Scenario json.RawMessage  `json:"scenario"`
	Parts    []clearance.Part `json:"parts"`
}

// clearanceJoin joins parts into the report over their runs: with every
// run of the check, the report of the "clearance" call, exactly, and kept
// for the check sheet.
func clearanceJoin(_ *Env, input []byte) (any, error) {
	var in JoinInput
	if err := json.Unmarshal(input, &in); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "not a clearance_join request: " + err.Error()}}
	}
	s, err := siteScenario(in.Scenario)
	if err != nil {
		return nil, err
	}
	rep, err := clearance.CheckJoin(s, in.Parts, clearance.Options{})
	if err != nil {
		return nil, err
	}
	if sp, _ := clearance.SpecOf(s); rep.Runs == sp.Runs {
		keepClearance(s, rep)
	}
	return rep, nil
}

func siteScenario(input []byte) (*scenario.Scenario, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	if s.Site == nil {
		return nil, scenario.Errors{{Field: "site", Message: "the scenario has no site block: add the obstacles, the suspension height and the load's size to check clearances"}}
	}
	return s, nil
}

// lastClearance is the last complete clearance report, by the scenario's
// fingerprint (key): the check sheet prints it and never runs the check.
var lastClearance struct {
	mu  sync.Mutex
	fp  string
	rep *clearance.Report
}

func keepClearance(s *scenario.Scenario, rep *clearance.Report) {
	fp, err := key(s)
	if err != nil {
		return
	}
	lastClearance.mu.Lock()
	lastClearance.fp, lastClearance.rep = fp, rep
	lastClearance.mu.Unlock()
}

// keptClearance is the clearance report of s when the bridge holds it.
func keptClearance(s *scenario.Scenario) *clearance.Report {
	fp, err := key(s)
	if err != nil {
		return nil
	}
	lastClearance.mu.Lock()
	defer lastClearance.mu.Unlock()
	if lastClearance.fp == fp {
		return lastClearance.rep
	}
	return nil
}
