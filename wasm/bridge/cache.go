package bridge

import (
	"sync"

	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// memo keeps the last evaluation and the last plan, each with the
// fingerprint of the scenario it is of (scenario.Fingerprint: any changed
// input changes it). The page evaluates, then asks for the figures and the
// sheet of the same inputs: those calls find the result here and never
// compute it again. One of each is kept: the page has one scenario.
type memo struct {
	mu       sync.Mutex
	resultFP string
	result   *sway.Result
	planFP   string
	plan     *plan.Result
	// computed counts evaluations and plans run (for tests).
	computed int
}

var last memo

// evaluated is the evaluation of s, from the memo when it holds s's.
// The result is shared: callers read it and never change it.
func evaluated(s *scenario.Scenario) (*sway.Result, error) {
	fp, err := scenario.Fingerprint(s)
	if err != nil {
		return nil, err
	}
	last.mu.Lock()
	if last.resultFP == fp {
		r := last.result
		last.mu.Unlock()
		return r, nil
	}
	last.mu.Unlock()
	r, err := sway.Evaluate(s)
	if err != nil {
		return nil, err
	}
	last.mu.Lock()
	last.resultFP, last.result = fp, r
	last.computed++
	last.mu.Unlock()
	return r, nil
}

// planned is the plan of s, from the memo when it holds s's.
func planned(s *scenario.Scenario) (*plan.Result, error) {
	fp, err := scenario.Fingerprint(s)
	if err != nil {
		return nil, err
	}
	last.mu.Lock()
	if last.planFP == fp {
		r := last.plan
		last.mu.Unlock()
		return r, nil
	}
	last.mu.Unlock()
	r, err := plan.Make(s)
	if err != nil {
		return nil, err
	}
	last.mu.Lock()
	last.planFP, last.plan = fp, r
	last.computed++
	last.mu.Unlock()
	return r, nil
}
