package plan

import "testing"

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
