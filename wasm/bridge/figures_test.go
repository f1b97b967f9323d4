package bridge

import (
	"encoding/json"
	"os"
	"testing"

	"swaysheet/core/figures"
)

// The figures call presents from the table, in the units asked for, and
// uses the evaluation the evaluate call made of the same scenario.
func TestFiguresCallUsesTheLastResult(t *testing.T) {
	data, err := os.ReadFile("examples/bay-travel.json")
	if err != nil {
		t.Fatal(err)
	}
	var e struct{ Error *Error }
	json.Unmarshal(Call(nil, "evaluate", data), &e)
	if e.Error != nil {
		t.Fatal(e.Error.Message)
	}
	before := last.computed
	in, _ := json.Marshal(map[string]any{"scenario": json.RawMessage(data), "system": "us"})
	var r struct {
		Result figures.Report `json:"result"`
		Error  *Error         `json:"error"`
	}
	if err := json.Unmarshal(Call(nil, "figures", in), &r); err != nil || r.Error != nil {
		t.Fatalf("figures: %v %+v", err, r.Error)
	}
	if last.computed != before {
		t.Error("the figures call evaluated again")
	}
	if r.Result.Verdict.State != figures.Outside || len(r.Result.Rows) == 0 {
		t.Fatalf("report %+v", r.Result.Verdict)
	}
	for _, row := range r.Result.Rows {
		if row.Key == "peak_excursion_m" && (row.Unit != "ft" || row.Check == nil || row.LimitKey != "limits.peak_excursion_m") {
			t.Errorf("excursion row %+v", row)
		}
	}
	for _, bad := range []string{"", "{", `{"scenario": 3}`, `{"scenario": {"format": "x"}}`} {
		var e struct{ Error *Error }
		json.Unmarshal(Call(nil, "figures", []byte(bad)), &e)
		if e.Error == nil {
			t.Errorf("figures(%q): no error", bad)
		}
	}
}
