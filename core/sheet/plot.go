package sheet

import (
	"math"
	"strings"

	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// Plot is a line chart for the project's one plotter (svg.go): the check
// sheet's plots, and every chart of the page through the bridge call
// "plot". Values are as they are to be shown (already in the display
// units); the plotter converts nothing.
type Plot struct {
	// ID names the chart's clip path and hatching (letters, digits, -
	// and _; "plot" otherwise): unique among the charts of one document.
	ID     string       `json:"id,omitempty"`
	Title  string       `json:"title"`
	XLabel string       `json:"x_label"`
	YLabel string       `json:"y_label"`
	Series []PlotSeries `json:"series"`
	// Lines are horizontal reference lines (a limit), each labelled.
	Lines []PlotLine `json:"lines,omitempty"`
	// Bands are hatched spans of x (a move speeding up or braking, a
	// range), each labelled at its top.
	Bands []PlotBand `json:"bands,omitempty"`
	// Circles are dashed circles around the origin (an allowed
	// excursion seen from above).
	Circles []PlotCircle `json:"circles,omitempty"`
	// Equal draws one unit as long on both axes (a plan view).
	Equal bool `json:"equal,omitempty"`
	// YFromZero keeps 0 on the y axis.
	YFromZero bool `json:"y_from_zero,omitempty"`
	// LegendTop puts the legend in rows above the plot, off the lines
	// (it goes there anyway when it does not fit in one row).
	LegendTop bool `json:"legend_top,omitempty"`
	// WidthPx is the width the chart is shown at on screen, CSS px (200
	// to 2000): the viewBox is that wide, so its text is drawn at its
	// own size (14 to 15 px) at any screen width. 0: the paper layout.
	WidthPx float64 `json:"width_px,omitempty"`
	// TitleAbove leaves the title out of the drawing (it stays its
	// accessible name): the page sets it above as text that wraps.
	TitleAbove bool `json:"title_above,omitempty"`
}

// PlotSeries is one line of a chart.
type PlotSeries struct {
	X []float64 `json:"x"`
	Y []float64 `json:"y"`
	// Name is the legend's word; Dash an SVG dash pattern ("4 2.5"),
	// empty (or anything but numbers) for a solid line; Width the line
	// width on paper (default 1.2; twice that on screen); Class the
	// page's class for it (s1 to s6 by its place when empty).
	Name  string  `json:"name"`
	Dash  string  `json:"dash,omitempty"`
	Width float64 `json:"width,omitempty"`
	Class string  `json:"class,omitempty"`
}

// PlotLine is a horizontal reference line at Y.
type PlotLine struct {
	Y    float64 `json:"y"`
	Text string  `json:"text"`
}

// PlotBand is a hatched span of x from X0 to X1.
type PlotBand struct {
	X0   float64 `json:"x0"`
	X1   float64 `json:"x1"`
	Text string  `json:"text,omitempty"`
}

// PlotCircle is a dashed circle of radius R around the origin.
type PlotCircle struct {
	R    float64 `json:"r"`
	Text string  `json:"text,omitempty"`
}

// SVG draws the plot, black on white (lines told apart by dash and
// width): on paper, or on screen when WidthPx is set. Every text in it is
// escaped; no number in it is NaN.
func (p *Plot) SVG() string {
	if p.WidthPx != 0 {
		return p.draw(screenLayout(p.WidthPx))
	}
	return p.draw(paperLayout())
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
		return markup((&Plot{ID: "sheet-swing", Title: "Load swing-out"}).SVG()), ""
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
	ss := []PlotSeries{{X: xs, Y: show(along), Width: 1.3, Name: "along the path"}}
	big := 0.0
	for _, a := range across {
		big = math.Max(big, math.Abs(a))
	}
	if big > 1e-4 {
		ss = append(ss, PlotSeries{X: xs, Y: show(across), Dash: "4 2.5", Width: 1, Name: "to the side"})
	} else {
		caption = strings.Replace(caption, " Dashed: to the side.", " It does not swing to the side.", 1)
	}
	return markup((&Plot{ID: "sheet-swing", Title: "Load swing-out from under the rope's top point", XLabel: xl, YLabel: "swing-out, " + ls, Series: ss}).SVG()), caption
}

// rel is the load's offset from the suspension point at sample i, along
// the direction (dx, dy) and across it (to the left).
func rel(h *sway.History, i int, dx, dy float64) (float64, float64) {
	ox, oy := h.LoadXM[i]-h.SuspensionXM[i], h.LoadYM[i]-h.SuspensionYM[i]
	return ox*dx + oy*dy, -ox*dy + oy*dx
}
