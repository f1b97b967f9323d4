package clearance

import (
	"math"
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
	// speed keeps the margin, as does every slower grid speed.
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
	if ts := sp.TopSpeed; ts == nil || !ts.Clears || ts.Speed != 0.5 || ts.Above != 0 || ts.Unit != "m/s" ||
		len(ts.Tested) != speedGrid || ts.Checks != speedGrid-1 || ts.Tested[0].Speed != 0.05 {
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
	if ts := sp.TopSpeed; ts == nil || ts.Clears || ts.Above != 0.05 || ts.Checks != speedGrid-1 {
		t.Errorf("top speed %+v", sp.TopSpeed)
	}
	if !strings.Contains(sp.Words[0], "No option") {
		t.Errorf("words %q", sp.Words)
	}
}

func TestPlanSiteTopSpeedBisection(t *testing.T) {
	// A wall across the path 0.6 m past the end of the move, and an
	// emergency stop at a random moment (1 s reaction): the faster the
	// move, the further the load runs past the end. The search brackets
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
	if ts == nil || !ts.Clears || !(ts.Above > ts.Speed) || ts.Checks < speedGrid-1 || ts.Checks > speedGrid+bisections {
		t.Fatalf("top speed %+v; words %q", ts, sp.Words)
	}
	checkTested(t, ts)
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

// checkTested: every speed tested at or below the answer keeps the
// margin, the one above it (Above) does not, and they are in order.
func checkTested(t *testing.T, ts *TopSpeed) {
	t.Helper()
	for i, v := range ts.Tested {
		if i > 0 && v.Speed < ts.Tested[i-1].Speed {
			t.Errorf("tested out of order: %+v", ts.Tested)
		}
		if v.Speed <= ts.Speed && !v.Clears {
			t.Errorf("%g does not clear, below the answer %g", v.Speed, ts.Speed)
		}
		if v.Speed == ts.Above && v.Clears {
			t.Errorf("above %g clears", v.Speed)
		}
	}
}

// TestPlanSiteTopSpeedNotMonotonic: a case where a slower top speed
// swings more. The bay-travel load (8.5 m rope: sway period
// T = 2*pi*sqrt(8.5/9.80665) = 5.85 s) is carried 18 m at 0.3 m/s^2 to a
// wall just past the end, with a top speed of 1.75 m/s: the ramps to and
// from it last t_a = 1.75/0.3 = 5.83 s, about one period, and in linear
// theory a ramp leaves a swing of 2(a/g)|sin(pi*t_a/T)| (any mechanics
// text): about none, so the load stops at the end. At 0.96 m/s (the
// grid's middle) the ramps last 3.2 s, 0.55 T, and each leaves
// 2(0.3/9.81)*0.99 = 0.061 rad, 0.52 m at the load: it swings into the
// wall's margin. A bisection that took slower to swing no more would
// stop at the plan's top speed, which clears; the search finds the
// failure below it, answers below that, and names 1.75 m/s as clearing
// again (not advised).
func TestPlanSiteTopSpeedNotMonotonic(t *testing.T) {
	s := testscenario.Example(t, "plan-bay-travel")
	top := 1.75
	s.Plan.TopSpeedMPerS = &top
	h, r := 12.0, 0.5
	// The wall's face 0.45 m past the margin around the load at rest at
	// the end: 18 + 0.5 + 0.3 + 0.45 = 19.25 m.
	s.Site = &scenario.Site{SuspensionHeightM: &h, LoadRadiusM: &r, MarginM: 0.3,
		Obstacles: []scenario.SiteObstacle{box("end wall", 19.35, 0, 0.2, 6, 11)}}
	res, err := plan.Make(s)
	if err != nil {
		t.Fatal(err)
	}
	sp, err := PlanSite(s, res, Options{})
	if err != nil {
		t.Fatal(err)
	}
	ts := sp.TopSpeed
	if ts == nil || len(ts.Tested) < speedGrid {
		t.Fatalf("top speed %+v", ts)
	}
	t.Logf("top speed %+v; words %q", ts, sp.Words)
	var middle, fastest SpeedTried
	for _, v := range ts.Tested {
		if math.Abs(v.Speed-0.9625) < 1e-9 {
			middle = v
		}
		if v.Speed == top {
			fastest = v
		}
	}
	if !fastest.Clears || middle.Speed == 0 || middle.Clears {
		t.Fatalf("want 1.75 m/s clearing and 0.9625 m/s not: %+v", ts.Tested)
	}
	if !ts.Clears || ts.Speed >= middle.Speed || ts.Above > middle.Speed || len(ts.FasterClears) == 0 || ts.FasterClears[len(ts.FasterClears)-1] != top {
		t.Errorf("top speed %+v", ts)
	}
	checkTested(t, ts)
	if w := strings.Join(sp.Words, " "); !strings.Contains(w, "keep it again") || !strings.Contains(w, "every slower one tested keeping it too") {
		t.Errorf("words %q", sp.Words)
	}
}
