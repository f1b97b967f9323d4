package bridge

import (
	"errors"
	"fmt"
	"sync"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
)

// The parts of the page's split clearance check (clearance_part, run on
// the pool's workers) come to the engine's worker once each: as they
// arrive ("clearance_hold") or with a join ("clearance_join"), each part
// with its data, decoded once and held here; a join then names the parts
// held by their runs alone ({"from", "to"} without "data"). What is held
// is the latest check's only (its scenario's fingerprint, key: another
// scenario, seed or run count starts afresh), at most its runs (a part
// takes the place of held parts it overlaps), and nothing once a join
// has every run (that report is kept, see kept). A part named but not
// held (the engine was restarted, or another check came since) is an
// error at its "data" that says so, with "resend": the page sends the
// join again with every part's data.
var held struct {
	sync.Mutex
	fp string
	j  *clearance.Joiner
}

// heldMissing is the error of a join naming a part not held.
type heldMissing struct{ scenario.Errors }

func (e heldMissing) Unwrap() error { return e.Errors }

// holdParts reads a clearance_hold or clearance_join request and holds
// the parts it carries data for, under the lock of held (the caller
// unlocks it). Its result: the scenario and the joiner of its check.
func holdParts(name string, input []byte) (*scenario.Scenario, *clearance.Joiner, []clearance.Part, error) {
	sc, parts, err := readJoinInput(input)
	if err != nil {
		return nil, nil, nil, scenario.Errors{{Field: "(input)", Message: "not a " + name + " request: " + err.Error()}}
	}
	s, err := siteScenario(sc)
	if err != nil {
		return nil, nil, nil, err
	}
	fp, err := key(s)
	if err != nil {
		return nil, nil, nil, err
	}
	if held.fp != fp || held.j == nil {
		held.fp, held.j = "", nil
		j, err := clearance.NewJoiner(s, clearance.Options{})
		if err != nil {
			return nil, nil, nil, err
		}
		held.fp, held.j = fp, j
	}
	for i, p := range parts {
		if p.Data == nil {
			continue
		}
		if err := held.j.Add(p); err != nil {
			return nil, nil, nil, scenario.Errors{{Field: fmt.Sprintf("parts[%d]", i), Message: err.Error()}}
		}
	}
	return s, held.j, parts, nil
}

// HeldRuns is the result of "clearance_hold": how many runs of the check
// the engine holds.
type HeldRuns struct {
	Runs int `json:"runs"`
}

// clearanceHold holds the parts sent (the input of clearance_join) and
// joins nothing.
func clearanceHold(_ *Env, input []byte) (any, error) {
	held.Lock()
	defer held.Unlock()
	_, j, _, err := holdParts("clearance_hold", input)
	if err != nil {
		return nil, err
	}
	return HeldRuns{Runs: j.HeldRuns()}, nil
}

// clearanceJoin joins parts into the report over their runs: with every
// run of the check, the report of the "clearance" call, exactly, and kept
// (for the check sheet and clearance_figures). Its input is the scenario
// and the parts received so far, {"scenario": {...}, "parts": [...]}
// (read by readJoinInput), each {"from", "to", "data"} or, held, without
// "data".
func clearanceJoin(_ *Env, input []byte) (any, error) {
	held.Lock()
	defer held.Unlock()
	s, j, parts, err := holdParts("clearance_join", input)
	if err != nil {
		return nil, err
	}
	ranges := make([]clearance.Range, len(parts))
	for i, p := range parts {
		ranges[i] = clearance.Range{From: p.From, To: p.To}
	}
	rep, err := j.Report(ranges)
	var nh *clearance.NotHeldError
	if errors.As(err, &nh) {
		return nil, heldMissing{scenario.Errors{{Field: fmt.Sprintf("parts[%d].data", nh.Index),
			Message: fmt.Sprintf("the engine does not hold runs %d to %d of this check (it was restarted, or another check came since): send the part's data again", nh.Range.From, nh.Range.To)}}}
	}
	if err != nil {
		return nil, err
	}
	if rep.Runs == j.Runs() {
		held.fp, held.j = "", nil
		if fp, err := key(s); err == nil {
			kept.Lock()
			kept.fp, kept.rep = fp, rep
			kept.Unlock()
		}
	}
	return rep, nil
}
