package sheettest

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"

	"swaysheet/web/site"
)

// A site office's library served beside the page: the Examples dialog
// lists its files (by the index's name and description, or the file's
// own), names a file the core cannot read, and opens one after the core
// reads it. The service worker keeps what the page read, so with the
// network off the library is listed and opened again.
func TestSiteLibraryOffline(t *testing.T) {
	need(t)
	lib := t.TempDir()
	bay, err := os.ReadFile(filepath.Join(root, "testdata", "scenarios", "bay-travel.json"))
	if err != nil {
		t.Fatal(err)
	}
	var own map[string]any
	if err := json.Unmarshal(bay, &own); err != nil {
		t.Fatal(err)
	}
	own["name"] = "Bay 3: girder G2 to the welding line"
	delete(own, "example")
	delete(own, "description")
	ownData, _ := json.Marshal(own)
	tower, _ := os.ReadFile(filepath.Join(root, "testdata", "scenarios", "tower-slew.json"))
	for name, body := range map[string]string{
		"index.json":  `[{"file": "bay-3.json", "name": "Bay 3 girder", "description": "Lift plan LP-12 (invented for the test)"}, "tower.json", "broken.json"]`,
		"bay-3.json":  string(ownData),
		"tower.json":  string(tower),
		"broken.json": `{"format": "swaysheet-scenario", "version": 1, "load": {}}`,
	} {
		if err := os.WriteFile(filepath.Join(lib, name), []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	build := t.TempDir()
	buildWasm(t, build)
	srv, served := serve(t, site.Handler(site.Dirs{Static: filepath.Join(root, "web", "static"), Build: build,
		Examples: filepath.Join(root, "testdata", "scenarios"), Library: lib}))
	b := open(t)
	b.do(chromedp.Navigate(srv.URL + "/"))
	b.settle()
	b.poll(`!!navigator.serviceWorker.controller`, "the service worker does not control the page")
	// Reloaded, the page and its worker start under the service worker.
	b.do(chromedp.Reload())
	b.settle()

	list := func(where string) {
		t.Helper()
		b.do(chromedp.Click(chromedp.ID("open-examples")))
		b.poll(`!window.swaysheetLibrary.reading() && !!document.getElementById('library').dataset.state`, "the library was not read")
		if st := eval[string](b, `document.getElementById('library').dataset.state`); st != "listed" {
			t.Fatalf("%s: library %s: %q", where, st, b.text("#library-source"))
		}
		items := b.text("#library-list")
		for _, w := range []string{"Bay 3 girder", "Lift plan LP-12", "Housing site: tower crane slews a rebar bundle", "Not listed: ", "broken.json"} {
			if !strings.Contains(items, w) {
				t.Errorf("%s: the list lacks %q: %q", where, w, items)
			}
		}
		if n := eval[int](b, `document.querySelectorAll('#library-list [data-lib]').length`); n != 2 {
			t.Errorf("%s: %d files to open, want 2", where, n)
		}
		n := eval[int](b, `window.swaysheet.loads()`)
		b.do(chromedp.Click(chromedp.CSS(`#library-list [data-lib="0"]`)))
		b.poll(`window.swaysheet.loads() > `+itoa(n)+` && window.swaysheet.settled()`, where+": the library file was not opened")
		if got := eval[string](b, `JSON.parse(window.swaysheet.scenarioJSON()).name`); got != own["name"] {
			t.Errorf("%s: opened %q", where, got)
		}
		if !eval[bool](b, `document.getElementById('example-banner').hidden`) {
			t.Errorf("%s: the site's own lift is marked as an example", where)
		}
	}
	list("online")
	names, paths := b.caches()
	have := map[string]bool{}
	for _, p := range paths {
		have[p] = true
	}
	if !strings.Contains(strings.Join(names, " "), "swaysheet-site-library") || !have["/library/index.json"] || !have["/library/bay-3.json"] || !have["/library/tower.json"] {
		t.Errorf("caches %q hold %q", names, paths)
	}

	// The network off: the library from the copy kept.
	b.offline(true)
	served.setDown(true)
	before := served.count()
	b.do(chromedp.Reload())
	b.settle()
	list("offline")
	// Only the library's network-first reads and the browser's update
	// check of the service worker reach for the server (and find it
	// down); the page's own files come from the release's cache.
	served.mu.Lock()
	for _, p := range served.paths[before:] {
		if !strings.HasPrefix(p, "/library/") && p != "/sw.js" {
			t.Errorf("with the network off the server was asked for %s", p)
		}
	}
	served.mu.Unlock()
	b.offline(false)
	served.setDown(false)
}
