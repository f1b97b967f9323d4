package sheet

import (
	"fmt"
	"math"
	"strings"

	"swaysheet/core/clearance"
	"swaysheet/core/units"
)

// SiteSectionScreen draws the clearance report's vertical section along
// the crane's path for the page, widthPx CSS px wide (the site plan's
// screen layout: text 14 to 15 px): the bands the load's lowest point
// stays in (95 % of runs hatched, half of them grey), its lowest point
// with no spread (solid) and the hook's (dashed), and the obstacles the
// path passes with their tops; distance along the path across, height up,
// in the length unit shown. Empty when the report has no section, or the
// crane does not travel (no path to take it along).
func SiteSectionScreen(sec *clearance.Section, u units.Choice, widthPx float64) string {
	return drawSiteSection(sec, u, widthPx, siteScreen(), 170)
}

// siteSectionPaper draws the same section for the check sheet: the plan's
// paper layout, a 400 unit wide viewBox scaled to its column, each
// obstacle named above its side.
func siteSectionPaper(sec *clearance.Section, u units.Choice) string {
	return drawSiteSection(sec, u, 400, sitePaper(), 48)
}

// drawSiteSection draws the section in layout l, widthPx wide with a plot
// ph high.
func drawSiteSection(sec *clearance.Section, u units.Choice, widthPx float64, l siteLayout, ph float64) string {
	if sec == nil || len(sec.Nominal) == 0 || !(sec.PathLengthM > 0) {
		return "" // no crane path to take a section along
	}
	f, sym := u.Show("length", 1)
	d0, d1, z1 := math.Inf(1), math.Inf(-1), sec.SuspensionHeightM
	grow := func(d float64) {
		if finite(d) {
			d0, d1 = math.Min(d0, d), math.Max(d1, d)
		}
	}
	for _, p := range sec.Nominal {
		grow(p.DistanceM)
	}
	for _, b := range []clearance.SectionBand{sec.Envelope95, sec.Envelope50} {
		for _, d := range b.DistM {
			grow(d)
			grow(d + b.BinM)
		}
	}
	for _, o := range sec.Obstacles {
		grow(o.FromM)
		grow(o.ToM)
		z1 = math.Max(z1, o.TopM)
	}
	if !finite(d0) {
		return ""
	}
	if !(d1 > d0) {
		d1 = d0 + 1
	}
	if !(z1 > 0) || !finite(z1) {
		z1 = 1
	}
	z1 *= 1.05
	if !(widthPx >= 200) {
		widthPx = 200
	}
	W := math.Min(math.Round(widthPx), 2000)
	pw := W - l.left - l.right
	H := l.top + ph + l.bottom
	kx, kz := pw/(d1-d0), ph/z1
	px := func(d float64) float64 { return l.left + (d-d0)*kx }
	py := func(z float64) float64 { return l.top + ph - z*kz }
	var b strings.Builder
	hatch, size := "sw-section-hatch", ""
	if l.screen {
		hatch, size = "section-hatch", fmt.Sprintf(` width="%g" height="%g"`, W, H)
	}
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %g %g"%s%s role="img" aria-label="Vertical section along the crane’s path">`, W, H, size, l.cls("site-svg"))
	fmt.Fprintf(&b, `<defs><pattern id="%s" width="%g" height="%g" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="%g" height="%g" fill="none"%s/><line x1="0" y1="0" x2="0" y2="%g" stroke="#000" stroke-width="%g"%s/></pattern></defs>`,
		hatch, l.hatch, l.hatch, l.hatch, l.hatch, l.cls("zone-bg"), l.hatch, l.hatch/4.5, l.cls("zone-line"))
	thin := 1.0 // lines: 1 px on screen, half a unit on paper
	if !l.screen {
		thin = 0.6
	}
	xt, xs := ticks(d0*f, d1*f, max(3, int(math.Round(pw/64))), true)
	zt, zs := ticks(0, z1*f, 4, true)
	for _, t := range zt {
		y := py(t / f)
		fmt.Fprintf(&b, `<line x1="%g" x2="%g" y1="%.2f" y2="%.2f" stroke="#ccc" stroke-width="%g"%s/>`, l.left, l.left+pw, y, y, thin, l.cls("grid"))
		fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="%g" text-anchor="end"%s>%s</text>`, l.left-l.tick/3, y+l.tick*0.35, l.tick, l.cls("tick"), tickText(t, zs))
	}
	for _, t := range xt {
		fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="%g" text-anchor="middle"%s>%s</text>`, px(t/f), l.top+ph+l.tick*1.15, l.tick, l.cls("tick"), tickText(t, xs))
	}
	for _, e := range []struct {
		b     clearance.SectionBand
		paint string
		cls   string
	}{{sec.Envelope95, `fill="url(#` + hatch + `)"`, "env95"}, {sec.Envelope50, `fill="#999" fill-opacity="0.5"`, "env50"}} {
		var d strings.Builder
		for i := range e.b.DistM {
			if i < len(e.b.LowM) && i < len(e.b.HighM) && finite(e.b.LowM[i]) && finite(e.b.HighM[i]) {
				fmt.Fprintf(&d, "M%.2f %.2fH%.2fV%.2fH%.2fz", px(e.b.DistM[i]), py(e.b.HighM[i]), px(e.b.DistM[i]+e.b.BinM), py(e.b.LowM[i]), px(e.b.DistM[i]))
			}
		}
		fmt.Fprintf(&b, `<path d="%s" %s%s/>`, d.String(), e.paint, l.cls(e.cls))
	}
	for _, o := range sec.Obstacles {
		fmt.Fprintf(&b, `<rect x="%.2f" y="%.2f" width="%.2f" height="%.2f" fill="#000"%s><title>%s</title></rect>`,
			px(o.FromM), py(o.TopM), math.Max((o.ToM-o.FromM)*kx, 2), o.TopM*kz, l.cls("obstacle-side"), escapeHTML(o.Name))
	}
	for _, c := range []struct {
		cls, dash string
		z         func(clearance.SectionPoint) float64
	}{{"load-path", "", func(p clearance.SectionPoint) float64 { return p.LowM }}, {"crane-path", ` stroke-dasharray="6 4"`, func(p clearance.SectionPoint) float64 { return p.HookM }}} {
		var d strings.Builder
		for i, p := range sec.Nominal {
			fmt.Fprintf(&d, "%c%.2f %.2f", "LM"[b2i(i == 0)], px(p.DistanceM), py(c.z(p)))
		}
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000" stroke-width="%g"%s%s/>`, d.String(), 2*thin, c.dash, l.cls(c.cls))
	}
	if !l.screen {
		sectionNames(&b, sec, l, px, py)
	}
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%g" height="%g" fill="none" stroke="#000" stroke-width="%g"%s/>`, l.left, l.top, pw, ph, thin, l.cls("frame"))
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" text-anchor="middle"%s>along the path (%s)</text>`, l.left+pw/2, H-l.axis*0.3, l.axis, l.cls("axis-label"), escapeHTML(sym))
	ax := l.axis * 1.05
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" text-anchor="middle" transform="rotate(-90 %g %g)"%s>height (%s)</text>`, ax, l.top+ph/2, l.axis, ax, l.top+ph/2, l.cls("axis-label"), escapeHTML(sym))
	b.WriteString(`</svg>`)
	return b.String()
}

// sectionNames writes each obstacle's name over its side on paper, in a
// second row above when the first is taken there.
func sectionNames(b *strings.Builder, sec *clearance.Section, l siteLayout, px, py func(float64) float64) {
	var ends [2]float64
	ends[0], ends[1] = math.Inf(-1), math.Inf(-1)
	for _, o := range sec.Obstacles {
		x := (px(o.FromM) + px(o.ToM)) / 2
		w := float64(len([]rune(o.Name))) * l.label * 0.55
		row := 0
		if x-w/2 < ends[0] {
			row = 1
		}
		if row == 1 && x-w/2 < ends[1] {
			continue // no room: the plan and the table name it
		}
		ends[row] = x + w/2 + l.label*0.4
		y := py(o.TopM) - l.label*0.35 - float64(row)*l.label*1.05
		fmt.Fprintf(b, `<text x="%.2f" y="%.2f" font-size="%g" text-anchor="middle" stroke="#fff" stroke-width="%g" paint-order="stroke">%s</text>`,
			x, math.Max(y, l.top+l.label*0.9), l.label, l.label/4, escapeHTML(o.Name))
	}
}
