package bridge

import (
	"encoding/json"
	"os"
	"strings"
	"testing"

	"swaysheet/core/figures"
	"swaysheet/core/scenario"
)

// The figures call presents from the table, in the units asked for, and
// uses the evaluation the evaluate call made of the same scenario.
func TestFiguresCallUsesTheLastResult(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/bay-travel.json")
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

// After the page's plan call, the sheet of the same scenario plans
// nothing again, and a second sheet computes nothing at all.
func TestSheetUsesTheLastPlan(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/plan-tower-slew.json")
	if err != nil {
		t.Fatal(err)
	}
	var e struct{ Error *Error }
	json.Unmarshal(Call(nil, "plan", data), &e)
	if e.Error != nil {
		t.Fatal(e.Error.Message)
	}
	in, _ := json.Marshal(map[string]any{"scenario": json.RawMessage(data)})
	before := last.computed
	json.Unmarshal(Call(nil, "sheet", in), &e)
	if e.Error != nil {
		t.Fatal(e.Error.Message)
	}
	// The recommended move's evaluations at the nominal rope length and
	// the plan's range ends, nothing else.
	if n := last.computed - before; n != 3 {
		t.Errorf("the sheet computed %d times after the plan call, want 3 (the recommended move at three rope lengths)", n)
	}
	before = last.computed
	Call(nil, "sheet", in)
	if last.computed != before {
		t.Error("a second sheet of the same inputs computed again")
	}
}

// The plot call draws with the sheet's plotter; text and dash patterns
// from the page never become markup.
func TestPlotCall(t *testing.T) {
	in := `{"title": "<b>rope</b>", "x_label": "time, s", "y_label": "deg",
		"series": [{"x": [0, 1, 2], "y": [0, 1, 0], "name": "angle", "dash": "4\" onload=\"x"}],
		"lines": [{"y": 0.5, "text": "limit"}]}`
	var r struct {
		Result struct{ SVG string } `json:"result"`
		Error  *Error               `json:"error"`
	}
	if err := json.Unmarshal(Call(nil, "plot", []byte(in)), &r); err != nil || r.Error != nil {
		t.Fatalf("plot: %v %+v", err, r.Error)
	}
	if !strings.HasPrefix(r.Result.SVG, "<svg") || strings.Contains(r.Result.SVG, "<b>") || strings.Contains(r.Result.SVG, "onload") {
		t.Errorf("svg %q", r.Result.SVG)
	}
	// The page's charts: at the width shown, with bands, a circle, equal axes.
	in = `{"id": "rel", "title": "t", "width_px": 340, "title_above": true, "equal": true, "legend_top": true,
		"series": [{"x": [0, 1], "y": [0, 1], "name": "a", "class": "s2"}, {"x": [0, 1], "y": [1, 0], "name": "b"}],
		"bands": [{"x0": 0, "x1": 0.5, "text": "A1"}], "circles": [{"r": 0.5}]}`
	if err := json.Unmarshal(Call(nil, "plot", []byte(in)), &r); err != nil || r.Error != nil {
		t.Fatalf("plot: %v %+v", err, r.Error)
	}
	for _, want := range []string{`viewBox="0 0 340 `, `class="chart"`, `url(#rel-hatch)`, `<ellipse`, `class="line s2"`, `class="legend"`} {
		if !strings.Contains(r.Result.SVG, want) {
			t.Errorf("no %s in %s", want, r.Result.SVG)
		}
	}
	var e struct{ Error *Error }
	json.Unmarshal(Call(nil, "plot", []byte(`{"series": 3}`)), &e)
	if e.Error == nil {
		t.Error("bad plot input: no error")
	}
}

// The plot call draws a kept evaluation's histories by the evaluate
// reply's key the same, byte for byte, as from the numbers the page reads
// from that reply; an unknown key or series name is an error on
// history_key (the page's worker then sends the numbers).
func TestPlotCallByKey(t *testing.T) {
	var ev struct {
		Result struct {
			History map[string]json.RawMessage `json:"history"`
			Key     string                     `json:"key"`
		} `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "evaluate", readExample(t, DemoFile)), &ev); err != nil || len(ev.Result.Key) != 64 {
		t.Fatalf("evaluate: %v, key %q", err, ev.Result.Key)
	}
	h, key := ev.Result.History, ev.Result.Key
	chart := `{"id": "angle", "title": "rope angle", "x_label": "time, s", "y_label": "deg", "width_px": 420, "bands": [{"x0": 0, "x1": 2, "text": "A1"}], `
	byNumbers := chart + `"series": [{"x": ` + string(h["time_s"]) + `, "y": ` + string(h["swing_deg"]) + `, "name": "swing"},` +
		`{"x": ` + string(h["time_s"]) + `, "y": ` + string(h["rel_x_m"]) + `, "name": "x"}]}`
	byKey := chart + `"series": [{"name": "swing"}, {"name": "x"}], "history_key": "` + key + `",
		"series_of": [["time_s", "swing_deg"], ["time_s", "rel_x_m"]]}`
	var a, b struct {
		Result struct{ SVG string } `json:"result"`
		Error  *Error               `json:"error"`
	}
	if err := json.Unmarshal(Call(nil, "plot", []byte(byNumbers)), &a); err != nil || a.Error != nil {
		t.Fatalf("plot by numbers: %v %+v", err, a.Error)
	}
	if err := json.Unmarshal(Call(nil, "plot", []byte(byKey)), &b); err != nil || b.Error != nil {
		t.Fatalf("plot by key: %v %+v", err, b.Error)
	}
	if a.Result.SVG != b.Result.SVG || !strings.Contains(a.Result.SVG, "<path") {
		t.Errorf("by key:\n%.400s\nby numbers:\n%.400s", b.Result.SVG, a.Result.SVG)
	}
	for _, in := range []string{
		`{"series": [{}], "history_key": "0123", "series_of": [["time_s", "swing_deg"]]}`,
		`{"series": [{}], "history_key": "` + key + `", "series_of": [["time_s", "swing"]]}`,
		`{"series": [{}, {}], "history_key": "` + key + `", "series_of": [["time_s", "swing_deg"]]}`,
		`{"series": [{}], "history_key": "` + key + `", "series_of": [["time_s", "swing_deg"], ["time_s", "rope_m"]]}`,
	} {
		var e struct{ Error *Error }
		json.Unmarshal(Call(nil, "plot", []byte(in)), &e)
		if e.Error == nil || len(e.Error.Fields) != 1 || e.Error.Fields[0].Field != "history_key" {
			t.Errorf("%s: %+v, want an error on history_key", in, e.Error)
		}
	}
}

// A changed reference field of the sheet computes nothing again; a
// changed input does.
func TestMemoKey(t *testing.T) {
	data, _ := os.ReadFile("../../testdata/scenarios/hard-stop.json")
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := evaluated(s, true); err != nil {
		t.Fatal(err)
	}
	before := last.computed
	s.Sheet = &scenario.Sheet{CheckedBy: "A. Checker"}
	evaluated(s, true)
	if last.computed != before {
		t.Error("a reference field computed the result again")
	}
	m := *s.Load.MassKg * 2
	s.Load.MassKg = &m
	evaluated(s, true)
	if last.computed != before+1 {
		t.Error("a changed mass did not compute again")
	}
}

// A planned request without moves is presented for the recommended move:
// the figures call says which scenario (result_fingerprint, and the
// scenario itself for the page's plots), the sheet prints the same one,
// and evaluating that scenario computes nothing again.
func TestFiguresSheetAndPlotsAgree(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/plan-bay-travel.json")
	if err != nil {
		t.Fatal(err)
	}
	var e struct{ Error *Error }
	json.Unmarshal(Call(nil, "evaluate", data), &e)
	json.Unmarshal(Call(nil, "plan", data), &e)
	if e.Error != nil {
		t.Fatal(e.Error.Message)
	}
	in, _ := json.Marshal(map[string]any{"scenario": json.RawMessage(data), "system": "us"})
	var f struct {
		Result FiguresReply `json:"result"`
		Error  *Error       `json:"error"`
	}
	if json.Unmarshal(Call(nil, "figures", in), &f); f.Error != nil || f.Result.ResultFor == "" || len(f.Result.ResultScenario) == 0 {
		t.Fatalf("figures: %+v result_for %q", f.Error, f.Result.ResultFor)
	}
	var sh struct {
		Result SheetReply `json:"result"`
		Error  *Error     `json:"error"`
	}
	if json.Unmarshal(Call(nil, "sheet", in), &sh); sh.Error != nil {
		t.Fatal(sh.Error.Message)
	}
	if sh.Result.ResultFingerprint != f.Result.ResultFingerprint || sh.Result.Fingerprint == f.Result.ResultFingerprint {
		t.Errorf("sheet of %s (scenario %s), figures of %s", sh.Result.ResultFingerprint, sh.Result.Fingerprint, f.Result.ResultFingerprint)
	}
	s, err := scenario.Parse(f.Result.ResultScenario)
	if err != nil {
		t.Fatal(err)
	}
	if fp, _ := scenario.Fingerprint(s); fp != f.Result.ResultFingerprint || len(s.Motions) != 1 {
		t.Errorf("result_scenario: fingerprint %s, %d motions", fp, len(s.Motions))
	}
	before := last.computed
	var ev struct {
		Result struct {
			PeakSwingDeg float64 `json:"peak_swing_deg"`
		} `json:"result"`
		Error *Error `json:"error"`
	}
	if json.Unmarshal(Call(nil, "evaluate", f.Result.ResultScenario), &ev); ev.Error != nil || last.computed != before {
		t.Errorf("evaluating the presented scenario: %+v, %d computations", ev.Error, last.computed-before)
	}
	for _, row := range f.Result.Rows {
		if row.Key == "peak_swing_deg" && row.ValueSI != ev.Result.PeakSwingDeg {
			t.Errorf("figures give %g deg, the evaluation %g deg", row.ValueSI, ev.Result.PeakSwingDeg)
		}
	}
	// The scenario's own moves: presented as they are.
	own, _ := os.ReadFile("../../testdata/scenarios/bay-travel.json")
	in, _ = json.Marshal(map[string]any{"scenario": json.RawMessage(own)})
	f.Result = FiguresReply{}
	json.Unmarshal(Call(nil, "figures", in), &f)
	if fp, _ := scenario.Fingerprint(mustParse(t, own)); f.Result.ResultFingerprint != fp || f.Result.ResultScenario != nil {
		t.Errorf("own moves: %s, want %s", f.Result.ResultFingerprint, fp)
	}
}

func mustParse(t *testing.T, data []byte) *scenario.Scenario {
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	return s
}
