package scenario

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

const good = `{
  "format": "swaysheet-scenario", "version": 1, "name": "t",
  "load": {"mass_kg": 1000, "rope_length_m": 8},
  "motions": [{"axis": "travel_x", "distance_m": 10, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3}]
}`

func TestGoodScenarioDecodes(t *testing.T) {
	s, err := Parse([]byte(good))
	if err != nil {
		t.Fatal(err)
	}
	if *s.Load.MassKg != 1000 || len(s.Motions) != 1 {
		t.Fatalf("decoded %+v", s)
	}
}

// Each kind of bad input gets a message that names the field and, for
// numbers, the accepted range.
func TestBadInputMessages(t *testing.T) {
	cases := []struct {
		name, edit, field, want string
	}{
		{"unknown field", `"name": "t",`, "colour", "unknown field"},
		{"missing mass", `"mass_kg": 1000,`, "load.mass_kg", "is required: accepted from 0.1 up to 2e+06 kg"},
		{"negative rope", `"rope_length_m": 8`, "load.rope_length_m", "-3 is out of range: accepted from 0.3 up to 500 m"},
		{"zero rope", `"rope_length_m": 8`, "load.rope_length_m", "0 is out of range"},
		{"zero mass", `"mass_kg": 1000,`, "load.mass_kg", "0 is out of range"},
		{"absurd acceleration", `"accel_m_per_s2": 0.3`, "motions[0].accel_m_per_s2", "50 is out of range: accepted from 0.001 up to 5 m/s²"},
		{"zero speed", `"speed_m_per_s": 0.5`, "motions[0].speed_m_per_s", "0 is out of range: accepted from 0.001 up to 10 m/s"},
		{"bad axis", `"axis": "travel_x"`, "motions[0].axis", `is "sideways": accepted`},
		{"slew fields on travel", `"axis": "travel_x"`, "motions[0].angle_deg", "does not apply here"},
		{"wrong type", `"mass_kg": 1000,`, "load.mass_kg", "expected a number, found a JSON string"},
		{"wrong format", `"format": "swaysheet-scenario"`, "format", "a scenario file has format"},
		{"future version", `"version": 1`, "version", "2 is not supported"},
		{"bad accuracy", `"name": "t",`, "settings.accuracy", `accepted "default" or "tight"`},
		{"wind both ways", `"name": "t",`, "wind.force_n", "not both"},
		{"wind speed without area", `"name": "t",`, "load.area_m2", "is required when the wind is given as a speed"},
	}
	replace := map[string]string{
		"unknown field":           `"name": "t", "colour": "red",`,
		"missing mass":            ``,
		"negative rope":           `"rope_length_m": -3`,
		"zero rope":               `"rope_length_m": 0`,
		"zero mass":               `"mass_kg": 0,`,
		"absurd acceleration":     `"accel_m_per_s2": 50`,
		"zero speed":              `"speed_m_per_s": 0`,
		"bad axis":                `"axis": "sideways"`,
		"slew fields on travel":   `"axis": "travel_x", "angle_deg": 30`,
		"wrong type":              `"mass_kg": "heavy",`,
		"wrong format":            `"format": "something-else"`,
		"future version":          `"version": 2`,
		"bad accuracy":            `"name": "t", "settings": {"accuracy": "best"},`,
		"wind both ways":          `"name": "t", "wind": {"force_n": 10, "speed_m_per_s": 5, "shape_factor": 1},`,
		"wind speed without area": `"name": "t", "wind": {"speed_m_per_s": 5, "shape_factor": 1.2},`,
	}
	for _, c := range cases {
		in := strings.Replace(good, c.edit, replace[c.name], 1)
		_, err := Parse([]byte(in))
		es, ok := err.(Errors)
		if !ok {
			t.Errorf("%s: want field errors, got %v", c.name, err)
			continue
		}
		found := false
		for _, e := range es {
			if e.Field == c.field && strings.Contains(e.Message, c.want) {
				found = true
			}
		}
		if !found {
			t.Errorf("%s: want %s: ...%s..., got %v", c.name, c.field, c.want, es)
		}
	}
}

func TestMalformedFiles(t *testing.T) {
	for in, want := range map[string]string{
		``:                         "the file is empty",
		`{"format": `:              "ends in the middle",
		`{"format": "x"} {}`:       "more after the scenario",
		`[1, 2]`:                   "expected",
		`{"format": "swa` + "\x00": "not valid JSON",
	} {
		_, err := Parse([]byte(in))
		if err == nil || !strings.Contains(err.Error(), want) {
			t.Errorf("%q: want %q, got %v", in, want, err)
		}
	}
	big := bytes.Repeat([]byte(" "), MaxFileBytes+1)
	if _, err := Parse(big); err == nil || !strings.Contains(err.Error(), "larger than") {
		t.Errorf("large file: %v", err)
	}
}

// Every range in the table is used by Validate and every example decodes;
// the examples survive an encode/decode round trip unchanged.
func TestExamplesRoundTrip(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	if len(files) < 6 {
		t.Fatalf("want at least six example scenarios, have %d", len(files))
	}
	for _, name := range files {
		data, err := os.ReadFile(name)
		if err != nil {
			t.Fatal(err)
		}
		s, err := Parse(data)
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		var buf bytes.Buffer
		if err := Encode(&buf, s); err != nil {
			t.Fatal(err)
		}
		s2, err := Parse(buf.Bytes())
		if err != nil {
			t.Fatalf("%s: re-decode: %v", name, err)
		}
		a, _ := json.Marshal(s)
		b, _ := json.Marshal(s2)
		if !bytes.Equal(a, b) {
			t.Errorf("%s: round trip changed the scenario", name)
		}
	}
}

// The schema file is valid JSON and names every top-level field of the
// format.
func TestSchemaCoversFields(t *testing.T) {
	data, err := os.ReadFile("schema.json")
	if err != nil {
		t.Fatal(err)
	}
	var sch struct {
		Properties map[string]json.RawMessage `json:"properties"`
	}
	if err := json.Unmarshal(data, &sch); err != nil {
		t.Fatal(err)
	}
	for _, f := range []string{"format", "version", "name", "load", "crane", "motions", "wind", "initial", "limits", "settings", "sheet"} {
		if _, ok := sch.Properties[f]; !ok {
			t.Errorf("schema lacks %q", f)
		}
	}
}

// Near a horizontal rope a modest horizontal velocity means a huge speed
// along the arc; the whole speed is bounded.
func TestInitialSpeedAlongTheArcBounded(t *testing.T) {
	in := strings.Replace(good, `"name": "t",`, `"name": "t", "initial": {"swing_deg": 89, "velocity_x_m_per_s": 5},`, 1)
	_, err := Parse([]byte(in))
	if err == nil || !strings.Contains(err.Error(), "initial.velocity_x_m_per_s: with the rope at 89 deg") {
		t.Fatalf("got %v", err)
	}
	in = strings.Replace(good, `"name": "t",`, `"name": "t", "initial": {"swing_deg": 10, "velocity_y_m_per_s": 3},`, 1)
	if _, err := Parse([]byte(in)); err != nil {
		t.Fatalf("sideways push at 10 deg: %v", err)
	}
}
