package sway

import (
	"fmt"
	"math"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// BuildProfile builds the motion profile of one validated move of s, of
// any profile kind, in the axis' SI unit (m or rad), with its start_s and
// its input shaper. A shaper designed through a rope length (its own or
// the load's) gets the small-swing period 2*pi*sqrt(L/g).
func BuildProfile(s *scenario.Scenario, m *scenario.Motion) (motion.Profile, error) {
	dr, _ := m.Drive() // Validate rejects unknown axes first
	k := dr.Axis.Kind
	scale := k.ToSI
	acc := func() (float64, float64) {
		return *dr.Accel * scale, deref(dr.Decel, *dr.Accel) * scale
	}
	var p motion.Profile
	switch m.Profile {
	case "", scenario.ProfileTrapezoid:
		p = Profile(m)
	case scenario.ProfileSCurve:
		t := Profile(m)
		r := 0.0
		switch {
		case m.RoundingS != nil:
			r = *m.RoundingS
		case dr.Jerk != nil:
			r = t.Accel / (*dr.Jerk * scale)
		}
		p = motion.NewSCurve(t.Start, t.Distance, t.Speed, t.Accel, t.Decel, r)
	case scenario.ProfileSineRamp:
		t := Profile(m) // the same fields; accel_* and decel_* are the peaks
		p = motion.NewSineRamp(t.Start, t.Distance, t.Speed, t.Accel, t.Decel)
	case scenario.ProfileSteps:
		a, d := acc()
		steps := make([]motion.Step, len(m.Steps))
		for i, st := range m.Steps {
			steps[i] = motion.Step{AtS: m.StartS + st.AtS, Speed: *st.Speed(k) * scale}
		}
		sp, err := motion.NewSteps(steps, a, d)
		if err != nil {
			return nil, scenario.Errors{{Field: "steps", Message: err.Error()}}
		}
		p = sp
	case scenario.ProfileHardStop:
		p = motion.NewHardStop(*dr.Speed*scale, *m.BrakeAtS, *dr.Decel*scale)
	case scenario.ProfileSeries:
		pw, err := m.SeriesProfile()
		if err != nil {
			return nil, scenario.Errors{{Field: "csv", Message: err.Error()}}
		}
		p = pw
		if m.StartS != 0 {
			p = &motion.Shaped{Base: pw, Impulses: []motion.Impulse{{A: 1, T: m.StartS}}}
		}
	default:
		panic("sway: unknown profile " + m.Profile) // Validate rejects these first
	}
	if sh := m.Shaper; sh != nil {
		period := 0.0
		switch {
		case sh.PeriodS != nil:
			period = *sh.PeriodS
		default:
			l := *s.Load.RopeLengthM
			if sh.RopeLengthM != nil {
				l = *sh.RopeLengthM
			}
			period = 2 * math.Pi * math.Sqrt(l/units.StandardGravity)
			if h := s.Load.Hook; h != nil {
				period = 2 * math.Pi / modes(h, *s.Load.MassKg, l).Omega[0]
			}
		}
		var d *shaper.Shaper
		var err error
		if sh.SecondPeriodS != nil {
			d, err = shaper.NewTwoMode(sh.Kind, period, *sh.SecondPeriodS, sh.DampingRatio, sh.TolerancePct/100)
		} else {
			d, err = shaper.New(sh.Kind, period, sh.DampingRatio, sh.TolerancePct/100)
		}
		if err != nil {
			return nil, scenario.Errors{{Field: "shaper", Message: err.Error()}}
		}
		p = d.Apply(p)
	}
	if c := m.Stop; c != nil {
		dec := c.Decel
		if dec == 0 && dr.Decel != nil {
			dec = *dr.Decel
		} else if dec == 0 && dr.Accel != nil {
			dec = *dr.Accel
		}
		if !(dec > 0) {
			return nil, scenario.Errors{{Field: "site.spread.emergency_stop", Message: "the move has no braking rate of its own (a record): state the emergency deceleration"}}
		}
		p = motion.NewStopped(p, c.AtS, c.ReactionS, dec*scale)
	}
	return p, nil
}

// phaseOf finds the phase times of any profile: the cruise is the longest
// span between breakpoints at steady, non-zero speed; without one, the
// acceleration ends and the deceleration starts at the peak speed.
func phaseOf(i int, axis string, p motion.Profile) Phase {
	if t, ok := p.(*motion.Trapezoid); ok {
		bp := t.Breakpoints()
		return Phase{Motion: i, Axis: axis, StartS: bp[0], EndS: bp[len(bp)-1],
			AccelEndS: t.Start + t.PeakSpeed()/t.Accel, DecelStartS: t.End() - t.PeakSpeed()/t.Decel}
	}
	bp := p.Breakpoints()
	ph := Phase{Motion: i, Axis: axis, StartS: bp[0], EndS: p.End()}
	best, peak, peakAt := 0.0, -1.0, bp[0]
	for j := 0; j+1 < len(bp); j++ {
		a, b := bp[j], bp[j+1]
		mid := p.At(0.5 * (a + b))
		if v := math.Abs(p.At(a).Vel); v > peak {
			peak, peakAt = v, a
		}
		if mid.Acc == 0 && mid.Vel != 0 && b-a > best {
			best, ph.AccelEndS, ph.DecelStartS = b-a, a, b
		}
	}
	if best == 0 {
		ph.AccelEndS, ph.DecelStartS = peakAt, peakAt
	}
	return ph
}

// profileWarning says when a point-to-point move is too short to reach
// its top speed; ok is false when it is not.
func profileWarning(i int, m *scenario.Motion, p motion.Profile, craneKind string) (words.Sentence, bool) {
	var dist, speed, peak float64
	switch q := p.(type) {
	case *motion.Trapezoid:
		dist, speed, peak = q.Distance, q.Speed, q.PeakSpeed()
	case *motion.SCurve:
		dist, speed, peak = q.Base.Distance, q.Base.Speed, q.Base.PeakSpeed()
	case *motion.SineRamp:
		dist, speed, peak = q.Distance, q.Speed, q.PeakSpeed()
	case *motion.Shaped:
		return profileWarning(i, m, q.Base, craneKind)
	}
	if !(peak < speed*(1-1e-12)) {
		return words.Sentence{}, false
	}
	k := kindOf(m)
	scale := 1 / k.ToSI
	return words.Say(fmt.Sprintf("Move %d (%s, {0}) is too short to reach its top speed of {1}: it peaks at {2}.",
		i+1, crane.WordsFor(craneKind, m.Axis)),
		words.Of(math.Abs(dist)*scale, k.Unit), words.Of(speed*scale, k.SpeedUnit),
		words.Of(peak*scale, k.SpeedUnit)), true
}
