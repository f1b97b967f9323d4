package main

import (
	"fmt"
	"io"

	"swaysheet/core/plan"
)

// runPlans plans each file and prints the table (or JSON).
func runPlans(names []string, asJSON bool, stdout, stderr io.Writer) int {
	return eachFile(names, stderr, func(i int, name string) error {
		r, err := planFile(name)
		if err != nil {
			return err
		}
		if asJSON {
			return writeJSON(stdout, r)
		}
		if i > 0 {
			fmt.Fprintln(stdout)
		}
		fmt.Fprintln(stdout, name)
		return plan.WriteTable(stdout, r)
	})
}

func planFile(name string) (*plan.Result, error) {
	s, err := readScenario(name)
	if err != nil {
		return nil, err
	}
	return plan.Make(s)
}
