package sway

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
)

// TestTravelSamplesAsKin: on travel moves alone the specialised path
// writes each history sample from the segment's spans directly
// (fastScan.recordState); taken through kinOf and rel instead, as for
// every other move, every sample of every series is the same bits, on
// every example and reference scenario the specialised path takes with
// travel moves only, at the default and the tight accuracy.
func TestTravelSamplesAsKin(t *testing.T) {
	travel := 0
	for _, file := range scenarioFiles(t) {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		s, err := scenario.Parse(data)
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		su, err := build(s, false)
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		if su.fast == nil || !su.fast.travel {
			continue
		}
		travel++
		for _, acc := range []string{"default", "tight"} {
			s.Settings = &scenario.Settings{Accuracy: acc}
			direct, err := EvaluateWith(s, Options{})
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			viaKin, err := EvaluateWith(s, Options{kinSamples: true})
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			sameSeriesBits(t, file+" ("+acc+")", &direct.History, &viaKin.History)
		}
	}
	if travel < 3 {
		t.Errorf("only %d scenarios with travel moves alone: the test checks too little", travel)
	}
}

// scenarioFiles are the paths of every example and reference scenario.
func scenarioFiles(t *testing.T) []string {
	var files []string
	for _, dir := range []string{"testdata/scenarios", "testdata/reference/scenarios"} {
		fs, err := filepath.Glob(filepath.Join("..", "..", dir, "*.json"))
		if err != nil {
			t.Fatal(err)
		}
		files = append(files, fs...)
	}
	return files
}

// sameSeriesBits fails the test unless every series of a and b (b taken
// through kinOf) has the same samples, bit for bit.
func sameSeriesBits(t *testing.T, what string, a, b *History) {
	t.Helper()
	sa, sb := a.series(), b.series()
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

// TestDenseBothKeepsTheState: the dense output's state from denseBoth (the
// peak search's rates) is dense's, bit for bit, at points across every
// step of a run: the peak search reads the swing and the excursion from
// either (measureDense).
func TestDenseBothKeepsTheState(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "scenarios", "diagonal-travel.json"))
	if err != nil {
		t.Fatal(err)
	}
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	su, err := build(s, false)
	if err != nil || su.fast == nil {
		t.Fatalf("no specialised model: %v", err)
	}
	v := fastSolver{m: su.fast, relTol: DefaultRelTol, absTol: DefaultRelTol * 1e-2, maxSteps: 10000}
	var y [6]float64
	copy(y[:], su.y0)
	cuts := restartCuts(su.breaks, 60)
	t0, steps := 0.0, 0
	for _, cut := range cuts {
		su.fast.segment(t0, cut)
		v.reset(t0, &y)
		for {
			done, err := v.step(cut)
			if err != nil {
				t.Fatal(err)
			}
			steps++
			for k := range 9 {
				at := v.told + float64(k)/8*(v.t-v.told)
				var a, b, bd [6]float64
				v.dense(at, &a)
				v.denseBoth(at, &b, &bd)
				for i := range a {
					if math.Float64bits(a[i]) != math.Float64bits(b[i]) {
						t.Fatalf("step %d at %v: component %d is %v from dense, %v from denseBoth", steps, at, i, a[i], b[i])
					}
				}
			}
			if done {
				break
			}
		}
		y, t0 = v.y, cut
	}
	if steps < 100 {
		t.Errorf("only %d steps checked", steps)
	}
}
