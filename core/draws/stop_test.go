package draws

import (
	"math"
	"strings"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

func TestEmergencyStopDraws(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	// The move: from 1 s, 18 m at 0.5 m/s with ramps of 2 s: to rest at
	// 1 + 2 + 34 + 2... = 1 + 18/0.5 + 2 = 39 s.
	p, _ := sway.BuildProfile(s, &s.Motions[0])
	t0, t1 := 1.0, p.End()
	if math.Abs(t1-39) > 1e-9 {
		t.Fatalf("the move ends at %g s, want 39", t1)
	}
	one, decel := 1.0, 1.18
	sp := spread
	sp.EmergencyStop = &scenario.EmergencyStop{ReactionS: &one, DecelMPerS2: &decel}
	const n = 400
	sum := 0.0
	for i := 0; i < n; i++ {
		d := Draw(s, sp, 3, i)
		at := StopAtS(d)
		plain := Draw(s, spread, 3, i)
		q, _ := sway.BuildProfile(plain, &plain.Motions[0])
		if a, b := plain.Motions[0].StartS, q.End(); !(at >= a && at < b) {
			t.Fatalf("draw %d: stop at %g s, outside its move (%g to %g s)", i, at, a, b)
		}
		sum += at
		// Reproducible, and the other drawn values are as without the stop.
		if again := StopAtS(Draw(s, sp, 3, i)); again != at {
			t.Fatalf("draw %d: stop at %g, then %g", i, at, again)
		}
		if *plain.Load.RopeLengthM != *d.Load.RopeLengthM || plain.Motions[0].StartS != d.Motions[0].StartS {
			t.Fatalf("draw %d: the stop changed the other draws", i)
		}
		if c := d.Motions[0].Stop; c.ReactionS != 1 || c.Decel != 1.18 {
			t.Fatalf("draw %d: stop %+v", i, c)
		}
	}
	// Uniform over the move (press scatter 0.2 s moves the start a
	// little): the mean of n uniform moments is within 4 standard errors,
	// (t1-t0)/sqrt(12 n), of the middle (standard result).
	mid, se := (t0+t1)/2, (t1-t0)/math.Sqrt(12*n)
	if mean := sum / n; math.Abs(mean-mid) > 4*se+0.2 {
		t.Errorf("mean stop moment %g s, middle of the move %g s", mean, mid)
	}
	// A draw stopped in the cruise: the trolley ends v*t_r + v²/(2a)
	// past where it was at the stop command (any mechanics text).
	for i := 0; i < n; i++ {
		d := Draw(s, sp, 3, i)
		at := StopAtS(d)
		if at < 8 || at > 30 {
			continue
		}
		q, err := sway.BuildProfile(d, &d.Motions[0])
		if err != nil {
			t.Fatal(err)
		}
		got := q.At(q.End()).Pos - q.At(at).Pos
		if want := 0.5*1 + 0.5*0.5/(2*1.18); math.Abs(got-want) > 1e-12 {
			t.Errorf("draw %d: %g m from the stop command, want %g", i, got, want)
		}
		break
	}
	// A bad request names the field.
	bad := -1.0
	sp.EmergencyStop = &scenario.EmergencyStop{ReactionS: &bad}
	if _, err := Run(s, Request{Spread: sp, Runs: 2}, 1); err == nil || !strings.Contains(err.Error(), "draws.spread.emergency_stop.reaction_s") {
		t.Errorf("error %v", err)
	}
}
