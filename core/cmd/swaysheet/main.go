// Command swaysheet evaluates scenario files and prints the result as JSON,
// or as a short table with -summary. With -plan it runs the planning
// request of each file (its "plan" block) and prints the ranked table of
// drive settings, or the plan as JSON with -json.
//
//	go run ./core/cmd/swaysheet [-summary] [-no-history] FILE.json ...
//	go run ./core/cmd/swaysheet -plan [-json] FILE.json ...
//	go run ./core/cmd/swaysheet -clearance [-json] FILE.json ...
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
	"text/tabwriter"

	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
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
	planJSON := fs.Bool("json", false, "with -plan or -clearance: print JSON instead of the table")
	sheetDir := fs.String("sheet", "", "write the check sheet of each file as HTML into this folder")
	sheetUnits := fs.String("units", "si", "with -sheet: the unit system of the sheet, si or us")
	sheetLink := fs.String("link", "index.html", "with -sheet: the page's address for the QR code's link")
	clear := fs.Bool("clearance", false, "check the load's likely swept envelope against the obstacles of each file's site block (with -json: the report as JSON)")
	ropeLength := fs.Bool("ropelength", false, "find the rope length from heights or a timed swing: each argument is a question as JSON text or a .json file")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: swaysheet [-summary] [-no-history] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -plan [-json] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -clearance [-json] FILE.json ...")
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
	if *planning {
		return runPlans(fs.Args(), *planJSON, stdout, stderr)
	}
	if *ropeLength {
		return runRopeLength(fs.Args(), stdout, stderr)
	}
	if *clear {
		return runClearance(fs.Args(), *planJSON, stdout, stderr)
	}
	status := 0
	for _, name := range fs.Args() {
		s, res, err := evaluate(name, sway.Options{NoHistory: *noHistory || *summary})
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
			continue
		}
		if *summary {
			printSummary(stdout, name, s, res)
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

// printSummary prints the figures of the result as the figures table
// presents them (core/figures): the crew's words, the value rounded in SI
// units, the verdict against the plan's limit, the technical name; then
// the verdict of the whole and the warnings.
func printSummary(w io.Writer, file string, s *scenario.Scenario, r *sway.Result) {
	fmt.Fprintf(w, "%s\n%s\n", r.Name, file)
	rep := figures.Present(s, r, units.Choice{System: "si"})
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
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
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t(%s)\n", row.Crew, row.Text, row.Unit, verdict, row.Technical)
	}
	tw.Flush()
	fmt.Fprintf(w, "  verdict: %s\n", rep.Verdict.Text)
	for _, s := range r.Warnings {
		fmt.Fprintf(w, "  warning: %s\n", s)
	}
	fmt.Fprintln(w)
}
