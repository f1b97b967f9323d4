package bridge

import (
	"encoding/json"
	"sync"

	"swaysheet/core/clearance"
	"swaysheet/core/figures"
	"swaysheet/core/scenario"
)

// The clearance check is registered here, beside its code, so that the
// table in bridge.go stays as it is.
func init() {
	Calls["clearance"] = checkClearance
	Calls["site_plan"] = planSite
	Calls["clearance_figures"] = clearanceFigures
	Calls["clearance_part"] = clearancePart
	Calls["clearance_join"] = clearanceJoin
	Calls["clearance_hold"] = clearanceHold
}

// kept is the last clearance check with its scenario's fingerprint: the
// page asks for the check, then for its figures in the units shown.
var kept struct {
	sync.Mutex
	fp  string
	rep *clearance.Report
}

// checked is the clearance check of s, from kept when it holds s's.
func checked(s *scenario.Scenario) (*clearance.Report, error) {
	fp, err := key(s)
	if err != nil {
		return nil, err
	}
	kept.Lock()
	if kept.fp == fp {
		r := kept.rep
		kept.Unlock()
		return r, nil
	}
	kept.Unlock()
	r, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		return nil, err
	}
	kept.Lock()
	kept.fp, kept.rep = fp, r
	kept.Unlock()
	return r, nil
}

// ClearanceFiguresInput is the input of "clearance_figures": the
// figures call's, and the report to present when the page gives the one
// it shows (then nothing is checked).
type ClearanceFiguresInput struct {
	ShownInput
	Report *clearance.Report `json:"report,omitempty"`
}

// clearanceFigures presents the scenario's clearance check: the report
// given, else the last one when it is of the same scenario, else one
// computed. Input as the figures call's ({"scenario", "units", "system"})
// with "report" optional; the result figures.ClearanceReport JSON (the
// check's rows and each obstacle's, converted and rounded as the figures
// call's rows, each obstacle's verdict, and the obstacles worst first).
func clearanceFigures(_ *Env, input []byte) (any, error) {
	var in ClearanceFiguresInput
	s, err := in.read(input, &in)
	if err != nil {
		return nil, err
	}
	if s.Site == nil {
		return nil, noSite
	}
	r := in.Report
	if r == nil {
		if r, err = checked(s); err != nil {
			return nil, err
		}
	}
	return figures.PresentClearance(r, in.choice()), nil
}

var noSite = scenario.Errors{{Field: "site", Message: "the scenario has no site block: add the obstacles, the suspension height and the load's size to check clearances"}}

// checkClearance runs the clearance check of the scenario's site block:
// input is the scenario JSON, the result the clearance.Report JSON
// (verdict, each obstacle, the 50 % and 95 % envelopes as cell spans).
// A scenario without a site block gets a field error at "site".
func checkClearance(_ *Env, input []byte) (any, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	if s.Site == nil {
		return nil, noSite
	}
	return checked(s)
}

// planSite checks a plan's options against the scenario's site block:
// input is the scenario JSON with both a plan and a site block, the result
// the clearance.SitePlan JSON (the fastest option that keeps the margin in
// 95 % of runs, by its index in the plan call's options, and the largest
// top speed that does). The plan is the plan call's own (the bridge keeps
// the last one by fingerprint, so asking after "plan" plans nothing
// again). A missing block is a field error at "site" or "plan".
func planSite(_ *Env, input []byte) (any, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	if s.Site == nil {
		return nil, noSite
	}
	if s.Plan == nil {
		return nil, scenario.Errors{{Field: "plan", Message: "the scenario has no plan block: add the move to plan (see plan-site-bay-columns)"}}
	}
	res, err := planned(s, true)
	if err != nil {
		return nil, err
	}
	return clearance.PlanSite(s, res, clearance.Options{})
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

func siteScenario(input []byte) (*scenario.Scenario, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	if s.Site == nil {
		return nil, noSite
	}
	return s, nil
}

// keptClearance is the clearance check of s when the bridge keeps it
// (nil otherwise): the check sheet prints it and never runs the check.
func keptClearance(s *scenario.Scenario) *clearance.Report {
	fp, err := key(s)
	if err != nil {
		return nil
	}
	kept.Lock()
	defer kept.Unlock()
	if kept.fp == fp {
		return kept.rep
	}
	return nil
}
