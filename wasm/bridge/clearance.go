package bridge

import (
	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
)

// The clearance check is registered here, beside its code, so that the
// table in bridge.go stays as it is.
func init() {
	Calls["clearance"] = checkClearance
	Calls["site_plan"] = planSite
}

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
		return nil, scenario.Errors{{Field: "site", Message: "the scenario has no site block: add the obstacles, the suspension height and the load's size to check clearances"}}
	}
	return clearance.Check(s, clearance.Options{})
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
		return nil, scenario.Errors{{Field: "site", Message: "the scenario has no site block: add the obstacles, the suspension height and the load's size to check clearances"}}
	}
	if s.Plan == nil {
		return nil, scenario.Errors{{Field: "plan", Message: "the scenario has no plan block: add the move to plan (see plan-site-bay-columns)"}}
	}
	res, err := planned(s)
	if err != nil {
		return nil, err
	}
	return clearance.PlanSite(s, res, clearance.Options{})
}
