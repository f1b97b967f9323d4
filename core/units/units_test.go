package units

import (
	"math"
	"testing"
)

// Source: NIST Special Publication 811 (2008), appendix B: the foot, inch,
// pound and pound-force are exact by definition; tonne-force is
// 1000 kg times standard gravity; rpm is 2*pi/60 rad/s.
func TestFactorsAreTheDefinitions(t *testing.T) {
	for _, c := range []struct {
		q, sym string
		want   float64
	}{
		{"length", "ft", 0.3048},
		{"length", "in", 0.0254},
		{"mass", "lb", 0.45359237},
		{"mass", "sh tn", 907.18474},
		{"mass", "t", 1000},
		{"force", "lbf", 4.4482216152605},
		{"force", "kip", 4448.2216152605},
		{"force", "tf", 9806.65},
		{"speed", "m/min", 1.0 / 60},
		{"speed", "ft/min", 0.3048 / 60},
		{"acceleration", "ft/s²", 0.3048},
		{"angular_speed", "rpm", 6}, // 1 rpm = 360 deg / 60 s
		{"area", "ft²", 0.09290304},
	} {
		got, ok := ToSI(c.q, c.sym, 1)
		if !ok {
			t.Errorf("%s %s: unknown", c.q, c.sym)
			continue
		}
		if math.Abs(got/c.want-1) > 1e-15 {
			t.Errorf("1 %s = %.17g SI, want %.17g", c.sym, got, c.want)
		}
	}
}

func TestRoundTripAndTable(t *testing.T) {
	for name, q := range Table {
		if q.Units[0].ToSI != 1 {
			t.Errorf("%s: first unit must be the SI unit", name)
		}
		found := 0
		for _, u := range q.Units {
			if u.Symbol == q.SIDefault || u.Symbol == q.USDefault {
				found++
			}
			for _, v := range []float64{0, 1, 12.5, -3.75, 1e4} {
				si, _ := ToSI(name, u.Symbol, v)
				back, _ := FromSI(name, u.Symbol, si)
				if math.Abs(back-v) > 1e-12*math.Max(1, math.Abs(v)) {
					t.Errorf("%s %s: %v -> %v -> %v", name, u.Symbol, v, si, back)
				}
			}
		}
		if found == 0 {
			t.Errorf("%s: default units not in the list", name)
		}
	}
	if _, ok := ToSI("length", "furlong", 1); ok {
		t.Error("unknown unit accepted")
	}
}

func TestRoundAndChoice(t *testing.T) {
	deg := Table["angle"].Units[0]
	for _, c := range []struct {
		v    float64
		u    Unit
		want string
	}{
		{2.04, deg, "2.0"}, {-0.01, deg, "0.0"}, {1234567.8, deg, "1234567.8"},
		{0.4712, Unit{Symbol: "m", ToSI: 1, Step: 0.01}, "0.47"},
		{1.5459, Unit{Symbol: "ft", ToSI: Foot, Step: 0.05}, "1.55"},
		{16263.7, Unit{Symbol: "lbf", ToSI: PoundForce, Step: 10}, "16260"},
		{0.000123456, Unit{}, "0.0001235"}, {1.5e9, Unit{}, "1500000000"},
	} {
		if _, got := Round(c.v, c.u); got != c.want {
			t.Errorf("Round(%v, %s) = %q, want %q", c.v, c.u.Symbol, got, c.want)
		}
	}
	if QuantityOf("") != "ratio" {
		t.Errorf(`QuantityOf("") = %q`, QuantityOf(""))
	}
	// The table made once answers as a walk over the names in sorted order.
	for _, q := range Table {
		sym, first := q.Units[0].Symbol, ""
		for k, o := range Table {
			if o.Units[0].Symbol == sym && (first == "" || k < first) {
				first = k
			}
		}
		if got := QuantityOf(sym); got != first {
			t.Errorf("QuantityOf(%q) = %q, want %q", sym, got, first)
		}
	}
	if got := QuantityOf("furlong"); got != "" {
		t.Errorf(`QuantityOf("furlong") = %q`, got)
	}
	if u := (Choice{System: "us"}).Unit(WindSpeed); u.Symbol != "ft/s" {
		t.Errorf("US wind speed in %s", u.Symbol)
	}
	if v, s := (Choice{Chosen: map[string]string{"length": "in"}}).Show("length", 0.0254); v != 1 || s != "in" {
		t.Errorf("chosen inch: %v %s", v, s)
	}
	for name, q := range Table {
		for _, u := range q.Units {
			if u.Step <= 0 {
				t.Errorf("%s %s: no rounding step", name, u.Symbol)
			}
		}
	}
}
