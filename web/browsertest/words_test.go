package browsertest

import (
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/version"
)

// siAfterNumber finds an SI unit symbol used as a unit: after a number,
// not the start of a longer word ("3 m", "0.5 m/s", "12 kN"; not "3
// minutes"). As core/sheet's test of the US sheet.
var siAfterNumber = regexp.MustCompile(`\d\s*(m/s²|m/s2|m/s|m/min|m²|m³|kg/m³|kN|kg|N|m|t)(?:[^\p{L}\p{N}/²³]|$)`)

// "Use as my own" leaves nothing of the example to print under the user's
// lift: name, description and example mark go; the sheet then carries the
// release's version and the time it was made as the lift's date.
func TestUseAsMyOwn(t *testing.T) {
	h := setup(t)
	before := h.scenario()
	desc, _ := before["description"].(string)
	if before["example"] != true || desc == "" {
		t.Fatalf("the demo is not a described example: %v", before["example"])
	}
	if eval[bool](h, `document.getElementById('example-banner').hidden`) {
		t.Fatal("no example banner on the demo")
	}
	h.click("#example-own")
	h.settle()
	s := h.scenario()
	for _, k := range []string{"example", "name", "description"} {
		if _, ok := s[k]; ok {
			t.Errorf("after Use as my own the scenario keeps %s: %v", k, s[k])
		}
	}
	if !eval[bool](h, `document.getElementById('example-banner').hidden`) {
		t.Error("the example banner stays")
	}
	sheet := h.text("#sheet-host")
	for _, no := range []string{desc[:40], before["name"].(string), "Invented example", "EXAMPLE"} {
		if strings.Contains(sheet, no) {
			t.Errorf("the sheet still prints %q", no)
		}
	}
	today := time.Now().Format("2006-01-02")
	for _, w := range []string{"swaysheet " + version.Version, today, "(printed)"} {
		if !strings.Contains(sheet, w) {
			t.Errorf("the sheet lacks %q", w)
		}
	}
	if strings.Contains(sheet, "-dev") {
		t.Error("the sheet prints a development version")
	}
}

// A planning request without moves, once planned, is presented for the
// recommended move: the figures, the plots and the sheet are all of that
// one scenario (the same fingerprint), and the page says so.
func TestPlotsAndSheetOfTheFiguresMove(t *testing.T) {
	h := setup(t)
	before := eval[int](h, `window.swaysheetPlan.count()`)
	h.openExample("plan the girder's travel")
	h.planSettled(before)
	h.settle()
	w := h.corePlan()
	if w.Recommended < 0 {
		t.Fatal("the core recommends nothing for the bay-travel plan")
	}
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	if len(s.Motions) != 0 {
		t.Fatalf("the planning example has %d moves of its own", len(s.Motions))
	}
	rec := *s
	rec.Motions = []scenario.Motion{w.Options[w.Recommended].Motion}
	fp, _ := scenario.Fingerprint(&rec)
	plots := eval[string](h, `document.getElementById('charts').dataset.fingerprint`)
	sheet := eval[string](h, `document.getElementById('sheet-host').dataset.resultFingerprint`)
	if plots != fp || sheet != fp {
		t.Errorf("the recommended move is %s; the plots are of %q, the sheet of %q", fp, plots, sheet)
	}
	if st := eval[string](h, `document.getElementById('verdict').dataset.state`); st == "not_simulated" {
		t.Error("the planned request still says nothing was simulated")
	}
	if !strings.Contains(h.text("#result-for"), "recommended") || !strings.Contains(h.text("#plot-angle figcaption"), "recommended") {
		t.Errorf("the page does not say which move it shows: %q, %q", h.text("#result-for"), h.text("#plot-angle figcaption"))
	}
	r, err := sway.Evaluate(&rec)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := h.text(`#figures [data-key="peak_swing_deg"] .num`), shown("angle", "deg", r.PeakSwingDeg); got != want {
		t.Errorf("largest swing %q, the recommended move's %q", got, want)
	}
	// The angle plot is of a move, not a load at rest: its line rises.
	if d := h.plotPath("plot-angle"); len(strings.Fields(d)) < 10 {
		t.Errorf("angle plot %q", d)
	}
	if !strings.Contains(h.text("#plan-nomove"), "recommended move") {
		t.Errorf("plan note: %q", h.text("#plan-nomove"))
	}
	// The crane's own moves: the plots are of the inputs again.
	h.click("#plan-opt-" + strconv.Itoa(w.Recommended) + " [data-apply]")
	h.settle()
	own, _ := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	fp2, _ := scenario.Fingerprint(own)
	if got := eval[string](h, `document.getElementById('charts').dataset.fingerprint`); got != fp2 || h.text("#result-for") != "(missing #result-for)" {
		t.Errorf("with the move in the motions: plots of %q, want %q; %q", got, fp2, h.text("#result-for"))
	}
}

// Import reads a drive record (CSV) into a recorded move of its axis; a
// bad record gives the core's message naming the line and column, and
// keeps the inputs; a record of two axes asks which.
func TestImportDriveRecord(t *testing.T) {
	h := setup(t)
	dir := t.TempDir()
	write := func(name, text string) string {
		f := filepath.Join(dir, name)
		if err := os.WriteFile(f, []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
		return f
	}
	upload := func(file string) {
		t.Helper()
		h.do(chromedp.SetUploadFiles(chromedp.ID("import-file"), []string{file}))
	}
	// Bad: a number the core does not read, on line 3.
	kept := eval[string](h, `window.swaysheet.scenarioJSON()`)
	upload(write("bad.csv", "time_s,travel_x_m_per_s\n0,0\n0.5,fast\n1,0\n"))
	h.waitFor(`/line 3, column travel_x_m_per_s/.test(document.getElementById('notice').textContent)`, "no message naming the line and column")
	h.settle()
	if got := eval[string](h, `window.swaysheet.scenarioJSON()`); got != kept {
		t.Error("a bad record changed the inputs")
	}
	// Good: speeds of the trolley travel.
	rec := "time_s,travel_x_m_per_s\n# invented drive record\n0,0\n0.5,0.1\n1,0.2\n5,0.2\n5.5,0.1\n6,0\n"
	n := eval[int](h, `window.swaysheet.loads()`)
	upload(write("run.csv", rec))
	h.waitFor(`window.swaysheet.loads() > `+strconv.Itoa(n), "the record was not imported")
	h.settle()
	ms := h.scenario()["motions"].([]any)
	var got map[string]any
	for _, m := range ms {
		if mm := m.(map[string]any); mm["axis"] == "travel_x" {
			if got != nil {
				t.Error("two moves of travel x after the import")
			}
			got = mm
		}
	}
	if got == nil || got["profile"] != "series" || got["csv"] != rec {
		t.Fatalf("motions after the import: %v", ms)
	}
	if !strings.Contains(h.text("#notice"), "drive record run.csv") {
		t.Errorf("notice %q", h.text("#notice"))
	}
	if h.text("#figures") == "(missing #figures)" {
		t.Error("no results for the recorded move")
	}
	// Two axes: the page asks which, and takes that column.
	n = eval[int](h, `window.swaysheet.loads()`)
	upload(write("two.csv", "time_s,travel_x_m,travel_y_m\n0,0,0\n1,0.1,0.05\n2,0.4,0.2\n3,0.9,0.45\n4,1.2,0.6\n"))
	h.waitFor(`!!document.getElementById('dlg-record') && document.getElementById('dlg-record').open`, "no question which axis")
	h.do(chromedp.SetValue(chromedp.ID("record-axis"), "travel_y"))
	h.click("#record-use")
	h.waitFor(`window.swaysheet.loads() > `+strconv.Itoa(n), "the two-axis record was not imported")
	h.settle()
	found := false
	for _, m := range h.scenario()["motions"].([]any) {
		if mm := m.(map[string]any); mm["axis"] == "travel_y" && mm["profile"] == "series" {
			found = true
		}
	}
	if !found {
		t.Errorf("no recorded travel y move: %v", h.scenario()["motions"])
	}
}

// waitFor polls expr until it is true.
func (h *harness) waitFor(expr, what string) {
	h.t.Helper()
	if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](expr, chromedp.WithPollingTimeout(30*time.Second), chromedp.WithPollingInterval(50*time.Millisecond))); err != nil {
		h.t.Fatalf("%s: %v", what, err)
	}
}
