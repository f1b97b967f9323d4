package scenario_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// The wind's rise time: bad values name wind.ramp_s and its range (README
// "Bad input").
func TestWindRampBadInput(t *testing.T) {
	load := `{"mass_kg": 1000, "rope_length_m": 5, "area_m2": 4, "drag_coefficient": 1.2}`
	for _, c := range []struct{ wind, says string }{
		{`{"speed_m_per_s": 10, "shape_factor": 1.2, "ramp_s": -1}`, "-1 is out of range: accepted from 0 up to 600 s"},
		{`{"force_n": 500, "ramp_s": 900}`, "900 is out of range: accepted from 0 up to 600 s"},
		{`{"force_n": 500, "ramp_s": "3 s"}`, "expected a number, found a JSON string"},
	} {
		_, err := scenario.Parse([]byte(file(load, `, "wind": `+c.wind)))
		var es scenario.Errors
		if !errors.As(err, &es) || es[0].Field != "wind.ramp_s" || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %v, want wind.ramp_s: ...%s...", c.wind, err, c.says)
		}
	}
	if _, err := scenario.Parse([]byte(file(load, `, "wind": {"speed_m_per_s": 10, "shape_factor": 1.2, "ramp_s": 4, "duration_s": 6}`))); err != nil {
		t.Errorf("a gust with a ramp: %v", err)
	}
}
