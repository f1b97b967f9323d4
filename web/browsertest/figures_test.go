package browsertest

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// fig is the selector of the figure row with the given key (its JSON path
// in the evaluate call's result).
func fig(key string) string { return `#figures [data-key=` + strconv.Quote(key) + `]` }

// shownRow is one figure row as the page shows it.
type shownRow struct {
	Key, Crew, Text, Unit, Check, Technical string
}

// shownFigures is the verdict band and the rows as the page shows them.
type shownFigures struct {
	State, Head, Text string
	Rows              []shownRow
}

const readFigures = `(function () {
  var t = function (e, sel) { var x = e && e.querySelector(sel); return x ? x.textContent.trim() : ''; };
  var v = document.getElementById('verdict');
  var tech = {};
  document.querySelectorAll('#engineering tbody tr').forEach(function (tr) { tech[tr.dataset.key] = t(tr, 'th'); });
  return JSON.stringify({
    State: v ? v.dataset.state : '', Head: t(v, '.verdict-head'), Text: t(v, '.verdict-text'),
    Rows: Array.from(document.querySelectorAll('#figures .fig')).map(function (li) {
      return { Key: li.dataset.key, Crew: t(li, '.crew'), Text: t(li, '.num'), Unit: t(li, '.u'), Check: t(li, '.check'), Technical: tech[li.dataset.key] || '' };
    })
  });
})()`

func (h *harness) shownFigures() shownFigures {
	h.t.Helper()
	var f shownFigures
	if err := json.Unmarshal([]byte(eval[string](h, readFigures)), &f); err != nil {
		h.t.Fatal(err)
	}
	return f
}

// presented is what the figures call gives for r, the result of the
// page's scenario, in the units the page shows: figures.PresentRopes over
// every rope length the scenario names (r at the nominal, sway.Evaluate at
// the plan's range ends), as the bridge does.
func (h *harness) presented(r *sway.Result) figures.Report {
	h.t.Helper()
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		h.t.Fatal(err)
	}
	var chosen map[string]string
	if err := json.Unmarshal([]byte(eval[string](h, `JSON.stringify(window.swaysheet.units())`)), &chosen); err != nil {
		h.t.Fatal(err)
	}
	evs, err := figures.EvaluateRopes(s, func(x *scenario.Scenario) (*sway.Result, error) {
		if x == s {
			return r, nil
		}
		return sway.Evaluate(x)
	})
	if err != nil {
		h.t.Fatal(err)
	}
	return figures.PresentRopes(s, evs, units.Choice{Chosen: chosen, System: eval[string](h, `window.swaysheet.system()`)})
}

// rowText is the text the core gives for the figure key ("" when r has
// no such figure).
func rowText(rep figures.Report, key string) string {
	for _, row := range rep.Rows {
		if row.Key == key {
			return row.Text
		}
	}
	return ""
}

// checkShown compares the verdict band and every figure row the page
// shows with the figures of r (presented) (the core's result of the page's
// scenario) in the page's units: the same rows in the same order, the
// crew words, the core's rounded text and unit, the limit's words and the
// technical name under "Engineering detail".
func (h *harness) checkShown(r *sway.Result) {
	h.t.Helper()
	want := h.presented(r)
	got := h.shownFigures()
	if got.State != want.Verdict.State || got.Text != want.Verdict.Text {
		h.t.Errorf("verdict band %q %q, the core gives %q %q", got.State, got.Text, want.Verdict.State, want.Verdict.Text)
	}
	sym := map[string]string{figures.AllWithin: "\u2714", figures.Outside: "\u2716"}[want.Verdict.State]
	if sym != "" && !strings.HasPrefix(got.Head, sym) {
		h.t.Errorf("verdict band head %q lacks its symbol %s", got.Head, sym)
	}
	if len(got.Rows) != len(want.Rows) {
		h.t.Errorf("the page shows %d figures, the core gives %d", len(got.Rows), len(want.Rows))
	}
	for i := 0; i < len(got.Rows) && i < len(want.Rows); i++ {
		g, w := got.Rows[i], want.Rows[i]
		check := ""
		switch {
		case w.Check != nil && w.Check.Within:
			check = "\u2714 " + w.Check.Words
		case w.Check != nil:
			check = "\u2716 " + w.Check.Words
		case w.LimitKey != "" && want.Verdict.State == figures.NotSimulated:
			check = "\u2013 nothing simulated"
		case w.LimitKey != "":
			check = "\u2013 no limit set"
		}
		ww := shownRow{Key: w.Key, Crew: w.Crew, Text: w.Text, Unit: w.Unit, Check: check, Technical: w.Technical}
		if g != ww {
			h.t.Errorf("row %d:\n page %+v\n core %+v", i, g, ww)
		}
	}
}

// TestFiguresRows opens two examples, one with the hook block's extra
// rows, in SI and US units: the page shows every row figures.Present
// gives and the verdict band, compared with the core run in the test.
func TestFiguresRows(t *testing.T) {
	h := setup(t)
	dir := filepath.Join(root, "out", "browser")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ example, file string }{
		{"girder on the overhead crane", "bay-travel"},
		{"heavy hook block", "heavy-hook-long-slings"},
	} {
		for _, sys := range []string{"si", "us"} {
			t.Run(c.file+" "+sys, func(t *testing.T) {
				h.t = t
				h.openExample(c.example)
				h.do(chromedp.Click(chromedp.ID("sys-" + sys)))
				h.settle()
				r := h.core()
				rep := h.presented(r)
				if len(rep.Rows) < 10 {
					t.Fatalf("the core gives only %d rows", len(rep.Rows))
				}
				h.checkShown(r)
				if c.file == "heavy-hook-long-slings" && h.text(fig("rigging.mode_periods_s[1]")+" .num") != rowText(rep, "rigging.mode_periods_s[1]") {
					t.Errorf("the hook block's second mode is not shown")
				}
				eval[bool](h, `document.getElementById('notice').hidden = true; document.getElementById('results').scrollIntoView({block: 'start'}); true`)
				time.Sleep(150 * time.Millisecond)
				if shot, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot()); err == nil {
					_ = os.WriteFile(filepath.Join(dir, "figures-"+c.file+"-"+sys+".png"), shot, 0o644)
				}
			})
		}
	}

	t.Run("no move: nothing simulated", func(t *testing.T) {
		h.t = t
		h.do(chromedp.Click(chromedp.ID("sys-si")))
		for eval[int](h, `document.querySelectorAll('#move-form .move').length`) > 0 {
			h.click("#move-form .move button[data-remove]")
			h.settle()
		}
		r := h.core()
		if rep := h.presented(r); rep.Verdict.State != figures.NotSimulated {
			t.Fatalf("the core's verdict without moves: %q", rep.Verdict.State)
		}
		h.checkShown(r)
		if got := h.text("#verdict"); !strings.Contains(got, "Nothing was simulated") {
			t.Errorf("verdict band without moves: %q", got)
		}
		// With the engineering detail open: each row's technical name.
		eval[bool](h, `document.getElementById('engineering').open = true; document.getElementById('notice').hidden = true; document.getElementById('results').scrollIntoView({block: 'start'}); true`)
		time.Sleep(150 * time.Millisecond)
		if shot, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot()); err == nil {
			_ = os.WriteFile(filepath.Join(dir, "figures-no-move-detail.png"), shot, 0o644)
		}
	})
}
