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

// TestShownAsRead: History.Shown gives, bit for bit, the numbers a parser
// reads from AppendJSON's text (encoding/json's reading, correctly
// rounded as a browser's JSON.parse is), on every example's series at the
// default digits and at 3 and 15, and on series with a negative number
// rounding to zero and large numbers with no decimals; a series AppendJSON
// writes with significant digits ('g') is not shown.
func TestShownAsRead(t *testing.T) {
	var hs []*History
	for _, s := range loadExamples(t) {
		r, err := Evaluate(s)
		if err != nil {
			t.Fatal(err)
		}
		hs = append(hs, &r.History)
	}
	hs = append(hs, &History{TimeS: []float64{0, 0.5, 1}, SwingDeg: []float64{-1e-12, 3.25, -0.0}, TensionN: []float64{1, 2e300, -3e299},
		RelXM: []float64{math.SmallestNonzeroFloat64, 1e-300, -1e-3}, RopeM: []float64{1e16, 3, 9.5e16}})
	checked := 0
	for _, h := range hs {
		for _, digits := range []int{3, 9, 15} {
			text, err := h.AppendJSON(nil, digits)
			if err != nil {
				t.Fatal(err)
			}
			var read map[string][]float64
			if err := json.Unmarshal(text, &read); err != nil {
				t.Fatal(err)
			}
			for _, key := range historyKeys {
				got, ok := h.Shown(key, digits)
				if !ok && h == hs[len(hs)-1] && key == "tension_n" {
					continue // written with significant digits: not shown (checked below)
				}
				if !ok {
					t.Fatalf("%s at %d digits: not shown", key, digits)
				}
				if want := read[key]; len(got) != len(want) {
					t.Fatalf("%s at %d digits: %d numbers, read %d", key, digits, len(got), len(want))
				}
				for j, w := range read[key] {
					if math.Float64bits(got[j]) != math.Float64bits(w) {
						t.Fatalf("%s[%d] at %d digits: shown %v, read %v", key, j, digits, got[j], w)
					}
					checked++
				}
			}
		}
	}
	if _, ok := hs[0].Shown("no_such_series", 9); ok {
		t.Error("an unknown series is shown")
	}
	if _, ok := (&History{SwingDeg: []float64{math.Inf(1)}}).Shown("swing_deg", 9); ok {
		t.Error("a series with an infinity is shown")
	}
	if _, ok := hs[len(hs)-1].Shown("tension_n", 9); ok {
		t.Error("a series beyond an int64's digits is shown")
	}
	t.Logf("%d numbers", checked)
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
	for _, bad := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		_, want := json.Marshal(bad)
		if _, err := (&History{TimeS: []float64{0, 1}, TensionN: []float64{1, bad}}).AppendJSON(nil, 9); err == nil || want == nil || err.Error() != want.Error() {
			t.Errorf("%v in a series: %v, want encoding/json's %v", bad, err, want)
		}
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
