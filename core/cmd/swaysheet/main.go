// Command swaysheet evaluates scenario files and prints the result as JSON,
// or as a short table with -summary. With -plan it runs the planning
// request of each file (its "plan" block) and prints the ranked table of
// drive settings, or the plan as JSON with -json.
//
//	go run ./core/cmd/swaysheet [-summary] [-no-history] FILE.json ...
//	go run ./core/cmd/swaysheet -plan [-json] FILE.json ...
//	go run ./core/cmd/swaysheet -sheet OUTDIR [-units si|us] [-link URL] FILE.json ...
//
// With -sheet it writes the printable check sheet of each file as
// OUTDIR/NAME.html (web/sheet, the same renderer the page prints with) and
// prints each file written with the scenario's fingerprint.
package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"os"
	"text/tabwriter"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
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
	planJSON := fs.Bool("json", false, "with -plan: print the plan as JSON instead of the table")
	sheetDir := fs.String("sheet", "", "write the check sheet of each file as HTML into this folder")
	sheetUnits := fs.String("units", "si", "with -sheet: the unit system of the sheet, si or us")
	sheetLink := fs.String("link", "index.html", "with -sheet: the page's address for the QR code's link")
	ropeLength := fs.Bool("ropelength", false, "find the rope length from heights or a timed swing: each argument is a question as JSON text or a .json file")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: swaysheet [-summary] [-no-history] FILE.json ...")
		fmt.Fprintln(stderr, "       swaysheet -plan [-json] FILE.json ...")
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
	status := 0
	for _, name := range fs.Args() {
		res, err := evaluate(name, sway.Options{NoHistory: *noHistory || *summary})
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
			continue
		}
		if *summary {
			printSummary(stdout, name, res)
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

func evaluate(name string, opt sway.Options) (*sway.Result, error) {
	s, err := readScenario(name)
	if err != nil {
		return nil, err
	}
	return sway.EvaluateWith(s, opt)
}

func printSummary(w io.Writer, file string, r *sway.Result) {
	fmt.Fprintf(w, "%s\n%s\n", r.Name, file)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label string, v float64, unit string) { fmt.Fprintf(tw, "  %s\t%.4g\t%s\n", label, v, unit) }
	row("period (small swing)", r.PeriodS, "s")
	row("period at residual swing", r.PeriodAmplitudeS, "s")
	row("peak swing", r.PeakSwingDeg, "deg")
	row("peak excursion", r.PeakExcursionM, "m")
	row("residual swing", r.ResidualSwingDeg, "deg")
	row("residual excursion", r.ResidualExcursionM, "m")
	row("tension max", r.TensionMaxN/1000, "kN")
	row("tension min", r.TensionMinN/1000, "kN")
	row("tension factor", r.TensionFactor, "")
	if r.WindForceN > 0 {
		row("wind lean", r.WindLeanDeg, "deg")
	}
	if rg := r.Rigging; rg != nil {
		row("mode periods (linear)", rg.ModePeriodsS[0], fmt.Sprintf("s and %.4g s", rg.ModePeriodsS[1]))
		row("mode periods (simulated)", rg.SimulatedPeriodsS[0], fmt.Sprintf("s and %.4g s", rg.SimulatedPeriodsS[1]))
		row("second mode share", 100*rg.SecondModeShare, "%")
		row("peak rope swing", rg.PeakRopeSwingDeg, "deg")
		row("peak rigging angle to rope", rg.PeakRiggingAngleDeg, "deg")
		row("rigging tension max", rg.RiggingTensionMaxN/1000, "kN")
	}
	row("run", r.RunS, "s")
	tw.Flush()
	for _, c := range r.Checks {
		mark := "within"
		if !c.Within {
			mark = "OUTSIDE"
		}
		fmt.Fprintf(w, "  check %s: %.4g (limit %.4g %s) %s\n", c.Label, c.Value, c.Limit, c.Unit, mark)
	}
	for _, s := range r.Warnings {
		fmt.Fprintf(w, "  warning: %s\n", s)
	}
	fmt.Fprintln(w)
}
