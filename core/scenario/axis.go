package scenario

import (
	"math"

	"swaysheet/core/crane"
	"swaysheet/core/units"
)

// Start is where the crane block puts the axes at time zero, in the
// model's units.
func (c Crane) Start() crane.Start {
	return crane.Start{RadiusM: c.RadiusM, SlewRad: c.SlewDeg * units.Degree}
}

// Field is the crane block's value at its JSON path, for the fields an
// axis' geometry needs (crane.Axis.Needs); NaN for a path it does not
// hold.
func (c Crane) Field(path string) float64 {
	switch path {
	case "crane.radius_m":
		return c.RadiusM
	case "crane.slew_deg":
		return c.SlewDeg
	}
	return math.NaN()
}

// Drive is a move's kinematic fields, whichever kind its axis is: the
// metre fields of a linear axis, the degree fields of an angular one
// (crane.Kind names them), in the scenario's units. Kind.ToSI turns
// them into the model's.
type Drive struct {
	Axis                                crane.Axis
	Distance, Speed, Accel, Decel, Jerk *float64
	m                                   *Motion
}

// Drive reads m's kinematic fields by its axis' kind; ok is false for an
// unknown axis. (Plain fields, no maps: every evaluation of a plan's
// moves reads them, and in wasm a map costs more than the rest.)
func (m *Motion) Drive() (Drive, bool) {
	ax, ok := crane.Of(m.Axis)
	if !ok {
		return Drive{}, false
	}
	d := Drive{Axis: ax, m: m}
	if ax.Kind == crane.Angular {
		d.Distance, d.Speed, d.Accel, d.Decel, d.Jerk = m.AngleDeg, m.RateDegPerS, m.AccelDegPerS2, m.DecelDegPerS2, m.JerkDegPerS3
	} else {
		d.Distance, d.Speed, d.Accel, d.Decel, d.Jerk = m.DistanceM, m.SpeedMPerS, m.AccelMPerS2, m.DecelMPerS2, m.JerkMPerS3
	}
	return d, true
}

// Field is the move's field of the given kind and name (one of the kind's
// Distance, Speed, Accel, Decel, Jerk names), nil when absent or unknown:
// a move of this axis must not have those of the other kind.
func (d Drive) Field(k *crane.Kind, name string) *float64 {
	m := d.m
	if k == crane.Angular {
		switch name {
		case k.Distance:
			return m.AngleDeg
		case k.Speed:
			return m.RateDegPerS
		case k.Accel:
			return m.AccelDegPerS2
		case k.Decel:
			return m.DecelDegPerS2
		case k.Jerk:
			return m.JerkDegPerS3
		}
		return nil
	}
	switch name {
	case k.Distance:
		return m.DistanceM
	case k.Speed:
		return m.SpeedMPerS
	case k.Accel:
		return m.AccelMPerS2
	case k.Decel:
		return m.DecelMPerS2
	case k.Jerk:
		return m.JerkMPerS3
	}
	return nil
}

// Speed is the step's speed in the unit of the axis' kind.
func (st *SpeedStep) Speed(k *crane.Kind) *float64 {
	if k == crane.Angular {
		return st.RateDegPerS
	}
	return st.SpeedMPerS
}
