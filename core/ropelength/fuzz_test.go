package ropelength

import (
	"encoding/json"
	"testing"
)

// FuzzParse: no input gives a panic, or a result that cannot be encoded
// (NaN or Inf) without an error.
func FuzzParse(f *testing.F) {
	for _, s := range []string{
		`{"timed": {"swings": 10, "time_s": 86, "amplitude_deg": 5}}`,
		`{"heights": {"sheave_height_m": 32.5, "hook_height_m": 14, "sling_depth_m": 3, "centre_depth_m": 0.5}, "timed": {"swings": 5, "time_s": 47}}`,
		`{"timed": {"swings": 5, "time_s": 40, "amplitude_deg": 30}, "hook": {"mass_kg": 1500, "load_mass_kg": 3000, "rigging_length_m": 4}}`,
		`{"heights": {"sheave_height_m": 30, "hook_height_m": 12, "sling_depth_m": 2}, "hook": {"mass_kg": 500, "load_mass_kg": 2000}}`,
		`{"timed": {"swings": 5, "time_s": 32.65, "amplitude_deg": 10}, "load": {"mass_kg": 7200, "body": {"length_m": 13, "width_m": 0.5, "height_m": 1, "hook_mass_kg": 250, "legs": [{"length_m": 5.831, "attach_x_m": 5, "attach_z_m": 0.5}, {"length_m": 5.831, "attach_x_m": -5, "attach_z_m": 0.5}]}}}`,
		`{"heights": {"sheave_height_m": 12, "hook_height_m": 8}, "load": {"mass_kg": 9000, "body": {"length_m": 8, "width_m": 0.2, "height_m": 3, "spreader": {"spacing_m": 6}}}}`,
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		r, err := Parse(data)
		if err != nil {
			return
		}
		if _, err := json.Marshal(r); err != nil {
			t.Fatalf("%s: result not encodable: %v", data, err)
		}
	})
}
