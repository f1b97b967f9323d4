package main

import (
	"encoding/json"
	"fmt"
	"io"
	"os"
	"strings"

	"swaysheet/core/ropelength"
)

// runRopeLength answers each question (JSON text, or a file holding it)
// with the ropelength.Result JSON.
func runRopeLength(args []string, stdout, stderr io.Writer) int {
	status := 0
	for _, a := range args {
		data := []byte(a)
		if !strings.HasPrefix(strings.TrimSpace(a), "{") {
			b, err := os.ReadFile(a)
			if err != nil {
				fmt.Fprintf(stderr, "%s: %v\n", a, err)
				status = 1
				continue
			}
			data = b
		}
		res, err := ropelength.Parse(data)
		var out []byte
		if err == nil {
			out, err = json.MarshalIndent(res, "", "  ")
		}
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", a, err)
			status = 1
			continue
		}
		fmt.Fprintf(stdout, "%s\n", out)
	}
	return status
}
