package sway

import (
	"fmt"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
)

// moveTooLong reports a move that ends after the longest run simulated, at
// the field that makes it long, with what to change in the words of the
// file: the slowest phase of the move decides which field that is.
func moveTooLong(i int, m *scenario.Motion, p motion.Profile) error {
	end := p.End()
	if end <= scenario.MaxRunS {
		return nil
	}
	k := crane.Linear // an unknown axis is rejected before this
	if d, ok := m.Drive(); ok {
		k = d.Axis.Kind
	}
	speed, accel, decel, dist := k.Speed, k.Accel, k.Decel, k.Distance
	field, advice := accel, ""
	rangeKey := "motions[]." + accel
	own := end - m.StartS // the move's own length, shaper included
	switch {
	case m.StartS > own:
		field, rangeKey, advice = "start_s", "motions[].start_s", "start it earlier"
	case m.Shaper != nil && shaperTime(p) > own/2:
		field, rangeKey, advice = "shaper.period_s", "motions[].shaper.period_s", "shape it for a shorter period, or use shaper zv"
	}
	if advice == "" {
		switch m.Profile {
		case "", scenario.ProfileTrapezoid, scenario.ProfileSCurve, scenario.ProfileSineRamp:
			t := Profile(m) // for a sine ramp, its trapezoid decides near enough
			ramps := t.PeakSpeed()/t.Accel + t.PeakSpeed()/t.Decel
			if ramps < t.Duration()-ramps {
				field = speed
				advice = "or shorten " + dist
			} else if t.Decel < t.Accel {
				field = decel
			}
		case scenario.ProfileSteps:
			if last := m.Steps[len(m.Steps)-1].AtS; last > own/2 {
				field, rangeKey, advice = fmt.Sprintf("steps[%d].at_s", len(m.Steps)-1), "motions[].steps[].at_s", "end the steps earlier"
			} else if m.DecelMPerS2 != nil || m.DecelDegPerS2 != nil {
				field = decel
			}
		case scenario.ProfileHardStop:
			field, rangeKey = decel, "motions[].hard_stop."+decel
			if *m.BrakeAtS > own/2 {
				field, rangeKey, advice = "brake_at_s", "motions[].brake_at_s", "brake earlier"
			}
		case scenario.ProfileSeries:
			field, rangeKey, advice = "csv", "", "shorten the record or start it earlier"
		}
		if field == speed || field == accel || field == decel {
			if m.Profile == scenario.ProfileHardStop {
				rangeKey = "motions[].hard_stop." + field
			} else {
				rangeKey = "motions[]." + field
			}
			advice = "raise " + field + " (" + scenario.Ranges[rangeKey].Text() + ")" + prefixed(" ", advice)
			rangeKey = ""
		}
	}
	if r, ok := scenario.Ranges[rangeKey]; ok {
		advice += " (" + field + " " + r.Text() + ")"
	}
	return scenario.Errors{{Field: fmt.Sprintf("motions[%d].%s", i, field), Message: fmt.Sprintf(
		"the move ends at t = %.4g s: at most %g s is simulated, so every move must end by then; %s", end, scenario.MaxRunS, advice)}}
}

func prefixed(p, s string) string {
	if s == "" {
		return ""
	}
	return p + s
}

// shaperTime is how much a shaper lengthens a move: its last impulse time.
func shaperTime(p motion.Profile) float64 {
	if s, ok := p.(*motion.Shaped); ok {
		return s.End() - s.Base.End()
	}
	return 0
}
