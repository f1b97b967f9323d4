package sheet

import (
	"fmt"
	"html"
	"math"
	"strings"
)

// series is one line of a chart; Dash "" is solid.
type series struct {
	X, Y  []float64
	Dash  string
	Width float64
	Name  string
}

// hline is a horizontal reference line.
type hline struct {
	Y    float64
	Text string
}

// chart draws a line chart as SVG in black on white: lines told apart by
// dash pattern and width, not by colour. The width and height are in
// the viewBox's units; the SVG scales to its box on paper.
func chart(title, xlabel, ylabel string, ss []series, hs []hline) string {
	const W, H = 360.0, 122.0
	const left, right, top, bottom = 44.0, 8.0, 18.0, 30.0
	xmin, xmax, ymin, ymax := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, s := range ss {
		for i := range s.X {
			if i >= len(s.Y) || !finite(s.X[i]) || !finite(s.Y[i]) {
				continue
			}
			xmin, xmax = math.Min(xmin, s.X[i]), math.Max(xmax, s.X[i])
			ymin, ymax = math.Min(ymin, s.Y[i]), math.Max(ymax, s.Y[i])
		}
	}
	for _, h := range hs {
		if finite(h.Y) {
			ymin, ymax = math.Min(ymin, h.Y), math.Max(ymax, h.Y)
		}
	}
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %g %g" role="img" aria-label="%s">`, W, H, html.EscapeString(title))
	fmt.Fprintf(&b, `<text x="%g" y="11" font-size="10" font-weight="bold">%s</text>`, left, html.EscapeString(title))
	if !finite(xmin) || !finite(ymin) {
		fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="10">no data</text></svg>`, left, H/2)
		return b.String()
	}
	if ymax-ymin < 1e-9 {
		ymin, ymax = ymin-1, ymax+1
	}
	if xmax-xmin < 1e-9 {
		xmin, xmax = xmin-1, xmax+1
	}
	xt, xs := ticks(xmin, xmax, 6)
	yt, ys := ticks(ymin, ymax, 5)
	xmin, xmax = math.Min(xmin, xt[0]), math.Max(xmax, xt[len(xt)-1])
	ymin, ymax = math.Min(ymin, yt[0]), math.Max(ymax, yt[len(yt)-1])
	pw, ph := W-left-right, H-top-bottom
	px := func(x float64) float64 { return left + (x-xmin)/(xmax-xmin)*pw }
	py := func(y float64) float64 { return top + (ymax-y)/(ymax-ymin)*ph }
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%g" height="%g" fill="none" stroke="#000" stroke-width="0.8"/>`, left, top, pw, ph)
	for _, t := range xt {
		x := px(t)
		fmt.Fprintf(&b, `<line x1="%.2f" y1="%g" x2="%.2f" y2="%g" stroke="#bbb" stroke-width="0.4"/>`, x, top, x, top+ph)
		fmt.Fprintf(&b, `<text x="%.2f" y="%g" font-size="8.5" text-anchor="middle">%s</text>`, x, top+ph+10, tickText(t, xs))
	}
	for _, t := range yt {
		y := py(t)
		fmt.Fprintf(&b, `<line x1="%g" y1="%.2f" x2="%g" y2="%.2f" stroke="#bbb" stroke-width="0.4"/>`, left, y, left+pw, y)
		fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="8.5" text-anchor="end">%s</text>`, left-3, y+3, tickText(t, ys))
	}
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="9" text-anchor="middle">%s</text>`, left+pw/2, H-4, html.EscapeString(xlabel))
	fmt.Fprintf(&b, `<text x="10" y="%g" font-size="9" text-anchor="middle" transform="rotate(-90 10 %g)">%s</text>`, top+ph/2, top+ph/2, html.EscapeString(ylabel))
	for _, h := range hs {
		if !finite(h.Y) {
			continue
		}
		y := py(h.Y)
		fmt.Fprintf(&b, `<line x1="%g" y1="%.2f" x2="%g" y2="%.2f" stroke="#000" stroke-width="0.9" stroke-dasharray="2 2"/>`, left, y, left+pw, y)
		fmt.Fprintf(&b, `<text x="%g" y="%.2f" font-size="8" text-anchor="end">%s</text>`, left+pw-2, y-2, html.EscapeString(h.Text))
	}
	for _, s := range ss {
		var d strings.Builder
		pen := false
		for i := range s.X {
			if i >= len(s.Y) || !finite(s.X[i]) || !finite(s.Y[i]) {
				pen = false
				continue
			}
			c := 'L'
			if !pen {
				c = 'M'
			}
			fmt.Fprintf(&d, "%c%.2f %.2f", c, px(s.X[i]), py(s.Y[i]))
			pen = true
		}
		w := s.Width
		if w == 0 {
			w = 1.2
		}
		dash := ""
		if s.Dash != "" {
			dash = fmt.Sprintf(` stroke-dasharray="%s"`, s.Dash)
		}
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#000" stroke-width="%g"%s stroke-linejoin="round"/>`, d.String(), w, dash)
	}
	// Legend for more than one line: a sample of each line's pattern.
	if len(ss) > 1 {
		x := left + 6
		for _, s := range ss {
			dash := ""
			if s.Dash != "" {
				dash = fmt.Sprintf(` stroke-dasharray="%s"`, s.Dash)
			}
			w := s.Width
			if w == 0 {
				w = 1.2
			}
			fmt.Fprintf(&b, `<line x1="%g" y1="%g" x2="%g" y2="%g" stroke="#000" stroke-width="%g"%s/>`, x, top+8, x+16, top+8, w, dash)
			fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="8">%s</text>`, x+19, top+11, html.EscapeString(s.Name))
			x += 26 + 4.6*float64(len([]rune(s.Name)))
		}
	}
	b.WriteString(`</svg>`)
	return b.String()
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// ticks gives round tick values covering [lo, hi] and their step.
func ticks(lo, hi float64, n int) ([]float64, float64) {
	span := hi - lo
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
	var out []float64
	for t := start; t <= hi+step*0.5 && len(out) < 50; t += step {
		out = append(out, t)
	}
	if len(out) < 2 {
		out = append(out, start+step)
	}
	return out, step
}

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
	return fmt.Sprintf("%.*f", dec, v)
}
