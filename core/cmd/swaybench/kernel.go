package main

import (
	"fmt"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"time"

	"swaysheet/core/draws"
	"swaysheet/core/sway"
)

// floorRows times the floor kernel (floor.go) and the core's figures-only
// evaluation of a travel scenario, interleaved in the same run so that
// the load of a shared machine falls on both alike, and reports their
// ratio against the target of at most 2x.
func floorRows(file string, repeat int, group string) ([]Row, error) {
	s, err := readScenario(file)
	if err != nil {
		return nil, err
	}
	f, ok := newFloorRun(s)
	if !ok {
		return nil, fmt.Errorf("%s: the floor kernel takes travel moves with trapezoids only", file)
	}
	var steps int
	// As the page's bridge evaluates a scenario it has parsed (and so
	// validated): figures only, not validated again.
	opts := []sway.Options{{NoHistory: true, Validated: true}, {NoHistory: true, Validated: true, General: true}}
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
	return []Row{
		{Group: group, Name: base + " floor kernel", Value: floor, Unit: "us",
			Note: fmt.Sprintf("minimal Dormand-Prince on 6-element arrays, same tolerances, restarts and projection, no peak search: %d steps (core %d); median of %d", f.steps, steps, repeat)},
		{Group: group, Name: base + " core / floor", Value: core / floor, Unit: "x",
			Note: fmt.Sprintf("core figures only %.0f us (specialised path) over the floor, same run; target at most 2x: %s", core, verdict(core <= 2*floor))},
		{Group: group, Name: base + " general / floor", Value: general / floor, Unit: "x",
			Note: fmt.Sprintf("general path figures only %.0f us (sway.Options.General), same run", general)},
	}, nil
}

// drawsRows times 1,000 draws of a scenario (core/draws) on one goroutine
// and on all processors, against the target of 1,000 runs in at most a
// second natively. The load of a shared machine shows in the processor
// time next to the wall time.
func drawsRows(file string, group string) ([]Row, error) {
	s, err := readScenario(file)
	if err != nil {
		return nil, err
	}
	req := draws.Request{Runs: 1000, Seed: 1, Spread: draws.Spread{RopeLengthM: 0.3, CentreDepthM: 0.1, PressS: 0.2, GustPct: 20, GustS: 1}}
	base := strings.TrimSuffix(filepath.Base(file), ".json")
	var rows []Row
	var one float64
	for _, workers := range []int{1, runtime.NumCPU()} {
		if workers == 1 && len(rows) > 0 {
			continue
		}
		if _, err := draws.Run(s, draws.Request{Runs: 20, Seed: 1, Spread: req.Spread}, workers); err != nil { // warm up
			return nil, err
		}
		ts := make([]float64, 3)
		cpu0 := processCPU()
		for k := range ts {
			start := time.Now()
			if _, err := draws.Run(s, req, workers); err != nil {
				return nil, err
			}
			ts[k] = time.Since(start).Seconds()
		}
		cpu := (processCPU() - cpu0) / float64(len(ts))
		wall := Median(ts)
		note := loadNote() + "1,000 draws (rope ±0.3 m, centre depth ±0.1 m, presses ±0.2 s, gust ±20 % and ±1 s, standard deviations), percentiles of 4 figures; median of 3; "
		if runtime.GOOS == "js" {
			// One thread: the page shares the runs out over its workers
			// (the page row, web/browsertest benchDraws).
			note += "one thread, for the page's row (split over its workers)"
		} else {
			note += "target at most 1 s: " + verdict(wall <= 1)
		}
		if cpu > 0 {
			// On a shared machine the wall time says how much of the
			// processors the run got; the processor time what it needed.
			note += fmt.Sprintf("; %.2f s of processor time a run", cpu)
		}
		if workers == 1 {
			one = wall
		} else {
			note += fmt.Sprintf("; %.2fx the speed of one goroutine", one/wall)
		}
		rows = append(rows, Row{Group: group, Name: fmt.Sprintf("%s x1000, %d goroutine(s)", base, workers), Value: wall, Unit: "s", Note: note})
	}
	return rows, nil
}

// loadNote is the machine's load average when it can be read (Linux), for
// timings of several cores on a shared machine.
func loadNote() string {
	data, err := os.ReadFile("/proc/loadavg")
	if err != nil {
		return ""
	}
	f := strings.Fields(string(data))
	if len(f) == 0 {
		return ""
	}
	return "load average " + f[0] + " at the time; "
}
