package main

import (
	"errors"
	"fmt"
	"io"
	"text/tabwriter"

	"swaysheet/core/clearance"
)

// runClearance runs the clearance check of each file's site block and
// prints the verdict, each obstacle's figures and the envelopes, or the
// report as JSON.
func runClearance(files []string, asJSON bool, stdout, stderr io.Writer) int {
	return eachFile(files, stderr, func(_ int, name string) error {
		s, err := readScenario(name)
		if err != nil {
			return err
		}
		if s.Site == nil {
			return errors.New("site: the scenario has no site block: add the obstacles, the suspension height and the load's size to check clearances")
		}
		rep, err := clearance.Check(s, clearance.Options{})
		if err != nil {
			return err
		}
		if asJSON {
			return writeJSON(stdout, rep)
		}
		printClearance(stdout, name, s.Name, rep)
		return nil
	})
}

func printClearance(w io.Writer, file, title string, r *clearance.Report) {
	fmt.Fprintf(w, "%s\n%s\n", title, file)
	verdict := "CLEARS"
	if !r.Clears {
		verdict = "DOES NOT CLEAR"
	}
	fmt.Fprintf(w, "  %s (%d runs, seed %d, margin %.2f m)\n", verdict, r.Runs, r.Seed, r.MarginM)
	for _, s := range r.Words {
		fmt.Fprintf(w, "  %s\n", s)
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  obstacle\tkeeps the margin\tat least (95 % conf.)\tclearance 95 % of runs keep\tsmallest\tat\tstrikes")
	for _, o := range r.Obstacles {
		fmt.Fprintf(tw, "  %s\t%d of %d\t%.0f %%\t%.2f m\t%.2f m\t%.1f s\t%d\n", o.Name, o.KeepMargin, o.Runs,
			100*o.ShareKeepMarginLow, o.ClearanceP5M, o.SmallestM, o.SmallestAtS, o.Strikes)
	}
	tw.Flush()
	for _, e := range []clearance.EnvelopeOut{r.Envelope50, r.Envelope95} {
		fmt.Fprintf(w, "  area the load stays inside in %.0f %% of runs: %.1f m² (strays up to %.2f m from the path with no spread; confidence that it holds at least %.0f %% of all runs: %.0f %%)\n",
			100*e.Level, e.AreaM2, e.StrayM, 100*e.Level, 100*e.Confidence)
	}
	fmt.Fprintln(w, "  keep everyone out of the 95 % area while the load moves.")
	fmt.Fprintln(w)
}
