package offline

import (
	"bytes"
	"flag"
	"image/png"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaysheet/core/sheet"
)

var update = flag.Bool("update", false, "rewrite the icon PNGs in web/static")

var icons = []struct {
	file     string
	n        int
	maskable bool
}{{"icon-192.png", 192, false}, {"icon-512.png", 512, false}, {"icon-maskable-512.png", 512, true}}

// The committed icons are DrawIcon's; go test ./web/offline -update
// rewrites them.
func TestIcons(t *testing.T) {
	for _, ic := range icons {
		var b bytes.Buffer
		if err := png.Encode(&b, DrawIcon(ic.n, ic.maskable)); err != nil {
			t.Fatal(err)
		}
		path := filepath.Join("..", "static", ic.file)
		if *update {
			if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		got, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		img, err := png.Decode(bytes.NewReader(got))
		if err != nil || img.Bounds().Dx() != ic.n || img.Bounds().Dy() != ic.n {
			t.Fatalf("%s: not a %d px PNG (%v)", ic.file, ic.n, err)
		}
		if !bytes.Equal(got, b.Bytes()) {
			t.Fatalf("%s differs from DrawIcon: go test ./web/offline -update", ic.file)
		}
	}
}

func TestServiceWorkerFilesAndVersion(t *testing.T) {
	build := t.TempDir()
	for _, n := range Built {
		os.WriteFile(filepath.Join(build, n), []byte("x"+n), 0o644)
	}
	d := Dirs{Static: "../static", Build: build, Examples: "../../testdata/scenarios"}
	files, err := Collect(d)
	if err != nil {
		t.Fatal(err)
	}
	have := map[string]bool{}
	for _, f := range files {
		have[f.Name] = true
		if f.Name == "sheet.css" && string(f.Data) != sheet.CSS {
			t.Error("sheet.css is not core/sheet's")
		}
	}
	for _, want := range []string{"index.html", "main.js", "engine.js", "plan-view.js", "coach.js", "coach.css", "worker.js", "sheet.js", "sheet.css", "print.css", "offline.js", "site-view.js", "site-figures.js",
		"manifest.webmanifest", "icon-192.png", "swaysheet.wasm", "swayfetch.wasm", "fetchworker.js", "wasm_exec.js", "examples/index.json", "examples/bay-travel.json"} {
		if !have[want] {
			t.Errorf("the release lacks %s", want)
		}
	}
	if have["sw.js"] {
		t.Error("sw.js caches itself")
	}
	tmpl, _ := os.ReadFile("../static/sw.js")
	v1 := Version("1.0", files)
	sw := string(ServiceWorker(tmpl, v1, files))
	if strings.Contains(sw, "{{") || !strings.Contains(sw, "'"+v1+"'") || !strings.Contains(sw, `"examples/bay-travel.json"`) {
		t.Fatal("the service worker was not filled in")
	}
	// Any changed file is a new release.
	files[0].Data = append([]byte{}, files[0].Data...)
	files[0].Data = append(files[0].Data, ' ')
	if Version("1.0", files) == v1 {
		t.Fatal("a changed file kept the cache version")
	}
}
