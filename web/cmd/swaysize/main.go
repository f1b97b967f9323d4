// Command swaysize measures the page's download sizes against their
// targets and prints them as swaybench rows (JSON lines) for make bench:
// the page's main wasm gzipped (target 1.6 MB; it links no net/http), the
// site library's fetch wasm (wasm/fetch: tinyutil's httputil and so
// net/http, loaded only when the library is opened; no target), the
// single-file page (target 2 MB), and for information the raw sizes, the
// single file's wasm and the static folder. With -parts (the main wasm
// built without -s) it adds its largest parts by package family, gzipped
// each on its own, and what net/http and crypto add to it, which is to be
// nothing (breakdown.go). MB here is 10^6 bytes.
//
//	go run ./web/cmd/swaysize -wasm out/web/swaysheet.wasm -fetch-wasm out/web/swayfetch.wasm -single-wasm out/single/swaysheet.wasm -single dist/swaysheet.html -static dist/web -parts out/bench/parts.wasm
//	go run ./web/cmd/swaysize -breakdown out/bench/parts.wasm   # the whole table, as text
package main

import (
	"bytes"
	"compress/gzip"
	"encoding/json"
	"flag"
	"fmt"
	"io/fs"
	"log"
	"os"
	"path/filepath"
)

type row struct {
	Group string  `json:"group"`
	Name  string  `json:"name"`
	Value float64 `json:"value"`
	Unit  string  `json:"unit"`
	Note  string  `json:"note,omitempty"`
}

func gz(b []byte) int {
	var buf bytes.Buffer
	w, _ := gzip.NewWriterLevel(&buf, gzip.BestCompression)
	w.Write(b)
	w.Close()
	return buf.Len()
}

// The targets, MB (issue: the page's wasm at most 1.6 MB gzipped while
// keeping tinyutil, which the fetch wasm holds; the single file within
// 2 MB).
const (
	pageGzipTarget   = 1.6
	singlePageTarget = 2.0
)

func verdict(n int, target float64) string {
	mb := float64(n) / 1e6
	if mb <= target {
		return fmt.Sprintf("target %g MB: met, %.1f kB to spare", target, (target-mb)*1e3)
	}
	return fmt.Sprintf("target %g MB: MISSED by %.1f kB", target, (mb-target)*1e3)
}

func main() {
	wasm := flag.String("wasm", "out/web/swaysheet.wasm", "the page's main wasm")
	fetchWasm := flag.String("fetch-wasm", "out/web/swayfetch.wasm", "the site library's fetch wasm")
	single := flag.String("single-wasm", "out/single/swaysheet.wasm", "the single file's wasm (-tags nofetch)")
	page := flag.String("single", "dist/swaysheet.html", "the single-file page")
	static := flag.String("static", "dist/web", "the static folder")
	parts := flag.String("breakdown", "", "print this wasm's code by package (a build without -s) and exit")
	partsOf := flag.String("parts", "", "add rows of this wasm's largest parts (the page's wasm built without -s)")
	flag.Parse()
	if *parts != "" {
		b, err := os.ReadFile(*parts)
		if err != nil {
			log.Fatal(err)
		}
		if err := printBreakdown(os.Stdout, b); err != nil {
			log.Fatal(err)
		}
		return
	}
	var rows []row
	add := func(name string, n int, note string) {
		rows = append(rows, row{Group: "size", Name: name, Value: float64(n) / 1e6, Unit: "MB", Note: note})
	}
	read := func(p string) []byte {
		b, err := os.ReadFile(p)
		if err != nil {
			log.Fatal(err)
		}
		return b
	}
	w := read(*wasm)
	add("page main wasm, gzipped", gz(w), verdict(gz(w), pageGzipTarget))
	add("page main wasm, raw", len(w), "for information (no target)")
	f := read(*fetchWasm)
	add("site library fetch wasm, gzipped", gz(f), "for information: tinyutil's httputil and net/http, loaded only when the library is opened")
	add("site library fetch wasm, raw", len(f), "for information")
	p := read(*page)
	add("single-file page (wasm zopfli-gzipped, 7-bit text)", len(p), verdict(len(p), singlePageTarget))
	s := read(*single)
	add("single-file wasm (nofetch), gzipped", gz(s), "for information: its share of the single file")
	add("single-file wasm, raw", len(s), "for information")
	total, files := 0, 0
	filepath.WalkDir(*static, func(path string, d fs.DirEntry, err error) error {
		if err == nil && !d.IsDir() {
			if st, err := d.Info(); err == nil {
				total += int(st.Size())
				files++
			}
		}
		return nil
	})
	add("static folder", total, fmt.Sprintf("%d files; a server that gzips sends the wasm at the gzipped size", files))
	if *partsOf != "" {
		pr, err := partRows(read(*partsOf))
		if err != nil {
			log.Fatal(err)
		}
		rows = append(rows, pr...)
	}
	enc := json.NewEncoder(os.Stdout)
	for _, r := range rows {
		enc.Encode(r)
	}
}
