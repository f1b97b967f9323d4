package sheet

import (
	"fmt"
	"strings"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// siteView is the sheet's clearance section: the clearance check's
// verdict, a plan of the site from above with the envelopes, and each
// obstacle's figures, all from the report it is given (the bridge's kept
// report, or the command line's own check): the sheet runs no check.
type siteView struct {
	Err     string
	Clears  bool
	Words   []string
	Plan    markup
	Caption string
	// Section is the vertical section along the path (empty without
	// one); Caption then says both drawings.
	Section markup
	Rows    [][]string // obstacle, top, keeps the margin, 95 % keep, smallest (at), room under
	Spread  string
}

func siteSection(s *scenario.Scenario, rep *clearance.Report, err string, u units.Choice) *siteView {
	if s.Site == nil {
		return nil
	}
	v := &siteView{}
	if rep == nil {
		v.Err = err
		if v.Err == "" {
			v.Err = "the clearance check has not been run for these inputs"
		}
		return v
	}
	v.Clears, v.Words = rep.Clears, rep.Words
	if len(rep.WordSentences) == len(rep.Words) {
		v.Words = words.FormatAll(rep.WordSentences, u)
	}
	length := func(m float64) string {
		x, sym := u.Show("length", m)
		return Num(x, 3) + " " + sym
	}
	for i, o := range rep.Obstacles {
		top := ""
		if i < len(s.Site.Obstacles) && s.Site.Obstacles[i].TopM != nil {
			top = length(*s.Site.Obstacles[i].TopM)
		}
		keeps := fmt.Sprintf("%d of %d", o.KeepMargin, o.Runs)
		if o.Strikes > 0 {
			keeps += fmt.Sprintf("; struck in %d, first %s s by %s", o.Strikes, Num(o.FirstStrikeS, 3), clearance.StruckBy(o.FirstStrikeBy, o.FirstStrikeLine))
		}
		under := "not passed over"
		if vt := o.Vertical; vt != nil {
			under = length(vt.SmallestM) + " at " + length(vt.AtDistanceM) + " along"
		}
		v.Rows = append(v.Rows, []string{o.Name, top, keeps, length(o.ClearanceP5M),
			length(o.SmallestM) + " at " + Num(o.SmallestAtS, 3) + " s, " + length(o.SmallestAtDistanceM) + " along", under})
	}
	e := rep.Envelope95
	v.Spread = fmt.Sprintf("%d runs, seed %d; margin %s. The exclusion zone holds %d of the runs: %.0f %% sure to hold 95 %% of all runs.",
		rep.Runs, rep.Seed, length(rep.MarginM), e.Inside, 100*e.Confidence)
	v.Plan = markup(sitePlanPaper(SitePlanInput{Site: clearance.SiteOf(s.Site), Report: rep, Units: u, Selected: -1}))
	v.Section = markup(siteSectionPaper(&rep.Section, u))
	v.Caption = "Seen from above. Hatched: the exclusion zone (95 % of runs): nobody stands here during the lift. Grey: where the load stays in half the runs. Solid line: the load's path with no spread. Black: obstacles, with their top heights; grey band: the margin around them."
	if v.Section != "" {
		v.Caption = "Left, from above: hatched, the exclusion zone (95 % of runs): nobody stands here during the lift; grey, half the runs; solid, the load with no spread; black, obstacles with their tops, the margin grey around. " +
			"Right, from the side along the path: the load's lowest point (hatched 95 % of runs, grey half, solid no spread), the hook dashed, the obstacles passed black to their tops."
	}
	return v
}

// site writes the clearance section.
func (h *htmlWriter) site(v *siteView) {
	h.raw("<section class=\"sw-site\">\n<h2>Clearances along the path</h2>\n")
	if v.Err != "" {
		h.el("p", "", "Not checked: "+v.Err+".")
		h.raw("</section>\n")
		return
	}
	cls, sym := "sw-verdict sw-clr-ok", "&#x2714; "
	if !v.Clears {
		cls, sym = "sw-verdict sw-clr-bad", "&#x2716; DOES NOT CLEAR: "
	}
	h.raw(`<p class="` + cls + `">` + sym)
	h.t(strings.Join(v.Words, " "))
	// With a section: the plan and the section side by side, the table
	// under both at the full width (a line an obstacle); without, the
	// plan beside the table.
	h.raw("</p>\n")
	if v.Section != "" {
		h.raw("<figure class=\"sw-site-figs\"><div class=\"sw-site-grid\">")
		h.m(v.Plan)
		h.m(v.Section)
		h.raw("</div>")
		h.el("figcaption", "", v.Caption+" Spreads used: "+v.Spread)
		h.raw("</figure>\n")
		h.siteTable(v, false)
	} else {
		h.raw("<div class=\"sw-site-grid sw-site-beside\">\n<figure>")
		h.m(v.Plan)
		h.el("figcaption", "", v.Caption)
		h.raw("</figure>\n<div>\n")
		h.siteTable(v, true)
		h.raw("</div>\n</div>\n")
	}
	h.raw("</section>\n")
}

// siteTable writes each obstacle's row, and the spreads used when asked.
func (h *htmlWriter) siteTable(v *siteView, spreads bool) {
	h.raw("<table class=\"sw-t sw-clr\"><thead><tr><th>obstacle</th><th>top</th><th>keeps the margin</th><th>95 % of runs keep</th><th>smallest</th><th>room under the load over it</th></tr></thead><tbody>\n")
	for _, r := range v.Rows {
		h.raw("<tr>")
		for i, c := range r {
			if i == 0 {
				h.el("th", "", c)
			} else {
				h.el("td", "", c)
			}
		}
		h.raw("</tr>\n")
	}
	h.raw("</tbody></table>\n")
	if spreads {
		h.el("p", "sw-small", "Spreads used: "+v.Spread)
	}
}
