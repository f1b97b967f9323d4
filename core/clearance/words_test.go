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
	want := "column (C4): the load keeps 0.30 m from it in 150 of 200 runs (75 %; 95 % needed); it strikes it in 3 runs, the earliest 7.3 s into the move, 4.50 m along the path."
	if plain[0] != want {
		t.Errorf("%q\nwant %q", plain[0], want)
	}
	// 0.3 m = 0.98 ft, 4.5 m = 14.76 ft (ft = 0.3048 m, NIST SP 811), to 0.05 ft.
	us := ss[0].Format(units.Choice{System: "us"})
	if !strings.Contains(us, "keeps 1.00 ft") || !strings.Contains(us, "14.75 ft along") || strings.Contains(us, " m ") {
		t.Errorf("US: %q", us)
	}
}
