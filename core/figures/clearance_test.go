package figures

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"swaysheet/core/clearance"
	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// TestClearanceRowsAreTheReportsFields: every row's key is the JSON path
// of its value in the report (or the obstacle's report), and lengths are
// shown in the units chosen.
func TestClearanceRowsAreTheReportsFields(t *testing.T) {
	s := testscenario.Example(t, "site-tower-hoarding")
	s.Site.Spread.Runs = 20
	one := 1.0
	s.Site.Spread.EmergencyStop = &scenario.EmergencyStop{ReactionS: &one}
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	data, _ := json.Marshal(rep)
	var doc map[string]any
	json.Unmarshal(data, &doc)
	get := func(m map[string]any, path string) (float64, bool) {
		var v any = m
		for _, p := range strings.Split(path, ".") {
			mm, ok := v.(map[string]any)
			if !ok {
				return 0, false
			}
			v = mm[p]
		}
		f, ok := v.(float64)
		return f, ok
	}
	p := PresentClearance(rep, units.Choice{System: "us"})
	if len(p.Rows) < 6 || len(p.Obstacles) != 1 || len(p.Obstacles[0].Rows) < 8 {
		t.Fatalf("rows %+v", p)
	}
	for _, r := range p.Rows {
		v, ok := get(doc, r.Key)
		if r.Key == "spread.gust_pct" {
			v /= 100
		}
		if !ok || math.Abs(v-r.ValueSI) > 1e-12 {
			t.Errorf("%s: report %g (%v), row %g", r.Key, v, ok, r.ValueSI)
		}
	}
	obs := doc["obstacles"].([]any)[0].(map[string]any)
	for _, r := range p.Obstacles[0].Rows {
		if v, ok := get(obs, r.Key); !ok || math.Abs(v-r.ValueSI) > 1e-12 {
			t.Errorf("%s: report %g (%v), row %g", r.Key, v, ok, r.ValueSI)
		}
		if r.UnitSI == "m" && r.Unit != "ft" {
			t.Errorf("%s shown in %q, want ft", r.Key, r.Unit)
		}
	}
}
