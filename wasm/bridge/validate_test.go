package bridge

import (
	"encoding/json"
	"testing"

	"swaysheet/core/scenario"
)

// The validate call gives the fingerprint of the scenario as the core read
// it, the same as scenario.Fingerprint.
func TestValidateFingerprint(t *testing.T) {
	data := readExample(t, DemoFile)
	var r struct {
		Result Validation `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "validate", data), &r); err != nil {
		t.Fatal(err)
	}
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	want, err := scenario.Fingerprint(s)
	if err != nil {
		t.Fatal(err)
	}
	if !r.Result.Valid || r.Result.Fingerprint != want {
		t.Errorf("validate gave %+v, want the fingerprint %s", r.Result, want)
	}
}
