package site

import (
	"encoding/json"
	"net/http"
	"net/http/httptest"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaysheet/core/sheet"
)

func handler(t *testing.T) http.Handler {
	build := t.TempDir()
	if err := os.WriteFile(filepath.Join(build, "swaysheet.wasm"), []byte("\x00asm"), 0o644); err != nil {
		t.Fatal(err)
	}
	return Handler(Dirs{Static: "../static", Build: build, Examples: "../../testdata/scenarios"})
}

func get(h http.Handler, method, path string) *httptest.ResponseRecorder {
	rec := httptest.NewRecorder()
	h.ServeHTTP(rec, httptest.NewRequest(method, path, nil))
	return rec
}

func TestServesOwnFilesOnly(t *testing.T) {
	h := handler(t)
	for _, c := range []struct {
		path string
		code int
	}{
		{"/", 200}, {"/main.js", 200}, {"/worker.js", 200}, {"/swaysheet.wasm", 200},
		{"/examples/bay-travel.json", 200}, {"/examples/index.json", 200},
		{"/../go.mod", 404}, {"/examples/../../go.mod", 404}, {"/site/site.go", 404},
		{"/examples/", 404}, {"/wasm_exec.js", 404}, {"/nothing.html", 404},
	} {
		rec := get(h, "GET", c.path)
		if rec.Code != c.code {
			t.Errorf("GET %s: %d, want %d", c.path, rec.Code, c.code)
		}
		if !strings.Contains(rec.Header().Get("Content-Security-Policy"), "default-src 'self'") {
			t.Errorf("GET %s: no CSP", c.path)
		}
	}
	if rec := get(h, "POST", "/"); rec.Code != http.StatusMethodNotAllowed {
		t.Errorf("POST: %d", rec.Code)
	}
	if ct := get(h, "GET", "/swaysheet.wasm").Header().Get("Content-Type"); ct != "application/wasm" {
		t.Errorf("wasm content type %q", ct)
	}
	// The check sheet's style sheet is the core's own (no copy in web/static).
	css := get(h, "GET", "/sheet.css")
	if css.Code != 200 || css.Body.String() != sheet.CSS || !strings.HasPrefix(css.Header().Get("Content-Type"), "text/css") {
		t.Errorf("GET /sheet.css: %d %q, not core/sheet's sheet.css", css.Code, css.Header().Get("Content-Type"))
	}
}

func TestExampleIndex(t *testing.T) {
	rec := get(handler(t), "GET", "/examples/index.json")
	var names []string
	if err := json.Unmarshal(rec.Body.Bytes(), &names); err != nil {
		t.Fatal(err)
	}
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	if len(names) == 0 || len(names) != len(files) {
		t.Errorf("index %v, files %v", names, files)
	}
}

// A site library folder is served under /library/: its .json files, and
// nothing else; without one, /library/ is not found.
func TestSiteLibrary(t *testing.T) {
	lib := t.TempDir()
	os.WriteFile(filepath.Join(lib, "index.json"), []byte(`["bay-3.json"]`), 0o644)
	os.WriteFile(filepath.Join(lib, "bay-3.json"), []byte(`{}`), 0o644)
	os.WriteFile(filepath.Join(lib, "notes.txt"), []byte(`x`), 0o644)
	h := Handler(Dirs{Static: "../static", Build: t.TempDir(), Examples: "../../testdata/scenarios", Library: lib})
	for p, code := range map[string]int{"/library/index.json": 200, "/library/bay-3.json": 200,
		"/library/notes.txt": 404, "/library/../go.mod": 404, "/library/": 404} {
		if rec := get(h, "GET", p); rec.Code != code {
			t.Errorf("GET %s: %d, want %d", p, rec.Code, code)
		}
	}
	if rec := get(handler(t), "GET", "/library/index.json"); rec.Code != 404 {
		t.Errorf("no library: %d", rec.Code)
	}
}
