package plan

import (
	"encoding/json"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// FuzzPlan decodes arbitrary bytes as a scenario and plans every one that
// decodes with a plan block. Planning must never panic and always end; it
// returns either an error with a message (a field error naming its field,
// or the spent work budget) or a result that encodes as JSON (so no NaN or
// infinity anywhere) whose recommended index points at an option.
//
// Seeds: the plan-*.json examples and the plans at the smallest accepted
// values of TestPlanAtTheBounds. Each plan draws on a budget of 5e6 work
// units (about 65 ms) instead of Work, so that the fuzzer runs many.
func FuzzPlan(f *testing.F) {
	files, _ := filepath.Glob("../../testdata/scenarios/plan-*.json")
	for _, name := range files {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	f.Add([]byte(slewPlan("0.01", "0.01", "0.01", "0.1", "0.01", "")))
	f.Add([]byte(slewPlan("0.01", "36", "30", "150", "0.01", `, "pendant_steps_pct": [1, 2, 3, 4, 100]`)))
	f.Fuzz(func(t *testing.T, data []byte) {
		s, err := scenario.Parse(data)
		if err != nil || s.Plan == nil {
			return // FuzzParse checks the messages
		}
		res, err := makeWith(s, sway.NewBudget(5e6, budgetMessage))
		if err != nil {
			var es scenario.Errors
			switch {
			case errors.As(err, &es):
				for _, e := range es {
					if e.Field == "" || e.Message == "" {
						t.Fatalf("field error without field or message: %+v", e)
					}
				}
			case errors.Is(err, sway.ErrWorkLimit):
			default:
				t.Fatalf("an error that names no field: %v", err)
			}
			return
		}
		if _, err := json.Marshal(res); err != nil {
			t.Fatalf("the plan does not encode as JSON (NaN or infinity?): %v", err)
		}
		if res.Recommended >= len(res.Options) {
			t.Fatalf("recommended %d of %d options", res.Recommended, len(res.Options))
		}
	})
}

// FuzzPlanValues plans scenarios built from fuzzed numbers, so that the
// fuzzer explores the accepted ranges themselves (the bytes of FuzzPlan
// rarely decode to a plan). Inputs outside the ranges are rejected by
// Parse and skipped; every accepted one must plan as FuzzPlan requires.
func FuzzPlanValues(f *testing.F) {
	f.Add(false, 12.0, 0.5, 0.3, 8.0, 0.0, 0.0, 2.0, 0.5, 0.0, 0.0, "")
	f.Add(true, 40.0, 0.8, 0.4, 28.0, 26.0, 30.0, 3.0, 0.5, 0.0, 0.0, "pendant")
	f.Add(false, 6.0, 0.4, 0.25, 8.0, 7.5, 8.5, 3.0, 0.5, 400.0, 2.5, "")
	f.Add(true, 0.01, 0.01, 0.01, 0.3, 0.3, 500.0, 0.01, 0.01, 0.1, 0.1, "pendant")
	f.Fuzz(func(t *testing.T, slew bool, dist, v, a, rope, lo, hi, peak, res, hook, rig float64, drive string) {
		move := fmt.Sprintf(`"axis": "travel_x", "distance_m": %g, "top_speed_m_per_s": %g, "max_accel_m_per_s2": %g`, dist, v, a)
		if slew {
			move = fmt.Sprintf(`"axis": "slew", "angle_deg": %g, "top_rate_deg_per_s": %g, "max_accel_deg_per_s2": %g`, dist, v, a)
		}
		if lo != 0 || hi != 0 {
			move += fmt.Sprintf(`, "rope_length_min_m": %g, "rope_length_max_m": %g`, lo, hi)
		}
		if drive != "" {
			move += fmt.Sprintf(`, "drive": %q`, drive)
		}
		load := fmt.Sprintf(`"mass_kg": 2000, "rope_length_m": %g`, rope)
		if hook != 0 {
			load += fmt.Sprintf(`, "hook": {"mass_kg": %g, "rigging_length_m": %g}`, hook, rig)
		}
		data := fmt.Sprintf(`{"format": "swaysheet-scenario", "version": 1, "name": "fuzz", "load": {%s}, "crane": {"radius_m": 20},
		  "motions": [], "limits": {"peak_swing_deg": %g, "residual_swing_deg": %g}, "plan": {%s}}`, load, peak, res, move)
		s, err := scenario.Parse([]byte(data))
		if err != nil {
			return
		}
		r, err := makeWith(s, sway.NewBudget(5e6, budgetMessage))
		if err != nil {
			var es scenario.Errors
			if !errors.As(err, &es) && !errors.Is(err, sway.ErrWorkLimit) {
				t.Fatalf("an error that names no field: %v\n%s", err, data)
			}
			return
		}
		if _, err := json.Marshal(r); err != nil {
			t.Fatalf("the plan does not encode as JSON: %v\n%s", err, data)
		}
	})
}
