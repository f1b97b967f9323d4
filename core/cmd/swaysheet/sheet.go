package main

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"time"

	"swaysheet/core/clearance"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/core/version"
)

// direct evaluates and plans for the sheet, with no memo.
var direct = sheet.Computer{Evaluate: sway.Evaluate, Plan: plan.Make, Clearance: checkSite}

func checkSite(s *scenario.Scenario) (*clearance.Report, error) {
	return clearance.Check(s, clearance.Options{})
}

// runSheets writes one check sheet per scenario file into dir, named after
// the file (bay-travel.json -> bay-travel.html), with the renderer of
// core/sheet, which the page prints with too.
func runSheets(dir string, names []string, system, link string, stdout, stderr io.Writer) int {
	if system != "si" && system != "us" {
		fmt.Fprintf(stderr, "-units must be si or us, not %q\n", system)
		return 2
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		fmt.Fprintln(stderr, err)
		return 1
	}
	status := 0
	used := map[string]bool{}
	for _, name := range names {
		s, err := readScenario(name)
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
			continue
		}
		in := direct.Compute(s)
		in.Units, in.Version, in.LinkBase = units.Choice{System: system}, version.Version, link
		in.PrintedAt = time.Now().UTC().Format("2006-01-02 15:04 UTC")
		sh, err := sheet.Build(in)
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
			continue
		}
		base := strings.TrimSuffix(filepath.Base(name), filepath.Ext(name))
		out := base
		for i := 2; used[out]; i++ {
			out = fmt.Sprintf("%s-%d", base, i)
		}
		used[out] = true
		path := filepath.Join(dir, out+".html")
		f, err := os.Create(path)
		if err != nil {
			fmt.Fprintln(stderr, err)
			status = 1
			continue
		}
		err = sh.WriteDocument(f)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", path, err)
			status = 1
			continue
		}
		fmt.Fprintf(stdout, "%s\t%s\t%s\n", path, sh.Fingerprint, s.Name)
	}
	return status
}
