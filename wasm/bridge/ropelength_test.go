package bridge

import (
	"encoding/json"
	"math"
	"testing"

	"swaysheet/core/units"
)

// The ropelength call answers a timed swing and names bad fields.
func TestRopeLengthCall(t *testing.T) {
	var r struct {
		Result struct {
			RopeLengthM float64 `json:"rope_length_m"`
		} `json:"result"`
	}
	out := Call(nil, "ropelength", []byte(`{"timed": {"swings": 10, "time_s": 86}}`))
	if err := json.Unmarshal(out, &r); err != nil {
		t.Fatal(err)
	}
	// Small swing: L = g*(T/(2*pi))^2 (T = 2*pi*sqrt(L/g), handbook formula).
	if want := units.StandardGravity * math.Pow(8.6/(2*math.Pi), 2); math.Abs(r.Result.RopeLengthM-want) > 1e-12 {
		t.Errorf("rope length %v m, want %v m (%s)", r.Result.RopeLengthM, want, out)
	}
	for in, field := range map[string]string{
		`{"timed": {"swings": 0, "time_s": 86}}`:          "timed.swings",
		`{"timed": {"swings": "ten", "time_s": 86}}`:      "timed.swings",
		`{"timed": {"swings": 10, "time_s": 86}, "x": 1}`: "(input)",
		`{"timed": `: "(input)",
	} {
		var e errReply
		if err := json.Unmarshal(Call(nil, "ropelength", []byte(in)), &e); err != nil || e.Error == nil ||
			len(e.Error.Fields) == 0 || e.Error.Fields[0].Field != field {
			t.Errorf("%s: want an error on %s, got %+v", in, field, e.Error)
		}
	}
}
