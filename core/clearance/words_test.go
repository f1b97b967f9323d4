package clearance

import (
	"strings"
	"testing"

	"swaysheet/core/units"
	"swaysheet/core/words"
)

// The verdict's sentences carry their quantities marked: the plain text is
// their SI filling, and in US units no metre is left.
func TestVerdictSentencesMarked(t *testing.T) {
	reps := []ObstacleReport{{Name: "column {C4}", Runs: 200, KeepMargin: 150, ShareKeepMargin: 0.75, Strikes: 3, FirstStrikeS: 7.25, FirstStrikeAtDistanceM: 4.5}}
	ok, ss := VerdictSentences(reps, 0.3)
	_, plain := Verdict(reps, 0.3)
	if ok || len(ss) != 1 || strings.Join(words.Strings(ss), "") != strings.Join(plain, "") {
		t.Fatalf("ok %v, %q, plain %q", ok, words.Strings(ss), plain)
	}
	want := "column (C4): the load keeps 0.30 m from it in 150 of 200 runs (75 %; 95 % needed); it is struck in 3 of 200 runs, by the load; first 7.3 s into the move, 4.50 m along the path."
	if plain[0] != want {
		t.Errorf("%q\nwant %q", plain[0], want)
	}
	// 0.3 m = 0.98 ft, 4.5 m = 14.76 ft (ft = 0.3048 m, NIST SP 811), to 0.05 ft.
	us := ss[0].Format(units.Choice{System: "us"})
	if !strings.Contains(us, "keeps 1.00 ft") || !strings.Contains(us, "14.75 ft along") || strings.Contains(us, " m ") {
		t.Errorf("US: %q", us)
	}
}

// A strike by the rope counts as the obstacle's: the verdict says how
// often it is struck, by what, and what struck first (the line, with how
// high up, when the rope did: the first line need not be the deepest,
// nor is it named when not known); an obstacle kept in 95 % of the runs but struck in
// a few is said too, after the verdict.
func TestVerdictNamesWhatStrikes(t *testing.T) {
	rope := &RopeReport{Runs: 200, KeepMargin: 188, Strikes: 10, Part: "hook rope 2", FirstStrikeS: 4.5, FirstStrikeAtHeightM: 27.5}
	reps := []ObstacleReport{
		{Name: "mast", Runs: 200, KeepMargin: 180, ShareKeepMargin: 0.9, Strikes: 12, LoadStrikes: 3, FirstStrikeS: 4.5, FirstStrikeBy: StruckByRope, FirstStrikeLine: "hook rope 1", FirstStrikeAtDistanceM: 8.1, Rope: rope},
		{Name: "stack", Runs: 200, KeepMargin: 198, ShareKeepMargin: 0.99, Strikes: 1, LoadStrikes: 1, FirstStrikeS: 9, FirstStrikeBy: StruckByLoad, FirstStrikeAtDistanceM: 12, Rope: &RopeReport{Runs: 200, KeepMargin: 200, Part: "hoist rope"}},
	}
	ok, plain := Verdict(reps, 0.5)
	want := []string{
		"mast: the load and its rope keep 0.50 m from it in 180 of 200 runs (90 %; 95 % needed); it is struck in 12 of 200 runs: by the load in 3, by its rope in 10 (hook rope 2 deepest); first by hook rope 1, 4.5 s into the move, 8.10 m along the path, 27.50 m up.",
		"stack: kept clear by the margin 0.50 m in 198 of 200 runs; it is struck in 1 of 200 runs, by the load; first 9.0 s into the move, 12.00 m along the path.",
	}
	if ok || strings.Join(plain, "\n") != strings.Join(want, "\n") {
		t.Errorf("%v %q\nwant %q", ok, plain, want)
	}
	reps[0].FirstStrikeLine = ""
	if _, plain = Verdict(reps, 0.5); !strings.Contains(plain[0], "; first by its rope, 4.5 s into the move") {
		t.Errorf("no line known: %q", plain[0])
	}
}
