package sheet

import (
	"fmt"
	"html"
	"math"
	"strings"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
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
	Rows    [][]string // obstacle, top, keeps the margin, 95 % keep, smallest (at)
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
			keeps += fmt.Sprintf("; strikes in %d, first %s s", o.Strikes, Num(o.FirstStrikeS, 3))
		}
		v.Rows = append(v.Rows, []string{o.Name, top, keeps, length(o.ClearanceP5M),
			length(o.SmallestM) + " at " + Num(o.SmallestAtS, 3) + " s, " + length(o.SmallestAtDistanceM) + " along"})
	}
	e := rep.Envelope95
	v.Spread = fmt.Sprintf("%d runs, seed %d; margin %s. The exclusion zone holds %d of the runs: %.0f %% sure to hold 95 %% of all runs.",
		rep.Runs, rep.Seed, length(rep.MarginM), e.Inside, 100*e.Confidence)
	v.Plan = markup(sitePlanSVG(s, rep, u))
	v.Caption = "Seen from above. Hatched: the exclusion zone (95 % of runs): nobody stands here during the lift. Grey: where the load stays in half the runs. Solid line: the load's path with no spread. Black: obstacles, with their top heights; grey band: the margin around them."
	return v
}

// sitePlanSVG draws the site from above: the exclusion zone hatched, the
// 50 % envelope grey, the margin as a band around each obstacle (a stroke
// twice the margin wide, round at the corners: the area within the margin
// of the outline), the obstacles black with their names and tops, and the
// nominal path. x and y in the length unit shown, equal scales.
func sitePlanSVG(s *scenario.Scenario, rep *clearance.Report, u units.Choice) string {
	f, sym := u.Show("length", 1)
	site := clearance.SiteOf(s.Site)
	lo, hi := [2]float64{math.Inf(1), math.Inf(1)}, [2]float64{math.Inf(-1), math.Inf(-1)}
	grow := func(x, y float64) {
		lo[0], lo[1], hi[0], hi[1] = math.Min(lo[0], x), math.Min(lo[1], y), math.Max(hi[0], x), math.Max(hi[1], y)
	}
	for _, o := range site.Obstacles {
		for _, p := range o.Outline {
			grow(p.X-rep.MarginM, p.Y-rep.MarginM)
			grow(p.X+rep.MarginM, p.Y+rep.MarginM)
		}
	}
	for _, sp := range rep.Envelope95.Spans {
		grow(sp.X0M, sp.Y0M)
		grow(sp.X1M, sp.Y1M)
	}
	for _, p := range rep.Nominal {
		grow(p.X, p.Y)
	}
	if !finite(lo[0]) {
		return ""
	}
	const left, bottom, top = 34.0, 22.0, 10.0
	dx, dy := math.Max(hi[0]-lo[0], 1e-3), math.Max(hi[1]-lo[1], 1e-3)
	pw := 360.0
	k := pw / dx
	ph := dy * k
	if ph > 170 {
		ph = 170
		k = ph / dy
		pw = math.Max(dx*k, 160)
	}
	ph = math.Max(ph, 40)
	W, H := left+pw+6, top+ph+bottom
	px := func(x float64) float64 { return left + (x-lo[0])*k }
	py := func(y float64) float64 { return top + ph - (y-lo[1])*k }
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %.1f %.1f" role="img" aria-label="Site plan from above with the envelopes and the exclusion zone">`, W, H)
	b.WriteString(`<defs><pattern id="sw-hatch" width="5" height="5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="5" stroke="#000" stroke-width="1.1"/></pattern></defs>`)
	spans := func(es []clearance.Span, fill string) {
		var d strings.Builder
		for _, sp := range es {
			fmt.Fprintf(&d, "M%.2f %.2fH%.2fV%.2fH%.2fz", px(sp.X0M), py(sp.Y1M), px(sp.X1M), py(sp.Y0M), px(sp.X0M))
		}
		fmt.Fprintf(&b, `<path d="%s" fill="%s" shape-rendering="crispEdges"/>`, d.String(), fill)
	}
	spans(rep.Envelope50.Spans, "#ccc")
	spans(rep.Envelope95.Spans, "url(#sw-hatch)")
	outline := func(o clearance.Obstacle) string {
		var d strings.Builder
		for i, p := range o.Outline {
			c := 'L'
			if i == 0 {
				c = 'M'
			}
			fmt.Fprintf(&d, "%c%.2f %.2f", c, px(p.X), py(p.Y))
		}
		return d.String() + "z"
	}
	for _, o := range site.Obstacles {
		if rep.MarginM > 0 {
			fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#999" stroke-opacity="0.6" stroke-width="%.2f" stroke-linejoin="round"/>`, outline(o), 2*rep.MarginM*k)
		}
	}
	for _, o := range site.Obstacles {
		fmt.Fprintf(&b, `<path d="%s" fill="#000"/>`, outline(o))
	}
	var d strings.Builder
	for i, p := range rep.Nominal {
		c := 'L'
		if i == 0 {
			c = 'M'
		}
		fmt.Fprintf(&d, "%c%.2f %.2f", c, px(p.X), py(p.Y))
	}
	fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000" stroke-width="1.2"/>`, d.String())
	for _, o := range site.Obstacles {
		cx, cy := 0.0, math.Inf(-1)
		for _, p := range o.Outline {
			cx += p.X / float64(len(o.Outline))
			cy = math.Max(cy, p.Y)
		}
		top, _ := u.Show("length", o.TopM)
		fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="7" text-anchor="middle" paint-order="stroke" stroke="#fff" stroke-width="2.5">%s</text>`,
			px(cx), math.Max(py(cy)-3, 8), html.EscapeString(o.Name+", top "+Num(top, 3)+" "+sym))
	}
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%.2f" height="%.2f" fill="none" stroke="#000" stroke-width="0.6"/>`, left, top, pw, ph)
	xt, xs := ticks(lo[0]*f, hi[0]*f, 6, true)
	for _, t := range xt {
		if x := px(t / f); x >= left-0.5 && x <= left+pw+0.5 {
			fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="8" text-anchor="middle">%s</text>`, x, top+ph+9, tickText(t, xs))
		}
	}
	yt, ys := ticks(lo[1]*f, hi[1]*f, 4, true)
	for _, t := range yt {
		if y := py(t / f); y >= top-0.5 && y <= top+ph+0.5 {
			fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="8" text-anchor="end">%s</text>`, left-3, y+3, tickText(t, ys))
		}
	}
	fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="8.5" text-anchor="middle">x (%s)</text>`, left+pw/2, H-2, html.EscapeString(sym))
	fmt.Fprintf(&b, `<text x="9" y="%.2f" font-size="8.5" text-anchor="middle" transform="rotate(-90 9 %.2f)">y (%s)</text>`, top+ph/2, top+ph/2, html.EscapeString(sym))
	b.WriteString(`</svg>`)
	return b.String()
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
	h.raw("</p>\n<div class=\"sw-site-grid\">\n<figure>")
	h.m(v.Plan)
	h.el("figcaption", "", v.Caption)
	h.raw("</figure>\n<div>\n<table class=\"sw-t sw-clr\"><thead><tr><th>obstacle</th><th>top</th><th>keeps the margin</th><th>95 % of runs keep</th><th>smallest</th></tr></thead><tbody>\n")
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
	h.el("p", "sw-small", "Spreads used: "+v.Spread)
	h.raw("</div>\n</div>\n</section>\n")
}
