package sheettest

import (
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"

	"swaysheet/core/clearance"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// Every example's stand-alone sheet (as swaysheet -sheet writes it) prints
// on exactly one page at A4 and at Letter, in SI and in US units (the
// site examples with their clearance section and plan view).
func TestEveryExampleOnePage(t *testing.T) {
	need(t)
	files, _ := filepath.Glob(filepath.Join(root, "testdata", "scenarios", "*.json"))
	dir := t.TempDir()
	b := open(t)
	one := regexp.MustCompile(`(?m)^Pages:\s+1$`)
	for _, f := range files {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		s, err := scenario.Parse(data)
		if err != nil {
			t.Fatal(err)
		}
		var rep *clearance.Report
		if s.Site != nil {
			if rep, err = clearance.Check(s, clearance.Options{}); err != nil {
				t.Fatal(err)
			}
		}
		kept := func(*scenario.Scenario) (*clearance.Report, error) { return rep, nil }
		for _, sys := range []string{"si", "us"} {
			in := sheet.Computer{Evaluate: sway.Evaluate, Plan: plan.Make, Clearance: kept}.Compute(s)
			in.Units, in.Version, in.LinkBase, in.PrintedAt = units.Choice{System: sys}, "test", "https://example.org/swaysheet/", "2026-12-02 07:30"
			sh, err := sheet.Build(in)
			if err != nil {
				t.Fatal(err)
			}
			html := filepath.Join(dir, sys+"-"+filepath.Base(f)+".html")
			w, _ := os.Create(html)
			if err := sh.WriteDocument(w); err != nil {
				t.Fatal(err)
			}
			w.Close()
			b.do(chromedp.Navigate("file://" + html))
			for _, p := range papers {
				pdf := filepath.Join(dir, "p.pdf")
				os.WriteFile(pdf, b.pdf(p.w, p.h), 0o644)
				info, err := exec.Command("pdfinfo", pdf).Output()
				if err != nil {
					t.Fatal(err)
				}
				// Kept to look at: out/browser/not-one-page-*.pdf, and
				// every sheet as out/browser/example-*.pdf with
				// SWAYSHEET_KEEP_SHEETS=1.
				bad := !one.Match(info)
				if bad || os.Getenv("SWAYSHEET_KEEP_SHEETS") == "1" {
					keep := filepath.Join(root, "out", "browser", map[bool]string{true: "not-one-page-", false: "example-"}[bad]+strings.TrimSuffix(filepath.Base(f), ".json")+"-"+sys+"-"+p.name+".pdf")
					os.MkdirAll(filepath.Dir(keep), 0o755)
					os.WriteFile(keep, b.pdf(p.w, p.h), 0o644)
					if bad {
						t.Errorf("%s (%s) at %s: not one page (kept as %s)", filepath.Base(f), sys, p.name, keep)
					}
				}
			}
		}
	}
}
