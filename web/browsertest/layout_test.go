package browsertest

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

// layoutProblems lists what a person could not read at the viewport: the
// page wider than the screen, a header or bar control past its edge, a
// label cut off, chart text under 12 px as drawn.
const layoutProblems = `(function () {
  var out = [], W = innerWidth;
  var seen = function (e) { var r = e.getBoundingClientRect(); return e.checkVisibility({visibilityProperty: true}) && r.width > 0 && r.height > 0; };
  var name = function (e) { return e.id || (e.textContent || '').trim().slice(0, 20) || e.tagName; };
  if (document.documentElement.scrollWidth > W + 1) out.push('the page is ' + document.documentElement.scrollWidth + ' px wide');
  document.querySelectorAll('header.top *, nav.actions *, #results .fig, #verdict, .plot').forEach(function (e) {
    if (!seen(e)) return;
    var r = e.getBoundingClientRect();
    if (r.right > W + 0.5 || r.left < -0.5) out.push(name(e) + ' is past the screen edge (' + Math.round(r.left) + ' to ' + Math.round(r.right) + ')');
  });
  document.querySelectorAll('button, .button, label, legend, h1, h2, h3, .chart-title').forEach(function (e) {
    if (seen(e) && e.scrollWidth > e.clientWidth + 1 && getComputedStyle(e).overflow !== 'visible') out.push(name(e) + ' is cut off');
    if (seen(e) && e.closest('nav.actions') && e.scrollWidth > e.clientWidth + 1) out.push(name(e) + ' is cut off');
  });
  // Nothing in the page scrolls on its own (the results panel in
  // landscape did); the plan's table keeps every number in sight.
  document.querySelectorAll('main *').forEach(function (e) {
    var o = getComputedStyle(e).overflowY;
    if (seen(e) && e.tagName !== 'TEXTAREA' && (o === 'auto' || o === 'scroll') && e.scrollHeight > e.clientHeight + 1) out.push(name(e) + ' scrolls on its own');
  });
  document.querySelectorAll('#plan-table').forEach(function (t) {
    var w = t.closest('.table-wrap');
    if (seen(t) && w && w.scrollWidth > w.clientWidth + 1) out.push('the plan table is ' + w.scrollWidth + ' px wide in ' + w.clientWidth + ' px: numbers out of sight');
    t.querySelectorAll('td').forEach(function (c) { if (c.scrollWidth > c.clientWidth + 1) out.push('plan table cell "' + c.textContent + '" is cut off'); });
  });
  document.querySelectorAll('svg.chart').forEach(function (svg) {
    if (!seen(svg)) return;
    var k = svg.getScreenCTM().a;
    svg.querySelectorAll('text').forEach(function (t) {
      var px = parseFloat(getComputedStyle(t).fontSize) * k;
      if (px < 11.95) out.push(svg.closest('figure').id + ' text "' + t.textContent + '" is ' + px.toFixed(1) + ' px');
    });
  });
  return out.join('\n');
})()`

// covered lists the inputs in view (above the bottom bar) that something
// else covers.
const covered = `(function () {
  var bar = document.querySelector('nav.actions').getBoundingClientRect().top, out = [];
  document.querySelectorAll('#inputs input[type=text], #inputs select').forEach(function (e) {
    var r = e.getBoundingClientRect(), x = r.left + r.width / 2, y = r.top + r.height / 2;
    if (r.width === 0 || y < 0 || y > bar) return;
    var at = document.elementFromPoint(x, y);
    if (at !== e && !e.contains(at)) out.push(e.id + ' under ' + (at ? at.id || at.className || at.tagName : 'nothing'));
  });
  return out.join(', ');
})()`

// TestLayouts: at a phone (390x844) and a tablet either way up, nothing is
// off screen, no label is cut off and chart text is at least 12 px; a
// notice covers no input; results for earlier inputs are greyed and
// marked. Screenshots in out/browser/.
func TestLayouts(t *testing.T) {
	h := setup(t)
	dir := filepath.Join(root, "out", "browser")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	shot := func(name string, full bool) {
		var b []byte
		var err error
		if full {
			b, err = chromedp.Run(h.ctx, chromedp.FullScreenshot(90))
		} else {
			b, err = chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
		}
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, name), b, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	for _, vp := range []struct {
		w, h int
		name string
	}{{390, 844, "phone-390x844"}, {820, 1180, "tablet-820x1180"}, {1180, 820, "tablet-1180x820"}} {
		h.do(chromedp.EmulateViewport(int64(vp.w), int64(vp.h)))
		time.Sleep(500 * time.Millisecond) // the charts are drawn again at the new width
		h.settle()
		if p := eval[string](h, layoutProblems); p != "" {
			t.Errorf("%s:\n%s", vp.name, p)
		}
		shot("layout-"+vp.name+".png", false)
		shot("layout-"+vp.name+"-full.jpg", true)
		if b, err := chromedp.Run(h.ctx, chromedp.Screenshot(chromedp.CSS("#plot-path"))); err == nil {
			_ = os.WriteFile(filepath.Join(dir, "layout-"+vp.name+"-chart.png"), b, 0o644)
		}

		// A notice, with the inputs in view: it covers none of them.
		h.do(chromedp.ScrollIntoView(chromedp.CSS("#f-motions-0-accel_m_per_s2")))
		h.do(chromedp.Click(chromedp.ID("do-export")))
		if err := h.poll(`!document.getElementById('notice').hidden`, 10*time.Second); err != nil {
			t.Fatal(err)
		}
		// The field read at several heights, down to just above the bar.
		for _, above := range []int{150, 200, 260, 340} {
			eval[bool](h, `(function () { var e = document.getElementById('f-motions-0-accel_m_per_s2'), r = e.getBoundingClientRect();
				window.scrollBy(0, r.top + r.height / 2 - (document.querySelector('nav.actions').getBoundingClientRect().top - `+strconv.Itoa(above)+` + 100)); return true; })()`)
			if c := eval[string](h, covered); c != "" {
				t.Errorf("%s: the notice covers inputs: %s", vp.name, c)
				break
			}
		}
	}

	// Results for earlier inputs: greyed and marked.
	h.do(chromedp.EmulateViewport(390, 844))
	h.typeInto("#f-load-rope_length_m", "-3")
	h.settle()
	if !eval[bool](h, `document.getElementById('results').classList.contains('is-stale')`) {
		t.Error("the results are not marked as for earlier inputs")
	}
	band := eval[string](h, `getComputedStyle(document.querySelector('#verdict')).backgroundColor + ' ' + getComputedStyle(document.querySelector('#figures .fig')).backgroundColor + ' ' +
		getComputedStyle(document.querySelector('#verdict .verdict-head'), '::after').content`)
	if strings.Count(band, "rgb(230, 230, 230)") != 2 || !strings.Contains(band, "for earlier inputs") {
		t.Errorf("stale verdict band and figures: %s", band)
	}
	h.do(chromedp.ScrollIntoView(chromedp.CSS("#results")))
	shot("stale-results-phone.png", false)
	h.typeInto("#f-load-rope_length_m", "8.5")
	h.settle()
	if eval[bool](h, `document.getElementById('results').classList.contains('is-stale')`) {
		t.Error("the results stay marked after a valid value")
	}
	h.do(chromedp.EmulateViewport(820, 1180))
}
