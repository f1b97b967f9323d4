package scenario

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"swaysheet/core/crane"
)

// Range is the accepted interval of one field, with its unit for messages.
type Range struct {
	_        [0]func() // never compared: no equality code in the wasm
	Min, Max float64
	Unit     string
	// OpenMin excludes Min itself (the value must be above it).
	OpenMin bool
	// MinAbs, when set, is the smallest size of a value other than 0: a
	// quantity where 0 means "none" but a crane cannot do less than MinAbs.
	MinAbs float64
}

// Ranges lists the accepted range of every numeric field by its path; []
// stands for any list index. The page shows these beside its inputs, so
// they are kept in this one place.
var Ranges = map[string]Range{
	"load.mass_kg":               {Min: 0.1, Max: 2e6, Unit: "kg"},
	"load.rope_length_m":         {Min: MinRopeM, Max: 500, Unit: "m"},
	"load.area_m2":               {Min: 0, Max: 2000, Unit: "m²"},
	"load.drag_coefficient":      {Min: 0, Max: 3, Unit: ""},
	"load.hook.mass_kg":          {Min: 0.1, Max: 2e5, Unit: "kg"},
	"load.hook.rigging_length_m": {Min: 0.1, Max: 100, Unit: "m"},
	"crane.radius_m":             {Min: 0, Max: 150, Unit: "m"},
	"crane.slew_deg":             {Min: -360, Max: 360, Unit: "deg"},

	"motions[].start_s":          {Min: 0, Max: MaxRunS, Unit: "s"},
	"motions[].distance_m":       {Min: -2000, Max: 2000, Unit: "m", MinAbs: MinDistanceM},
	"motions[].speed_m_per_s":    {Min: MinSpeedMPerS, Max: 10, Unit: "m/s"},
	"motions[].accel_m_per_s2":   {Min: MinAccelMPerS2, Max: 5, Unit: "m/s²"},
	"motions[].decel_m_per_s2":   {Min: MinAccelMPerS2, Max: 5, Unit: "m/s²"},
	"motions[].angle_deg":        {Min: -3600, Max: 3600, Unit: "deg", MinAbs: MinAngleDeg},
	"motions[].rate_deg_per_s":   {Min: MinRateDegPerS, Max: 36, Unit: "deg/s"},
	"motions[].accel_deg_per_s2": {Min: MinAccelDegPerS2, Max: 30, Unit: "deg/s²"},
	"motions[].decel_deg_per_s2": {Min: MinAccelDegPerS2, Max: 30, Unit: "deg/s²"},

	"wind.force_n":               {Min: 0, Max: 1e7, Unit: "N"},
	"wind.speed_m_per_s":         {Min: 0, Max: 60, Unit: "m/s"},
	"wind.shape_factor":          {Min: 0, Max: 3, Unit: ""},
	"wind.air_density_kg_per_m3": {Min: 0, Max: 1.5, Unit: "kg/m³"},
	"wind.toward_deg":            {Min: -360, Max: 360, Unit: "deg"},
	"wind.start_s":               {Min: 0, Max: MaxRunS, Unit: "s"},
	"wind.duration_s":            {Min: 0, Max: MaxRunS, Unit: "s", MinAbs: MinDurationS},
	"wind.ramp_s":                {Min: 0, Max: 600, Unit: "s", MinAbs: MinDurationS},

	"initial.swing_deg":          {Min: 0, Max: 89, Unit: "deg"},
	"initial.toward_deg":         {Min: -360, Max: 360, Unit: "deg"},
	"initial.velocity_x_m_per_s": {Min: -20, Max: 20, Unit: "m/s"},
	"initial.velocity_y_m_per_s": {Min: -20, Max: 20, Unit: "m/s"},

	"limits.peak_swing_deg":       {Min: MinAngleDeg, Max: 90, Unit: "deg"},
	"limits.peak_excursion_m":     {Min: MinDistanceM, Max: 100, Unit: "m"},
	"limits.residual_swing_deg":   {Min: MinAngleDeg, Max: 90, Unit: "deg"},
	"limits.residual_excursion_m": {Min: MinDistanceM, Max: 100, Unit: "m"},
	"limits.tension_factor":       {Min: 1, Max: 10, Unit: ""},
	"limits.peak_tilt_deg":        {Min: 0.1, Max: 45, Unit: "deg"},

	"settings.rel_tol":        {Min: 1e-13, Max: 1e-3, Unit: ""},
	"settings.settle_periods": {Min: 2, Max: 50, Unit: "periods"},
	"settings.duration_s":     {Min: 0, Max: MaxRunS, Unit: "s"},
	"settings.samples":        {Min: 50, Max: 5000, Unit: "points"},
}

// fieldRange is one entry of Ranges, for the files that add the ranges of
// their own block in an init (addRanges).
type fieldRange struct {
	field string
	Range
}

// addRanges adds rs to Ranges. The files give their ranges as a list, not
// as a map literal: a list of constants is data in the binary, while a map
// literal of fewer than 26 entries compiles to code that stores one entry
// after another (in the page's wasm about 400 bytes an entry).
func addRanges(rs []fieldRange) {
	for _, r := range rs {
		Ranges[r.field] = r.Range
	}
}

// Bounds that other packages check against.
const (
	// The smallest values a crane drive has, well below any real creep
	// speed or ramp (common practice: creep speeds of a few cm/s, slew
	// rates of tenths of a degree per second), and far above the sizes
	// where products and quotients of them underflow or overflow:
	// speeds, accelerations and jerks at least 0.001 in metres or 0.01 in
	// degrees; distances and angles 0 or at least that in size; durations
	// 0 or at least 0.01 s.
	MinSpeedMPerS    = 0.001
	MinAccelMPerS2   = 0.001
	MinRateDegPerS   = 0.01
	MinAccelDegPerS2 = 0.01
	MinDistanceM     = 0.001
	MinAngleDeg      = 0.01
	MinDurationS     = 0.01
	// MinPercent is the smallest percentage other than 0 (tolerances,
	// pendant steps).
	MinPercent = 0.1

	// MinRopeM is the shortest rope the model accepts at any time, m.
	MinRopeM = 0.3
	// MaxRunS is the longest run the model simulates, s.
	MaxRunS = 3600.0
	// MaxInitialSpeed is the largest initial speed of the load relative to
	// the suspension point, m/s.
	MaxInitialSpeed = 20.0
	// MaxRadiusM is the largest slew radius at any time, m.
	MaxRadiusM = 150.0
)

// Profiles lists the motion profile names this version reads.
var Profiles = []string{ProfileTrapezoid, ProfileSCurve, ProfileSteps, ProfileHardStop, ProfileSeries, ProfileSineRamp}

type checker struct{ errs Errors }

func (c *checker) add(field, format string, args ...any) {
	c.errs = append(c.errs, FieldError{Field: field, Message: fmt.Sprintf(format, args...)})
}

// RangeText is the accepted range in words, for messages.
func (r Range) Text() string {
	lo := "from " + num(r.Min)
	if r.OpenMin {
		lo = "above " + num(r.Min)
	}
	u := ""
	if r.Unit != "" {
		u = " " + r.Unit
	}
	t := fmt.Sprintf("accepted %s up to %s%s", lo, num(r.Max), u)
	if r.MinAbs > 0 {
		t += fmt.Sprintf(": 0, or at least %s%s in size", num(r.MinAbs), u)
	}
	return t
}

func num(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// fits reports whether v is in the range.
func (r Range) fits(v float64) bool {
	return !(math.IsNaN(v) || math.IsInf(v, 0) || v > r.Max || v < r.Min || (r.OpenMin && v == r.Min) ||
		(v != 0 && math.Abs(v) < r.MinAbs))
}

// value checks v against the range named key and reports it under field.
func (c *checker) value(field, key string, v float64) {
	r, ok := Ranges[key]
	if !ok {
		panic("scenario: no range for " + key)
	}
	if !r.fits(v) {
		c.add(field, "%s is out of range: %s", num(v), r.Text())
	}
}

// valueIn, requiredIn and optionalIn are value, required and optional for
// the field name of the object at the JSON path at ("motions[0]") with
// the range keyed keyAt+"."+name ("motions[]"): the path is joined only
// for a message, as a plan checks its moves at every run.
func (c *checker) valueIn(at, keyAt, name string, v float64) {
	if !Ranges[keyAt+"."+name].fits(v) {
		c.value(at+"."+name, keyAt+"."+name, v)
	}
}

func (c *checker) requiredIn(at, keyAt, name string, v *float64) {
	if v == nil || !Ranges[keyAt+"."+name].fits(*v) {
		c.required(at+"."+name, keyAt+"."+name, v)
	}
}

func (c *checker) optionalIn(at, keyAt, name string, v *float64) {
	if v != nil {
		c.valueIn(at, keyAt, name, *v)
	}
}

// required checks a pointer field that must be present.
func (c *checker) required(field, key string, v *float64) {
	if v == nil {
		c.add(field, "is required: %s", Ranges[key].Text())
		return
	}
	c.value(field, key, *v)
}

// optional checks a pointer field that may be absent.
func (c *checker) optional(field, key string, v *float64) {
	if v != nil {
		c.value(field, key, *v)
	}
}

// forbidden reports a field that does not belong to the axis.
func (c *checker) forbidden(field string, v *float64, why string) {
	if v != nil {
		c.add(field, "does not apply here: %s", why)
	}
}

// Validate checks every field of s against its accepted range and the
// rules that tie fields together.
func (s *Scenario) Validate() error {
	var c checker
	if s.Format != FormatName {
		c.add("format", "is %q: a scenario file has format %q", s.Format, FormatName)
	}
	if s.Version != Version {
		c.add("version", "%d is not supported: this build reads version %d", s.Version, Version)
	}
	c.required("load.mass_kg", "load.mass_kg", s.Load.MassKg)
	c.required("load.rope_length_m", "load.rope_length_m", s.Load.RopeLengthM)
	c.value("load.area_m2", "load.area_m2", s.Load.AreaM2)
	c.value("load.drag_coefficient", "load.drag_coefficient", s.Load.DragCoefficient)
	if s.Load.DragCoefficient > 0 && s.Load.AreaM2 == 0 {
		c.add("load.area_m2", "is required when load.drag_coefficient is set: %s", Ranges["load.area_m2"].Text())
	}
	if h := s.Load.Hook; h != nil {
		c.required("load.hook.mass_kg", "load.hook.mass_kg", h.MassKg)
		c.required("load.hook.rigging_length_m", "load.hook.rigging_length_m", h.RiggingLengthM)
	}
	if b := s.Load.Body; b != nil {
		b.validate(&c, s)
	}
	c.value("crane.radius_m", "crane.radius_m", s.Crane.RadiusM)
	c.value("crane.slew_deg", "crane.slew_deg", s.Crane.SlewDeg)
	if len(s.Motions) > 100 {
		c.add("motions", "has %d moves: at most 100 are accepted", len(s.Motions))
	}
	for i := range s.Motions {
		s.Motions[i].validate(&c, fmt.Sprintf("motions[%d]", i))
	}
	if w := s.Wind; w != nil {
		w.validate(&c, s.Load.AreaM2)
	}
	if in := s.Initial; in != nil {
		c.value("initial.swing_deg", "initial.swing_deg", in.SwingDeg)
		c.value("initial.toward_deg", "initial.toward_deg", in.TowardDeg)
		c.value("initial.velocity_x_m_per_s", "initial.velocity_x_m_per_s", in.VelocityXMPerS)
		c.value("initial.velocity_y_m_per_s", "initial.velocity_y_m_per_s", in.VelocityYMPerS)
		// The vertical part of the load's velocity follows from the rope:
		// n.v = 0. Near a horizontal rope a small horizontal speed means a
		// huge vertical one, so the whole speed is bounded too.
		th, az := in.SwingDeg*math.Pi/180, in.TowardDeg*math.Pi/180
		nx, ny, nz := math.Sin(th)*math.Cos(az), math.Sin(th)*math.Sin(az), -math.Cos(th)
		vz := -(nx*in.VelocityXMPerS + ny*in.VelocityYMPerS) / nz
		if v := math.Sqrt(in.VelocityXMPerS*in.VelocityXMPerS + in.VelocityYMPerS*in.VelocityYMPerS + vz*vz); v > MaxInitialSpeed {
			c.add("initial.velocity_x_m_per_s", "with the rope at %.3g deg this horizontal velocity makes the load move at %.4g m/s along its arc: at most %g m/s is accepted", in.SwingDeg, v, MaxInitialSpeed)
		}
	}
	if l := s.Limits; l != nil {
		c.optional("limits.peak_swing_deg", "limits.peak_swing_deg", l.PeakSwingDeg)
		c.optional("limits.peak_excursion_m", "limits.peak_excursion_m", l.PeakExcursionM)
		c.optional("limits.residual_swing_deg", "limits.residual_swing_deg", l.ResidualSwingDeg)
		c.optional("limits.residual_excursion_m", "limits.residual_excursion_m", l.ResidualExcursionM)
		c.optional("limits.tension_factor", "limits.tension_factor", l.TensionFactor)
		c.optional("limits.peak_tilt_deg", "limits.peak_tilt_deg", l.PeakTiltDeg)
	}
	if st := s.Settings; st != nil {
		switch st.Accuracy {
		case "", "default", "tight":
		default:
			c.add("settings.accuracy", "is %q: accepted \"default\" or \"tight\"", st.Accuracy)
		}
		if st.RelTol != 0 {
			c.value("settings.rel_tol", "settings.rel_tol", st.RelTol)
		}
		if st.SettlePeriods != 0 {
			c.value("settings.settle_periods", "settings.settle_periods", st.SettlePeriods)
		}
		c.value("settings.duration_s", "settings.duration_s", st.DurationS)
		if st.Samples != 0 {
			c.value("settings.samples", "settings.samples", float64(st.Samples))
		}
	}
	if p := s.Plan; p != nil {
		p.validate(&c, s)
	}
	s.validateSite(&c)
	if len(c.errs) > 0 {
		return c.errs
	}
	return nil
}

// ValidateMotion checks one move alone as Validate checks each of a
// scenario's motions, naming its fields under at ("motions[0]"). It is for
// a caller that put a move of its own into a scenario validated before (the
// planner's options, run hundreds of times a plan), so that the rest of the
// scenario is not checked again at every run.
func ValidateMotion(m *Motion, at string) error {
	var c checker
	m.validate(&c, at)
	if len(c.errs) > 0 {
		return c.errs
	}
	return nil
}

func (m *Motion) validate(c *checker, at string) {
	const keyAt = "motions[]"
	switch m.Profile {
	case "", ProfileTrapezoid, ProfileSCurve, ProfileSineRamp:
		m.validateProfile(c, at) // the S-curve's rounding; nothing else belongs here
	case ProfileSteps, ProfileHardStop, ProfileSeries:
		m.validateProfile(c, at)
		m.validateShaper(c, at)
		return
	default:
		c.add(at+".profile", "is %q: accepted %q", m.Profile, Profiles)
		return
	}
	m.validateShaper(c, at)
	c.valueIn(at, keyAt, "start_s", m.StartS)
	// The axis' kind (crane.Kind) names the fields its moves take.
	d, known := m.Drive()
	switch {
	case known:
		k := d.Axis.Kind
		c.requiredIn(at, keyAt, k.Distance, d.Distance)
		c.requiredIn(at, keyAt, k.Speed, d.Speed)
		c.requiredIn(at, keyAt, k.Accel, d.Accel)
		c.optionalIn(at, keyAt, k.Decel, d.Decel)
		for _, o := range crane.Kinds {
			if o != k {
				for _, name := range [...]string{o.Distance, o.Speed, o.Accel, o.Decel} {
					if v := d.Field(o, name); v != nil {
						// The words only when needed: a scenario is validated at
						// every evaluation, a plan's hundreds of times.
						why := "the " + m.Axis + " axis moves in " + k.Words + "; use " + strings.Join([]string{k.Distance, k.Speed, k.Accel, k.Decel}, ", ")
						c.forbidden(at+"."+name, v, why)
					}
				}
			}
		}
	case m.Axis == "":
		c.add(at+".axis", "is required: accepted %q", Axes)
	default:
		c.add(at+".axis", "is %q: accepted %q", m.Axis, Axes)
	}
}

func (w *Wind) validate(c *checker, area float64) {
	switch {
	case w.ForceN != nil && w.SpeedMPerS != nil:
		c.add("wind.force_n", "give either wind.force_n or wind.speed_m_per_s, not both")
	case w.ForceN == nil && w.SpeedMPerS == nil:
		c.add("wind.force_n", "is required (or wind.speed_m_per_s): %s", Ranges["wind.force_n"].Text())
	}
	c.optional("wind.force_n", "wind.force_n", w.ForceN)
	c.optional("wind.speed_m_per_s", "wind.speed_m_per_s", w.SpeedMPerS)
	c.value("wind.shape_factor", "wind.shape_factor", w.ShapeFactor)
	c.value("wind.air_density_kg_per_m3", "wind.air_density_kg_per_m3", w.AirDensityKgPerM3)
	if w.SpeedMPerS != nil {
		if area == 0 {
			c.add("load.area_m2", "is required when the wind is given as a speed: %s", Ranges["load.area_m2"].Text())
		}
		if w.ShapeFactor == 0 {
			c.add("wind.shape_factor", "is required when the wind is given as a speed: above 0 up to 3 (about 1.2 to 2 for boxes and plates)")
		}
	}
	c.value("wind.toward_deg", "wind.toward_deg", w.TowardDeg)
	c.value("wind.start_s", "wind.start_s", w.StartS)
	c.value("wind.duration_s", "wind.duration_s", w.DurationS)
	c.value("wind.ramp_s", "wind.ramp_s", w.RampS)
}
