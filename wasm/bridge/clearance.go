package bridge

import (
	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
)

// The clearance check is registered here, beside its code, so that the
// table in bridge.go stays as it is.
func init() { Calls["clearance"] = checkClearance }

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
