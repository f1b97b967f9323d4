// Package site serves the page's own files and nothing else: the static
// page (web/static) and the files the core holds for it (offline.FromCore:
// sheet.css), the built wasm and Go's wasm_exec.js (the build
// folder), and the example scenarios (testdata/scenarios) under
// /examples/, with /examples/index.json listing them.
package site

import (
	"bytes"
	"encoding/json"
	"net/http"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"
	"time"

	"swaysheet/core/version"
	"swaysheet/web/offline"
)

// Dirs are the folders served.
type Dirs struct {
	Static   string // web/static
	Build    string // holds swaysheet.wasm, swayfetch.wasm and wasm_exec.js
	Examples string // testdata/scenarios
	// Library is a site library folder (library/index.json and the
	// scenario files it names), served under /library/; empty: none.
	Library string
}

// CSP allows the page to load only its own files; wasm needs
// 'wasm-unsafe-eval'.
const CSP = "default-src 'self'; script-src 'self' 'wasm-unsafe-eval'; style-src 'self'; " +
	"img-src 'self' data: blob:; connect-src 'self'; worker-src 'self'; object-src 'none'; " +
	"base-uri 'none'; form-action 'none'; frame-ancestors 'none'"

var built = map[string]bool{"swaysheet.wasm": true, "swayfetch.wasm": true, "wasm_exec.js": true}

// Handler serves d. Only GET and HEAD of plain files are answered.
func Handler(d Dirs) http.Handler {
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		if r.Method != http.MethodGet && r.Method != http.MethodHead {
			http.Error(w, "only GET and HEAD", http.StatusMethodNotAllowed)
			return
		}
		h := w.Header()
		h.Set("Content-Security-Policy", CSP)
		h.Set("X-Content-Type-Options", "nosniff")
		h.Set("Referrer-Policy", "no-referrer")
		h.Set("Cache-Control", "no-cache")
		p := path.Clean("/" + r.URL.Path)
		switch {
		case p == "/":
			file(w, r, filepath.Join(d.Static, "index.html"))
		case p == "/sw.js":
			serviceWorker(w, d)
		case p == "/examples/index.json":
			index(w, d.Examples)
		case strings.HasPrefix(p, "/examples/"):
			name := strings.TrimPrefix(p, "/examples/")
			if strings.Contains(name, "/") || !strings.HasSuffix(name, ".json") {
				http.NotFound(w, r)
				return
			}
			file(w, r, filepath.Join(d.Examples, name))
		case strings.HasPrefix(p, "/library/") && d.Library != "":
			name := strings.TrimPrefix(p, "/library/")
			if strings.Contains(name, "/") || !strings.HasSuffix(name, ".json") {
				http.NotFound(w, r)
				return
			}
			file(w, r, filepath.Join(d.Library, name))
		case offline.FromCore[strings.TrimPrefix(p, "/")] != nil:
			name := strings.TrimPrefix(p, "/")
			if strings.HasSuffix(name, ".css") {
				w.Header().Set("Content-Type", "text/css; charset=utf-8")
			}
			http.ServeContent(w, r, name, time.Time{}, bytes.NewReader(offline.FromCore[name]))
		case built[strings.TrimPrefix(p, "/")]:
			file(w, r, filepath.Join(d.Build, strings.TrimPrefix(p, "/")))
		default:
			file(w, r, filepath.Join(d.Static, filepath.FromSlash(strings.TrimPrefix(p, "/"))))
		}
	})
}

// serviceWorker writes web/static/sw.js filled in with the files of the
// page as they are now and their version (web/offline), as make dist does.
func serviceWorker(w http.ResponseWriter, d Dirs) {
	tmpl, err := os.ReadFile(filepath.Join(d.Static, "sw.js"))
	if err != nil {
		http.Error(w, err.Error(), http.StatusNotFound)
		return
	}
	files, err := offline.Collect(offline.Dirs{Static: d.Static, Build: d.Build, Examples: d.Examples})
	if err != nil {
		http.Error(w, err.Error(), http.StatusInternalServerError)
		return
	}
	w.Header().Set("Content-Type", "text/javascript; charset=utf-8")
	_, _ = w.Write(offline.ServiceWorker(tmpl, offline.Version(version.Version, files), files))
}

func file(w http.ResponseWriter, r *http.Request, name string) {
	st, err := os.Stat(name)
	if err != nil || st.IsDir() {
		http.NotFound(w, r)
		return
	}
	if strings.HasSuffix(name, ".wasm") {
		w.Header().Set("Content-Type", "application/wasm")
	}
	if strings.HasSuffix(name, ".webmanifest") {
		w.Header().Set("Content-Type", "application/manifest+json")
	}
	http.ServeFile(w, r, name)
}

func index(w http.ResponseWriter, dir string) {
	files, err := filepath.Glob(filepath.Join(dir, "*.json"))
	if err != nil {
		http.Error(w, err.Error(), http.StatusInternalServerError)
		return
	}
	names := []string{}
	for _, f := range files {
		names = append(names, filepath.Base(f))
	}
	sort.Strings(names)
	w.Header().Set("Content-Type", "application/json")
	_ = json.NewEncoder(w).Encode(names)
}
