package browsertest

import (
	"strings"
	"testing"
)

// TestPeakTiltLimitField: the limits form has the rigid load's tilt limit
// (limits.peak_tilt_deg, typed in by hand in form.js); the panel example's
// 5 deg shows there and its tilt row says within; 1 deg typed in makes
// the row and the verdict OUTSIDE (the core's words, as the figures call
// gives them). The spreader's legs are named spreader legs.
func TestPeakTiltLimitField(t *testing.T) {
	h := setup(t)
	h.openExample("wall panel on a spreader beam")
	// The legs under the spreader are spreader legs in the figures and
	// the form (sway.LegName); the figures never say sling legs.
	if f, b := h.text("#figures"), h.text("#body-form"); !strings.Contains(f, "largest pull in a spreader leg") || strings.Contains(f, "sling leg") ||
		!strings.Contains(b, "Spacing of the two spreader legs") {
		t.Errorf("the spreader's legs: figures %q; form %q", f, b)
	}
	if v := h.value("#f-limits-peak_tilt_deg"); v != "5" {
		t.Errorf("tilt limit field shows %q, want 5", v)
	}
	row := `#figures [data-key="body.peak_tilt_deg"] .check`
	if got := h.text(row); !strings.Contains(got, "within the limit of 5.0 deg") {
		t.Errorf("tilt row at 5 deg: %q", got)
	}
	h.typeInto("#f-limits-peak_tilt_deg", "1")
	h.settle()
	if got := h.text(row); !strings.Contains(got, "OUTSIDE the limit of 1.0 deg") {
		t.Errorf("tilt row at 1 deg: %q", got)
	}
	if got := h.text("#verdict"); !strings.Contains(got, "largest tilt of the load") {
		t.Errorf("verdict at 1 deg: %q", got)
	}
}
