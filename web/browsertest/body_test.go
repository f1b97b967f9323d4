package browsertest

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// The rigid load's inputs (body-form.js): opening the bay girder example
// shows its sling legs; a new leg length goes into the scenario and the
// results are the core's for it (every row compared with figures.Present,
// the period named as the rigid load's first mode); a value out of range
// and legs that cannot reach the hook show the core's own message at the
// field.
func TestBodyForm(t *testing.T) {
	h := setup(t)
	h.openExample("girder as a rigid load")
	leg := "#f-load-body-legs-0-length_m"
	if !eval[bool](h, `document.getElementById('body-on').checked`) || h.value(leg) != "5.831" {
		t.Fatalf("rigid load inputs not shown: ticked %v, leg 1 %q", eval[bool](h, `document.getElementById('body-on').checked`), h.value(leg))
	}
	before := eval[float64](h, `window.swaysheet.resultCount()`)
	h.typeInto(leg, "6.2")
	h.settle()
	legs := h.scenario()["load"].(map[string]any)["body"].(map[string]any)["legs"].([]any)
	if got := legs[0].(map[string]any)["length_m"]; got != 6.2 {
		t.Fatalf("leg 1 in the scenario: %v", got)
	}
	if eval[float64](h, `window.swaysheet.resultCount()`) <= before {
		t.Error("no new result after the leg length changed")
	}
	r := h.core()
	if r.Body == nil || r.Body.RestTiltDeg <= 0 {
		t.Fatalf("the core's result for unequal legs: %+v", r.Body)
	}
	h.checkShown(r)
	if p := h.text(`#engineering [data-key="period_s"]`); !strings.Contains(p, "first mode of the rigid load") {
		t.Errorf("period's technical name on the page: %q", p)
	}

	for _, c := range []struct{ typed, want string }{
		{"500", ""},           // the range, from the core's validation
		{"1", "cannot reach"}, // the geometry, from the core's evaluation
	} {
		h.typeInto(leg, c.typed)
		h.settle()
		want := c.want
		if want == "" {
			s, err := scenario.Parse([]byte(eval[string](h, `window.swaysheet.scenarioJSON()`)))
			var fe scenario.Errors
			if s != nil || !errors.As(err, &fe) || fe[0].Field != "load.body.legs[0].length_m" {
				t.Fatalf("%s m: the core reads %v", c.typed, err)
			}
			want = fe[0].Message
		}
		msg := h.text(`[data-field="load.body.legs[0].length_m"] .msg`)
		if !strings.Contains(strings.ToLower(msg), strings.ToLower(want)) || !eval[bool](h, `document.querySelector('`+leg+`').getAttribute('aria-invalid') === 'true'`) {
			t.Errorf("%s m: the field shows %q, the core says %q", c.typed, msg, want)
		}
	}

	// Hung from a spreader instead: its fields replace the legs, and the
	// results are the core's again.
	eval[bool](h, `(function(){var e=document.getElementById('body-hung');e.value='spreader';e.dispatchEvent(new Event('change',{bubbles:true}));return true;})()`)
	h.settle()
	body := h.scenario()["load"].(map[string]any)["body"].(map[string]any)
	if _, legs := body["legs"]; legs || body["spreader"] == nil || h.value("#f-load-body-spreader-spacing_m") == "" {
		t.Fatalf("after choosing a spreader: %v", body)
	}
	h.checkShown(h.core())

	// Two hook ropes (a tandem lift): their fields replace the spreader's;
	// rope 2's own length goes into the scenario, and the results (each
	// rope's pull among them) are the core's.
	eval[bool](h, `(function(){var e=document.getElementById('body-hung');e.value='tandem';e.dispatchEvent(new Event('change',{bubbles:true}));return true;})()`)
	h.settle()
	rope := "#f-load-body-tandem-ropes-1-length_m"
	h.typeInto(rope, "5.2")
	h.settle()
	body = h.scenario()["load"].(map[string]any)["body"].(map[string]any)
	tandem, _ := body["tandem"].(map[string]any)
	if _, sp := body["spreader"]; sp || tandem == nil || tandem["ropes"].([]any)[1].(map[string]any)["length_m"] != 5.2 {
		t.Fatalf("after choosing two hook ropes: %v", body)
	}
	r = h.core()
	if r.Body == nil || r.Body.Suspension != "two ropes" {
		t.Fatalf("the core's result for two hook ropes: %+v", r.Body)
	}
	h.checkShown(r)
	if p := h.text(`[data-key="body.legs[1].tension_max_n"]`); p == "" {
		t.Error("rope 2's largest pull not shown")
	}
}
