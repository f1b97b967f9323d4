package sheet

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
