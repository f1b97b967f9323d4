package scenario_test

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
)

// TestSeriesBounds checks that a recorded or planned series is held to the
// same limits as any other move and that its numbers are plain decimals.
func TestSeriesBounds(t *testing.T) {
	series := func(axis, csv, extra string) string {
		return "{" + head + `, "load": {"mass_kg": 1000, "rope_length_m": 5}, "crane": {"radius_m": 20}, "motions": [{"axis": "` + axis +
			`", "profile": "series", "csv": "` + csv + `"` + extra + `}]}`
	}
	for _, c := range []struct{ name, data, field, says string }{
		{"speed beyond the axis", series("travel_x", `time_s,travel_x_m_per_s\n0,0\n1,1e6\n2,0\n`, ""),
			"motions[0].csv", "line 3, column travel_x_m_per_s: the speed reaches 1e+06 m/s at t = 1 s: accepted up to 10 m/s, as for speed_m_per_s"},
		{"slew rate beyond the axis", series("slew", `time_s,slew_deg_per_s\n0,0\n1,50\n2,0\n`, ""),
			"motions[0].csv", "the speed reaches 50 deg/s at t = 1 s: accepted up to 36 deg/s"},
		{"acceleration beyond the axis", series("travel_x", `time_s,travel_x_m_per_s\n0,0\n0.01,1\n1,1\n2,0\n`, ""),
			"motions[0].csv", "line 2, column travel_x_m_per_s: the acceleration reaches 100 m/s² at t = 0 s: accepted up to 10 m/s²"},
		{"spline speed beyond the axis", series("travel_x", `time_s,travel_x_m\n0,0\n1,30\n2,30\n`, ""),
			"motions[0].csv", "column travel_x_m: the speed reaches"},
		{"hex number", series("travel_x", `time_s,travel_x_m_per_s\n0,0\n1,0x1p-2\n2,0\n`, ""),
			"motions[0].csv", `line 3, column travel_x_m_per_s: "0x1p-2" is not a number: write it in decimal, like 0.25 or 2.5e-1`},
		{"underscore", series("travel_x", `time_s,travel_x_m_per_s\n0,0\n1,1_0\n2,0\n`, ""),
			"motions[0].csv", `"1_0" is not a number`},
		{"infinity", series("travel_x", `time_s,travel_x_m_per_s\n0,0\n1,inf\n2,0\n`, ""),
			"motions[0].csv", `"inf" is not a number`},
		{"all before the run", series("travel_x", `time_s,travel_x_m_per_s\n-10,0\n-9,0.5\n-8,0\n`, ""),
			"motions[0].csv", "the record starts at t = -10 s, before the run starts at t = 0: give times from 0, or set start_s to at least 10"},
		{"partly before the run", series("travel_x", `time_s,travel_x_m_per_s\n0,0\n1,0.5\n2,0\n`, `, "start_s": 0`),
			"", ""},
	} {
		_, err := scenario.Parse([]byte(c.data))
		if c.field == "" {
			if err != nil {
				t.Errorf("%s: %v", c.name, err)
			}
			continue
		}
		var es scenario.Errors
		if !errors.As(err, &es) || len(es) == 0 {
			t.Errorf("%s: want a field error, got %v", c.name, err)
			continue
		}
		if es[0].Field != c.field || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %q; want field %q with %q", c.name, es.Error(), c.field, c.says)
		}
	}
}

// TestDecimalGrammar checks the CSV number grammar directly.
func TestDecimalGrammar(t *testing.T) {
	for _, ok := range []string{"0", "-1", "+2.5", ".5", "5.", "1e3", "1E-3", "-0.25e+2"} {
		if _, err := motion.ParseCSV(strings.NewReader("time_s,x_m\n0,0\n1," + ok + "\n")); err != nil {
			t.Errorf("%q: %v", ok, err)
		}
	}
	for _, bad := range []string{"0x10", "0x1p-2", "1_0", "inf", "NaN", "1e", "e3", "--1", "1.2.3", "0b1", "１"} {
		if _, err := motion.ParseCSV(strings.NewReader("time_s,x_m\n0,0\n1," + bad + "\n")); err == nil {
			t.Errorf("%q was read as a number", bad)
		}
	}
}
