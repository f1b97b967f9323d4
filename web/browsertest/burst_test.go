package browsertest

import (
	"strings"
	"testing"
	"time"

	"swaysheet/core/scenario"
)

// TestInputBurst changes the rope length twelve times a few milliseconds
// apart, each change sent while the core still works on the one before
// (the page sends a change at once; the worker leaves out an evaluation
// overtaken before it began, compute.js and worker.js). Once the page has
// settled: the figures are the core's for the last length, the plots and
// the check sheet are of that same result (result fingerprint), the sheet
// prints the last length, and the rope-angle chart shown is the one drawn
// again from the result presented.
func TestInputBurst(t *testing.T) {
	h := setup(t)
	before := eval[int](h, `window.swaysheet.resultCount()`)
	const last = "9.35"
	eval2[bool](h, `new Promise(function (done) {
	  var el = document.getElementById('f-load-rope_length_m'), i = 0,
	    vs = ['7.1', '7.2', '7.3', '7.4', '7.5', '7.6', '7.7', '7.8', '7.9', '8.1', '8.2', '`+last+`'];
	  el.focus();
	  (function next() {
	    el.value = vs[i++];
	    el.dispatchEvent(new Event('input', { bubbles: true }));
	    if (i < vs.length) setTimeout(next, 2); else done(true);
	  })();
	})`)
	h.settle()
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	if s.Load.RopeLengthM == nil || *s.Load.RopeLengthM != 9.35 {
		t.Fatalf("rope length %v after the burst, want %s", s.Load.RopeLengthM, last)
	}
	h.checkShown(h.core())
	fp, err := scenario.Fingerprint(s)
	if err != nil {
		t.Fatal(err)
	}
	plots := eval[string](h, `document.getElementById('charts').dataset.fingerprint`)
	sheet := eval[string](h, `document.getElementById('sheet-host').dataset.resultFingerprint`)
	if plots != fp || sheet != fp {
		t.Errorf("the inputs are %s; the plots are of %q, the sheet of %q", fp, plots, sheet)
	}
	if txt := h.text("#sheet-host"); !strings.Contains(txt, last) {
		t.Errorf("the sheet does not print the rope length %s", last)
	}
	t.Logf("%d of 12 changes presented", eval[int](h, `window.swaysheet.resultCount()`)-before)
	// Every chart the worker drew with an evaluation was drawn from the
	// evaluation the engine keeps, none from numbers sent back.
	if n := eval[map[string]float64](h, `window.swaysheet.chartsDrawn()`); n["byKey"] == 0 || n["byNumbers"] != 0 {
		t.Errorf("charts drawn with an evaluation: %v, want all by key", n)
	}
	// The rope-angle chart the worker drew with the last change is the
	// one the page draws of the result presented (a resize draws again).
	d := h.plotPath("plot-angle")
	eval[bool](h, `(window.dispatchEvent(new Event('resize')), true)`)
	time.Sleep(400 * time.Millisecond)
	h.settle()
	if again := h.plotPath("plot-angle"); again != d {
		t.Errorf("the rope-angle chart shown after the burst differs from the one drawn again of the result:\n%.200s\n%.200s", d, again)
	}
}

// TestHeldFiguresShownOnError: a change typed while the figures of the
// result before it are still asked for holds those figures back
// (results.js presentFigures: the later inputs' follow at once). When the
// later inputs are rejected by the core, the held figures are shown: the
// page settles with the figures, plots and sheet of the last valid
// result, marked as for earlier inputs, and the field's message.
func TestHeldFiguresShownOnError(t *testing.T) {
	h := setup(t)
	h.pasteInto("#f-load-rope_length_m", "8.3")
	h.settle()
	want := h.text("#figures")
	plots := eval[string](h, `document.getElementById('charts').dataset.fingerprint`)
	h.pasteInto("#f-load-rope_length_m", "7")
	h.settle()
	if h.text("#figures") == want {
		t.Fatal("the figures for 7 m are those for 8.3 m")
	}
	// 8.3 again; -1 is typed once its figures are asked for.
	eval[bool](h, `(function () {
	  var el = document.getElementById('f-load-rope_length_m'), post = Worker.prototype.postMessage, armed = true;
	  Worker.prototype.postMessage = function (m) {
	    if (armed && m && m.name === 'figures') {
	      armed = false;
	      Worker.prototype.postMessage = post;
	      setTimeout(function () { el.value = '-1'; el.dispatchEvent(new Event('input', { bubbles: true })); }, 0);
	    }
	    return post.apply(this, arguments);
	  };
	  el.value = '8.3';
	  el.dispatchEvent(new Event('input', { bubbles: true }));
	  return true;
	})()`)
	h.settle()
	if v := h.value("#f-load-rope_length_m"); v != "-1" {
		t.Fatalf("the field reads %q, want -1", v)
	}
	if msg := h.text("#f-load-rope_length_m-msg"); msg == "" {
		t.Error("no message at the rope length for -1")
	}
	if got := h.text("#figures"); got != want {
		t.Errorf("the figures shown are not those of the last valid result (8.3 m):\n%.300s\nwant\n%.300s", got, want)
	}
	if got := eval[string](h, `document.getElementById('charts').dataset.fingerprint`); got != plots {
		t.Errorf("the plots are of %q, want %q (8.3 m)", got, plots)
	}
	if eval[bool](h, `document.getElementById('stale').hidden`) {
		t.Error("the results are not marked as for earlier inputs")
	}
}
