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
	v := m.kinematic(ax.Kind)
	return Drive{Axis: ax, Distance: v[0], Speed: v[1], Accel: v[2], Decel: v[3], Jerk: v[4], m: m}, true
}

// kinematic is the table of m's kinematic fields of kind k, in the order
// of the kind's names (Distance, Speed, Accel, Decel, Jerk): the degree
// fields for the angular kind, the metre fields for the linear one.
func (m *Motion) kinematic(k *crane.Kind) [5]*float64 {
	if k == crane.Angular {
		return [5]*float64{m.AngleDeg, m.RateDegPerS, m.AccelDegPerS2, m.DecelDegPerS2, m.JerkDegPerS3}
	}
	return [5]*float64{m.DistanceM, m.SpeedMPerS, m.AccelMPerS2, m.DecelMPerS2, m.JerkMPerS3}
}

// Field is the move's field of the given kind and name (one of the kind's
// Distance, Speed, Accel, Decel, Jerk names), nil when absent or unknown:
// a move of this axis must not have those of the other kind.
func (d Drive) Field(k *crane.Kind, name string) *float64 {
	v := d.m.kinematic(k)
	for i, n := range [5]string{k.Distance, k.Speed, k.Accel, k.Decel, k.Jerk} {
		if n == name {
			return v[i]
		}
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
