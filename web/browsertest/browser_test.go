// Package browsertest drives the page in headless Chromium with real typing
// and clicks. It runs only when SWAYSHEET_BROWSER=1 (make test-browser sets
// it), so that go test ./... stays quick.
package browsertest

import (
	"bytes"
	"context"
	"encoding/json"
	"math"
	"net/http"
	"net/http/httptest"
	"os"
	"os/exec"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/browser"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/cdproto/target"
	"github.com/chromedp/chromedp"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/web/site"
)

const root = "../.."

// fmtRes is the page's result format: 4 significant digits, shortest form.
func fmtRes(v float64) string {
	x, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 4, 64), 64)
	return strconv.FormatFloat(x, 'f', -1, 64)
}

// fmtField is the page's input format: 10 significant digits.
func fmtField(v float64) string {
	x, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 10, 64), 64)
	return strconv.FormatFloat(x, 'f', -1, 64)
}

// fmtTyped is the page's format of an input converted into a unit the
// SI view does not use: 4 significant digits, as a person types it.
func fmtTyped(v float64) string { return fmtRes(v) }

// shown is an SI value as the page and sheet show it in the unit of the
// given symbol: converted and rounded to the unit's step, as the core
// rounds figures for people (core/units.Round).
func shown(q, symbol string, si float64) string {
	u := units.Choice{Chosen: map[string]string{q: symbol}}.Unit(q)
	_, t := units.Round(si/u.ToSI, u)
	return t
}

type harness struct {
	t        *testing.T
	ctx      context.Context
	url      string
	dl       string
	mu       sync.Mutex
	requests []string // seen by DevTools in the page and its worker
	served   []string // paths the test server answered
}

func setup(t *testing.T) *harness { return setupFor(t, 4*time.Minute) }

// setupFor is setup with a time limit for the whole test.
func setupFor(t *testing.T, limit time.Duration) *harness {
	if os.Getenv("SWAYSHEET_BROWSER") != "1" {
		t.Skip("browser tests run with SWAYSHEET_BROWSER=1 (make test-browser)")
	}
	chrome, err := exec.LookPath("chromium")
	if err != nil {
		t.Fatal("chromium is not installed (make deps installs it)")
	}
	build := wasmBuild(t)
	h := &harness{t: t, dl: t.TempDir()}
	files := site.Handler(site.Dirs{Static: filepath.Join(root, "web", "static"), Build: build,
		Examples: filepath.Join(root, "testdata", "scenarios")})
	srv := httptest.NewServer(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		h.mu.Lock()
		h.served = append(h.served, r.URL.Path)
		h.mu.Unlock()
		files.ServeHTTP(w, r)
	}))
	t.Cleanup(srv.Close)

	opts := append(chromedp.DefaultExecAllocatorOptions[:], chromedp.ExecPath(chrome), chromedp.NoSandbox,
		chromedp.DisableGPU, chromedp.NoFirstRun, chromedp.UserDataDir(t.TempDir()),
		chromedp.Flag("disable-background-networking", true), chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true), chromedp.Flag("disable-quic", true))
	actx, cancelA := chromedp.NewExecAllocator(context.Background(), opts...)
	ctx, cancelC := chromedp.NewContext(actx)
	ctx, cancelT := context.WithTimeout(ctx, limit)
	t.Cleanup(func() { cancelT(); cancelC(); cancelA() })

	h.ctx, h.url = ctx, srv.URL+"/"
	if err := chromedp.Do(ctx); err != nil {
		t.Fatal(err)
	}
	if err := chromedp.Listen(ctx, func(ev any) {
		if e, ok := ev.(*network.EventRequestWillBeSent); ok {
			h.mu.Lock()
			h.requests = append(h.requests, e.Request.URL)
			h.mu.Unlock()
		}
	}); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.CallBrowser(ctx, browser.SetDownloadBehavior, browser.SetDownloadBehaviorParams{
		Behavior: browser.SetDownloadBehaviorBehaviorAllow, DownloadPath: h.dl}); err != nil {
		t.Fatal(err)
	}
	// The worker's requests: attach to each worker as it starts. (Its very
	// first fetch, the wasm, can come before the attach; the server's own
	// log below covers that one.)
	attached := chromedp.Events(ctx, target.AttachedToTarget)
	go func() {
		for ev, err := range attached {
			if err != nil {
				return
			}
			if ev.TargetInfo.Type != "worker" {
				continue
			}
			wctx, _ := chromedp.NewContext(ctx, chromedp.WithTargetID(ev.TargetInfo.TargetID))
			go func() {
				if chromedp.Do(wctx) != nil {
					return
				}
				_ = chromedp.Listen(wctx, func(ev any) {
					if e, ok := ev.(*network.EventRequestWillBeSent); ok {
						h.mu.Lock()
						h.requests = append(h.requests, e.Request.URL)
						h.mu.Unlock()
					}
				})
			}()
		}
	}()
	h.do(chromedp.EmulateViewport(820, 1180), chromedp.Navigate(h.url))
	h.settle()
	return h
}

func (h *harness) do(a ...chromedp.Action[chromedp.Void]) {
	h.t.Helper()

	if err := chromedp.Do(h.ctx, a...); err != nil {
		h.t.Fatal(err)
	}
}

func eval[T any](h *harness, expr string) T {
	h.t.Helper()
	v, err := chromedp.Run(h.ctx, chromedp.Evaluate[T](expr))
	if err != nil {
		h.t.Fatalf("%s: %v", expr, err)
	}
	return v
}

// settle waits until the core has answered for the inputs as they are.
func (h *harness) settle() {
	h.t.Helper()
	if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](`window.swaysheet && document.body.dataset.state === 'ready' && window.swaysheet.settled()`,
		chromedp.WithPollingTimeout(60*time.Second), chromedp.WithPollingInterval(50*time.Millisecond))); err != nil {
		h.t.Fatalf("the page did not settle: %v", err)
	}
}

func (h *harness) text(sel string) string {
	h.t.Helper()
	return strings.TrimSpace(eval[string](h, `(function(){var e=document.querySelector(`+strconv.Quote(sel)+`);return e?e.textContent:'(missing '+`+strconv.Quote(sel)+`+')';})()`))
}

func (h *harness) value(sel string) string {
	h.t.Helper()
	return eval[string](h, `document.querySelector(`+strconv.Quote(sel)+`).value`)
}

// typeInto replaces a field's text by typing, as a person does.
func (h *harness) typeInto(sel, text string) {
	h.t.Helper()
	h.do(chromedp.Click(chromedp.CSS(sel)),
		chromedp.KeyEvent("a", chromedp.KeyModifiers(chromedp.ModifierCtrl)),
		chromedp.KeyEvent("\b"),
		chromedp.SendKeys(chromedp.CSS(sel), text))
}

// pasteInto replaces a field's text at once, as pasting does.
func (h *harness) pasteInto(sel, text string) {
	h.t.Helper()
	eval[bool](h, `(function () { var e = document.querySelector(`+strconv.Quote(sel)+`); e.focus(); e.value = `+strconv.Quote(text)+`;
		e.dispatchEvent(new Event('input', { bubbles: true })); return true; })()`)
}

func (h *harness) scenario() map[string]any {
	h.t.Helper()
	var m map[string]any
	if err := json.Unmarshal([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)), &m); err != nil {
		h.t.Fatal(err)
	}
	return m
}

// core evaluates the page's current scenario with the Go core directly.
func (h *harness) core() *sway.Result {
	h.t.Helper()
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		h.t.Fatal(err)
	}
	r, err := sway.Evaluate(s)
	if err != nil {
		h.t.Fatal(err)
	}
	return r
}

func (h *harness) plotPath(id string) string {
	return eval[string](h, `document.querySelector('#`+id+` path.line').getAttribute('d')`)
}

func TestPage(t *testing.T) {
	h := setup(t)

	t.Run("demo shows the core's period", func(t *testing.T) {
		h.t = t
		h.mu.Lock()
		if strings.Contains(strings.Join(h.requests, " "), "fetchworker.js") {
			t.Error("the site library's fetch worker started before the library was opened")
		}
		h.mu.Unlock()
		if h.text("#example-banner") == "" || eval[bool](h, `document.getElementById('example-banner').hidden`) {
			t.Error("the demo is not labelled as an example")
		}
		r := h.core()
		// Small-amplitude period T = 2*pi*sqrt(L/g) (any mechanics text)
		// for the demo's rope of 8.5 m.
		if want := 2 * math.Pi * math.Sqrt(8.5/units.StandardGravity); math.Abs(r.PeriodS-want) > 1e-12 {
			t.Errorf("core period %v, want %v", r.PeriodS, want)
		}
		if got, w := h.text(fig("period_s")+" .num"), rowText(h.presented(r), "period_s"); got != w {
			t.Errorf("period shown %q, the core gives %q", got, w)
		}
		h.checkShown(r)
		if n := len(h.text("#assumptions")); n < 100 {
			t.Errorf("assumptions not shown (%d characters)", n)
		}
		if !strings.Contains(h.text("#cautions"), "Nobody under a suspended load") {
			t.Error("cautions not shown")
		}
	})

	t.Run("rope length, speed and acceleration update results and plots", func(t *testing.T) {
		h.t = t
		for _, c := range []struct{ sel, text, path string }{
			{"#f-load-rope_length_m", "12", "load.rope_length_m"},
			{"#f-motions-0-speed_m_per_s", "40", "motions[0].speed_m_per_s"},
			{"#f-motions-0-accel_m_per_s2", "0.4", "motions[0].accel_m_per_s2"},
		} {
			before := h.text("#headline")
			angle, tension := h.plotPath("plot-angle"), h.plotPath("plot-tension")
			h.typeInto(c.sel, c.text)
			h.settle()
			if h.text("#headline") == before {
				t.Errorf("%s: results did not change", c.path)
			}
			if h.plotPath("plot-angle") == angle || h.plotPath("plot-tension") == tension {
				t.Errorf("%s: plots did not change", c.path)
			}
			h.checkShown(h.core())
		}
		s := h.scenario()
		mo := s["motions"].([]any)[0].(map[string]any)
		// 40 m/min = 40/60 m/s (the page shows speed in m/min in SI).
		if s["load"].(map[string]any)["rope_length_m"] != 12.0 || mo["speed_m_per_s"] != 40*(1.0/units.Minute) || mo["accel_m_per_s2"] != 0.4 {
			t.Errorf("scenario after typing: %v %v", s["load"], mo)
		}
	})

	t.Run("unit switch converts exactly and back", func(t *testing.T) {
		h.t = t
		fields := []string{"#f-load-mass_kg", "#f-load-rope_length_m", "#f-motions-0-distance_m", "#f-motions-0-speed_m_per_s",
			"#f-motions-0-accel_m_per_s2", "#f-limits-peak_excursion_m"}
		results := []string{"#verdict", fig("period_s"), fig("peak_swing_deg"), fig("peak_excursion_m"), fig("residual_swing_deg"),
			fig("tension_factor"), fig("tension_max_n")}
		snap := func() []string {
			var out []string
			for _, f := range fields {
				out = append(out, h.value(f)+" "+h.text("[data-field] "+f+" ~ .unit"))
			}
			for _, r := range results {
				out = append(out, h.text(r))
			}
			return out
		}
		si := snap()
		s := h.scenario()
		r := h.core()
		h.do(chromedp.Click(chromedp.ID("sys-us")))
		h.settle()
		load := s["load"].(map[string]any)
		mo := s["motions"].([]any)[0].(map[string]any)
		// Factors of NIST SP 811 appendix B, from core/units.
		want := map[string]string{
			"#f-load-mass_kg":             fmtTyped(load["mass_kg"].(float64) / units.Pound),
			"#f-load-rope_length_m":       fmtTyped(load["rope_length_m"].(float64) / units.Foot),
			"#f-motions-0-speed_m_per_s":  fmtTyped(mo["speed_m_per_s"].(float64) / (units.Foot / units.Minute)),
			"#f-motions-0-accel_m_per_s2": fmtTyped(mo["accel_m_per_s2"].(float64) / units.Foot),
		}
		for sel, w := range want {
			if got := h.value(sel); got != w {
				t.Errorf("US: %s shows %q, want %q", sel, got, w)
			}
		}
		if u := h.text("[data-field] #f-load-rope_length_m ~ .unit"); u != "ft" {
			t.Errorf("rope length unit %q, want ft", u)
		}
		h.checkShown(r)
		// The core converts and rounds (ft and lbf, NIST SP 811): the page
		// shows the result's SI value over the factor, to the unit's step.
		us := units.Choice{System: "us"}
		for _, c := range []struct {
			key, q, unit string
			si, factor   float64
		}{{"peak_excursion_m", "length", "ft", r.PeakExcursionM, units.Foot}, {"tension_max_n", "force", "lbf", r.TensionMaxN, units.PoundForce}} {
			_, w := units.Round(c.si/c.factor, us.Unit(c.q))
			if got := h.text(fig(c.key) + " .num"); got != w || h.text(fig(c.key)+" .u") != c.unit {
				t.Errorf("US %s: %q %q, want %q %s", c.key, got, h.text(fig(c.key)+" .u"), w, c.unit)
			}
		}
		if !reflect.DeepEqual(h.scenario(), s) {
			t.Error("switching units changed the scenario")
		}
		// A bad value typed in US units is reported in US units.
		keep := h.value("#f-motions-0-speed_m_per_s")
		h.typeInto("#f-motions-0-speed_m_per_s", "5000")
		h.settle()
		// 10 m/s, the core's upper bound, is 1968.5 ft/min (ft = 0.3048 m,
		// NIST SP 811): shown to four digits, rounded inward, so that the
		// bound as shown is accepted.
		if msg := h.text("#f-motions-0-speed_m_per_s-msg"); !strings.Contains(msg, "5000 ft/min is out of range") || !strings.Contains(msg, "up to 1968 ft/min") {
			t.Errorf("US range message: %q", msg)
		}
		h.typeInto("#f-motions-0-speed_m_per_s", keep)
		h.settle()
		h.do(chromedp.Click(chromedp.ID("sys-si")))
		h.settle()
		// The speed shown in ft/min was rounded to four digits, so typed
		// back it is not quite the SI speed: typed again in SI (m/min).
		h.typeInto("#f-motions-0-speed_m_per_s", fmtField(mo["speed_m_per_s"].(float64)*60))
		h.settle()
		if back := snap(); !reflect.DeepEqual(back, si) {
			t.Errorf("SI -> US -> SI does not give back the same figures:\n%q\n%q", si, back)
		}
	})

	t.Run("invalid input shows a message at the field and keeps the last results", func(t *testing.T) {
		h.t = t
		before := h.text("#headline")
		h.typeInto("#f-load-rope_length_m", "-3")
		h.settle()
		msg := h.text("#f-load-rope_length_m-msg")
		if !strings.Contains(msg, "accepted") || !strings.Contains(msg, "m") {
			t.Errorf("message at the rope length: %q", msg)
		}
		if eval[string](h, `document.getElementById('f-load-rope_length_m').getAttribute('aria-invalid')`) != "true" {
			t.Error("field not marked invalid")
		}
		if h.text("#headline") != before || eval[bool](h, `document.getElementById('stale').hidden`) {
			t.Error("the last valid results were not kept and marked")
		}
		h.typeInto("#f-load-rope_length_m", "abc")
		h.settle()
		if msg := h.text("#f-load-rope_length_m-msg"); !strings.Contains(msg, "Enter a number") {
			t.Errorf("message for text: %q", msg)
		}
		if h.text("#headline") != before {
			t.Error("results changed on text input")
		}
		h.typeInto("#f-load-rope_length_m", "10")
		h.settle()
		if msg := h.text("#f-load-rope_length_m-msg"); msg != "" {
			t.Errorf("message stays after a valid value: %q", msg)
		}
		if !eval[bool](h, `document.getElementById('stale').hidden`) {
			t.Error("stale note stays after a valid value")
		}
		h.checkShown(h.core())
	})

	t.Run("save, reload, restore; rename, delete; damaged entry skipped", func(t *testing.T) {
		h.t = t
		saved := h.scenario()
		h.do(chromedp.Click(chromedp.ID("open-saved")))
		h.typeInto("#save-name", "Girder lift")
		h.do(chromedp.Click(chromedp.ID("save-do")))
		if !strings.Contains(h.text("#save-msg"), "Saved") {
			t.Fatalf("save: %q", h.text("#save-msg"))
		}
		h.do(chromedp.Click(chromedp.CSS("#dlg-saved form button")))
		h.typeInto("#f-load-rope_length_m", "14")
		h.settle()
		// A damaged entry, as a broken browser store might leave it.
		eval[bool](h, `localStorage.setItem('swaysheet.saved.v1:Broken', '{not json'); true`)
		h.do(chromedp.Reload())
		h.settle()
		if got := h.scenario()["load"].(map[string]any)["rope_length_m"]; got != 14.0 {
			t.Errorf("after reload the inputs are not kept: rope %v", got)
		}
		h.do(chromedp.Click(chromedp.ID("open-saved")))
		list := h.text("#saved-list")
		if !strings.Contains(list, "Broken") || !strings.Contains(list, "damaged") || !strings.Contains(list, "Girder lift") {
			t.Errorf("saved list: %q", list)
		}
		// Rename, then open.
		h.do(chromedp.Click(chromedp.CSS(`#saved-list button[data-sren="1"]`)))
		h.typeInto("#ren-in", "Girder lift B")
		h.do(chromedp.Click(chromedp.ID("ren-ok")))
		if list := h.text("#saved-list"); !strings.Contains(list, "Girder lift B") {
			t.Errorf("after rename: %q", list)
		}
		h.do(chromedp.Click(chromedp.CSS(`#saved-list button[data-sopen="1"]`)))
		h.settle()
		if got := h.scenario(); !reflect.DeepEqual(got, saved) {
			t.Errorf("restored scenario differs:\n%v\n%v", got, saved)
		}
		// Delete the damaged entry; the other stays.
		h.do(chromedp.Click(chromedp.ID("open-saved")), chromedp.Click(chromedp.CSS(`#saved-list button[data-sdel="0"]`)),
			chromedp.Click(chromedp.ID("del-yes")))
		if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](`!document.getElementById('saved-list').textContent.includes('Broken')`,
			chromedp.WithPollingTimeout(30*time.Second))); err != nil {
			t.Errorf("delete: %v", err)
		}
		if list := h.text("#saved-list"); !strings.Contains(list, "Girder lift B") {
			t.Errorf("after delete: %q", list)
		}
		h.do(chromedp.Click(chromedp.CSS("#dlg-saved form button")))
	})

	t.Run("export and import give the same scenario", func(t *testing.T) {
		h.t = t
		h.typeInto("#f-load-mass_kg", "5300")
		h.settle()
		want := h.scenario()
		h.do(chromedp.Click(chromedp.ID("do-export")))
		var file string
		for i := 0; i < 300 && file == ""; i++ {
			time.Sleep(100 * time.Millisecond)
			m, _ := filepath.Glob(filepath.Join(h.dl, "*.json"))
			if len(m) > 0 {
				file = m[0]
			}
		}
		if file == "" {
			t.Fatal("no exported file")
		}
		data, _ := os.ReadFile(file)
		var got map[string]any
		if err := json.Unmarshal(data, &got); err != nil || !reflect.DeepEqual(got, want) {
			t.Fatalf("exported file differs (%v):\n%s", err, data)
		}
		if _, err := scenario.Parse(data); err != nil {
			t.Errorf("the exported file is not a valid scenario: %v", err)
		}
		h.typeInto("#f-load-mass_kg", "999")
		h.settle()
		h.do(chromedp.SetUploadFiles(chromedp.ID("import-file"), []string{file}))
		if _, err := chromedp.Run(h.ctx, chromedp.Poll[bool](`document.getElementById('notice').textContent.includes('Imported')`,
			chromedp.WithPollingTimeout(30*time.Second))); err != nil {
			t.Fatal(err)
		}
		h.settle()
		if got := h.scenario(); !reflect.DeepEqual(got, want) {
			t.Errorf("imported scenario differs:\n%v\n%v", got, want)
		}
	})

	t.Run("share link round trip", func(t *testing.T) {
		h.t = t
		want := h.scenario()
		h.do(chromedp.Click(chromedp.ID("do-share")))
		link := h.value("#share-url")
		if !strings.HasPrefix(link, h.url+"#s=") {
			t.Fatalf("link %q", link)
		}
		h.do(chromedp.Click(chromedp.CSS("#dlg-share form button")))
		h.typeInto("#f-load-mass_kg", "1234")
		h.settle()
		h.do(chromedp.Navigate("about:blank"), chromedp.Navigate(link))
		h.settle()
		if got := h.scenario(); !reflect.DeepEqual(got, want) {
			t.Errorf("scenario from the link differs:\n%v\n%v", got, want)
		}
	})

	t.Run("examples come from the origin", func(t *testing.T) {
		h.t = t
		h.do(chromedp.Click(chromedp.ID("open-examples")))
		if src := h.text("#examples-source"); !strings.Contains(src, "own server") {
			t.Errorf("examples source: %q", src)
		}
		// An example with a move of its own (a planning request without one
		// is shown for the planner's recommended move, which the core's
		// evaluation of the file alone does not have).
		h.do(chromedp.Click(chromedp.Search(`//ul[@id='examples-list']//li[contains(., 'girder on the overhead crane')]//button`)))
		h.settle()
		h.checkShown(h.core())
	})

	t.Run("the site library's fetch wasm starts only for the library", func(t *testing.T) {
		h.t = t
		// fetchworker.js (swayfetch.wasm) is requested by the core's worker
		// the first time the Examples dialog lists the site library.
		fetches := func() int {
			h.mu.Lock()
			defer h.mu.Unlock()
			return strings.Count(strings.Join(h.requests, " "), "fetchworker.js")
		}
		h.do(chromedp.Click(chromedp.ID("open-examples")))
		if err := h.poll(`!window.swaysheetLibrary.reading() && !!document.getElementById('library').dataset.state`, 60*time.Second); err != nil {
			t.Errorf("the library was not read: %v", err)
		}
		if st := h.text("#library-source"); !strings.Contains(st, "No site library here") {
			t.Errorf("with no library/ on the server: %q", st)
		}
		if fetches() == 0 {
			t.Errorf("no fetch worker started for the library (requests: %v)", h.requests)
		}
		h.do(chromedp.Click(chromedp.CSS("#dlg-examples form button")))
	})

	t.Run("portrait tablet screenshot", func(t *testing.T) {
		h.t = t
		h.do(chromedp.Click(chromedp.ID("open-examples")))
		h.do(chromedp.Click(chromedp.Search(`//ul[@id='examples-list']//li[contains(., 'Fabrication bay')]//button`)))
		h.settle()
		dir := filepath.Join(root, "out", "browser")
		if err := os.MkdirAll(dir, 0o755); err != nil {
			t.Fatal(err)
		}
		shot, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
		if err != nil {
			t.Fatal(err)
		}
		full, err := chromedp.Run(h.ctx, chromedp.FullScreenshot(100))
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.HasPrefix(shot, []byte("\x89PNG")) {
			t.Fatal("screenshot is not a PNG")
		}
		h.do(chromedp.EmulateViewport(1180, 820))
		time.Sleep(300 * time.Millisecond)
		land, err := chromedp.Run(h.ctx, chromedp.CaptureScreenshot())
		if err != nil {
			t.Fatal(err)
		}
		h.do(chromedp.EmulateViewport(820, 1180))
		for name, b := range map[string][]byte{"portrait-tablet.png": shot, "portrait-tablet-full.png": full, "landscape-tablet.png": land} {
			if err := os.WriteFile(filepath.Join(dir, name), b, 0o644); err != nil {
				t.Fatal(err)
			}
		}
		t.Logf("screenshots in %s", dir)
	})

	t.Run("prints on one page at A4 and Letter; typed markup stays text", func(t *testing.T) {
		h.t = t
		pdfinfo, err1 := exec.LookPath("pdfinfo")
		pdftotext, err2 := exec.LookPath("pdftotext")
		if err1 != nil || err2 != nil {
			t.Fatal("pdfinfo and pdftotext are needed (make deps installs poppler-utils)")
		}
		dialogs := chromedp.Events(h.ctx, page.JavascriptDialogOpening)
		opened := make(chan string, 4)
		go func() {
			for ev, err := range dialogs {
				if err != nil {
					return
				}
				opened <- ev.Message
				_, _ = chromedp.Call(h.ctx, page.HandleJavaScriptDialog, page.HandleJavaScriptDialogParams{Accept: true})
			}
		}()
		const markup = `<img src=x onerror=alert(1)>`
		h.typeInto("#f-sheet-project", markup)
		h.settle()
		if got := h.scenario()["sheet"].(map[string]any)["project"]; got != markup {
			t.Errorf("project field holds %q", got)
		}
		dir := t.TempDir()
		for _, paper := range []struct {
			name string
			w, h float64 // inches
		}{{"A4", 8.27, 11.69}, {"Letter", 8.5, 11}} {
			res, err := chromedp.Call(h.ctx, page.PrintToPDF, page.PrintToPDFParams{PaperWidth: paper.w, PaperHeight: paper.h})
			if err != nil {
				t.Fatal(err)
			}
			f := filepath.Join(os.Getenv("SWAYSHEET_PDF_DIR"), paper.name+".pdf")
			if os.Getenv("SWAYSHEET_PDF_DIR") == "" {
				f = filepath.Join(dir, paper.name+".pdf")
			}
			if err := os.WriteFile(f, res.Data, 0o644); err != nil {
				t.Fatal(err)
			}
			info, _ := exec.Command(pdfinfo, f).Output()
			if !strings.Contains(string(info), "\nPages:           1\n") {
				t.Errorf("%s: not one page:\n%s", paper.name, info)
			}
			// Reading order, with line breaks and spaces removed: a long text
			// wraps in its box on paper.
			raw, _ := exec.Command(pdftotext, "-raw", f, "-").Output()
			text := strings.Join(strings.Fields(string(raw)), "")
			for _, want := range []string{"CAUTIONS", "Nobody under a suspended load", "Time for one full swing", "Rope length", markup, "WHAT THE MODEL ASSUMES"} {
				if !strings.Contains(text, strings.Join(strings.Fields(want), "")) {
					t.Errorf("%s: the printed text lacks %q", paper.name, want)
				}
			}
		}
		select {
		case m := <-opened:
			t.Errorf("a dialog opened: %q", m)
		case <-time.After(300 * time.Millisecond):
		}
	})

	t.Run("touch targets are at least 44 px", func(t *testing.T) {
		h.t = t
		small := eval[string](h, `Array.from(document.querySelectorAll('button,input,select,textarea,a.button,summary'))
			.filter(function (e) { var r = e.getBoundingClientRect(); return r.width > 0 && (r.height < 44 || r.width < 44); })
			.map(function (e) { var r = e.getBoundingClientRect(); return (e.id || e.className || e.tagName) + ' ' + Math.round(r.width) + 'x' + Math.round(r.height); })
			.join(', ')`)
		if small != "" {
			t.Errorf("targets smaller than 44 px: %s", small)
		}
	})

	t.Run("no request leaves the origin", func(t *testing.T) {
		h.t = t
		h.mu.Lock()
		reqs := append([]string{}, h.requests...)
		h.mu.Unlock()
		seen := map[string]bool{}
		for _, u := range reqs {
			switch {
			case strings.HasPrefix(u, h.url), strings.HasPrefix(u, "data:"), strings.HasPrefix(u, "blob:"+strings.TrimSuffix(h.url, "/")),
				u == "about:blank":
			default:
				t.Errorf("request outside the origin: %s", u)
			}
			seen[strings.TrimPrefix(strings.SplitN(u, "#", 2)[0], h.url)] = true
		}
		// The watcher sees the worker's requests too.
		for _, f := range []string{"examples/index.json", "examples/bay-travel.json", "worker.js"} {
			if !seen[f] {
				t.Errorf("no request for %s seen (requests: %v)", f, reqs)
			}
		}
		h.mu.Lock()
		served := strings.Join(h.served, " ")
		h.mu.Unlock()
		if !strings.Contains(served, "/swaysheet.wasm") {
			t.Errorf("the wasm was not loaded from the origin: %s", served)
		}
	})
}
