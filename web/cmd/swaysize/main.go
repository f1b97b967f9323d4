// Command swaysize measures the page's download sizes against their
// budgets and prints them as swaybench rows (JSON lines) for make bench:
// the wasm raw and gzipped (budget 3 MB and 1 MB), the single-file page
// (budget 2 MB) and the static folder. MB here is 10^6 bytes.
//
//	go run ./web/cmd/swaysize -wasm out/web/swaysheet.wasm -single-wasm out/single/swaysheet.wasm -single dist/swaysheet.html -static dist/web
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

func verdict(n int, budget float64) string {
	mb := float64(n) / 1e6
	if mb <= budget {
		return fmt.Sprintf("budget %g MB: within", budget)
	}
	return fmt.Sprintf("budget %g MB: OVER by %.2f MB", budget, mb-budget)
}

func main() {
	wasm := flag.String("wasm", "out/web/swaysheet.wasm", "the page's wasm")
	single := flag.String("single-wasm", "out/single/swaysheet.wasm", "the single file's wasm (-tags nofetch)")
	page := flag.String("single", "dist/swaysheet.html", "the single-file page")
	static := flag.String("static", "dist/web", "the static folder")
	parts := flag.String("breakdown", "", "print this wasm's code by package (a build without -s) and exit")
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
	add("page wasm, raw", len(w), verdict(len(w), 3))
	add("page wasm, gzipped", gz(w), verdict(gz(w), 1))
	s := read(*single)
	add("single-file wasm (nofetch, -s -w), raw", len(s), verdict(len(s), 3))
	add("single-file wasm, gzipped", gz(s), verdict(gz(s), 1))
	p := read(*page)
	add("single-file page (wasm zopfli-gzipped, base85)", len(p), verdict(len(p), 2))
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
	enc := json.NewEncoder(os.Stdout)
	for _, r := range rows {
		enc.Encode(r)
	}
}
