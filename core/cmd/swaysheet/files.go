package main

import (
	"encoding/json"
	"fmt"
	"io"
)

// eachFile calls do for every file name in turn, printing its error under
// the file's name on stderr; the exit status is 1 when any failed.
func eachFile(names []string, stderr io.Writer, do func(i int, name string) error) int {
	status := 0
	for i, name := range names {
		if err := do(i, name); err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
		}
	}
	return status
}

// writeJSON writes v as indented JSON.
func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}
