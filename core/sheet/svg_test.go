package sheet

import (
	"encoding/xml"
	"fmt"
	"math"
	"os"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// demoPlots are one of each chart the page and the sheet draw.
func demoPlots() map[string]*Plot {
	t := make([]float64, 101)
	y := make([]float64, 101)
	cx, cy := make([]float64, 101), make([]float64, 101)
	for i := range t {
		t[i] = 0.2 * float64(i)
		y[i] = 2 * math.Abs(math.Sin(t[i]))
		cx[i], cy[i] = 0.3*math.Cos(t[i]), 0.1*math.Sin(t[i])
	}
	return map[string]*Plot{
		"bands": {ID: "angle", Title: "Rope angle", XLabel: "time (s)", YLabel: "rope angle (deg)", YFromZero: true,
			Series: []PlotSeries{{X: t, Y: y, Name: "rope angle", Class: "s1"}},
			Bands:  []PlotBand{{X0: 0, X1: 2, Text: "A1"}, {X0: 8, X1: 10, Text: "B1"}},
			Lines:  []PlotLine{{Y: 2.5, Text: "limit 2.5 deg"}}},
		"equal": {ID: "rel", Title: "Seen from above", XLabel: "x (m)", YLabel: "y (m)", Equal: true,
			Series:  []PlotSeries{{X: cx, Y: cy, Name: "load"}},
			Circles: []PlotCircle{{R: 0.5, Text: "allowed"}}},
		"legend": {ID: "plan-ramp", Title: "Residual", XLabel: "ramp (s)", YLabel: "residual (deg)", LegendTop: true, YFromZero: true,
			Series: []PlotSeries{{X: t, Y: y, Name: "rope 8.00 m"}, {X: t, Y: cy, Name: "rope 9.50 m"}, {X: t, Y: cx, Name: "rope 11.00 m"},
				{X: t, Y: cx, Name: "rope 12.00 m"}, {X: t, Y: cx, Name: "rope 14.00 m"}}},
		"flat": {Title: "Flat", Series: []PlotSeries{{X: []float64{0, 1}, Y: []float64{3, 3}}}},
	}
}

var number = regexp.MustCompile(`\s(?:x|y|x1|x2|y1|y2|cx|cy|rx|ry|width|height|font-size|stroke-width)="([^"]*)"`)

// checkSVG: well-formed XML with an svg root, no script, no NaN or
// infinity in any number, every text at least minText units.
func checkSVG(t *testing.T, name, svg string, minText float64) {
	t.Helper()
	if !strings.HasPrefix(svg, "<svg") || strings.Contains(svg, "<script") {
		t.Errorf("%s: not a plain svg: %.80s", name, svg)
	}
	if strings.Contains(svg, "NaN") || strings.Contains(svg, "Inf") {
		t.Errorf("%s: NaN or Inf in %s", name, svg)
	}
	d := xml.NewDecoder(strings.NewReader(svg))
	for {
		tok, err := d.Token()
		if err != nil {
			if err.Error() != "EOF" {
				t.Errorf("%s: not well-formed: %v", name, err)
			}
			break
		}
		if se, ok := tok.(xml.StartElement); ok && se.Name.Local == "text" {
			for _, a := range se.Attr {
				if a.Name.Local == "font-size" {
					if f, _ := strconv.ParseFloat(a.Value, 64); f < minText {
						t.Errorf("%s: text of %g units", name, f)
					}
				}
			}
		}
	}
	for _, m := range number.FindAllStringSubmatch(svg, -1) {
		if _, err := strconv.ParseFloat(m[1], 64); err != nil {
			t.Errorf("%s: %q is not a number", name, m[0])
		}
	}
}

// On screen the viewBox is the width shown, so text is drawn at its own
// size: at least 12 px at a phone's 300 px and at 640 px.
func TestPlotOnScreen(t *testing.T) {
	for name, p := range demoPlots() {
		for _, w := range []float64{300, 640} {
			p.WidthPx = w
			p.TitleAbove = true
			svg := p.SVG()
			checkSVG(t, name, svg, 12)
			if !strings.Contains(svg, `viewBox="0 0 `+strconv.FormatFloat(w, 'g', -1, 64)+` `) || !strings.Contains(svg, `class="chart"`) {
				t.Errorf("%s at %g px: %.120s", name, w, svg)
			}
			if strings.Contains(svg, `class="title"`) {
				t.Errorf("%s: the title is drawn although it is above", name)
			}
		}
	}
	ps := demoPlots()
	if svg := ps["bands"].SVG(); strings.Count(svg, `fill="url(#angle-hatch)"`) != 2 || !strings.Contains(svg, ">A1<") || !strings.Contains(svg, "limit 2.5 deg") {
		t.Error("bands or limit line missing")
	}
	// Every legend entry above the plot, in more than one row at 300 px.
	p := ps["legend"]
	p.WidthPx = 300
	svg := p.SVG()
	if strings.Count(svg, `class="legend"`) != 5 {
		t.Error("legend entries missing")
	}
	m := regexp.MustCompile(`<rect x="72" y="([0-9.]+)"`).FindStringSubmatch(svg)
	if m == nil {
		t.Fatal("no plot frame")
	}
	if top, _ := strconv.ParseFloat(m[1], 64); top < 12+2*14*1.6 {
		t.Errorf("the plot starts at %g, above two rows of legend", top)
	}
}

// Equal axes: one unit as long on both; the limit circle is a circle.
func TestPlotEqualAxes(t *testing.T) {
	p := demoPlots()["equal"]
	p.WidthPx = 340
	svg := p.SVG()
	m := regexp.MustCompile(`<ellipse cx="[^"]+" cy="[^"]+" rx="([^"]+)" ry="([^"]+)"`).FindStringSubmatch(svg)
	if m == nil {
		t.Fatal("no limit circle")
	}
	rx, _ := strconv.ParseFloat(m[1], 64)
	ry, _ := strconv.ParseFloat(m[2], 64)
	if rx <= 0 || math.Abs(rx-ry) > 0.02 {
		t.Errorf("circle drawn %g by %g", rx, ry)
	}
	if !strings.Contains(svg, ">allowed<") {
		t.Error("circle label missing")
	}
}

// On paper the layout is the sheet's (360 units wide), title inside.
func TestPlotOnPaper(t *testing.T) {
	for name, p := range demoPlots() {
		svg := p.SVG()
		checkSVG(t, name, svg, 8)
		if !strings.Contains(svg, `viewBox="0 0 360 `) || strings.Contains(svg, "class=") {
			t.Errorf("%s: not the paper layout: %.120s", name, svg)
		}
	}
	empty := (&Plot{Title: "x", Series: []PlotSeries{{X: []float64{math.NaN()}, Y: []float64{1}}}}).SVG()
	if !strings.Contains(empty, "no data") {
		t.Error("no finite point: want 'no data'")
	}
}

// Text, ids, classes and dash patterns from the input never become markup.
func TestPlotEscapes(t *testing.T) {
	p := &Plot{ID: `x"><script>`, Title: "<b>t</b>", XLabel: "&", Series: []PlotSeries{
		{X: []float64{0, 1}, Y: []float64{0, 1}, Name: "<i>", Dash: `1" onload="x`, Class: `s1" onclick="y`},
		{X: []float64{0, 1}, Y: []float64{1, math.Inf(1)}, Name: "b"}},
		Bands: []PlotBand{{X0: 0, X1: 0.5, Text: "<u>"}}, Lines: []PlotLine{{Y: 0.5, Text: "<s>"}}, WidthPx: math.NaN()}
	svg := p.SVG()
	checkSVG(t, "hostile", svg, 12)
	for _, bad := range []string{"<script", "<b>", "<i>", "<u>", "<s>", "onload", "onclick"} {
		if strings.Contains(svg, bad) {
			t.Errorf("%q in %s", bad, svg)
		}
	}
}

// SWAYSHEET_PLOTS=DIR writes the demo charts as SVG files to look at.
func TestWritePlots(t *testing.T) {
	dir := os.Getenv("SWAYSHEET_PLOTS")
	if dir == "" {
		t.Skip("set SWAYSHEET_PLOTS=DIR to write the demo charts")
	}
	for name, p := range demoPlots() {
		os.WriteFile(dir+"/paper-"+name+".svg", []byte(p.SVG()), 0o644)
		p.WidthPx = 340
		os.WriteFile(dir+"/screen-"+name+".svg", []byte(p.SVG()), 0o644)
	}
}

// TestPathAsFmt: a series' path is written as fmt's "%c%.2f %.2f" writes
// each point, for every kind of coordinate the scales can give (negative
// zero, halves that round, large, infinite, not a number).
func TestPathAsFmt(t *testing.T) {
	xs := []float64{0, math.Copysign(0, -1), -0.004, 0.005, 0.015, 1.005, -2.675, 123456.789, -1e300, 1e-320,
		math.Inf(1), math.Inf(-1), math.NaN(), 640, 319.999, -0.0049999}
	s := &PlotSeries{X: xs, Y: xs}
	for _, f := range []func(float64) float64{
		func(v float64) float64 { return v },
		func(v float64) float64 { return 1e308 * v },
		func(v float64) float64 { return -v / 3 },
	} {
		var want strings.Builder
		pen := false
		for i := range xs {
			if !finite(xs[i]) {
				pen = false
				continue
			}
			c := 'L'
			if !pen {
				c = 'M'
			}
			fmt.Fprintf(&want, "%c%.2f %.2f", c, f(xs[i]), f(xs[i]))
			pen = true
		}
		if got := s.path(f, f); got != want.String() {
			t.Errorf("path\n got %s\nwant %s", got, want.String())
		}
	}
}
