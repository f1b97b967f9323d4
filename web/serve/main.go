// Command serve serves the swaysheet page on 127.0.0.1 and prints its URL.
// Run it from the repository root after building the wasm (make serve does
// both):
//
//	go run ./web/serve -addr 127.0.0.1:8080 -build out/web
package main

import (
	"flag"
	"fmt"
	"log"
	"net"
	"net/http"
	"os"
	"path/filepath"
	"time"

	"swaysheet/web/site"
)

func main() {
	addr := flag.String("addr", "127.0.0.1:8080", "address to listen on (keep it on the loopback)")
	build := flag.String("build", filepath.Join("out", "web"), "folder holding swaysheet.wasm, swayfetch.wasm and wasm_exec.js")
	library := flag.String("library", "", "a site library folder to serve under /library/ (library/index.json and the scenario files it lists)")
	flag.Parse()
	for _, f := range []string{"swaysheet.wasm", "swayfetch.wasm", "wasm_exec.js"} {
		if _, err := os.Stat(filepath.Join(*build, f)); err != nil {
			log.Fatalf("%v: build the wasm first (make serve)", err)
		}
	}
	ln, err := net.Listen("tcp", *addr)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("swaysheet: open http://%s/  (Ctrl-C stops the server)\n", ln.Addr())
	srv := &http.Server{
		Handler: site.Handler(site.Dirs{Static: filepath.Join("web", "static"), Build: *build,
			Examples: filepath.Join("testdata", "scenarios"), Library: *library}),
		ReadHeaderTimeout: 10 * time.Second,
	}
	log.Fatal(srv.Serve(ln))
}
