package draws

import (
	"errors"
	"reflect"
	"strings"
	"swaysheet/core/internal/testscenario"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

var spread = Spread{RopeLengthM: 0.3, CentreDepthM: 0.1, PressS: 0.2, GustPct: 20, GustS: 1}

// The same seed gives the same draws however they are split, over one
// goroutine or two, in one request or in two halves.
func TestReproducible(t *testing.T) {
	s := testscenario.Example(t, "wind-gust")
	req := Request{Spread: spread, Runs: 40, Seed: 7}
	one, err := Run(s, req, 1)
	if err != nil {
		t.Fatal(err)
	}
	two, err := Run(s, req, 2)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(one, two) {
		t.Fatal("one and two goroutines give different results")
	}
	a, err := Run(s, Request{Spread: spread, Runs: 40, Seed: 7, First: 0, Count: 25}, 2)
	if err != nil {
		t.Fatal(err)
	}
	b, err := Run(s, Request{Spread: spread, Runs: 40, Seed: 7, First: 25, Count: 15}, 2)
	if err != nil {
		t.Fatal(err)
	}
	merged := Figures{
		PeakSwingDeg:     append(a.Figures.PeakSwingDeg, b.Figures.PeakSwingDeg...),
		PeakExcursionM:   append(a.Figures.PeakExcursionM, b.Figures.PeakExcursionM...),
		ResidualSwingDeg: append(a.Figures.ResidualSwingDeg, b.Figures.ResidualSwingDeg...),
		TensionFactor:    append(a.Figures.TensionFactor, b.Figures.TensionFactor...),
	}
	if !reflect.DeepEqual(merged, one.Figures) || !reflect.DeepEqual(Summarise(&merged), one.Summary) {
		t.Fatal("two halves merged differ from the whole")
	}
	other, err := Run(s, Request{Spread: spread, Runs: 40, Seed: 8}, 2)
	if err != nil {
		t.Fatal(err)
	}
	if reflect.DeepEqual(other.Figures, one.Figures) {
		t.Fatal("another seed gives the same draws")
	}
	if one.Summary.PeakSwingDeg.P50 == one.Summary.PeakSwingDeg.P95 {
		t.Fatal("the draws do not spread the peak swing")
	}
}

// Without spread every draw is the scenario itself.
func TestNoSpread(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	r, err := Run(s, Request{Runs: 5, Seed: 1}, 2)
	if err != nil {
		t.Fatal(err)
	}
	want, err := sway.EvaluateWith(s, sway.Options{NoHistory: true})
	if err != nil {
		t.Fatal(err)
	}
	p := r.Summary.PeakSwingDeg
	if p.P50 != want.PeakSwingDeg || p.P95 != want.PeakSwingDeg || p.Max != want.PeakSwingDeg {
		t.Fatalf("peak swing %+v, want %v in every draw", p, want.PeakSwingDeg)
	}
}

// Percentiles by linear interpolation between order statistics (Hyndman
// and Fan 1996, definition 7, NumPy's default): for 1..11 the 90th
// percentile is 10 and for 1..10 the 95th is 9.55.
func TestPercentiles(t *testing.T) {
	p := percentiles([]float64{11, 3, 5, 1, 2, 4, 6, 7, 8, 9, 10})
	if p.P50 != 6 || p.P90 != 10 || p.Max != 11 {
		t.Fatalf("got %+v", p)
	}
	q := percentiles([]float64{1, 2, 3, 4, 5, 6, 7, 8, 9, 10})
	if d := q.P95 - 9.55; d > 1e-12 || d < -1e-12 {
		t.Fatalf("p95 of 1..10 = %v, want 9.55", q.P95)
	}
}

func TestBadRequest(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	for _, c := range []struct {
		req   Request
		field string
	}{
		{Request{Runs: 0}, "draws.runs"},
		{Request{Runs: 10, First: 8, Count: 5}, "draws.first"},
		{Request{Runs: 10, Spread: Spread{PressS: -1}}, "draws.spread.press_s"},
		{Request{Runs: 10, Spread: Spread{GustPct: 1e9}}, "draws.spread.gust_pct"},
	} {
		_, err := Run(s, c.req, 1)
		var fe scenario.Errors
		if !errors.As(err, &fe) || fe[0].Field != c.field {
			t.Errorf("%+v: got %v, want an error at %s", c.req, err, c.field)
		}
	}
	// A rope drawn shorter than the model accepts names the draw.
	short := testscenario.Example(t, "bay-travel")
	l := 0.35
	short.Load.RopeLengthM = &l
	if _, err := Run(short, Request{Runs: 50, Seed: 3, Spread: Spread{RopeLengthM: 0.1}}, 2); err == nil {
		t.Fatal("a rope drawn below 0.3 m went through")
	}
}

// A spread out of range is said with its accepted range in the units
// shown, its bounds rounded inward to the unit's step: 50 m = 164.04 ft
// (ft = 0.3048 m exactly, NIST SP 811), said as 164.00 ft; 20 m/s² =
// 65.62 ft/s², said as 65.60; 0.01 m/s² = 0.0328 ft/s², said as 0.05.
func TestBadRequestInUnitsShown(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	decel := 25.0
	req := Request{Runs: 10, Spread: Spread{RopeLengthM: 60.96, GustPct: 150, EmergencyStop: &scenario.EmergencyStop{DecelMPerS2: &decel}}}
	for _, c := range []struct {
		u    units.Choice
		want []string
	}{
		{units.Choice{System: "us"}, []string{
			"draws.spread.rope_length_m: is 200.00 ft: accepted from 0.00 ft up to 164.00 ft",
			"draws.spread.gust_pct: is 150 %: accepted from 0 % up to 100 %",
			"draws.spread.emergency_stop.reaction_s: is required: accepted from 0.0 s up to 10.0 s",
			"draws.spread.emergency_stop.decel_m_per_s2: is 82.00 ft/s²: accepted from 0.05 ft/s² up to 65.60 ft/s²"}},
		{units.Choice{System: "si"}, []string{
			"draws.spread.rope_length_m: is 60.96 m: accepted from 0.00 m up to 50.00 m"}},
	} {
		err := Check(s, req, c.u)
		for _, w := range c.want {
			if err == nil || !strings.Contains(err.Error()+";", w+";") {
				t.Errorf("%s: %v\nwant %q", c.u.System, err, w)
			}
		}
	}
	if _, err := Run(s, req, 1); err == nil || err.Error() != Check(s, req, units.Choice{System: "si"}).Error() {
		t.Errorf("Run's messages are not Check's in SI: %v", err)
	}
}

// BenchmarkBayTravel1000 is 1,000 draws of bay-travel on one and on all
// processors (make bench reports the same from swaybench).
func BenchmarkBayTravel1000(b *testing.B) {
	s := testscenario.Example(b, "bay-travel")
	for _, w := range []int{1, 2} {
		b.Run(map[int]string{1: "1core", 2: "2cores"}[w], func(b *testing.B) {
			for b.Loop() {
				if _, err := Run(s, Request{Spread: spread, Runs: 1000, Seed: 1}, w); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// The specialised and the general path of core/sway agree on scattered
// scenarios too, not only on the files (core/sway TestFastPathAgrees):
// 40 wide draws of every single-rope example, figures within 1e-8 of
// each other (relative, the reference tolerances are 2e-5 deg and 5e-6 m).
func TestPathsAgreeOverDraws(t *testing.T) {
	wide := Spread{RopeLengthM: 1, CentreDepthM: 0.3, PressS: 1, GustPct: 50, GustS: 3}
	for _, name := range []string{"bay-travel", "diagonal-travel", "hard-stop", "hoist-during-travel",
		"pendant-steps", "recorded-run", "slew-with-trolley", "tower-slew", "wind-gust"} {
		s := testscenario.Example(t, name)
		for i := range 40 {
			d := Draw(s, wide, 11, i)
			fast, err := sway.EvaluateWith(d, sway.Options{NoHistory: true})
			if err != nil {
				continue // a draw the core rejects (a rope drawn too short) is no comparison
			}
			gen, err := sway.EvaluateWith(d, sway.Options{NoHistory: true, General: true})
			if err != nil {
				t.Fatalf("%s draw %d: general path: %v", name, i, err)
			}
			for _, c := range []struct {
				what       string
				a, b, unit float64
			}{
				{"peak swing", fast.PeakSwingDeg, gen.PeakSwingDeg, max(gen.PeakSwingDeg, 1e-3)},
				{"residual swing", fast.ResidualSwingDeg, gen.ResidualSwingDeg, max(gen.PeakSwingDeg, 1e-3)},
				{"peak excursion", fast.PeakExcursionM, gen.PeakExcursionM, max(gen.PeakExcursionM, 1e-3)},
				{"tension max", fast.TensionMaxN, gen.TensionMaxN, gen.StaticTensionN},
				{"tension min", fast.TensionMinN, gen.TensionMinN, gen.StaticTensionN},
			} {
				if d := (c.a - c.b) / c.unit; !(d <= 1e-8 && d >= -1e-8) {
					t.Errorf("%s draw %d: %s fast %.12g, general %.12g", name, i, c.what, c.a, c.b)
				}
			}
		}
	}
}
