package main

import (
	"bytes"
	"strings"
	"testing"
)

func TestClearanceCommand(t *testing.T) {
	var out, errw bytes.Buffer
	code := run([]string{"-clearance", "../../../testdata/scenarios/site-bay-columns.json", "../../../testdata/scenarios/site-tower-hoarding.json"}, &out, &errw)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errw.String())
	}
	for _, want := range []string{"DOES NOT CLEAR", "column C3", "CLEARS", "site hoarding", "keep everyone out of the 95 % area"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
	out.Reset()
	errw.Reset()
	if code := run([]string{"-clearance", "../../../testdata/scenarios/bay-travel.json"}, &out, &errw); code != 1 || !strings.Contains(errw.String(), "site: the scenario has no site block") {
		t.Errorf("no site block: exit %d, %q", code, errw.String())
	}
}

func TestSitePlanCommand(t *testing.T) {
	var out, errw bytes.Buffer
	code := run([]string{"-site-plan", "../../../testdata/scenarios/plan-site-bay-columns.json"}, &out, &errw)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errw.String())
	}
	for _, want := range []string{"Fastest option that keeps 0.30 m", "Largest top speed tested that keeps the margin", "60 runs each", "Drive limits"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
}
