// Package offline lists the files of one release of the page and writes
// its service worker (web/static/sw.js with the release's version and file
// list filled in). The development server (web/site) and the static build
// (make dist, web/dist) both use it, so a hosted copy and the local one
// cache the same files.
package offline

import (
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"os"
	"path/filepath"
	"sort"
	"strings"

	"swaysheet/core/sheet"
)

// File is one file of the page, by its URL path relative to the page.
type File struct {
	Name string
	Data []byte
}

// Dirs are the folders the page is made of (as site.Dirs).
type Dirs struct {
	Static, Build, Examples string
}

// Built are the build outputs served beside the static files.
var Built = []string{"swaysheet.wasm", "swayfetch.wasm", "wasm_exec.js"}

// FromCore are the page's files that the core holds, by name: the check
// sheet's style sheet is core/sheet's own (the page shows the sheet the
// core renders), served and built from there, with no copy in web/static.
var FromCore = map[string][]byte{"sheet.css": []byte(sheet.CSS)}

// ReadStatic reads one file of the page's static folder, or the core's
// own when FromCore has it.
func ReadStatic(static, name string) ([]byte, error) {
	if b, ok := FromCore[name]; ok {
		return b, nil
	}
	return os.ReadFile(filepath.Join(static, name))
}

// Collect reads every file of the page: the static folder but sw.js, the
// files FromCore, the built wasm and wasm_exec.js, and the example
// scenarios under examples/ with examples/index.json listing them.
func Collect(d Dirs) ([]File, error) {
	var out []File
	ents, err := os.ReadDir(d.Static)
	if err != nil {
		return nil, err
	}
	for _, e := range ents {
		if e.IsDir() || e.Name() == "sw.js" || strings.HasPrefix(e.Name(), ".") {
			continue
		}
		b, err := os.ReadFile(filepath.Join(d.Static, e.Name()))
		if err != nil {
			return nil, err
		}
		out = append(out, File{e.Name(), b})
	}
	for n, b := range FromCore {
		out = append(out, File{n, b})
	}
	for _, n := range Built {
		b, err := os.ReadFile(filepath.Join(d.Build, n))
		if err != nil {
			return nil, err
		}
		out = append(out, File{n, b})
	}
	ex, err := filepath.Glob(filepath.Join(d.Examples, "*.json"))
	if err != nil {
		return nil, err
	}
	sort.Strings(ex)
	names := []string{}
	for _, f := range ex {
		b, err := os.ReadFile(f)
		if err != nil {
			return nil, err
		}
		names = append(names, filepath.Base(f))
		out = append(out, File{"examples/" + filepath.Base(f), b})
	}
	idx, _ := json.Marshal(names)
	out = append(out, File{"examples/index.json", append(idx, '\n')})
	sort.Slice(out, func(i, j int) bool { return out[i].Name < out[j].Name })
	return out, nil
}

// Version is the release's cache version: the tool's version and the
// first 12 hex digits of a SHA-256 over every file's name and content, so
// any changed file makes a new release.
func Version(tool string, files []File) string {
	h := sha256.New()
	for _, f := range files {
		h.Write([]byte(f.Name))
		h.Write([]byte{0})
		sum := sha256.Sum256(f.Data)
		h.Write(sum[:])
	}
	return tool + "-" + hex.EncodeToString(h.Sum(nil))[:12]
}

// ServiceWorker fills the template (web/static/sw.js) with the version
// and the list of files to cache ("./" for the page itself).
func ServiceWorker(template []byte, version string, files []File) []byte {
	list := []string{"./"}
	for _, f := range files {
		list = append(list, f.Name)
	}
	js, _ := json.Marshal(list)
	s := strings.Replace(string(template), "{{VERSION}}", version, 1)
	s = strings.Replace(s, "{{FILES}}", string(js), 1)
	return []byte(s)
}
