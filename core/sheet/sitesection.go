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
// in the length unit shown. Empty when the report has no section.
func SiteSectionScreen(sec *clearance.Section, u units.Choice, widthPx float64) string {
	if sec == nil || len(sec.Nominal) == 0 {
		return ""
	}
	l := siteScreen()
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
	pw, ph := W-l.left-l.right, 170.0
	H := l.top + ph + l.bottom
	kx, kz := pw/(d1-d0), ph/z1
	px := func(d float64) float64 { return l.left + (d-d0)*kx }
	py := func(z float64) float64 { return l.top + ph - z*kz }
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %g %g" width="%g" height="%g" class="site-svg" role="img" aria-label="Vertical section along the crane’s path">`, W, H, W, H)
	fmt.Fprintf(&b, `<defs><pattern id="section-hatch" width="%g" height="%g" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="%g" height="%g" fill="none" class="zone-bg"/><line x1="0" y1="0" x2="0" y2="%g" stroke="#000" stroke-width="%g" class="zone-line"/></pattern></defs>`,
		l.hatch, l.hatch, l.hatch, l.hatch, l.hatch, l.hatch/4.5)
	xt, xs := ticks(d0*f, d1*f, max(3, int(math.Round(pw/64))), true)
	zt, zs := ticks(0, z1*f, 4, true)
	for _, t := range zt {
		y := py(t / f)
		fmt.Fprintf(&b, `<line x1="%g" x2="%g" y1="%.2f" y2="%.2f" stroke="#ccc" stroke-width="1" class="grid"/>`, l.left, l.left+pw, y, y)
		fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="%g" text-anchor="end" class="tick">%s</text>`, l.left-l.tick/3, y+l.tick*0.35, l.tick, tickText(t, zs))
	}
	for _, t := range xt {
		fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="%g" text-anchor="middle" class="tick">%s</text>`, px(t/f), l.top+ph+l.tick*1.15, l.tick, tickText(t, xs))
	}
	for _, e := range []struct {
		b     clearance.SectionBand
		paint string
		cls   string
	}{{sec.Envelope95, `fill="url(#section-hatch)"`, "env95"}, {sec.Envelope50, `fill="#999" fill-opacity="0.5"`, "env50"}} {
		var d strings.Builder
		for i := range e.b.DistM {
			if i < len(e.b.LowM) && i < len(e.b.HighM) && finite(e.b.LowM[i]) && finite(e.b.HighM[i]) {
				fmt.Fprintf(&d, "M%.2f %.2fH%.2fV%.2fH%.2fz", px(e.b.DistM[i]), py(e.b.HighM[i]), px(e.b.DistM[i]+e.b.BinM), py(e.b.LowM[i]), px(e.b.DistM[i]))
			}
		}
		fmt.Fprintf(&b, `<path d="%s" %s class="%s"/>`, d.String(), e.paint, e.cls)
	}
	for _, o := range sec.Obstacles {
		fmt.Fprintf(&b, `<rect x="%.2f" y="%.2f" width="%.2f" height="%.2f" fill="#000" class="obstacle-side"><title>%s</title></rect>`,
			px(o.FromM), py(o.TopM), math.Max((o.ToM-o.FromM)*kx, 2), o.TopM*kz, escapeHTML(o.Name))
	}
	for _, c := range []struct {
		cls, dash string
		z         func(clearance.SectionPoint) float64
	}{{"load-path", "", func(p clearance.SectionPoint) float64 { return p.LowM }}, {"crane-path", ` stroke-dasharray="6 4"`, func(p clearance.SectionPoint) float64 { return p.HookM }}} {
		var d strings.Builder
		for i, p := range sec.Nominal {
			fmt.Fprintf(&d, "%c%.2f %.2f", "LM"[b2i(i == 0)], px(p.DistanceM), py(c.z(p)))
		}
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000" stroke-width="2"%s class="%s"/>`, d.String(), c.dash, c.cls)
	}
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%g" height="%g" fill="none" stroke="#000" stroke-width="1" class="frame"/>`, l.left, l.top, pw, ph)
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" text-anchor="middle" class="axis-label">along the path (%s)</text>`, l.left+pw/2, H-l.axis*0.3, l.axis, escapeHTML(sym))
	ax := l.axis * 1.05
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" text-anchor="middle" transform="rotate(-90 %g %g)" class="axis-label">height (%s)</text>`, ax, l.top+ph/2, l.axis, ax, l.top+ph/2, escapeHTML(sym))
	b.WriteString(`</svg>`)
	return b.String()
}
