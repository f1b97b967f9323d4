package sway

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
)

// TestAirTravelAsKin: on travel moves alone with a steady air
// (fastModel.steady: wind off or full over a segment, no drag) the
// specialised path adds the air's share of the applied acceleration kept
// for the segment, in rhs and in each history sample; taken through
// kinOf and rel instead (Options.kinSamples), as for every other move
// with air, the result is the same bits: every figure, the solver's counts and every sample of every
// series, of the full evaluation and of the path alone (Options.PathOnly,
// the clearance check's runs). The scenarios are every example and
// reference scenario whose specialised model has travel moves alone with
// wind and no drag, each also on an overhead crane (a tower crane's
// radius makes it slew) and with its travel moves along y, at the default
// and the tight accuracy; and runs of the bay example as its clearance
// check draws them, with the wind also set in at the travel's corners and
// at the start, ramped, for a while and blowing every way.
func TestAirTravelAsKin(t *testing.T) {
	checked, ramp, steady := 0, 0, 0
	check := func(s *scenario.Scenario, what string, accs ...string) {
		su, err := build(s, false)
		if err != nil || su.fast == nil || !su.fast.airTravel {
			return
		}
		checked++
		if su.fast.air.RampS > 0 {
			ramp++
		}
		steady += steadySegments(su)
		sameAsPlain(t, s, what, accs...)
	}
	for _, file := range scenarioFiles(t) {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		for variant, name := range []string{"as is", "overhead", "along y"} {
			s, err := scenario.Parse(data)
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			s.Plan, s.Site = nil, nil
			switch variant {
			case 1:
				s.Crane.Kind, s.Crane.RadiusM = "overhead", 0
			case 2:
				s.Crane.Kind, s.Crane.RadiusM = "overhead", 0
				for i := range s.Motions {
					if s.Motions[i].Axis == "travel_x" {
						s.Motions[i].Axis = "travel_y"
					}
				}
			}
			check(s, file+" ("+name+")", "default", "tight")
		}
	}
	// The clearance check's runs of the bay example: the gust's moment,
	// strength and direction and the rope drawn (as its spread does), the
	// wind set in at the travel's corners and at the start, ramped, for a
	// while, blowing against the travel.
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "scenarios", "site-bay-columns.json"))
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(1, 2))
	for i := range 60 {
		s, err := scenario.Parse(data)
		if err != nil {
			t.Fatal(err)
		}
		s.Plan, s.Site = nil, nil
		w := s.Wind
		switch {
		case i < 5:
			w.StartS = []float64{0, 1, 3, 49, 51}[i] // the start and the travel's corners
		case i < 9:
			w.RampS, w.DurationS = float64(i-4), 10
		default:
			w.StartS = max(0, 20+8*rng.NormFloat64())
			f := *w.ForceN * (1 + 0.3*rng.NormFloat64())
			w.ForceN = &f
			rope := *s.Load.RopeLengthM + 0.15*rng.NormFloat64()
			s.Load.RopeLengthM = &rope
		}
		w.TowardDeg = float64(45 * (i % 8))
		check(s, fmt.Sprintf("site-bay-columns run %d", i), "default")
	}
	t.Logf("%d scenarios, %d with ramps, %d segments of steady air", checked, ramp, steady)
	if checked < 60 || ramp < 4 || steady < 100 {
		t.Errorf("%d scenarios with travel moves alone and wind (%d with ramps, %d segments of steady air): the test checks too little", checked, ramp, steady)
	}
}

// steadySegments is the number of segments between restarts of su over
// which the specialised model finds the air steady (fastModel.steadyAir).
func steadySegments(su *setup) int {
	n, a := 0, 0.0
	for _, b := range restartCuts(su.breaks, su.motionEnd+30) {
		su.fast.segment(a, b)
		if su.fast.steady {
			n++
		}
		a = b
	}
	return n
}

// sameResultBits fails the test unless a and b (b taken the other way)
// are the same bits: their JSON (which writes a negative zero as -0 and
// every other number so that it reads back to its bits) and every sample
// of every history series.
func sameResultBits(t *testing.T, what string, a, b *Result) {
	t.Helper()
	ja, err := json.Marshal(a)
	if err != nil {
		t.Fatal(err)
	}
	jb, err := json.Marshal(b)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(ja, jb) {
		i := 0
		for i < len(ja) && i < len(jb) && ja[i] == jb[i] {
			i++
		}
		from := max(i-80, 0)
		t.Errorf("%s: the results differ at byte %d: ...%s, the other way ...%s", what, i, ja[from:min(i+40, len(ja))], jb[from:min(i+40, len(jb))])
		return
	}
	sameSeriesBits(t, what, &a.History, &b.History)
}
