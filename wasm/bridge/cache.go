package bridge

import (
	"sync"

	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// memo keeps the last evaluations (keptResults of them) and the last plan, each with the
// fingerprint of the scenario it is of (key: any changed input but the
// check sheet's reference fields changes it). The page evaluates, then asks for the figures and the
// sheet of the same inputs: those calls find the result here and never
// compute it again. Several results: a planning request without moves of
// its own has its own result and the sheet's, of the recommended move,
// and the verdict is over every rope length the scenario names (the
// nominal and the plan's range ends: three evaluations of each).
type memo struct {
	mu      sync.Mutex
	results []keptResult // most recent first, at most keptResults
	planFP  string
	plan    *plan.Result
	// computed counts evaluations and plans run (for tests).
	computed int
}

var last memo

// keptResults is how many evaluations the memo keeps: the scenario's own
// and its recommended move's, each at three rope lengths, and two more.
const keptResults = 8

// evaluated is the evaluation of s, from the memo when it holds s's;
// validated says s came from scenario.Parse unchanged (not validated
// again). The result is shared: callers read it and never change it.
func evaluated(s *scenario.Scenario, validated bool) (*sway.Result, error) {
	r, _, err := evaluatedKeyed(s, validated)
	return r, err
}

// evaluatedKeyed is evaluated, with the memo's key of the result.
func evaluatedKeyed(s *scenario.Scenario, validated bool) (*sway.Result, string, error) {
	fp, err := key(s)
	if err != nil {
		return nil, "", err
	}
	last.mu.Lock()
	for i, k := range last.results {
		if k.fp == fp {
			copy(last.results[1:i+1], last.results[:i])
			last.results[0] = k
			last.mu.Unlock()
			return k.result, fp, nil
		}
	}
	last.mu.Unlock()
	r, err := sway.EvaluateWith(s, sway.Options{Validated: validated})
	if err != nil {
		return nil, "", err
	}
	last.mu.Lock()
	last.results = append([]keptResult{{fp: fp, result: r}}, last.results...)
	if len(last.results) > keptResults {
		last.results = last.results[:keptResults]
	}
	last.computed++
	last.mu.Unlock()
	return r, fp, nil
}

type keptResult struct {
	fp     string
	result *sway.Result
}

// planned is the plan of s, from the memo when it holds s's; validated
// says s came from scenario.Parse unchanged (not validated again), as
// for evaluated.
func planned(s *scenario.Scenario, validated bool) (*plan.Result, error) {
	fp, err := key(s)
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
	mk := plan.Make
	if validated {
		mk = plan.MakeValidated
	}
	r, err := mk(s)
	if err != nil {
		return nil, err
	}
	last.mu.Lock()
	last.planFP, last.plan = fp, r
	last.computed++
	last.mu.Unlock()
	return r, nil
}

// key is the fingerprint of what a result depends on: the scenario without
// its check sheet references (typing "checked by" computes nothing again).
func key(s *scenario.Scenario) (string, error) {
	c := *s
	c.Sheet = nil
	return scenario.Fingerprint(&c)
}

// keptPlan is the plan of s when the memo holds it, else nil: for calls
// that use a plan already made and never start one.
func keptPlan(s *scenario.Scenario) (*plan.Result, error) {
	fp, err := key(s)
	if err != nil {
		return nil, err
	}
	last.mu.Lock()
	defer last.mu.Unlock()
	if last.planFP == fp {
		return last.plan, nil
	}
	return nil, nil
}

// keptResultOf is the evaluation of s when the memo holds it, else nil:
// for drawings that never start one.
func keptResultOf(s *scenario.Scenario) *sway.Result {
	fp, err := key(s)
	if err != nil {
		return nil
	}
	return keptByKey(fp)
}

// keptByKey is the kept evaluation of memo key fp, else nil.
func keptByKey(fp string) (r *sway.Result) {
	last.mu.Lock()
	for _, k := range last.results {
		if k.fp == fp {
			r = k.result
			break
		}
	}
	last.mu.Unlock()
	return r
}
