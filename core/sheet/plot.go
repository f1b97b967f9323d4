package sheet

import (
	"math"
	"strings"

	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// Plot is a line chart to draw with the sheet's plotter: the page can
// have the same SVG as the paper through the bridge call "plot". Values
// are as they are to be shown (already in the display units).
type Plot struct {
	Title  string `json:"title"`
	XLabel string `json:"x_label"`
	YLabel string `json:"y_label"`
	Series []struct {
		X []float64 `json:"x"`
		Y []float64 `json:"y"`
		// Name is the legend's word; Dash an SVG dash pattern ("4 2.5"),
		// empty for a solid line; Width the line width (default 1.2).
		Name  string  `json:"name"`
		Dash  string  `json:"dash"`
		Width float64 `json:"width"`
	} `json:"series"`
	// Lines are horizontal reference lines (a limit), each labelled.
	Lines []struct {
		Y    float64 `json:"y"`
		Text string  `json:"text"`
	} `json:"lines"`
}

// SVG draws the plot in black on white (lines told apart by dash and
// width), as on the check sheet. Every text in it is escaped.
func (p *Plot) SVG() string {
	ss := make([]series, len(p.Series))
	for i, s := range p.Series {
		w := s.Width
		if w <= 0 {
			w = 1.2
		}
		ss[i] = series{X: s.X, Y: s.Y, Dash: dashOnly(s.Dash), Width: w, Name: s.Name}
	}
	hs := make([]hline, len(p.Lines))
	for i, l := range p.Lines {
		hs[i] = hline{Y: l.Y, Text: l.Text}
	}
	return chart(p.Title, p.XLabel, p.YLabel, ss, hs)
}

// dashOnly keeps a dash pattern of numbers, spaces and commas; anything
// else (it is written into an attribute) gives a solid line.
func dashOnly(d string) string {
	for _, c := range d {
		if !(c >= '0' && c <= '9' || c == '.' || c == ' ' || c == ',') {
			return ""
		}
	}
	return d
}

// swingOutPlot draws how far the load swings out from under the point the
// rope hangs from, along the crane's path (ahead +, behind -) and across
// it, against the distance the crane has moved along its path (against
// time when the crane does not move). Seen from above, a straight travel
// is one line with the load on it; this shows the swing itself.
func swingOutPlot(h *sway.History, u units.Choice) (markup, string) {
	n := len(h.TimeS)
	if n == 0 || len(h.SuspensionXM) < n || len(h.LoadXM) < n {
		return markup(chart("Load swing-out", "", "", nil, nil)), ""
	}
	dist := make([]float64, n)
	along := make([]float64, n)
	across := make([]float64, n)
	dx, dy := 1.0, 0.0 // direction of travel; x until the crane moves
	for i := 1; i < n; i++ {
		ex, ey := h.SuspensionXM[i]-h.SuspensionXM[i-1], h.SuspensionYM[i]-h.SuspensionYM[i-1]
		step := math.Hypot(ex, ey)
		dist[i] = dist[i-1] + step
		if step > 1e-9 {
			dx, dy = ex/step, ey/step
			if i == 1 || dist[i-1] == 0 {
				for j := 0; j < i; j++ { // the start takes the first direction
					along[j], across[j] = rel(h, j, dx, dy)
				}
			}
		}
		along[i], across[i] = rel(h, i, dx, dy)
	}
	if n == 1 || dist[n-1] == 0 {
		along[0], across[0] = rel(h, 0, dx, dy)
	}
	show := func(xs []float64) []float64 {
		out := make([]float64, len(xs))
		for i, x := range xs {
			out[i], _ = u.Show("length", x)
		}
		return out
	}
	_, ls := u.Show("length", 1)
	xs, xl := show(dist), "crane's travel along its path, "+ls
	caption := "Solid: ahead (+) or behind (−) the point the rope hangs from, along the crane's path. Dashed: to the side. The swing at the stop shows as a vertical stroke at the end."
	if dist[n-1] < 1e-6 {
		xs, xl = h.TimeS, "time, s"
		caption = "The crane does not move: swing-out against time. Solid: along x. Dashed: along y."
	}
	ss := []series{{X: xs, Y: show(along), Width: 1.3, Name: "along the path"}}
	big := 0.0
	for _, a := range across {
		big = math.Max(big, math.Abs(a))
	}
	if big > 1e-4 {
		ss = append(ss, series{X: xs, Y: show(across), Dash: "4 2.5", Width: 1, Name: "to the side"})
	} else {
		caption = strings.Replace(caption, " Dashed: to the side.", " It does not swing to the side.", 1)
	}
	return markup(chart("Load swing-out from under the rope's top point", xl, "swing-out, "+ls, ss, nil)), caption
}

// rel is the load's offset from the suspension point at sample i, along
// the direction (dx, dy) and across it (to the left).
func rel(h *sway.History, i int, dx, dy float64) (float64, float64) {
	ox, oy := h.LoadXM[i]-h.SuspensionXM[i], h.LoadYM[i]-h.SuspensionYM[i]
	return ox*dx + oy*dy, -ox*dy + oy*dx
}
