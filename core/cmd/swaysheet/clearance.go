package main

import (
	"errors"
	"fmt"
	"io"
	"text/tabwriter"

	"swaysheet/core/clearance"
	"swaysheet/core/plan"
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
	fmt.Fprintln(tw, "  obstacle\tkeeps the margin\tat least (95 % conf.)\tclearance 95 % of runs keep\tsmallest\tat\talong the path\tstrikes\tgap below the load\trope: closest")
	for _, o := range r.Obstacles {
		gap := "not passed over"
		if v := o.Vertical; v != nil {
			gap = fmt.Sprintf("%.2f m at %.1f m (%d runs over it)", v.SmallestM, v.AtDistanceM, v.Runs)
		}
		rope := "not checked"
		if rp := o.Rope; rp != nil {
			rope = fmt.Sprintf("%.2f m (%s, %.1f m up, %.1f s)", rp.SmallestM, rp.Part, rp.SmallestAtHeightM, rp.SmallestAtS)
			if rp.Strikes > 0 {
				rope += fmt.Sprintf("; passes through it in %d runs, first at %.1f s, %.1f m up", rp.Strikes, rp.FirstStrikeS, rp.FirstStrikeAtHeightM)
			}
		}
		strikes := fmt.Sprint(o.Strikes)
		if o.Strikes > 0 {
			strikes += fmt.Sprintf(" (load %d, first by %s at %.1f s)", o.LoadStrikes, clearance.StruckBy(o.FirstStrikeBy, o.FirstStrikeLine), o.FirstStrikeS)
		}
		fmt.Fprintf(tw, "  %s\t%d of %d\t%.0f %%\t%.2f m\t%.2f m\t%.1f s\t%.1f m\t%s\t%s\t%s\n", o.Name, o.KeepMargin, o.Runs,
			100*o.ShareKeepMarginLow, o.ClearanceP5M, o.SmallestM, o.SmallestAtS, o.SmallestAtDistanceM, strikes, gap, rope)
	}
	tw.Flush()
	if b := r.Section.Envelope95; len(b.LowM) > 0 {
		fmt.Fprintf(w, "  section along the path (%.1f m, load as %s): lowest point of the 95 %% runs %.2f m up\n", r.Section.PathLengthM, r.Outline, minOf(b.LowM))
	}
	for _, e := range []clearance.EnvelopeOut{r.Envelope50, r.Envelope95} {
		fmt.Fprintf(w, "  area the load stays inside in %.0f %% of runs: %.1f m² (strays up to %.2f m from the path with no spread; confidence that it holds at least %.0f %% of all runs: %.0f %%)\n",
			100*e.Level, e.AreaM2, e.StrayM, 100*e.Level, 100*e.Confidence)
	}
	fmt.Fprintln(w, "  keep everyone out of the 95 % area while the load moves.")
	fmt.Fprintln(w)
}

func minOf(v []float64) float64 {
	m := v[0]
	for _, x := range v {
		m = min(m, x)
	}
	return m
}

// runSitePlan plans each file's move and checks the options against its
// site block, printing the outcome or the check as JSON.
func runSitePlan(files []string, asJSON bool, stdout, stderr io.Writer) int {
	return eachFile(files, stderr, func(_ int, name string) error {
		s, err := readScenario(name)
		if err != nil {
			return err
		}
		if s.Site == nil {
			return errors.New("site: the scenario has no site block: add the obstacles, the suspension height and the load's size to check clearances")
		}
		res, err := plan.Make(s)
		if err != nil {
			return err
		}
		sp, err := clearance.PlanSite(s, res, clearance.Options{})
		if err != nil {
			return err
		}
		if asJSON {
			return writeJSON(stdout, sp)
		}
		fmt.Fprintf(stdout, "%s\n%s\n", s.Name, name)
		for _, x := range append(sp.Words, sp.Messages...) {
			fmt.Fprintf(stdout, "  %s\n", x)
		}
		tw := tabwriter.NewWriter(stdout, 0, 0, 2, ' ', 0)
		fmt.Fprintf(tw, "  option\tmove time\tclears\tworst obstacle\tkeeps the margin in\n")
		for _, o := range sp.Options {
			state, share := "not checked: "+o.Skipped, ""
			if o.Checked {
				state = map[bool]string{true: "yes", false: "NO"}[o.Clears]
				share = fmt.Sprintf("%.0f %%", 100*o.ShareKeepMargin)
			}
			fmt.Fprintf(tw, "  %s\t%.1f s\t%s\t%s\t%s\n", o.Label, o.MoveTimeS, state, o.Worst, share)
		}
		tw.Flush()
		fmt.Fprintln(stdout)
		return nil
	})
}
