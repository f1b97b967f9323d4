package main

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"time"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// floorRows times the floor kernel (floor.go) and the core's figures-only
// evaluation of a travel scenario, interleaved in the same run so that
// the load of a shared machine falls on both alike, and reports their
// ratio against the target of at most 2x.
func floorRows(file string, repeat int, group string) ([]Row, error) {
	data, err := os.ReadFile(file)
	if err != nil {
		return nil, err
	}
	s, err := scenario.Parse(data)
	if err != nil {
		return nil, fmt.Errorf("%s: %w", file, err)
	}
	f, ok := newFloorRun(s)
	if !ok {
		return nil, fmt.Errorf("%s: the floor kernel takes travel moves with trapezoids only", file)
	}
	var steps int
	opts := []sway.Options{{NoHistory: true}, {NoHistory: true, General: true}}
	var tf []float64
	tc := make([][]float64, len(opts))
	for i := range repeat + 10 {
		start := time.Now()
		f.run()
		d := float64(time.Since(start).Nanoseconds()) / 1e3
		for k, o := range opts {
			start := time.Now()
			r, err := sway.EvaluateWith(s, o)
			dc := float64(time.Since(start).Nanoseconds()) / 1e3
			if err != nil {
				return nil, err
			}
			steps = r.Solver.Steps
			if i >= 10 { // the first runs warm up
				tc[k] = append(tc[k], dc)
			}
		}
		if i >= 10 {
			tf = append(tf, d)
		}
	}
	floor, core, general := Median(tf), Median(tc[0]), Median(tc[1])
	base := strings.TrimSuffix(filepath.Base(file), ".json")
	verdict := "met"
	if core > 2*floor {
		verdict = "MISSED"
	}
	return []Row{
		{Group: group, Name: base + " floor kernel", Value: floor, Unit: "us",
			Note: fmt.Sprintf("minimal Dormand-Prince on 6-element arrays, same tolerances, restarts and projection, no peak search: %d steps (core %d); median of %d", f.steps, steps, repeat)},
		{Group: group, Name: base + " core / floor", Value: core / floor, Unit: "x",
			Note: fmt.Sprintf("core figures only %.0f us (specialised path) over the floor, same run; target at most 2x: %s", core, verdict)},
		{Group: group, Name: base + " general / floor", Value: general / floor, Unit: "x",
			Note: fmt.Sprintf("general path figures only %.0f us (sway.Options.General), same run", general)},
	}, nil
}
