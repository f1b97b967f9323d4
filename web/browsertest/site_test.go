package browsertest

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
)

// siteSettled waits until the page has answered for the inputs and the
// clearance check of them is done (or stopped).
func (h *harness) siteSettled() {
	h.t.Helper()
	h.settle()
	if err := h.poll(`window.swaysheetSite && window.swaysheetSite.settled() && window.swaysheet.settled()`, 180*time.Second); err != nil {
		h.t.Fatalf("the clearance check did not finish: %v", err)
	}
}

// pageReport is the clearance report the page shows.
func (h *harness) pageReport() *clearance.Report {
	h.t.Helper()
	var r clearance.Report
	if err := json.Unmarshal([]byte(eval[string](h, `JSON.stringify(window.swaysheetSite.report())`)), &r); err != nil {
		h.t.Fatal(err)
	}
	return &r
}

// obstacle reads obstacle i of the page's scenario.
func (h *harness) obstacle(i int) scenario.SiteObstacle {
	h.t.Helper()
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		h.t.Fatal(err)
	}
	return s.Site.Obstacles[i]
}

// centreOf is the middle of an element of the plan on screen, scrolled
// into view.
func (h *harness) centreOf(sel string) (float64, float64) {
	h.t.Helper()
	v := eval[[]float64](h, `(function(){var e=document.querySelector(`+strconv.Quote(sel)+`);e.scrollIntoView({block:'center'});
		var r=e.getBoundingClientRect();return [r.left+r.width/2, r.top+r.height/2];})()`)
	return v[0], v[1]
}

// touchDrag drags by pointer events of a finger (pointerType touch) from
// the middle of sel by (dx, dy) CSS px, in steps; the moves go to the
// plan's figure, which captures the pointer (the plan is redrawn under
// the finger).
func (h *harness) touchDrag(sel string, dx, dy float64) {
	h.t.Helper()
	eval[bool](h, `(function(){var e=document.querySelector(`+strconv.Quote(sel)+`);var r=e.getBoundingClientRect();
		var x=r.left+r.width/2,y=r.top+r.height/2,o={bubbles:true,pointerId:7,pointerType:'touch',isPrimary:true};
		e.dispatchEvent(new PointerEvent('pointerdown',Object.assign({clientX:x,clientY:y},o)));
		var f=document.getElementById('site-plan');
		for(var i=1;i<=5;i++)f.dispatchEvent(new PointerEvent('pointermove',Object.assign({clientX:x+`+fmtField(dx)+`*i/5,clientY:y+`+fmtField(dy)+`*i/5},o)));
		f.dispatchEvent(new PointerEvent('pointerup',Object.assign({clientX:x+`+fmtField(dx)+`,clientY:y+`+fmtField(dy)+`},o)));return true;})()`)
}

// TestSitePlan: the bay site example's obstacles, envelopes and exclusion
// zone are drawn from the core's report (the same runs and verdict as
// the Go core's check of the page's scenario) and its verdict is in the
// verdict band; an obstacle moved with the mouse, resized and tapped with
// a finger, added, given a top the core rejects (the core's message at the
// field) and deleted; each edit reaches the scenario's site block; the
// runs cancelled midway; the section at a phone and a tablet either way up.
func TestSitePlan(t *testing.T) {
	h := setupFor(t, 10*time.Minute)
	h.openExample("machine frame past the column line")
	h.siteSettled()

	rep := h.pageReport()
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	want, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Runs != want.Runs || rep.Clears != want.Clears || !reflect.DeepEqual(rep.Words, want.Words) ||
		rep.Envelope95.Inside != want.Envelope95.Inside || len(rep.Envelope95.Spans) != len(want.Envelope95.Spans) {
		t.Errorf("page's report: %d runs, %v, %q, %d spans; the core's: %d, %v, %q, %d spans", rep.Runs, rep.Clears, rep.Words,
			len(rep.Envelope95.Spans), want.Runs, want.Clears, want.Words, len(want.Envelope95.Spans))
	}
	// Drawn: every obstacle with its top, every span of both envelopes.
	if n := eval[int](h, `document.querySelectorAll('#site-svg path.obstacle').length`); n != 4 {
		t.Errorf("%d obstacles drawn", n)
	}
	labels := strings.Join(h.texts("#site-svg text.ob-label"), "|")
	if strings.Count(labels, "top 8 m") != 3 || !strings.Contains(labels, "top 2.2 m") {
		t.Errorf("labels %q lack the tops", labels)
	}
	if cards := strings.Join(h.texts("#site-form legend"), "|"); !strings.Contains(cards, "Obstacle 1: column C2") || !strings.Contains(cards, "Obstacle 4: panel stack") {
		t.Errorf("obstacle cards: %q", cards)
	}
	for _, e := range []struct {
		cls  string
		want int
	}{{"env95", len(rep.Envelope95.Spans)}, {"env50", len(rep.Envelope50.Spans)}} {
		d := eval[string](h, `document.querySelector('#site-svg path.`+e.cls+`').getAttribute('d')`)
		if got := strings.Count(d, "M"); got != e.want || got == 0 {
			t.Errorf("%s: %d spans drawn, the report has %d", e.cls, got, e.want)
		}
	}
	// The core's sentences, in the units shown (the say call).
	if v := h.text("#clearance-verdict"); !strings.Contains(v, "DOES NOT CLEAR") || !strings.Contains(v, "column C3: the load keeps 0.3") || !strings.Contains(v, "of 200 runs") {
		t.Errorf("verdict band: %q", v)
	}
	if !strings.Contains(h.text("#site-plan figcaption"), "nobody stands here during the lift") {
		t.Error("the exclusion zone is not explained")
	}

	// Move the panel stack with the mouse: 60 px to the right.
	before := h.obstacle(3)
	x, y := h.centreOf(`#site-svg path.obstacle[data-ob="3"]`)
	h.do(chromedp.MouseEvent(chromedp.MousePressed, x, y, chromedp.ButtonLeft))
	for i := 1; i <= 6; i++ {
		h.do(chromedp.MouseEvent(chromedp.MouseMoved, x+10*float64(i), y, chromedp.ButtonLeft))
	}
	h.do(chromedp.MouseEvent(chromedp.MouseReleased, x+60, y, chromedp.ButtonLeft))
	h.siteSettled()
	after := h.obstacle(3)
	dx := after.Corners[0].XM - before.Corners[0].XM
	for i := range after.Corners {
		if d := after.Corners[i].XM - before.Corners[i].XM; dx <= 0.5 || math.Abs(d-dx) > 0.011 || after.Corners[i].YM != before.Corners[i].YM {
			t.Errorf("corner %d moved by %g (first by %g), y %g -> %g", i, d, dx, before.Corners[i].YM, after.Corners[i].YM)
		}
	}
	if got := h.value(`[data-path="site.obstacles[3].corners[0].x_m"]`); got != fmtField(after.Corners[0].XM) {
		t.Errorf("field shows %s, scenario %g", got, after.Corners[0].XM)
	}
	if st := eval[map[string]any](h, `window.swaysheetSite.state()`); st["stale"] != false {
		t.Errorf("the report is not of the moved obstacle: %v", st)
	}

	// Tap column C2 with a finger (selects it, handles shown), drag its
	// corner handle 2 (+length, +width) outward: the box grows, its
	// opposite corner stays.
	h.touchDrag(`#site-svg path.obstacle[data-ob="0"]`, 0, 0)
	if n := eval[int](h, `document.querySelectorAll('#site-svg .handle-hit').length`); n != 4 {
		t.Fatalf("%d handles on the tapped obstacle", n)
	}
	if w := eval[float64](h, `document.querySelector('#site-svg .handle-hit').getBoundingClientRect().width`); w < 47.5 {
		t.Errorf("a handle's target is %.1f px across", w)
	}
	c0 := h.obstacle(0).Box
	h.touchDrag(`#site-svg .handle-hit[data-handle="2"]`, 30, -30)
	h.siteSettled()
	c1 := h.obstacle(0).Box
	lowX, lowY := c0.CentreXM-*c0.LengthM/2, c0.CentreYM-*c0.WidthM/2
	if *c1.LengthM <= *c0.LengthM || *c1.WidthM <= *c0.WidthM ||
		math.Abs(c1.CentreXM-*c1.LengthM/2-lowX) > 0.011 || math.Abs(c1.CentreYM-*c1.WidthM/2-lowY) > 0.011 {
		t.Errorf("resized box: %+v (%g x %g) from %+v (%g x %g)", c1, *c1.LengthM, *c1.WidthM, c0, *c0.LengthM, *c0.WidthM)
	}

	// Add an obstacle, give it a top the core rejects, then a good one,
	// then delete it.
	h.click("#site-add-obstacle")
	h.settle()
	if n := eval[int](h, `JSON.parse(window.swaysheet.scenarioJSON()).site.obstacles.length`); n != 5 {
		t.Fatalf("%d obstacles after adding one", n)
	}
	top := `[data-path="site.obstacles[4].top_m"]`
	h.typeInto(top, "0")
	h.settle()
	if msg := h.text(`[data-field="site.obstacles[4].top_m"] .msg`); !strings.Contains(msg, "out of range") || !strings.Contains(msg, "0.01") {
		t.Errorf("message at the rejected top: %q", msg)
	}
	if h.value(top) != "0" {
		t.Error("the rejected value was not left in the field")
	}
	h.typeInto(top, "4.5")
	h.siteSettled()
	if msg := h.text(`[data-field="site.obstacles[4].top_m"] .msg`); msg != "" {
		t.Errorf("message stays: %q", msg)
	}
	h.click(`[data-site-remove="4"]`)
	h.siteSettled()
	if n := eval[int](h, `JSON.parse(window.swaysheet.scenarioJSON()).site.obstacles.length`); n != 4 {
		t.Errorf("%d obstacles after deleting one", n)
	}

	// Cancel midway: many runs, cancelled once some are done.
	h.typeInto(`[data-path="site.spread.runs"]`, "3000")
	if err := h.poll(`window.swaysheetSite.state().going && window.swaysheetSite.state().done > 0`, 120*time.Second); err != nil {
		t.Fatalf("no runs going: %v", err)
	}
	if !strings.Contains(h.text("#clearance-progress-text"), "of 3000") {
		t.Errorf("progress: %q", h.text("#clearance-progress-text"))
	}
	h.click("#clearance-cancel")
	if err := h.poll(`!window.swaysheetSite.state().going`, 20*time.Second); err != nil {
		t.Fatalf("the runs did not stop: %v", err)
	}
	if st := eval[map[string]any](h, `window.swaysheetSite.state()`); !strings.Contains(st["error"].(string), "cancelled") || st["stale"] != true {
		t.Errorf("after Cancel: %v", st)
	}
	if v := h.text("#clearance-verdict"); !strings.Contains(v, "for earlier inputs") {
		t.Errorf("verdict band after Cancel: %q", v)
	}
	if h.scenario()["site"].(map[string]any)["spread"].(map[string]any)["runs"] != 3000.0 {
		t.Error("the inputs were not kept")
	}

	// Layouts: the plan fits the screen, its buttons are 48 px.
	out := filepath.Join(root, "out", "browser")
	os.MkdirAll(out, 0o755)
	for _, vp := range []struct {
		name string
		w, h int64
	}{{"phone", 390, 844}, {"tablet-portrait", 820, 1180}, {"tablet-landscape", 1180, 820}} {
		h.do(chromedp.EmulateViewport(vp.w, vp.h))
		time.Sleep(400 * time.Millisecond)
		h.centreOf("#site-svg")
		bad := eval[string](h, `(function(){var out=[],W=innerWidth;
			if(document.documentElement.scrollWidth>W+1)out.push('page '+document.documentElement.scrollWidth+' px wide');
			var r=document.getElementById('site-svg').getBoundingClientRect();if(r.right>W+0.5||r.left<-0.5)out.push('plan past the edge');
			document.querySelectorAll('#site button').forEach(function(b){var q=b.getBoundingClientRect();if(q.width&&q.height<47.5)out.push(b.textContent+' '+q.height+' px high');});
			return out.join('; ');})()`)
		if bad != "" {
			t.Errorf("%s: %s", vp.name, bad)
		}
		png, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
		if err != nil {
			t.Fatal(err)
		}
		os.WriteFile(filepath.Join(out, "site-"+vp.name+".png"), png, 0o644)
	}
}

// TestClearanceSplitEqualsSingle: the runs split over the page's workers
// (three, and one) give the single "clearance" call's report exactly, and
// the envelope is refined as the parts arrive.
func TestClearanceSplitEqualsSingle(t *testing.T) {
	h := setup(t)
	h.openExample("machine frame past the column line")
	h.siteSettled()
	sc := h.scenario()
	sc["site"].(map[string]any)["spread"].(map[string]any)["runs"] = 60
	b, _ := json.Marshal(sc)
	sent := strconv.Quote(string(b))
	single := eval2[string](h, `window.swaysheetSite.single(`+sent+`).then(function(r){return JSON.stringify(r.result||r.error);})`)
	for _, w := range []int{3, 1} {
		got := eval2[[]any](h, `(function(){var seen=0;return window.swaysheetSite.split(`+sent+`,60,`+strconv.Itoa(w)+`,function(s){if(s.report&&!s.final)seen++;})
			.then(function(r){return [JSON.stringify(r.result||r.error), seen];});})()`)
		if got[0].(string) != single {
			t.Errorf("%d workers: the split report differs from the single call's", w)
		}
		if w == 3 && got[1].(float64) < 1 {
			t.Error("no refined envelope before the last part")
		}
	}
	// The engine's worker restarted once a join has answered (the parts
	// it held are gone): the next join is told so, sent again with every
	// part's data, and the report is the same.
	got := eval2[[]any](h, `(function(){var cut=0;return window.swaysheetSite.split(`+sent+`,60,2,function(s){if(s.report&&!s.final&&!cut){cut=1;window.swaysheet.cancel();}})
		.then(function(r){return [JSON.stringify(r.result||r.error), cut];});})()`)
	if got[0].(string) != single || got[1].(float64) != 1 {
		t.Errorf("the engine restarted midway (%v): the split report differs from the single call's: %.200s", got[1], got[0])
	}
	var r clearance.Report
	if err := json.Unmarshal([]byte(single), &r); err != nil || r.Runs != 60 || len(r.Envelope95.Spans) == 0 {
		t.Errorf("single call: %v, %d runs", err, r.Runs)
	}
}
