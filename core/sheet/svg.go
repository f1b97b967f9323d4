package sheet

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// The one plotter of the project: the check sheet's plots and, through the
// bridge call "plot", every chart on the page. It draws a Plot (plot.go)
// as SVG in one of two layouts: on paper (Plot.WidthPx 0) a 360 by 122
// viewBox scaled to the sheet's column, text 8 to 10 units, the title
// inside; on screen the viewBox is as wide as the chart is shown, in CSS
// px, so its text is drawn at its own size (14 to 15 px, never under 12)
// however wide the screen. Lines are told apart by dash pattern and width,
// black on white, so a chart reads in black and white; on screen each
// part also carries a class (line s1, grid, tick, limit, band, ...) that
// the page's style sheet may colour.

// layout is the geometry and text sizes of one chart, in viewBox units.
type layout struct {
	w, h                     float64
	left, right, top, bottom float64
	title, tick, axis, small float64 // font sizes: title, tick labels, axis labels, legend and notes
	line, grid, frame        float64 // stroke widths
	limitDash                string
	screen                   bool
}

// paperLayout is the sheet's: 360 by 122 units, scaled to its column.
func paperLayout() layout {
	return layout{w: 360, h: 122, left: 44, right: 8, top: 4, bottom: 30, // top: 18 with the title
		title: 10, tick: 8.5, axis: 9, small: 8, line: 1, grid: 0.4, frame: 0.8, limitDash: "2 2"}
}

// screenLayout is the page's: w CSS px wide (clamped to 200 to 2000), so
// a unit of the viewBox is a pixel on screen.
func screenLayout(w float64) layout {
	if !(w >= 200) {
		w = 200
	}
	w = math.Min(math.Round(w), 2000)
	return layout{w: w, h: 300, left: 72, right: 16, top: 12, bottom: 56,
		title: 16, tick: 14, axis: 15, small: 14, line: 2, grid: 1, frame: 1.5, limitDash: "10 6", screen: true}
}

// charWidth is an estimate of the width of one character of text of
// size f (a proportional font's average).
func charWidth(f float64) float64 { return 0.62 * f }

// legendItem is one entry of the legend and where it starts.
type legendItem struct {
	s    *PlotSeries
	i    int // its place among the series
	x, y float64
}

// draw writes the plot's SVG in the layout.
func (p *Plot) draw(l layout) string {
	id := safeID(p.ID)
	var b strings.Builder
	cls := func(c string) string {
		if !l.screen || c == "" {
			return ""
		}
		return ` class="` + c + `"`
	}
	if p.Title != "" && !p.TitleAbove {
		l.top += l.title + 4
		if l.screen {
			l.h += l.title + 4
		}
	}
	// The legend: inside the plot at its top when it fits in one row
	// and LegendTop is not asked for; else in rows above the plot.
	var legend []legendItem
	if len(p.Series) > 1 {
		rowH, x, row := l.small*1.6, l.left+6, 0
		for i := range p.Series {
			w := 3*l.small + 4 + charWidth(l.small)*float64(len([]rune(p.Series[i].Name))) // line, gap, text, a space
			if i > 0 && x+w > l.w-l.right {
				x, row = l.left+6, row+1
			}
			legend = append(legend, legendItem{s: &p.Series[i], i: i, x: x, y: float64(row)})
			x += w
		}
		rows := float64(row + 1)
		if row == 0 && !p.LegendTop {
			legend[0].y, rows = -1, 0 // inside
		}
		for i := range legend {
			if rows == 0 {
				legend[i].y = l.top + l.small
			} else {
				legend[i].y = l.top + rowH*(legend[i].y+0.5)
			}
		}
		l.top += rowH * rows
		l.h += rowH * rows
	}
	pw, ph := l.w-l.left-l.right, l.h-l.top-l.bottom
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %g %g"%s role="img" aria-label="%s">`, l.w, l.h, cls("chart"), escapeHTML(p.Title))
	if p.Title != "" && !p.TitleAbove {
		fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" font-weight="bold"%s>%s</text>`, l.left, l.title+1, l.title, cls("title"), escapeHTML(p.Title))
	}
	xr, yr, ok := p.ranges(pw, ph)
	if !ok {
		fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g">no data</text></svg>`, l.left, l.top+ph/2, l.axis)
		return b.String()
	}
	px := func(x float64) float64 { return l.left + (x-xr.lo)/(xr.hi-xr.lo)*pw }
	py := func(y float64) float64 { return l.top + (yr.hi-y)/(yr.hi-yr.lo)*ph }
	fmt.Fprintf(&b, `<defs><clipPath id="%s-clip"><rect x="%g" y="%g" width="%g" height="%g"/></clipPath>`, id, l.left, l.top, pw, ph)
	if len(p.Bands) > 0 {
		s := 2 * l.small / 3 // the hatching's spacing
		fmt.Fprintf(&b, `<pattern id="%s-hatch" width="%g" height="%g" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">`+
			`<rect width="%g" height="%g" fill="#fff"%s/><line x1="0" y1="0" x2="0" y2="%g" stroke="#999" stroke-width="%g"%s/></pattern>`,
			id, s, s, s, s, cls("band-bg"), s, l.line, cls("band-line"))
	}
	b.WriteString(`</defs>`)
	for _, band := range p.Bands {
		if !finite(band.X0) || !finite(band.X1) {
			continue
		}
		x0, x1 := math.Max(px(math.Min(band.X0, band.X1)), l.left), math.Min(px(math.Max(band.X0, band.X1)), l.left+pw)
		if x1-x0 < 0.5 {
			continue
		}
		fmt.Fprintf(&b, `<rect x="%.1f" y="%g" width="%.1f" height="%g" fill="url(#%s-hatch)" opacity="0.75"%s/>`, x0, l.top, x1-x0, ph, id, cls("band"))
		if band.Text != "" {
			fmt.Fprintf(&b, `<text x="%.1f" y="%g" font-size="%g" font-weight="bold" text-anchor="middle"%s>%s</text>`,
				(x0+x1)/2, l.top+l.small, l.small, cls("band-text"), escapeHTML(band.Text))
		}
	}
	nx := 6
	if l.screen {
		nx = max(3, int(math.Round(pw/64)))
		if p.Equal {
			nx = max(3, int(math.Round(pw/80)))
		}
	}
	xt, xs := ticks(xr.lo, xr.hi, nx, p.Equal)
	yt, ys := ticks(yr.lo, yr.hi, 5, p.Equal)
	for _, t := range xt {
		x := px(t)
		fmt.Fprintf(&b, `<line x1="%.2f" y1="%g" x2="%.2f" y2="%g" stroke="#bbb" stroke-width="%g"%s/>`, x, l.top, x, l.top+ph, l.grid, cls("grid"))
		fmt.Fprintf(&b, `<text x="%.2f" y="%g" font-size="%g" text-anchor="middle"%s>%s</text>`, x, l.top+ph+1.2*l.tick, l.tick, cls("tick"), tickText(t, xs))
	}
	for _, t := range yt {
		y := py(t)
		fmt.Fprintf(&b, `<line x1="%g" y1="%.2f" x2="%g" y2="%.2f" stroke="#bbb" stroke-width="%g"%s/>`, l.left, y, l.left+pw, y, l.grid, cls("grid"))
		fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="%g" text-anchor="end"%s>%s</text>`, l.left-l.tick/3, y+l.tick*0.35, l.tick, cls("tick"), tickText(t, ys))
	}
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%g" height="%g" fill="none" stroke="#000" stroke-width="%g"%s/>`, l.left, l.top, pw, ph, l.frame, cls("frame"))
	fmt.Fprintf(&b, `<g clip-path="url(#%s-clip)">`, id)
	for _, c := range p.Circles {
		if !finite(c.R) || c.R <= 0 {
			continue
		}
		fmt.Fprintf(&b, `<ellipse cx="%.2f" cy="%.2f" rx="%.2f" ry="%.2f" fill="none" stroke="#000" stroke-width="%g" stroke-dasharray="%s"%s/>`,
			px(0), py(0), px(c.R)-px(0), py(0)-py(c.R), l.line, l.limitDash, cls("limit"))
	}
	for _, h := range p.Lines {
		if !finite(h.Y) {
			continue
		}
		y := py(h.Y)
		fmt.Fprintf(&b, `<line x1="%g" y1="%.2f" x2="%g" y2="%.2f" stroke="#000" stroke-width="%g" stroke-dasharray="%s"%s/>`, l.left, y, l.left+pw, y, l.line, l.limitDash, cls("limit"))
	}
	for i := range p.Series {
		s := &p.Series[i]
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000"%s stroke-linejoin="round"%s/>`, s.path(px, py), s.stroke(l, i, len(p.Series)), cls("line "+s.class(i)))
	}
	b.WriteString(`</g>`)
	for _, h := range p.Lines {
		if !finite(h.Y) || h.Text == "" {
			continue
		}
		y := py(h.Y) - l.small/3 // above the line, or below it near the top
		if y-l.small < l.top {
			y = py(h.Y) + l.small
		}
		fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="%g" font-weight="bold" text-anchor="end"%s>%s</text>`, l.left+pw-l.small/3, y, l.small, cls("limit-text"), escapeHTML(h.Text))
	}
	for _, c := range p.Circles {
		if !finite(c.R) || c.R <= 0 || c.Text == "" {
			continue
		}
		fmt.Fprintf(&b, `<text x="%.2f" y="%.2f" font-size="%g" font-weight="bold" text-anchor="middle"%s>%s</text>`, px(0), py(c.R)-l.small/3, l.small, cls("limit-text"), escapeHTML(c.Text))
	}
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" text-anchor="middle"%s>%s</text>`, l.left+pw/2, l.h-l.axis*0.45, l.axis, cls("axis-label"), escapeHTML(p.XLabel))
	ax := l.axis * 1.1
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g" text-anchor="middle" transform="rotate(-90 %g %g)"%s>%s</text>`, ax, l.top+ph/2, l.axis, ax, l.top+ph/2, cls("axis-label"), escapeHTML(p.YLabel))
	for _, it := range legend {
		fmt.Fprintf(&b, `<line x1="%g" y1="%g" x2="%g" y2="%g" stroke="#000"%s%s/>`, it.x, it.y, it.x+2*l.small, it.y, it.s.stroke(l, it.i, len(p.Series)), cls("line "+it.s.class(it.i)))
		fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="%g"%s>%s</text>`, it.x+2*l.small+4, it.y+0.35*l.small, l.small, cls("legend"), escapeHTML(it.s.Name))
	}
	b.WriteString(`</svg>`)
	return b.String()
}

// span is a range of values along one axis.
type span struct{ lo, hi float64 }

func (s *span) add(v float64) {
	if finite(v) {
		s.lo, s.hi = math.Min(s.lo, v), math.Max(s.hi, v)
	}
}

// ranges are the values the axes cover: every finite point, the limit
// lines, circles around the origin, 0 when the y axis starts from zero.
// Plain axes end on ticks; equal axes (a plan view, one unit as long on
// both) are padded by 4 % and the shorter widened to the plot's shape.
// ok is false with no finite point.
func (p *Plot) ranges(pw, ph float64) (xr, yr span, ok bool) {
	xr, yr = span{math.Inf(1), math.Inf(-1)}, span{math.Inf(1), math.Inf(-1)}
	for _, s := range p.Series {
		for i := range s.X {
			if i < len(s.Y) && finite(s.X[i]) && finite(s.Y[i]) {
				xr.add(s.X[i])
				yr.add(s.Y[i])
			}
		}
	}
	if !finite(xr.lo) {
		return xr, yr, false
	}
	for _, h := range p.Lines {
		yr.add(h.Y)
	}
	for _, c := range p.Circles {
		if finite(c.R) && c.R > 0 {
			xr.add(-c.R)
			xr.add(c.R)
			yr.add(-c.R)
			yr.add(c.R)
		}
	}
	if p.YFromZero {
		yr.add(0)
	}
	for _, r := range []*span{&xr, &yr} {
		if d := r.hi - r.lo; d < 1e-9*math.Max(1, math.Abs(r.lo)) {
			c := (r.lo + r.hi) / 2
			w := math.Max(math.Abs(c)*0.1, 0.5)
			r.lo, r.hi = c-w, c+w
			if p.YFromZero && r == &yr && c >= 0 && c-w < 0 {
				r.lo, r.hi = 0, c+w
			}
		}
	}
	if !p.Equal {
		for _, r := range []*span{&xr, &yr} {
			t, _ := ticks(r.lo, r.hi, 5, false)
			r.lo, r.hi = math.Min(r.lo, t[0]), math.Max(r.hi, t[len(t)-1])
		}
		return xr, yr, true
	}
	pad := 0.04 * math.Max(xr.hi-xr.lo, yr.hi-yr.lo)
	xr.lo, xr.hi, yr.lo, yr.hi = xr.lo-pad, xr.hi+pad, yr.lo-pad, yr.hi+pad
	scale := math.Min(pw/(xr.hi-xr.lo), ph/(yr.hi-yr.lo)) // px per unit, the same on both
	cx, cy := (xr.lo+xr.hi)/2, (yr.lo+yr.hi)/2
	xr = span{cx - pw/scale/2, cx + pw/scale/2}
	yr = span{cy - ph/scale/2, cy + ph/scale/2}
	return xr, yr, true
}

// path is the series' SVG path in the plot's coordinates; a point that is
// not finite breaks the line. Each point is "M" or "L" and its coordinates
// with two decimals, as fmt's "%c%.2f %.2f" writes them (strconv's 'f'
// format, which fmt uses for %.2f; written directly, as fmt took two
// thirds of the chart's drawing; TestPathAsFmt).
func (s *PlotSeries) path(px, py func(float64) float64) string {
	var d strings.Builder
	var num [40]byte
	pen := false
	for i := range s.X {
		if i >= len(s.Y) || !finite(s.X[i]) || !finite(s.Y[i]) {
			pen = false
			continue
		}
		c := byte('L')
		if !pen {
			c = 'M'
		}
		d.WriteByte(c)
		d.Write(strconv.AppendFloat(num[:0], px(s.X[i]), 'f', 2, 64))
		d.WriteByte(' ')
		d.Write(strconv.AppendFloat(num[:0], py(s.Y[i]), 'f', 2, 64))
		pen = true
	}
	return d.String()
}

// dashes are the dash patterns of series without one of their own, by
// their class s1 to s6 (by default their place: the first solid), when a
// chart has more than one; the page's style sheet gives those classes
// the same.
var dashes = []string{"", "7 5", "2 4", "12 4 2 4", "", "16 6"}

// stroke is the width and dash attributes of series i of n in the layout
// (on screen twice the paper's width).
func (s *PlotSeries) stroke(l layout, i, n int) string {
	w := s.Width
	if !(w > 0 && w <= 10) {
		w = 1.2
	}
	out := fmt.Sprintf(` stroke-width="%g"`, w*l.line)
	d := dashOnly(s.Dash)
	if s.Dash == "" && n > 1 {
		k, ok := classNumber(s.class(i))
		if !ok || k < 1 {
			k = i + 1
		}
		d = dashes[(k+len(dashes)-1)%len(dashes)]
	}
	if d != "" {
		out += ` stroke-dasharray="` + d + `"`
	}
	return out
}

// class is the series' class on screen: its own when it is a plain word,
// else s1 to s6 by its place.
func (s *PlotSeries) class(i int) string {
	if s.Class != "" && safeID(s.Class) == s.Class {
		return s.Class
	}
	return fmt.Sprintf("s%d", i%6+1)
}

// safeID keeps letters, digits, - and _ of an id (it is written into
// attributes and url(#...)); empty gives "plot".
func safeID(id string) string {
	var b strings.Builder
	for _, c := range id {
		if c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '-' || c == '_' {
			b.WriteRune(c)
		}
	}
	if b.Len() == 0 || b.Len() > 40 {
		return "plot"
	}
	return b.String()
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// ticks gives round tick values (1, 2, 2.5 or 5 times a power of ten
// apart, about n over [lo, hi]) and their step: covering [lo, hi] (from
// the last tick at or below lo to the first at or above hi), or, inside,
// only those within it.
func ticks(lo, hi float64, n int, inside bool) ([]float64, float64) {
	span := hi - lo
	if !(span > 0) || !finite(span) || n < 1 {
		return []float64{lo}, 1
	}
	raw := span / float64(n)
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	step := mag
	for _, m := range []float64{1, 2, 2.5, 5, 10} {
		if m*mag >= raw {
			step = m * mag
			break
		}
	}
	start := math.Floor(lo/step) * step
	if inside {
		start = math.Ceil(lo/step-1e-9) * step
	}
	end := hi + step*0.5
	if inside {
		end = hi + step*1e-9
	}
	var out []float64
	for k := 0; k < 50; k++ {
		t := start + float64(k)*step
		if t > end {
			break
		}
		out = append(out, t)
	}
	if len(out) < 2 && !inside {
		out = append(out, start+step)
	}
	return out, step
}

// tickText writes a tick value with the decimals its step needs, and a
// minus sign (U+2212) for negatives.
func tickText(v, step float64) string {
	if math.Abs(v) < step*1e-9 {
		v = 0
	}
	dec := 0
	if step < 1 {
		dec = int(math.Ceil(-math.Log10(step) - 1e-9))
		if step*math.Pow(10, float64(dec)) != math.Round(step*math.Pow(10, float64(dec))) {
			dec++
		}
	}
	return strings.Replace(fmt.Sprintf("%.*f", dec, v), "-", "−", 1)
}
