package browsertest

import (
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"swaysheet/core/clearance"
)

// TestRopeStrikeShown: the example where the hoist rope, not the load,
// strikes a lower crane's tower: the verdict band and the obstacle's own
// verdict say that it is struck, by its rope, and which line struck
// first (the hoist rope) and when, in the units shown; the strike rows
// are the obstacle's.
func TestRopeStrikeShown(t *testing.T) {
	h := setupFor(t, 8*time.Minute)
	h.do(chromedp.EmulateViewport(820, 1180))
	h.openExample("hoist rope past a lower crane")
	h.siteSettled()
	rep := h.pageReport()
	if o := rep.Obstacles[0]; o.Strikes == 0 || o.FirstStrikeBy != clearance.StruckByRope || o.FirstStrikeLine != "hoist rope" {
		t.Fatalf("the page's report: strikes %d, first by %q %q", o.Strikes, o.FirstStrikeBy, o.FirstStrikeLine)
	}
	for _, sys := range []string{"si", "us"} {
		if sys == "us" {
			h.click("#sys-us")
			h.settle()
		}
		unit := map[string]string{"si": " m", "us": " ft"}[sys]
		got := h.clearanceList(unit)
		band := h.text("#clearance-verdict")
		if !strings.Contains(band, "DOES NOT CLEAR") || !strings.Contains(band, "first by the hoist rope, ") || !strings.Contains(band, unit+" up") {
			t.Errorf("%s: verdict band %q", sys, band)
		}
		if v := got[0]["verdict"].(string); !strings.Contains(v, "struck in") || !strings.Contains(v, "its rope") || !strings.Contains(v, "first by the hoist rope") {
			t.Errorf("%s: the tower's verdict %q", sys, v)
		}
		if _, ok := got[0]["rows"].(map[string]any)["share_strike"]; !ok {
			t.Errorf("%s: no strike share row", sys)
		}
		h.centreOf("#clearance-verdict")
		shot(h, "rope-strike-verdict-"+sys+".png")
		h.centreOf("#clearance-figures")
		shot(h, "rope-strike-figures-"+sys+".png")
	}
}
