package browsertest

import (
	"reflect"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/target"
	"github.com/chromedp/chromedp"
)

// The page's rows of the README's bad-input table: a malformed share link,
// an input only the core can judge, and an engine that fails. Each shows
// a message, keeps the last valid result and loses nothing saved.
func TestBadInputInThePage(t *testing.T) {
	h := setup(t)

	t.Run("malformed share link keeps the inputs", func(t *testing.T) {
		h.t = t
		h.typeInto("#f-load-mass_kg", "4321")
		h.settle()
		want := h.scenario()
		saved := eval[int](h, `Object.keys(localStorage).length`)
		for _, frag := range []string{"#s=@@not-base64@@", "#s=bm90IGpzb24", "#s=eyJmb3JtYXQiOjF9"} {
			h.do(chromedp.Navigate("about:blank"), chromedp.Navigate(h.url+frag), chromedp.WaitReady(chromedp.CSS("#headline")))
			h.settle()
			if got := h.scenario(); !reflect.DeepEqual(got, want) {
				t.Errorf("%s: the inputs changed:\n%v\n%v", frag, got, want)
			}
			if n := eval[int](h, `Object.keys(localStorage).length`); n < saved {
				t.Errorf("%s: saved entries went from %d to %d", frag, saved, n)
			}
			if frag == "#s=@@not-base64@@" {
				// Not a link the page makes at all: the fragment is left alone.
				continue
			}
			if msg := h.text("#notice"); !strings.Contains(msg, "does not hold a readable scenario") {
				t.Errorf("%s: notice %q", frag, msg)
			}
		}
		h.checkShown(h.core())
	})

	t.Run("an input only the core can judge: message, last result kept", func(t *testing.T) {
		h.t = t
		before := h.text("#headline")
		// A move starting near the end of the longest run: the core says the
		// run would be too long.
		// Pasted, not typed: typed key by key, a busy machine computes the
		// valid values on the way ("3", "35", "359") and shows their results.
		h.pasteInto("#f-motions-0-start_s", "3590")
		h.settle()
		if !strings.Contains(h.text("main"), "at most 3600 s is simulated") {
			t.Errorf("no message for the run length; page says %q", h.text("#stale"))
		}
		if got := h.text("#headline"); got != before || eval[bool](h, `document.getElementById('stale').hidden`) {
			t.Errorf("the last valid results were not kept and marked:\n%q\n%q\nstale hidden: %v", before, got, eval[bool](h, `document.getElementById('stale').hidden`))
		}
		h.typeInto("#f-motions-0-start_s", "1")
		h.settle()
		h.checkShown(h.core())
	})
}

// A failure inside the engine never leaves the page dead: the worker is
// made to throw, the page restarts it, and the next change computes.
func TestEngineFailureRecovers(t *testing.T) {
	h := setup(t)
	infos, err := chromedp.Call(h.ctx, target.GetTargets, target.GetTargetsParams{})
	if err != nil {
		t.Fatal(err)
	}
	var worker target.ID
	for _, ti := range infos.TargetInfos {
		if ti.Type == "worker" {
			worker = ti.TargetID
		}
	}
	if worker == "" {
		t.Fatal("no worker target")
	}
	wctx, cancel := chromedp.NewContext(h.ctx, chromedp.WithTargetID(worker))
	defer cancel()
	if _, err := chromedp.Run(wctx, chromedp.Evaluate[bool](`setTimeout(function () { throw new Error('made to fail by the test'); }, 0), true`)); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](`document.getElementById('notice').textContent.includes('restarted')`,
		chromedp.WithPollingTimeout(20*time.Second))); err != nil {
		t.Fatalf("no restart notice: %v (engine banner %q)", err, h.text("#engine-error"))
	}
	h.typeInto("#f-load-rope_length_m", "11")
	h.settle()
	h.checkShown(h.core())
	if !eval[bool](h, `document.getElementById('engine-error').hidden`) {
		t.Errorf("engine error banner shown: %q", h.text("#engine-error"))
	}
}
