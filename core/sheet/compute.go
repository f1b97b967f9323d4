package sheet

import (
	"swaysheet/core/clearance"
	"swaysheet/core/figures"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// Computer is how a caller evaluates and plans: the command line passes
// sway.Evaluate and plan.Make, the bridge its memo of the last result and
// plan. The sheet never computes itself.
type Computer struct {
	Evaluate func(*scenario.Scenario) (*sway.Result, error)
	Plan     func(*scenario.Scenario) (*plan.Result, error)
	// Clearance gives the clearance check of a scenario with a site
	// block (nil: the sheet says it was not run).
	Clearance func(*scenario.Scenario) (*clearance.Report, error)
}

// Compute gathers what the sheet of s shows with c's functions: the plan
// (for a plan block), and the evaluation of s, or, for a planning request
// without moves of its own, of the recommended move. Errors go into the
// Input, to be printed on the sheet. The caller fills in the units,
// version, link and time.
func (c Computer) Compute(s *scenario.Scenario) Input {
	in := Input{Scenario: s, Evaluated: s}
	if s.Site != nil && c.Clearance != nil {
		rep, err := c.Clearance(s)
		if err != nil {
			in.ClearanceErr = err.Error()
		}
		in.Clearance = rep
	}
	if s.Plan != nil {
		p, err := c.Plan(s)
		if err != nil {
			in.PlanErr = err.Error()
		}
		in.Plan = p
		if p != nil && len(s.Motions) == 0 && p.Recommended >= 0 && p.Recommended < len(p.Options) {
			o := p.Options[p.Recommended]
			ev := *s
			ev.Motions = []scenario.Motion{o.Motion}
			in.Evaluated = &ev
			in.ResultFor = "the planner's recommended drive setting"
		}
	}
	// The nominal rope length first, then the plan's range ends: the
	// verdict is the worst over them.
	evals, err := figures.EvaluateRopes(in.Evaluated, c.Evaluate)
	if err != nil {
		in.ResultErr = err.Error()
		return in
	}
	in.Result, in.Ropes = evals[0].Result, evals
	return in
}
