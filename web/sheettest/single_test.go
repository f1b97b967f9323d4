package sheettest

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"

	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/web/dist"
)

// The single file, opened as file:// with no server, computes the demo
// scenario: the figures shown are the core's own for it.
func TestSingleFileFromDisk(t *testing.T) {
	need(t)
	dir := t.TempDir()
	buildWasm(t, dir, "-tags", "nofetch", "-ldflags=-s -w")
	wexec, _ := os.ReadFile(filepath.Join(dir, "wasm_exec.js"))
	wasm, _ := os.ReadFile(filepath.Join(dir, "swaysheet.wasm"))
	html, err := dist.Single(filepath.Join(root, "web", "static"), wexec, wasm)
	if err != nil {
		t.Fatal(err)
	}
	file := filepath.Join(dir, "swaysheet.html")
	if err := os.WriteFile(file, html, 0o644); err != nil {
		t.Fatal(err)
	}
	os.Remove(filepath.Join(dir, "swaysheet.wasm")) // nothing beside the file
	os.Remove(filepath.Join(dir, "wasm_exec.js"))
	// SWAYSHEET_SINGLE_FILE tests a file that make dist wrote instead.
	if f := os.Getenv("SWAYSHEET_SINGLE_FILE"); f != "" {
		abs, err := filepath.Abs(f)
		if err != nil {
			t.Fatal(err)
		}
		file = abs
	}

	b := open(t)
	b.do(chromedp.Navigate("file://" + file))
	b.settle()
	data, err := os.ReadFile(filepath.Join(root, "testdata", "scenarios", "bay-travel.json"))
	if err != nil {
		t.Fatal(err)
	}
	s, _ := scenario.Parse(data)
	r, err := sway.Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	rep := figures.Present(s, r, units.Choice{System: "si"})
	for _, key := range []string{"period_s", "peak_swing_deg"} {
		if got, w := b.text(figSel(key)), shownText(rep, key); got != w {
			t.Errorf("%s shown %q, the core gives %q", key, got, w)
		}
	}
	if name := eval[string](b, `JSON.parse(window.swaysheet.scenarioJSON()).name`); name != s.Name {
		t.Errorf("the demo is %q, want %q", name, s.Name)
	}
	// Change an input and get a new result, still from the file.
	n := eval[int](b, `window.swaysheet.resultCount()`)
	b.typeInto("#f-load-rope_length_m", "12")
	b.poll(`window.swaysheet.resultCount() > `+itoa(n)+` && window.swaysheet.settled()`, "no new result")
	if got := b.text(figSel("period_s")); got == shownText(rep, "period_s") {
		t.Error("a longer rope kept the period")
	}
	if eval[string](b, `document.getElementById('engine-error').hidden ? '' : document.getElementById('engine-error').textContent`) != "" {
		t.Error("the engine reported an error")
	}
	// The single file's core has no draws call: the spread over likely
	// runs is not offered.
	if eval[bool](b, `!!document.getElementById('spread') || !!window.swaysheetSpread`) {
		t.Error("the single file offers the spread over likely runs, which its core cannot run")
	}
	// A page opened from a file has no server, so no site library: the
	// Examples dialog says so (the core's message) and lists none.
	b.do(chromedp.Click(chromedp.ID("open-examples")))
	b.poll(`!window.swaysheetLibrary.reading() && document.getElementById('library').dataset.state === 'none'`, "the library was not asked for")
	if msg := b.text("#library-source"); !strings.Contains(msg, "opened from a file") || b.text("#library-list") != "" {
		t.Errorf("single file: library %q, list %q", msg, b.text("#library-list"))
	}
	eval[bool](b, `document.getElementById('dlg-examples').close(); true`)
	// The press coach's module is in the file too.
	if !eval[bool](b, `typeof window.swaysheetCoach === 'object' && window.swaysheetCoach.running() === false`) {
		t.Error("the press coach is not in the single file")
	}
	// The print sheet is made there too.
	b.waitSheet()
}

func itoa(n int) string { return strconv.Itoa(n) }
