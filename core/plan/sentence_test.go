package plan

import (
	"fmt"
	"strings"
	"testing"
)

// with and list renumber the placeholders of the sentence put in, so each
// quantity keeps its place.
func TestSentenceWithList(t *testing.T) {
	parts := []Sentence{say("peak swing {0} > {1}", qAngle(3.2), qAngle(3)), say("peak excursion {0} > {1}", qLen(0.412), qLen(0.3))}
	s := say("leaves {0}: {outside}.", qTime(2)).with("{outside}", list(parts, "; "))
	want := "leaves 2 s: peak swing 3.2 deg > 3 deg; peak excursion 0.412 m > 0.3 m."
	if s.String() != want || len(s.Quantities) != 5 {
		t.Errorf("%q (%d quantities), want %q", s.String(), len(s.Quantities), want)
	}
	if j := say("a {0}.", qTime(1)).join(say("b {0}.", qTime(2))); j.String() != "a 1 s. b 2 s." {
		t.Errorf("join: %q", j.String())
	}
}

// TestSentenceStringOnePass holds the one-pass String to the replacement
// of each placeholder in turn, on every sentence of every planning
// example's plan and on placeholders it must leave alone.
func TestSentenceStringOnePass(t *testing.T) {
	byPass := func(s Sentence) string {
		out := s.Text
		for i, q := range s.Quantities {
			out = strings.ReplaceAll(out, fmt.Sprintf("{%d}", i), q.String())
		}
		return out
	}
	ss := []Sentence{
		say("{0} and {1}, {0} again, {2} kept, {10} kept, {} {x} {-1} { 0} {01} {", qLen(1.5), qSpeed(0.5)),
		say("no placeholders"), say("{0}", qTime(3)), say("{1}{0}", qAngle(2), qRate(0.1)),
	}
	for _, name := range []string{"plan-bay-travel.json", "plan-tower-slew.json", "plan-precast-hook.json", "plan-gantry-pendant.json", "plan-site-bay-columns.json"} {
		r, err := Make(load(t, name))
		if err != nil {
			t.Fatal(err)
		}
		ss = append(ss, r.ReasonSentence)
		ss = append(ss, r.NoteSentences...)
		ss = append(ss, r.InfeasibleSentences...)
		for _, o := range r.Options {
			ss = append(append(append(ss, o.Sentences...), o.FindingSentences...), o.OutsideSentences...)
		}
	}
	for _, s := range ss {
		if got, want := s.String(), byPass(s); got != want {
			t.Errorf("%q: one pass gives %q, replacement by replacement %q", s.Text, got, want)
		}
	}
	if len(ss) < 50 {
		t.Fatalf("only %d sentences compared", len(ss))
	}
}
