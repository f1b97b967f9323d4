// Package ropelength finds the rope length L of a scenario from what a crew
// can see or time on site, since nobody can measure the distance from the
// sheave to the load's centre of mass directly.
//
// From heights (Heights): the height of the rope's upper point of rotation
// (trolley sheave, boom or jib tip) minus the height of the hook, plus the
// depth of the slings below the hook and the depth of the load's centre of
// mass below its lifting points:
//
//	L = h_sheave - h_hook + d_sling + d_centre
//
// With a hook block the rope to the hook is h_sheave - h_hook (the hook
// block's centre of mass taken at the hook) and the rigging is
// d_sling + d_centre.
//
// From a timed swing (Timed): N full swings (there and back) in t seconds
// give the period T = t/N. A swing of amplitude theta0 is slower than a small
// one: T = 4*sqrt(L/g)*K(k), k = sin(theta0/2), with K the complete elliptic
// integral of the first kind (Abramowitz & Stegun 17.3; gonum's
// mathext.CompleteK takes the parameter m = k^2), so the small-swing period
// is T0 = T*pi/(2*K(k)) and the length L = g*(T0/(2*pi))^2, exact for one
// rope. This L is also the effective length of any load: the one rope with
// the same sway period, which is what a shaper designed by rope length
// needs.
//
// With a hook block (Hook) the swing a crew times is the slower (first)
// mode of the two-mass pendulum. Its small-swing frequency w solves
// L1*L2*w^4 - g*(1+R)*(L1+L2)*w^2 + g^2*(1+R) = 0, R = m_load/m_hook
// (linearised two-mass pendulum, as core/pendulum's LinearModes), so for
// w = 2*pi/T0 the rope to the hook is
//
//	L1 = g*(1+R)*(L2*w^2 - g) / (w^2*(L2*w^2 - g*(1+R)))
//
// which is positive exactly when T0 > 2*pi*sqrt(L2/g) (the load cannot
// swing faster than on its rigging from a fixed hook). The amplitude
// correction above is that of one rope, applied to the first mode: an
// approximation for the two masses, whose size the package tests measure
// by simulation.
//
// With a rigid load (Load: load.body) the swing timed is the rigid load's
// first mode, and the rope to the hook is the one whose first mode has
// the small-swing period: see rigid.go.
package ropelength

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mathext"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// Input is one question: heights, a timed swing, or both (then both
// answers are given and compared); Hook adds a hook block.
type Input struct {
	Heights *Heights `json:"heights,omitempty"`
	Timed   *Timed   `json:"timed,omitempty"`
	Hook    *Hook    `json:"hook,omitempty"`
	// Load is a rigid load (load.body; rigid.go), in place of Hook.
	Load *Load `json:"load,omitempty"`
}

// Heights are read off the crane (height indicator, tape, drawing), all
// from the same datum.
type Heights struct {
	// SheaveHeightM is the height of the rope's upper point of rotation:
	// trolley sheave, boom or jib tip.
	SheaveHeightM *float64 `json:"sheave_height_m"`
	// HookHeightM is the height of the hook, where the slings hang.
	HookHeightM *float64 `json:"hook_height_m"`
	// SlingDepthM is from the hook down to the load's lifting points
	// (slings, shackles, spreader).
	SlingDepthM float64 `json:"sling_depth_m,omitempty"`
	// CentreDepthM is from the lifting points down to the load's centre of
	// mass.
	CentreDepthM float64 `json:"centre_depth_m,omitempty"`
}

// Timed is a timed free swing with the crane at rest.
type Timed struct {
	// Swings is the number of full swings (there and back) timed.
	Swings *float64 `json:"swings"`
	// TimeS is how long they took.
	TimeS *float64 `json:"time_s"`
	// AmplitudeDeg is the estimated swing amplitude (the largest angle of
	// the line from the sheave to the load from the vertical); zero for a
	// small swing.
	AmplitudeDeg float64 `json:"amplitude_deg,omitempty"`
	// TimingErrorS is the possible error of TimeS, for the range of
	// lengths given; zero means DefaultTimingErrorS.
	TimingErrorS float64 `json:"timing_error_s,omitempty"`
}

// DefaultTimingErrorS is the timing error assumed when none is given: two
// presses of a stopwatch, each off by about 0.2 to 0.3 s (a person pressing
// on a count; from memory), taken as 0.5 s in all.
const DefaultTimingErrorS = 0.5

// Hook is the hook block and what hangs from it.
type Hook struct {
	MassKg     *float64 `json:"mass_kg"`
	LoadMassKg *float64 `json:"load_mass_kg"`
	// RiggingLengthM is from the hook block's centre of mass to the load's
	// centre of mass; with heights it may be left out (it is then the
	// sling depth plus the centre depth).
	RiggingLengthM float64 `json:"rigging_length_m,omitempty"`
}

// Ranges of the input fields, by JSON path, as scenario.Ranges.
var Ranges = map[string]scenario.Range{
	"heights.sheave_height_m": {Min: -500, Max: 1000, Unit: "m"},
	"heights.hook_height_m":   {Min: -500, Max: 1000, Unit: "m"},
	"heights.sling_depth_m":   {Min: 0, Max: 100, Unit: "m"},
	"heights.centre_depth_m":  {Min: 0, Max: 50, Unit: "m"},
	"timed.swings":            {Min: 0, Max: 1000, Unit: "swings", OpenMin: true},
	"timed.time_s":            {Min: 0, Max: 36000, Unit: "s", OpenMin: true},
	"timed.amplitude_deg":     {Min: 0, Max: 60, Unit: "deg"},
	"timed.timing_error_s":    {Min: 0, Max: 60, Unit: "s"},
	"hook.mass_kg":            scenario.Ranges["load.hook.mass_kg"],
	"hook.load_mass_kg":       scenario.Ranges["load.mass_kg"],
	"hook.rigging_length_m":   {Min: 0, Max: scenario.Ranges["load.hook.rigging_length_m"].Max, Unit: "m", OpenMin: true},
}

// Result is the answer. Lengths in m, periods in s.
type Result struct {
	// RopeLengthM is the scenario's load.rope_length_m: from heights when
	// given, else from the timed swing. With a hook block it is the rope
	// to the hook (the scenario's rope length then runs to the hook).
	RopeLengthM float64 `json:"rope_length_m"`
	// RiggingLengthM is the scenario's load.hook.rigging_length_m (hook
	// block); with a rigid load, the depth of its centre of mass below the
	// hook hanging still (not a scenario field: the body gives it).
	RiggingLengthM float64 `json:"rigging_length_m,omitempty"`

	FromHeights *HeightsAnswer `json:"from_heights,omitempty"`
	FromTimed   *TimedAnswer   `json:"from_timed,omitempty"`
	// DifferencePct is (timed - heights)/heights of the rope length when
	// both are given, percent.
	DifferencePct *float64 `json:"difference_pct,omitempty"`
	Notes         []string `json:"notes"`
}

// HeightsAnswer is the rope length from heights.
type HeightsAnswer struct {
	// RopeLengthM is from the sheave to the load's centre of mass (one
	// rope; with a hook block, rope to the hook plus rigging).
	RopeLengthM float64 `json:"rope_length_m"`
	// With a hook block: the rope to the hook and the rigging.
	RopeToHookM    float64 `json:"rope_to_hook_m,omitempty"`
	RiggingLengthM float64 `json:"rigging_length_m,omitempty"`
	// SmallSwingPeriodS is 2*pi*sqrt(L/g), or the first mode's with a hook
	// block: what a timed swing should give.
	SmallSwingPeriodS float64 `json:"small_swing_period_s"`
	// EffectiveLengthM is g*(T0/(2*pi))^2 for that period: the one rope
	// with the same sway period (RopeLengthM for one rope; with a hook
	// block or a rigid load, what a shaper designed by rope length needs).
	EffectiveLengthM float64 `json:"effective_length_m"`
}

// TimedAnswer is the rope length from a timed swing.
type TimedAnswer struct {
	_                 [0]func() // never compared: no equality code in the wasm
	PeriodS           float64   `json:"period_s"`             // t/N, at the amplitude timed
	SmallSwingPeriodS float64   `json:"small_swing_period_s"` // T0
	AmplitudeFactor   float64   `json:"amplitude_factor"`     // T/T0 = 2K(k)/pi
	// EffectiveLengthM is g*(T0/(2*pi))^2: the one rope with this sway
	// period (the rope length for a single-rope scenario and for shaping).
	EffectiveLengthM float64 `json:"effective_length_m"`
	// RopeToHookM is L1 with a hook block; with a rigid load the rope to
	// the hook whose first mode has the small-swing period (rigid.go).
	RopeToHookM float64 `json:"rope_to_hook_m,omitempty"`
	// RangeM is the rope length (effective, or to the hook) for the time
	// less and more the timing error.
	RangeM       [2]float64 `json:"range_m"`
	TimingErrorS float64    `json:"timing_error_s"`
}

// Find answers one question. Bad input gives scenario.Errors naming the
// field and its accepted range.
func Find(in *Input) (*Result, error) {
	if err := in.Validate(); err != nil {
		return nil, err
	}
	res := &Result{Notes: []string{}}
	var m1, m2, l2 float64
	hook := in.Hook != nil
	if hook {
		m1, m2, l2 = *in.Hook.MassKg, *in.Hook.LoadMassKg, in.Hook.RiggingLengthM
	}
	if in.Load != nil {
		if err := rigidAnswers(in, res); err != nil {
			return nil, err
		}
	} else if err := pointAnswers(in, res, hook, m1, m2, l2); err != nil {
		return nil, err
	}
	toHook := hook || in.Load != nil
	ha, ta := res.FromHeights, res.FromTimed
	switch {
	case ha != nil:
		res.RopeLengthM = ha.RopeLengthM
		if toHook {
			res.RopeLengthM = ha.RopeToHookM
		}
	default:
		res.RopeLengthM = ta.EffectiveLengthM
		if toHook {
			res.RopeLengthM = ta.RopeToHookM
		}
	}
	if ha != nil && ta != nil {
		hl, tl := ha.RopeLengthM, ta.EffectiveLengthM
		if toHook {
			hl, tl = ha.RopeToHookM, ta.RopeToHookM
		}
		d := 100 * (tl - hl) / hl
		res.DifferencePct = &d
		if hl < ta.RangeM[0] || hl > ta.RangeM[1] {
			res.Notes = append(res.Notes, fmt.Sprintf(
				"The heights give %.3g m, the timed swing %.3g m (%.3g to %.3g m within the timing error): they disagree. Check the heights, the centre of mass and the count of swings; the timed swing is what the load does.",
				hl, tl, ta.RangeM[0], ta.RangeM[1]))
		}
	}
	if ta != nil && in.Timed.AmplitudeDeg > 30 {
		res.Notes = append(res.Notes, "The swing timed was above 30 deg, outside the range the tool is meant for; time a smaller swing.")
	}
	if hook && ta != nil && in.Timed.AmplitudeDeg > 0 {
		res.Notes = append(res.Notes, "With a hook block the amplitude correction is that of one rope, applied to the slower mode: an approximation; time a small swing where you can.")
	}
	return res, nil
}

// pointAnswers fills the heights' and the timed swing's answers for one
// rope or a hook block.
func pointAnswers(in *Input, res *Result, hook bool, m1, m2, l2 float64) error {
	g := units.StandardGravity
	if h := in.Heights; h != nil {
		rope := *h.SheaveHeightM - *h.HookHeightM
		below := h.SlingDepthM + h.CentreDepthM
		a := &HeightsAnswer{RopeLengthM: rope + below}
		a.SmallSwingPeriodS = 2 * math.Pi * math.Sqrt(a.RopeLengthM/g)
		if hook {
			if l2 == 0 {
				l2 = below
			}
			a.RopeToHookM, a.RiggingLengthM = rope, l2
			a.RopeLengthM = rope + l2
			a.SmallSwingPeriodS = 2 * math.Pi / pendulum.LinearModes(m1, m2, rope, l2, g).Omega[0]
		}
		a.EffectiveLengthM = effectiveLength(a.SmallSwingPeriodS)
		res.FromHeights = a
	}
	if tm := in.Timed; tm != nil {
		var toHook func(float64) (float64, error)
		if hook {
			toHook = func(t0 float64) (float64, error) { return RopeToHook(m1, m2, l2, t0) }
		}
		a, err := timedAnswer(tm, toHook)
		if err != nil {
			return err
		}
		res.FromTimed = a
	}
	if hook {
		res.RiggingLengthM = l2
	}
	return nil
}

// timedAnswer answers the timed swing: one rope when toHook is nil, else
// the rope to the hook that toHook gives for the small-swing period.
func timedAnswer(tm *Timed, toHook func(t0 float64) (float64, error)) (*TimedAnswer, error) {
	n, t := *tm.Swings, *tm.TimeS
	errS := tm.TimingErrorS
	if errS == 0 {
		errS = DefaultTimingErrorS
	}
	k := math.Sin(tm.AmplitudeDeg * units.Degree / 2)
	factor := 2 * mathext.CompleteK(k*k) / math.Pi
	length := func(t float64) (float64, error) {
		t0 := t / n / factor
		if toHook == nil {
			return effectiveLength(t0), nil
		}
		return toHook(t0)
	}
	a := &TimedAnswer{PeriodS: t / n, AmplitudeFactor: factor, SmallSwingPeriodS: t / n / factor, TimingErrorS: errS}
	a.EffectiveLengthM = effectiveLength(a.SmallSwingPeriodS)
	l, err := length(t)
	if err != nil {
		return nil, err
	}
	if toHook != nil {
		a.RopeToHookM = l
	}
	lo, _ := length(math.Max(t-errS, 1e-9))
	hi, err := length(t + errS)
	if err != nil {
		hi = scenario.Ranges["load.rope_length_m"].Max
	}
	a.RangeM = [2]float64{math.Max(lo, 0), hi}
	if l < scenario.MinRopeM || l > scenario.Ranges["load.rope_length_m"].Max {
		return nil, scenario.Errors{{Field: "timed.time_s", Message: fmt.Sprintf(
			"%g swings in %g s give a rope length of %.4g m, outside the model's range (%s); check the count and the time",
			n, t, l, scenario.Ranges["load.rope_length_m"].Text())}}
	}
	return a, nil
}

// effectiveLength is the one rope's length with the small-swing period
// t0: L = g*(t0/(2*pi))^2, from T0 = 2*pi*sqrt(L/g) (any mechanics text).
func effectiveLength(t0 float64) float64 {
	return units.StandardGravity * math.Pow(t0/(2*math.Pi), 2)
}

// RopeToHook is the rope length to the hook block (mass m1) whose first
// mode, with the load (mass m2) on rigging l2, has the small-swing period
// t0 (see the package comment). The error names timed.time_s when no rope
// length gives that period.
func RopeToHook(m1, m2, l2, t0 float64) (float64, error) {
	g := units.StandardGravity
	tMin := 2 * math.Pi * math.Sqrt(l2/g)
	if t0 <= tMin {
		return 0, scenario.Errors{{Field: "timed.time_s", Message: fmt.Sprintf(
			"a small-swing period of %.4g s is too short for %.4g m of rigging: the load swings at least as slowly as on its rigging from a fixed hook (%.4g s); check the count, the time and the rigging length",
			t0, l2, tMin)}}
	}
	r := m2 / m1
	w2 := math.Pow(2*math.Pi/t0, 2)
	return g * (1 + r) * (l2*w2 - g) / (w2 * (l2*w2 - g*(1+r))), nil
}
