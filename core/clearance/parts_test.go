package clearance

import (
	"encoding/json"
	"reflect"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
)

func TestPartsJoinToTheSingleCall(t *testing.T) {
	// The runs split into parts (unequal, joined out of order, each part
	// sent through JSON as between the page's workers) give the report of
	// one call over the same runs, exactly: the check is reproducible from
	// the seed and each run's index alone.
	s := testscenario.Example(t, "site-bay-columns")
	s.Site.Spread.Runs = 40
	one, err := Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var parts []Part
	for _, r := range [][2]int{{25, 40}, {0, 7}, {7, 25}} {
		p, err := CheckPart(s, r[0], r[1], Options{Workers: 1})
		if err != nil {
			t.Fatal(err)
		}
		data, err := json.Marshal(p)
		if err != nil {
			t.Fatal(err)
		}
		var back Part
		if err := json.Unmarshal(data, &back); err != nil {
			t.Fatal(err)
		}
		parts = append(parts, back)
	}
	joined, err := CheckJoin(s, parts, Options{})
	if err != nil {
		t.Fatal(err)
	}
	a, _ := json.Marshal(one)
	b, _ := json.Marshal(joined)
	if string(a) != string(b) {
		t.Error("joined parts differ from the single call")
	}
	if !reflect.DeepEqual(one.Envelope95, joined.Envelope95) || len(one.Envelope95.Spans) == 0 {
		t.Error("95 % envelope differs or is empty")
	}
	// Some of the runs: a report over those runs.
	some, err := CheckJoin(s, parts[1:2], Options{})
	if err != nil || some.Runs != 7 {
		t.Fatalf("part of the runs: %v", err)
	}
	// Overlapping or foreign parts are refused.
	if _, err := CheckJoin(s, []Part{parts[1], parts[1]}, Options{}); err == nil {
		t.Error("overlapping parts joined")
	}
	if _, err := CheckPart(s, 30, 41, Options{}); err == nil {
		t.Error("runs past the check's own accepted")
	}
}

func TestEnvelopeCellsAreTheLattice(t *testing.T) {
	// A run swept onto a grid of its own marks the cells it marks on a
	// shared grid (the lattice does not move with the grid).
	pts := []Point2{{0.03, 0.01}, {3.37, 1.12}, {5.9, -0.4}}
	r := PlanPath{Points: pts, RadiusM: 0.7}
	lone := PlanPath{Points: []Point2{{-20, 9}}, RadiusM: 0.1}
	e, err := NewEnvelope([]PlanPath{r, lone}, pts, 1, 0.1)
	if err != nil {
		t.Fatal(err)
	}
	cells, _ := decodeCells(runCells(&r, 0.1))
	far, _ := decodeCells(runCells(&lone, 0.1))
	out, err := unionSpans(append(cells, far...), 0.1)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(out.Spans, e.Spans()) || out.AreaM2 != e.AreaM2() {
		t.Errorf("own grid: %d spans, %g m²; shared: %d spans, %g m²", len(out.Spans), out.AreaM2, len(e.Spans()), e.AreaM2())
	}
}

func TestPartsJoinRigidLoad(t *testing.T) {
	// A rigid load's box: its outlines swept onto the lattice, its lowest
	// corner in the section; parts joined as one call.
	s := rigidBesideStack(t, scenario.SiteSpread{Runs: 6, Seed: 3, RopeLengthM: 0.2})
	one, joined := singleAndJoined(t, s, [][2]int{{4, 6}, {0, 4}})
	a, _ := json.Marshal(one)
	b, _ := json.Marshal(joined)
	if one.Outline != OutlineBox || string(a) != string(b) {
		t.Errorf("rigid load: outline %q; joined parts equal the single call: %v", one.Outline, string(a) == string(b))
	}
}

// TestPartsCarryTheFirstStrikingLine: a part's runs carry the line of
// the hoisting gear that struck first, so the joined report names it as
// the single call does (the rope example, struck first by its hoist rope).
func TestPartsCarryTheFirstStrikingLine(t *testing.T) {
	s := testscenario.Example(t, "site-tower-rope-mast")
	s.Site.Spread.Runs = 4
	one, joined := singleAndJoined(t, s, [][2]int{{1, 4}, {0, 1}})
	a, _ := json.Marshal(one)
	b, _ := json.Marshal(joined)
	if o := joined.Obstacles[0]; o.FirstStrikeLine != "hoist rope" || string(a) != string(b) {
		t.Errorf("first struck by %q %q; joined parts equal the single call: %v", o.FirstStrikeBy, o.FirstStrikeLine, string(a) == string(b))
	}
}

// TestDrawnRopeOutsideThePlanRange: a drawn rope length outside the plan
// block's rope range is a run like any other (the range is what the
// planner tries); before, run 7 of this check failed its validation with
// a 5.91 m rope against the plan's 4.5 to 5.5 m.
func TestDrawnRopeOutsideThePlanRange(t *testing.T) {
	s := rigidBesideStack(t, scenario.SiteSpread{Runs: 20, Seed: 1, RopeLengthM: 0.5})
	if s.Plan == nil {
		t.Fatal("the example has no plan block; the test needs one")
	}
	rep, err := Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Runs != 20 {
		t.Errorf("%d runs", rep.Runs)
	}
}

// rigidBesideStack is the bay girder as a rigid load with a site of one
// stack beside its path (invented) and the spreads sp.
func rigidBesideStack(t *testing.T, sp scenario.SiteSpread) *scenario.Scenario {
	t.Helper()
	s := testscenario.Example(t, "bay-girder-rigid")
	h, r := 12.0, 0.0
	top := 3.0
	s.Site = &scenario.Site{SuspensionHeightM: &h, LoadRadiusM: &r, MarginM: 0.3,
		Obstacles: []scenario.SiteObstacle{{Name: "stack", TopM: &top,
			Box: &scenario.SiteBox{CentreXM: 6, CentreYM: 3, LengthM: ptr(2), WidthM: ptr(1)}}},
		Spread: &sp}
	return s
}

// singleAndJoined checks s in one call and in parts of the given run
// ranges (first, last+1) joined, for tests that hold the two equal.
func singleAndJoined(t *testing.T, s *scenario.Scenario, ranges [][2]int) (one, joined *Report) {
	t.Helper()
	one, err := Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var parts []Part
	for _, rg := range ranges {
		p, err := CheckPart(s, rg[0], rg[1], Options{})
		if err != nil {
			t.Fatal(err)
		}
		parts = append(parts, *p)
	}
	joined, err = CheckJoin(s, parts, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return one, joined
}
