package browsertest

import (
	"strconv"
	"strings"
	"testing"
)

// choose picks a value in a select of the form as a person does (a
// change event).
func (h *harness) choose(id, value string) {
	h.t.Helper()
	eval[bool](h, `(function () { var e = document.getElementById(`+strconv.Quote(id)+`); e.value = `+strconv.Quote(value)+`;
		e.dispatchEvent(new Event('change', { bubbles: true })); return true; })()`)
	h.settle()
}

// TestAxisKinds: the form's fields follow the kind of the axis chosen
// (state.js AXES, after core/crane): a move switched to the slew gets the
// degree fields with the slew's words, and back to a travel the metre
// fields; a plan switched to the slew gets its degree fields and the hook
// radius it needs, and the core plans it.
func TestAxisKinds(t *testing.T) {
	h := setup(t)
	move := `JSON.parse(window.swaysheet.scenarioJSON()).motions[0]`
	h.choose("f-motions-0-axis", "slew")
	if !eval[bool](h, `(function (m) { return m.axis === 'slew' && m.angle_deg === 90 && m.distance_m === undefined && m.speed_m_per_s === undefined; })(`+move+`)`) {
		t.Errorf("move switched to the slew: %s", eval[string](h, `JSON.stringify(`+move+`)`))
	}
	if got := h.text(`label[for="f-motions-0-angle_deg"]`); got != "Slew angle" {
		t.Errorf("slew move's angle labelled %q", got)
	}
	h.choose("f-motions-0-axis", "travel_y")
	if !eval[bool](h, `(function (m) { return m.axis === 'travel_y' && m.distance_m === 10 && m.angle_deg === undefined; })(`+move+`)`) {
		t.Errorf("move switched back to a travel: %s", eval[string](h, `JSON.stringify(`+move+`)`))
	}

	h.click("#plan-on")
	h.settle()
	before := eval[int](h, `window.swaysheetPlan.count()`)
	h.choose("f-plan-axis", "slew")
	plan := `JSON.parse(window.swaysheet.scenarioJSON())`
	if !eval[bool](h, `(function (s) { return s.plan.angle_deg === 90 && s.plan.top_rate_deg_per_s === 3.6 && s.plan.distance_m === undefined && s.crane.radius_m > 0; })(`+plan+`)`) {
		t.Errorf("plan switched to the slew: %s", eval[string](h, `JSON.stringify(`+plan+`)`))
	}
	if got := h.text(`label[for="f-plan-top_rate_deg_per_s"]`); got != "Top slew rate" {
		t.Errorf("top rate labelled %q", got)
	}
	if eval[int](h, `document.querySelectorAll('#f-plan-radius').length`) != 1 {
		t.Error("no hook radius in the slew plan's fields")
	}
	h.click("#plan-run")
	h.planSettled(before)
	if w := h.corePlan(); w.AngleDeg != 90 || h.text("#plan-summary") == "" {
		t.Errorf("slew plan: core angle %g, summary %q", w.AngleDeg, h.text("#plan-summary"))
	}
}

// TestSineRampMove: the move form offers the sine ramp (motion.SineRamp)
// beside the trapezoid; choosing it sets the move's profile and keeps its
// fields, the acceleration's hint says it is the largest, the figures
// shown are the core's for that scenario, and axe-core finds nothing.
func TestSineRampMove(t *testing.T) {
	h := setup(t)
	move := `JSON.parse(window.swaysheet.scenarioJSON()).motions[0]`
	h.choose("f-motions-0-profile", "sine_ramp")
	if !eval[bool](h, `(function (m) { return m.profile === 'sine_ramp' && m.distance_m > 0 && m.accel_m_per_s2 > 0; })(`+move+`)`) {
		t.Errorf("move switched to the sine ramp: %s", eval[string](h, `JSON.stringify(`+move+`)`))
	}
	if got := h.value("#f-motions-0-profile"); got != "sine_ramp" {
		t.Errorf("profile shown %q after the form was drawn again", got)
	}
	if hint := h.text(`[data-field="motions[0].accel_m_per_s2"]`); !strings.Contains(hint, "the largest") {
		t.Errorf("acceleration field of a sine ramp says %q", hint)
	}
	h.checkShown(h.core())
	if bad := h.axe(); len(bad) > 0 {
		t.Errorf("the form with a sine ramp: axe-core finds:\n%s", strings.Join(bad, "\n"))
	}
	h.choose("f-motions-0-profile", "trapezoid")
	if got := eval[string](h, move+`.profile`); got != "trapezoid" {
		t.Errorf("move switched back: profile %q", got)
	}
}
