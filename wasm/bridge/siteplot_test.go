package bridge

import (
	"encoding/json"
	"os"
	"strings"
	"testing"

	"swaysheet/core/clearance"
)

// The page's site plan: drawn by the core from the kept report (found by
// the checked scenario's fingerprint), or from a report given, with the
// transform that maps the drawing back to metres; no check is run.
func TestSitePlotCall(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/site-bay-columns.json")
	if err != nil {
		t.Fatal(err)
	}
	var sc map[string]any
	json.Unmarshal(data, &sc)
	sc["site"].(map[string]any)["spread"].(map[string]any)["runs"] = 20
	small, _ := json.Marshal(sc)
	resultOf(t, "evaluate", small) // the memo's evaluation gives the crane's path
	var rep clearance.Report
	if err := json.Unmarshal(resultOf(t, "clearance", small), &rep); err != nil {
		t.Fatal(err)
	}
	in := `{"scenario":` + string(small) + `,"units":{},"system":"si","width_px":390,"selected":1}`
	var r SitePlotReply
	if err := json.Unmarshal(resultOf(t, "site_plot", []byte(in)), &r); err != nil {
		t.Fatal(err)
	}
	if !r.Envelopes || strings.Count(r.SVG, `class="obstacle`) != 4 || !strings.Contains(r.SVG, `class="obstacle selected" data-ob="1"`) ||
		!strings.Contains(r.SVG, `class="env95"`) || !strings.Contains(r.SVG, `class="crane-path"`) || !strings.Contains(r.SectionSVG, `class="obstacle-side"`) {
		t.Errorf("plan: envelopes %v, svg %.300s…, section %.100s…", r.Envelopes, r.SVG, r.SectionSVG)
	}
	// Text at least 12 px at 390 px wide: the viewBox is as wide.
	if r.Frame.WidthPx != 390 || !strings.Contains(r.SVG, `viewBox="0 0 390.0 `) || strings.Contains(r.SVG, `font-size="8"`) {
		t.Errorf("frame %+v", r.Frame)
	}
	// Every obstacle's corners fall inside the plot, and map back.
	for _, o := range r.Outlines {
		for _, p := range o {
			px, py := (p.X-r.Frame.XM)/r.Frame.MPerPx, (r.Frame.YM-p.Y)/r.Frame.MPerPx
			if px < 50 || px > r.Frame.WidthPx || py < 0 || py > r.Frame.HeightPx {
				t.Errorf("corner %+v drawn at %g, %g", p, px, py)
			}
		}
	}
	// A frame given is kept; another scenario's report is not found.
	fr, _ := json.Marshal(r.Frame)
	other := strings.Replace(string(small), `"runs":20`, `"runs":21`, 1)
	in = `{"scenario":` + string(small) + `,"report_for":` + other + `,"width_px":390,"frame":` + string(fr) + `}`
	var r2 SitePlotReply
	if err := json.Unmarshal(resultOf(t, "site_plot", []byte(in)), &r2); err != nil {
		t.Fatal(err)
	}
	if r2.Envelopes || r2.Frame != r.Frame || r2.SectionSVG != "" {
		t.Errorf("other report: envelopes %v, frame %+v", r2.Envelopes, r2.Frame)
	}
	// A report given is drawn.
	rb, _ := json.Marshal(rep)
	in = `{"scenario":` + string(small) + `,"report_for":` + other + `,"report":` + string(rb) + `,"width_px":800}`
	var r3 SitePlotReply
	if err := json.Unmarshal(resultOf(t, "site_plot", []byte(in)), &r3); err != nil || !r3.Envelopes || r3.Frame.WidthPx != 800 {
		t.Errorf("report given: %v, %v, %+v", err, r3.Envelopes, r3.Frame)
	}
	bay, _ := os.ReadFile("../../testdata/scenarios/bay-travel.json")
	if out := string(Call(nil, "site_plot", []byte(`{"scenario":`+string(bay)+`}`))); !strings.Contains(out, `"field":"site"`) {
		t.Errorf("no site block: %s", out)
	}
}

// resultOf is a call's result JSON; the test fails on an error reply.
func resultOf(t *testing.T, name string, in []byte) []byte {
	t.Helper()
	var r struct {
		Result json.RawMessage `json:"result"`
		Error  *Error          `json:"error"`
	}
	if err := json.Unmarshal(Call(nil, name, in), &r); err != nil || r.Error != nil {
		t.Fatalf("%s: %v %+v", name, err, r.Error)
	}
	return r.Result
}
