package bridge

import (
	"encoding/json"
	"fmt"
	"os"
	"strings"
	"testing"

	"swaysheet/core/clearance"
	"swaysheet/core/figures"
)

func TestClearanceCall(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/site-tower-hoarding.json")
	if err != nil {
		t.Fatal(err)
	}
	out, err := Calls["clearance"](nil, data)
	if err != nil {
		t.Fatal(err)
	}
	rep := out.(*clearance.Report)
	if !rep.Clears || rep.Runs != 200 || len(rep.Envelope95.Spans) == 0 {
		t.Errorf("report: clears %v, runs %d, %d spans", rep.Clears, rep.Runs, len(rep.Envelope95.Spans))
	}
	if _, err := json.Marshal(rep); err != nil {
		t.Fatal(err)
	}
	bay, _ := os.ReadFile("../../testdata/scenarios/bay-travel.json")
	if _, err := Calls["clearance"](nil, bay); err == nil || !strings.Contains(err.Error(), "site:") {
		t.Errorf("no site block: %v", err)
	}
}

func TestSitePlanCall(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/plan-site-bay-columns.json")
	if err != nil {
		t.Fatal(err)
	}
	out, err := Calls["site_plan"](nil, data)
	if err != nil {
		t.Fatal(err)
	}
	sp := out.(*clearance.SitePlan)
	if sp.Fastest < 0 || sp.RunsPerCheck != 60 || sp.TopSpeed == nil || !sp.TopSpeed.Clears {
		t.Errorf("site plan: fastest %d, %d runs, top speed %+v", sp.Fastest, sp.RunsPerCheck, sp.TopSpeed)
	}
	if _, err := json.Marshal(sp); err != nil {
		t.Fatal(err)
	}
	site, _ := os.ReadFile("../../testdata/scenarios/site-bay-columns.json")
	if _, err := Calls["site_plan"](nil, site); err == nil || !strings.Contains(err.Error(), "plan") {
		t.Errorf("no plan block: %v", err)
	}
}

func TestClearanceFiguresCall(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/site-bay-columns.json")
	if err != nil {
		t.Fatal(err)
	}
	if _, err := Calls["clearance"](nil, data); err != nil {
		t.Fatal(err)
	}
	in := []byte(`{"scenario": ` + string(data) + `, "units": {"length": "ft"}, "system": "si"}`)
	out, err := Calls["clearance_figures"](nil, in)
	if err != nil {
		t.Fatal(err)
	}
	rep := out.(figures.ClearanceReport)
	if len(rep.Obstacles) != 4 || rep.Obstacles[0].Name != "column C2" || rep.Obstacles[0].RopePart != "hoist rope" {
		t.Errorf("report %+v", rep)
	}
	// Lengths in the units asked for, the rope's among them.
	for _, r := range rep.Obstacles[0].Rows {
		if r.UnitSI == "m" && r.Unit != "ft" {
			t.Errorf("%s in %q", r.Key, r.Unit)
		}
	}
	if r := rep.Obstacles[0].Rows; len(r) == 0 || r[0].Key != "share_keep_margin" {
		t.Errorf("first row %+v", r)
	}
	if _, err := json.Marshal(rep); err != nil {
		t.Fatal(err)
	}
	// The report the page shows, given: presented as it is, nothing
	// checked (a one-run report of another seed is not the kept one).
	sc := strings.Replace(string(data), `"runs": 200`, `"runs": 3`, 1)
	small, err := clearance.Check(mustParse(t, []byte(sc)), clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	given, _ := json.Marshal(small)
	out, err = Calls["clearance_figures"](nil, []byte(`{"scenario": `+string(data)+`, "units": {}, "system": "si", "report": `+string(given)+`}`))
	if err != nil {
		t.Fatal(err)
	}
	got := out.(figures.ClearanceReport)
	if len(got.WorstFirst) != 4 || !strings.Contains(got.Rows[0].Key, "margin") {
		t.Fatalf("given report: %+v", got)
	}
	for _, r := range got.Rows {
		if r.Key == "envelope_95.area_m2" && r.ValueSI != small.Envelope95.AreaM2 {
			t.Errorf("area %g, the given report's %g", r.ValueSI, small.Envelope95.AreaM2)
		}
	}
}

// The page splits the runs over workers: "clearance_part" for each range
// and "clearance_join" of them answer as the "clearance" call does, and
// the joined report of every run is what the sheet prints (no check run).
func TestClearancePartsAndSheet(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/site-bay-columns.json")
	if err != nil {
		t.Fatal(err)
	}
	sc := strings.Replace(string(data), `"runs": 200`, `"runs": 24`, 1)
	one, err := Calls["clearance"](nil, []byte(sc))
	if err != nil {
		t.Fatal(err)
	}
	kept.rep = nil
	var parts []string
	for _, r := range [][2]int{{10, 24}, {0, 10}} {
		out, err := Calls["clearance_part"](nil, []byte(fmt.Sprintf(`{"scenario":%s,"from":%d,"to":%d}`, sc, r[0], r[1])))
		if err != nil {
			t.Fatal(err)
		}
		b, _ := json.Marshal(out)
		parts = append(parts, string(b))
	}
	joined, err := Calls["clearance_join"](nil, []byte(`{"scenario":`+sc+`,"parts":[`+strings.Join(parts, ",")+`]}`))
	if err != nil {
		t.Fatal(err)
	}
	a, _ := json.Marshal(one)
	b, _ := json.Marshal(joined)
	if string(a) != string(b) {
		t.Error("the joined parts differ from the clearance call")
	}
	// As the page sends them: each part's data once, held as it arrives
	// (clearance_hold) or with a join, the parts held named by their runs.
	if _, err := Calls["clearance_hold"](nil, []byte(`{"scenario":`+sc+`,"parts":[`+parts[0]+`]}`)); err != nil {
		t.Fatal(err)
	}
	joined, err = Calls["clearance_join"](nil, []byte(`{"scenario":`+sc+`,"parts":[{"from":10,"to":24},`+parts[1]+`]}`))
	if err != nil {
		t.Fatal(err)
	}
	if b, _ = json.Marshal(joined); string(a) != string(b) {
		t.Error("the parts held and joined differ from the clearance call")
	}
	out, err := Calls["sheet"](nil, []byte(`{"scenario":`+sc+`,"units":{},"system":"si"}`))
	if err != nil {
		t.Fatal(err)
	}
	if html := out.(SheetReply).HTML; !strings.Contains(html, "sw-hatch") || !strings.Contains(html, "24 runs, seed 1") {
		t.Error("the sheet does not print the kept clearance report")
	}
	if _, err := Calls["clearance_part"](nil, []byte(`{"scenario":`+sc+`,"from":20,"to":30}`)); err == nil {
		t.Error("runs past the check's own accepted")
	}
}
