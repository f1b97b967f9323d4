package bridge

import (
	"encoding/json"

	"swaysheet/core/sway"
)

// marshalReply is json.Marshal(r) but for an evaluation's time histories,
// written by sway.History.AppendJSON with the significant digits the run
// resolves (sway.HistoryDigits: 9 at the default accuracy) instead of
// through encoding/json's reflection and shortest decimals: most of an
// evaluate reply (6,611 numbers for bay-travel), which took longer to
// write than the run to compute. The page draws the histories and never
// computes with them; every other number is as encoding/json writes it.
// The histories come last in the result's object.
func marshalReply(r reply) ([]byte, error) {
	ev, ok := r.Result.(*evaluation)
	if !ok || ev.Result == nil || ev.History.TimeS == nil {
		return json.Marshal(r)
	}
	res := ev.Result
	b, err := json.Marshal(&historyLast{evaluation: ev})
	if err != nil {
		return nil, err
	}
	out := append(make([]byte, 0, len(b)+len(res.History.TimeS)*11*12), `{"result":`...)
	out = append(append(out, b[:len(b)-1]...), `,"history":`...)
	if out, err = res.History.AppendJSON(out, sway.HistoryDigits(res.Solver.RelTol)); err != nil {
		return nil, err
	}
	return append(out, '}', '}'), nil
}

// historyLast is an evaluation whose History encoding/json leaves out
// (the field of the same name here, nil, hides it).
type historyLast struct {
	*evaluation
	History *struct{} `json:"history,omitempty"`
}
