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
)

// StandardGravity is g_n in m/s^2 (3rd CGPM 1901; ISO 80000-3).
const StandardGravity = 9.80665

// AirDensity is the air density, kg/m^3, used for wind pressure
// q = 0.5*rho*v^2 when a scenario gives none (the value used in crane
// standards such as EN 13001-2 and ISO 4302; from memory).
const AirDensity = 1.25

// Exact factors to SI (NIST SP 811, appendix B).
const (
	Foot       = 0.3048                 // m
	Inch       = 0.0254                 // m
	Pound      = 0.45359237             // kg
	PoundForce = 4.4482216152605        // N
	Kip        = 1000 * PoundForce      // N
	ShortTon   = 2000 * Pound           // kg
	Tonne      = 1000                   // kg
	TonneForce = 1000 * StandardGravity // N
	Minute     = 60                     // s
	Degree     = math.Pi / 180          // rad
)

// Unit is one unit of measure of a quantity: its symbol and the factor that
// turns a value in it into the quantity's SI unit (value_SI = value*ToSI).
type Unit struct {
	Symbol string  `json:"symbol"`
	Name   string  `json:"name"`
	ToSI   float64 `json:"to_si"`
	// Step is how finely a result in this unit is given to people (0.1
	// for degrees, 0.01 for metres): the value is rounded to a whole
	// number of steps (Round). Zero: four significant digits.
	Step float64 `json:"step,omitempty"`
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
var Table = tableOf(quantities)

// quantities are the entries of Table.
var quantities = []keyedQuantity{
	{"length", Quantity{Name: "length", SIDefault: "m", USDefault: "ft", Units: []Unit{
		{"m", "metre", 1, 0.01}, {"ft", "foot", Foot, 0.05}, {"in", "inch", Inch, 0.5}}}},
	{"mass", Quantity{Name: "mass", SIDefault: "kg", USDefault: "lb", Units: []Unit{
		{"kg", "kilogram", 1, 1}, {"t", "tonne", Tonne, 0.01}, {"lb", "pound", Pound, 1}, {"sh tn", "short ton", ShortTon, 0.01}}}},
	{"speed", Quantity{Name: "speed", SIDefault: "m/min", USDefault: "ft/min", Units: []Unit{
		{"m/s", "metre per second", 1, 0.01}, {"m/min", "metre per minute", 1.0 / Minute, 0.1},
		{"ft/s", "foot per second", Foot, 0.05}, {"ft/min", "foot per minute", Foot / Minute, 1}}}},
	{"acceleration", Quantity{Name: "acceleration", SIDefault: "m/s²", USDefault: "ft/s²", Units: []Unit{
		{"m/s²", "metre per second squared", 1, 0.01}, {"ft/s²", "foot per second squared", Foot, 0.05}}}},
	{"angle", Quantity{Name: "angle", SIDefault: "deg", USDefault: "deg", Units: []Unit{
		{"deg", "degree", 1, 0.1}}}}, // scenarios and results carry angles in degrees
	{"angular_speed", Quantity{Name: "angular speed", SIDefault: "deg/s", USDefault: "rpm", Units: []Unit{
		{"deg/s", "degree per second", 1, 0.01}, {"rpm", "revolution per minute", 360.0 / Minute, 0.01}}}},
	{"angular_acceleration", Quantity{Name: "angular acceleration", SIDefault: "deg/s²", USDefault: "deg/s²", Units: []Unit{
		{"deg/s²", "degree per second squared", 1, 0.01}}}},
	{"force", Quantity{Name: "force", SIDefault: "kN", USDefault: "lbf", Units: []Unit{
		{"N", "newton", 1, 100}, {"kN", "kilonewton", 1000, 0.1}, {"lbf", "pound-force", PoundForce, 10},
		{"kip", "kip", Kip, 0.01}, {"tf", "tonne-force", TonneForce, 0.01}}}},
	{"time", Quantity{Name: "time", SIDefault: "s", USDefault: "s", Units: []Unit{{"s", "second", 1, 0.1}}}},
	{"area", Quantity{Name: "area", SIDefault: "m²", USDefault: "ft²", Units: []Unit{
		{"m²", "square metre", 1, 0.01}, {"ft²", "square foot", Foot * Foot, 0.1}}}},
	{"density", Quantity{Name: "density", SIDefault: "kg/m³", USDefault: "kg/m³", Units: []Unit{
		{"kg/m³", "kilogram per cubic metre", 1, 0.01}}}},
	{"ratio", Quantity{Name: "ratio", SIDefault: "", USDefault: "", Units: []Unit{{"", "", 1, 0.01}}}},
	// A share of a whole: the core holds 0 to 1, people read per cent.
	// (QuantityOf("") stays "ratio": names are tried in sorted order.)
	{"share", Quantity{Name: "share", SIDefault: "%", USDefault: "%", Units: []Unit{
		{"", "fraction of one", 1, 0.01}, {"%", "per cent", 0.01, 1}}}},
}

// keyedQuantity is one entry of Table. Table is written as a list (data
// in the binary) and made a map once at start: a map literal of fewer
// than 26 entries compiles to code that stores one entry after another
// (in the page's wasm about 700 bytes an entry).
type keyedQuantity struct {
	key string
	q   Quantity
}

func tableOf(list []keyedQuantity) map[string]Quantity {
	m := make(map[string]Quantity, len(list))
	for _, e := range list {
		m[e.key] = e.q
	}
	return m
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
// "deg" is the angle quantity. Of several, the first name in sorted order
// is taken, so the answer does not depend on map order.
func QuantityOf(siSymbol string) string { return quantityOfSI[siSymbol] }

// quantityOfSI is QuantityOf's answer for each SI symbol of Table, made
// once (every warning's numbers ask for it, and a walk over the table
// costs more than the rest of the sentence in wasm).
var quantityOfSI = func() map[string]string {
	m := map[string]string{}
	for k, q := range Table {
		if len(q.Units) == 0 {
			continue
		}
		if s := q.Units[0].Symbol; m[s] == "" || k < m[s] {
			m[s] = k
		}
	}
	return m
}()
