package plan

import (
	"encoding/json"
	"strings"
	"testing"

	"swaysheet/core/crane"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestAxisFromCraneOnly follows DEVELOPERS.md's recipe for a crane type
// with its first step alone: two axes added to core/crane's table (a
// second travel and a second slew, on the existing roles, so the
// geometry is the one there). Validation, the model's build and the
// planner take them with no other change: each plan is that of the axis
// it copies, move for move, apart from the axis' name.
func TestAxisFromCraneOnly(t *testing.T) {
	saved := crane.Axes
	defer func() { crane.Axes = saved }()
	crane.Axes = append(append([]crane.Axis{}, saved...),
		crane.Axis{Name: "runway_2", Words: "second runway", Kind: crane.Linear, Role: crane.AlongX, Plannable: true},
		crane.Axis{Name: "turn_2", Words: "second slew", Kind: crane.Angular, Role: crane.Turn, Plannable: true, Needs: "crane.radius_m"})

	for _, c := range []struct{ file, from, to string }{
		{"plan-bay-travel.json", "travel_x", "runway_2"},
		{"plan-tower-slew.json", "slew", "turn_2"},
	} {
		s := load(t, c.file)
		want, err := Make(s)
		if err != nil {
			t.Fatal(err)
		}
		s.Plan.Axis = c.to
		for i := range s.Motions {
			if s.Motions[i].Axis == c.from {
				s.Motions[i].Axis = c.to
			}
		}
		got, err := Make(s)
		if err != nil {
			t.Fatalf("%s on %s: %v", c.file, c.to, err)
		}
		a, _ := json.Marshal(want)
		b, _ := json.Marshal(got)
		if strings.ReplaceAll(string(a), `"`+c.from+`"`, `"`+c.to+`"`) != string(b) {
			t.Errorf("%s: the plan on %s differs from that on %s", c.file, c.to, c.from)
		}
		// The recommended move, evaluated on the new axis, is that move.
		if got.Recommended >= 0 {
			s.Motions = []scenario.Motion{got.Options[got.Recommended].Motion}
			r, err := sway.Evaluate(s)
			if err != nil || r.PeakSwingDeg <= 0 {
				t.Errorf("%s: the recommended move on %s: %v", c.file, c.to, err)
			}
		}
	}

	// A plan of the new slew without the hook radius it needs is refused
	// at that field.
	s := load(t, "plan-tower-slew.json")
	s.Plan.Axis, s.Crane.RadiusM = "turn_2", 0
	if _, err := Make(s); err == nil || !strings.Contains(err.Error(), "crane.radius_m") {
		t.Errorf("no hook radius: %v", err)
	}
}
