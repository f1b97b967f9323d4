package browsertest

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"

	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// openExample opens the example whose name contains part from the library.
func (h *harness) openExample(part string) {
	h.t.Helper()
	h.do(chromedp.Click(chromedp.ID("open-examples")))
	h.do(chromedp.Click(chromedp.Search(`//ul[@id='examples-list']//li[contains(., ` + strconv.Quote(part) + `)]//button`)))
	h.settle()
}

// said is a planner's sentence as the core's "say" call puts it in the
// page's units of the system (core/words).
func said(t *testing.T, s plan.Sentence, system string) string {
	t.Helper()
	var w words.Sentence
	b, _ := json.Marshal(s)
	if err := json.Unmarshal(b, &w); err != nil {
		t.Fatal(err)
	}
	return w.Format(units.Choice{System: system})
}

// planSettled waits until the page has a plan (count above before) and is
// not planning.
func (h *harness) planSettled(before int) {
	h.t.Helper()
	if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](`window.swaysheetPlan && !window.swaysheetPlan.running() && window.swaysheetPlan.count() > `+strconv.Itoa(before),
		chromedp.WithPollingTimeout(90*time.Second), chromedp.WithPollingInterval(50*time.Millisecond))); err != nil {
		h.t.Fatalf("no plan shown: %v", err)
	}
	h.settle()
}

// corePlan runs the planner of the Go core on the page's current scenario.
func (h *harness) corePlan() *plan.Result {
	h.t.Helper()
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		h.t.Fatal(err)
	}
	r, err := plan.Make(s)
	if err != nil {
		h.t.Fatal(err)
	}
	return r
}

// click brings an element to the middle of the screen, clear of the
// fixed action bar and the notice, and clicks it as a person does.
func (h *harness) click(sel string) {
	h.t.Helper()
	if !eval[bool](h, `(function(){var e=document.querySelector(`+strconv.Quote(sel)+`);if(!e)return false;e.scrollIntoView({block:'center'});return true;})()`) {
		h.t.Fatalf("%s: no such element", sel)
	}
	h.do(chromedp.Click(chromedp.CSS(sel)))
}

func (h *harness) texts(sel string) []string {
	h.t.Helper()
	return eval[[]string](h, `Array.from(document.querySelectorAll(`+strconv.Quote(sel)+`)).map(function(e){return e.textContent.trim();})`)
}

func shownNumber(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(strings.Fields(strings.ReplaceAll(s, "\u00a0", " "))[0], 64)
	if err != nil {
		t.Fatalf("%q is not a number: %v", s, err)
	}
	return v
}

func TestPlanner(t *testing.T) {
	h := setup(t)

	var want *plan.Result
	t.Run("the plan example shows the core's recommended option", func(t *testing.T) {
		h.t = t
		before := eval[int](h, `window.swaysheetPlan.count()`)
		h.openExample("plan the girder")
		h.planSettled(before)
		want = h.corePlan()
		if want.Recommended < 0 {
			t.Fatal("the core recommends nothing for the example")
		}
		rec := want.Options[want.Recommended]
		if got := h.text("#plan-rec-label"); got != rec.Label {
			t.Errorf("recommended %q, the core recommends %q", got, rec.Label)
		}
		// The reason in the core's words, without repeating the option's name.
		if got, w := h.text("#plan-reason"), strings.TrimPrefix(said(t, want.ReasonSentence, "si"), "Recommended: "+rec.Label+" — "); got != w || !strings.HasPrefix(h.text("#plan-rec"), "★ Recommended: "+rec.Label) {
			t.Errorf("reason %q, the core's %q", got, want.Reason)
		}
		// Marked by word and by symbol, not by colour alone.
		row := h.text("#plan-table tbody tr.rec")
		if !strings.Contains(row, "Recommended") || !strings.Contains(row, "\u2605") || !strings.Contains(row, rec.Label) {
			t.Errorf("recommended row: %q", row)
		}
		rows := h.texts("#plan-table tbody tr")
		if len(rows) != len(want.Options) {
			t.Fatalf("%d rows, the core has %d options", len(rows), len(want.Options))
		}
		for i, o := range want.Options {
			row := "#plan-table tbody tr:nth-child(" + strconv.Itoa(i+1) + ") "
			for col, w := range map[string]string{"rank": strconv.Itoa(o.Rank) + ".", "label": o.Label, "move": shown("time", "s", o.MoveTimeS),
				"extra": shown("time", "s", o.PenaltyS), "peak": shown("angle", "deg", o.WorstPeakSwingDeg), "excursion": shown("length", "m", o.WorstPeakExcursionM),
				"residual": shown("angle", "deg", o.WorstResidualSwingDeg)} {
				got := strings.TrimPrefix(h.text(row+`[data-col="`+col+`"]`), "\u2605 ")
				if got != w {
					t.Errorf("row %d (%s) %s: %q, the core gives %q", i, o.Key, col, got, w)
				}
			}
			if mark := h.text(row + `[data-col="limits"]`); o.Within != strings.Contains(mark, "within") || o.Within == strings.Contains(mark, "OUTSIDE") {
				t.Errorf("row %d: limits %q, within %v", i, mark, o.Within)
			}
		}
		// Crew settings as the planner gives them: press times for a pendant,
		// ramp segments for a variable-speed drive.
		for i, o := range want.Options {
			sel := "#plan-opt-" + strconv.Itoa(i)
			switch {
			case len(o.Presses) > 0:
				got := h.texts(sel + ` table[data-crew="presses"] tbody tr td:first-child`)
				if len(got) != len(o.Presses) {
					t.Errorf("%s: %d press rows, the core has %d", o.Key, len(got), len(o.Presses))
					continue
				}
				for k, p := range o.Presses {
					if got[k] != shown("time", "s", p.AtS)+"\u00a0s" {
						t.Errorf("%s press %d at %q, the core %v s", o.Key, k, got[k], p.AtS)
					}
				}
			case len(o.SpeedProfile) > 0:
				if n := len(h.texts(sel + ` table[data-crew="ramps"] tbody tr`)); n != len(o.SpeedProfile)-1 {
					t.Errorf("%s: %d ramp rows, the core has %d knots", o.Key, n, len(o.SpeedProfile))
				}
			default:
				if got := h.text(sel + ` [data-crew="ramp"]`); !strings.Contains(got, shown("time", "s", o.RampS)+"\u00a0s") || !strings.Contains(got, shown("acceleration", "m/s²", o.AccelMPerS2)) {
					t.Errorf("%s: ramp settings %q, the core: ramp %v s, accel %v", o.Key, got, o.RampS, o.AccelMPerS2)
				}
			}
			if n := len(h.texts(sel + ` table.verified tbody tr`)); n != len(o.Verified) {
				t.Errorf("%s: %d verified rows, the core %d", o.Key, n, len(o.Verified))
			}
			// A screened option's figures are estimates, shown as such.
			if n := len(h.texts(sel + ` table.estimated tbody tr`)); n != len(o.Estimated) ||
				(o.NotSimulated != "") != strings.Contains(h.text(sel), "Not simulated: linear-theory estimate") {
				t.Errorf("%s: %d estimate rows, the core %d (not simulated: %q)", o.Key, n, len(o.Estimated), o.NotSimulated)
			}
		}
		// The two curves, one line per rope length and per shaper.
		if n := eval[int](h, `document.querySelectorAll('#plot-plan-ramp path.line').length`); n != len(want.Curves.AccelTime.Series) {
			t.Errorf("ramp-time plot: %d lines, the core %d series", n, len(want.Curves.AccelTime.Series))
		}
		if n := eval[int](h, `document.querySelectorAll('#plot-plan-rope path.line').length`); n != len(want.Curves.RopeError.Series) {
			t.Errorf("rope-error plot: %d lines, the core %d series", n, len(want.Curves.RopeError.Series))
		}
		for _, p := range []string{"#plot-plan-ramp", "#plot-plan-rope"} {
			if txt := h.text(p + " svg"); !strings.Contains(txt, "(s)") && !strings.Contains(txt, "(%)") {
				t.Errorf("%s: no axis units in %q", p, txt)
			}
		}
	})

	t.Run("the plan's touch targets are at least 44 px", func(t *testing.T) {
		h.t = t
		small := eval[string](h, `Array.from(document.querySelectorAll('#planner button, #planner input, #planner select, #planner summary, #planner a'))
			.filter(function (e) { var r = e.getBoundingClientRect(); return r.width > 0 && (r.height < 44 || r.width < 44); })
			.map(function (e) { var r = e.getBoundingClientRect(); return (e.id || e.className || e.tagName) + ' ' + Math.round(r.width) + 'x' + Math.round(r.height); })
			.join(', ')`)
		if small != "" {
			t.Errorf("targets smaller than 44 px: %s", small)
		}
	})

	t.Run("the unit switch converts the plan's figures", func(t *testing.T) {
		h.t = t
		if want == nil {
			t.Skip("no plan")
		}
		h.do(chromedp.Click(chromedp.ID("sys-us")))
		h.settle()
		// ft = 0.3048 m exactly (NIST SP 811, appendix B), from core/units.
		for i, o := range want.Options {
			got := h.text("#plan-table tbody tr:nth-child(" + strconv.Itoa(i+1) + `) [data-col="excursion"]`)
			if w := shown("length", "ft", o.WorstPeakExcursionM); got != w {
				t.Errorf("%s: excursion %q ft, want %q", o.Key, got, w)
			}
		}
		if s := h.text("#plan-summary"); !strings.Contains(s, shown("length", "ft", want.DistanceM)+"\u00a0ft") {
			t.Errorf("summary in US units: %q", s)
		}
		rec := want.Options[want.Recommended]
		if len(rec.Presses) > 0 {
			sp := h.texts("#plan-opt-" + strconv.Itoa(want.Recommended) + ` table[data-crew="presses"] tbody tr td:last-child`)
			if w := shown("speed", "ft/min", math.Abs(rec.Presses[0].Speed)) + "\u00a0ft/min"; len(sp) == 0 || sp[0] != w {
				t.Errorf("press speed in US units %q, want %q", sp, w)
			}
		}
		// The planner's own sentences in US units, as the core put them
		// (the "say" call): no SI unit after a number.
		for _, sel := range []string{"#plan-rec", "#plan-out"} {
			if txt := h.text(sel); siAfterNumber.MatchString(txt) || strings.Contains(txt, "SI units") {
				t.Errorf("%s in US units: %q", sel, siAfterNumber.FindString(txt))
			}
		}
		eval[bool](h, `document.getElementById('notice').hidden = true; document.getElementById('plan-rec').scrollIntoView({block: 'start'}); true`)
		time.Sleep(150 * time.Millisecond)
		if shot, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot()); err == nil {
			_ = os.MkdirAll(filepath.Join(root, "out", "browser"), 0o755)
			_ = os.WriteFile(filepath.Join(root, "out", "browser", "plan-us-portrait.png"), shot, 0o644)
		}
		h.do(chromedp.Click(chromedp.ID("sys-si")))
		h.settle()
	})

	t.Run("invalid plan input shows a message at the field", func(t *testing.T) {
		h.t = t
		h.typeInto("#f-plan-distance_m", "5000")
		h.settle()
		msg := h.text("#f-plan-distance_m-msg")
		if !strings.Contains(msg, "accepted") || !strings.Contains(msg, "2000") {
			t.Errorf("message at the distance: %q", msg)
		}
		if !eval[bool](h, `!document.getElementById('plan-stale').hidden`) {
			t.Error("the plan shown is not marked as for earlier inputs")
		}
		h.typeInto("#f-plan-distance_m", "ten")
		h.settle()
		if msg := h.text("#f-plan-distance_m-msg"); !strings.Contains(msg, "Enter a number") {
			t.Errorf("message for text: %q", msg)
		}
		h.click("#plan-run")
		if got := h.text("#plan-error"); !strings.Contains(got, "marked fields") {
			t.Errorf("planning with a bad field: %q", got)
		}
		if h.text("#plan-rec-label") != want.Options[want.Recommended].Label {
			t.Error("the last plan was not kept")
		}
		h.typeInto("#f-plan-distance_m", "18")
		h.settle()
		if msg := h.text("#f-plan-distance_m-msg"); msg != "" {
			t.Errorf("message stays: %q", msg)
		}
		h.typeInto("#f-plan-pendant_steps_pct", "50, 40")
		h.settle()
		if msg := h.text("#f-plan-pendant_steps_pct-msg"); !strings.Contains(msg, "100") {
			t.Errorf("message at the pendant steps: %q", msg)
		}
		// A variable-speed drive has no pendant steps: the field goes, and
		// the steps come back with the pendant.
		h.do(chromedp.Focus(chromedp.ID("f-plan-drive")), chromedp.KeyEvent(kb.ArrowDown))
		h.settle()
		if _, ok := h.scenario()["plan"].(map[string]any)["pendant_steps_pct"]; ok || eval[bool](h, `!!document.getElementById('f-plan-pendant_steps_pct')`) {
			t.Error("pendant steps kept with a variable-speed drive")
		}
		if msg := h.text("#general-error"); msg != "" && !eval[bool](h, `document.getElementById('general-error').hidden`) {
			t.Errorf("general error: %q", msg)
		}
		if got := h.value("#f-plan-drive"); got != "variable_speed" {
			t.Errorf("drive after the arrow key: %q", got)
		}
		h.do(chromedp.Focus(chromedp.ID("f-plan-drive")), chromedp.KeyEvent(kb.ArrowUp))
		h.settle()
		if got := h.value("#f-plan-pendant_steps_pct"); got != "50, 40" {
			t.Errorf("pendant steps after choosing either drive again: %q", got)
		}
		h.typeInto("#f-plan-pendant_steps_pct", "")
		h.settle()
		if !eval[bool](h, `document.getElementById('plan-stale').hidden`) {
			t.Errorf("back to the planned inputs, the plan is still marked as for earlier inputs: %v", h.scenario()["plan"])
		}
	})

	t.Run("portrait tablet screenshot of the plan section", func(t *testing.T) {
		h.t = t
		dir := filepath.Join(root, "out", "browser")
		if err := os.MkdirAll(dir, 0o755); err != nil {
			t.Fatal(err)
		}
		shot, err := chromedp.Run(h.ctx, chromedp.Screenshot(chromedp.ID("planner")))
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, "plan-section-portrait.png"), shot, 0o644); err != nil {
			t.Fatal(err)
		}
		// The screen as a person sees it: the top of the section, the
		// options, the curves.
		for name, sel := range map[string]string{"plan-top-portrait.png": "#planner-h", "plan-options-portrait.png": "#plan-rec",
			"plan-curves-portrait.png": "#plot-plan-ramp", "plan-crew-portrait.png": "#plan-opt-0"} {
			eval[bool](h, `document.getElementById('notice').hidden = true; true`)
			eval[bool](h, `document.querySelector(`+strconv.Quote(sel)+`).scrollIntoView({block: 'start'}); true`)
			time.Sleep(150 * time.Millisecond)
			view, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
			if err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(filepath.Join(dir, name), view, 0o644); err != nil {
				t.Fatal(err)
			}
		}
		h.do(chromedp.EmulateViewport(1180, 820))
		eval[bool](h, `document.getElementById('plan-rec').scrollIntoView({block: 'start'}); true`)
		time.Sleep(300 * time.Millisecond)
		land, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
		h.do(chromedp.EmulateViewport(820, 1180))
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, "plan-landscape.png"), land, 0o644); err != nil {
			t.Fatal(err)
		}
	})

	t.Run("applying the recommended option shows the core's figures for its move", func(t *testing.T) {
		h.t = t
		i := want.Recommended
		o := want.Options[i]
		if !strings.Contains(h.text("#plan-nomove"), "motions are empty") {
			t.Error("no note that the example has no motions yet")
		}
		h.click(`#plan-opt-` + strconv.Itoa(i) + ` button.apply`)
		h.settle()
		s := h.scenario()
		mo, _ := s["motions"].([]any)
		wantMo, _ := json.Marshal([]scenario.Motion{o.Motion})
		var wm []any
		_ = json.Unmarshal(wantMo, &wm)
		gotMo, _ := json.Marshal(mo)
		wantJSON, _ := json.Marshal(wm)
		if string(gotMo) != string(wantJSON) {
			t.Fatalf("motions after applying:\n%s\nwant\n%s", gotMo, wantJSON)
		}
		r := h.core()
		h.checkShown(r)
		// The planner checked the same move at the nominal rope (integrator
		// tolerance plan.RelTol, two settle periods); the page's own
		// evaluation uses the default accuracy: they agree closely.
		v := o.Verified[0]
		if d := math.Abs(r.PeakSwingDeg - v.PeakSwingDeg); d > 1e-3*v.PeakSwingDeg+1e-4 {
			t.Errorf("peak %v deg on the page, the plan verified %v", r.PeakSwingDeg, v.PeakSwingDeg)
		}
		if d := math.Abs(r.ResidualSwingDeg - v.ResidualSwingDeg); d > 0.01*v.ResidualSwingDeg+1e-3 {
			t.Errorf("residual %v deg on the page, the plan verified %v", r.ResidualSwingDeg, v.ResidualSwingDeg)
		}
		// The core rounds the shown figure to the unit's step (0.1 deg).
		half := units.Choice{}.Unit("angle").Step / 2
		if got := shownNumber(t, h.text(fig("residual_swing_deg")+" .num")); math.Abs(got-v.ResidualSwingDeg) > 0.01*v.ResidualSwingDeg+half+1e-9 {
			t.Errorf("residual shown %v, the plan verified %v", got, v.ResidualSwingDeg)
		}
		// Still the plan of these inputs: applying changes only the motions.
		if !eval[bool](h, `document.getElementById('plan-stale').hidden`) {
			t.Error("applying an option marked the plan as stale")
		}
		if got := h.text("#plan-opt-" + strconv.Itoa(i) + " button.apply"); !strings.Contains(got, "In the crane motions") {
			t.Errorf("apply button after applying: %q", got)
		}
		// A shaped variable-speed option too (trapezoid with a shaper).
		for j, o := range want.Options {
			if o.Shaper == "" || o.Drive != scenario.DriveVariableSpeed || j == i {
				continue
			}
			h.click(`#plan-opt-` + strconv.Itoa(j) + ` > summary`)
			h.click(`#plan-opt-` + strconv.Itoa(j) + ` button.apply`)
			h.settle()
			if !eval[bool](h, `document.getElementById('plan-opt-`+strconv.Itoa(j)+`').open`) {
				t.Error("the opened option closed on applying it")
			}
			h.checkShown(h.core())
			if got := h.text(`[data-move="0"]`); !strings.Contains(got, "shaper") {
				t.Errorf("the shaped move in the motions: %q", got)
			}
			break
		}
	})

	t.Run("ticking Plan a move starts from the first move; the plan button plans", func(t *testing.T) {
		h.t = t
		h.openExample("Fabrication bay: girder on the overhead crane")
		if eval[bool](h, `document.getElementById('plan-on').checked`) {
			t.Fatal("the demo has no plan block")
		}
		h.click("#plan-on")
		h.settle()
		p := h.scenario()["plan"].(map[string]any)
		mo := h.scenario()["motions"].([]any)[0].(map[string]any)
		if p["distance_m"] != mo["distance_m"] || p["top_speed_m_per_s"] != mo["speed_m_per_s"] || p["max_accel_m_per_s2"] != mo["accel_m_per_s2"] {
			t.Errorf("plan %v from move %v", p, mo)
		}
		before := eval[int](h, `window.swaysheetPlan.count()`)
		h.click("#plan-run")
		h.planSettled(before)
		w := h.corePlan()
		if w.Recommended >= 0 && h.text("#plan-rec-label") != w.Options[w.Recommended].Label {
			t.Errorf("recommended %q, the core %q", h.text("#plan-rec-label"), w.Options[w.Recommended].Label)
		}
		h.click("#plan-on")
		h.settle()
		if _, ok := h.scenario()["plan"]; ok {
			t.Error("plan block kept after unticking")
		}
	})

	t.Run("a slew plan opens with its plan", func(t *testing.T) {
		h.t = t
		before := eval[int](h, `window.swaysheetPlan.count()`)
		h.openExample("tower crane's slew")
		h.planSettled(before)
		w := h.corePlan()
		if w.Recommended >= 0 {
			if got := h.text("#plan-rec-label"); got != w.Options[w.Recommended].Label {
				t.Errorf("recommended %q, the core %q", got, w.Options[w.Recommended].Label)
			}
		} else if !strings.Contains(h.text("#plan-rec"), "No option") {
			t.Errorf("no recommendation not said: %q", h.text("#plan-rec"))
		}
		if got := h.value("#f-plan-radius"); got != fmtField(35) {
			t.Errorf("hook radius in the plan section %q", got)
		}
		if s := h.text("#plan-summary"); !strings.Contains(s, "Slew") || !strings.Contains(s, "deg/s") {
			t.Errorf("slew summary: %q", s)
		}
		// Too fast a slew for the limit: the lean alone breaks it, and the
		// core says what to change.
		h.typeInto("#f-plan-top_rate_deg_per_s", "30")
		h.settle()
		before = eval[int](h, `window.swaysheetPlan.count()`)
		h.click("#plan-run")
		h.planSettled(before)
		w = h.corePlan()
		if len(w.Infeasible) == 0 {
			t.Fatal("the core finds the fast slew feasible")
		}
		got := h.texts("#plan-infeasible li")
		if len(got) != len(w.Infeasible) {
			t.Fatalf("infeasible messages %q, the core %q", got, w.Infeasible)
		}
		for i, m := range w.InfeasibleSentences {
			if m := said(t, m, "si"); !strings.Contains(got[i], m) {
				t.Errorf("message %d: %q, the core %q", i, got[i], m)
			}
		}
		if !strings.Contains(h.text("#plan-rec"), "No option") {
			t.Errorf("no recommendation not said: %q", h.text("#plan-rec"))
		}
	})
}

func TestHookPlan(t *testing.T) {
	h := setup(t)
	before := eval[int](h, `window.swaysheetPlan.count()`)
	h.openExample("light panel's travel under the big gantry")
	h.planSettled(before)
	w := h.corePlan()
	if len(w.ModePeriodsS) != 2 {
		t.Fatalf("the core gives no mode periods for the hook example: %v", w.ModePeriodsS)
	}
	if w.Recommended < 0 || h.text("#plan-rec-label") != w.Options[w.Recommended].Label {
		t.Errorf("recommended %q, the core %d", h.text("#plan-rec-label"), w.Recommended)
	}
	for sel, v := range map[string]string{"#plan-mode1": shown("time", "s", w.ModePeriodsS[0]) + "\u00a0s", "#plan-mode2": shown("time", "s", w.ModePeriodsS[1]) + "\u00a0s",
		"#plan-share": fmtRes(100*w.SecondModeShare) + "\u00a0%"} {
		if got := h.text(sel); got != v {
			t.Errorf("%s: %q, the core %q", sel, got, v)
		}
	}
	for i, o := range w.Options {
		row := h.text("#plan-table tbody tr:nth-child(" + strconv.Itoa(i+1) + ")")
		if o.TwoMode != strings.Contains(row, "both modes") {
			t.Errorf("%s: two-mode %v, row %q", o.Key, o.TwoMode, row)
		}
		if len(o.Verified) == 0 {
			continue // not simulated (screened): linear-theory estimates only
		}
		if v := o.Verified[0]; v.PeakRiggingAngleDeg > 0 {
			got := h.text("#plan-opt-" + strconv.Itoa(i) + " table.verified tbody tr:first-child td:last-child")
			if got != shown("angle", "deg", v.PeakRiggingAngleDeg) {
				t.Errorf("%s: rope to rigging %q, the core %v", o.Key, got, v.PeakRiggingAngleDeg)
			}
		}
	}
	if n := eval[int](h, `document.querySelectorAll('#plot-plan-rope path.line').length`); n != len(w.Curves.RopeError.Series) {
		t.Errorf("rope-error plot: %d lines, the core %d", n, len(w.Curves.RopeError.Series))
	}
	h.click("#plan-opt-" + strconv.Itoa(w.Recommended) + " button.apply")
	h.settle()
	r := h.core()
	h.checkShown(r)
	if r.Rigging == nil || h.text(fig("rigging.mode_periods_s[1]")+" .num") != rowText(h.presented(r), "rigging.mode_periods_s[1]") {
		t.Errorf("results after applying: second mode %q", h.text(fig("rigging.mode_periods_s[1]")))
	}
	dir := filepath.Join(root, "out", "browser")
	eval[bool](h, `document.getElementById('notice').hidden = true; document.getElementById('plan-summary').scrollIntoView({block: 'start'}); true`)
	time.Sleep(150 * time.Millisecond)
	if shot, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot()); err == nil {
		_ = os.WriteFile(filepath.Join(dir, "plan-hook-portrait.png"), shot, 0o644)
	}
}

func TestHookBlockPage(t *testing.T) {
	h := setup(t)

	t.Run("hook block inputs show the core's mode periods", func(t *testing.T) {
		h.t = t
		if !eval[bool](h, `document.querySelector('#figures [data-key^="rigging."]') === null`) {
			t.Error("mode periods shown without a hook block")
		}
		h.click("#hook-on")
		h.settle()
		h.typeInto("#f-load-hook-mass_kg", "1400")
		h.typeInto("#f-load-hook-rigging_length_m", "6")
		h.settle()
		s := h.scenario()
		hook := s["load"].(map[string]any)["hook"].(map[string]any)
		if hook["mass_kg"] != 1400.0 || hook["rigging_length_m"] != 6.0 {
			t.Fatalf("hook in the scenario: %v", hook)
		}
		r := h.core()
		g := r.Rigging
		if g == nil {
			t.Fatal("the core gives no rigging block")
		}
		// Every rigging figure of the core's table is shown (checkShown
		// compares each row with figures.Present).
		rep := h.presented(r)
		for _, key := range []string{"rigging.mode_periods_s[0]", "rigging.mode_periods_s[1]", "rigging.simulated_periods_s[0]",
			"rigging.simulated_periods_s[1]", "rigging.second_mode_share", "rigging.peak_rigging_angle_deg", "rigging.rigging_tension_max_n"} {
			if w := rowText(rep, key); w == "" || h.text(fig(key)+" .num") != w {
				t.Errorf("%s shows %q, the core gives %q", key, h.text(fig(key)+" .num"), w)
			}
		}
		h.checkShown(r)
		for _, w := range r.Warnings {
			if !strings.Contains(h.text("#warnings"), w) {
				t.Errorf("warning not shown: %q", w)
			}
		}
		// Off and on again: the hook block comes back as typed.
		h.click("#hook-on")
		h.settle()
		if _, ok := h.scenario()["load"].(map[string]any)["hook"]; ok || !eval[bool](h, `document.querySelector('#figures [data-key^="rigging."]') === null`) {
			t.Error("hook block still modelled after unticking")
		}
		h.click("#hook-on")
		h.settle()
		if got := h.value("#f-load-hook-mass_kg"); got != "1400" {
			t.Errorf("hook mass after ticking again: %q", got)
		}
		dir := filepath.Join(root, "out", "browser")
		if err := os.MkdirAll(dir, 0o755); err != nil {
			t.Fatal(err)
		}
		eval[bool](h, `document.getElementById('notice').hidden = true; document.getElementById('results').scrollIntoView({block: 'start'}); true`)
		time.Sleep(150 * time.Millisecond)
		if shot, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot()); err != nil {
			t.Fatal(err)
		} else if err := os.WriteFile(filepath.Join(dir, "hook-block-results-portrait.png"), shot, 0o644); err != nil {
			t.Fatal(err)
		}
		h.typeInto("#f-load-hook-rigging_length_m", "0")
		h.settle()
		if msg := h.text("#f-load-hook-rigging_length_m-msg"); !strings.Contains(msg, "accepted") {
			t.Errorf("message at the rigging length: %q", msg)
		}
	})

	t.Run("the heavy hook example shows both modes", func(t *testing.T) {
		h.t = t
		h.openExample("heavy hook block")
		r := h.core()
		if r.Rigging == nil {
			t.Fatal("no rigging block")
		}
		if got, w := h.text(fig("rigging.mode_periods_s[1]")+" .num"), rowText(h.presented(r), "rigging.mode_periods_s[1]"); got != w {
			t.Errorf("second mode %q, the core %q", got, w)
		}
		if got := h.value("#f-load-hook-rigging_length_m"); got != "6" {
			t.Errorf("rigging length field %q", got)
		}
		if len(r.Warnings) == 0 {
			t.Error("the core gives no warning for the heavy hook block")
		}
		for _, w := range r.Warnings {
			if !strings.Contains(h.text("#warnings"), w) {
				t.Errorf("warning not shown: %q", w)
			}
		}
	})
}
