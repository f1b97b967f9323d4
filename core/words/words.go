// Package words holds the sentences the core writes for people with their
// quantities marked, so that the command line, the check sheet and the
// page can show every number of a sentence in the units people chose and
// rounded as they read it (core/units.Round), never in scientific
// notation.
//
// A Sentence's Text holds placeholders {0}, {1}, ... where Quantities[0],
// [1], ... go. Its JSON is
//
//	{"text": "Move 1 (travel x, {0}) is too short to reach its top speed of {1}",
//	 "quantities": [{"value": 0.5, "quantity": "length"},
//	                {"value": 1, "quantity": "speed"}]}
//
// value is in the SI unit of the quantity (the first unit of
// core/units.Table[quantity]: m, s, m/s, N; angles in degrees, as the
// scenarios carry them). The planner's marked sentences (core/plan) have
// the same JSON, with "digits" besides; Format ignores digits and rounds
// by the unit's step, like the figures table.
package words

import (
	"strconv"
	"strings"

	"swaysheet/core/units"
)

// Quantity is one marked number of a sentence.
type Quantity struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	// Value is in the SI unit of Quantity (angles in degrees).
	Value float64 `json:"value"`
	// Quantity is a core/units.Table name ("length", "speed", "time") or
	// units.WindSpeed.
	Quantity string `json:"quantity"`
	// Digits are the significant digits of the plain SI text (String);
	// zero: rounded by the unit's step. Kept for the planner's sentences.
	Digits int `json:"digits,omitempty"`
}

// Sentence is one sentence with its quantities marked.
type Sentence struct {
	Text       string     `json:"text"`
	Quantities []Quantity `json:"quantities"`
}

// Say builds a sentence whose placeholders {i} stand for qs[i]. Braces in
// text that are not placeholders are the caller's mistake.
func Say(text string, qs ...Quantity) Sentence {
	if qs == nil {
		qs = []Quantity{}
	}
	return Sentence{Text: text, Quantities: qs}
}

// Plain is a sentence without quantities; braces in it become
// parentheses so that nothing reads as a placeholder.
func Plain(text string) Sentence {
	return Say(strings.NewReplacer("{", "(", "}", ")").Replace(text))
}

// Quantity constructors, SI in (angles in degrees).
func Length(v float64) Quantity { return Quantity{Value: v, Quantity: "length"} }
func Time(v float64) Quantity   { return Quantity{Value: v, Quantity: "time"} }
func Angle(v float64) Quantity  { return Quantity{Value: v, Quantity: "angle"} }
func Speed(v float64) Quantity  { return Quantity{Value: v, Quantity: "speed"} }

// Of is the quantity of an SI unit symbol ("m", "m/s", "deg/s"): a move's
// fields carry their axis' unit (core/crane Kind).
func Of(v float64, siSymbol string) Quantity {
	return Quantity{Value: v, Quantity: units.QuantityOf(siSymbol)}
}

// Show is the quantity in the display units of u, rounded as people read
// it, with its unit symbol: "1.6 ft/s", "0.3 deg", "12 %".
func (q Quantity) Show(u units.Choice) string {
	un := u.Unit(q.Quantity)
	if un.ToSI == 0 { // not a quantity of the table: as it is
		_, t := units.Round(q.Value, units.Unit{})
		return t
	}
	_, t := units.Round(q.Value/un.ToSI, un)
	if un.Symbol == "" {
		return t
	}
	if un.Symbol == "%" {
		return t + " %"
	}
	return t + " " + un.Symbol
}

// Format fills the placeholders with the quantities in the units of u,
// rounded as people read them.
func (s Sentence) Format(u units.Choice) string {
	return s.fill(func(q Quantity) string { return q.Show(u) })
}

// String fills the placeholders in SI: the plain text kept in the
// results' older string fields.
func (s Sentence) String() string { return s.Format(units.Choice{Chosen: siUnits}) }

// siUnits shows every quantity in its SI unit (the first of its units).
var siUnits = func() map[string]string {
	m := map[string]string{units.WindSpeed: "m/s"}
	for k, q := range units.Table {
		m[k] = q.Units[0].Symbol
	}
	m["share"] = "%"
	return m
}()

func (s Sentence) fill(show func(Quantity) string) string {
	if len(s.Quantities) == 0 {
		return s.Text
	}
	var b strings.Builder
	t := s.Text
	for {
		i := strings.IndexByte(t, '{')
		if i < 0 {
			break
		}
		j := strings.IndexByte(t[i:], '}')
		if j < 0 {
			break
		}
		n, err := strconv.Atoi(t[i+1 : i+j])
		if err != nil || n < 0 || n >= len(s.Quantities) {
			b.WriteString(t[:i+j+1])
			t = t[i+j+1:]
			continue
		}
		b.WriteString(t[:i])
		b.WriteString(show(s.Quantities[n]))
		t = t[i+j+1:]
	}
	b.WriteString(t)
	return b.String()
}

// FormatAll formats each sentence.
func FormatAll(ss []Sentence, u units.Choice) []string {
	out := make([]string, len(ss))
	for i, s := range ss {
		out[i] = s.Format(u)
	}
	return out
}

// Strings is the plain SI text of each sentence.
func Strings(ss []Sentence) []string { return FormatAll(ss, units.Choice{Chosen: siUnits}) }
