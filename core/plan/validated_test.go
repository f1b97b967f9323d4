package plan

import (
	"cmp"
	"encoding/json"
	"slices"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestMakeValidatedAgrees: planning a scenario scenario.Parse returned
// without validating it again (the bridge's plan call) gives the plan
// Make gives, byte for byte; without a plan block it is the same field
// error.
func TestMakeValidatedAgrees(t *testing.T) {
	for _, name := range []string{"plan-bay-travel.json", "plan-tower-slew.json", "plan-site-bay-columns.json"} {
		s := load(t, name)
		a, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		b, err := MakeValidated(s)
		if err != nil {
			t.Fatal(err)
		}
		ja, _ := json.Marshal(a)
		jb, _ := json.Marshal(b)
		if string(ja) != string(jb) {
			t.Errorf("%s: MakeValidated differs from Make", name)
		}
	}
	s := load(t, "bay-travel.json")
	_, e1 := Make(s)
	_, e2 := MakeValidated(s)
	var f1, f2 scenario.Errors
	if !asErrors(e1, &f1) || !asErrors(e2, &f2) || len(f1) != 1 || f1[0] != f2[0] || f1[0].Field != "plan" {
		t.Errorf("no plan block: %v against %v", e1, e2)
	}
}

func asErrors(err error, fe *scenario.Errors) bool {
	x, ok := err.(scenario.Errors)
	*fe = x
	return ok
}

// TestRampSearchOrder: the ramp search tries first the rope length where
// the last setting failed (rampOK); the settings it finds are those of
// the search that tries every rope length of every setting in grid order.
func TestRampSearchOrder(t *testing.T) {
	for _, name := range []string{"plan-tower-slew.json", "plan-bay-travel.json"} {
		for _, maxR := range []float64{0, 2} {
			fast := request1(t, name)
			got := fast.findRamp(maxR)
			all := request1(t, name)
			grid, ls, tmin, tmax := all.rampSearch()
			want := all.scanRamps(tmin, tmax, maxR, grid, ls, true).candidates
			if len(want) == 0 || !slices.Equal(sortedTotal(got.candidates), sortedTotal(want)) {
				t.Errorf("%s, rounding up to %g s: found %v, every length tried %v", name, maxR, got.candidates, want)
			}
		}
	}
}

// sortedTotal orders settings by ramp plus rounding, as findRamp does,
// then by ramp.
func sortedTotal(c [][2]float64) [][2]float64 {
	c = slices.Clone(c)
	slices.SortFunc(c, func(a, b [2]float64) int {
		if x, y := a[0]+a[1], b[0]+b[1]; x != y {
			return cmp.Compare(x, y)
		}
		return cmp.Compare(a[0], b[0])
	})
	return c
}

func request1(t *testing.T, name string) *request {
	rq, err := newRequest(load(t, name))
	if err != nil {
		t.Fatal(err)
	}
	rq.budget = sway.NewBudget(Work, budgetMessage)
	return rq
}
