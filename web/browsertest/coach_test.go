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

	"swaysheet/core/plan"
)

// fakeClock is the coach's time source in the test: now() and a
// scheduler that advance(ms) drives, firing what falls due in order.
const fakeClock = `(function(){
  var c = {t: 1000, q: [], seq: 0, lag: 0};
  c.now = function(){ return c.t; };
  c.after = function(ms, fn){ var id = ++c.seq; c.q.push({at: c.t + Math.max(0, ms), fn: fn, id: id}); return id; };
  c.cancel = function(id){ c.q = c.q.filter(function(e){ return e.id !== id; }); };
  c.advance = function(ms){
    var end = c.t + ms;
    for (;;) {
      c.q.sort(function(a, b){ return a.at - b.at || a.id - b.id; });
      var e = c.q[0];
      if (!e || e.at > end) break;
      c.q.shift(); c.t = e.at + c.lag; e.fn();
    }
    c.t = end;
  };
  window.testClock = c;
  window.swaysheetCoach.useClock(c);
  // Stubs that count the sound and vibration calls.
  var calls = window.coachCalls = {osc: 0, stopped: 0, closed: 0, vib: []};
  window.AudioContext = function(){
    this.currentTime = 0; this.destination = {};
    this.createGain = function(){ return {gain: {value: 1}, connect: function(){}}; };
    this.createOscillator = function(){ return {frequency: {value: 0}, connect: function(){}, start: function(){ calls.osc++; }, stop: function(){ calls.stopped++; }}; };
    this.close = function(){ calls.closed++; return Promise.resolve(); };
  };
  Object.defineProperty(navigator, 'vibrate', {configurable: true, value: function(p){ calls.vib.push(p); return true; }});
  return true;
})()`

type coachEvent struct {
	Kind      string  `json:"kind"`
	Text      string  `json:"text"`
	AtMs      float64 `json:"at_ms"`
	PlannedMs float64 `json:"planned_ms"`
}

// TestPressCoach: the coach of the pendant example's own-steps option
// gives each cue at the moment the plan's counts set (within 50 ms), with
// a count-in, a beep and a vibration; a release at a mark waits for the
// tap; Stop ends it with no cue after. Screenshots in out/browser/.
func TestPressCoach(t *testing.T) {
	h := setup(t)
	before := eval[int](h, `window.swaysheetPlan.count()`)
	h.openExample("three-step pendant")
	h.planSettled(before)
	var r plan.Result
	if err := json.Unmarshal([]byte(eval[string](h, `window.swaysheetPlan.resultJSON()`)), &r); err != nil {
		t.Fatal(err)
	}
	k := -1
	for i, o := range r.Options {
		if len(o.Presses) > 0 {
			k = i
			break
		}
	}
	if k < 0 {
		t.Fatal("the pendant example has no option with presses")
	}
	o := r.Options[k]
	btn := `[data-coach="` + strconv.Itoa(k) + `"]`
	eval[bool](h, `document.getElementById('plan-opt-`+strconv.Itoa(k)+`').open = true`)
	h.click(btn)
	if !eval[bool](h, `window.swaysheetCoach.running() && !!document.getElementById('coach')`) {
		t.Fatal("the coach did not open")
	}
	eval[bool](h, fakeClock)
	if !eval[bool](h, `document.querySelector('main').inert`) {
		t.Error("the page behind the coach can be reached")
	}

	// The screen states the timing scatter and the cautions.
	note := h.text("#coach")
	for _, w := range []string{"9 in 10 times", "timing scatter", "No one under the load", "swings more than the plan allows"} {
		if !strings.Contains(note, w) {
			t.Errorf("coach screen lacks %q", w)
		}
	}
	// An option outside the limits says so, with what it breaks.
	if out := h.text("#coach-outside"); o.Within != strings.HasPrefix(out, "(missing") || !o.Within && !strings.Contains(out, "OUTSIDE") {
		t.Errorf("option within %v, the coach says %q", o.Within, out)
	}
	for _, p := range o.Presses {
		if p.BeforeStopM > 0 && !strings.Contains(note, shown("length", "m", p.BeforeStopM)+"\u00a0m before the stop point") {
			t.Errorf("no mark %v m on the coach", p.BeforeStopM)
		}
	}

	dir := filepath.Join(root, "out", "browser")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	shot := func(name string, w, ht int64) {
		h.do(chromedp.EmulateViewport(w, ht))
		eval[bool](h, `document.getElementById('coach').scrollTop = 0, true`)
		b, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, name), b, 0o644); err != nil {
			t.Fatal(err)
		}
	}

	shot("coach-ready-390x844.png", 390, 844)
	h.do(chromedp.EmulateViewport(820, 1180))
	h.click("#coach-start")
	t0 := eval[float64](h, `window.testClock.now()`)
	// The planned moments: the count-in of 3 s, then each count from the
	// cue before; a release at a mark is made when the test taps.
	want := []float64{}
	at := t0 + 3000
	for i, p := range o.Presses {
		if p.ByMark {
			// Tap 1.3 s after the planned moment: the next counts run from the tap.
			gap := (p.AtS - o.Presses[i-1].AtS) * 1000
			eval[bool](h, `window.testClock.advance(`+strconv.FormatFloat(gap+1300, 'f', 3, 64)+`), true`)
			if eval[bool](h, `document.getElementById('coach-marked').hidden`) {
				t.Fatalf("press %d: no tap for the mark", i)
			}
			if cue := h.text("#coach-cue"); !strings.HasPrefix(cue, "At the mark: RELEASE") || !strings.Contains(h.text("#coach-mark"), shown("length", "m", p.BeforeStopM)+"\u00a0m") {
				t.Errorf("waiting for the mark: %q, %q", cue, h.text("#coach-mark"))
			}
			if i == 3 {
				shot("coach-390x844.png", 390, 844)
				shot("coach-820x1180.png", 820, 1180)
			}
			at = eval[float64](h, `window.testClock.now()`)
			h.click("#coach-marked")
			want = append(want, at)
			continue
		}
		if i > 0 {
			at += p.CountS * 1000
		}
		want = append(want, at)
		eval[bool](h, `window.testClock.advance(`+strconv.FormatFloat(at-eval[float64](h, `window.testClock.now()`)+10, 'f', 3, 64)+`), true`)
	}
	var log []coachEvent
	if err := json.Unmarshal([]byte(eval[string](h, `window.swaysheetCoach.logJSON()`)), &log); err != nil {
		t.Fatal(err)
	}
	var cues, counts []coachEvent
	for _, e := range log {
		switch e.Kind {
		case "cue":
			cues = append(cues, e)
		case "count":
			counts = append(counts, e)
		}
	}
	if len(cues) != len(o.Presses) {
		t.Fatalf("%d cues, the plan has %d presses: %+v", len(cues), len(o.Presses), log)
	}
	for i, c := range cues {
		if math.Abs(c.AtMs-want[i]) > 50 {
			t.Errorf("cue %d %q at %.0f ms, planned %.0f ms", i, c.Text, c.AtMs-t0, want[i]-t0)
		}
		rel := o.Presses[i].Release
		if rel != strings.HasPrefix(c.Text, "RELEASE") || !strings.Contains(c.Text, strconv.Itoa(int(o.Presses[i].Pct))) && o.Presses[i].Pct != 0 {
			t.Errorf("cue %d %q, the plan: step %v %%, release %v", i, c.Text, o.Presses[i].Pct, rel)
		}
	}
	if !eval[bool](h, `document.getElementById('coach-late').hidden`) {
		t.Errorf("cues on time marked late: %q", h.text("#coach-late"))
	}
	if len(counts) < 3 {
		t.Errorf("%d count-in calls", len(counts))
	}
	calls := eval[map[string]any](h, `window.coachCalls`)
	if n := calls["osc"].(float64); n < float64(len(cues)+len(counts)) {
		t.Errorf("%v beeps for %d cues and %d counts", n, len(cues), len(counts))
	}
	if n := len(calls["vib"].([]any)); n < len(cues)+len(counts) {
		t.Errorf("%d vibrations for %d cues and %d counts", n, len(cues), len(counts))
	}
	t.Logf("%d cues, %d count-in beats, %v oscillators, %d vibrations", len(cues), len(counts), calls["osc"], len(calls["vib"].([]any)))

	// Stop, in the middle of a second run in US units: no cue after it.
	h.click("#coach-stop")
	h.do(chromedp.Click(chromedp.ID("sys-us")))
	h.settle()
	eval[bool](h, `document.getElementById('plan-opt-`+strconv.Itoa(k)+`').open = true`)
	h.click(btn)
	eval[bool](h, fakeClock)
	// ft = 0.3048 m exactly (NIST SP 811, appendix B), from core/units.
	if last := o.Presses[len(o.Presses)-1]; !strings.Contains(h.text("#coach-list"), shown("length", "ft", last.BeforeStopM)+"\u00a0ft before the stop point") {
		t.Errorf("the marks are not in feet: %q", h.text("#coach-list"))
	}
	h.click("#coach-start")
	// A device that holds timers back 400 ms: the cue is marked late.
	eval[bool](h, `window.testClock.lag = 400, window.testClock.advance(3500), true`) // the first cue, then part of the count to the second
	if late := h.text("#coach-late"); !strings.Contains(late, "late") || eval[bool](h, `document.getElementById('coach-late').hidden`) {
		t.Errorf("a cue 0.4 s late is not marked: %q", late)
	}
	h.click("#coach-stop")
	eval[bool](h, `window.testClock.advance(60000), true`)
	if err := json.Unmarshal([]byte(eval[string](h, `window.swaysheetCoach.logJSON()`)), &log); err != nil {
		t.Fatal(err)
	}
	stopped := false
	for _, e := range log {
		if e.Kind == "stop" {
			stopped = true
		} else if stopped {
			t.Errorf("%s %q after Stop", e.Kind, e.Text)
		}
	}
	if !stopped {
		t.Error("no stop in the coach's log")
	}
	if eval[bool](h, `window.swaysheetCoach.running() || !!document.getElementById('coach')`) {
		t.Error("the coach is still on screen after Stop")
	}
	if eval[bool](h, `document.querySelector('main').inert`) {
		t.Error("the page stays unreachable after Stop")
	}
	if c := eval[map[string]any](h, `window.coachCalls`); c["closed"].(float64) != 1 {
		t.Errorf("the sound was closed %v times at Stop", c["closed"])
	}
	if last := eval[float64](h, `window.coachCalls.vib[window.coachCalls.vib.length-1]`); last != 0 {
		t.Errorf("the last vibration call %v, want 0 (cancel)", last)
	}
}

// TestPressCoachSlew: for a slew the marks are angles before the stop
// angle, as the plan gives them (tower-crane example with a two-step
// pendant, opened by a share link).
func TestPressCoachSlew(t *testing.T) {
	h := setup(t)
	data, err := os.ReadFile(filepath.Join(root, "testdata", "scenarios", "plan-tower-slew.json"))
	if err != nil {
		t.Fatal(err)
	}
	var sc map[string]any
	if err := json.Unmarshal(data, &sc); err != nil {
		t.Fatal(err)
	}
	pl := sc["plan"].(map[string]any)
	pl["drive"] = "pendant"
	pl["pendant_steps_pct"] = []float64{50, 100}
	text, _ := json.Marshal(sc)
	h.do(chromedp.Navigate("about:blank"), chromedp.Navigate(shareLink(h.url, string(text))), chromedp.WaitReady(chromedp.CSS("#headline")))
	h.settle()
	h.planSettled(0)
	var r plan.Result
	if err := json.Unmarshal([]byte(eval[string](h, `window.swaysheetPlan.resultJSON()`)), &r); err != nil {
		t.Fatal(err)
	}
	for i, o := range r.Options {
		if len(o.Presses) == 0 {
			continue
		}
		eval[bool](h, `document.getElementById('plan-opt-`+strconv.Itoa(i)+`').open = true`)
		h.click(`[data-coach="` + strconv.Itoa(i) + `"]`)
		list := h.text("#coach-list")
		n := 0
		for _, p := range o.Presses {
			if p.BeforeStopDeg > 0 {
				n++
				if !strings.Contains(list, fmtRes(p.BeforeStopDeg)+"\u00a0deg before the stop angle") {
					t.Errorf("%s: no mark %v deg in %q", o.Key, p.BeforeStopDeg, list)
				}
			}
		}
		if n == 0 || strings.Contains(list, "stop point") {
			t.Errorf("%s: slew marks %d, list %q", o.Key, n, list)
		}
		if !strings.HasPrefix(h.text("#coach-stale"), "(missing") {
			t.Errorf("a current plan's coach says it is stale")
		}
		h.click("#coach-stop")
		// Inputs changed since the plan: the coach says so.
		h.typeInto("#f-load-mass_kg", "2345")
		h.settle()
		if err := h.poll(`!document.getElementById('plan-stale').hidden`, 10*time.Second); err != nil {
			t.Fatalf("the plan is not marked stale: %v", err)
		}
		h.click(`[data-coach="` + strconv.Itoa(i) + `"]`)
		if s := h.text("#coach-stale"); !strings.Contains(s, "inputs changed") {
			t.Errorf("stale plan, the coach says %q", s)
		}
		h.click("#coach-stop")
		return
	}
	t.Fatal("the slew plan has no option with presses")
}
