package sway

import (
	"encoding/json"
	"math"
	"math/rand/v2"
	"strconv"
	"testing"
)

// TestHistoryJSON: AppendJSON with HistoryDigits reads back as valid JSON,
// every example's histories, every number within half a unit of its
// series' last decimal (which keeps the digits asked for in the series'
// largest number), shorter than encoding/json's text.
func TestHistoryJSON(t *testing.T) {
	for name, s := range loadExamples(t) {
		r, err := Evaluate(s)
		if err != nil {
			t.Fatal(name, err)
		}
		h := &r.History
		got, _ := json.Marshal(h)
		digits := HistoryDigits(r.Solver.RelTol)
		short, err := h.AppendJSON(nil, digits)
		if err != nil {
			t.Fatal(name, err)
		}
		var back History
		if err := json.Unmarshal(short, &back); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		in, out := h.series(), back.series()
		for i := range in {
			a, b := *in[i], *out[i]
			if len(a) != len(b) {
				t.Fatalf("%s %s: %d numbers, read back %d", name, historyKeys[i], len(a), len(b))
			}
			top := 0.0
			for _, x := range a {
				top = math.Max(top, math.Abs(x))
			}
			for j := range a {
				if d := math.Abs(a[j] - b[j]); d > 0.5*top*math.Pow10(1-digits)*(1+1e-9) && d > 1e-15 {
					t.Fatalf("%s %s[%d]: %v written as %v (%d digits of %v)", name, historyKeys[i], j, a[j], b[j], digits, top)
				}
			}
		}
		if len(short) >= len(got) {
			t.Errorf("%s: %d digits take %d bytes, the shortest decimals %d", name, digits, len(short), len(got))
		}
	}
}

// TestAppendFixed checks the fixed decimals' text on the edges.
func TestAppendFixed(t *testing.T) {
	for _, c := range []struct {
		x    float64
		dec  int
		want string
	}{{0, 3, "0"}, {math.Copysign(0, -1), 3, "0"}, {1.5, 3, "1.5"}, {-1.5, 3, "-1.5"}, {0.05, 3, "0.05"},
		{-0.0004, 3, "0"}, {-0.0005, 3, "-0.001"}, {12, 0, "12"}, {9.4248190166, 6, "9.424819"}, {70540.028835, 2, "70540.03"},
		{1e-15, 15, "0.000000000000001"}, {0.1 + 0.2, 15, "0.3"}, {123456789.987, 4, "123456789.987"}} {
		if got := string(appendFixed(nil, c.x*math.Pow10(c.dec), c.dec)); got != c.want {
			t.Errorf("%v at %d decimals: %q, want %q", c.x, c.dec, got, c.want)
		}
	}
	if got := string(appendFixedOrG(3e17, 9)); got != "3e+17" {
		t.Errorf("a series past an int64's digits: %q", got)
	}
	empty := History{TimeS: []float64{}, SwingDeg: []float64{0}}
	want, _ := json.Marshal(empty)
	if got, _ := empty.AppendJSON(nil, 9); string(got) != string(want) {
		t.Errorf("empty and zero series: %s, encoding/json %s", got, want)
	}
	if HistoryDigits(1e-7) != 9 || HistoryDigits(1e-11) != 13 || HistoryDigits(0) != 15 {
		t.Errorf("digits %d, %d, %d", HistoryDigits(1e-7), HistoryDigits(1e-11), HistoryDigits(0))
	}
}

// appendFixedOrG writes the one-number series x at digits.
func appendFixedOrG(x float64, digits int) []byte {
	h := History{TimeS: []float64{x}}
	b, _ := h.AppendJSON(nil, digits)
	return b[len(`{"time_s":[`) : len(b)-len(`],"swing_deg":null,"rel_x_m":null,"rel_y_m":null,"rel_z_m":null,"load_x_m":null,"load_y_m":null,"suspension_x_m":null,"suspension_y_m":null,"tension_n":null,"rope_m":null}`)]
}

// TestAppendFixedAsPlain: appendFixed writes the text of the plain way
// (strconv's integers, the fraction's trailing zeros stripped by
// division), for numbers of every size, sign and count of decimals.
func TestAppendFixedAsPlain(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for range 200000 {
		dec := r.IntN(16)
		y := math.Round((r.Float64()*2 - 1) * math.Pow10(r.IntN(17)))
		if r.IntN(4) == 0 { // many trailing zeros
			y = math.Round(y/math.Pow10(dec)) * math.Pow10(dec)
		}
		if r.IntN(8) == 0 {
			y += 0.5 // a half, as math.Round rounds it
		}
		if math.Abs(y) >= 1e17 {
			continue
		}
		if got, want := string(appendFixed(nil, y, dec)), string(appendFixedPlain(nil, y, dec)); got != want {
			t.Fatalf("%v at %d decimals: %q, want %q", y, dec, got, want)
		}
	}
}

// appendFixedPlain is appendFixed the plain way (its form before the
// digits were written in one pass).
func appendFixedPlain(b []byte, y float64, dec int) []byte {
	m := int64(math.Round(y))
	if m == 0 {
		return append(b, '0')
	}
	if m < 0 {
		b = append(b, '-')
		m = -m
	}
	p := int64(math.Pow10(dec))
	b = strconv.AppendInt(b, m/p, 10)
	frac := m % p
	if frac == 0 {
		return b
	}
	for frac%10 == 0 {
		frac /= 10
		dec--
	}
	b = append(b, '.')
	for q := int64(math.Pow10(dec - 1)); q > frac; q /= 10 { // leading zeros
		b = append(b, '0')
	}
	return strconv.AppendInt(b, frac, 10)
}
