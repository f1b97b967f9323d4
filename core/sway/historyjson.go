package sway

import (
	"encoding/json"
	"math"
	"strconv"
)

// The time histories are most of an evaluation's JSON (bay-travel: 6,611
// numbers of 130 kB). encoding/json writes each number as the shortest
// decimal that reads back the same, through reflection: about 900
// instructions a number natively, more than the run took to compute them.
// For the page, which draws the histories and never computes with them
// (every figure comes from the core's own numbers), AppendJSON writes each
// series with a fixed number of significant digits instead: a tenth of
// the work and half the text (the evaluate call's reply, wasm/bridge).

// HistoryDigits is the number of significant digits AppendJSON keeps for
// a run at relative tolerance relTol: two more than the tolerance
// resolves (9 at the default 1e-7, 13 at "tight"'s 1e-11), the digits
// beyond being the integrator's error, not the motion.
func HistoryDigits(relTol float64) int {
	if relTol <= 0 || math.IsNaN(relTol) {
		return 15 // no tolerance known: as many as an int64 holds
	}
	return min(15, max(3, int(math.Ceil(-math.Log10(relTol)))+2))
}

// historyKeys are the JSON names of History's series, in field order
// (History.series).
var historyKeys = [...]string{"time_s", "swing_deg", "rel_x_m", "rel_y_m", "rel_z_m", "load_x_m", "load_y_m",
	"suspension_x_m", "suspension_y_m", "tension_n", "rope_m"}

// AppendJSON appends h's JSON, each series with as many decimals as keep
// digits (at least 1) significant digits in its largest number (at most
// 15 decimals), trailing zeros dropped: each number within half a unit of
// its last decimal. A number JSON cannot hold (NaN, infinity) gives
// encoding/json's error.
func (h *History) AppendJSON(b []byte, digits int) ([]byte, error) {
	for i, p := range h.series() {
		xs := *p
		b = append(b, ",{"[1-min(i, 1)], '"')
		b = append(b, historyKeys[i]...)
		b = append(b, `":[`...)
		if xs == nil {
			b = append(b[:len(b)-1], "null"...)
			continue
		}
		dec, scale, fixed, ok := decimals(xs, digits)
		for i := 0; !ok; i++ { // decimals found a NaN or an infinity: encoding/json's own error
			if x := xs[i]; x-x != 0 {
				_, err := json.Marshal(x)
				return nil, err
			}
		}
		for _, x := range xs {
			if fixed {
				b = appendFixed(b, x*scale, dec)
			} else {
				b = strconv.AppendFloat(b, x, 'g', digits, 64)
			}
			b = append(b, ',')
		}
		if len(xs) > 0 {
			b = b[:len(b)-1] // the last comma
		}
		b = append(b, ']')
	}
	return append(b, '}'), nil
}

// decimals is how AppendJSON writes series xs with digits: dec decimals
// (scale = 10^dec) when fixed, else digits significant digits ('g', for a
// series whose largest number times scale is beyond an int64's exact
// digits). ok (and fixed) is false when xs holds a NaN or an infinity.
func decimals(xs []float64, digits int) (dec int, scale float64, fixed, ok bool) {
	top := 0.0
	for _, x := range xs {
		if x-x != 0 {
			return 0, 0, false, false
		}
		top = max(top, math.Abs(x))
	}
	if top > 0 {
		dec = min(15, max(0, digits-1-int(math.Floor(math.Log10(top)))))
	}
	scale = math.Pow10(dec)
	return dec, scale, top*scale < 1e17, true
}

// Shown is the series of JSON name key ("swing_deg") as AppendJSON writes
// it with digits and a parser reads it back, number for number: the
// float64 nearest each written decimal. A number is written as the whole
// float64 r = Round(x*10^dec) over 10^dec, and 10^dec (dec at most 15) is
// exact, so r/10^dec, one correctly rounded division, is that nearest
// float64 (zero as +0, as written). It lets the page's worker draw a chart
// of a kept evaluation without sending the numbers back (wasm/bridge, the
// plot call), with the very numbers the page reads from the evaluate
// reply. ok is false for an unknown key, a series AppendJSON cannot write
// and one it writes with significant digits ('g': numbers beyond an
// int64's digits).
func (h *History) Shown(key string, digits int) (out []float64, ok bool) {
	for i, p := range h.series() {
		if historyKeys[i] != key {
			continue
		}
		xs := *p
		_, scale, fixed, _ := decimals(xs, digits)
		if !fixed { // also for NaN or infinity
			return nil, false
		}
		out = make([]float64, len(xs))
		for j, x := range xs {
			if r := math.Round(x * scale); r != 0 {
				out[j] = r / scale
			}
		}
		return out, true
	}
	return nil, false
}

// appendFixed appends y/10^dec, y rounded to a whole number (dec 0 to 15,
// |y| below 1e17), trailing zeros and a bare point dropped, zero as 0: the
// digits written from the last, in one pass (strconv's way, an integer
// division and a search for trailing zeros besides, took about 300
// instructions a number, more than half of an evaluate call's reply;
// TestAppendFixedAsPlain holds the two to the same text).
func appendFixed(b []byte, y float64, dec int) []byte {
	r := math.Round(y)
	if r == 0 {
		return append(b, '0')
	}
	m := uint64(math.Abs(r))
	var buf [24]byte
	i := len(buf)
	for k := 0; k < dec; k++ { // the decimals, less trailing zeros
		if d := m % 10; d != 0 || i < len(buf) {
			i--
			buf[i] = '0' + byte(d)
		}
		m /= 10
	}
	if i < len(buf) {
		i--
		buf[i] = '.'
	}
	for { // the whole part, at least one digit
		i--
		buf[i] = '0' + byte(m%10)
		if m /= 10; m == 0 {
			break
		}
	}
	if r < 0 {
		i--
		buf[i] = '-'
	}
	return append(b, buf[i:]...)
}
