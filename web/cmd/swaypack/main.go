// Command swaypack rewrites wasm files in place with their data segments
// joined (web/dist.PackData): the same memory at start, about 6 % less
// gzipped. make wasm and make single-wasm run it after go build.
//
//	go run ./web/cmd/swaypack out/web/swaysheet.wasm
package main

import (
	"fmt"
	"log"
	"os"

	"swaysheet/web/dist"
)

func main() {
	if len(os.Args) < 2 {
		log.Fatal("usage: swaypack FILE.wasm ...")
	}
	for _, f := range os.Args[1:] {
		in, err := os.ReadFile(f)
		if err != nil {
			log.Fatal(err)
		}
		out, err := dist.PackData(in, dist.PackGap)
		if err != nil {
			log.Fatalf("%s: %v", f, err)
		}
		if err := os.WriteFile(f, out, 0o755); err != nil {
			log.Fatal(err)
		}
		fmt.Printf("%s: data segments joined, %d -> %d bytes\n", f, len(in), len(out))
	}
}
