package browsertest

import (
	"encoding/json"
	"math"
	"strings"
	"testing"
	"time"

	"swaysheet/core/draws"
	"swaysheet/core/figures"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// TestSpreadOverLikelyRuns: asked, the page runs the lift over seeded
// draws split over its workers and shows the percentiles of the crew's
// figures; they are those of the Go core's own draws of the same scenario,
// request and seed (core/draws Run, figures.PresentSpread), to the last
// bit and in the same words. A spread out of range is named at its field,
// with its range in the units shown (and in US units nothing in the
// section is said in SI).
// New inputs mark the answer as for earlier ones and stop runs going. Not
// timed (the page bench has the 1,000-run row).
func TestSpreadOverLikelyRuns(t *testing.T) {
	h := setup(t)
	h.openExample("girder on the overhead crane")
	h.waitFor(`!!document.querySelector('#spread-runs')`, "the spread's fields")
	h.typeInto("#spread-runs", "120")
	h.typeInto("#spread-seed", "5")
	h.typeInto("#spread-spread-rope_length_m", "0.4")
	h.click("#spread-run")
	if err := h.poll(`document.getElementById('spread-out').dataset.state === 'done'`, 2*time.Minute); err != nil {
		t.Fatalf("no spread shown: %v (%s)", err, h.text("#spread-out"))
	}

	var req draws.Request
	if err := json.Unmarshal([]byte(eval[string](h, `JSON.stringify(window.swaysheetSpread.request())`)), &req); err != nil {
		t.Fatal(err)
	}
	if req.Runs != 120 || req.Seed != 5 || req.Spread.RopeLengthM != 0.4 || req.Spread.PressS != 0.2 {
		t.Fatalf("request %+v", req)
	}
	s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	native, err := draws.Run(s, req, 0)
	if err != nil {
		t.Fatal(err)
	}
	want := figures.PresentSpread(s, req, native, units.Choice{System: "si"})
	var got figures.Spread
	if err := json.Unmarshal([]byte(eval[string](h, `JSON.stringify(window.swaysheetSpread.shown())`)), &got); err != nil {
		t.Fatal(err)
	}
	if got.Runs != 120 || len(got.Rows) != len(want.Rows) || got.Spreads != want.Spreads || got.Limits != want.Limits {
		t.Fatalf("shown %+v\nnative %+v", got, want)
	}
	for i, w := range want.Rows {
		g := got.Rows[i]
		for _, p := range []struct {
			name string
			g, w figures.Row
		}{{"p50", g.P50, w.P50}, {"p90", g.P90, w.P90}, {"p95", g.P95, w.P95}, {"max", g.Max, w.Max}} {
			if p.g.ValueSI != p.w.ValueSI {
				t.Errorf("%s %s: page %v, native %v", w.Key, p.name, p.g.ValueSI, p.w.ValueSI)
			}
			cell := h.text(`#spread-out tr[data-key="` + w.Key + `"] td.` + p.name)
			if want := p.w.Text + " " + w.Unit; cell != want {
				t.Errorf("%s %s shows %q, native %q", w.Key, p.name, cell, want)
			}
		}
		if line, want := h.text(`#spread-out li[data-key="`+w.Key+`"]`), strings.TrimSpace(w.Words+" "+w.LimitWords); line != want {
			t.Errorf("%s reads %q, native %q", w.Key, line, want)
		}
	}
	if math.IsNaN(got.Rows[0].P95.ValueSI) || got.Rows[0].P95.ValueSI <= got.Rows[0].P50.ValueSI {
		t.Errorf("the largest swing does not spread: %+v", got.Rows[0])
	}
	if used := h.text("#spread-out .spread-used"); used != want.Spreads {
		t.Errorf("spread stated %q, want %q", used, want.Spreads)
	}
	eval[bool](h, `(document.getElementById('spread').scrollIntoView(), true)`)
	shot(h, "spread-over-likely-runs.png")
	if bad := h.axe(); len(bad) > 0 {
		t.Errorf("axe: %v", bad)
	}

	// A spread out of the core's range: its message at the field.
	h.typeInto("#spread-spread-rope_length_m", "60")
	h.click("#spread-run")
	if err := h.poll(`document.getElementById('spread-out').dataset.state !== 'going' && document.querySelector('#spread-form [data-field="draws.spread.rope_length_m"] .msg').textContent !== ''`, time.Minute); err != nil {
		t.Fatalf("no message at the rope's spread: %v", err)
	}
	if msg := h.text(`#spread-form [data-field="draws.spread.rope_length_m"] .msg`); !strings.Contains(msg, "is 60.00 m: accepted from 0.00 m up to 50.00 m") {
		t.Errorf("rope spread 60 m: %q", msg)
	}
	h.typeInto("#spread-spread-rope_length_m", "0.4")

	// In US units: the answer shown again in feet, and a spread out of
	// range said in feet (50 m = 164.04 ft, ft = 0.3048 m, NIST SP 811;
	// said rounded down to the 0.05 ft step), no SI unit anywhere in the
	// section.
	h.click("#sys-us")
	h.settle()
	h.waitFor(`document.querySelector('#spread-out .spread-used').textContent.indexOf(' ft') >= 0`, "the spread in feet")
	noSI := func(when string) {
		for _, sel := range []string{"#spread-out", "#spread-form"} {
			if txt := h.text(sel); siAfterNumber.MatchString(txt) {
				t.Errorf("%s, US view: %s shows %q", when, sel, siAfterNumber.FindString(txt))
			}
		}
	}
	noSI("the answer")
	h.typeInto("#spread-spread-rope_length_m", "200")
	h.click("#spread-run")
	if err := h.poll(`document.getElementById('spread-out').dataset.state !== 'going' && document.querySelector('#spread-form [data-field="draws.spread.rope_length_m"] .msg').textContent !== ''`, time.Minute); err != nil {
		t.Fatalf("no message at the rope's spread in feet: %v", err)
	}
	if msg := h.text(`#spread-form [data-field="draws.spread.rope_length_m"] .msg`); msg != "is 200.00 ft: accepted from 0.00 ft up to 164.00 ft" {
		t.Errorf("rope spread 200 ft: %q", msg)
	}
	noSI("a spread out of range")
	h.typeInto("#spread-spread-rope_length_m", "1.3")
	h.click("#sys-si")
	h.settle()

	// New inputs: the spread shown is said to be of earlier ones.
	h.typeInto("#f-load-rope_length_m", "9")
	h.settle()
	if st := eval[string](h, `document.getElementById('spread-out').dataset.state`); st != "stale" {
		t.Errorf("after new inputs the spread is %q, want stale", st)
	}

	// Runs going when the inputs change are stopped.
	h.typeInto("#spread-runs", "50000")
	h.click("#spread-run")
	h.waitFor(`window.swaysheetSpread.state().going && !document.getElementById('spread-progress').hidden`, "runs going")
	h.typeInto("#f-load-rope_length_m", "8.5")
	h.settle()
	if err := h.poll(`!window.swaysheetSpread.state().going && document.getElementById('spread-progress').hidden && window.swaysheetSpread.state().done < 50000`, 30*time.Second); err != nil {
		t.Errorf("runs of earlier inputs not stopped: %+v", eval[map[string]any](h, `window.swaysheetSpread.state()`))
	}
}
