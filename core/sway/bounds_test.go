package sway_test

import (
	"errors"
	"fmt"
	"math/rand"
	"strings"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// TestMoveTooLong checks that a move ending after the longest run is an
// error at the move's own field, saying what to change, and not a run
// length of +Inf or millions of seconds at settings.duration_s.
func TestMoveTooLong(t *testing.T) {
	const head = `{"format": "swaysheet-scenario", "version": 1, "name": "long move", "load": {"mass_kg": 1000, "rope_length_m": 5}, "motions": [`
	for _, c := range []struct{ name, move, field, says string }{
		{"slow cruise", `{"axis": "travel_x", "distance_m": 2000, "speed_m_per_s": 0.001, "accel_m_per_s2": 0.3}`,
			"motions[0].speed_m_per_s", "the move ends at t = 2e+06 s: at most 3600 s is simulated, so every move must end by then; raise speed_m_per_s (accepted from 0.001 up to 10 m/s)"},
		{"slow ramp", `{"axis": "travel_x", "profile": "steps", "accel_m_per_s2": 0.001, "steps": [{"at_s": 0, "speed_m_per_s": 10}, {"at_s": 3000, "speed_m_per_s": 0}]}`,
			"motions[0].accel_m_per_s2", "the move ends at t = 6000 s: at most 3600 s is simulated, so every move must end by then; raise accel_m_per_s2 (accepted from 0.001 up to 5 m/s²)"},
		{"slow brake", `{"axis": "travel_x", "profile": "hard_stop", "speed_m_per_s": 10, "brake_at_s": 1, "decel_m_per_s2": 0.001}`,
			"motions[0].decel_m_per_s2", "the move ends at t = 1e+04 s"},
		{"late start", `{"axis": "travel_x", "start_s": 3599, "distance_m": 20, "speed_m_per_s": 1, "accel_m_per_s2": 0.3}`,
			"motions[0].start_s", "start it earlier"},
	} {
		s, err := scenario.Parse([]byte(head + c.move + "]}"))
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		_, err = sway.Evaluate(s)
		var es scenario.Errors
		if !errors.As(err, &es) || es[0].Field != c.field || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %v; want %s: ...%s...", c.name, err, c.field, c.says)
		}
	}
}

// TestSplineExtremes checks that a recorded hoist or radius (a cubic
// spline through positions) is held to the rope and radius limits at the
// extremes inside every spline piece, not only where the sampled speed
// changes sign: the record below passes through its samples and still
// takes the rope to 0.157 m between them. A random search then checks
// that no accepted record leaves the limits on a fine grid.
func TestSplineExtremes(t *testing.T) {
	rec := func(axis, col string, xs []float64) string {
		var b strings.Builder
		b.WriteString(`time_s,` + col + `\n`)
		for i, x := range xs {
			fmt.Fprintf(&b, `%d,%.3f\n`, 2*i, x)
		}
		return `{"format": "swaysheet-scenario", "version": 1, "name": "spline", "load": {"mass_kg": 1000, "rope_length_m": 5}, "crane": {"radius_m": 4.7},` +
			` "motions": [{"axis": "` + axis + `", "profile": "series", "csv": "` + b.String() + `"}]}`
	}
	for _, c := range []struct{ axis, col, field, says string }{
		{"hoist", "hoist_m", "load.rope_length_m", "the motions take the rope length to 0.1569 m at t = "},
		{"radius", "radius_m", "crane.radius_m", "the motions take the slew radius to"},
	} {
		xs := []float64{0, -1.78, 2.771, -3.293, 4.03, 4.03}
		if c.axis == "radius" {
			for i := range xs {
				xs[i] = -xs[i]
			}
		}
		s, err := scenario.Parse([]byte(rec(c.axis, c.col, xs)))
		if err != nil {
			t.Fatal(err)
		}
		_, err = sway.Evaluate(s)
		var es scenario.Errors
		if !errors.As(err, &es) || es[0].Field != c.field || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %v, want %s: %s", c.axis, err, c.field, c.says)
		}
	}
	r := rand.New(rand.NewSource(1))
	for k := 0; k < 3000; k++ {
		xs := make([]float64, 4+r.Intn(4))
		for i := 1; i < len(xs)-1; i++ {
			xs[i] = r.Float64()*9 - 4.5
		}
		xs[len(xs)-1] = xs[len(xs)-2]
		s, err := scenario.Parse([]byte(rec("hoist", "hoist_m", xs)))
		if err != nil {
			continue
		}
		if _, err := sway.EvaluateWith(s, sway.Options{NoHistory: true, MaxSteps: 1}); err != nil && !errors.Is(err, sway.ErrStepLimit) {
			continue // rejected before integrating
		}
		p, err := sway.BuildProfile(s, &s.Motions[0])
		if err != nil {
			t.Fatal(err)
		}
		for tt := 0.0; tt <= float64(2*len(xs)); tt += 0.001 {
			if l := 5 - p.At(tt).Pos; l < scenario.MinRopeM-1e-9 {
				t.Fatalf("accepted record %v takes the rope to %g m at t = %g s", xs, l, tt)
			}
		}
	}
}

// TestWorkBudget checks that a run whose every step looks at many moving
// pieces (here 100 shaped moves at once) ends when its work budget is
// spent, with a message in plain words, and that a shared budget stops
// every evaluation drawing on it.
func TestWorkBudget(t *testing.T) {
	var b strings.Builder
	b.WriteString(`{"format": "swaysheet-scenario", "version": 1, "name": "many moves", "load": {"mass_kg": 1000, "rope_length_m": 5}, "motions": [`)
	for i := range 100 {
		if i > 0 {
			b.WriteString(",")
		}
		fmt.Fprintf(&b, `{"axis": "travel_x", "start_s": %g, "distance_m": 10, "speed_m_per_s": 0.5, "accel_m_per_s2": 0.3, "shaper": {"kind": "ei", "period_s": 4.5, "second_period_s": 1.3}}`, float64(i)*0.01)
	}
	b.WriteString(`]}`)
	s, err := scenario.Parse([]byte(b.String()))
	if err != nil {
		t.Fatal(err)
	}
	_, err = sway.EvaluateWith(s, sway.Options{NoHistory: true, General: true, Budget: sway.NewBudget(1e6, "")})
	if !errors.Is(err, sway.ErrWorkLimit) {
		t.Fatalf("want the work limit, got %v", err)
	}
	for _, want := range []string{"This run needs more computing than allowed", "shorten the moves or the run time", "fewer moves"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("message %q lacks %q", err, want)
		}
	}
	// A shared budget stops the runs drawing on it once spent: bay-travel
	// on the general path needs about 9e4 units (the 1e6 runs out in the
	// twelfth run).
	shared := sway.NewBudget(1e6, "This plan needs more computing than allowed: narrow the rope-length range.")
	bay := readScenario(t, "testdata/scenarios/bay-travel.json")
	runs := 0
	for ; runs < 100; runs++ {
		if _, err := sway.EvaluateWith(bay, sway.Options{NoHistory: true, General: true, Budget: shared}); err != nil {
			if !errors.Is(err, sway.ErrWorkLimit) || !strings.Contains(err.Error(), "This plan needs more computing") {
				t.Fatalf("shared budget: %v", err)
			}
			break
		}
	}
	if runs < 2 || runs > 20 {
		t.Fatalf("a shared budget of 1e6 ran out after %d runs of bay-travel", runs)
	}
}

// TestRigidWork: a rigid load's evaluations are charged at their own cost
// (sway.WorkPerRigidEval, about 1 us each natively), so that a budget
// stops a rigid load after about the time it states, not eight times
// later as when they were charged as a rope's; and the scan's own
// evaluations of the load stay near the count the general scan's changes
// of 2026-12-04 brought.
func TestRigidWork(t *testing.T) {
	s := readScenario(t, "testdata/scenarios/precast-beam-tandem.json")
	const all = 1_000_000_000_000
	b := sway.NewBudget(all, "")
	res, err := sway.EvaluateWith(s, sway.Options{NoHistory: true, Budget: b})
	if err != nil {
		t.Fatal(err)
	}
	// At least 70 units (0.9 us at about 13 ns a unit, the low end of the
	// measured cost) for each of the integrator's evaluations alone; the
	// scan's come on top.
	spent := all - b.Left()
	if min := int64(70 * res.Solver.Evals); spent < min {
		t.Errorf("spent %d units on %d evaluations of the integrator alone, want at least %d", spent, res.Solver.Evals, min)
	}
	// And at most 200 for each: the scan evaluates the load about 0.66
	// times for each of the integrator's evaluations (176 units in all,
	// 2026-12-04). Watching the rigging and the missing legs again makes it
	// 213; the scan before that day, asking again at a step's ends for
	// every quantity, 395. (Asking again with only the load's quantities
	// watched makes 182, which this bound lets pass.)
	if max := int64(200 * res.Solver.Evals); spent > max {
		t.Errorf("spent %d units on %d evaluations of the integrator, want at most %d: does the scan evaluate the load more often?", spent, res.Solver.Evals, max)
	}
}
