package scenario

import (
	"fmt"
	"slices"
	"strings"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
)

// Motion profile names.
const (
	ProfileTrapezoid = "trapezoid" // point to point, constant acceleration
	ProfileSCurve    = "s_curve"   // point to point, jerk-limited
	ProfileSteps     = "steps"     // step-speed pendant or two-speed drive
	ProfileHardStop  = "hard_stop" // moving from t = 0, then braking
	ProfileSeries    = "series"    // recorded or planned time series (CSV)
	ProfileSineRamp  = "sine_ramp" // point to point, half-cosine speed ramps
)

// ProfileFields are the fields of the profiles other than the trapezoid
// (the sine ramp has none of its own: it takes the trapezoid's, with
// accel_* and decel_* its peak values), and the input shaper any profile
// may pass through. Each belongs only to the profile named beside it.
type ProfileFields struct {
	// s_curve: a jerk limit (in the axis' unit) or a rounding time, one of.
	JerkMPerS3   *float64 `json:"jerk_m_per_s3,omitempty"`
	JerkDegPerS3 *float64 `json:"jerk_deg_per_s3,omitempty"`
	RoundingS    *float64 `json:"rounding_s,omitempty"`
	// steps: the speed steps in time, reached with accel_*/decel_*.
	Steps []SpeedStep `json:"steps,omitempty"`
	// hard_stop: when the brake sets in; speed_m_per_s / rate_deg_per_s is
	// the speed from t = 0 and decel_* the braking.
	BrakeAtS *float64 `json:"brake_at_s,omitempty"`
	// series: the CSV text of the record (see motion.ParseCSV) and the
	// column for this axis (default <axis>_m_per_s or <axis>_m, slew_deg_per_s
	// or slew_deg). The record's times are shifted by the motion's start_s.
	CSV    string `json:"csv,omitempty"`
	Column string `json:"column,omitempty"`
	// Shaper passes the move through an input shaper (any profile).
	Shaper *ShaperSpec `json:"shaper,omitempty"`
}

// SpeedStep is one step of a step-speed move: at AtS after the motion's
// start_s the drive heads for this speed (signed).
type SpeedStep struct {
	AtS         float64  `json:"at_s"`
	SpeedMPerS  *float64 `json:"speed_m_per_s,omitempty"`
	RateDegPerS *float64 `json:"rate_deg_per_s,omitempty"`
}

// ShaperSpec is an input shaper on a motion: kind zv, zvd or ei, designed
// for a sway period given directly or through a rope length (default: the
// load's rope length; with a hook block, the slower mode's period at that
// rope length to the hook), optionally with a second mode's period.
type ShaperSpec struct {
	_            [0]func() // never compared: no equality code in the wasm
	Kind         string    `json:"kind"`
	PeriodS      *float64  `json:"period_s,omitempty"`
	RopeLengthM  *float64  `json:"rope_length_m,omitempty"`
	DampingRatio float64   `json:"damping_ratio,omitempty"`
	// TolerancePct is the EI shaper's residual at its design period, %
	// (0: 5 %).
	TolerancePct float64 `json:"tolerance_pct,omitempty"`
	// SecondPeriodS, given, makes the shaper two-mode: the convolution of
	// one of its kind for the first period with one for this second period
	// (hook block and rigging: the second mode's period), both with the
	// same damping ratio and EI tolerance.
	SecondPeriodS *float64 `json:"second_period_s,omitempty"`
}

// ShaperKinds are the accepted shaper kinds.
var ShaperKinds = []string{"zv", "zvd", "ei"}

// MaxSteps bounds the steps of one step-speed move.
const MaxSteps = 50

func init() {
	addRanges([]fieldRange{
		{"motions[].jerk_m_per_s3", Range{Min: MinAccelMPerS2, Max: 50, Unit: "m/s³"}},
		{"motions[].jerk_deg_per_s3", Range{Min: MinAccelDegPerS2, Max: 300, Unit: "deg/s³"}},
		{"motions[].rounding_s", Range{Min: 0, Max: 60, Unit: "s", MinAbs: MinDurationS}},
		{"motions[].brake_at_s", Range{Min: 0, Max: MaxRunS, Unit: "s"}},
		{"motions[].steps[].at_s", Range{Min: 0, Max: MaxRunS, Unit: "s"}},
		{"motions[].steps[].speed_m_per_s", Range{Min: -10, Max: 10, Unit: "m/s", MinAbs: MinSpeedMPerS}},
		{"motions[].steps[].rate_deg_per_s", Range{Min: -36, Max: 36, Unit: "deg/s", MinAbs: MinRateDegPerS}},
		{"motions[].shaper.period_s", Range{Min: 0.5, Max: 120, Unit: "s"}},
		{"motions[].shaper.rope_length_m", Range{Min: MinRopeM, Max: 500, Unit: "m"}},
		{"motions[].shaper.damping_ratio", Range{Min: 0, Max: 0.3, Unit: ""}},
		{"motions[].shaper.tolerance_pct", Range{Min: 0, Max: 50, Unit: "%", MinAbs: MinPercent}},
		{"motions[].shaper.second_period_s", Range{Min: 0.1, Max: 120, Unit: "s"}},
		{"motions[].hard_stop.speed_m_per_s", Range{Min: MinSpeedMPerS, Max: 10, Unit: "m/s"}},
		{"motions[].hard_stop.rate_deg_per_s", Range{Min: MinRateDegPerS, Max: 36, Unit: "deg/s"}},
		{"motions[].hard_stop.decel_m_per_s2", Range{Min: MinAccelMPerS2, Max: 10, Unit: "m/s²"}},
		{"motions[].hard_stop.decel_deg_per_s2", Range{Min: MinAccelDegPerS2, Max: 60, Unit: "deg/s²"}},
	})
}

// metric reports whether the axis moves in metres (else degrees).
func metric(axis string) bool {
	a, ok := crane.Of(axis)
	return !ok || a.Kind == crane.Linear
}

// DefaultColumn is the CSV column a series motion of the axis reads when
// none is named: the speed column if the record has it, else the position.
func DefaultColumn(axis string, s *motion.Series) string {
	unit := kindOf(axis).CSVSuffix
	if _, ok := s.Column(axis + unit + "_per_s"); ok {
		return axis + unit + "_per_s"
	}
	return axis + unit
}

// ColumnScale is the factor from a CSV column's unit to the axis' SI unit.
func ColumnScale(axis string) float64 { return kindOf(axis).ToSI }

// kindOf is the axis' kind; linear for an unknown axis (Validate rejects
// those).
func kindOf(axis string) *crane.Kind {
	if a, ok := crane.Of(axis); ok {
		return a.Kind
	}
	return crane.Linear
}

// validateProfile checks the fields of the non-trapezoid profiles, and
// that no field of another profile is given.
func (m *Motion) validateProfile(c *checker, at string) {
	f := func(name string) string { return at + "." + name }
	key := func(name string) string { return "motions[]." + name }
	p := m.Profile
	if p == "" {
		p = ProfileTrapezoid
	}
	not := func(field string, given bool, belongs string) {
		if given {
			c.add(f(field), "does not apply to profile %q: it belongs to profile %q", p, belongs)
		}
	}
	if p != ProfileSCurve {
		not("jerk_m_per_s3", m.JerkMPerS3 != nil, ProfileSCurve)
		not("jerk_deg_per_s3", m.JerkDegPerS3 != nil, ProfileSCurve)
		not("rounding_s", m.RoundingS != nil, ProfileSCurve)
	}
	if p != ProfileSteps {
		not("steps", m.Steps != nil, ProfileSteps)
	}
	if p != ProfileHardStop {
		not("brake_at_s", m.BrakeAtS != nil, ProfileHardStop)
	}
	if p != ProfileSeries {
		not("csv", m.CSV != "", ProfileSeries)
		not("column", m.Column != "", ProfileSeries)
	}
	if p == ProfileTrapezoid || p == ProfileSineRamp { // the trapezoid's checks cover them
		return
	}
	if p != ProfileSCurve { // the trapezoid's checks cover the S-curve's axis
		if _, ok := crane.Of(m.Axis); !ok {
			if m.Axis == "" {
				c.add(f("axis"), "is required: accepted %q", Axes)
			} else {
				c.add(f("axis"), "is %q: accepted %q", m.Axis, Axes)
			}
			return
		}
	}
	met := metric(m.Axis)
	// only lists the kinematic fields the profile takes; others are errors.
	// (Plain slices, no maps: a plan validates its pendant moves hundreds
	// of times.)
	only := func(why string, allowed ...string) {
		fields := [...]struct {
			name  string
			given bool
		}{{"distance_m", m.DistanceM != nil}, {"speed_m_per_s", m.SpeedMPerS != nil},
			{"accel_m_per_s2", m.AccelMPerS2 != nil}, {"decel_m_per_s2", m.DecelMPerS2 != nil},
			{"angle_deg", m.AngleDeg != nil}, {"rate_deg_per_s", m.RateDegPerS != nil},
			{"accel_deg_per_s2", m.AccelDegPerS2 != nil}, {"decel_deg_per_s2", m.DecelDegPerS2 != nil}}
		for _, fd := range fields {
			if fd.given && !slices.Contains(allowed, fd.name) {
				c.add(f(fd.name), "does not apply here: %s", why)
			}
		}
	}
	switch p {
	case ProfileSCurve:
		n := 0
		for _, v := range []*float64{m.JerkMPerS3, m.JerkDegPerS3, m.RoundingS} {
			if v != nil {
				n++
			}
		}
		if n != 1 {
			jerk := "jerk_m_per_s3"
			if !met {
				jerk = "jerk_deg_per_s3"
			}
			c.add(f("rounding_s"), "give exactly one of rounding_s (%s) or %s (%s) for an S-curve",
				Ranges[key("rounding_s")].Text(), jerk, Ranges[key(jerk)].Text())
		}
		c.optional(f("rounding_s"), key("rounding_s"), m.RoundingS)
		if met {
			c.optional(f("jerk_m_per_s3"), key("jerk_m_per_s3"), m.JerkMPerS3)
			c.forbidden(f("jerk_deg_per_s3"), m.JerkDegPerS3, "the "+m.Axis+" axis moves in metres; use jerk_m_per_s3")
		} else {
			c.optional(f("jerk_deg_per_s3"), key("jerk_deg_per_s3"), m.JerkDegPerS3)
			c.forbidden(f("jerk_m_per_s3"), m.JerkMPerS3, "the "+m.Axis+" axis moves in degrees; use jerk_deg_per_s3")
		}
	case ProfileSteps:
		c.value(f("start_s"), key("start_s"), m.StartS)
		if met {
			only("a step-speed move takes steps[] and the ramps accel_m_per_s2 and decel_m_per_s2", "accel_m_per_s2", "decel_m_per_s2")
			c.required(f("accel_m_per_s2"), key("accel_m_per_s2"), m.AccelMPerS2)
			c.optional(f("decel_m_per_s2"), key("decel_m_per_s2"), m.DecelMPerS2)
		} else {
			only("a step-speed "+m.Axis+" move takes steps[] and the ramps accel_deg_per_s2 and decel_deg_per_s2", "accel_deg_per_s2", "decel_deg_per_s2")
			c.required(f("accel_deg_per_s2"), key("accel_deg_per_s2"), m.AccelDegPerS2)
			c.optional(f("decel_deg_per_s2"), key("decel_deg_per_s2"), m.DecelDegPerS2)
		}
		if len(m.Steps) == 0 || len(m.Steps) > MaxSteps {
			c.add(f("steps"), "has %d steps: accepted from 1 up to %d, the last one to speed 0", len(m.Steps), MaxSteps)
			return
		}
		// Each step's field names are written only for a message: a plan
		// checks its pendant moves at every run.
		const stepsKey = "motions[].steps[]"
		for i, st := range m.Steps {
			g := func(name string) string { return fmt.Sprintf("%s.steps[%d].%s", at, i, name) }
			if !Ranges[stepsKey+".at_s"].fits(st.AtS) {
				c.value(g("at_s"), stepsKey+".at_s", st.AtS)
			}
			if i > 0 && st.AtS < m.Steps[i-1].AtS {
				c.add(g("at_s"), "%s s comes before step %d at %s s: steps must be in time order", num(st.AtS), i-1, num(m.Steps[i-1].AtS))
			}
			v, name, other, otherName, unit := st.SpeedMPerS, "speed_m_per_s", st.RateDegPerS, "rate_deg_per_s", "metres"
			if !met {
				v, name, other, otherName, unit = st.RateDegPerS, "rate_deg_per_s", st.SpeedMPerS, "speed_m_per_s", "degrees"
			}
			if v == nil || !Ranges[stepsKey+"."+name].fits(*v) {
				c.required(g(name), stepsKey+"."+name, v)
			}
			if other != nil {
				c.forbidden(g(otherName), other, "the "+m.Axis+" axis moves in "+unit+"; use "+name)
			}
			if i == len(m.Steps)-1 && v != nil && *v != 0 {
				c.add(g(name), "is %s: the last step must be to 0, so that the move ends at rest", num(*v))
			}
		}
	case ProfileHardStop:
		if m.StartS != 0 {
			c.add(f("start_s"), "does not apply to a hard stop: it moves from t = 0; set brake_at_s for when the brake sets in")
		}
		c.required(f("brake_at_s"), key("brake_at_s"), m.BrakeAtS)
		if met {
			only("a hard stop takes speed_m_per_s (moving in the axis' + direction from t = 0), brake_at_s and decel_m_per_s2", "speed_m_per_s", "decel_m_per_s2")
			c.required(f("speed_m_per_s"), key("hard_stop.speed_m_per_s"), m.SpeedMPerS)
			c.required(f("decel_m_per_s2"), key("hard_stop.decel_m_per_s2"), m.DecelMPerS2)
		} else {
			only("a hard stop takes rate_deg_per_s (moving in the axis' + direction from t = 0), brake_at_s and decel_deg_per_s2", "rate_deg_per_s", "decel_deg_per_s2")
			c.required(f("rate_deg_per_s"), key("hard_stop.rate_deg_per_s"), m.RateDegPerS)
			c.required(f("decel_deg_per_s2"), key("hard_stop.decel_deg_per_s2"), m.DecelDegPerS2)
		}
	case ProfileSeries:
		c.value(f("start_s"), key("start_s"), m.StartS)
		only("a series takes its motion from csv")
		if strings.TrimSpace(m.CSV) == "" {
			c.add(f("csv"), "is required: the CSV text of the record, header time_s and the axis column (for example %s_m_per_s)", m.Axis)
			return
		}
		if _, err := m.SeriesProfile(); err != nil {
			c.add(f("csv"), "%v", err)
		}
	}
}

// SeriesProfile parses the CSV of a series motion and builds its profile
// in the axis' SI unit (without the start_s shift).
func (m *Motion) SeriesProfile() (*motion.Piecewise, error) {
	s, err := motion.ParseCSV(strings.NewReader(m.CSV))
	if err != nil {
		return nil, err
	}
	col := m.Column
	if col == "" {
		col = DefaultColumn(m.Axis, s)
		if _, ok := s.Column(col); !ok {
			unit := kindOf(m.Axis).CSVSuffix
			return nil, fmt.Errorf("the record has no column for the %s axis: name it %s%s (positions) or %s%s_per_s (speeds), or set column",
				m.Axis, m.Axis, unit, m.Axis, unit)
		}
	}
	scale := ColumnScale(m.Axis)
	p, err := s.Profile(col, scale)
	if err != nil {
		return nil, err
	}
	if t0 := s.TimeS[0] + m.StartS; t0 < 0 {
		return nil, fmt.Errorf("the record starts at t = %g s, before the run starts at t = 0: give times from 0, or set start_s to at least %g",
			t0, -s.TimeS[0])
	}
	// A record is held to the axis' limits like any other move.
	speed, accel := "speed_m_per_s", "decel_m_per_s2"
	if !metric(m.Axis) {
		speed, accel = "rate_deg_per_s", "decel_deg_per_s2"
	}
	vr, ar := Ranges["motions[]."+speed], Ranges["motions[].hard_stop."+accel]
	if v, at := p.PeakSpeedAt(); v/scale > vr.Max*(1+1e-9) {
		return nil, &motion.CSVError{Line: s.LineAt(at), Column: col, Message: fmt.Sprintf(
			"the speed reaches %.4g %s at t = %.4g s: accepted up to %g %s, as for %s", v/scale, vr.Unit, at, vr.Max, vr.Unit, speed)}
	}
	if a, at := p.PeakAccelAt(); a/scale > ar.Max*(1+1e-9) {
		return nil, &motion.CSVError{Line: s.LineAt(at), Column: col, Message: fmt.Sprintf(
			"the acceleration reaches %.4g %s at t = %.4g s: accepted up to %g %s, as for a hard stop's %s", a/scale, ar.Unit, at, ar.Max, ar.Unit, accel)}
	}
	if e := p.End(); e+m.StartS > MaxRunS {
		return nil, fmt.Errorf("the record ends at %g s: at most %g s is simulated", e, MaxRunS)
	}
	return p, nil
}

func (m *Motion) validateShaper(c *checker, at string) {
	sh := m.Shaper
	if sh == nil {
		return
	}
	f := func(name string) string { return at + ".shaper." + name }
	in, keyAt := at+".shaper", "motions[].shaper"
	switch sh.Kind {
	case "zv", "zvd", "ei":
	case "":
		c.add(f("kind"), "is required: accepted %q", ShaperKinds)
	default:
		c.add(f("kind"), "is %q: accepted %q", sh.Kind, ShaperKinds)
	}
	if sh.PeriodS != nil && sh.RopeLengthM != nil {
		c.add(f("period_s"), "give either period_s or rope_length_m for the shaper's design, not both")
	}
	c.optionalIn(in, keyAt, "period_s", sh.PeriodS)
	c.optionalIn(in, keyAt, "rope_length_m", sh.RopeLengthM)
	c.valueIn(in, keyAt, "damping_ratio", sh.DampingRatio)
	c.valueIn(in, keyAt, "tolerance_pct", sh.TolerancePct)
	c.optionalIn(in, keyAt, "second_period_s", sh.SecondPeriodS)
	if sh.Kind == "ei" && sh.DampingRatio != 0 {
		c.add(f("damping_ratio"), "is %s: the EI shaper here is the undamped one; use 0, or shaper zv or zvd", num(sh.DampingRatio))
	}
	if sh.Kind != "ei" && sh.TolerancePct != 0 {
		c.add(f("tolerance_pct"), "applies to the ei shaper only")
	}
}
