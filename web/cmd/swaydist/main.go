// Command swaydist builds the page for use anywhere (make dist): a folder
// to host on any web server and one self-contained HTML file that opens
// from a file with no server. See package web/dist.
//
//	go run ./web/cmd/swaydist -build out/web -single-wasm out/single/swaysheet.wasm -out dist
package main

import (
	"flag"
	"fmt"
	"log"
	"os"
	"path/filepath"
	"runtime"

	"swaysheet/core/version"
	"swaysheet/web/dist"
	"swaysheet/web/offline"
)

func main() {
	build := flag.String("build", filepath.Join("out", "web"), "folder holding swaysheet.wasm, swayfetch.wasm and wasm_exec.js")
	single := flag.String("single-wasm", filepath.Join("out", "single", "swaysheet.wasm"), "the wasm built with -tags nofetch for the single file")
	out := flag.String("out", "dist", "output folder")
	gzFile := flag.String("single-gz", "", "the single file's wasm, already gzipped (zopfli); empty: gzip -9 here")
	flag.Parse()
	d := offline.Dirs{Static: filepath.Join("web", "static"), Build: *build, Examples: filepath.Join("testdata", "scenarios")}
	web := filepath.Join(*out, "web")
	if err := os.RemoveAll(web); err != nil {
		log.Fatal(err)
	}
	files, err := dist.Static(d, version.Version, web)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%s/: %d files, to host on any web server\n", web, len(files))
	wexec, err := os.ReadFile(filepath.Join(runtime.GOROOT(), "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		log.Fatal(err)
	}
	wasm, err := os.ReadFile(*single)
	if err != nil {
		log.Fatal(err)
	}
	var page []byte
	if *gzFile != "" {
		gz, err := os.ReadFile(*gzFile)
		if err != nil {
			log.Fatal(err)
		}
		page, err = dist.SingleGz(d.Static, wexec, gz)
	} else {
		page, err = dist.Single(d.Static, wexec, wasm)
	}
	if err != nil {
		log.Fatal(err)
	}
	name := filepath.Join(*out, "swaysheet.html")
	if err := os.WriteFile(name, page, 0o644); err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%s: %d bytes, opens from a file with no server\n", name, len(page))
}
