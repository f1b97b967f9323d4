package sheettest

import (
	"encoding/base64"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"

	"swaysheet/core/scenario"
	"swaysheet/core/version"
	"swaysheet/web/site"
)

const hostile = `<img src=x onerror=alert(1)>`

// pageServer serves the page as make serve does, from a fresh wasm build.
func pageServer(t *testing.T, static string) (string, *served) {
	build := t.TempDir()
	buildWasm(t, build)
	srv, c := serve(t, site.Handler(site.Dirs{Static: static, Build: build,
		Examples: filepath.Join(root, "testdata", "scenarios")}))
	return srv.URL + "/", c
}

// Paper sizes in inches, and the sheet's own margins (sheet.css @page).
var papers = []struct {
	name string
	w, h float64
	size string // pdfinfo's name
}{{"a4", 8.27, 11.69, "A4"}, {"letter", 8.5, 11, "letter"}}

func (b *browser) pdf(w, h float64) []byte {
	b.t.Helper()
	res, err := chromedp.Call(b.ctx, page.PrintToPDF, page.PrintToPDFParams{
		PaperWidth: w, PaperHeight: h, MarginTop: ptr(0.315), MarginBottom: ptr(0.315), MarginLeft: ptr(0.394), MarginRight: ptr(0.394),
		PrintBackground: ptr(true), PreferCSSPageSize: ptr(false)})
	if err != nil {
		b.t.Fatal(err)
	}
	return res.Data
}

func pdfText(t *testing.T, file string, args ...string) string {
	t.Helper()
	a := append(args[1:], file)
	if args[0] == "pdftotext" {
		a = append(a, "-")
	}
	out, err := exec.Command(args[0], a...).Output()
	if err != nil {
		t.Fatalf("%s %s: %v", args[0], file, err)
	}
	return string(out)
}

// The print of the page is the check sheet: one page on A4 and on Letter,
// holding the inputs, results, cautions and fingerprint; a reference field
// holding markup prints as typed and runs nothing.
func TestPrintCheckSheet(t *testing.T) {
	need(t)
	url, _ := pageServer(t, filepath.Join(root, "web", "static"))
	b := open(t)
	b.do(chromedp.Navigate(url))
	b.settle()
	b.waitSheet()

	b.typeInto("#f-sheet-project", hostile)
	b.typeInto("#f-sheet-lift_reference", "L-07 girder G2")
	b.typeInto("#f-sheet-checked_by", `"><script>alert(2)</script>`)
	b.typeInto("#f-sheet-date", "2026-12-02 07:30")
	b.settle()
	sc := eval[string](b, `window.swaysheet.scenarioJSON()`)
	s, err := scenario.Parse([]byte(sc))
	if err != nil {
		t.Fatal(err)
	}
	if s.Sheet == nil || s.Sheet.Project != hostile {
		t.Fatalf("the project field did not reach the scenario: %+v", s.Sheet)
	}
	fp, _ := scenario.Fingerprint(s)
	for i := 0; ; i++ {
		got := b.waitSheet()
		if got == fp {
			break
		}
		if i > 300 {
			t.Fatalf("the check sheet does not follow the inputs: fingerprint %s, want %s", got, fp)
		}
		time.Sleep(50 * time.Millisecond)
	}
	if n := eval[int](b, `document.querySelectorAll('#sheet-host img, #sheet-host script, body > img').length`); n != 0 {
		t.Fatalf("%d elements made from the reference fields", n)
	}

	out := filepath.Join(root, "out", "browser")
	os.MkdirAll(out, 0o755)
	for _, p := range papers {
		file := filepath.Join(out, "sheet-"+p.name+".pdf")
		if err := os.WriteFile(file, b.pdf(p.w, p.h), 0o644); err != nil {
			t.Fatal(err)
		}
		info := pdfText(t, file, "pdfinfo")
		if !regexp.MustCompile(`(?m)^Pages:\s+1$`).MatchString(info) {
			t.Errorf("%s: not exactly one page:\n%s", p.name, info)
		}
		if !strings.Contains(info, p.size) {
			t.Errorf("%s: page size is not %s:\n%s", p.name, p.size, info)
		}
		// Compared without white space: a field's text may wrap. The
		// reading-order text keeps a wrapped field together, the layout
		// text keeps a table's label beside its value.
		squeeze := func(s string) string { return strings.Join(strings.Fields(s), "") }
		raw := squeeze(pdfText(t, file, "pdftotext"))
		layout := squeeze(pdfText(t, file, "pdftotext", "-layout"))
		flat := raw + "\n" + layout
		for _, want := range []string{
			"Hook-load sway check sheet", s.Name[:30],
			hostile, `"><script>alert(2)</script>`, "L-07 girder G2", "2026-12-02 07:30",
			"INPUTS", "Mass 7200 kg", "Rope length 8.50 m", "Speed 30.0 m/min",
			"RESULTS", "Time for one full swing", "Largest swing", "Rope pull increase", "within", "OUTSIDE",
			"SAFETY CAUTIONS", "Nobody under a suspended load", "take precedence",
			"WHAT THE MODEL ASSUMES", "Prepared by", "Checked by", "swaysheet " + version.Version,
			fp,
		} {
			if w := squeeze(want); !strings.Contains(raw, w) && !strings.Contains(layout, w) {
				t.Errorf("%s: the printed text lacks %q", p.name, want)
			}
		}
		// No page furniture: the page's buttons and headings are not printed.
		for _, no := range []string{"Share link", "Examples", "Import", "Skip to the inputs"} {
			if strings.Contains(flat, squeeze(no)) {
				t.Errorf("%s: the print holds the page's %q", p.name, no)
			}
		}
		if p.name == "a4" {
			png := exec.Command("pdftoppm", "-r", "110", "-png", "-singlefile", file, filepath.Join(out, "sheet-a4"))
			if o, err := png.CombinedOutput(); err != nil {
				t.Fatalf("pdftoppm: %v %s", err, o)
			}
		}
	}
	b.mu.Lock()
	defer b.mu.Unlock()
	if len(b.dialogs) > 0 {
		t.Fatalf("a dialog opened: %q", b.dialogs)
	}
}

func ptr[T any](v T) *T { return &v }

// The page's print of the site example, once its clearance check is done:
// the sheet the bridge makes from its kept report (no check run for it)
// holds the site plan, the vertical section along the path, each obstacle
// (with the room under the load) and the spreads used, on one page at A4
// and at Letter.
func TestPrintSitePlan(t *testing.T) {
	need(t)
	url, _ := pageServer(t, filepath.Join(root, "web", "static"))
	data, err := os.ReadFile(filepath.Join(root, "testdata", "scenarios", "site-bay-columns.json"))
	if err != nil {
		t.Fatal(err)
	}
	b := open(t)
	b.do(chromedp.Navigate(url + "#s=" + base64.RawURLEncoding.EncodeToString(data)))
	b.settle()
	b.poll(`window.swaysheetSite && window.swaysheetSite.settled() && !!window.swaysheetSite.report() && window.swaysheet.settled() && !!document.querySelector('#sheet-host .sw-site svg')`, "the sheet with the site plan")
	out := filepath.Join(root, "out", "browser")
	os.MkdirAll(out, 0o755)
	for _, p := range papers {
		file := filepath.Join(out, "sheet-site-"+p.name+".pdf")
		if err := os.WriteFile(file, b.pdf(p.w, p.h), 0o644); err != nil {
			t.Fatal(err)
		}
		if info := pdfText(t, file, "pdfinfo"); !regexp.MustCompile(`(?m)^Pages:\s+1$`).MatchString(info) {
			t.Errorf("%s: not exactly one page:\n%s", p.name, info)
		}
		text := strings.Join(strings.Fields(pdfText(t, file, "pdftotext")), " ")
		for _, want := range []string{"CLEARANCES ALONG THE PATH", "DOES NOT CLEAR", "nobody stands here during the lift", "column C3", "panel stack", "200 runs, seed 1",
			"room under the load over it", "along the path (m)", "from the side along the path"} {
			if !strings.Contains(text, want) {
				t.Errorf("%s: the printed sheet lacks %q", p.name, want)
			}
		}
	}
}
