package clearance

import (
	"encoding/json"
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"swaysheet/core/draws"
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
	res, _ := sway.EvaluateWith(s, sway.Options{LegEnds: true})
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
		res, err := sway.EvaluateWith(variant(i), sway.Options{LegEnds: true})
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

func TestZeroSpreadThroughTheDraws(t *testing.T) {
	// A spread block with every spread at zero draws runs that are all
	// the scenario itself: both envelopes are the single run's swept area,
	// cell for cell, and the section's bands are its own lowest point
	// (nothing stochastic is left: the check is the deterministic one).
	s := bay(t)
	s.Site.Spread = &scenario.SiteSpread{Runs: 20, Seed: 4}
	rep, err := Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	one, err := Evaluate(s, 1, 0, nil, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for k, e := range []EnvelopeOut{rep.Envelope50, rep.Envelope95} {
		own := []EnvelopeOut{one.Envelope50, one.Envelope95}[k]
		if e.StrayM != 0 || !reflect.DeepEqual(e.Spans, own.Spans) {
			t.Errorf("level %g: stray %g, %d spans; the single run's %d", e.Level, e.StrayM, len(e.Spans), len(own.Spans))
		}
	}
	if !reflect.DeepEqual(rep.Section.Envelope95.LowM, one.Section.Envelope95.LowM) {
		t.Error("the section's band is not the single run's")
	}
}

func TestSeedReproducesAndConfidenceIsStated(t *testing.T) {
	// The same seed gives the same report, whatever the number of
	// goroutines; the exclusion zone's confidence is the binomial one for
	// its runs inside of the runs drawn: P(Binomial(N, 0.95) <= k-1)
	// (distribution-free tolerance region, Wilks 1941; see
	// TestEnvelopeConfidence for the identity), and it reaches 95 %.
	s := bay(t)
	two := 0.2
	s.Site.Spread = &scenario.SiteSpread{Runs: 80, Seed: 9, RopeLengthM: two, PressS: two}
	a, err := Check(s, Options{Workers: 1})
	if err != nil {
		t.Fatal(err)
	}
	b, err := Check(s, Options{Workers: 2})
	if err != nil {
		t.Fatal(err)
	}
	ja, _ := json.Marshal(a)
	jb, _ := json.Marshal(b)
	if string(ja) != string(jb) {
		t.Fatal("the same seed gave different reports")
	}
	e := a.Envelope95
	if e.Confidence != CoverageConfidence(e.Inside, a.Runs, Required) || e.Confidence < ExclusionConfidence {
		t.Errorf("95 %% envelope: %d of %d runs, confidence %g", e.Inside, a.Runs, e.Confidence)
	}
	s.Site.Spread.Seed = 10
	c, _ := Check(s, Options{})
	if jc, _ := json.Marshal(c); string(jc) == string(ja) {
		t.Error("another seed gave the same runs")
	}
}

func TestEmergencyStopSpreadInTheCheck(t *testing.T) {
	// An emergency stop only (1 s reaction, the move's own 0.25 m/s²
	// braking): each run's trolley ends v*t_r + v²/(2a) past where it was
	// at its stop command, v its speed then (constant speed, then uniform
	// deceleration: any mechanics text; 0.5 m + 0.5 m in the cruise at
	// 0.5 m/s).
	s := bay(t)
	one := 1.0
	s.Site.Spread = &scenario.SiteSpread{Runs: 30, Seed: 2, EmergencyStop: &scenario.EmergencyStop{ReactionS: &one}}
	rep, err := Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	base, _ := sway.BuildProfile(s, &s.Motions[0])
	sp := draws.Spread{EmergencyStop: s.Site.Spread.EmergencyStop}
	for i := 0; i < 30; i++ {
		d := draws.Draw(s, sp, 2, i)
		at := draws.StopAtS(d)
		st := base.At(at)
		want := st.Pos + st.Vel*1 + st.Vel*st.Vel/(2*0.25)
		res, err := sway.EvaluateWith(d, sway.Options{LegEnds: true})
		if err != nil {
			t.Fatal(err)
		}
		x := res.History.SuspensionXM
		if got := x[len(x)-1]; math.Abs(got-want) > 1e-9 {
			t.Errorf("run %d, stopped at %.2f s at %.3f m/s: ends at %.6f m, want %.6f", i, at, st.Vel, got, want)
		}
	}
	if rep.Spread == nil || rep.Spread.EmergencyStop == nil || *rep.Spread.EmergencyStop.ReactionS != 1 {
		t.Errorf("the report does not state the spread: %+v", rep.Spread)
	}
	if rep.Envelope95.StrayM == 0 {
		t.Error("the stops do not spread the runs")
	}
}

func TestCheckBudgetNamesWhatToShorten(t *testing.T) {
	s := bay(t)
	s.Site.Spread = &scenario.SiteSpread{Runs: 50, Seed: 1, RopeLengthM: 0.1}
	_, err := Check(s, Options{Budget: sway.NewBudget(1000, checkBudgetMessage)})
	if !errors.Is(err, sway.ErrWorkLimit) || !strings.Contains(err.Error(), "site.spread.runs") {
		t.Errorf("error %v", err)
	}
}
