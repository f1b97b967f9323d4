package plan

import (
	"encoding/json"
	"errors"
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
