package scenario

import (
	"fmt"

	"swaysheet/core/crane"
)

// Plan asks the planner (package plan) for drive settings for one move of
// the travel or slew axis. The rope length is load.rope_length_m, with an
// optional range around it; the limits are the scenario's limits, of which
// residual_swing_deg and one of peak_swing_deg or peak_excursion_m are
// required.
type Plan struct {
	Axis string `json:"axis"`

	DistanceM      *float64 `json:"distance_m,omitempty"`
	TopSpeedMPerS  *float64 `json:"top_speed_m_per_s,omitempty"`
	MaxAccelMPerS2 *float64 `json:"max_accel_m_per_s2,omitempty"`

	AngleDeg         *float64 `json:"angle_deg,omitempty"`
	TopRateDegPerS   *float64 `json:"top_rate_deg_per_s,omitempty"`
	MaxAccelDegPerS2 *float64 `json:"max_accel_deg_per_s2,omitempty"`

	// The rope lengths the load may have during the move (hoisting, or
	// doubt about where the centre of mass is); both or neither.
	RopeLengthMinM *float64 `json:"rope_length_min_m,omitempty"`
	RopeLengthMaxM *float64 `json:"rope_length_max_m,omitempty"`

	DampingRatio   float64 `json:"damping_ratio,omitempty"`
	EITolerancePct float64 `json:"ei_tolerance_pct,omitempty"`
	// Drive is the crane's drive: "variable_speed" or "pendant". Empty
	// (files written before the drive was required) reads as "pendant"
	// when pendant_steps_pct are given and "variable_speed" otherwise; the
	// plan says which it assumed.
	Drive string `json:"drive,omitempty"`
	// PendantStepsPct are the speeds of the crane's pendant steps, % of
	// the top speed, ascending, the last 100; required for a pendant. The
	// planner times the presses of these steps and never invents others.
	PendantStepsPct []float64 `json:"pendant_steps_pct,omitempty"`
	// SCurveMaxRoundingS is the largest S-curve rounding (jerk limiting,
	// as in the s_curve profile's rounding_s) the variable-speed drive
	// offers; 0 or absent: the drive has none.
	SCurveMaxRoundingS float64 `json:"s_curve_max_rounding_s,omitempty"`
	// TimingSigmaS is the standard deviation of a person's press and
	// release times on a pendant (default DefaultTimingSigmaS; 0 is exact
	// timing); ReactionDelayS is added to every press timed by a count or
	// a mark (default 0).
	TimingSigmaS   *float64 `json:"timing_sigma_s,omitempty"`
	ReactionDelayS float64  `json:"reaction_delay_s,omitempty"`
}

// DefaultTimingSigmaS is the default scatter of a person's press times:
// a person pressing on a count is off by roughly 0.2 to 0.3 s (standard
// deviation; from memory).
const DefaultTimingSigmaS = 0.25

// Drive kinds for a plan.
const (
	DriveVariableSpeed = "variable_speed"
	DrivePendant       = "pendant"
)

func init() {
	addRanges([]fieldRange{
		{"plan.distance_m", Range{Min: -2000, Max: 2000, Unit: "m", MinAbs: 0.01}},
		{"plan.top_speed_m_per_s", Range{Min: MinSpeedMPerS, Max: 10, Unit: "m/s"}},
		{"plan.max_accel_m_per_s2", Range{Min: MinAccelMPerS2, Max: 5, Unit: "m/s²"}},
		{"plan.angle_deg", Range{Min: -3600, Max: 3600, Unit: "deg", MinAbs: MinAngleDeg}},
		{"plan.top_rate_deg_per_s", Range{Min: MinRateDegPerS, Max: 36, Unit: "deg/s"}},
		{"plan.max_accel_deg_per_s2", Range{Min: MinAccelDegPerS2, Max: 30, Unit: "deg/s²"}},
		{"plan.rope_length_min_m", Range{Min: MinRopeM, Max: 500, Unit: "m"}},
		{"plan.rope_length_max_m", Range{Min: MinRopeM, Max: 500, Unit: "m"}},
		{"plan.damping_ratio", Range{Min: 0, Max: 0.3, Unit: ""}},
		{"plan.ei_tolerance_pct", Range{Min: 0, Max: 50, Unit: "%", MinAbs: MinPercent}},
		{"plan.pendant_steps_pct[]", Range{Min: 1, Max: 100, Unit: "%"}},
		{"plan.s_curve_max_rounding_s", Range{Min: 0, Max: 30, Unit: "s", MinAbs: MinDurationS}},
		{"plan.timing_sigma_s", Range{Min: 0, Max: 2, Unit: "s"}},
		{"plan.reaction_delay_s", Range{Min: 0, Max: 3, Unit: "s"}},
	})
}

// planFields are the plan block's move fields by the kind of axis they
// belong to, by JSON name (crane.Kind names them).
func (p *Plan) planFields() map[*crane.Kind]map[string]*float64 {
	return map[*crane.Kind]map[string]*float64{
		crane.Linear:  {"distance_m": p.DistanceM, "top_speed_m_per_s": p.TopSpeedMPerS, "max_accel_m_per_s2": p.MaxAccelMPerS2},
		crane.Angular: {"angle_deg": p.AngleDeg, "top_rate_deg_per_s": p.TopRateDegPerS, "max_accel_deg_per_s2": p.MaxAccelDegPerS2},
	}
}

// Move is the planned move's axis and its distance, top speed and largest
// acceleration in the units of the axis' kind (nil when not given); ok is
// false for an axis the planner does not plan.
func (p *Plan) Move() (ax crane.Axis, dist, speed, accel *float64, ok bool) {
	ax, ok = crane.Of(p.Axis)
	if !ok || !ax.Plannable {
		return ax, nil, nil, nil, false
	}
	k := ax.Kind
	f := p.planFields()[k]
	return ax, f[k.Distance], f[k.TopSpeed], f[k.MaxAccel], true
}

func (p *Plan) validate(c *checker, s *Scenario) {
	ax, dist, _, _, ok := p.Move()
	switch {
	case p.Axis == "":
		c.add("plan.axis", "is required: accepted %q", crane.Names(true))
		return
	case !ok:
		c.add("plan.axis", "is %q: the planner plans %q", p.Axis, crane.Names(true))
		return
	}
	k, fields := ax.Kind, p.planFields()
	for _, name := range []string{k.Distance, k.TopSpeed, k.MaxAccel} {
		c.required("plan."+name, "plan."+name, fields[k][name])
	}
	why := fmt.Sprintf("a %s move is planned in %s; use %s, %s, %s", ax.Words, k.Words, k.Distance, k.TopSpeed, k.MaxAccel)
	for _, other := range crane.Kinds {
		if other == k {
			continue
		}
		for _, name := range []string{other.Distance, other.TopSpeed, other.MaxAccel} {
			c.forbidden("plan."+name, fields[other][name], why)
		}
	}
	if dist != nil && *dist == 0 {
		c.add("plan."+k.Distance, "is 0: give how far the %s moves, %s", ax.Words, Ranges["plan."+k.Distance].Text())
	}
	if ax.Needs != "" && !(s.Crane.Field(ax.Needs) > 0) {
		r := Ranges[ax.Needs]
		c.add(ax.Needs, "is required to plan a %s move: above 0 up to %g %s", ax.Words, r.Max, r.Unit)
	}
	p.checkDuration(c)
	if (p.RopeLengthMinM == nil) != (p.RopeLengthMaxM == nil) {
		c.add("plan.rope_length_min_m", "give both plan.rope_length_min_m and plan.rope_length_max_m, or neither")
	}
	c.optional("plan.rope_length_min_m", "plan.rope_length_min_m", p.RopeLengthMinM)
	c.optional("plan.rope_length_max_m", "plan.rope_length_max_m", p.RopeLengthMaxM)
	if p.RopeLengthMinM != nil && p.RopeLengthMaxM != nil && s.Load.RopeLengthM != nil {
		lo, hi, l := *p.RopeLengthMinM, *p.RopeLengthMaxM, *s.Load.RopeLengthM
		if !(lo <= l && l <= hi) {
			c.add("plan.rope_length_min_m", "the range %s to %s m must contain load.rope_length_m = %s m", num(lo), num(hi), num(l))
		}
	}
	c.value("plan.damping_ratio", "plan.damping_ratio", p.DampingRatio)
	c.value("plan.ei_tolerance_pct", "plan.ei_tolerance_pct", p.EITolerancePct)
	switch p.Drive {
	case "", DriveVariableSpeed, DrivePendant:
	default:
		c.add("plan.drive", "is %q: accepted %q or %q, the drive the crane has", p.Drive, DriveVariableSpeed, DrivePendant)
	}
	if p.Drive == DrivePendant && len(p.PendantStepsPct) == 0 {
		c.add("plan.pendant_steps_pct", "is required for a pendant: list the pendant's speed steps, %% of the top speed, slowest first, the last 100 (e.g. [50, 100])")
	}
	c.value("plan.s_curve_max_rounding_s", "plan.s_curve_max_rounding_s", p.SCurveMaxRoundingS)
	c.optional("plan.timing_sigma_s", "plan.timing_sigma_s", p.TimingSigmaS)
	c.value("plan.reaction_delay_s", "plan.reaction_delay_s", p.ReactionDelayS)
	if n := len(p.PendantStepsPct); n > 0 {
		if n > 5 {
			c.add("plan.pendant_steps_pct", "has %d steps: accepted 1 to 5", n)
		}
		for i, v := range p.PendantStepsPct {
			f := fmt.Sprintf("plan.pendant_steps_pct[%d]", i)
			c.value(f, "plan.pendant_steps_pct[]", v)
			if i > 0 && v <= p.PendantStepsPct[i-1] {
				c.add(f, "%s %% is not above the step before (%s %%): list the steps from slowest to fastest", num(v), num(p.PendantStepsPct[i-1]))
			}
		}
		if last := p.PendantStepsPct[n-1]; last != 100 {
			c.add(fmt.Sprintf("plan.pendant_steps_pct[%d]", n-1), "is %s: the last step is the top speed, 100 %%", num(last))
		}
		if p.Drive == DriveVariableSpeed {
			c.add("plan.pendant_steps_pct", "applies to a pendant: set plan.drive to %q or leave it empty", DrivePendant)
		}
	}
	l := s.Limits
	if l == nil || l.ResidualSwingDeg == nil {
		if l == nil || l.ResidualExcursionM == nil {
			c.add("limits.residual_swing_deg", "is required for a plan (or limits.residual_excursion_m): the residual swing allowed when the move ends, %s", Ranges["limits.residual_swing_deg"].Text())
		}
	}
	if l == nil || (l.PeakSwingDeg == nil && l.PeakExcursionM == nil) {
		c.add("limits.peak_swing_deg", "a plan needs limits.peak_swing_deg (%s) or limits.peak_excursion_m (%s)",
			Ranges["limits.peak_swing_deg"].Text(), Ranges["limits.peak_excursion_m"].Text())
	}
}
