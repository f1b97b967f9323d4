// Command swaysheet evaluates scenario files and prints the result as JSON,
// or as a short table with -summary. With -plan it runs the planning
// request of each file (its "plan" block) and prints the ranked table of
// drive settings, or the plan as JSON with -json.
//
//	go run ./core/cmd/swaysheet [-summary] [-no-history] FILE.json ...
//	go run ./core/cmd/swaysheet -plan [-json] FILE.json ...
//	go run ./core/cmd/swaysheet -clearance [-json] FILE.json ...
//	go run ./core/cmd/swaysheet -site-plan [-json] FILE.json ...
//	go run ./core/cmd/swaysheet -sheet OUTDIR [-units si|us] [-link URL] FILE.json ...
//
// With -sheet it writes the printable check sheet of each file as
// OUTDIR/NAME.html (core/sheet, the same renderer the page prints with) and
// prints each file written with the scenario's fingerprint.
package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"os"
	"strings"

	"swaysheet/core/figures"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("swaysheet", flag.ContinueOnError)
	fs.SetOutput(stderr)
	summary := fs.Bool("summary", false, "print a short table instead of the result JSON")
	noHistory := fs.Bool("no-history", false, "leave the time histories out of the result JSON")
	planning := fs.Bool("plan", false, "plan the scenario's move: print the ranked table of drive settings")
	planJSON := fs.Bool("json", false, "with -plan, -clearance or -site-plan: print JSON instead of the table")
	sheetDir := fs.String("sheet", "", "write the check sheet of each file as HTML into this folder")
	sheetUnits := fs.String("units", "si", "with -sheet and -summary: the unit system shown, si or us")
	sheetLink := fs.String("link", "index.html", "with -sheet: the page's address for the QR code's link")
	clear := fs.Bool("clearance", false, "check the load's likely swept envelope against the obstacles of each file's site block (with -json: the report as JSON)")
	sitePlan := fs.Bool("site-plan", false, "plan the move of each file's plan block and check its options against its site block: the fastest that keeps the margin and the largest top speed that does (with -json: the check as JSON)")
	ropeLength := fs.Bool("ropelength", false, "find the rope length from heights or a timed swing: each argument is a question as JSON text or a .json file")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: swaysheet [-summary [-units si|us]] [-no-history] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -plan [-json] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -clearance [-json] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -site-plan [-json] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -sheet OUTDIR [-units si|us] [-link URL] FILE.json ...")
		fmt.Fprintln(stderr, `       swaysheet -ropelength '{"timed": {"swings": 10, "time_s": 86}}' ...`)
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if fs.NArg() == 0 {
		fs.Usage()
		return 2
	}
	if *sheetDir != "" {
		return runSheets(*sheetDir, fs.Args(), *sheetUnits, *sheetLink, stdout, stderr)
	}
	if *sheetUnits != "si" && *sheetUnits != "us" {
		fmt.Fprintf(stderr, "-units must be si or us, not %q\n", *sheetUnits)
		return 2
	}
	if *planning {
		return runPlans(fs.Args(), *planJSON, stdout, stderr)
	}
	if *ropeLength {
		return runRopeLength(fs.Args(), stdout, stderr)
	}
	if *clear {
		return runClearance(fs.Args(), *planJSON, stdout, stderr)
	}
	if *sitePlan {
		return runSitePlan(fs.Args(), *planJSON, stdout, stderr)
	}
	status := 0
	for _, name := range fs.Args() {
		if *summary {
			s, err := readScenario(name)
			if err == nil {
				err = printSummary(stdout, name, s, units.Choice{System: *sheetUnits})
			}
			if err != nil {
				fmt.Fprintf(stderr, "%s: %v\n", name, err)
				status = 1
			}
			continue
		}
		_, res, err := evaluate(name, sway.Options{NoHistory: *noHistory})
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
			continue
		}
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(res); err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
		}
	}
	return status
}

// readScenario opens and decodes one scenario file.
func readScenario(name string) (*scenario.Scenario, error) {
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	return scenario.Decode(f)
}

func evaluate(name string, opt sway.Options) (*scenario.Scenario, *sway.Result, error) {
	s, err := readScenario(name)
	if err != nil {
		return nil, nil, err
	}
	opt.Validated = true // Decode validates
	r, err := sway.EvaluateWith(s, opt)
	return s, r, err
}

// printSummary prints the figures of s as the figures table presents
// them (core/figures), with the words and rounding of the check sheet and
// gathered as the sheet gathers them (for a planning request without
// moves, the recommended move): the verdict over every rope length the
// scenario names first, then each figure in the crew's words with its
// value, unit and verdict, the warnings in the units shown, and the
// technical names last.
func printSummary(w io.Writer, file string, s *scenario.Scenario, u units.Choice) error {
	in := sheet.Computer{Plan: plan.Make, Evaluate: func(x *scenario.Scenario) (*sway.Result, error) {
		return sway.EvaluateWith(x, sway.Options{NoHistory: true})
	}}.Compute(s)
	if in.ResultErr != "" {
		return fmt.Errorf("%s", in.ResultErr)
	}
	fmt.Fprintf(w, "%s\n%s\n", s.Name, file)
	if in.ResultFor != "" {
		fmt.Fprintf(w, "  for %s\n", in.ResultFor)
	}
	rep := figures.PresentRopes(in.Evaluated, in.Ropes, u)
	fmt.Fprintf(w, "  verdict: %s\n", rep.Verdict.Text)
	wl, wv := 0, 0
	for _, row := range rep.Rows {
		wl, wv = max(wl, len([]rune(row.Crew))), max(wv, len(row.Text))
	}
	for _, row := range rep.Rows {
		verdict := ""
		if c := row.Check; c != nil {
			verdict = c.Words
		} else if row.LimitKey != "" {
			verdict = "no limit set"
			if rep.Verdict.State == figures.NotSimulated {
				verdict = "nothing simulated"
			}
		}
		line := fmt.Sprintf("  %-*s  %*s %-6s %s", wl, row.Crew, wv, row.Text, row.Unit, verdict)
		fmt.Fprintln(w, strings.TrimRight(line, " "))
	}
	for _, s := range words.FormatAll(in.Result.WarningSentences, u) {
		fmt.Fprintf(w, "  warning: %s\n", s)
	}
	fmt.Fprintln(w, "  engineering detail (technical names):")
	for _, row := range rep.Rows {
		fmt.Fprintf(w, "    %s: %s\n", row.Crew, row.Technical)
	}
	fmt.Fprintln(w)
	return nil
}
