package browsertest

import (
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"swaysheet/core/figures"
	"swaysheet/core/units"
)

// clearanceList waits for the obstacles' figures under the plan and
// reads them: per obstacle in the page's order, its name, class, verdict
// and rows (key: text as shown).
func (h *harness) clearanceList(want string) []map[string]any {
	h.t.Helper()
	if err := h.poll(`window.swaysheetSite.settled() && document.querySelectorAll('#clearance-figures .clr-ob').length > 0 && document.getElementById('clearance-figures').textContent.indexOf(`+strconv.Quote(want)+`) >= 0`, 120*time.Second); err != nil {
		h.t.Fatalf("no clearance figures with %q: %v", want, err)
	}
	return eval[[]map[string]any](h, `Array.prototype.map.call(document.querySelectorAll('#clearance-figures .clr-ob'), function (li) {
		var rows = {};
		li.querySelectorAll('.clr-row').forEach(function (r) { rows[r.dataset.key] = r.querySelector('dd').textContent; });
		return {name: li.querySelector('h4').textContent, cls: li.className, verdict: li.querySelector('.clr-verdict').textContent, rows: rows};
	})`)
}

// TestClearanceFiguresList: under the bay example's plan, each obstacle's
// figures as the core presents them (clearance_figures of the report the
// page shows): worst first in the core's order, the core's verdict words
// and each row's text and unit as the core rounded them; again in feet
// when US units are chosen; axe-core finds nothing serious at a phone's
// size.
func TestClearanceFiguresList(t *testing.T) {
	h := setupFor(t, 8*time.Minute)
	h.do(chromedp.EmulateViewport(390, 844))
	h.openExample("machine frame past the column line")
	h.siteSettled()
	rep := h.pageReport()
	for _, sys := range []string{"si", "us"} {
		if sys == "us" {
			h.click("#sys-us")
			h.settle()
		}
		want := figures.PresentClearance(rep, units.Choice{System: sys})
		unit := map[string]string{"si": " m", "us": " ft"}[sys]
		got := h.clearanceList(unit)
		if len(got) != len(want.WorstFirst) {
			t.Fatalf("%s: %d obstacles listed, the core has %d", sys, len(got), len(want.WorstFirst))
		}
		for k, i := range want.WorstFirst {
			o, g := want.Obstacles[i], got[k]
			if g["name"] != o.Name {
				t.Errorf("%s: place %d is %v, the core's worst first has %s", sys, k+1, g["name"], o.Name)
				continue
			}
			if !strings.Contains(g["verdict"].(string), o.Verdict) || strings.Contains(g["cls"].(string), "ok") != o.Keeps {
				t.Errorf("%s: %s verdict %q (%v), the core's %q (%v)", sys, o.Name, g["verdict"], g["cls"], o.Verdict, o.Keeps)
			}
			rows := g["rows"].(map[string]any)
			for _, r := range o.Rows {
				if shownText := r.Text + " " + r.Unit; strings.TrimSpace(shownText) != rows[r.Key] {
					t.Errorf("%s: %s %s shows %q, the core's %q", sys, o.Name, r.Key, rows[r.Key], shownText)
				}
			}
			for _, k := range []string{"smallest_m", "smallest_at_distance_m", "smallest_at_s", "share_strike"} {
				if _, ok := rows[k]; !ok {
					t.Errorf("%s: %s lacks %s", sys, o.Name, k)
				}
			}
		}
		if sys == "si" && (!strings.Contains(got[0]["verdict"].(string), "does NOT keep") || !strings.Contains(got[0]["cls"].(string), "out")) {
			t.Errorf("the bay example's worst obstacle: %v", got[0])
		}
	}
	h.centreOf("#clearance-figures")
	if bad := h.axe(); len(bad) > 0 {
		t.Errorf("axe-core: %s", strings.Join(bad, "; "))
	}
	if w := eval[float64](h, `document.documentElement.scrollWidth`); w > 391 {
		t.Errorf("the page is %g px wide at 390", w)
	}
	shot(h, "clearance-figures-phone.png")
	for _, vp := range []struct {
		name string
		w, h int64
	}{{"tablet-portrait", 820, 1180}, {"tablet-landscape", 1180, 820}} {
		h.do(chromedp.EmulateViewport(vp.w, vp.h))
		time.Sleep(400 * time.Millisecond)
		h.centreOf("#clearance-figures")
		if bad := eval[string](h, `(function(){var W=innerWidth,out=[];if(document.documentElement.scrollWidth>W+1)out.push('page '+document.documentElement.scrollWidth+' px wide');
			document.querySelectorAll('#clearance-figures dd').forEach(function(d){var r=d.getBoundingClientRect();if(r.right>W+0.5)out.push(d.textContent+' past the edge');});return out.join('; ');})()`); bad != "" {
			t.Errorf("%s: %s", vp.name, bad)
		}
		shot(h, "clearance-figures-"+vp.name+".png")
	}
}

// shot keeps a screenshot in out/browser.
func shot(h *harness, name string) {
	h.t.Helper()
	out := filepath.Join(root, "out", "browser")
	os.MkdirAll(out, 0o755)
	png, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
	if err != nil {
		h.t.Fatal(err)
	}
	os.WriteFile(filepath.Join(out, name), png, 0o644)
}

// fingerDrag drags with a finger's pointer events from (x, y) by (dx,
// dy) CSS px: the pointerdown goes to what the browser finds at that
// point (as a real touch), the moves to the plan's figure.
func (h *harness) fingerDrag(x, y, dx, dy float64) string {
	h.t.Helper()
	return eval[string](h, `(function(){var x=`+fmtField(x)+`,y=`+fmtField(y)+`,e=document.elementFromPoint(x,y),o={bubbles:true,pointerId:9,pointerType:'touch',isPrimary:true};
		var hit=(e.getAttribute('class')||'')+' '+(e.dataset.handle||'');
		e.dispatchEvent(new PointerEvent('pointerdown',Object.assign({clientX:x,clientY:y},o)));
		var f=document.getElementById('site-plan');
		for(var i=1;i<=5;i++)f.dispatchEvent(new PointerEvent('pointermove',Object.assign({clientX:x+`+fmtField(dx)+`*i/5,clientY:y+`+fmtField(dy)+`*i/5},o)));
		f.dispatchEvent(new PointerEvent('pointerup',Object.assign({clientX:x+`+fmtField(dx)+`,clientY:y+`+fmtField(dy)+`},o)));return hit;})()`)
}

// TestSiteHandlesPhone: at 390x844 a small obstacle (the 1 m square the
// page adds, a few px on the plan) gets handles set off its corners whose
// 48 px targets do not overlap and leave the obstacle itself to a finger:
// touching its middle moves it (size kept), dragging a handle resizes it
// with the opposite corner fixed.
func TestSiteHandlesPhone(t *testing.T) {
	h := setupFor(t, 8*time.Minute)
	h.do(chromedp.EmulateViewport(390, 844))
	h.openExample("machine frame past the column line")
	h.siteSettled()
	h.click("#site-add-obstacle")
	h.siteSettled()
	h.centreOf(`#site-svg path.obstacle[data-ob="4"]`)
	if err := h.poll(`document.querySelectorAll('#site-svg .handle-hit[data-ob="4"]').length === 4`, 30*time.Second); err != nil {
		t.Fatalf("no handles on the added obstacle: %v", err)
	}
	geo := eval[map[string]any](h, `(function(){var b=document.querySelector('#site-svg path.obstacle[data-ob="4"]').getBoundingClientRect();
		var hs=Array.prototype.map.call(document.querySelectorAll('#site-svg .handle-hit'),function(e){var r=e.getBoundingClientRect();return [r.left+r.width/2,r.top+r.height/2,r.width];});
		return {body:[b.left+b.width/2,b.top+b.height/2,b.width,b.height],handles:hs,leads:document.querySelectorAll('#site-svg .handle-lead').length};})()`)
	body := geo["body"].([]any)
	bx, by := body[0].(float64), body[1].(float64)
	t.Logf("obstacle %.1f x %.1f px on the phone's plan", body[2], body[3])
	hs := geo["handles"].([]any)
	for i := range hs {
		a := hs[i].([]any)
		if a[2].(float64) < 47.5 {
			t.Errorf("handle %d's target is %.1f px across", i, a[2])
		}
		if d := math.Hypot(a[0].(float64)-bx, a[1].(float64)-by); d < 24 {
			t.Errorf("handle %d covers the obstacle's middle (%.1f px off)", i, d)
		}
		for j := i + 1; j < len(hs); j++ {
			b := hs[j].([]any)
			if d := math.Hypot(a[0].(float64)-b[0].(float64), a[1].(float64)-b[1].(float64)); d < 48 {
				t.Errorf("handles %d and %d are %.1f px apart: their targets overlap", i, j, d)
			}
		}
	}
	if geo["leads"].(float64) != 4 {
		t.Errorf("%v lines from the set-off handles to their corners", geo["leads"])
	}
	shot(h, "site-handles-phone.png")

	// The middle is the obstacle's: a finger there moves it.
	b0 := h.obstacle(4).Box
	if hit := h.fingerDrag(bx, by, 40, 0); strings.Contains(hit, "handle") {
		t.Errorf("the obstacle's middle is a handle's (%q)", hit)
	}
	h.siteSettled()
	b1 := h.obstacle(4).Box
	if b1.CentreXM <= b0.CentreXM+0.1 || *b1.LengthM != *b0.LengthM || *b1.WidthM != *b0.WidthM {
		t.Errorf("moved box %+v from %+v", b1, b0)
	}
	// Handle 2 (+length, +width) outward: it grows, corner 0 stays.
	h.centreOf(`#site-svg path.obstacle[data-ob="4"]`)
	if err := h.poll(`document.querySelectorAll('#site-svg .handle-hit[data-ob="4"]').length === 4`, 30*time.Second); err != nil {
		t.Fatal(err)
	}
	x, y := h.centreOf(`#site-svg .handle-hit[data-handle="2"]`)
	if hit := h.fingerDrag(x, y, 30, -30); !strings.Contains(hit, "handle-hit 2") {
		t.Errorf("the finger on handle 2 found %q", hit)
	}
	h.siteSettled()
	b2 := h.obstacle(4).Box
	if *b2.LengthM <= *b1.LengthM || *b2.WidthM <= *b1.WidthM ||
		math.Abs(b2.CentreXM-*b2.LengthM/2-(b1.CentreXM-*b1.LengthM/2)) > 0.011 || math.Abs(b2.CentreYM-*b2.WidthM/2-(b1.CentreYM-*b1.WidthM/2)) > 0.011 {
		t.Errorf("resized box %+v (%g x %g) from %+v (%g x %g)", b2, *b2.LengthM, *b2.WidthM, b1, *b1.LengthM, *b1.WidthM)
	}
}

// TestSiteHandlePlaces: handlePlaces (site-plan.js) leaves the handles of
// a large outline on its corners, sets a small one's off along each
// corner's outward bisector (outside an L's inward corner too, worked by
// hand: 36 px at 45 degrees is 25.46 px each way), and nearestHandle takes
// the nearest of two overlapping targets.
func TestSiteHandlePlaces(t *testing.T) {
	h := setup(t)
	got := eval2[map[string]any](h, `import('./site-plan.js').then(function (m) {
		var big = m.handlePlaces([[0,0],[200,0],[200,200],[0,200]], 1);
		var ell = m.handlePlaces([[0,0],[20,0],[20,10],[10,10],[10,20],[0,20]], 1);
		var NS = 'http://www.w3.org/2000/svg', svg = document.createElementNS(NS, 'svg');
		svg.setAttribute('width', 300); svg.setAttribute('height', 100); svg.style.position = 'fixed'; svg.style.left = '0'; svg.style.top = '0';
		[[50, 'a'], [80, 'b']].forEach(function (c) { var e = document.createElementNS(NS, 'circle'); e.setAttribute('class', 'handle-hit');
			e.setAttribute('cx', c[0]); e.setAttribute('cy', 50); e.setAttribute('r', 24); e.dataset.handle = c[1]; svg.appendChild(e); });
		document.body.appendChild(svg);
		var near = m.nearestHandle(svg, 70, 50), none = m.nearestHandle(svg, 200, 50);
		svg.remove();
		return {big: big, ell: ell, near: near && near.dataset.handle, none: none === null};
	})`)
	if b := got["big"].([]any); b[2].([]any)[0].(float64) != 200 || b[2].([]any)[1].(float64) != 200 {
		t.Errorf("a large outline's handle moved: %v", b)
	}
	want := [][2]float64{{-25.46, -25.46}, {45.46, -25.46}, {45.46, 35.46}, {35.46, 35.46}, {35.46, 45.46}, {-25.46, 45.46}}
	for i, p := range got["ell"].([]any) {
		xy := p.([]any)
		if math.Abs(xy[0].(float64)-want[i][0]) > 0.01 || math.Abs(xy[1].(float64)-want[i][1]) > 0.01 {
			t.Errorf("L corner %d: handle at %v, want %v", i, xy, want[i])
		}
	}
	if got["near"] != "b" || got["none"] != true {
		t.Errorf("nearest handle to x=70 of targets at 50 and 80: %v; none far off: %v", got["near"], got["none"])
	}
}
