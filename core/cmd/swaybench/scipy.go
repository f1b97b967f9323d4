package main

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// refFile is the committed SciPy reference (testdata/reference).
type refFile struct {
	Scenarios []struct {
		Scenario string `json:"scenario"`
		Result   struct {
			Samples []struct {
				TimeS float64 `json:"time_s"`
				RelXM float64 `json:"rel_x_m"`
				RelYM float64 `json:"rel_y_m"`
				RelZM float64 `json:"rel_z_m"`
			} `json:"samples"`
		} `json:"result"`
	} `json:"scenarios"`
}

// scipyRows puts SciPy's DOP853 beside the core at equal accuracy: the
// core's default accuracy is its largest sampled rope-vector error against
// the committed 1e-12 reference; the reference script then finds the
// loosest SciPy tolerance that reaches it and times it. Both are timed in
// this run.
func scipyRows(refPath, python, script string, files []string, repeat int) ([]Row, error) {
	data, err := os.ReadFile(refPath)
	if err != nil {
		return nil, err
	}
	var ref refFile
	if err := json.Unmarshal(data, &ref); err != nil {
		return nil, fmt.Errorf("%s: %w", refPath, err)
	}
	var rows []Row
	for _, file := range files {
		var samples = -1
		for i, sc := range ref.Scenarios {
			if filepath.Clean(sc.Scenario) == filepath.Clean(file) {
				samples = i
			}
		}
		if samples < 0 {
			return nil, fmt.Errorf("%s: not in %s", file, refPath)
		}
		raw, err := os.ReadFile(file)
		if err != nil {
			return nil, err
		}
		s, err := scenario.Parse(raw)
		if err != nil {
			return nil, err
		}
		res, err := sway.Evaluate(s)
		if err != nil {
			return nil, err
		}
		h := res.History
		worst := 0.0
		for _, rs := range ref.Scenarios[samples].Result.Samples {
			i := int(math.Round(rs.TimeS / h.TimeS[1]))
			if i < 0 || i >= len(h.TimeS) {
				continue
			}
			d := math.Sqrt(sq(h.RelXM[i]-rs.RelXM) + sq(h.RelYM[i]-rs.RelYM) + sq(h.RelZM[i]-rs.RelZM))
			worst = math.Max(worst, d)
		}
		target := math.Max(worst, 1e-9)
		// The core's full evaluation as the page makes it: histories and
		// peak search, the parsed scenario not validated again. make bench
		// takes the median of 1,001 (about 0.1 s, as long as SciPy's five
		// runs take): over 51 (5 ms), one burst of the shared host's load
		// once put diagonal-travel at 190 us against 83 in the run before.
		// Each side is timed twice, by turns, and its faster taken: a slow
		// spell of the host can last seconds (on 2026-12-04 the core's
		// median of 1,001 was 153 us in one bench, 110 in its own rows).
		var core float64
		var sp scipyTime
		for round := range 2 {
			c, _, err := timeIt(s, repeat, sway.Options{Validated: true})
			if err != nil {
				return nil, err
			}
			t, err := timeSciPy(python, script, file, target)
			if err != nil {
				return nil, err
			}
			if round == 0 || c < core {
				core = c
			}
			if round == 0 || t.SolveS < sp.SolveS {
				sp = t
			}
		}
		base := strings.TrimSuffix(filepath.Base(file), ".json")
		rows = append(rows,
			Row{Group: "SciPy DOP853 " + sp.SciPyVers, Name: base, Value: sp.SolveS * 1e3, Unit: "ms",
				Note: fmt.Sprintf("integration alone at rtol %.0e (reaches %.2g m; core default %.2g m); with its peak search %.0f ms", sp.Rtol, sp.PosErrM, worst, sp.FullS*1e3)},
			Row{Group: "SciPy DOP853 " + sp.SciPyVers, Name: base + " ratio", Value: sp.SolveS * 1e6 / core, Unit: "x",
				Note: fmt.Sprintf("SciPy integration / core full evaluation (%.0f us, median of %d, same run; each side the faster of two turns); with peak search %.0fx; target at least 300x: %s", core, repeat, sp.FullS*1e6/core, verdict(sp.SolveS*1e6/core >= 300))})
	}
	return rows, nil
}

// scipyTime is what the reference script's time command prints: SciPy's
// medians of five runs, integration alone and with its peak search.
type scipyTime struct {
	Rtol      float64 `json:"rtol"`
	SolveS    float64 `json:"wall_s_solve_median"`
	FullS     float64 `json:"wall_s_full_median"`
	PosErrM   float64 `json:"sample_position_error_m"`
	SciPyVers string  `json:"scipy"`
}

// timeSciPy times SciPy's DOP853 on file at the tolerance that reaches the
// target position error (the reference script's time command).
func timeSciPy(python, script, file string, target float64) (scipyTime, error) {
	var sp scipyTime
	out, err := exec.Command(python, script, "time", file,
		"--target-position-error-m", fmt.Sprint(target), "--repeat", "5").Output()
	if err != nil {
		return sp, fmt.Errorf("%s time %s: %w", script, file, err)
	}
	lines := strings.Split(strings.TrimSpace(string(out)), "\n")
	if err := json.Unmarshal([]byte(lines[len(lines)-1]), &sp); err != nil {
		return sp, fmt.Errorf("%s time %s: %w", script, file, err)
	}
	return sp, nil
}

func sq(x float64) float64 { return x * x }
