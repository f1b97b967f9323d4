package clearance

import (
	"math"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

func bay(t *testing.T) *scenario.Scenario {
	t.Helper()
	s := testscenario.Example(t, "bay-travel")
	h, r, top := 12.0, 0.5, 9.0
	s.Site = &scenario.Site{SuspensionHeightM: &h, LoadRadiusM: &r, MarginM: 0.3,
		Obstacles: []scenario.SiteObstacle{{Name: "column", TopM: &top,
			Box: &scenario.SiteBox{CentreXM: 10, CentreYM: 2, LengthM: ptr(0.4), WidthM: ptr(0.4)}}}}
	return s
}

func ptr(v float64) *float64 { return &v }

func TestNoSpreadEnvelopeIsTheRun(t *testing.T) {
	// With every spread at zero every run is the nominal one: the 50 % and
	// 95 % envelopes are that run's swept area, exactly (the same cells).
	s := bay(t)
	rep, err := Evaluate(s, 5, 0, nil, Options{})
	if err != nil {
		t.Fatal(err)
	}
	res, _ := sway.Evaluate(s)
	run := RunOf(res)
	var pts []Point2
	for _, p := range run.Path(12) {
		pts = append(pts, p.At.Plan())
	}
	one, _ := NewEnvelope([]PlanPath{{Points: pts, RadiusM: 0.5}}, pts, 1, 0.1)
	for _, e := range []EnvelopeOut{rep.Envelope50, rep.Envelope95} {
		if e.StrayM != 0 || e.AreaM2 != one.AreaM2() || len(e.Spans) != len(one.Spans()) {
			t.Errorf("level %g: stray %g, area %g; the run's own %g", e.Level, e.StrayM, e.AreaM2, one.AreaM2())
		}
	}
	// The column stands 2 m off the path (face at y = 1.8) and the load
	// swings along the path: every run keeps 1.8 - 0.5 - (its sideways
	// swing, none) = 1.3 m, below the column's top.
	o := rep.Obstacles[0]
	if o.KeepMargin != 5 || math.Abs(o.SmallestM-1.3) > 1e-6 || !rep.Clears {
		t.Errorf("column: %+v", o)
	}
}

func TestRopeSpreadEnvelopeMatchesTheRangeEnds(t *testing.T) {
	// A spread in rope length only: five runs at lengths spread evenly
	// over 7.5 to 9.5 m. The 95 % envelope of five runs holds all five
	// (ceil(0.95*5) = 5), so along the path it reaches exactly as far as
	// the runs do at either end of the move, within a cell's diagonal.
	s := bay(t)
	lengths := []float64{7.5, 8, 8.5, 9, 9.5}
	variant := func(i int) *scenario.Scenario {
		d := *s
		L := lengths[i]
		d.Load.RopeLengthM = &L
		return &d
	}
	rep, err := Evaluate(s, len(lengths), 0, variant, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Envelope95.Inside != 5 {
		t.Fatalf("95 %% envelope holds %d runs, want 5", rep.Envelope95.Inside)
	}
	// Extent along x of each run's path plus the radius.
	farthest, nearest := math.Inf(-1), math.Inf(1)
	for i := range lengths {
		res, err := sway.Evaluate(variant(i))
		if err != nil {
			t.Fatal(err)
		}
		run := RunOf(res)
		for _, p := range run.Path(12) {
			farthest = math.Max(farthest, p.At.X+0.5)
			nearest = math.Min(nearest, p.At.X-0.5)
		}
	}
	hi, lo := extentX(rep.Envelope95.Spans)
	if math.Abs(hi-farthest) > 0.1*math.Sqrt2 || math.Abs(lo-nearest) > 0.1*math.Sqrt2 {
		t.Errorf("envelope x from %g to %g; runs from %g to %g", lo, hi, nearest, farthest)
	}
}

func extentX(spans []Span) (hi, lo float64) {
	hi, lo = math.Inf(-1), math.Inf(1)
	for _, s := range spans {
		hi = math.Max(hi, s.X1M)
		lo = math.Min(lo, s.X0M)
	}
	return hi, lo
}
