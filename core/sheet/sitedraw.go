package sheet

import (
	"fmt"
	"math"
	"strings"

	"swaysheet/core/clearance"
	"swaysheet/core/units"
)

// The site plan from above, drawn for the check sheet (paper) and, through
// the bridge call "site_plot", for the page (screen): one drawing.
//
// Seen from above, x to the right and y up, one metre as long on both
// axes. A point (x, y) in metres is drawn at
//
//	px = (x - Frame.XM) / Frame.MPerPx,  py = (Frame.YM - y) / Frame.MPerPx
//
// in the drawing's units (CSS px on screen); the page maps a pointer back
// with the inverse, x = XM + px*MPerPx, y = YM - py*MPerPx, and nothing
// else.

// SiteFrame is the plan's coordinate transform: the metres at the
// drawing's top left corner, the metres per unit of the drawing, and the
// drawing's size in its units.
type SiteFrame struct {
	XM       float64 `json:"x_m"`
	YM       float64 `json:"y_m"`
	MPerPx   float64 `json:"m_per_px"`
	WidthPx  float64 `json:"width_px"`
	HeightPx float64 `json:"height_px"`
}

// SitePlanInput is what the plan draws: the site, the clearance report
// (nil: the obstacles alone), the crane's path (the suspension point's,
// optional) and the load's path to draw without a report.
type SitePlanInput struct {
	Site   *clearance.Site
	Report *clearance.Report
	Crane  []clearance.Point2
	Load   []clearance.Point2
	Units  units.Choice
	// Screen: WidthPx is the width shown (CSS px), MaxHeightPx the
	// tallest the plan may be (260 to 640 px by default), Selected the
	// obstacle drawn selected (-1: none). Frame, given, is kept (the plan
	// does not move under a finger dragging an obstacle).
	WidthPx, MaxHeightPx float64
	Selected             int
	Frame                *SiteFrame
}

// siteLayout is the plan's margins and text sizes in one of its two
// layouts.
type siteLayout struct {
	screen                   bool
	left, right, top, bottom float64
	tick, axis, label        float64 // font sizes
	hatch                    float64 // spacing of the exclusion zone's hatching
	pad                      float64 // share of the extent added around it
}

func sitePaper() siteLayout {
	return siteLayout{left: 34, right: 6, top: 10, bottom: 22, tick: 8, axis: 8.5, label: 7, hatch: 5}
}

// siteScreen: text 14 to 15 px at the width shown, never under 12.
func siteScreen() siteLayout {
	return siteLayout{screen: true, left: 58, right: 10, top: 10, bottom: 46, tick: 14, axis: 15, label: 14, hatch: 8, pad: 0.06}
}

// SitePlanScreen draws the plan for the page: the SVG and its frame.
func SitePlanScreen(in SitePlanInput) (string, SiteFrame) {
	return drawSitePlan(in, siteScreen())
}

// sitePlanPaper draws the plan for the check sheet (a 400 unit wide
// viewBox scaled to its column).
func sitePlanPaper(in SitePlanInput) string {
	svg, _ := drawSitePlan(in, sitePaper())
	return svg
}

// extent is the box the plan shows: every obstacle with its margin, the
// 95 % envelope and the paths; ok false with none.
func (in *SitePlanInput) extent() (lo, hi clearance.Point2, ok bool) {
	lo, hi = clearance.Point2{X: math.Inf(1), Y: math.Inf(1)}, clearance.Point2{X: math.Inf(-1), Y: math.Inf(-1)}
	grow := func(x, y float64) {
		if finite(x) && finite(y) {
			lo.X, lo.Y, hi.X, hi.Y = math.Min(lo.X, x), math.Min(lo.Y, y), math.Max(hi.X, x), math.Max(hi.Y, y)
		}
	}
	m := in.Site.MarginM
	if in.Report != nil {
		m = in.Report.MarginM
		for _, sp := range in.Report.Envelope95.Spans {
			grow(sp.X0M, sp.Y0M)
			grow(sp.X1M, sp.Y1M)
		}
	}
	for _, o := range in.Site.Obstacles {
		for _, p := range o.Outline {
			grow(p.X-m, p.Y-m)
			grow(p.X+m, p.Y+m)
		}
	}
	for _, ps := range [][]clearance.Point2{in.nominal(), in.Crane} {
		for _, p := range ps {
			grow(p.X, p.Y)
		}
	}
	return lo, hi, finite(lo.X)
}

// nominal is the load's path drawn: the report's, else the one given.
func (in *SitePlanInput) nominal() []clearance.Point2 {
	if in.Report != nil && len(in.Report.Nominal) > 0 {
		return in.Report.Nominal
	}
	return in.Load
}

// frame fits the extent into the layout: on paper 360 units wide and at
// most 170 high; on screen the width shown and at most MaxHeightPx high,
// the plan centred across when its height limits it.
func (in *SitePlanInput) frame(l siteLayout) (SiteFrame, bool) {
	if f := in.Frame; l.screen && f != nil && f.MPerPx > 0 && finite(f.MPerPx) && finite(f.XM) && finite(f.YM) &&
		f.WidthPx >= 200 && f.WidthPx <= 2000 && f.HeightPx >= 40 && f.HeightPx <= 2000 {
		return *f, true
	}
	lo, hi, ok := in.extent()
	if !ok {
		if !l.screen {
			return SiteFrame{}, false
		}
		lo, hi = clearance.Point2{X: -5, Y: -5}, clearance.Point2{X: 5, Y: 5}
	}
	if l.pad > 0 {
		p := l.pad*math.Max(hi.X-lo.X, hi.Y-lo.Y) + 0.5
		lo, hi = clearance.Point2{X: lo.X - p, Y: lo.Y - p}, clearance.Point2{X: hi.X + p, Y: hi.Y + p}
	}
	dx, dy := math.Max(hi.X-lo.X, 1e-3), math.Max(hi.Y-lo.Y, 1e-3)
	pw, maxH, minW := 360.0, 170.0, 160.0
	if l.screen {
		w := in.WidthPx
		if !(w >= 200) {
			w = 200
		}
		pw = math.Min(math.Round(w), 2000) - l.left - l.right
		maxH = in.MaxHeightPx
		if !(maxH >= 260) {
			maxH = 260
		}
		maxH, minW = math.Min(maxH, 640), pw
	}
	k := pw / dx
	ph := dy * k
	if ph > maxH {
		ph = maxH
		k = ph / dy
		pw = math.Max(dx*k, minW)
	}
	ph = math.Max(ph, 40)
	x0 := lo.X - (pw/k-dx)/2 // centred across
	return SiteFrame{XM: x0 - l.left/k, YM: lo.Y + (ph+l.top)/k, MPerPx: 1 / k,
		WidthPx: l.left + pw + l.right, HeightPx: l.top + ph + l.bottom}, true
}

// cls is a class attribute on screen (the page's style sheet colours
// the parts), nothing on paper.
func (l siteLayout) cls(c string) string {
	if !l.screen {
		return ""
	}
	return ` class="` + c + `"`
}

// drawSitePlan draws the site from above: the exclusion zone hatched, the
// 50 % envelope grey over it, the margin as a band around each obstacle
// (a stroke twice the margin wide, round at the corners: the area within
// the margin of the outline), the obstacles black with their names and
// tops, the load's path with no spread (solid) and the crane's (dashed).
// x and y in the length unit shown, equal scales.
func drawSitePlan(in SitePlanInput, l siteLayout) (string, SiteFrame) {
	fr, ok := in.frame(l)
	if !ok {
		return "", fr
	}
	f, sym := in.Units.Show("length", 1)
	k := 1 / fr.MPerPx
	px := func(x float64) float64 { return (x - fr.XM) * k }
	py := func(y float64) float64 { return (fr.YM - y) * k }
	W, H := fr.WidthPx, fr.HeightPx
	pw, ph := W-l.left-l.right, H-l.top-l.bottom
	hatch := "sw-hatch"
	var b strings.Builder
	size := ""
	if l.screen {
		hatch, size = "site-hatch", fmt.Sprintf(` width="%.0f" height="%.0f"`, W, H)
	}
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %.1f %.1f"%s%s role="img" aria-label="Site plan from above with the envelopes and the exclusion zone">`, W, H, size, l.cls("site-svg"))
	fmt.Fprintf(&b, `<defs><pattern id="%s" width="%g" height="%g" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="%g" height="%g" fill="none"%s/><line x1="0" y1="0" x2="0" y2="%g" stroke="#000" stroke-width="%g"%s/></pattern>`+
		`<clipPath id="%s-clip"><rect x="%g" y="%g" width="%.2f" height="%.2f"/></clipPath></defs>`,
		hatch, l.hatch, l.hatch, l.hatch, l.hatch, l.cls("zone-bg"), l.hatch, l.hatch/4.5, l.cls("zone-line"), hatch, l.left, l.top, pw, ph)
	if l.screen {
		in.grid(&b, l, px, py, fr, f)
	}
	fmt.Fprintf(&b, `<g clip-path="url(#%s-clip)">`, hatch)
	if rep := in.Report; rep != nil {
		spans := func(es []clearance.Span, paint, c string) {
			var d strings.Builder
			for _, sp := range es {
				fmt.Fprintf(&d, "M%.2f %.2fH%.2fV%.2fH%.2fz", px(sp.X0M), py(sp.Y1M), px(sp.X1M), py(sp.Y0M), px(sp.X0M))
			}
			fmt.Fprintf(&b, `<path d="%s" %s shape-rendering="crispEdges"%s/>`, d.String(), paint, l.cls(c))
		}
		spans(rep.Envelope95.Spans, `fill="url(#`+hatch+`)"`, "env95")
		spans(rep.Envelope50.Spans, `fill="#999" fill-opacity="0.5"`, "env50")
	}
	line := func(ps []clearance.Point2) string {
		var d strings.Builder
		for i, p := range ps {
			if finite(p.X) && finite(p.Y) {
				fmt.Fprintf(&d, "%c%.2f %.2f", "LM"[b2i(i == 0)], px(p.X), py(p.Y))
			}
		}
		return d.String()
	}
	if len(in.Crane) > 0 {
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000" stroke-width="%g" stroke-dasharray="6 4"%s/>`, line(in.Crane), l.axis/10, l.cls("crane-path"))
	}
	if ps := in.nominal(); len(ps) > 0 {
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000" stroke-width="%g"%s/>`, line(ps), l.axis/7, l.cls("load-path"))
	}
	margin := in.Site.MarginM
	if in.Report != nil {
		margin = in.Report.MarginM
	}
	for i, o := range in.Site.Obstacles {
		d := line(o.Outline) + "z"
		if margin > 0 {
			fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#999" stroke-opacity="0.6" stroke-width="%.2f" stroke-linejoin="round"%s/>`, d, 2*margin*k, l.cls("margin"))
		}
		if l.screen { // the touch target: the outline and a band 24 px wide around it
			fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="none" stroke-width="48" class="ob-hit" data-ob="%d"/>`, d, i)
		}
	}
	for i, o := range in.Site.Obstacles {
		d := line(o.Outline) + "z"
		if !l.screen {
			fmt.Fprintf(&b, `<path d="%s" fill="#000"/>`, d)
			continue
		}
		sel := ""
		if i == in.Selected {
			sel = " selected"
		}
		fmt.Fprintf(&b, `<path d="%s" fill="#000" class="obstacle%s" data-ob="%d"><title>%s</title></path>`, d, sel, i, escapeHTML(nameOf(o, i)))
	}
	b.WriteString(`</g>`)
	in.labels(&b, l, px, py, pw, sym)
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%.2f" height="%.2f" fill="none" stroke="#000" stroke-width="%g"%s/>`, l.left, l.top, pw, ph, l.axis/14, l.cls("frame"))
	in.tickLabels(&b, l, px, py, fr, f)
	fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="%g" text-anchor="middle"%s>x (%s)</text>`, l.left+pw/2, H-l.axis*0.3, l.axis, l.cls("axis-label"), escapeHTML(sym))
	ax := l.axis * 1.05
	fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="%g" text-anchor="middle" transform="rotate(-90 %g %.2f)"%s>y (%s)</text>`, ax, l.top+ph/2, l.axis, ax, l.top+ph/2, l.cls("axis-label"), escapeHTML(sym))
	b.WriteString(`</svg>`)
	return b.String(), fr
}

func b2i(v bool) int {
	if v {
		return 1
	}
	return 0
}

// labels writes each obstacle's name and top above it, or below it when
// that place is taken by an earlier label: on screen the names only when
// there is room (else the tops, and the name of the one selected; the
// names are on the obstacles' cards).
func (in *SitePlanInput) labels(b *strings.Builder, l siteLayout, px, py func(float64) float64, pw float64, sym string) {
	roomy := !l.screen || pw/math.Max(1, float64(len(in.Site.Obstacles))) > 170
	type box struct{ x0, x1, y float64 }
	var placed []box
	free := func(c box) bool {
		for _, p := range placed {
			if c.x0 < p.x1 && p.x0 < c.x1 && math.Abs(c.y-p.y) < l.label*1.1 {
				return false
			}
		}
		return true
	}
	for i, o := range in.Site.Obstacles {
		cx, hy, ly := 0.0, math.Inf(-1), math.Inf(1)
		for _, p := range o.Outline {
			cx += p.X / float64(len(o.Outline))
			hy, ly = math.Max(hy, p.Y), math.Min(ly, p.Y)
		}
		top, _ := in.Units.Show("length", o.TopM)
		text := "top " + Num(top, 3) + " " + sym
		if roomy || i == in.Selected {
			text = nameOf(o, i) + ", " + text
		}
		half := charWidth(l.label) * float64(len([]rune(text))) / 2
		x := math.Min(math.Max(px(cx), l.left+half), l.left+pw-half)
		c := box{x - half, x + half, math.Max(py(hy)-l.label*0.4, l.top+l.label)}
		for _, y := range []float64{py(ly) + l.label*1.1, c.y - l.label*1.2, py(ly) + l.label*2.3} {
			if free(c) {
				break
			}
			c.y = y
		}
		placed = append(placed, c)
		fmt.Fprintf(b, `<text x="%.2f" y="%.2f" font-size="%g" font-weight="bold" text-anchor="middle" paint-order="stroke" stroke="#fff" stroke-width="%g"%s>%s</text>`,
			x, c.y, l.label, l.label/3, l.cls("ob-label"), escapeHTML(text))
	}
}

// grid draws the screen's grid lines at the ticks.
func (in *SitePlanInput) grid(b *strings.Builder, l siteLayout, px, py func(float64) float64, fr SiteFrame, f float64) {
	xt, yt, _, _ := in.ticksOf(l, fr, f)
	for _, t := range xt {
		x := px(t / f)
		fmt.Fprintf(b, `<line x1="%.2f" x2="%.2f" y1="%g" y2="%.2f" stroke="#ccc" stroke-width="1" class="grid"/>`, x, x, l.top, fr.HeightPx-l.bottom)
	}
	for _, t := range yt {
		y := py(t / f)
		fmt.Fprintf(b, `<line x1="%g" x2="%.2f" y1="%.2f" y2="%.2f" stroke="#ccc" stroke-width="1" class="grid"/>`, l.left, fr.WidthPx-l.right, y, y)
	}
}

// ticksOf are the round values of the length unit shown (f metres each)
// inside the plot: about one per 80 px across and 60 px up on screen.
func (in *SitePlanInput) ticksOf(l siteLayout, fr SiteFrame, f float64) (xt, yt []float64, xs, ys float64) {
	pw, ph := fr.WidthPx-l.left-l.right, fr.HeightPx-l.top-l.bottom
	x0, x1 := fr.XM+l.left*fr.MPerPx, fr.XM+(l.left+pw)*fr.MPerPx
	y0, y1 := fr.YM-(l.top+ph)*fr.MPerPx, fr.YM-l.top*fr.MPerPx
	nx, ny := 6, 4
	if l.screen {
		nx, ny = max(3, int(math.Round(pw/64))), max(3, int(math.Round(ph/50)))
	}
	xt, xs = ticks(x0*f, x1*f, nx, true)
	yt, ys = ticks(y0*f, y1*f, ny, true)
	return xt, yt, xs, ys
}

// tickLabels writes the ticks' values below and left of the plot.
func (in *SitePlanInput) tickLabels(b *strings.Builder, l siteLayout, px, py func(float64) float64, fr SiteFrame, f float64) {
	xt, yt, xs, ys := in.ticksOf(l, fr, f)
	ph := fr.HeightPx - l.top - l.bottom
	for _, t := range xt {
		fmt.Fprintf(b, `<text x="%.2f" y="%.2f" font-size="%g" text-anchor="middle"%s>%s</text>`, px(t/f), l.top+ph+l.tick*1.15, l.tick, l.cls("tick"), tickText(t, xs))
	}
	for _, t := range yt {
		fmt.Fprintf(b, `<text x="%g" y="%.2f" font-size="%g" text-anchor="end"%s>%s</text>`, l.left-l.tick/3, py(t/f)+l.tick*0.35, l.tick, l.cls("tick"), tickText(t, ys))
	}
}

// nameOf is an obstacle's name, or its place.
func nameOf(o clearance.Obstacle, i int) string {
	if o.Name != "" {
		return o.Name
	}
	return fmt.Sprintf("obstacle %d", i+1)
}
