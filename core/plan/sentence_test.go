package plan

import "testing"

// A sentence fills its placeholders in SI, with m/min beside m/s and rpm
// beside deg/s (core/units factors, NIST SP 811: rpm = 6 deg/s), and two
// sentences join with their placeholders renumbered.
func TestSentence(t *testing.T) {
	s := say("Ramp {0} to {1}; slew {2}.", qTime(5.6), qSpeed(0.5), qRate(4.2))
	if got, want := s.String(), "Ramp 5.6 s to 0.5 m/s (30 m/min); slew 4.2 deg/s (0.7 rpm)."; got != want {
		t.Errorf("%q, want %q", got, want)
	}
	j := s.join(say("Then {0} at {1}.", qAngle(0.13), qLen(8.5).digits(4)))
	if got, want := j.String(), "Ramp 5.6 s to 0.5 m/s (30 m/min); slew 4.2 deg/s (0.7 rpm). Then 0.13 deg at 8.5 m."; got != want || len(j.Quantities) != 5 {
		t.Errorf("%q, want %q", got, want)
	}
	if got := plain("a {b}").String(); got != "a (b)" {
		t.Errorf("plain %q", got)
	}
}
