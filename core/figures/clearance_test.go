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

// TestClearanceRowsHaveTheRope: each obstacle's rows give the rope's
// clearance after the load's, name the line that comes closest, and keep
// the engineers' figures last.
func TestClearanceRowsHaveTheRope(t *testing.T) {
	s := testscenario.Example(t, "site-tower-hoarding")
	s.Site.Spread.Runs = 10
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	p := PresentClearance(rep, units.Choice{})
	o := p.Obstacles[0]
	if o.RopePart != "hoist rope" {
		t.Errorf("rope part %q", o.RopePart)
	}
	at := map[string]int{}
	for i, r := range o.Rows {
		at[r.Key] = i
	}
	for _, k := range []string{"share_keep_margin", "smallest_m", "rope.smallest_m", "rope.smallest_at_height_m", "error_bound_m"} {
		if _, ok := at[k]; !ok {
			t.Fatalf("no row %s: %+v", k, o.Rows)
		}
	}
	if !(at["share_keep_margin"] < at["smallest_m"] && at["smallest_m"] < at["rope.smallest_m"] && at["rope.smallest_m"] < at["error_bound_m"]) || !o.Rows[len(o.Rows)-1].Detail {
		t.Errorf("order %v", at)
	}
	if r := o.Rows[at["rope.smallest_m"]]; r.Crew != "closest the rope comes" || r.ValueSI != rep.Obstacles[0].Rope.SmallestM {
		t.Errorf("rope row %+v", r)
	}
}

// TestObstacleVerdictsWorstFirst: each obstacle's verdict is the check's
// own rule (clearance.VerdictSentences names exactly the obstacles that
// do not keep the margin), said in the units shown, and the obstacles are
// listed worst first (the planner's worst one leads).
func TestObstacleVerdictsWorstFirst(t *testing.T) {
	s := testscenario.Example(t, "site-bay-columns")
	s.Site.Spread.Runs = 30
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	p := PresentClearance(rep, units.Choice{System: "us"})
	_, said := clearance.Verdict(rep.Obstacles, rep.MarginM)
	verdicts := strings.Join(said, " ")
	if len(p.WorstFirst) != len(rep.Obstacles) {
		t.Fatalf("worst_first %v", p.WorstFirst)
	}
	for k, i := range p.WorstFirst {
		o, rows := rep.Obstacles[i], p.Obstacles[i]
		// The check's words name an obstacle that is not kept, or that is
		// kept but struck in a few runs.
		if rows.Keeps != (o.ShareKeepMargin >= clearance.Required) || (rows.Keeps && o.Strikes == 0) == strings.Contains(verdicts, o.Name+":") {
			t.Errorf("%s: keeps %v, the check's words %q", o.Name, rows.Keeps, verdicts)
		}
		if !strings.Contains(rows.Verdict, "ft") || !strings.Contains(rows.Verdict, "95 %") {
			t.Errorf("%s: verdict %q not in the units shown", o.Name, rows.Verdict)
		}
		if o.Strikes > 0 && !strings.Contains(rows.Verdict, "struck in") {
			t.Errorf("%s: struck %d times, verdict %q", o.Name, o.Strikes, rows.Verdict)
		}
		if k > 0 {
			prev := rep.Obstacles[p.WorstFirst[k-1]]
			if prev.ShareKeepMargin > o.ShareKeepMargin || (prev.ShareKeepMargin == o.ShareKeepMargin && prev.SmallestM > o.SmallestM) {
				t.Errorf("%s listed after %s", o.Name, prev.Name)
			}
		}
	}
	if p.Obstacles[p.WorstFirst[0]].Keeps {
		t.Errorf("the bay example's worst obstacle keeps the margin: %+v", p.Obstacles[p.WorstFirst[0]])
	}
	t.Log(p.Obstacles[p.WorstFirst[0]].Verdict)
}

// A tower struck by the rope alone (the example site-tower-rope-mast):
// the obstacle's verdict says it is struck, by its rope, and names the
// line, and the line that struck first (the rows say when); the strike
// rows are the obstacle's, the rope's own beside them.
func TestObstacleVerdictRopeStrike(t *testing.T) {
	s := testscenario.Example(t, "site-tower-rope-mast")
	s.Site.Spread.Runs = 20
	rep, err := clearance.Check(s, clearance.Options{})
	if err != nil {
		t.Fatal(err)
	}
	p := PresentClearance(rep, units.Choice{System: "si"})
	o := p.Obstacles[0]
	if o.Keeps || !strings.Contains(o.Verdict, "; struck in") || !strings.Contains(o.Verdict, "by its rope (the hoist rope deepest), first by the hoist rope") || o.RopePart != "hoist rope" {
		t.Errorf("verdict %q, rope part %q", o.Verdict, o.RopePart)
	}
	keys := map[string]bool{}
	for _, r := range o.Rows {
		keys[r.Key] = true
	}
	for _, k := range []string{"share_strike", "first_strike_s", "first_strike_at_distance_m", "rope.first_strike_s", "rope.first_strike_at_height_m"} {
		if !keys[k] {
			t.Errorf("no row %s", k)
		}
	}
}
