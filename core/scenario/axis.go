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
	// Given and Other are the fields by name: those of the axis' kind,
	// and those of the other kinds (which a move of this axis must not
	// have).
	Given, Other map[string]*float64
}

// Drive reads m's kinematic fields by its axis' kind; ok is false for an
// unknown axis.
func (m *Motion) Drive() (Drive, bool) {
	ax, ok := crane.Of(m.Axis)
	if !ok {
		return Drive{}, false
	}
	byKind := map[*crane.Kind]map[string]*float64{
		crane.Linear: {"distance_m": m.DistanceM, "speed_m_per_s": m.SpeedMPerS, "accel_m_per_s2": m.AccelMPerS2,
			"decel_m_per_s2": m.DecelMPerS2, "jerk_m_per_s3": m.JerkMPerS3},
		crane.Angular: {"angle_deg": m.AngleDeg, "rate_deg_per_s": m.RateDegPerS, "accel_deg_per_s2": m.AccelDegPerS2,
			"decel_deg_per_s2": m.DecelDegPerS2, "jerk_deg_per_s3": m.JerkDegPerS3},
	}
	k := ax.Kind
	d := Drive{Axis: ax, Given: byKind[k], Other: map[string]*float64{}}
	d.Distance, d.Speed, d.Accel, d.Decel, d.Jerk = d.Given[k.Distance], d.Given[k.Speed], d.Given[k.Accel], d.Given[k.Decel], d.Given[k.Jerk]
	for kind, fields := range byKind {
		if kind != k {
			for name, v := range fields {
				d.Other[name] = v
			}
		}
	}
	return d, true
}

// Speed is the step's speed in the unit of the axis' kind.
func (st *SpeedStep) Speed(k *crane.Kind) *float64 {
	if k == crane.Angular {
		return st.RateDegPerS
	}
	return st.SpeedMPerS
}
