package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// -sheet writes one HTML sheet per file, named after it, and lists each
// with its fingerprint; a bad file is reported and the rest still written.
func TestSheetBatch(t *testing.T) {
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.json")
	os.WriteFile(bad, []byte(`{"format": "swaysheet-scenario"`), 0o644)
	files := []string{"../../../testdata/scenarios/bay-travel.json", bad, "../../../testdata/scenarios/plan-tower-slew.json"}
	var out, errOut bytes.Buffer
	code := run(append([]string{"-sheet", filepath.Join(dir, "sheets"), "-units", "us"}, files...), &out, &errOut)
	if code != 1 || !strings.Contains(errOut.String(), "bad.json") {
		t.Fatalf("exit %d, stderr %q: the bad file is not reported", code, errOut.String())
	}
	for _, name := range []string{"bay-travel", "plan-tower-slew"} {
		html, err := os.ReadFile(filepath.Join(dir, "sheets", name+".html"))
		if err != nil {
			t.Fatal(err)
		}
		data, _ := os.ReadFile("../../../testdata/scenarios/" + name + ".json")
		s, _ := scenario.Parse(data)
		fp, _ := scenario.Fingerprint(s)
		if !strings.Contains(string(html), fp) || !strings.Contains(out.String(), fp) {
			t.Errorf("%s: fingerprint %s missing", name, fp)
		}
		if !strings.Contains(string(html), `<td class="sw-u">ft</td>`) {
			t.Errorf("%s: not in US units", name)
		}
	}
	if code := run([]string{"-sheet", dir, "-units", "metric", files[0]}, &out, &errOut); code != 2 {
		t.Errorf("-units metric: exit %d", code)
	}
}
