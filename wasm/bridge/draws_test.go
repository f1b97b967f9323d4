//go:build !nofetch

package bridge

import (
	"encoding/json"
	"testing"
)

func TestDrawsCall(t *testing.T) {
	in := []byte(`{"scenario": ` + string(readExample(t, DemoFile)) + `, "draws": {"runs": 6, "seed": 2, "spread": {"rope_length_m": 0.2, "press_s": 0.1}}}`)
	var r struct {
		Result *struct {
			Runs    int `json:"runs"`
			Summary struct {
				PeakSwingDeg struct{ P50, P95 float64 } `json:"peak_swing_deg"`
			} `json:"summary"`
			Figures struct {
				PeakSwingDeg []float64 `json:"peak_swing_deg"`
			} `json:"figures"`
		} `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "draws", in), &r); err != nil || r.Result == nil {
		t.Fatalf("draws: %v %s", err, Call(nil, "draws", in))
	}
	if r.Result.Runs != 6 || len(r.Result.Figures.PeakSwingDeg) != 6 || !(r.Result.Summary.PeakSwingDeg.P95 > 0) {
		t.Fatalf("got %+v", r.Result)
	}
	var e errReply
	bad := []byte(`{"scenario": ` + string(readExample(t, DemoFile)) + `, "draws": {"runs": 0}}`)
	if err := json.Unmarshal(Call(nil, "draws", bad), &e); err != nil || e.Error == nil || e.Error.Fields[0].Field != "draws.runs" {
		t.Fatalf("runs 0: %+v", e.Error)
	}
}
