package sheet

import (
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"swaysheet/core/clearance"
	"swaysheet/core/units"
)

var fontSize = regexp.MustCompile(`font-size="([^"]*)"`)

// The page's plan and section (screen layout) at a phone's width: text at
// least 12 px as drawn (the viewBox is as wide as shown), every number
// finite, names escaped, each obstacle drawn with its index for the
// page's pointer overlay, and the frame mapping the obstacles' corners
// into the plot; a frame given is kept.
func TestSitePlanScreen(t *testing.T) {
	s := demo(t, "site-bay-columns.json")
	s.Site.Spread.Runs = 20
	s.Site.Obstacles[0].Name = `<b>"C2"</b>`
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	in := SitePlanInput{Site: clearance.SiteOf(s.Site), Report: rep, Units: units.Choice{System: "si"}, WidthPx: 390, Selected: 2}
	svg, fr := SitePlanScreen(in)
	sec := SiteSectionScreen(&rep.Section, in.Units, 390)
	for name, doc := range map[string]string{"plan": svg, "section": sec} {
		if !strings.HasPrefix(doc, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 390`) || strings.Contains(doc, "NaN") || strings.Contains(doc, "Inf") || strings.Contains(doc, "<b>") {
			t.Errorf("%s: %.200s", name, doc)
		}
		for _, m := range fontSize.FindAllStringSubmatch(doc, -1) {
			if v, _ := strconv.ParseFloat(m[1], 64); v < 12 {
				t.Errorf("%s: text %g px at 390 px wide", name, v)
			}
		}
	}
	if !strings.Contains(svg, `class="obstacle selected" data-ob="2"`) || strings.Count(svg, `class="ob-hit"`) != 4 || !strings.Contains(svg, "&lt;b&gt;") {
		t.Error("the obstacles are not drawn for the overlay")
	}
	if fr.WidthPx != 390 || !(fr.MPerPx > 0) {
		t.Fatalf("frame %+v", fr)
	}
	l := siteScreen()
	for _, o := range in.Site.Obstacles {
		for _, p := range o.Outline {
			px, py := (p.X-fr.XM)/fr.MPerPx, (fr.YM-p.Y)/fr.MPerPx
			if px < l.left || px > fr.WidthPx-l.right || py < l.top || py > fr.HeightPx-l.bottom {
				t.Errorf("corner %+v at %g, %g px: outside the plot", p, px, py)
			}
		}
	}
	moved := fr
	moved.XM += 3
	in.Frame, in.WidthPx = &moved, 800
	if _, f2 := SitePlanScreen(in); f2 != moved {
		t.Errorf("kept frame %+v, got %+v", moved, f2)
	}
	in.Frame = &SiteFrame{MPerPx: math.NaN()}
	if _, f3 := SitePlanScreen(in); f3.WidthPx != 800 {
		t.Errorf("a bad frame was kept: %+v", f3)
	}
}
