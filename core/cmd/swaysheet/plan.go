package main

import (
	"encoding/json"
	"fmt"
	"io"

	"swaysheet/core/plan"
)

// runPlans plans each file and prints the table (or JSON).
func runPlans(names []string, asJSON bool, stdout, stderr io.Writer) int {
	status := 0
	for i, name := range names {
		r, err := planFile(name)
		if err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
			continue
		}
		if asJSON {
			enc := json.NewEncoder(stdout)
			enc.SetIndent("", "  ")
			if err := enc.Encode(r); err != nil {
				fmt.Fprintf(stderr, "%s: %v\n", name, err)
				status = 1
			}
			continue
		}
		if i > 0 {
			fmt.Fprintln(stdout)
		}
		fmt.Fprintln(stdout, name)
		if err := plan.WriteTable(stdout, r); err != nil {
			fmt.Fprintf(stderr, "%s: %v\n", name, err)
			status = 1
		}
	}
	return status
}

func planFile(name string) (*plan.Result, error) {
	s, err := readScenario(name)
	if err != nil {
		return nil, err
	}
	return plan.Make(s)
}
