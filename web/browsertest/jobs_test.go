package browsertest

import (
	"context"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

// A crew's job on the page, from opening it with the example: the fields
// typed and the buttons tapped, in the order the job goes.
type jobStep struct {
	tap  string // a button or checkbox to tap
	typ  string // a field to type into ...
	text string // ... this text
	read string // the answer to read
}

type crewJob struct {
	name  string
	steps []jobStep
}

var crewJobs = []crewJob{
	{"check-a-move", []jobStep{
		{tap: "#example-own"},
		{typ: "#f-load-mass_kg", text: "5400"},
		{typ: "#f-load-rope_length_m", text: "12"},
		{typ: "#f-motions-0-distance_m", text: "24"},
		{typ: "#f-motions-0-speed_m_per_s", text: "30"},
		{typ: "#f-motions-0-accel_m_per_s2", text: "0.2"},
		{typ: "#f-limits-peak_swing_deg", text: "3"},
		{typ: "#f-limits-residual_swing_deg", text: "1"},
		{read: "#verdict"},
	}},
	{"find-drive-settings", []jobStep{
		{tap: "#example-own"},
		{typ: "#f-load-mass_kg", text: "5400"},
		{typ: "#f-load-rope_length_m", text: "12"},
		{typ: "#f-limits-peak_swing_deg", text: "3"},
		{typ: "#f-limits-residual_swing_deg", text: "1"},
		{tap: "#plan-on"},
		{typ: "#f-plan-distance_m", text: "24"},
		{typ: "#f-plan-top_speed_m_per_s", text: "30"},
		{typ: "#f-plan-max_accel_m_per_s2", text: "0.3"},
		{tap: "#plan-run"},
		{read: "#plan-rec"},
	}},
	{"print-the-sheet", []jobStep{
		{tap: "#example-own"},
		{typ: "#f-name", text: "Girder G4 to bay 3"},
		{typ: "#f-sheet-project", text: "Hall 3 extension"},
		{typ: "#f-sheet-lift_reference", text: "L-014"},
		{typ: "#f-sheet-prepared_by", text: "A. Rigger"},
		{tap: "#do-print"},
	}},
}

// jobCount is what a job took: taps (a field tapped to type into it
// counts one, as does a button, a checkbox or a fold opened), fields typed
// into, the fields on the page when it starts, and how far the page moved
// under the person's eyes to reach each next thing (px).
type jobCount struct {
	taps, typed, shown, travel, height int
}

var viewports = []struct {
	w, h int
	name string
}{{390, 844, "phone-390x844"}, {820, 1180, "tablet-820x1180"}, {1180, 820, "tablet-1180x820"}}

// fieldsShown counts the inputs a person sees on the page (a closed fold
// hides what is in it).
const fieldsShown = `Array.from(document.querySelectorAll('main input:not([type=file]), main select, main textarea'))
	.filter(function (e) { return e.checkVisibility(); }).length`

// bringIntoView scrolls a target into view as a person would (only when it
// is not in view already, clear of the bottom bar) and says how far it
// moved on the screen; -1 when there is no such element.
func bringIntoView(sel string) string {
	return `(function () { var e = document.querySelector(` + strconv.Quote(sel) + `); if (!e) return -1;
		var bar = document.querySelector('nav.actions').getBoundingClientRect().top, r = e.getBoundingClientRect();
		if (r.top >= 0 && r.bottom <= bar) return 0;
		e.scrollIntoView({block: 'center'});
		return Math.round(Math.abs(e.getBoundingClientRect().top - r.top)); })()`
}

// closedFold is the summary of the outermost closed fold around a target.
func closedFold(sel string) string {
	return `(function () { var e = document.querySelector(` + strconv.Quote(sel) + `), out = '';
		for (var d = e && e.parentElement; d; d = d.parentElement) {
			if (d.tagName === 'DETAILS' && !d.open) { d.querySelector(':scope > summary').setAttribute('data-job-fold', ''); out = '[data-job-fold]'; }
		}
		document.querySelectorAll('[data-job-fold]').forEach(function (s, i, all) { if (i < all.length - 1) s.removeAttribute('data-job-fold'); });
		return out; })()`
}

// runJob opens the page afresh with the example and does the job.
func (h *harness) runJob(j crewJob) jobCount {
	h.t.Helper()
	h.settle()
	eval[bool](h, `localStorage.clear(); true`)
	h.do(chromedp.Navigate("about:blank"))
	h.do(chromedp.Navigate(h.url))
	h.settle()
	eval[bool](h, `window.print = function () { window.jobPrinted = true; }; window.scrollTo(0, 0); true`)
	var c jobCount
	c.shown = eval[int](h, fieldsShown)
	c.height = eval[int](h, `document.documentElement.scrollHeight`)
	reach := func(sel string) {
		for {
			fold := eval[string](h, closedFold(sel))
			if fold == "" {
				break
			}
			c.travel += eval[int](h, bringIntoView(fold))
			h.within(j.name+": opening the fold around "+sel, chromedp.Click(chromedp.CSS(fold)))
			eval[bool](h, `document.querySelectorAll('[data-job-fold]').forEach(function (s) { s.removeAttribute('data-job-fold'); }); true`)
			c.taps++
		}
		moved := eval[int](h, bringIntoView(sel))
		if moved < 0 {
			h.t.Fatalf("%s: %s is not on the page", j.name, sel)
		}
		c.travel += moved
	}
	for _, s := range j.steps {
		switch {
		case s.tap != "":
			plans := eval[int](h, `window.swaysheetPlan.count()`)
			reach(s.tap)
			h.within(j.name+": tapping "+s.tap, chromedp.Click(chromedp.CSS(s.tap)))
			c.taps++
			if s.tap == "#plan-run" {
				h.planSettled(plans)
			}
			h.settle()
		case s.typ != "":
			reach(s.typ)
			h.within(j.name+": typing into "+s.typ, chromedp.Click(chromedp.CSS(s.typ)),
				chromedp.KeyEvent("a", chromedp.KeyModifiers(chromedp.ModifierCtrl)),
				chromedp.KeyEvent("\b"),
				chromedp.SendKeys(chromedp.CSS(s.typ), s.text))
			c.taps++
			c.typed++
			h.settle()
		case s.read != "":
			h.settle()
			reach(s.read)
		}
	}
	return c
}

// within does the actions, failing the test when they take over 30 s (a
// click waits for its target to be visible).
func (h *harness) within(what string, a ...chromedp.Action[chromedp.Void]) {
	h.t.Helper()
	ctx, cancel := context.WithTimeout(h.ctx, 30*time.Second)
	defer cancel()
	if err := chromedp.Do(ctx, a...); err != nil {
		h.t.Fatalf("%s: %v", what, err)
	}
}

// siOnUSSheet finds figures in SI units on a sheet shown in US units.
var siOnUSSheet = regexp.MustCompile(`[0-9](\s|\x{00A0})?(m|cm|mm|km|m/s|m/s²|m/min|kg|t|kN|N|kg/m³|m²|km/h)([^A-Za-z0-9²³]|$)`)

// TestCrewJobs does the crew's three jobs (check a move, find drive
// settings, print the sheet) at a phone and a tablet either way up, from
// the page opened with the example: counts what each took, keeps a
// screenshot of the answer in out/browser/, runs axe-core and checks the
// order a keyboard takes; the US sheet carries no SI unit.
func TestCrewJobs(t *testing.T) {
	h := setupFor(t, 12*time.Minute)
	dir := filepath.Join(root, "out", "browser")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	var table []string
	for _, vp := range viewports {
		h.do(chromedp.EmulateViewport(int64(vp.w), int64(vp.h)))
		for _, j := range crewJobs {
			c := h.runJob(j)
			table = append(table, fmt.Sprintf("%-20s %-16s taps %2d, fields typed %d, fields on the page %2d, moved %5d px, page %5d px",
				j.name, vp.name, c.taps, c.typed, c.shown, c.travel, c.height))
			b, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
			if err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(filepath.Join(dir, "job-"+j.name+"-"+vp.name+".png"), b, 0o644); err != nil {
				t.Fatal(err)
			}
			if j.name == "check-a-move" {
				b, err := chromedp.Run(h.ctx, chromedp.FullScreenshot(100))
				if err != nil {
					t.Fatal(err)
				}
				if err := os.WriteFile(filepath.Join(dir, "job-page-"+vp.name+"-full.png"), b, 0o644); err != nil {
					t.Fatal(err)
				}
			}
			if bad := h.axe(); len(bad) > 0 {
				t.Errorf("%s at %s: axe-core finds:\n%s", j.name, vp.name, strings.Join(bad, "\n"))
			}
			if p := eval[string](h, layoutProblems); p != "" {
				t.Errorf("%s at %s:\n%s", j.name, vp.name, p)
			}
		}
		if p := eval[string](h, tabOrder); p != "" {
			t.Errorf("%s: the keyboard's order is not the screen's: %s", vp.name, p)
		}
	}
	t.Log("taps and fields of each job:\n" + strings.Join(table, "\n"))

	// The sheet in US units: no figure in SI units.
	h.do(chromedp.Click(chromedp.ID("sys-us")))
	h.settle()
	if !eval[bool](h, `window.jobPrinted === true`) {
		t.Error("Print did not print")
	}
	h.do(chromedp.Click(chromedp.ID("do-print")))
	if err := h.poll(`window.swaysheet.settled() && document.getElementById('sheet-host').dataset.ready !== undefined`, 30*time.Second); err != nil {
		t.Fatal(err)
	}
	// innerText leaves out what is not visible: the sheet is shown for the read.
	sheet := eval[string](h, `(function () { var e = document.getElementById('sheet-host'); e.style.visibility = 'visible';
		var t = e.innerText; e.style.visibility = ''; return t; })()`)
	if !strings.Contains(sheet, " ft") || len(sheet) < 2000 {
		t.Fatalf("the US sheet was not read (%d characters)", len(sheet))
	}
	for _, line := range strings.Split(sheet, "\n") {
		if m := siOnUSSheet.FindString(line); m != "" && !strings.Contains(line, "SHA-256") {
			t.Errorf("the US sheet has SI units (%q): %s", m, line)
		}
	}
}

// tabOrder lists where the keyboard's order (the page's order: nothing
// has a positive tabindex) goes back up the screen within a section, or,
// in one column, from one section to the one above it.
const tabOrder = `(function () {
  var out = [];
  document.querySelectorAll('[tabindex]').forEach(function (e) { if (e.tabIndex > 0) out.push(e.id + ' has tabindex ' + e.tabIndex); });
  var els = Array.from(document.querySelectorAll('main a[href], main button, main input, main select, main textarea, main summary'))
    .filter(function (e) { var r = e.getBoundingClientRect(); return r.width > 0 && r.height > 0 && !e.disabled; });
  var oneColumn = innerWidth < 1100;
  for (var i = 1; i < els.length; i++) {
    var a = els[i - 1], b = els[i], ra = a.getBoundingClientRect(), rb = b.getBoundingClientRect();
    if ((oneColumn || a.closest('.col') === b.closest('.col')) && rb.top < ra.top - 30) out.push((b.id || b.textContent.trim().slice(0, 24)) + ' comes after ' + (a.id || a.textContent.trim().slice(0, 24)) + ' but sits ' + Math.round(ra.top - rb.top) + ' px above it');
  }
  return out.slice(0, 8).join('; ');
})()`
