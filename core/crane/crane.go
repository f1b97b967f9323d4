// Package crane is the one place that knows a crane's axes and geometry:
// which axes there are, whether each moves in metres or degrees (its
// scenario fields, units and conversion to the model's SI units), whether
// the planner plans it, and how the axes together move the point the rope
// hangs from (Drives.Suspension). The scenario's validation, the
// scenario-to-model translation in core/sway and the sheet's words read it
// from here; a new crane type (a luffing jib, a boom) is a new Role and
// its geometry here, its fields in the scenario format, and the page's
// form.
package crane

import "swaysheet/core/units"

// Kind is how an axis moves: in metres or in degrees. It names the
// scenario fields of a move of the axis, each with its unit in the name.
type Kind struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Name  string // "linear" or "angular"
	Words string // "metres", "degrees": "the slew axis moves in degrees"
	// Unit, SpeedUnit and AccelUnit are the units of the scenario's
	// fields; ToSI turns them into the model's (m or rad).
	Unit, SpeedUnit, AccelUnit string
	ToSI                       float64
	// The scenario fields of a move: distance, top speed, acceleration,
	// braking, jerk.
	Distance, Speed, Accel, Decel, Jerk string
	// The plan block's fields (plan.distance_m or plan.angle_deg is
	// Distance): the top speed and the largest acceleration.
	TopSpeed, MaxAccel string
	// CSVSuffix is the unit part of a record's column ("_m", "_deg").
	CSVSuffix string
	// The core/units quantities of a distance, a speed and an
	// acceleration of the axis (their first unit is the scenario's).
	Quantity, SpeedQuantity, AccelQuantity string
}

// Linear and Angular are the two kinds of axis; Kinds lists them.
var (
	Linear = &Kind{Name: "linear", Words: "metres", Unit: "m", SpeedUnit: "m/s", AccelUnit: "m/s²", ToSI: 1,
		Distance: "distance_m", Speed: "speed_m_per_s", Accel: "accel_m_per_s2", Decel: "decel_m_per_s2",
		Jerk: "jerk_m_per_s3", TopSpeed: "top_speed_m_per_s", MaxAccel: "max_accel_m_per_s2", CSVSuffix: "_m",
		Quantity: "length", SpeedQuantity: "speed", AccelQuantity: "acceleration"}
	Angular = &Kind{Name: "angular", Words: "degrees", Unit: "deg", SpeedUnit: "deg/s", AccelUnit: "deg/s²",
		ToSI: units.Degree, Distance: "angle_deg", Speed: "rate_deg_per_s", Accel: "accel_deg_per_s2",
		Decel: "decel_deg_per_s2", Jerk: "jerk_deg_per_s3", TopSpeed: "top_rate_deg_per_s", MaxAccel: "max_accel_deg_per_s2",
		CSVSuffix: "_deg", Quantity: "angle", SpeedQuantity: "angular_speed", AccelQuantity: "angular_acceleration"}
	Kinds = []*Kind{Linear, Angular}
)

// Pick is linear or angular by the kind: for the values and fields a type
// holds once for each kind (distance_m and angle_deg).
func Pick[T any](k *Kind, linear, angular T) T {
	if k == Angular {
		return angular
	}
	return linear
}

// Role is what an axis does to the suspension point or the rope.
type Role int

// The roles of the axes of the cranes modelled: overhead and gantry
// cranes (travel on x and y) and tower cranes (slew, trolley on the jib),
// each with a hoist.
const (
	AlongX Role = iota // moves the suspension point along x
	AlongY             // along y
	Turn               // turns the jib about the vertical axis through the origin
	Reach              // moves the suspension point out along the jib (the hook radius)
	Rope               // hoists: the rope shortens as the axis moves up (positive)
	roles
)

// Axis is one crane axis as the scenario names it.
type Axis struct {
	_     [0]func() // never compared: no equality code in the wasm
	Name  string    // the scenario's "axis" value
	Words string    // as the page and the sheet name it
	Kind  *Kind
	Role  Role
	// Plannable: the planner plans a move of this axis (plan.axis).
	Plannable bool
	// Needs is the crane block's field (JSON path) that the axis'
	// geometry needs above 0 to be planned ("crane.radius_m": a slew
	// moves the hook along an arc of that radius); empty: none.
	Needs string
}

// Axes lists every axis, in display order.
var Axes = []Axis{
	{Name: "travel_x", Words: "travel x", Kind: Linear, Role: AlongX, Plannable: true},
	{Name: "travel_y", Words: "travel y", Kind: Linear, Role: AlongY, Plannable: true},
	{Name: "slew", Words: "slew", Kind: Angular, Role: Turn, Plannable: true, Needs: "crane.radius_m"},
	{Name: "radius", Words: "trolley on the jib (radius)", Kind: Linear, Role: Reach},
	{Name: "hoist", Words: "hoist (up +)", Kind: Linear, Role: Rope},
}

// Of returns the axis of the given name.
func Of(name string) (Axis, bool) {
	for _, a := range Axes {
		if a.Name == name {
			return a, true
		}
	}
	return Axis{}, false
}

// Names lists the axis names, in display order; with plannable, only
// those the planner plans.
func Names(plannable bool) []string {
	var out []string
	for _, a := range Axes {
		if a.Plannable || !plannable {
			out = append(out, a.Name)
		}
	}
	return out
}

// KindWords are the crew's words for the crane kinds of the scenario's
// crane.kind, as the sheet prints them.
var KindWords = map[string]string{
	"overhead": "overhead (bridge and trolley)",
	"gantry":   "gantry (gantry travel and trolley)",
	"tower":    "tower (slewing jib with trolley)",
	"slewing":  "slewing",
	"monorail": "monorail (trolley on a beam)",
}

// WordsFor names an axis as the crew of a crane of the given kind says it
// (crane.kind): on an overhead crane travel x is the bridge's travel and
// travel y the trolley's; an unknown kind keeps the axis' own words.
func WordsFor(kind, axis string) string {
	a, ok := Of(axis)
	if !ok {
		return axis
	}
	bridge := map[string]string{"overhead": "bridge travel", "gantry": "gantry travel"}[kind]
	switch {
	case bridge != "" && a.Role == AlongX:
		return bridge + " (x)"
	case bridge != "" && a.Role == AlongY:
		return "trolley travel (y)"
	case kind == "monorail" && a.Role == AlongX:
		return "trolley travel (x)"
	}
	return a.Words
}
