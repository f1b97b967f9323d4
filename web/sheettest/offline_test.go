package sheettest

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/chromedp"

	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/core/version"
)

func copyDir(t *testing.T, from, to string) {
	t.Helper()
	ents, err := os.ReadDir(from)
	if err != nil {
		t.Fatal(err)
	}
	os.MkdirAll(to, 0o755)
	for _, e := range ents {
		if e.IsDir() {
			continue
		}
		b, err := os.ReadFile(filepath.Join(from, e.Name()))
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(to, e.Name()), b, 0o644); err != nil {
			t.Fatal(err)
		}
	}
}

func (b *browser) offline(off bool) {
	b.t.Helper()
	if _, err := chromedp.Call(b.ctx, network.OverrideNetworkState, network.OverrideNetworkStateParams{
		Offline: off, Latency: 0, DownloadThroughput: -1, UploadThroughput: -1}); err != nil {
		b.t.Fatal(err)
	}
	// The same for the service worker's own requests (its update check).
	if _, err := chromedp.Call(b.ctx, network.EmulateNetworkConditionsByRule, network.EmulateNetworkConditionsByRuleParams{
		EmulateOfflineServiceWorker: &off,
		MatchedNetworkConditions:    []*network.Conditions{{Offline: off, DownloadThroughput: -1, UploadThroughput: -1}}}); err != nil {
		b.t.Fatal(err)
	}
}

// cacheState is the page's caches: their names, and the paths the
// swaysheet cache holds.
func (b *browser) caches() (names []string, paths []string) {
	b.t.Helper()
	js := `caches.keys().then(function (ks) {
	  return Promise.all(ks.map(function (k) { return caches.open(k).then(function (c) { return c.keys(); }).then(function (rs) {
	    return k + '=' + rs.map(function (r) { return new URL(r.url).pathname; }).join(',');
	  }); }));
	}).then(function (xs) { return xs.join(';'); })`
	v, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](js, chromedp.EvalAwaitPromise))
	if err != nil {
		b.t.Fatal(err)
	}
	for _, c := range strings.Split(v, ";") {
		if c == "" {
			continue
		}
		n, p, _ := strings.Cut(c, "=")
		names = append(names, n)
		paths = append(paths, strings.Split(p, ",")...)
	}
	return names, paths
}

// Load once, switch the network off (DevTools network emulation), reload,
// change an input and get a new result; nothing reaches the server. Then a
// new release: the page says a new version is ready, and after the reload
// it asks for, the new release's cache has replaced the old whole.
func TestOfflineAndNewVersion(t *testing.T) {
	need(t)
	static := filepath.Join(t.TempDir(), "static")
	copyDir(t, filepath.Join(root, "web", "static"), static)
	url, served := pageServer(t, static)
	b := open(t)
	b.do(chromedp.Navigate(url))
	b.settle()
	b.poll(`!!navigator.serviceWorker.controller`, "the service worker does not control the page")
	names, paths := b.caches()
	if len(names) != 1 || !strings.HasPrefix(names[0], "swaysheet-"+version.Version+"-") {
		t.Fatalf("caches %q, want one swaysheet release", names)
	}
	have := map[string]bool{}
	for _, p := range paths {
		have[p] = true
	}
	for _, f := range []string{"/", "/index.html", "/main.js", "/engine.js", "/plan-view.js", "/coach.js", "/coach.css", "/worker.js", "/swaysheet.wasm", "/fetchworker.js", "/swayfetch.wasm", "/wasm_exec.js", "/style.css", "/sheet.css",
		"/print.css", "/sheet.js", "/offline.js", "/manifest.webmanifest", "/icon-192.png", "/examples/index.json", "/examples/bay-travel.json"} {
		if !have[f] {
			t.Errorf("the cache lacks %s", f)
		}
	}
	// The manifest is one a tablet installs from.
	man := eval[string](b, `document.querySelector('link[rel=manifest]').href`)
	if !strings.HasSuffix(man, "/manifest.webmanifest") {
		t.Errorf("manifest link %q", man)
	}

	// The network off, twice over: DevTools emulation for the page, its
	// worker and the service worker, and the server cuts every connection.
	b.offline(true)
	served.setDown(true)
	before := served.count()
	b.do(chromedp.Reload())
	b.settle()
	period0 := b.text(figSel("period_s"))
	n := eval[int](b, `window.swaysheet.resultCount()`)
	b.typeInto("#f-load-rope_length_m", "14")
	b.poll(`window.swaysheet.resultCount() > `+strconv.Itoa(n)+` && window.swaysheet.settled()`, "no new result offline")
	s, err := scenario.Parse([]byte(eval[string](b, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	r, err := sway.Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	if got, w := b.text(figSel("period_s")), shownText(figures.Present(s, r, units.Choice{System: "si"}), "period_s"); got != w || got == period0 {
		t.Errorf("offline: period %q after the change (before %q), the core gives %q", got, period0, w)
	}
	b.waitSheet()
	// The browser's own update check of the service worker script may get
	// past the emulation (it then fails at the server, and the cached
	// release runs on); no request of the page does.
	for _, p := range served.since(before) {
		if p != "/sw.js" {
			t.Errorf("with the network off, the page asked the server for %s", p)
		}
	}
	served.setDown(false)
	if !eval[bool](b, `document.getElementById('update-notice').hidden`) {
		t.Error("a new version is announced with nothing new")
	}

	// A new release.
	b.offline(false)
	app, _ := os.ReadFile(filepath.Join(static, "main.js"))
	os.WriteFile(filepath.Join(static, "main.js"), append(app, []byte("\n// release 2\n")...), 0o644)
	b.do(chromedp.Evaluate[chromedp.Void](`navigator.serviceWorker.getRegistration().then(function (r) { return r.update(); })`, chromedp.EvalAwaitPromise))
	b.poll(`!document.getElementById('update-notice').hidden`, "the page does not say a new version is ready")
	// Until the user reloads, the open page keeps its release.
	names, _ = b.caches()
	old := map[string]bool{}
	for _, n := range names {
		old[n] = true
	}
	if len(names) != 2 {
		t.Fatalf("caches while the new release waits: %q", names)
	}
	b.do(chromedp.Click(chromedp.CSS("#update-reload")))
	b.pollThrough(`document.readyState === "complete" && !!navigator.serviceWorker.controller && document.getElementById('update-notice').hidden`, "no reload into the new release")
	b.settle()
	for i := 0; ; i++ {
		names, _ = b.caches()
		if len(names) == 1 || i > 200 {
			break
		}
		b.sleep()
	}
	if len(names) != 1 || !old[names[0]] {
		t.Fatalf("caches after the update: %q (before: %v)", names, old)
	}
	src, err := chromedp.Run(b.ctx, chromedp.Evaluate[string](`fetch('main.js').then(function (r) { return r.text(); })`, chromedp.EvalAwaitPromise))
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(src, "// release 2") {
		t.Error("the page still runs the old release")
	}
}
