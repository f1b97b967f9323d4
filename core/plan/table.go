package plan

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"swaysheet/core/crane"
)

// WriteTable prints a plan as a ranked table with the crew settings of
// each option, the recommendation and the cautions.
func WriteTable(w io.Writer, r *Result) error {
	var b strings.Builder
	fmt.Fprintf(&b, "%s\n", r.Name)
	k := crane.Linear
	if ax, ok := crane.Of(r.Axis); ok {
		k = ax.Kind
	}
	fmt.Fprintf(&b, "Move %.4g %s on %s, top speed %.3g %s", crane.Pick(k, r.DistanceM, r.AngleDeg), k.Unit, r.Axis,
		crane.Pick(k, r.TopSpeedMPerS, r.TopRateDegPerS), k.SpeedUnit)
	if r.RadiusM > 0 {
		fmt.Fprintf(&b, " at radius %.4g m (outward lean %.2g deg at that speed)", r.RadiusM, r.SlewLeanDeg)
	}
	b.WriteString("\n")
	fmt.Fprintf(&b, "Rope %.4g m (period %.3g s); simulated at %s m; shapers tuned to %.3g s (rope %.4g m)\n",
		r.RopeLengthM, r.PeriodS, floats(r.RopeLengthsM), r.DesignPeriodS, r.DesignRopeM)
	if len(r.ModePeriodsS) == 2 {
		fmt.Fprintf(&b, "Two sway modes %s, %.3g s and %.3g s at the nominal rope; the second carries up to %.0f %% of the load's swing; two-mode shapers tuned to %.3g s and %.3g s\n",
			r.ModesOf, r.ModePeriodsS[0], r.ModePeriodsS[1], 100*r.SecondModeShare, r.DesignPeriodS, r.SecondDesignPeriodS)
	}
	fmt.Fprintf(&b, "Limits: %s\n", limitsText(r.Limits))
	fmt.Fprintf(&b, "Drive: %s; options checked at %s m\n\n", r.Drive, floats(r.CheckedRopeLengthsM))
	for _, m := range r.Infeasible {
		fmt.Fprintf(&b, "NOT FEASIBLE: %s\n", m)
	}
	if len(r.Options) > 0 {
		tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "rank\toption\tmove s\t+s\tpeak deg\tpeak m\tresidual deg\tlimits")
		for i, o := range r.Options {
			mark := "  "
			if i == r.Recommended {
				mark = "=>"
			}
			ok := "within"
			if !o.Within {
				ok = "OUTSIDE: " + strings.Join(o.Outside, "; ")
			}
			fmt.Fprintf(tw, "%s%d\t%s\t%.3g\t%.3g\t%.3g\t%.3g\t%.2g\t%s\n", mark, o.Rank, o.Label, o.MoveTimeS, o.PenaltyS,
				o.WorstPeakSwingDeg, o.WorstPeakExcursionM, o.WorstResidualSwingDeg, ok)
		}
		tw.Flush()
		fmt.Fprintln(&b, "(peak and residual: the worst over the rope lengths simulated; +s: longer than at the drive limits)")
		for _, o := range r.Options {
			if o.Timing != nil {
				fmt.Fprintf(&b, "(%s: the %gth percentile over %d draws of a person's timing, scatter %.3g s)\n", o.Label, o.Timing.Percentile, o.Timing.Draws, o.Timing.SigmaS)
			}
		}
		fmt.Fprintln(&b)
	}
	fmt.Fprintf(&b, "%s\n", r.Reason)
	for _, n := range r.Notes {
		fmt.Fprintf(&b, "Note: %s\n", n)
	}
	for i, o := range r.Options {
		mark := ""
		if i == r.Recommended {
			mark = " (recommended)"
		}
		fmt.Fprintf(&b, "\n%d. %s%s\n", o.Rank, o.Label, mark)
		for _, s := range append(append([]string{}, o.Settings...), o.Findings...) {
			fmt.Fprintf(&b, "   %s\n", s)
		}
		for _, v := range o.Verified {
			rig := ""
			if len(r.ModePeriodsS) == 2 {
				rig = fmt.Sprintf("; rigging to rope up to %.3g deg", v.PeakRiggingAngleDeg)
			}
			exact := ""
			if v.Exact != nil {
				exact = fmt.Sprintf(" (90th percentile; exact timing: peak %.3g deg, residual %.2g deg)", v.Exact.PeakSwingDeg, v.Exact.ResidualSwingDeg)
			}
			fmt.Fprintf(&b, "   rope %.4g m: peak %.3g deg, %.3g m; residual %.2g deg, %.3g m%s%s\n", v.RopeLengthM, v.PeakSwingDeg, v.PeakExcursionM, v.ResidualSwingDeg, v.ResidualExcursionM, rig, exact)
		}
	}
	fmt.Fprintln(&b)
	for _, c := range r.Cautions {
		fmt.Fprintf(&b, "Caution: %s\n", c)
	}
	_, err := io.WriteString(w, b.String())
	return err
}

func floats(xs []float64) string {
	s := make([]string, len(xs))
	for i, x := range xs {
		s[i] = fmt.Sprintf("%.4g", x)
	}
	return strings.Join(s, ", ")
}

func limitsText(l Limits) string {
	var parts []string
	if l.PeakSwingDeg > 0 {
		parts = append(parts, fmt.Sprintf("peak swing %.3g deg", l.PeakSwingDeg))
	}
	if l.PeakExcursionM > 0 {
		parts = append(parts, fmt.Sprintf("peak excursion %.3g m", l.PeakExcursionM))
	}
	if l.ResidualSwingDeg > 0 {
		parts = append(parts, fmt.Sprintf("residual swing %.3g deg", l.ResidualSwingDeg))
	}
	if l.ResidualExcursionM > 0 {
		parts = append(parts, fmt.Sprintf("residual excursion %.3g m", l.ResidualExcursionM))
	}
	return strings.Join(parts, ", ")
}
