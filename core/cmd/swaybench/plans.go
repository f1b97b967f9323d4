package main

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"runtime"
	"sort"
	"strings"
	"time"

	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// planRows times, for each planning example in dir (plan-*.json), the
// parts of the page's "plan" call as the bridge (wasm/bridge) runs them:
// reading the scenario (JSON decode and validation, scenario.Parse), its
// fingerprint (the bridge's memo key), plan.Make and the reply's JSON.
// Inside plan.Make it times again, one by one, the simulations the plan
// kept (each simulated option at each checked rope length, at the
// planner's tolerance, and the recommended one at the check tolerance),
// so the plan's time splits into those simulations and the rest (the
// ramp and peak searches' own simulations, linear theory, curves,
// sentences). Medians of repeat plans; the processor time where the
// system gives it (natively), which a loaded machine changes less.
func planRows(dir string, repeat int, group string) ([]Row, error) {
	files, err := filepath.Glob(filepath.Join(dir, "plan-*.json"))
	if err != nil {
		return nil, err
	}
	sort.Strings(files)
	datas := make([][]byte, len(files))
	for i, name := range files {
		if datas[i], err = os.ReadFile(name); err != nil {
			return nil, err
		}
	}
	// Every example is planned a few times before any is timed: under
	// node the wasm's functions are compiled again, optimised, only once
	// they have run a while, so the first example timed would carry that
	// (the bay-travel row read 2 to 4 times its steady time, all in "the
	// rest of the plan" and the reply's JSON).
	for range 3 {
		for _, data := range datas {
			if s, err := scenario.Parse(data); err == nil {
				if r, err := plan.Make(s); err == nil {
					json.Marshal(r)
				}
			}
		}
	}
	var rows []Row
	for i, name := range files {
		data := datas[i]
		base := strings.TrimSuffix(filepath.Base(name), ".json")
		r, err := planParts(data, repeat)
		if err != nil {
			return nil, fmt.Errorf("%s: %w", name, err)
		}
		rows = append(rows, Row{Group: group, Name: base, Value: r.total, Unit: "ms", Note: r.note(repeat)})
	}
	return rows, nil
}

type planTimes struct {
	total, parse, key, make, encode, cpu float64 // ms, medians (cpu: mean)
	sims, kept, checks                   int     // simulations in all; timed again: at RelTol, at CheckRelTol
	keptMs, checkMs                      float64 // the kept and recommended simulations timed again, ms in all
	steps                                int     // integrator steps of the simulations timed again
	replyBytes                           int
	allocMB, mallocs, gcs                float64 // per plan call: heap allocated, allocations, collections
}

func (p planTimes) note(repeat int) string {
	s := fmt.Sprintf("parse+validate %.2f, fingerprint %.2f, plan %.2f, reply JSON %.2f ms (%d kB); %d simulations: %d of the options kept at tol %g take %.2f ms, %d of the recommended one at %g take %.2f ms (%d steps in all; each the fastest of 3 timed again), the rest of the plan %.2f ms; median of %d",
		p.parse, p.key, p.make, p.encode, p.replyBytes/1000, p.sims, p.kept, plan.RelTol, p.keptMs, p.checks, plan.CheckRelTol, p.checkMs, p.steps,
		p.make-p.keptMs-p.checkMs, repeat)
	s += fmt.Sprintf("; per plan call %.2f MB allocated in %.0f allocations, %.2f collections", p.allocMB, p.mallocs, p.gcs)
	if p.cpu > 0 {
		s += fmt.Sprintf("; processor time %.2f ms a plan", p.cpu)
	}
	return s
}

func planParts(data []byte, repeat int) (planTimes, error) {
	var p planTimes
	var parse, key, mk, enc, total []float64
	var last *plan.Result
	var lastS *scenario.Scenario
	c0 := processCPU()
	var m0, m1 runtime.MemStats
	for i := range repeat + 2 {
		t0 := time.Now()
		s, err := scenario.Parse(data)
		if err != nil {
			return p, err
		}
		t1 := time.Now()
		c := *s
		c.Sheet = nil
		if _, err := scenario.Fingerprint(&c); err != nil {
			return p, err
		}
		t2 := time.Now()
		r, err := plan.Make(s)
		if err != nil {
			return p, err
		}
		t3 := time.Now()
		b, err := json.Marshal(struct {
			Result any `json:"result"`
		}{r})
		if err != nil {
			return p, err
		}
		t4 := time.Now()
		if i == 1 {
			c0 = processCPU() // the first two warm up
			runtime.ReadMemStats(&m0)
		}
		if i < 2 {
			continue
		}
		ms := func(a, b time.Time) float64 { return float64(b.Sub(a).Nanoseconds()) / 1e6 }
		parse, key, mk, enc, total = append(parse, ms(t0, t1)), append(key, ms(t1, t2)), append(mk, ms(t2, t3)),
			append(enc, ms(t3, t4)), append(total, ms(t0, t4))
		last, lastS, p.replyBytes = r, s, len(b)
	}
	if c := processCPU(); c > 0 {
		p.cpu = (c - c0) * 1e3 / float64(repeat)
	}
	runtime.ReadMemStats(&m1)
	n := float64(repeat)
	p.allocMB, p.mallocs = float64(m1.TotalAlloc-m0.TotalAlloc)/1e6/n, float64(m1.Mallocs-m0.Mallocs)/n
	p.gcs = float64(m1.NumGC-m0.NumGC) / n
	p.parse, p.key, p.make, p.encode, p.total = Median(parse), Median(key), Median(mk), Median(enc), Median(total)
	p.sims = last.Simulations
	// The simulations the plan kept, timed again one by one.
	for i, o := range last.Options {
		if len(o.Verified) == 0 || o.Timing != nil {
			continue // screened, or a pendant's drawn timings (not in the result)
		}
		tol := plan.RelTol
		if i == last.Recommended {
			tol = plan.CheckRelTol
		}
		for _, rope := range last.CheckedRopeLengthsM {
			d, steps := math.Inf(1), 0
			for range 3 { // the fastest of 3: one run alone is at the mercy of the machine
				t0 := time.Now()
				n, err := simulateOnce(lastS, o.Motion, rope, tol)
				if err != nil {
					return p, err
				}
				d, steps = math.Min(d, float64(time.Since(t0).Nanoseconds())/1e6), n
			}
			p.steps += steps
			if i == last.Recommended {
				p.checks++
				p.checkMs += d
			} else {
				p.kept++
				p.keptMs += d
			}
		}
	}
	return p, nil
}

// simulateOnce runs one move at one rope length as the planner does
// (core/plan verify.go simulate) and returns the integrator's steps.
func simulateOnce(s *scenario.Scenario, m scenario.Motion, rope, tol float64) (int, error) {
	sc := *s
	sc.Plan = nil
	sc.Motions = []scenario.Motion{m}
	sc.Load.RopeLengthM = &rope
	sc.Settings = &scenario.Settings{RelTol: tol, SettlePeriods: 2}
	r, err := sway.EvaluateWith(&sc, sway.Options{NoHistory: true, NoModePeriods: true})
	if err != nil {
		return 0, err
	}
	return r.Solver.Steps, nil
}
