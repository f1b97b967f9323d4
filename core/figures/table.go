// Package figures is the one table of the figures an evaluation has: for
// each, the words a crew reads, its technical name, its unit and quantity
// (so it is shown in the units people chose and rounded as they read it)
// and the lift plan's limit it is held against, if any. The command
// line's summary, the check sheet and the page (bridge call "figures")
// all present a result from here, so a figure is added in one place:
// one entry of Table and the computation of its value.
package figures

import (
	"swaysheet/core/sway"
)

// Figure is one figure a result may have.
type Figure struct {
	// Key names the figure: its JSON path in sway.Result
	// ("peak_swing_deg", "rigging.mode_periods_s[0]").
	Key string
	// Crew is what a crew reads: plain words, no jargon.
	Crew string
	// Technical is the name an engineer looks for; Named, when set,
	// gives it for the result at hand (a figure whose method depends on
	// the load's model: one rope, hook block, rigid load).
	Technical string
	Named     func(r *sway.Result) string
	// Unit is the SI unit symbol of the value ("deg", "m", "s", "N", "").
	Unit string
	// Quantity is the core/units.Table quantity it is shown as; empty:
	// units.QuantityOf(Unit).
	Quantity string
	// Limit is the scenario.Limits field (its JSON name) the figure is
	// held against: within when value <= limit. Empty: no limit.
	Limit string
	// Detail marks a figure for engineers rather than the crew: the
	// check sheet gives it in its engineering detail, not among the
	// crew's lines.
	Detail bool
	// Get reads the figure from a result that has it, and When says
	// which results have it (Value reads both). Both are plain functions
	// and constants, so that the table is data, not code run at start.
	Get  func(r *sway.Result) float64
	When Presence
}

// Presence says which results have a figure.
type Presence int

const (
	Always         Presence = iota
	Positive                // when above zero
	Windy                   // when the wind blows
	Rigged                  // with a hook block and rigging modelled
	Bodied                  // with a rigid load modelled
	BodiedPositive          // with a rigid load modelled, when above zero
	Slung                   // of a rigid load's sling or spreader legs (two hook ropes have their own figures)
	TandemRope0             // of hook rope 1 of two (load.body.tandem)
	TandemRope1             // of hook rope 2 of two
)

// Value reads the figure from a result; false when the result does not
// have it (no wind, no hook block). The words say sling legs for Slung,
// and Present says spreader legs under a spreader.
func (f Figure) Value(r *sway.Result) (float64, bool) {
	b := r.Body
	switch f.When {
	case Windy:
		if !(r.WindForceN > 0) {
			return f.Get(r), false
		}
	case Rigged:
		if r.Rigging == nil {
			return 0, false
		}
	case Bodied, BodiedPositive:
		if b == nil {
			return 0, false
		}
	case Slung:
		if b == nil || b.Suspension == sway.TwoRopes {
			return 0, false
		}
	case TandemRope0, TandemRope1:
		if b == nil || b.Suspension != sway.TwoRopes || len(b.Legs) <= int(f.When-TandemRope0) {
			return 0, false
		}
	}
	v := f.Get(r)
	return v, !(f.When == Positive || f.When == BodiedPositive) || v > 0
}

// Table is every figure, in the order people read them.
var Table = []Figure{
	{Key: "peak_swing_deg", Crew: "largest swing", Technical: "peak swing (rope angle from the vertical)",
		Named: peakSwingName, Unit: "deg", Limit: "peak_swing_deg", When: Always, Get: func(r *sway.Result) float64 { return r.PeakSwingDeg }},
	{Key: "peak_swing_time_s", Crew: "largest swing comes at", Technical: "time of the peak swing",
		Unit: "s", When: Always, Get: func(r *sway.Result) float64 { return r.PeakSwingTimeS }},
	{Key: "peak_excursion_m", Crew: "load swings out by", Technical: "peak excursion (horizontal, load from under the suspension point)",
		Unit: "m", Limit: "peak_excursion_m", When: Always, Get: func(r *sway.Result) float64 { return r.PeakExcursionM }},
	{Key: "residual_swing_deg", Crew: "swing left after stopping", Technical: "residual swing after the last move",
		Named: residualSwingName, Unit: "deg", Limit: "residual_swing_deg", When: Always, Get: func(r *sway.Result) float64 { return r.ResidualSwingDeg }},
	{Key: "residual_excursion_m", Crew: "swing-out left after stopping", Technical: "residual excursion",
		Unit: "m", Limit: "residual_excursion_m", When: Always, Get: func(r *sway.Result) float64 { return r.ResidualExcursionM }},
	{Key: "period_s", Crew: "time for one full swing", Technical: pointPeriod,
		Named: periodName, Unit: "s", When: Always, Get: func(r *sway.Result) float64 { return r.PeriodS }},
	{Key: "period_amplitude_s", Crew: "full swing time at the swing left", Technical: "sway period at the residual swing's amplitude",
		Named: amplitudeName, Unit: "s", Detail: true, When: Positive, Get: func(r *sway.Result) float64 { return r.PeriodAmplitudeS }},
	{Key: "tension_factor", Crew: "rope pull increase", Technical: "tension factor (peak rope tension / static)",
		Unit: "", Limit: "tension_factor", When: Always, Get: func(r *sway.Result) float64 { return r.TensionFactor }},
	{Key: "tension_max_n", Crew: "largest rope pull", Technical: "peak rope tension",
		Unit: "N", When: Always, Get: func(r *sway.Result) float64 { return r.TensionMaxN }},
	{Key: "tension_min_n", Crew: "smallest rope pull", Technical: "lowest rope tension",
		Unit: "N", When: Always, Get: func(r *sway.Result) float64 { return r.TensionMinN }},
	{Key: "static_tension_n", Crew: "rope pull hanging still", Technical: "static rope tension (weight)",
		Unit: "N", When: Always, Get: func(r *sway.Result) float64 { return r.StaticTensionN }},
	{Key: "wind_force_n", Crew: "wind push on the load", Technical: "steady wind force",
		Unit: "N", When: Positive, Get: func(r *sway.Result) float64 { return r.WindForceN }},
	{Key: "wind_lean_deg", Crew: "rope lean in the wind", Technical: "steady wind lean",
		Unit: "deg", When: Windy, Get: func(r *sway.Result) float64 { return r.WindLeanDeg }},
	{Key: "wind_offset_m", Crew: "load hangs off plumb in the wind by", Technical: "steady wind offset (static, horizontal)",
		Unit: "m", When: Windy, Get: func(r *sway.Result) float64 { return r.WindOffsetM }},
	{Key: "wind_damping_ratio", Crew: "the air slows the swing by (of critical)", Technical: "damping ratio from air drag, along the wind (linearised)",
		Unit: "", Quantity: "share", When: Positive, Get: func(r *sway.Result) float64 { return r.WindDampingRatio }},
	{Key: "rigging.mode_periods_s[0]", Crew: "full swing time, slow swing", Technical: "first mode period (linear)",
		Unit: "s", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.ModePeriodsS[0] }},
	{Key: "rigging.mode_periods_s[1]", Crew: "full swing time, quick swing", Technical: "second mode period (linear)",
		Unit: "s", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.ModePeriodsS[1] }},
	{Key: "rigging.simulated_periods_s[0]", Crew: "slow swing, as simulated", Technical: "first mode period (simulated)",
		Unit: "s", Detail: true, When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.SimulatedPeriodsS[0] }},
	{Key: "rigging.simulated_periods_s[1]", Crew: "quick swing, as simulated", Technical: "second mode period (simulated)",
		Unit: "s", Detail: true, When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.SimulatedPeriodsS[1] }},
	{Key: "rigging.second_mode_share", Crew: "quick swing's share", Technical: "second mode's share of the load's swing (linear theory)",
		Unit: "", Quantity: "share", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.SecondModeShare }},
	{Key: "rigging.peak_rope_swing_deg", Crew: "largest swing of the hook's rope", Technical: "peak rope swing (hook block)",
		Unit: "deg", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.PeakRopeSwingDeg }},
	{Key: "rigging.peak_rigging_angle_deg", Crew: "load swings under the hook by", Technical: "peak rigging angle to the rope",
		Unit: "deg", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.PeakRiggingAngleDeg }},
	{Key: "rigging.rigging_tension_max_n", Crew: "largest pull in the rigging", Technical: "peak rigging tension",
		Unit: "N", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.RiggingTensionMaxN }},
	{Key: "rigging.rigging_tension_min_n", Crew: "smallest pull in the rigging", Technical: "lowest rigging tension",
		Unit: "N", When: Rigged, Get: func(r *sway.Result) float64 { return r.Rigging.RiggingTensionMinN }},
	{Key: "body.pitch_period_s", Crew: "time for one full pitch of the load", Technical: "pitch mode period (rigid load)",
		Unit: "s", When: BodiedPositive, Get: func(r *sway.Result) float64 { return r.Body.PitchPeriodS }},
	{Key: "body.twist_period_s", Crew: "time for one full twist of the load", Technical: "twist mode period (rigid load; bifilar with a spreader)",
		Unit: "s", When: BodiedPositive, Get: func(r *sway.Result) float64 { return r.Body.TwistPeriodS }},
	{Key: "body.rest_tilt_deg", Crew: "load hangs tilted by", Technical: "tilt of the load hanging still",
		Unit: "deg", When: Bodied, Get: func(r *sway.Result) float64 { return r.Body.RestTiltDeg }},
	{Key: "body.peak_tilt_deg", Crew: "largest tilt of the load", Technical: "peak tilt of the load's height axis from the vertical",
		Unit: "deg", Limit: "peak_tilt_deg", When: Bodied, Get: func(r *sway.Result) float64 { return r.Body.PeakTiltDeg }},
	{Key: "body.peak_twist_deg", Crew: "largest twist of the load", Technical: "peak twist about the vertical",
		Unit: "deg", When: Bodied, Get: func(r *sway.Result) float64 { return r.Body.PeakTwistDeg }},
	{Key: "body.peak_corner_swing_m", Crew: "a corner swings out by", Technical: "peak corner swing (horizontal, from where it hangs still)",
		Unit: "m", When: Bodied, Get: func(r *sway.Result) float64 { return r.Body.PeakCornerSwingM }},
	{Key: "body.legs[0].weight_share", Crew: sway.HookRope(0) + " holds, hanging still", Technical: "share of the load's weight on " + sway.HookRope(0) + " (load.body.tandem.ropes[0])",
		Unit: "", Quantity: "share", Detail: true, When: TandemRope0, Get: func(r *sway.Result) float64 { return r.Body.Legs[0].WeightShare }},
	{Key: "body.legs[1].weight_share", Crew: sway.HookRope(1) + " holds, hanging still", Technical: "share of the load's weight on " + sway.HookRope(1) + " (load.body.tandem.ropes[1])",
		Unit: "", Quantity: "share", Detail: true, When: TandemRope1, Get: func(r *sway.Result) float64 { return r.Body.Legs[1].WeightShare }},
	{Key: "body.legs[0].tension_max_n", Crew: "largest pull in " + sway.HookRope(0), Technical: "peak tension of " + sway.HookRope(0),
		Unit: "N", When: TandemRope0, Get: func(r *sway.Result) float64 { return r.Body.Legs[0].TensionMaxN }},
	{Key: "body.legs[1].tension_max_n", Crew: "largest pull in " + sway.HookRope(1), Technical: "peak tension of " + sway.HookRope(1),
		Unit: "N", When: TandemRope1, Get: func(r *sway.Result) float64 { return r.Body.Legs[1].TensionMaxN }},
	{Key: "body.leg_tension_max_n", Crew: "largest pull in a sling leg", Technical: "peak leg tension",
		Unit: "N", When: Slung, Get: func(r *sway.Result) float64 { return r.Body.LegTensionMaxN }},
	{Key: "body.leg_tension_min_n", Crew: "smallest pull in a sling leg", Technical: "lowest leg tension",
		Unit: "N", When: Slung, Get: func(r *sway.Result) float64 { return r.Body.LegTensionMinN }},
	{Key: "motion_end_s", Crew: "moves end at", Technical: "end of the last move",
		Unit: "s", When: Always, Get: func(r *sway.Result) float64 { return r.MotionEndS }},
	{Key: "run_s", Crew: "time simulated", Technical: "length of the simulated run",
		Unit: "s", Detail: true, When: Always, Get: func(r *sway.Result) float64 { return r.RunS }},
}

// pointPeriod is the period figure's technical name for a load given as
// a point.
const pointPeriod = "sway period (small swing, 2π√(L/g))"

// periodName names period_s by the model that gives it: 2π√(L/g) for a
// point on one rope; the slower mode of the linearised two-mass pendulum
// with a hook block; the slowest mode of the modal analysis of a rigid
// load (sway.Result.PeriodS).
func periodName(r *sway.Result) string {
	switch {
	case r.Body != nil:
		return "first mode of the rigid load (small swing, modal analysis)"
	case r.Rigging != nil:
		return "first mode of hook block and rigging (small swing, two-mass pendulum)"
	}
	return pointPeriod
}

// amplitudeName names period_amplitude_s: with a hook block or a rigid
// load the one rope's amplitude correction 2K(k)/π is applied to the
// first mode, an approximation.
func amplitudeName(r *sway.Result) string {
	if r.Body != nil || r.Rigging != nil {
		return "first mode at the residual swing's amplitude (one rope's 2K(k)/π: approximate)"
	}
	return "sway period at the residual swing's amplitude"
}

// peakSwingName and residualSwingName name a swing angle: with a hook
// block or a rigid load it is the line from the suspension point to the
// load's centre of mass, not the rope.
func peakSwingName(r *sway.Result) string {
	if r.Body != nil || r.Rigging != nil {
		return "peak swing (line to the load's centre of mass, from the vertical)"
	}
	return "peak swing (rope angle from the vertical)"
}

func residualSwingName(r *sway.Result) string {
	if r.Body != nil || r.Rigging != nil {
		return "residual swing after the last move (line to the load's centre of mass, from the vertical)"
	}
	return "residual swing after the last move"
}

// ByKey returns the figure with the given key.
func ByKey(key string) (Figure, bool) {
	for _, f := range Table {
		if f.Key == key {
			return f, true
		}
	}
	return Figure{}, false
}
