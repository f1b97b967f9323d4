package sway_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestMoveTooLong checks that a move ending after the longest run is an
// error at the move's own field, saying what to change, and not a run
// length of +Inf or millions of seconds at settings.duration_s.
func TestMoveTooLong(t *testing.T) {
	const head = `{"format": "swaysheet-scenario", "version": 1, "name": "long move", "load": {"mass_kg": 1000, "rope_length_m": 5}, "motions": [`
	for _, c := range []struct{ name, move, field, says string }{
		{"slow cruise", `{"axis": "travel_x", "distance_m": 2000, "speed_m_per_s": 0.001, "accel_m_per_s2": 0.3}`,
			"motions[0].speed_m_per_s", "the move ends at t = 2e+06 s: every move must end by t = 3600 s; raise speed_m_per_s (accepted from 0.001 up to 10 m/s)"},
		{"slow ramp", `{"axis": "travel_x", "profile": "steps", "accel_m_per_s2": 0.001, "steps": [{"at_s": 0, "speed_m_per_s": 10}, {"at_s": 3000, "speed_m_per_s": 0}]}`,
			"motions[0].accel_m_per_s2", "the move ends at t = 6000 s: every move must end by t = 3600 s; raise accel_m_per_s2 (accepted from 0.001 up to 5 m/s²)"},
		{"slow brake", `{"axis": "travel_x", "profile": "hard_stop", "speed_m_per_s": 10, "brake_at_s": 1, "decel_m_per_s2": 0.001}`,
			"motions[0].decel_m_per_s2", "the move ends at t = 1e+04 s"},
		{"late start", `{"axis": "travel_x", "start_s": 3599, "distance_m": 20, "speed_m_per_s": 1, "accel_m_per_s2": 0.3}`,
			"motions[0].start_s", "start it earlier"},
	} {
		s, err := scenario.Parse([]byte(head + c.move + "]}"))
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		_, err = sway.Evaluate(s)
		var es scenario.Errors
		if !errors.As(err, &es) || es[0].Field != c.field || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %v; want %s: ...%s...", c.name, err, c.field, c.says)
		}
	}
}
