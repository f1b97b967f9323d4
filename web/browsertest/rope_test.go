package browsertest

import (
	"encoding/json"
	"errors"
	"math"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"swaysheet/core/ropelength"
	"swaysheet/core/scenario"
)

// ropeSettled waits until the rope-length fold has the core's answer for
// what is typed in it.
func (h *harness) ropeSettled() {
	h.t.Helper()
	if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](`window.swaysheetRope && window.swaysheetRope.answered()`,
		chromedp.WithPollingTimeout(60*time.Second), chromedp.WithPollingInterval(50*time.Millisecond))); err != nil {
		h.t.Fatalf("the rope-length fold did not settle: %v", err)
	}
}

// ropeCore answers a question with the Go core directly.
func ropeCore(t *testing.T, q string) *ropelength.Result {
	t.Helper()
	r, err := ropelength.Parse([]byte(q))
	if err != nil {
		t.Fatalf("%s: %v", q, err)
	}
	return r
}

// ropeType types into the fold's field of that JSON path.
func (h *harness) ropeType(path, text string) {
	h.t.Helper()
	h.typeInto("#rf-"+strings.NewReplacer(".", "-").Replace(path), text)
	h.ropeSettled()
}

func (h *harness) ropeWay(way string) {
	h.t.Helper()
	h.click(`#rope-find input[data-ropeway][value="` + way + `"]`)
	h.ropeSettled()
}

// ropeOpen opens the fold and waits for its inside (drawn on the
// details' toggle event, which comes after the click).
func (h *harness) ropeOpen() {
	h.t.Helper()
	h.click("#rope-find > summary")
	if err := h.poll(`document.getElementById('rope-find').open && !!document.querySelector('#rope-body input')`, 10*time.Second); err != nil {
		h.t.Fatalf("the fold did not open: %v", err)
	}
}

// ropeTimed types a timed swing: the count, the seconds, the swing size.
func (h *harness) ropeTimed(swings, seconds, size string) {
	h.t.Helper()
	h.ropeWay("timed")
	h.ropeType("timed.swings", swings)
	h.ropeType("timed.time_s", seconds)
	h.choose("rf-size", size)
	h.ropeSettled()
}

// The rope-length fold (rope-form.js): from heights and from a timed
// swing, in SI and US units, its answer is the core's ropelength call's
// (compared with core/ropelength directly), "Use this length" puts it into
// the rope length field and the results are then the core's for it; a
// bad input shows the core's message naming the range, text that is not
// a number is asked again; what was typed is kept over a reload; with a
// rigid load the effective length is shown; axe finds nothing serious.
func TestRopeForm(t *testing.T) {
	h := setup(t)
	h.ropeOpen()

	// From heights, SI: L = sheave - hook + slings + centre (core/ropelength).
	h.ropeType("heights.sheave_height_m", "32.5")
	h.ropeType("heights.hook_height_m", "14")
	h.ropeType("heights.sling_depth_m", "3")
	h.ropeType("heights.centre_depth_m", "0.55")
	want := ropeCore(t, `{"heights": {"sheave_height_m": 32.5, "hook_height_m": 14, "sling_depth_m": 3, "centre_depth_m": 0.55}}`)
	if got, w := h.text("#rope-length"), shown("length", "m", want.RopeLengthM)+" m"; got != w {
		t.Fatalf("from heights: %q, the core gives %q", got, w)
	}
	if out := h.text("#rope-out"); !strings.Contains(out, shown("time", "s", want.FromHeights.SmallSwingPeriodS)+" s") {
		t.Errorf("from heights: the small swing's time %.3f s is not shown: %q", want.FromHeights.SmallSwingPeriodS, out)
	}
	if axe := h.axe(); len(axe) > 0 {
		t.Errorf("axe, the fold open with an answer:\n%s", strings.Join(axe, "\n"))
	}
	// Open, it keeps the keyboard's order the screen's (jobs_test.go) and
	// its targets large enough for a gloved finger.
	if p := eval[string](h, tabOrder); p != "" {
		t.Errorf("the keyboard's order with the fold open: %s", p)
	}
	if small := eval[string](h, `Array.from(document.querySelectorAll('#rope-find input, #rope-find select, #rope-find button, #rope-find summary'))
		.filter(function (e) { var r = e.getBoundingClientRect(); return r.height < 44 || r.width < 44; }).map(function (e) { return e.id || e.tagName; }).join(', ')`); small != "" {
		t.Errorf("targets in the fold smaller than 44 px: %s", small)
	}

	// Use this length: the field, the scenario and the results follow.
	before := eval[float64](h, `window.swaysheet.resultCount()`)
	h.click("#rope-use")
	h.settle()
	if got := h.scenario()["load"].(map[string]any)["rope_length_m"].(float64); math.Abs(got-want.RopeLengthM) > 0.005 {
		t.Fatalf("rope length in the scenario %v m, the answer %v m", got, want.RopeLengthM)
	}
	if v := h.value("#f-load-rope_length_m"); v != shown("length", "m", want.RopeLengthM) {
		t.Errorf("the rope length field shows %q, want %q", v, shown("length", "m", want.RopeLengthM))
	}
	if eval[float64](h, `window.swaysheet.resultCount()`) <= before {
		t.Error("no new result after Use this length")
	}
	r := h.core()
	if math.Abs(r.RopeLengthStartM-want.RopeLengthM) > 0.005 {
		t.Errorf("the core's result is at rope %v m", r.RopeLengthStartM)
	}
	h.checkShown(r)
	// Typing in the field undoes it.
	h.typeInto("#f-load-rope_length_m", "8.5")
	h.settle()
	if got := h.scenario()["load"].(map[string]any)["rope_length_m"]; got != 8.5 {
		t.Errorf("typed over: %v", got)
	}

	// A timed swing, SI, with the large-swing correction.
	h.ropeTimed("8", "47.2", "20")
	want = ropeCore(t, `{"timed": {"swings": 8, "time_s": 47.2, "amplitude_deg": 20}}`)
	out := h.text("#rope-out")
	if got, w := h.text("#rope-length"), shown("length", "m", want.RopeLengthM)+" m"; got != w ||
		!strings.Contains(out, shown("time", "s", want.FromTimed.SmallSwingPeriodS)+" s") ||
		!strings.Contains(out, shown("length", "m", want.FromTimed.RangeM[0])+" m to "+shown("length", "m", want.FromTimed.RangeM[1])+" m") {
		t.Errorf("timed: %q with %q; the core gives %q, small swing %.3f s, range %v", got, out, w, want.FromTimed.SmallSwingPeriodS, want.FromTimed.RangeM)
	}

	// Bad input: the core's message names the range; text is asked again.
	h.ropeType("timed.time_s", "0")
	_, err := ropelength.Parse([]byte(`{"timed": {"swings": 8, "time_s": 0}}`))
	var fe scenario.Errors
	if !errors.As(err, &fe) || fe[0].Field != "timed.time_s" {
		t.Fatalf("the core on time 0: %v", err)
	}
	msg := h.text(`[data-rope-field="timed.time_s"] .msg`)
	if !strings.Contains(msg, fe[0].Message) || !eval[bool](h, `document.getElementById('rf-timed-time_s').getAttribute('aria-invalid') === 'true'`) ||
		h.text("#rope-length") != "(missing #rope-length)" {
		t.Errorf("time 0: the field shows %q, the core says %q", msg, fe[0].Message)
	}
	h.ropeType("timed.time_s", "4x")
	if msg := h.text(`[data-rope-field="timed.time_s"] .msg`); !strings.Contains(msg, "Enter a number in s") || strings.Contains(h.text("#rope-find"), "NaN") {
		t.Errorf("time 4x: %q", msg)
	}
	h.ropeType("timed.time_s", "47.2")

	// US units: the heights in ft; the answer in ft, the core's.
	h.do(chromedp.Click(chromedp.ID("sys-us")))
	h.settle()
	h.ropeWay("heights")
	if v := h.value("#rf-heights-sheave_height_m"); v != fmtTyped(32.5/0.3048) {
		t.Errorf("the sheave height kept, in ft: %q", v)
	}
	h.ropeType("heights.sheave_height_m", "100")
	h.ropeType("heights.hook_height_m", "40")
	q, _ := json.Marshal(map[string]any{"heights": map[string]any{"sheave_height_m": 100 * 0.3048, "hook_height_m": 40 * 0.3048, "sling_depth_m": 3.0, "centre_depth_m": 0.55}})
	want = ropeCore(t, string(q))
	if got, w := h.text("#rope-length"), shown("length", "ft", want.RopeLengthM)+" ft"; got != w {
		t.Errorf("US from heights: %q, the core gives %q", got, w)
	}
	h.ropeType("heights.sheave_height_m", "5000")
	if msg := h.text(`[data-rope-field="heights.sheave_height_m"] .msg`); !strings.Contains(msg, "5000 ft is out of range: accepted from -1640 up to 3280 ft") {
		t.Errorf("US 5000 ft: %q", msg)
	}
	h.ropeType("heights.sheave_height_m", "100")
	h.click("#rope-use")
	h.settle()
	if got := h.scenario()["load"].(map[string]any)["rope_length_m"].(float64); math.Abs(got-want.RopeLengthM) > 0.05*0.3048/2+1e-9 {
		t.Errorf("US: rope length in the scenario %v m, the answer %v m", got, want.RopeLengthM)
	}
	h.checkShown(h.core())

	// Kept over a reload: the fold open on heights, the values typed.
	h.do(chromedp.Reload())
	h.settle()
	h.ropeSettled()
	if !eval[bool](h, `document.getElementById('rope-find').open`) || h.value("#rf-heights-hook_height_m") != "40" ||
		h.text("#rope-length") != shown("length", "ft", want.RopeLengthM)+" ft" {
		t.Errorf("after a reload: open %v, hook height %q, answer %q", eval[bool](h, `document.getElementById('rope-find').open`),
			h.value("#rf-heights-hook_height_m"), h.text("#rope-length"))
	}

	// A hook block: the rope to the hook, the effective length the tool
	// shapes for, and the core's note on the swing size's correction (the
	// timed swing typed before is kept).
	h.do(chromedp.Click(chromedp.ID("sys-si")))
	h.settle()
	h.click("#hook-on")
	h.settle()
	h.ropeWay("timed")
	l := h.scenario()["load"].(map[string]any)
	hq, _ := json.Marshal(map[string]any{"timed": map[string]any{"swings": 8, "time_s": 47.2, "amplitude_deg": 20},
		"hook": map[string]any{"mass_kg": l["hook"].(map[string]any)["mass_kg"], "load_mass_kg": l["mass_kg"], "rigging_length_m": l["hook"].(map[string]any)["rigging_length_m"]}})
	want = ropeCore(t, string(hq))
	out = h.text("#rope-out")
	if got := h.text("#rope-length"); got != shown("length", "m", want.RopeLengthM)+" m" || want.RopeLengthM != want.FromTimed.RopeToHookM ||
		!strings.Contains(out, "Effective length the tool shapes for: "+shown("length", "m", want.FromTimed.EffectiveLengthM)+" m") ||
		len(want.Notes) == 0 || !strings.Contains(out, want.Notes[0]) {
		t.Errorf("hook block: %q, %q; the core gives rope to the hook %.3f m, effective %.3f m, notes %q", got, out, want.RopeLengthM, want.FromTimed.EffectiveLengthM, want.Notes)
	}

	// A rigid load: the rope to the hook and the effective length the
	// tool shapes for (the bay girder: 5 swings in 32.65 s is about 5 m).
	// Ticking the rigid load: the rope length field and the fold say the
	// rope runs to the hook.
	h.click("#hook-on")
	h.settle()
	h.click("#body-on")
	h.settle()
	h.ropeSettled()
	if fh, rh := h.text("#f-load-rope_length_m-hint"), h.text("#rope-body > .hint"); !strings.Contains(fh, "sheave to the hook (") || !strings.Contains(rh, "sheave to the hook (") {
		t.Errorf("rigid load: the field's hint %q, the fold's %q", fh, rh)
	}
	h.openExample("girder as a rigid load")
	h.ropeTimed("5", "32.65", "0")
	l = h.scenario()["load"].(map[string]any)
	lq, _ := json.Marshal(map[string]any{"timed": map[string]any{"swings": 5, "time_s": 32.65},
		"load": map[string]any{"mass_kg": l["mass_kg"], "body": l["body"]}})
	want = ropeCore(t, string(lq))
	out = h.text("#rope-out")
	if got := h.text("#rope-length"); got != shown("length", "m", want.RopeLengthM)+" m" ||
		!strings.Contains(out, "Effective length the tool shapes for: "+shown("length", "m", want.FromTimed.EffectiveLengthM)+" m") {
		t.Errorf("rigid load: %q, %q; the core gives rope %.3f m, effective %.3f m", got, out, want.RopeLengthM, want.FromTimed.EffectiveLengthM)
	}
	if axe := h.axe(); len(axe) > 0 {
		t.Errorf("axe, US and a rigid load:\n%s", strings.Join(axe, "\n"))
	}

	// A swing too quick for any rope: the core's message names the rope
	// lengths it tried as a pair "a to b m"; in US units both ends are in
	// ft (before, only the second was converted and the first kept its
	// metres under the ft label).
	h.do(chromedp.Click(chromedp.ID("sys-us")))
	h.settle()
	h.ropeTimed("5", "5", "0")
	rr := scenario.Ranges["load.rope_length_m"]
	// Six significant digits, as units.js's fmtRange gives a bound
	// without a side: 0.3 m is 0.984252 ft, 500 m 1640.42 ft.
	pair := strconv.FormatFloat(rr.Min/0.3048, 'g', 6, 64) + " to " + strconv.FormatFloat(rr.Max/0.3048, 'g', 6, 64) + " ft"
	if msg := h.text("#rope-find"); !strings.Contains(msg, pair) || strings.Contains(msg, " m ") || strings.Contains(msg, " m)") {
		t.Errorf("US, a swing too quick: want %q in %q", pair, msg)
	}
}
