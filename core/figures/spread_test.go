package figures

import (
	"strings"
	"testing"

	"swaysheet/core/draws"
	"swaysheet/core/internal/testscenario"
	"swaysheet/core/units"
)

// The spread over draws is presented as the table presents one value,
// with the runs beyond each limit counted from the draws themselves.
func TestPresentSpread(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	lim := 80.0
	s.Limits.ResidualSwingDeg = &lim // no run beyond it
	req := draws.Request{Runs: 40, Seed: 2, Spread: draws.Spread{RopeLengthM: 0.5, GustPct: 10}}
	res, err := draws.Run(s, req, 0)
	if err != nil {
		t.Fatal(err)
	}
	sh := PresentSpread(s, req, res, units.Choice{System: "si"})
	if sh.Runs != 40 || len(sh.Rows) != 4 {
		t.Fatalf("%+v", sh)
	}
	for _, r := range sh.Rows {
		want, _ := presentValue(s, r.Key, r.P95.ValueSI, units.Choice{System: "si"})
		if r.P95.Text != want.Text || r.Crew != want.Crew || r.Unit != want.Unit {
			t.Errorf("%s: %+v, the table gives %+v", r.Key, r.P95, want)
		}
		over := 0
		var v []float64
		switch r.Key {
		case "peak_swing_deg":
			v = res.Figures.PeakSwingDeg
		case "residual_swing_deg":
			v = res.Figures.ResidualSwingDeg
		}
		for _, x := range v {
			if r.Check != nil && x > r.Check.LimitSI {
				over++
			}
		}
		if v != nil && over != r.Over {
			t.Errorf("%s: %d runs over, counted %d", r.Key, r.Over, over)
		}
	}
	if w := sh.Rows[2].LimitWords; w != "Within the lift plan's limit of 80.0 deg in all 40 runs." {
		t.Errorf("residual swing: %q", w)
	}
	for _, want := range []string{"rope length 0.50 m", "depth of the load's centre none", "gust strength none (no wind in the scenario)", "Seed 2:"} {
		if !strings.Contains(sh.Spreads, want) {
			t.Errorf("spread stated %q, lacks %q", sh.Spreads, want)
		}
	}
	if count(1234567) != "1,234,567" || count(999) != "999" {
		t.Error("count")
	}
}
