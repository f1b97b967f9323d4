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
