//go:build !nofetch

package bridge

import (
	"encoding/json"
	"reflect"
	"strconv"
	"strings"
	"testing"
)

func TestDrawsCall(t *testing.T) {
	in := []byte(`{"scenario": ` + string(readExample(t, DemoFile)) + `, "draws": {"runs": 6, "seed": 2, "spread": {"rope_length_m": 0.2, "press_s": 0.1}}}`)
	var r struct {
		Result *struct {
			Runs    int `json:"runs"`
			Summary struct {
				PeakSwingDeg struct{ P50, P95 float64 } `json:"peak_swing_deg"`
			} `json:"summary"`
			Figures struct {
				PeakSwingDeg []float64 `json:"peak_swing_deg"`
			} `json:"figures"`
		} `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "draws", in), &r); err != nil || r.Result == nil {
		t.Fatalf("draws: %v %s", err, Call(nil, "draws", in))
	}
	if r.Result.Runs != 6 || len(r.Result.Figures.PeakSwingDeg) != 6 || !(r.Result.Summary.PeakSwingDeg.P95 > 0) {
		t.Fatalf("got %+v", r.Result)
	}
	var e errReply
	bad := []byte(`{"scenario": ` + string(readExample(t, DemoFile)) + `, "draws": {"runs": 0}}`)
	if err := json.Unmarshal(Call(nil, "draws", bad), &e); err != nil || e.Error == nil || e.Error.Fields[0].Field != "draws.runs" {
		t.Fatalf("runs 0: %+v", e.Error)
	}
	// A spread out of range, the page in US units: the message names the
	// field and its range in feet, with no SI unit (50 m = 164.04 ft, ft =
	// 0.3048 m, NIST SP 811; said rounded down to the 0.05 ft step).
	bad = []byte(`{"scenario": ` + string(readExample(t, DemoFile)) + `, "draws": {"runs": 5, "spread": {"rope_length_m": 60.96}}, "system": "us"}`)
	e = errReply{}
	if err := json.Unmarshal(Call(nil, "draws", bad), &e); err != nil || e.Error == nil || len(e.Error.Fields) != 1 ||
		e.Error.Fields[0].Field != "draws.spread.rope_length_m" || e.Error.Fields[0].Message != "is 200.00 ft: accepted from 0.00 ft up to 164.00 ft" {
		t.Fatalf("rope spread 200 ft: %+v", e.Error)
	}
}

// Two parts of a request joined by draws_join (given out of order) answer
// as the whole request in one draws call, and the spread is presented from
// the figures table in the units asked for.
func TestDrawsJoin(t *testing.T) {
	sc := string(readExample(t, DemoFile))
	req := `{"runs": 30, "seed": 3, "spread": {"rope_length_m": 0.3, "press_s": 0.2}`
	part := func(first, count int) string {
		var r struct{ Result json.RawMessage }
		out := Call(nil, "draws", []byte(`{"scenario": `+sc+`, "draws": `+req+`, "first": `+strconv.Itoa(first)+`, "count": `+strconv.Itoa(count)+`}}`))
		if err := json.Unmarshal(out, &r); err != nil || r.Result == nil {
			t.Fatalf("draws part: %s", out)
		}
		return string(r.Result)
	}
	var whole, joined struct {
		Result *JoinedDraws `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "draws", []byte(`{"scenario": `+sc+`, "draws": `+req+`}}`)), &whole); err != nil || whole.Result == nil {
		t.Fatal("whole request failed")
	}
	out := Call(nil, "draws_join", []byte(`{"scenario": `+sc+`, "draws": `+req+`}, "parts": [`+part(12, 18)+`, `+part(0, 12)+`], "system": "us"}`))
	if err := json.Unmarshal(out, &joined); err != nil || joined.Result == nil {
		t.Fatalf("draws_join: %s", out)
	}
	j := joined.Result
	if j.Runs != 30 || !reflect.DeepEqual(j.Summary, whole.Result.Summary) || !reflect.DeepEqual(j.Figures, whole.Result.Figures) {
		t.Fatalf("joined %+v, whole %+v", j.Summary, whole.Result.Summary)
	}
	if len(j.Shown.Rows) != 4 || j.Shown.Rows[1].Unit != "ft" || !strings.HasPrefix(j.Shown.Rows[0].Words, "In 95 of 100 likely runs: largest swing ") ||
		!strings.Contains(j.Shown.Spreads, "rope length 1.00 ft") || !strings.Contains(j.Shown.Spreads, "Seed 3") {
		t.Fatalf("shown: %+v", j.Shown)
	}
	var e errReply
	if err := json.Unmarshal(Call(nil, "draws_join", []byte(`{"scenario": `+sc+`, "draws": `+req+`}, "parts": []}`)), &e); err != nil || e.Error == nil || e.Error.Fields[0].Field != "parts" {
		t.Fatalf("no parts: %+v", e.Error)
	}
}
