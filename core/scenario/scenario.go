// Package scenario is the swaysheet scenario file: one lift's load, rope,
// crane motions, wind, initial swing, limits and solver settings, as JSON.
//
// The format is versioned (Format and Version). All quantities are SI and
// each field carries its unit in its name (rope_length_m, speed_m_per_s);
// angles are in degrees. Decode rejects unknown fields, missing required
// fields and out-of-range values, naming the field, the value and the
// accepted range. The JSON Schema of the format is schema.json beside this
// file.
package scenario

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"strings"

	"swaysheet/core/crane"
)

// FormatName and Version identify the file format.
const (
	FormatName = "swaysheet-scenario"
	Version    = 1
)

// Axes lists the axis names in display order (core/crane's table).
var Axes = crane.Names(false)

// Scenario is one lift to check.
type Scenario struct {
	Format      string `json:"format"`
	Version     int    `json:"version"`
	Name        string `json:"name"`
	Description string `json:"description,omitempty"`
	// Example marks invented demonstration data.
	Example bool `json:"example,omitempty"`

	Load     Load      `json:"load"`
	Crane    Crane     `json:"crane,omitzero"`
	Motions  []Motion  `json:"motions"`
	Wind     *Wind     `json:"wind,omitempty"`
	Initial  *Initial  `json:"initial,omitempty"`
	Limits   *Limits   `json:"limits,omitempty"`
	Settings *Settings `json:"settings,omitempty"`
	// Sheet holds the user's reference fields for the printed check sheet.
	Sheet *Sheet `json:"sheet,omitempty"`
	// Plan asks the planner for drive settings (see plan.go).
	Plan *Plan `json:"plan,omitempty"`
	// Site holds the obstacles for the clearance check (see site.go).
	Site *Site `json:"site,omitempty"`
}

// Load is the hook load and its rope.
type Load struct {
	MassKg *float64 `json:"mass_kg"`
	// RopeLengthM is the distance from the rope's upper point of rotation
	// (trolley sheave, boom or jib tip) to the load's centre of mass, hook
	// block and rigging included.
	RopeLengthM *float64 `json:"rope_length_m"`
	// AreaM2 is the load's projected area facing the wind, m^2.
	AreaM2 float64 `json:"area_m2,omitempty"`
	// DragCoefficient, when positive, adds quadratic air drag on the load's
	// motion: F = -0.5*rho*c*A*|v|*v.
	DragCoefficient float64 `json:"drag_coefficient,omitempty"`
	// Hook, when present, models the hook block and the rigged load as two
	// masses (a double pendulum). Then RopeLengthM runs to the hook block's
	// centre of mass and MassKg is the rigged load without the hook block.
	Hook *Hook `json:"hook,omitempty"`
	// Body, when present, models the load as a rigid box on a sling set
	// (see body.go); RopeLengthM then runs to the hook.
	Body *Body `json:"body,omitempty"`
}

// Hook is the hook block and the rigging below it.
type Hook struct {
	MassKg *float64 `json:"mass_kg"`
	// RiggingLengthM is the distance from the hook block's centre of mass
	// to the load's centre of mass, slings and spreader included.
	RiggingLengthM *float64 `json:"rigging_length_m"`
}

// Crane is the crane's geometry at the start of the run. The suspension
// point is at (x + r*cos(slew), y + r*sin(slew)), with x and y the travel
// positions and r the slew radius.
type Crane struct {
	// Kind describes the crane: overhead, gantry, tower, slewing, monorail.
	Kind    string  `json:"kind,omitempty"`
	RadiusM float64 `json:"radius_m,omitempty"`
	SlewDeg float64 `json:"slew_deg,omitempty"`
}

// Motion is one move of one axis. Travel, radius and hoist axes take the
// _m fields, the slew axis the _deg fields. StartS shifts the whole move
// (a hard stop, which moves from t = 0, takes none). Decel, when not given,
// is Accel (trapezoid, s_curve, steps, sine_ramp); a hard stop needs its
// own.
type Motion struct {
	Axis    string  `json:"axis"`
	Profile string  `json:"profile,omitempty"` // "trapezoid" (default)
	StartS  float64 `json:"start_s,omitempty"`

	DistanceM   *float64 `json:"distance_m,omitempty"`
	SpeedMPerS  *float64 `json:"speed_m_per_s,omitempty"`
	AccelMPerS2 *float64 `json:"accel_m_per_s2,omitempty"`
	DecelMPerS2 *float64 `json:"decel_m_per_s2,omitempty"`

	AngleDeg      *float64 `json:"angle_deg,omitempty"`
	RateDegPerS   *float64 `json:"rate_deg_per_s,omitempty"`
	AccelDegPerS2 *float64 `json:"accel_deg_per_s2,omitempty"`
	DecelDegPerS2 *float64 `json:"decel_deg_per_s2,omitempty"`

	// Fields of the other profiles and the input shaper (see profiles.go).
	ProfileFields

	// Stop cuts the move by an emergency stop. It is not part of the
	// file format: the clearance check's draws set it on their copies
	// (site.spread.emergency_stop).
	Stop *StopCut `json:"-"`
}

// StopCut is an emergency stop of one move (motion.Stopped): at AtS the
// axis keeps its speed for ReactionS, then brakes at Decel (in the axis'
// unit, m/s² or deg/s²; zero: the move's own decel_*, or accel_* when it
// has none) to rest.
type StopCut struct {
	AtS, ReactionS, Decel float64
}

// Wind is a horizontal wind on the load, given as the force it makes on
// the load hanging still (ForceN) or as a wind speed (SpeedMPerS), from
// which that force is F = q*A*c with q = 0.5*rho*v^2, A the load's
// load.area_m2 and c the ShapeFactor. The speed is the 3-s gust speed at
// the load's height (from the site's anemometer or the forecast, taken up
// to that height), the speed crane wind limits are usually given in.
//
// With load.drag_coefficient set the air also acts on the load's motion:
// the drag is on the load's speed relative to the air, and the wind force
// above stays the force on the load at rest, so nothing is counted twice.
// The rule, with s(t) the wind speed's fraction of full (0 to 1, see
// RampS), e the unit vector toward TowardDeg and
// k = 0.5*rho*load.drag_coefficient*load.area_m2:
//
//	air velocity     w(t) = s(t) * V * e
//	force on load    F(t, v) = s^2*F_w*e - k*( |v - w|(v - w) + s^2*V^2*e )
//
// where v is the load's ground velocity, F_w the force at rest at full
// wind (ForceN or q*A*c) and V the full air speed: SpeedMPerS, or for a
// typed force the speed that makes that force through the drag,
// V = sqrt(F_w/k). At v = 0 the bracket vanishes and F = s^2*F_w*e; with a
// typed force, or a speed whose shape factor equals the drag coefficient,
// F is exactly -k*|v - w|(v - w). Without drag F = s^2*F_w*e, without wind
// F = -k*|v|*v.
type Wind struct {
	ForceN            *float64 `json:"force_n,omitempty"`
	SpeedMPerS        *float64 `json:"speed_m_per_s,omitempty"`
	ShapeFactor       float64  `json:"shape_factor,omitempty"`
	AirDensityKgPerM3 float64  `json:"air_density_kg_per_m3,omitempty"`
	// TowardDeg is the direction the wind pushes the load, degrees from +x
	// toward +y.
	TowardDeg float64 `json:"toward_deg,omitempty"`
	StartS    float64 `json:"start_s,omitempty"`
	// DurationS is how long the wind blows; zero means to the end of the run.
	DurationS float64 `json:"duration_s,omitempty"`
	// RampS is the gust's rise time: the wind speed rises linearly from 0
	// at StartS to full at StartS + RampS and, with DurationS, falls
	// linearly over RampS from StartS + DurationS, so its fraction of full
	// is s(t) = clamp((t - StartS)/RampS) - clamp((t - StartS - DurationS)/RampS)
	// with clamp to [0, 1]; the force goes as s^2 (a typed force too).
	// Zero (the default) is a sudden step on and off.
	RampS float64 `json:"ramp_s,omitempty"`
}

// Initial is the swing at time zero; the zero value hangs still.
type Initial struct {
	SwingDeg  float64 `json:"swing_deg,omitempty"`
	TowardDeg float64 `json:"toward_deg,omitempty"`
	// Horizontal velocity of the load relative to the suspension point.
	VelocityXMPerS float64 `json:"velocity_x_m_per_s,omitempty"`
	VelocityYMPerS float64 `json:"velocity_y_m_per_s,omitempty"`
}

// Limits are the plan's allowed values; each is optional.
type Limits struct {
	PeakSwingDeg     *float64 `json:"peak_swing_deg,omitempty"`
	PeakExcursionM   *float64 `json:"peak_excursion_m,omitempty"`
	ResidualSwingDeg *float64 `json:"residual_swing_deg,omitempty"`
	// ResidualExcursionM is the residual swing allowed as a distance of
	// the load from straight below the suspension point (a landing
	// tolerance).
	ResidualExcursionM *float64 `json:"residual_excursion_m,omitempty"`
	TensionFactor      *float64 `json:"tension_factor,omitempty"`
	// PeakTiltDeg is the largest tilt of a rigid load (load.body: its
	// height axis from the vertical) the rigging plan allows; a load
	// given as a point has no tilt and is not held against it.
	PeakTiltDeg *float64 `json:"peak_tilt_deg,omitempty"`
}

// Settings tune the computation; the zero value is the default.
type Settings struct {
	// Accuracy is "default" or "tight".
	Accuracy string `json:"accuracy,omitempty"`
	// RelTol overrides the integrator's relative tolerance.
	RelTol float64 `json:"rel_tol,omitempty"`
	// SettlePeriods is how many sway periods are simulated after the last
	// motion ends, or the wind last changes if that is later, to measure the
	// residual swing (at least 2; default 3).
	SettlePeriods float64 `json:"settle_periods,omitempty"`
	// DurationS is the shortest run; the run is longer if the motions need it.
	DurationS float64 `json:"duration_s,omitempty"`
	// Samples is the number of evenly spaced points in the time histories.
	Samples int `json:"samples,omitempty"`
}

// Sheet is free text for the printed check sheet.
type Sheet struct {
	Project         string `json:"project,omitempty"`
	LiftReference   string `json:"lift_reference,omitempty"`
	Crane           string `json:"crane,omitempty"`
	LoadDescription string `json:"load_description,omitempty"`
	PreparedBy      string `json:"prepared_by,omitempty"`
	CheckedBy       string `json:"checked_by,omitempty"`
	Date            string `json:"date,omitempty"`
}

// FieldError is one bad value, named by its JSON path.
type FieldError struct {
	Field   string `json:"field"`
	Message string `json:"message"`
}

func (e FieldError) Error() string { return e.Field + ": " + e.Message }

// Errors is every problem found in one scenario.
type Errors []FieldError

func (es Errors) Error() string {
	parts := make([]string, len(es))
	for i, e := range es {
		parts[i] = e.Error()
	}
	return strings.Join(parts, "; ")
}

// MaxFileBytes bounds the size of a scenario file.
const MaxFileBytes = 1 << 20

// Decode reads one scenario from JSON and validates it.
func Decode(r io.Reader) (*Scenario, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxFileBytes+1))
	if err != nil {
		return nil, err
	}
	return Parse(data)
}

// Parse decodes and validates one scenario.
func Parse(data []byte) (*Scenario, error) {
	if len(data) > MaxFileBytes {
		return nil, Errors{{Field: "(file)", Message: fmt.Sprintf("the file is larger than %d bytes", MaxFileBytes)}}
	}
	if fe := checkDepth(data); fe != nil {
		return nil, Errors{*fe}
	}
	if fe := checkKeys(data); fe != nil {
		return nil, Errors{*fe}
	}
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	var s Scenario
	if err := dec.Decode(&s); err != nil {
		return nil, Errors{jsonError(err, data)}
	}
	if dec.More() {
		return nil, Errors{{Field: "(file)", Message: "there is more after the scenario's closing brace"}}
	}
	if err := s.Validate(); err != nil {
		return nil, err
	}
	return &s, nil
}

func jsonError(err error, data []byte) FieldError {
	var te *json.UnmarshalTypeError
	var se *json.SyntaxError
	switch {
	case errors.As(err, &te):
		f := te.Field
		if p := pathAtOffset(data, te.Offset); p != "" {
			f = p
		}
		if f == "" {
			f = "(file)"
		}
		return FieldError{Field: f, Message: typeMessage(te.Type, te.Value)}
	case errors.As(err, &se):
		return FieldError{Field: "(file)", Message: fmt.Sprintf("not valid JSON at byte %d: %v", se.Offset, se)}
	case errors.Is(err, io.EOF):
		return FieldError{Field: "(file)", Message: "the file is empty"}
	case errors.Is(err, io.ErrUnexpectedEOF):
		return FieldError{Field: "(file)", Message: "the file ends in the middle of the scenario"}
	}
	msg := strings.TrimPrefix(err.Error(), "json: ")
	if f, ok := strings.CutPrefix(msg, "unknown field "); ok {
		name := strings.Trim(f, `"`)
		if name == "" {
			name = `""` // a key that is the empty string
		}
		return FieldError{Field: unknownFieldPath(data, name), Message: "unknown field; see the scenario schema for the accepted fields"}
	}
	return FieldError{Field: "(file)", Message: msg}
}

// Encode writes s as indented JSON.
func Encode(w io.Writer, s *Scenario) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(s)
}
