package clearance

import (
	"math"
	"strings"
	"testing"
)

// straightRun is a run along x from 0 to 20 m at 1 m/s, the load hanging
// 6 m below the suspension point and offset sideways by y.
func straightRun(y float64) Run {
	var r Run
	for i := 0; i <= 40; i++ {
		t := float64(i) * 0.5
		r.TimeS = append(r.TimeS, t)
		r.SuspensionXM = append(r.SuspensionXM, t)
		r.SuspensionYM = append(r.SuspensionYM, 0)
		r.RelXM = append(r.RelXM, 0)
		r.RelYM = append(r.RelYM, y)
		r.RelZM = append(r.RelZM, -6)
		r.RopeM = append(r.RopeM, 6)
		r.SwingDeg = append(r.SwingDeg, 0)
	}
	return r
}

func TestSiteCheckCountsRunsByHand(t *testing.T) {
	// A 0.4 m column at (10, 2), 6 m high: its near face is at y = 1.8.
	// The load (a ball of 0.5 m) passes at 4 m above the floor (10 - 6),
	// below the column's top, offset by y = 0.05, 0.15, ..., 0.95: its
	// clearance is 1.8 - y - 0.5 = 1.3 - y, from 1.25 m down to 0.35 m.
	// With a 0.5 m margin the runs with y up to 0.75 keep it: 8 of 10.
	site := Site{
		SuspensionHeightM: 10,
		Obstacles:         []Obstacle{{Name: "column B4", Outline: Rectangle(10, 2, 0.4, 0.4, 0), TopM: 6}},
		MarginM:           0.5,
		LoadRadiusM:       0.5,
	}
	var runs []Run
	for i := 0; i < 10; i++ {
		runs = append(runs, straightRun(0.05+0.1*float64(i)))
	}
	reps, err := site.Check(runs, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	r := reps[0]
	if r.KeepMargin != 8 || r.Strikes != 0 {
		t.Errorf("keep %d, strikes %d; want 8 and 0", r.KeepMargin, r.Strikes)
	}
	// The 5th percentile by nearest rank of 10 values is the smallest:
	// 1.3 - 0.95 = 0.35 m, first reached where the load comes level with
	// the face's near corner, x = 9.8 m, at 9.8 s.
	if math.Abs(r.ClearanceP5M-0.35) > 1e-9 || math.Abs(r.SmallestM-0.35) > 1e-9 {
		t.Errorf("p5 %g, smallest %g; want 0.35", r.ClearanceP5M, r.SmallestM)
	}
	if math.Abs(r.SmallestAtS-9.8) > 0.05+1e-9 {
		t.Errorf("smallest at %g s, want 9.8 s", r.SmallestAtS)
	}
	ok, words := Verdict(reps, site.MarginM)
	if ok || !strings.Contains(words[0], "column B4") || !strings.Contains(words[0], "8 of 10 runs") {
		t.Errorf("verdict %v %q", ok, words)
	}

	// Raised 3 m (the load at 7 m, over the 6 m column) every run clears
	// it by more than the margin: the closest is straight above, 1 m less
	// the radius, for the run at y = 1.95.
	site.SuspensionHeightM = 13
	reps, _ = site.Check(runs, 0.05)
	if ok, _ := Verdict(reps, site.MarginM); !ok || reps[0].KeepMargin != 10 {
		t.Errorf("over the column: %+v", reps[0])
	}

	// Moved onto the path, every run strikes the column, from the moment
	// the load's edge reaches its face: x = 9.8 - 0.5, 9.3 s for the runs
	// whose centre line meets the face (the points checked are 0.05 m
	// apart, so the first overlap is seen by 9.35 s).
	site.SuspensionHeightM = 10
	site.Obstacles[0].Outline = Rectangle(10, 0.5, 0.4, 0.4, 0)
	reps, _ = site.Check(runs, 0.05)
	if reps[0].Strikes != 10 || reps[0].KeepMargin != 0 || reps[0].FirstStrikeS > 9.35+1e-9 || reps[0].FirstStrikeS < 9.3-1e-9 {
		t.Errorf("on the path: %+v", reps[0])
	}
}

func TestSiteCheckRejectsBadObstacles(t *testing.T) {
	site := Site{Obstacles: []Obstacle{{Name: "stack", Outline: []Point2{{0, 0}, {1, 1}}, TopM: 2}}}
	if _, err := site.Check([]Run{straightRun(0)}, 0.05); err == nil || !strings.Contains(err.Error(), "obstacle 1 (stack)") {
		t.Errorf("error %v", err)
	}
}
