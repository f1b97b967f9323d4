package units

import (
	"math"
	"strconv"
)

// WindSpeed is the display quantity of the wind's speed: a speed, shown
// in its own units (m/s or ft/s by default) apart from the crane's speeds.
const WindSpeed = "wind_speed"

// Choice is the display units people chose: a unit symbol by quantity
// (Table names, plus WindSpeed), as the page's unit choosers hold them.
// A quantity left out takes the default of System, "si" (or "") or "us".
// The zero Choice is SI throughout.
type Choice struct {
	Chosen map[string]string
	System string
}

// Unit returns the display unit of quantity q; the zero Unit when q is
// not in Table (a symbol the quantity does not have falls back to SI).
func (c Choice) Unit(q string) Unit {
	base := q
	if q == WindSpeed {
		base = "speed"
	}
	tq, ok := Table[base]
	if !ok || len(tq.Units) == 0 {
		return Unit{}
	}
	sym, ok := c.Chosen[q]
	if !ok {
		switch {
		case q == WindSpeed && c.System == "us":
			sym = "ft/s"
		case q == WindSpeed:
			sym = "m/s"
		case c.System == "us":
			sym = tq.USDefault
		default:
			sym = tq.SIDefault
		}
	}
	for _, x := range tq.Units {
		if x.Symbol == sym {
			return x
		}
	}
	return tq.Units[0]
}

// Show converts an SI value of quantity q to its display unit and gives
// the unit's symbol; a quantity not in Table is shown as it is.
func (c Choice) Show(q string, si float64) (float64, string) {
	u := c.Unit(q)
	if u.ToSI == 0 {
		return si, ""
	}
	return si / u.ToSI, u.Symbol
}

// Round rounds v (in unit u) as it is given to people: to a whole number
// of u.Step, or to four significant digits when the unit has no step. It
// returns the rounded value and its text, in fixed notation (never
// "1e+03"), with as many decimals as the step has and no "-0".
func Round(v float64, u Unit) (float64, string) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return v, "—"
	}
	if u.Step <= 0 {
		if v == 0 {
			return 0, "0"
		}
		r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 4, 64), 64)
		return r, strconv.FormatFloat(r, 'f', -1, 64)
	}
	n := math.Round(v / u.Step)
	if n == 0 {
		n = 0 // no "-0"
	}
	r := n * u.Step
	return r, strconv.FormatFloat(r, 'f', decimals(u.Step), 64)
}

// decimals is the number of decimals a step needs (0.05 -> 2, 10 -> 0).
func decimals(step float64) int {
	for d := 0; d < 6; d++ {
		p := step * math.Pow10(d)
		if math.Abs(p-math.Round(p)) < 1e-9*p {
			return d
		}
	}
	return 6
}
