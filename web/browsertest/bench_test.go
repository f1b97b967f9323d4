package browsertest

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
)

// probe records, in the page, when the first result is shown and how long
// each input change takes to reach the rope-angle plot: from the last
// input event to the plot's redraw.
const probe = `(function () {
  window.__bench = { first: null, lat: [], t0: null, d: null };
  document.addEventListener('input', function () { window.__bench.t0 = performance.now(); }, true);
  new MutationObserver(function () {
    var b = window.__bench, now = performance.now();
    var num = document.querySelector('#figures [data-key="period_s"] .num');
    if (b.first === null && num && num.textContent.trim() !== '') b.first = now;
    var line = document.querySelector('#plot-angle path.line');
    var d = line ? line.getAttribute('d') : null;
    if (d !== b.d) {
      if (b.t0 !== null && b.d !== null) { b.lat.push(now - b.t0); b.t0 = null; }
      b.d = d;
    }
  }).observe(document, { subtree: true, childList: true, characterData: true, attributes: true });
})();`

// TestBenchPage measures, for make bench, the page's cold start to the
// first result shown and the time from an input change to the updated
// plot (benchTimes: as it is and with the CPU slowed 4 times), one full
// plan of each planning example (benchPlans), the clearance runs and the
// runs over draws (benchDraws). It
// runs only when SWAYSHEET_BENCH_OUT names the file for its rows; with
// SWAYSHEET_BENCH_ROWS=clearance it measures the clearance row alone,
// with SWAYSHEET_BENCH_ROWS=plans the plan rows alone, with
// SWAYSHEET_BENCH_ROWS=page the cold start and input rows alone, with
// SWAYSHEET_BENCH_ROWS=draws the 1,000 runs over draws alone.
func TestBenchPage(t *testing.T) {
	out := os.Getenv("SWAYSHEET_BENCH_OUT")
	if out == "" {
		t.Skip("page benchmark runs with SWAYSHEET_BENCH_OUT=FILE (make bench)")
	}
	h := setupFor(t, 15*time.Minute)
	switch os.Getenv("SWAYSHEET_BENCH_ROWS") {
	case "clearance":
		writeRows(t, out, []map[string]any{benchClearance(t, h)})
		return
	case "draws":
		writeRows(t, out, []map[string]any{benchDraws(t, h)})
		return
	case "plans":
		h.settle()
		writeRows(t, out, append(benchPlans(h), benchPlanPage(h)...))
		return
	}
	rows := benchTimes(t, h, 1)
	rows = append(rows, benchTimes(t, h, 4)...)
	if os.Getenv("SWAYSHEET_BENCH_ROWS") == "page" {
		writeRows(t, out, rows)
		return
	}
	rows = append(rows, benchPlans(h)...)
	rows = append(rows, benchClearance(t, h))
	rows = append(rows, benchDraws(t, h))
	writeRows(t, out, rows)
}

// writeRows writes the rows to the file out, one JSON object a line.
func writeRows(t *testing.T, out string, rows []map[string]any) {
	f, err := os.Create(out)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	enc := json.NewEncoder(f)
	for _, r := range rows {
		if err := enc.Encode(r); err != nil {
			t.Fatal(err)
		}
	}
}

// planTimer times the core's "plan" call in a worker of its own, as the
// page's engine runs it (worker.js): from posting the scenario to the
// reply, parsing and the reply's JSON included. Each run renames the
// scenario, so that the engine's memo of the last plan never answers.
// Two runs warm the worker up (the first starts the engine); the median
// of the next n is reported. Beside it, for the breakdown: the first
// (cold) plan after the engine started, the "validate" call of the same
// scenario (message passing, JSON decode, validation and fingerprint:
// the part of a plan call before planning), the page's JSON.parse of the
// plan's reply and the reply's length.
const planTimer = `(async function (text, n) {
  var w = new Worker(window.swaysheetWorkerURL || 'worker.js'), id = 0, ts = [], vs = [], ps = [], first = 0, bytes = 0;
  function call(name, input) {
    return new Promise(function (resolve) {
      var my = ++id;
      w.onmessage = function (e) { if (e.data.id === my) resolve(e.data.out); };
      w.postMessage({ id: my, name: name, input: input });
    });
  }
  await call('version', '');
  var s = JSON.parse(text), sims = 0;
  for (var i = 0; i < n + 2; i++) {
    s.name = 'bench ' + i;
    var input = JSON.stringify(s);
    var t0 = performance.now();
    var out = await call('plan', input);
    var t1 = performance.now();
    var r = JSON.parse(out);
    var dt = performance.now() - t0;
    if (r.error) { w.terminate(); return [-1, 0, r.error.message]; }
    sims = r.result.simulations;
    bytes = out.length;
    if (i === 0) first = dt;
    if (i >= 2) { ts.push(dt); ps.push(performance.now() - t1); }
    s.name = 'bench v' + i;
    var v0 = performance.now();
    await call('validate', JSON.stringify(s));
    if (i >= 2) vs.push(performance.now() - v0);
  }
  w.terminate();
  function med(xs) { xs.sort(function (a, b) { return a - b; }); return xs[xs.length >> 1]; }
  return [med(ts), sims, '', first, med(vs), med(ps), bytes, ts[0]];
})`

// benchPlans times one full plan of each planning example in the page
// (planTimer), against the targets of issue 16: 10 ms for a single rope,
// 30 ms for the two-mode plan of a hook block.
func benchPlans(h *harness) []map[string]any {
	files, err := filepath.Glob(filepath.Join(root, "testdata", "scenarios", "plan-*.json"))
	if err != nil || len(files) == 0 {
		h.t.Fatalf("no planning examples: %v", err)
	}
	const n = 21 // the host's noise moved a median of 9 by 40 % between runs
	var rows []map[string]any
	for _, f := range files {
		text, err := os.ReadFile(f)
		if err != nil {
			h.t.Fatal(err)
		}
		var s struct {
			Load struct {
				Hook any `json:"hook"`
				Body any `json:"body"`
			} `json:"load"`
		}
		if err := json.Unmarshal(text, &s); err != nil {
			h.t.Fatal(err)
		}
		v := eval2[[]any](h, planTimer+`(`+strconv.Quote(string(text))+`, `+strconv.Itoa(n)+`)`)
		ms, sims, msg := v[0].(float64), v[1].(float64), v[2].(string)
		if msg != "" {
			h.t.Fatalf("%s: %s", f, msg)
		}
		parts := fmt.Sprintf("first plan after the engine started %.0f ms; validate call of the same scenario %.1f ms; JSON.parse of the reply %.1f ms (%.0f kB); fastest %.1f ms; ",
			v[3].(float64), v[4].(float64), v[5].(float64), v[6].(float64)/1000, v[7].(float64))
		target, what := 10.0, "single rope"
		if s.Load.Hook != nil {
			target, what = 30, "two-mode plan of a hook block"
		}
		verdict := "met"
		if ms > target {
			verdict = "MISSED"
		}
		if s.Load.Body != nil { // issue 16 sets no target for a rigid load's plan
			target, what, verdict = 0, "", "no target for a rigid load"
		}
		h.t.Logf("%s: %.1f ms, %.0f simulations; %s", filepath.Base(f), ms, sims, parts)
		rows = append(rows, map[string]any{"group": "page (headless Chromium)", "name": "plan, " + strings.TrimSuffix(filepath.Base(f), ".json"),
			"value": ms, "unit": "ms", "note": parts + planNote(sims, n, target, what, verdict)})
	}
	return rows
}

func planNote(sims float64, n int, target float64, what, verdict string) string {
	note := fmt.Sprintf("one full plan in a worker, %.0f simulations, reply included; median of %d; ", sims, n)
	if target == 0 {
		return note + verdict
	}
	return note + fmt.Sprintf("target at most %g ms (%s): %s", target, what, verdict)
}

// benchClearance times, in the page, the 1,000-run clearance check of the
// bay site example split over the page's workers: from the start of the
// runs to the joined report of every run (median of 3).
func benchClearance(t *testing.T, h *harness) map[string]any {
	h.openExample("machine frame past the column line")
	h.siteSettled()
	sc := h.scenario()
	sc["site"].(map[string]any)["spread"].(map[string]any)["runs"] = 1000
	b, _ := json.Marshal(sc)
	var ms []float64
	workers := eval[int](h, `window.swaysheetSite.poolSize()`)
	for range 3 {
		v := eval2[[]any](h, `(function(){var t0=performance.now(),first=null;return window.swaysheetSite.split(`+strconv.Quote(string(b))+`,1000,0,
			function(s){if(s.report&&first===null)first=performance.now()-t0;}).then(function(r){return [performance.now()-t0, first||0, r.error?r.error.message:''];});})()`)
		if msg := v[2].(string); msg != "" {
			t.Fatalf("clearance runs: %s", msg)
		}
		ms = append(ms, v[0].(float64))
	}
	slices.Sort(ms)
	return map[string]any{"group": "page (headless Chromium)", "name": "clearance envelope, 1,000 runs of site-bay-columns", "value": ms[1], "unit": "ms",
		"note": fmt.Sprintf("split over %d workers (min(4, processors)), joined in the engine's worker; median of 3, fastest %.0f ms; target at most 1500 ms: %s",
			workers, ms[0], map[bool]string{true: "met", false: "MISSED"}[ms[1] <= 1500])}
}

// benchTimes measures the cold start to the first result shown (median of
// 5 loads with the browser cache cleared) and the time from an input
// change to the updated rope-angle plot (median and 95th percentile over
// 40 typed changes of the rope length, from the last keystroke; the page
// sends a change when the task that made it ends, with no wait), with Chromium's CPU slowed rate times (DevTools CPU
// throttling, Emulation.setCPUThrottlingRate; 1: as it is), against the
// targets of issue 16: at most 1 s and 50 ms at the 95th percentile, both
// also at rate 4 (a mid-range tablet).
func benchTimes(t *testing.T, h *harness, rate float64) []map[string]any {
	throttle := func(r float64) error {
		_, err := chromedp.Call(h.ctx, emulation.SetCPUThrottlingRate, emulation.SetCPUThrottlingRateParams{Rate: r})
		return err
	}
	if err := throttle(rate); err != nil {
		t.Fatal(err)
	}
	defer throttle(1)
	var colds []float64
	for range 5 {
		if _, err := chromedp.Call(h.ctx, page.AddScriptToEvaluateOnNewDocument,
			page.AddScriptToEvaluateOnNewDocumentParams{Source: probe}); err != nil {
			t.Fatal(err)
		}
		if _, err := chromedp.Call(h.ctx, network.ClearBrowserCache, cdp.Empty{}); err != nil {
			t.Fatal(err)
		}
		h.do(chromedp.Reload())
		h.settle()
		colds = append(colds, eval[float64](h, `window.__bench.first`))
	}
	// Input changes: type a new rope length, wait until the core has
	// answered, read the latency the probe saw.
	var lat []float64
	for i := range 40 {
		eval[bool](h, `(window.__bench.lat = [], true)`)
		h.typeInto("#f-load-rope_length_m", fmt.Sprintf("%.1f", 8+0.1*float64(i%20)))
		h.settle()
		var got []float64
		deadline := time.Now().Add(5 * time.Second)
		for len(got) == 0 && time.Now().Before(deadline) {
			got = eval[[]float64](h, `window.__bench.lat`)
			time.Sleep(10 * time.Millisecond)
		}
		if len(got) == 0 {
			t.Fatalf("change %d: the plot did not redraw", i)
		}
		lat = append(lat, got[len(got)-1])
	}
	slices.Sort(colds)
	slices.Sort(lat)
	p95 := lat[(len(lat)*95+99)/100-1]
	cpu := ""
	if rate != 1 {
		cpu = fmt.Sprintf(", CPU slowed %gx", rate)
	}
	met := func(v, target float64) string {
		if v <= target {
			return fmt.Sprintf("target at most %g ms: met", target)
		}
		return fmt.Sprintf("target at most %g ms: MISSED", target)
	}
	return []map[string]any{
		{"group": "page (headless Chromium)", "name": "cold start to first result" + cpu, "value": colds[len(colds)/2], "unit": "ms",
			"note": fmt.Sprintf("median of %d loads with the browser cache cleared; fastest %.0f ms; %s", len(colds), colds[0], met(colds[len(colds)/2], 1000))},
		{"group": "page (headless Chromium)", "name": "input change to updated plot, median" + cpu, "value": lat[len(lat)/2], "unit": "ms",
			"note": fmt.Sprintf("%d changes of the rope length, typed; from the last keystroke (sent at once, no wait)", len(lat))},
		{"group": "page (headless Chromium)", "name": "input change to updated plot, 95th percentile" + cpu, "value": p95, "unit": "ms",
			"note": fmt.Sprintf("slowest %.0f ms; %s", lat[len(lat)-1], met(p95, 50))},
	}
}
