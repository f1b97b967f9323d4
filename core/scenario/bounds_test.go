package scenario_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// TestLowerBounds checks that values no crane has (5e-324 is the smallest
// float64 above zero) are rejected at their field with the accepted range,
// and that the bounds stated for each kind of quantity hold: speeds at least
// 0.001 m/s or 0.01 deg/s, accelerations at least 0.001 m/s² or 0.01
// deg/s², distances and angles 0 or at least 0.001 m or 0.01 deg in size,
// durations 0 or at least 0.01 s.
func TestLowerBounds(t *testing.T) {
	good := `{"mass_kg": 1000, "rope_length_m": 5}`
	mv := func(fields string) string {
		return "{" + head + `, "load": ` + good + `, "motions": [{` + fields + `}]}`
	}
	plan := func(p, limits string) string {
		return file(good, `, "limits": {`+limits+`}, "plan": {`+p+`}`)
	}
	lim := `"peak_swing_deg": 2, "residual_swing_deg": 0.5`
	for _, c := range []struct{ name, data, field, says string }{
		{"tiny speed", mv(`"axis": "travel_x", "distance_m": 4, "speed_m_per_s": 5e-324, "accel_m_per_s2": 0.3`),
			"motions[0].speed_m_per_s", "5e-324 is out of range: accepted from 0.001 up to 10 m/s"},
		{"tiny accel", mv(`"axis": "travel_x", "distance_m": 2000, "speed_m_per_s": 1, "accel_m_per_s2": 5e-324`),
			"motions[0].accel_m_per_s2", "5e-324 is out of range: accepted from 0.001 up to 5 m/s²"},
		{"tiny decel", mv(`"axis": "travel_x", "distance_m": 4, "speed_m_per_s": 1, "accel_m_per_s2": 0.3, "decel_m_per_s2": 1e-9`),
			"motions[0].decel_m_per_s2", "accepted from 0.001 up to 5 m/s²"},
		{"tiny rate", mv(`"axis": "slew", "angle_deg": 40, "rate_deg_per_s": 1e-300, "accel_deg_per_s2": 1`),
			"motions[0].rate_deg_per_s", "accepted from 0.01 up to 36 deg/s"},
		{"tiny slew accel", mv(`"axis": "slew", "angle_deg": 40, "rate_deg_per_s": 1, "accel_deg_per_s2": 5e-324`),
			"motions[0].accel_deg_per_s2", "accepted from 0.01 up to 30 deg/s²"},
		{"tiny distance", mv(`"axis": "travel_x", "distance_m": 5e-324, "speed_m_per_s": 1, "accel_m_per_s2": 0.3`),
			"motions[0].distance_m", "5e-324 is out of range: accepted from -2000 up to 2000 m: 0, or at least 0.001 m in size"},
		{"tiny angle", mv(`"axis": "slew", "angle_deg": -1e-12, "rate_deg_per_s": 1, "accel_deg_per_s2": 1`),
			"motions[0].angle_deg", "at least 0.01 deg in size"},
		{"tiny jerk", mv(`"axis": "travel_x", "profile": "s_curve", "distance_m": 4, "speed_m_per_s": 1, "accel_m_per_s2": 0.3, "jerk_m_per_s3": 5e-324`),
			"motions[0].jerk_m_per_s3", "accepted from 0.001 up to 50 m/s³"},
		{"tiny rounding", mv(`"axis": "travel_x", "profile": "s_curve", "distance_m": 4, "speed_m_per_s": 1, "accel_m_per_s2": 0.3, "rounding_s": 5e-324`),
			"motions[0].rounding_s", "accepted from 0 up to 60 s: 0, or at least 0.01 s in size"},
		{"tiny step speed", mv(`"axis": "travel_x", "profile": "steps", "accel_m_per_s2": 0.3, "steps": [{"at_s": 0, "speed_m_per_s": 5e-324}, {"at_s": 5, "speed_m_per_s": 0}]`),
			"motions[0].steps[0].speed_m_per_s", "at least 0.001 m/s in size"},
		{"tiny hard stop speed", mv(`"axis": "travel_x", "profile": "hard_stop", "speed_m_per_s": 5e-324, "brake_at_s": 1, "decel_m_per_s2": 1`),
			"motions[0].speed_m_per_s", "accepted from 0.001 up to 10 m/s"},
		{"tiny hard stop decel", mv(`"axis": "travel_x", "profile": "hard_stop", "speed_m_per_s": 1, "brake_at_s": 1, "decel_m_per_s2": 5e-324`),
			"motions[0].decel_m_per_s2", "accepted from 0.001 up to 10 m/s²"},
		{"tiny shaper tolerance", mv(`"axis": "travel_x", "distance_m": 4, "speed_m_per_s": 1, "accel_m_per_s2": 0.3, "shaper": {"kind": "ei", "tolerance_pct": 5e-324}`),
			"motions[0].shaper.tolerance_pct", "0, or at least 0.1 % in size"},
		{"tiny wind duration", file(good, `, "wind": {"force_n": 100, "duration_s": 5e-324}`),
			"wind.duration_s", "0, or at least 0.01 s in size"},
		{"tiny swing limit", file(good, `, "limits": {"peak_swing_deg": 5e-324}`),
			"limits.peak_swing_deg", "accepted from 0.01 up to 90 deg"},
		{"tiny excursion limit", file(good, `, "limits": {"peak_excursion_m": 5e-324}`),
			"limits.peak_excursion_m", "accepted from 0.001 up to 100 m"},
		{"tiny residual limit", file(good, `, "limits": {"residual_swing_deg": 5e-324}`),
			"limits.residual_swing_deg", "accepted from 0.01 up to 90 deg"},
		{"tiny plan speed", plan(`"axis": "travel_x", "distance_m": 10, "top_speed_m_per_s": 5e-324, "max_accel_m_per_s2": 0.3`, lim),
			"plan.top_speed_m_per_s", "5e-324 is out of range: accepted from 0.001 up to 10 m/s"},
		{"tiny plan distance", plan(`"axis": "travel_x", "distance_m": 5e-324, "top_speed_m_per_s": 1, "max_accel_m_per_s2": 0.3`, lim),
			"plan.distance_m", "at least 0.01 m in size"},
		{"tiny plan accel", plan(`"axis": "travel_x", "distance_m": 10, "top_speed_m_per_s": 1, "max_accel_m_per_s2": 5e-324`, lim),
			"plan.max_accel_m_per_s2", "accepted from 0.001 up to 5 m/s²"},
		{"tiny plan angle", plan(`"axis": "slew", "angle_deg": 1e-10, "top_rate_deg_per_s": 1, "max_accel_deg_per_s2": 1`, lim),
			"plan.angle_deg", "at least 0.01 deg in size"},
		{"tiny plan rate", plan(`"axis": "slew", "angle_deg": 10, "top_rate_deg_per_s": 5e-324, "max_accel_deg_per_s2": 1`, lim),
			"plan.top_rate_deg_per_s", "accepted from 0.01 up to 36 deg/s"},
		{"tiny pendant step", plan(`"axis": "travel_x", "distance_m": 10, "top_speed_m_per_s": 1, "max_accel_m_per_s2": 0.3, "pendant_steps_pct": [5e-324, 100]`, lim),
			"plan.pendant_steps_pct[0]", "accepted from 1 up to 100 %"},
		{"tiny plan tolerance", plan(`"axis": "travel_x", "distance_m": 10, "top_speed_m_per_s": 1, "max_accel_m_per_s2": 0.3, "ei_tolerance_pct": 5e-324`, lim),
			"plan.ei_tolerance_pct", "0, or at least 0.1 % in size"},
	} {
		_, err := scenario.Parse([]byte(c.data))
		var es scenario.Errors
		if !errors.As(err, &es) || len(es) == 0 {
			t.Errorf("%s: want a field error, got %v", c.name, err)
			continue
		}
		found := false
		for _, e := range es {
			found = found || e.Field == c.field && strings.Contains(e.Message, c.says)
		}
		if !found {
			t.Errorf("%s: got %q; want field %q with %q", c.name, es.Error(), c.field, c.says)
		}
	}
}
