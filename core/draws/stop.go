package draws

import (
	"math"

	"swaysheet/core/crane"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// stopAll cuts every move of d by an emergency stop at the moment
// t0 + u*(t1 - t0), u in [0, 1): t0 is when the first move starts (its
// first breakpoint: a hard stop moves from t = 0, a shaped move's first
// impulse may come before its start) and t1 when the last one comes to
// rest, so the moment is uniform over the move. A move that cannot be
// built is left as it is (its evaluation says why).
func stopAll(d *scenario.Scenario, e *scenario.EmergencyStop, u float64) {
	t0, t1 := math.Inf(1), math.Inf(-1)
	for i := range d.Motions {
		p, err := sway.BuildProfile(d, &d.Motions[i])
		if err != nil {
			return
		}
		if bp := p.Breakpoints(); len(bp) > 0 {
			t0 = math.Min(t0, bp[0])
		}
		t1 = math.Max(t1, p.End())
	}
	if !(t1 >= t0) {
		return
	}
	at := t0 + u*(t1-t0)
	for i := range d.Motions {
		m := &d.Motions[i]
		c := &scenario.StopCut{AtS: at, ReactionS: *e.ReactionS}
		if a, ok := crane.Of(m.Axis); ok && a.Kind == crane.Angular && e.DecelDegPerS2 != nil {
			c.Decel = *e.DecelDegPerS2
		} else if ok && a.Kind == crane.Linear && e.DecelMPerS2 != nil {
			c.Decel = *e.DecelMPerS2
		}
		m.Stop = c
	}
}

// StopAtS is the moment of draw i's emergency stop (NaN without one).
func StopAtS(d *scenario.Scenario) float64 {
	for _, m := range d.Motions {
		if m.Stop != nil {
			return m.Stop.AtS
		}
	}
	return math.NaN()
}
