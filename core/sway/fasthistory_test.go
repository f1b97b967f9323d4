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
	var files []string
	for _, dir := range []string{"testdata/scenarios", "testdata/reference/scenarios"} {
		fs, err := filepath.Glob(filepath.Join("..", "..", dir, "*.json"))
		if err != nil {
			t.Fatal(err)
		}
		files = append(files, fs...)
	}
	travel := 0
	for _, file := range files {
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
			a, b := direct.History.series(), viaKin.History.series()
			for k := range a {
				if len(*a[k]) != len(*b[k]) {
					t.Fatalf("%s (%s): series %d has %d samples, through kinOf %d", file, acc, k, len(*a[k]), len(*b[k]))
				}
				for i, v := range *a[k] {
					if w := (*b[k])[i]; math.Float64bits(v) != math.Float64bits(w) {
						t.Errorf("%s (%s): series %d sample %d is %v, through kinOf %v", file, acc, k, i, v, w)
						break
					}
				}
			}
		}
	}
	if travel < 3 {
		t.Errorf("only %d scenarios with travel moves alone: the test checks too little", travel)
	}
}
