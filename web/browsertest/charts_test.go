package browsertest

import (
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

// chartProblems lists, for each chart figure named, what is wrong with
// the core's SVG as the page shows it: missing, no line, a script or an
// event handler, NaN or Infinity in it, text under 12 px as drawn.
const chartProblems = `(function (ids) {
  var out = [];
  ids.forEach(function (id) {
    var f = document.getElementById(id);
    var svg = f && f.querySelector('svg.chart');
    if (!svg) { out.push(id + ': no chart'); return; }
    if (!f.querySelector('.chart-title') || !f.querySelector('figcaption')) out.push(id + ': no title or caption');
    var lines = svg.querySelectorAll('path.line');
    if (!lines.length) out.push(id + ': no line');
    lines.forEach(function (p) { if (!/^M[0-9.]+ [0-9.]+/.test(p.getAttribute('d') || '')) out.push(id + ': an empty line'); });
    if (svg.querySelector('script, foreignObject')) out.push(id + ': a script in the chart');
    svg.querySelectorAll('*').forEach(function (e) {
      Array.prototype.forEach.call(e.attributes, function (a) {
        if (/^on/i.test(a.name)) out.push(id + ': an event handler');
        if (/NaN|Infinity/.test(a.value)) out.push(id + ': ' + a.name + '="' + a.value + '"');
      });
    });
    if (/NaN|Infinity/.test(svg.textContent)) out.push(id + ': NaN in the text');
    var k = svg.getScreenCTM().a;
    svg.querySelectorAll('text').forEach(function (t) {
      var px = parseFloat(getComputedStyle(t).fontSize) * k;
      if (!(px >= 11.95)) out.push(id + ': text "' + t.textContent + '" is ' + px.toFixed(1) + ' px');
    });
  });
  return out.join('\n');
})`

// TestCharts: at a phone (390x844) every chart of the results and of the
// planner is the core's SVG (core/sheet, the "plot" call), with its
// lines, hatched bands, limit line and circle, and legend, text at least
// 12 px as drawn and no NaN; a changed input draws them again.
func TestCharts(t *testing.T) {
	h := setup(t)
	h.do(chromedp.EmulateViewport(390, 844))
	h.openExample("girder on the overhead crane")
	results := `['plot-angle', 'plot-path', 'plot-rel', 'plot-tension']`
	if p := eval[string](h, chartProblems+`(`+results+`)`); p != "" {
		t.Errorf("result charts at 390x844:\n%s", p)
	}
	// The hatched bands of the moves, the limit line, the equal axes' circle
	// where the scenario sets an excursion limit, the planner's legend.
	if n := eval[int](h, `document.querySelectorAll('#plot-angle rect.band').length`); n < 2 {
		t.Errorf("rope-angle chart: %d hatched bands, want one per ramp", n)
	}
	if !strings.Contains(h.text("#plot-angle svg"), "limit") {
		t.Error("rope-angle chart: no limit line")
	}
	if eval[bool](h, `typeof JSON.parse(window.swaysheet.scenarioJSON()).limits.peak_excursion_m === 'number'`) &&
		eval[int](h, `document.querySelectorAll('#plot-rel ellipse.limit').length`) != 1 {
		t.Error("plan view: no limit circle")
	}
	// Each viewBox is as wide as the chart is shown: one unit is one pixel.
	if k := eval[float64](h, `document.querySelector('#plot-angle svg').getScreenCTM().a`); k < 0.95 || k > 1.1 {
		t.Errorf("rope-angle chart drawn at %.2f px per unit", k)
	}
	before := h.plotPath("plot-angle")
	h.typeInto("#f-load-rope_length_m", "12")
	h.settle()
	if h.plotPath("plot-angle") == before {
		t.Error("the rope-angle chart was not drawn again")
	}
	if p := eval[string](h, chartProblems+`(`+results+`)`); p != "" {
		t.Errorf("after a change:\n%s", p)
	}

	plans := eval[int](h, `window.swaysheetPlan.count()`)
	h.openExample("plan the girder")
	h.planSettled(plans)
	if p := eval[string](h, chartProblems+`(['plot-plan-ramp', 'plot-plan-rope'])`); p != "" {
		t.Errorf("planner charts at 390x844:\n%s", p)
	}
	if n := eval[int](h, `document.querySelectorAll('#plot-plan-ramp text.legend').length`); n != len(h.corePlan().Curves.AccelTime.Series) {
		t.Errorf("ramp-time chart: %d legend entries", n)
	}
	if eval[int](h, `document.querySelectorAll('#plot-plan-rope rect.band').length`) != 1 {
		t.Error("rope-error chart: the plan's range is not hatched")
	}
}
