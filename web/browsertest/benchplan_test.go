package browsertest

import (
	"fmt"
	"sort"
	"strings"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
)

// callLog records, in the page, every call the page makes to the engine's
// worker: its name, when it was posted, how long until its reply, and the
// lengths of its input and reply (Worker wrapped before the page starts).
const callLog = `(function () {
  var W = window.Worker;
  window.__calls = [];
  window.Worker = function (url, opts) {
    var w = new W(url, opts), pend = {}, post = w.postMessage.bind(w);
    w.postMessage = function (m) {
      if (m && m.name) pend[m.id] = { name: m.name, t0: performance.now(), in: (m.input || '').length };
      return post(m);
    };
    w.addEventListener('message', function (e) {
      var p = e.data && pend[e.data.id];
      if (!p) return;
      delete pend[e.data.id];
      p.ms = performance.now() - p.t0;
      p.out = (e.data.out || '').length;
      window.__calls.push(p);
    });
    return w;
  };
  window.Worker.prototype = W.prototype;
})();`

type loggedCall struct {
	Name string  `json:"name"`
	T0   float64 `json:"t0"`
	Ms   float64 `json:"ms"`
	In   int     `json:"in"`
	Out  int     `json:"out"`
}

// benchPlanPage opens each planning example as a person does (the page
// plans it and shows the recommended move) and reports the engine calls
// the page made from the example's first call to its settled page: each
// call's name, count and time until its reply, the plan call's among
// them. The page's calls queue in one worker, so a call's time from post
// to reply includes the calls before it; the span also holds the page's
// own work and its waits (the check sheet's 500 ms pause before it is
// remade).
func benchPlanPage(h *harness) []map[string]any {
	if _, err := chromedp.Call(h.ctx, page.AddScriptToEvaluateOnNewDocument,
		page.AddScriptToEvaluateOnNewDocumentParams{Source: callLog}); err != nil {
		h.t.Fatal(err)
	}
	h.do(chromedp.Reload())
	h.settle()
	var rows []map[string]any
	for _, ex := range []struct{ file, part string }{
		{"plan-bay-travel", "plan the girder"},
		{"plan-precast-hook", "light panel's travel"},
		{"plan-tower-slew", "tower crane's slew"},
	} {
		eval[bool](h, `(window.__calls = [], true)`)
		before := eval[int](h, `window.swaysheetPlan.count()`)
		h.openExample(ex.part)
		h.planSettled(before)
		calls := eval[[]loggedCall](h, `window.__calls`)
		if len(calls) == 0 {
			h.t.Fatalf("%s: no engine calls logged", ex.file)
		}
		sort.Slice(calls, func(i, j int) bool { return calls[i].T0 < calls[j].T0 })
		type sum struct {
			n  int
			ms float64
		}
		by := map[string]*sum{}
		var names []string
		busy, planMs, end := 0.0, 0.0, 0.0
		for _, c := range calls {
			if by[c.Name] == nil {
				by[c.Name] = &sum{}
				names = append(names, c.Name)
			}
			by[c.Name].n++
			by[c.Name].ms += c.Ms
			busy += c.Ms
			end = max(end, c.T0+c.Ms)
			if c.Name == "plan" {
				planMs += c.Ms
			}
		}
		var seq []string
		for _, c := range calls {
			seq = append(seq, fmt.Sprintf("%s@%.0f+%.0f", c.Name, c.T0-calls[0].T0, c.Ms))
		}
		h.t.Logf("%s: calls in order (name@posted+ms to reply): %s", ex.file, strings.Join(seq, " "))
		var parts []string
		for _, n := range names {
			parts = append(parts, fmt.Sprintf("%s %d× %.0f ms", n, by[n].n, by[n].ms))
		}
		span := end - calls[0].T0
		h.t.Logf("%s opened: %d calls over %.0f ms, %.0f ms from post to reply summed over them (they queue in the one worker, so these overlap): %s",
			ex.file, len(calls), span, busy, strings.Join(parts, ", "))
		rows = append(rows, map[string]any{"group": "page (headless Chromium)", "name": "open and plan, " + ex.file, "value": span, "unit": "ms",
			"note": fmt.Sprintf("from the example's first engine call to the last reply (%d calls; the plan call %.0f ms); each name's count and time from post to reply, summed (calls queue in the one worker): %s; once", len(calls), planMs, strings.Join(parts, ", "))})
	}
	return rows
}
