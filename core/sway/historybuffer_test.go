package sway_test

import (
	"reflect"
	"testing"

	"swaysheet/core/sway"
)

// TestHistoryBufferKeepsTheHistories: runs made one after another in one
// Options.HistoryBuffer (the clearance check's) give the same histories,
// bit for bit, as runs with their own memory, and the buffer is reused
// once it is large enough.
func TestHistoryBufferKeepsTheHistories(t *testing.T) {
	var buf []float64
	for round := range 2 {
		for _, file := range fastScenarios(t) {
			s := readScenario(t, file)
			s.Plan = nil
			own, err := sway.EvaluateWith(s, sway.Options{PathOnly: true})
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			before := cap(buf)
			reused, err := sway.EvaluateWith(s, sway.Options{PathOnly: true, HistoryBuffer: &buf})
			if err != nil {
				t.Fatalf("%s: %v", file, err)
			}
			if !reflect.DeepEqual(own.History, reused.History) || !reflect.DeepEqual(own.Body, reused.Body) {
				t.Errorf("%s: the histories differ in a reused buffer", file)
			}
			if round == 1 && cap(buf) != before {
				t.Errorf("%s: the buffer was made again the second time round (capacity %d, then %d)", file, before, cap(buf))
			}
		}
	}
}
