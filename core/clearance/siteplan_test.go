package clearance

import (
	"strings"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// plannedBay is the bay-travel plan (18 m along x, 8.5 m rope) with a site
// of one obstacle and the plan made.
func plannedBay(t *testing.T, ob scenario.SiteObstacle, spread *scenario.SiteSpread) (*scenario.Scenario, *plan.Result) {
	t.Helper()
	s := testscenario.Example(t, "plan-bay-travel")
	h, r := 12.0, 0.5
	s.Site = &scenario.Site{SuspensionHeightM: &h, LoadRadiusM: &r, MarginM: 0.3,
		Obstacles: []scenario.SiteObstacle{ob}, Spread: spread}
	res, err := plan.Make(s)
	if err != nil {
		t.Fatal(err)
	}
	return s, res
}

func box(name string, x, y, l, w, top float64) scenario.SiteObstacle {
	return scenario.SiteObstacle{Name: name, TopM: &top, Box: &scenario.SiteBox{CentreXM: x, CentreYM: y, LengthM: &l, WidthM: &w}}
}

func TestPlanSiteFarObstacle(t *testing.T) {
	// A column 10 m off the path: every option clears, so the fastest
	// option is the plan's fastest (checked first), the slower ones are
	// not checked (the recommended one aside), and the plan's own top
	// speed keeps the margin with no further check.
	s, res := plannedBay(t, box("far column", 9, 10, 0.5, 0.5, 8), &scenario.SiteSpread{Runs: 20, Seed: 1, RopeLengthM: 0.2})
	sp, err := PlanSite(s, res, Options{})
	if err != nil {
		t.Fatal(err)
	}
	fastest := 0
	for i, o := range res.Options {
		if o.MoveTimeS < res.Options[fastest].MoveTimeS {
			fastest = i
		}
	}
	if sp.Fastest != fastest || sp.RunsPerCheck != 20 {
		t.Fatalf("fastest %d, want %d; %d runs", sp.Fastest, fastest, sp.RunsPerCheck)
	}
	for i, o := range sp.Options {
		if want := i == fastest || i == res.Recommended; o.Checked != want {
			t.Errorf("option %d (%s): checked %v, skipped %q", i, o.Key, o.Checked, o.Skipped)
		}
	}
	if ts := sp.TopSpeed; ts == nil || !ts.Clears || ts.Speed != 0.5 || ts.Above != 0 || ts.Unit != "m/s" {
		t.Errorf("top speed %+v", sp.TopSpeed)
	}
}

func TestPlanSiteObstacleOnThePath(t *testing.T) {
	// A wall across the path at x = 10 m, 11 m high (the load passes at
	// 12 - 8.5 = 3.5 m): no option and no top speed clears.
	s, res := plannedBay(t, box("wall", 10, 0, 0.2, 6, 11), nil)
	sp, err := PlanSite(s, res, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if sp.Fastest != -1 || sp.RunsPerCheck != 1 {
		t.Errorf("fastest %d with %d runs", sp.Fastest, sp.RunsPerCheck)
	}
	for _, o := range sp.Options {
		if !o.Checked || o.Clears || o.Worst != "wall" {
			t.Errorf("option %s: %+v", o.Key, o)
		}
	}
	if ts := sp.TopSpeed; ts == nil || ts.Clears || ts.Above != 0.05 || ts.Checks != 1 {
		t.Errorf("top speed %+v", sp.TopSpeed)
	}
	if !strings.Contains(sp.Words[0], "No option") {
		t.Errorf("words %q", sp.Words)
	}
}

func TestPlanSiteTopSpeedBisection(t *testing.T) {
	// A wall across the path 0.6 m past the end of the move, and an
	// emergency stop at a random moment (1 s reaction): the faster the
	// move, the further the load runs past the end. The bisection brackets
	// the largest top speed that keeps the margin; both ends of the
	// bracket are checked again here with the same runs.
	one, gapM := 1.0, 0.6
	spread := &scenario.SiteSpread{Runs: 40, Seed: 5, EmergencyStop: &scenario.EmergencyStop{ReactionS: &one}}
	s, res := plannedBay(t, box("end wall", 18+0.5+gapM+0.1, 0, 0.2, 6, 11), spread)
	sp, err := PlanSite(s, res, Options{})
	if err != nil {
		t.Fatal(err)
	}
	ts := sp.TopSpeed
	if ts == nil || !ts.Clears || !(ts.Above > ts.Speed) || ts.Checks != bisections+1 {
		t.Fatalf("top speed %+v; words %q", ts, sp.Words)
	}
	t.Logf("top speed %+v; words %q", ts, sp.Words)
	var base scenario.Motion
	for _, o := range res.Options {
		if o.Key == "drive_limits" {
			base = o.Motion
		}
	}
	for _, c := range []struct {
		v     float64
		clear bool
	}{{ts.Speed, true}, {ts.Above, false}} {
		d := *s
		m := base
		v := c.v
		m.SpeedMPerS = &v
		d.Motions = []scenario.Motion{m}
		n, seed, sp := planRuns(s.Site)
		rep, err := Evaluate(&d, n, seed, drawn(&d, sp, seed), Options{})
		if err != nil {
			t.Fatal(err)
		}
		if rep.Clears != c.clear {
			t.Errorf("at %g m/s: clears %v, want %v", c.v, rep.Clears, c.clear)
		}
	}
}

func TestPlanSiteBudget(t *testing.T) {
	// With almost no work allowed every option is left unchecked, and the
	// message names what to shorten.
	s, res := plannedBay(t, box("far column", 9, 10, 0.5, 0.5, 8), &scenario.SiteSpread{Runs: 20, Seed: 1})
	sp, err := PlanSite(s, res, Options{Budget: sway.NewBudget(1000, planBudgetMessage)})
	if err != nil {
		t.Fatal(err)
	}
	if len(sp.Messages) != 1 || !strings.Contains(sp.Messages[0], "site.spread.runs") || sp.TopSpeed != nil {
		t.Errorf("messages %q, top speed %+v", sp.Messages, sp.TopSpeed)
	}
	for _, o := range sp.Options {
		if o.Checked || o.Skipped != "the work budget ran out" {
			t.Errorf("option %s: %+v", o.Key, o)
		}
	}
}
