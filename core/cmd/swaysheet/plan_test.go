package main

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"
)

func TestPlanCommand(t *testing.T) {
	var out, errb bytes.Buffer
	code := run([]string{"-plan", "../../../testdata/scenarios/plan-bay-travel.json", "../../../testdata/scenarios/plan-tower-slew.json",
		"../../../testdata/scenarios/plan-gantry-pendant.json"}, &out, &errb)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	text := out.String()
	for _, want := range []string{"rank  option", "=>1", "Recommended:", "Caution:", "Set the drive's ramp time", "press to 67 %", "release to 67 %", "before the stop point", "within"} {
		if !strings.Contains(text, want) {
			t.Errorf("table lacks %q", want)
		}
	}
	out.Reset()
	if code := run([]string{"-plan", "-json", "../../../testdata/scenarios/plan-tower-slew.json"}, &out, &errb); code != 0 {
		t.Fatalf("-json exit %d", code)
	}
	var r struct {
		Options     []json.RawMessage `json:"options"`
		Recommended int               `json:"recommended"`
	}
	if err := json.Unmarshal(out.Bytes(), &r); err != nil || len(r.Options) == 0 || r.Recommended != 0 {
		t.Errorf("plan JSON: %v, %d options, recommended %d", err, len(r.Options), r.Recommended)
	}
	errb.Reset()
	if code := run([]string{"-plan", "../../../testdata/scenarios/bay-travel.json"}, &out, &errb); code != 1 ||
		!strings.Contains(errb.String(), "plan: is required") {
		t.Errorf("no plan block: exit %d, %q", code, errb.String())
	}
}
