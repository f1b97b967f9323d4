package bridge

import (
	"bytes"
	"encoding/json"
	"math"
	"path/filepath"
	"reflect"
	"testing"

	"swaysheet/core/sway"
)

// TestEvaluateReply: an evaluate reply reads back as the result, every
// field but the histories exactly (encoding/json's shortest decimals), the
// histories as sway.History.AppendJSON writes them at the run's digits
// (core/sway TestHistoryJSON holds those to the numbers), on every
// example, with the memo's key; a history holding NaN is refused with
// encoding/json's error.
func TestEvaluateReply(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	for _, f := range files {
		r, err := sway.Evaluate(mustParse(t, readExample(t, filepath.Base(f))))
		if err != nil {
			t.Fatal(f, err)
		}
		got, err := marshalReply(reply{Result: &evaluation{r, "0a1b"}})
		if err != nil {
			t.Fatal(f, err)
		}
		var back struct{ Result sway.Result }
		var key struct{ Result struct{ Key string } }
		if err := json.Unmarshal(got, &back); err != nil || json.Unmarshal(got, &key) != nil || key.Result.Key != "0a1b" {
			t.Fatalf("%s: %v, key %q", filepath.Base(f), err, key.Result.Key)
		}
		hist, _ := r.History.AppendJSON(nil, sway.HistoryDigits(r.Solver.RelTol))
		var want sway.History
		if err := json.Unmarshal(hist, &want); err != nil {
			t.Fatal(err)
		}
		if !reflect.DeepEqual(back.Result.History, want) {
			t.Errorf("%s: the reply's histories are not AppendJSON's", filepath.Base(f))
		}
		rest := *r
		rest.History, back.Result.History = sway.History{}, sway.History{}
		a, _ := json.Marshal(rest)
		b, _ := json.Marshal(back.Result)
		if !bytes.Equal(a, b) {
			t.Errorf("%s: the reply's figures differ from the result's", filepath.Base(f))
		}
	}
	r := &sway.Result{History: sway.History{TimeS: []float64{0, 1}, SwingDeg: []float64{math.NaN()}}, Solver: sway.Stats{RelTol: 1e-7}}
	_, want := json.Marshal(reply{Result: r})
	if _, err := marshalReply(reply{Result: &evaluation{r, ""}}); err == nil || want == nil || err.Error() != want.Error() {
		t.Errorf("NaN in a history: got %v, encoding/json %v", err, want)
	}
}
