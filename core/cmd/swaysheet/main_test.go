package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestEveryExampleEvaluates(t *testing.T) {
	files, _ := filepath.Glob("../../../testdata/scenarios/*.json")
	if len(files) == 0 {
		t.Fatal("no examples")
	}
	var out, errOut bytes.Buffer
	if code := run(append([]string{"-no-history"}, files...), &out, &errOut); code != 0 {
		t.Fatalf("exit %d: %s", code, errOut.String())
	}
	dec := json.NewDecoder(&out)
	n := 0
	for dec.More() {
		var r map[string]any
		if err := dec.Decode(&r); err != nil {
			t.Fatal(err)
		}
		for _, k := range []string{"period_s", "period_amplitude_s", "peak_swing_deg", "peak_excursion_m",
			"residual_swing_deg", "tension_max_n", "tension_min_n", "tension_factor", "warnings", "history"} {
			if _, ok := r[k]; !ok {
				t.Errorf("result lacks %s", k)
			}
		}
		n++
	}
	if n != len(files) {
		t.Errorf("%d results for %d files", n, len(files))
	}
}

func TestSummaryAndBadInput(t *testing.T) {
	var out, errOut bytes.Buffer
	if code := run([]string{"-summary", "../../../testdata/scenarios/bay-travel.json"}, &out, &errOut); code != 0 {
		t.Fatalf("exit %d: %s", code, errOut.String())
	}
	for _, want := range []string{"largest swing", "peak swing", "swing left after stopping", "verdict: OUTSIDE the lift plan's limits"} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("summary lacks %q: %s", want, out.String())
		}
	}
	bad := filepath.Join(t.TempDir(), "bad.json")
	os.WriteFile(bad, []byte(`{"format":"swaysheet-scenario","version":1,"name":"x","load":{"mass_kg":-1,"rope_length_m":5},"motions":[]}`), 0o644)
	out.Reset()
	errOut.Reset()
	if code := run([]string{bad}, &out, &errOut); code != 1 {
		t.Errorf("bad input: exit %d", code)
	}
	if !strings.Contains(errOut.String(), "load.mass_kg: -1 is out of range") {
		t.Errorf("message: %s", errOut.String())
	}
	if code := run(nil, &out, &errOut); code != 2 {
		t.Errorf("no arguments: exit %d", code)
	}
}
