// Package units holds the physical constants and the unit conversion factors
// used everywhere in swaysheet. The core computes in SI; every conversion to
// and from the units people read off a crane goes through the table here, so
// that there is one source of truth for each factor.
//
// Factors are exact by definition as given in NIST Special Publication 811
// (2008), appendix B, and the SI Brochure (9th ed., 2019).
package units

import (
	"math"
	"sort"
)

// StandardGravity is g_n in m/s^2 (3rd CGPM 1901; ISO 80000-3).
const StandardGravity = 9.80665

// AirDensity is the air density, kg/m^3, used for wind pressure
// q = 0.5*rho*v^2 when a scenario gives none (the value used in crane
// standards such as EN 13001-2 and ISO 4302; from memory).
const AirDensity = 1.25

// Exact factors to SI (NIST SP 811, appendix B).
const (
	Foot         = 0.3048                 // m
	Inch         = 0.0254                 // m
	Pound        = 0.45359237             // kg
	PoundForce   = 4.4482216152605        // N
	Kip          = 1000 * PoundForce      // N
	ShortTon     = 2000 * Pound           // kg
	Tonne        = 1000                   // kg
	TonneForce   = 1000 * StandardGravity // N
	Minute       = 60                     // s
	Degree       = math.Pi / 180          // rad
	RevPerMinute = 2 * math.Pi / 60       // rad/s
)

// Unit is one unit of measure of a quantity: its symbol and the factor that
// turns a value in it into the quantity's SI unit (value_SI = value*ToSI).
type Unit struct {
	Symbol string  `json:"symbol"`
	Name   string  `json:"name"`
	ToSI   float64 `json:"to_si"`
}

// Quantity is a kind of input or result and the units it may be shown in.
// SI is the unit the core uses; Units[0] is always SI.
type Quantity struct {
	Name  string `json:"name"`
	Units []Unit `json:"units"`
	// Default units for the "si" and "us" unit systems, by symbol.
	SIDefault string `json:"si_default"`
	USDefault string `json:"us_default"`
}

// Table lists every quantity the page shows, keyed by name.
var Table = map[string]Quantity{
	"length": {Name: "length", SIDefault: "m", USDefault: "ft", Units: []Unit{
		{"m", "metre", 1}, {"ft", "foot", Foot}, {"in", "inch", Inch}}},
	"mass": {Name: "mass", SIDefault: "kg", USDefault: "lb", Units: []Unit{
		{"kg", "kilogram", 1}, {"t", "tonne", Tonne}, {"lb", "pound", Pound}, {"sh tn", "short ton", ShortTon}}},
	"speed": {Name: "speed", SIDefault: "m/min", USDefault: "ft/min", Units: []Unit{
		{"m/s", "metre per second", 1}, {"m/min", "metre per minute", 1.0 / Minute},
		{"ft/s", "foot per second", Foot}, {"ft/min", "foot per minute", Foot / Minute}}},
	"acceleration": {Name: "acceleration", SIDefault: "m/s²", USDefault: "ft/s²", Units: []Unit{
		{"m/s²", "metre per second squared", 1}, {"ft/s²", "foot per second squared", Foot}}},
	"angle": {Name: "angle", SIDefault: "deg", USDefault: "deg", Units: []Unit{
		{"deg", "degree", 1}}}, // scenarios and results carry angles in degrees
	"angular_speed": {Name: "angular speed", SIDefault: "deg/s", USDefault: "rpm", Units: []Unit{
		{"deg/s", "degree per second", 1}, {"rpm", "revolution per minute", 360.0 / Minute}}},
	"angular_acceleration": {Name: "angular acceleration", SIDefault: "deg/s²", USDefault: "deg/s²", Units: []Unit{
		{"deg/s²", "degree per second squared", 1}}},
	"force": {Name: "force", SIDefault: "kN", USDefault: "lbf", Units: []Unit{
		{"N", "newton", 1}, {"kN", "kilonewton", 1000}, {"lbf", "pound-force", PoundForce},
		{"kip", "kip", Kip}, {"tf", "tonne-force", TonneForce}}},
	"time": {Name: "time", SIDefault: "s", USDefault: "s", Units: []Unit{{"s", "second", 1}}},
	"area": {Name: "area", SIDefault: "m²", USDefault: "ft²", Units: []Unit{
		{"m²", "square metre", 1}, {"ft²", "square foot", Foot * Foot}}},
	"density": {Name: "density", SIDefault: "kg/m³", USDefault: "kg/m³", Units: []Unit{
		{"kg/m³", "kilogram per cubic metre", 1}}},
	"ratio": {Name: "ratio", SIDefault: "", USDefault: "", Units: []Unit{{"", "", 1}}},
}

// ToSI converts v in the unit with the given symbol of quantity q to SI.
// It reports false if the quantity or unit is unknown.
func ToSI(q, symbol string, v float64) (float64, bool) {
	u, ok := find(q, symbol)
	if !ok {
		return 0, false
	}
	return v * u.ToSI, true
}

// FromSI converts v in SI to the unit with the given symbol of quantity q.
func FromSI(q, symbol string, v float64) (float64, bool) {
	u, ok := find(q, symbol)
	if !ok {
		return 0, false
	}
	return v / u.ToSI, true
}

func find(q, symbol string) (Unit, bool) {
	for _, u := range Table[q].Units {
		if u.Symbol == symbol {
			return u, true
		}
	}
	return Unit{}, false
}

// QuantityOf names the quantity of Table whose SI unit has the given
// symbol, or "" when there is none. Scenarios carry angles in degrees, so
// "deg" is the angle quantity. Names are tried in sorted order, so the
// answer does not depend on map order.
func QuantityOf(siSymbol string) string {
	names := make([]string, 0, len(Table))
	for k := range Table {
		names = append(names, k)
	}
	sort.Strings(names)
	for _, k := range names {
		if q := Table[k]; len(q.Units) > 0 && q.Units[0].Symbol == siSymbol {
			return k
		}
	}
	return ""
}
