package sway

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
)

// TestAirTravelAsKin: on travel moves alone with air (fastModel.airTravel)
// the specialised path evaluates the right-hand side and writes each
// history sample through airRel; taken through kinOf and rel instead
// (Options.kinAir), as for every other move with air, the result is the
// same bits: every figure, the solver's counts and every sample of every
// series, of the full evaluation and of the path alone (Options.PathOnly,
// the clearance check's runs), at the default and the tight accuracy.
// The scenarios are every example and reference scenario whose
// specialised model has travel moves alone with air, and each of them
// also on an overhead crane (a tower crane's radius makes it slew) and
// with its travel moves along y: wind and drag, ramps, a gust's duration,
// the wind's speed, no moves at all, moves along x and along y.
func TestAirTravelAsKin(t *testing.T) {
	var files []string
	for _, dir := range []string{"testdata/scenarios", "testdata/reference/scenarios"} {
		fs, err := filepath.Glob(filepath.Join("..", "..", dir, "*.json"))
		if err != nil {
			t.Fatal(err)
		}
		files = append(files, fs...)
	}
	checked, drag, ramp := 0, 0, 0
	for _, file := range files {
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
			su, err := build(s, false)
			if err != nil || su.fast == nil || !su.fast.airTravel {
				continue
			}
			checked++
			if su.fast.air.DragK > 0 {
				drag++
			}
			if su.fast.air.RampS > 0 {
				ramp++
			}
			for _, acc := range []string{"default", "tight"} {
				s.Settings = &scenario.Settings{Accuracy: acc}
				what := file + " (" + name + ", " + acc + ")"
				for _, pathOnly := range []bool{false, true} {
					direct, err := EvaluateWith(s, Options{PathOnly: pathOnly})
					if err != nil {
						t.Fatalf("%s: %v", what, err)
					}
					viaKin, err := EvaluateWith(s, Options{PathOnly: pathOnly, kinAir: true})
					if err != nil {
						t.Fatalf("%s: %v", what, err)
					}
					sameResultBits(t, what, direct, viaKin)
				}
			}
		}
	}
	t.Logf("%d scenarios, %d with drag, %d with ramps", checked, drag, ramp)
	if checked < 6 || drag < 2 || ramp < 1 {
		t.Errorf("%d scenarios with travel moves alone and air (%d with drag, %d with ramps): the test checks too little", checked, drag, ramp)
	}
}

// sameResultBits fails the test unless a and b are the same bits: their
// JSON (which writes a negative zero as -0 and every other number so that
// it reads back to its bits) and every sample of every history series.
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
		t.Errorf("%s: the results differ at byte %d: ...%s, through kinOf ...%s", what, i, ja[from:min(i+40, len(ja))], jb[from:min(i+40, len(jb))])
		return
	}
	sa, sb := a.History.series(), b.History.series()
	for k := range sa {
		if len(*sa[k]) != len(*sb[k]) || len(*sa[k]) == 0 {
			t.Fatalf("%s: series %d has %d samples, through kinOf %d", what, k, len(*sa[k]), len(*sb[k]))
		}
		for i, v := range *sa[k] {
			if w := (*sb[k])[i]; math.Float64bits(v) != math.Float64bits(w) {
				t.Errorf("%s: series %d sample %d is %v, through kinOf %v", what, k, i, v, w)
				break
			}
		}
	}
}
