package motion

import (
	"bytes"
	"math"
	"strings"
	"testing"
)

// consistent checks that speed is the derivative of position and
// acceleration that of speed (central differences away from breakpoints),
// and that position and speed are continuous at breakpoints.
func consistent(t *testing.T, name string, p Profile, t0, t1 float64) {
	t.Helper()
	const h = 1e-5
	bp := p.Breakpoints()
	nearBreak := func(x float64) bool {
		for _, b := range bp {
			if math.Abs(x-b) < 3*h {
				return true
			}
		}
		return false
	}
	for x := t0; x <= t1; x += 0.0137 {
		if nearBreak(x) {
			continue
		}
		a, b, s := p.At(x-h), p.At(x+h), p.At(x)
		if d := (b.Pos - a.Pos) / (2 * h); math.Abs(d-s.Vel) > 1e-6*(1+math.Abs(s.Vel)) {
			t.Fatalf("%s at %g: d(pos)/dt %g, vel %g", name, x, d, s.Vel)
		}
		if d := (b.Vel - a.Vel) / (2 * h); math.Abs(d-s.Acc) > 1e-5*(1+math.Abs(s.Acc)) {
			t.Fatalf("%s at %g: d(vel)/dt %g, acc %g", name, x, d, s.Acc)
		}
	}
	for _, x := range bp {
		a, b := p.At(x-1e-10), p.At(x+1e-10)
		if math.Abs(a.Pos-b.Pos) > 1e-8 || math.Abs(a.Vel-b.Vel) > 1e-8 {
			t.Fatalf("%s jumps at breakpoint %g: %+v to %+v", name, x, a, b)
		}
	}
}

func TestSCurve(t *testing.T) {
	// Exact by construction: moving average of the trapezoid (definition
	// in the SCurve doc comment).
	for _, c := range []struct{ d, v, a, dec, r float64 }{
		{18, 0.5, 0.25, 0.25, 1}, {-6, 0.8, 0.4, 0.3, 0.5}, {0.5, 1, 0.5, 0.5, 2}, {10, 0.5, 0.3, 0.3, 0},
	} {
		p := NewSCurve(2, c.d, c.v, c.a, c.dec, c.r)
		consistent(t, "s-curve", p, 0, p.End()+2)
		if got := p.At(p.End() + 5); math.Abs(got.Pos-c.d) > 1e-12 || got.Vel != 0 || got.Acc != 0 {
			t.Errorf("%+v: end state %+v, want at rest at %g", c, got, c.d)
		}
		if want := p.Base.End() + c.r; math.Abs(p.End()-want) > 1e-12 {
			t.Errorf("%+v: ends at %g, want the trapezoid's end plus the rounding time, %g", c, p.End(), want)
		}
		if want := p.Base.PeakSpeed(); p.Base.Duration()-2*want/c.a > c.r && math.Abs(p.PeakSpeed()-want) > 1e-12 {
			t.Errorf("%+v: peak speed %g, want the trapezoid's %g (cruise longer than the rounding)", c, p.PeakSpeed(), want)
		}
		if p.At(1.9) != (State{}) {
			t.Errorf("%+v: moves before its start", c)
		}
		// The jerk is accel/Tr where the ramps are longer than Tr.
		if c.r > 0 && c.v/c.a > c.r {
			q := p.At(2 + c.r/2)
			if math.Abs(q.Acc-math.Copysign(c.a/2, c.d)) > 1e-12 {
				t.Errorf("%+v: acceleration %g half way up the rounding, want %g", c, q.Acc, c.a/2)
			}
			if pk := p.PeakAccel(); math.Abs(pk-c.a) > 1e-12 {
				t.Errorf("%+v: peak acceleration %g, want %g", c, pk, c.a)
			}
		}
	}
}

func TestSteps(t *testing.T) {
	// Two-speed drive: 0.2 m/s, then 0.5 m/s, then slow, then stop.
	s, err := NewSteps([]Step{{1, 0.2}, {4, 0.5}, {20, 0.2}, {23, 0}}, 0.25, 0.4)
	if err != nil {
		t.Fatal(err)
	}
	consistent(t, "steps", s, 0, s.End()+1)
	if v := s.At(3).Vel; math.Abs(v-0.2) > 1e-12 {
		t.Errorf("speed at 3 s %g, want the first step 0.2", v)
	}
	if a := s.At(4.5).Acc; a != 0.25 {
		t.Errorf("acceleration at 4.5 s %g, want the ramp 0.25", a)
	}
	if a := s.At(20.1).Acc; a != -0.4 {
		t.Errorf("deceleration at 20.1 s %g, want -0.4", a)
	}
	// Distance (kinematics): each step held from its time to the next, less
	// (or plus) the ramp's lag dv^2/(2a) against an instant step.
	want := 0.2*3 - 0.2*0.2/(2*0.25) + // 1 to 4 s at 0.2
		0.5*16 - 0.3*0.3/(2*0.25) + // 4 to 20 s at 0.5, ramp up from 0.2
		0.2*3 + 0.3*0.3/(2*0.4) + // 20 to 23 s at 0.2, ramp down from 0.5
		0.2*0.2/(2*0.4) // the stop
	if got := s.At(s.End()).Pos; math.Abs(got-want) > 1e-12 {
		t.Errorf("distance %g, want %g", got, want)
	}
	// A reversal brakes through zero and ramps up the other way.
	r, err := NewSteps([]Step{{0, 0.4}, {5, -0.4}, {12, 0}}, 0.2, 0.5)
	if err != nil {
		t.Fatal(err)
	}
	consistent(t, "reversal", r, 0, r.End()+1)
	if a := r.At(5.4).Acc; a != -0.5 {
		t.Errorf("braking before reversal %g, want -0.5", a)
	}
	if a := r.At(6.0).Acc; a != -0.2 {
		t.Errorf("accelerating after reversal %g, want -0.2", a)
	}
	for _, bad := range [][]Step{{}, {{0, 0.5}}, {{2, 0.5}, {1, 0}}, {{0, math.NaN()}, {1, 0}}} {
		if _, err := NewSteps(bad, 0.2, 0.2); err == nil {
			t.Errorf("steps %v: no error", bad)
		}
	}
}

func TestHardStop(t *testing.T) {
	h := NewHardStop(0.6, 2, 1.2)
	consistent(t, "hard stop", h, -1, 5)
	if s := h.At(1); s.Vel != 0.6 || s.Acc != 0 || math.Abs(s.Pos-0.6) > 1e-15 {
		t.Errorf("before braking %+v", s)
	}
	// Stopping distance v^2/(2d) after the brake sets in (kinematics).
	if got, want := h.At(10).Pos, 0.6*2+0.36/2.4; math.Abs(got-want) > 1e-12 {
		t.Errorf("stops at %g, want %g", got, want)
	}
	if h.End() != 2.5 {
		t.Errorf("end %g, want 2.5", h.End())
	}
	if s := NewHardStop(0.6, 0, 1.2).At(-1); s.Vel != 0.6 {
		t.Errorf("braking at once: before t=0 speed %g, want 0.6", s.Vel)
	}
}

func TestShaped(t *testing.T) {
	base := NewTrapezoid(0, 10, 0.5, 0.25, 0.25)
	s := &Shaped{Base: base, Impulses: []Impulse{{0.5, 0}, {0.5, 3}}}
	consistent(t, "shaped", s, 0, s.End()+1)
	if got := s.At(100).Pos; math.Abs(got-10) > 1e-12 {
		t.Errorf("shaped move ends at %g, want 10", got)
	}
	if s.End() != base.End()+3 {
		t.Errorf("end %g, want %g", s.End(), base.End()+3)
	}
	if got := s.At(1).Acc; got != 0.125 {
		t.Errorf("acceleration %g before the second impulse, want half the ramp", got)
	}
}

// A record written with WriteCSV and read back gives the same text and,
// for a speed record sampled at the breakpoints of a piecewise linear speed,
// the same motion exactly (linear interpolation is exact there).
func TestCSVRoundTrip(t *testing.T) {
	tr := NewTrapezoid(0.5, 6, 0.5, 0.25, 0.5)
	var times []float64
	for i := 0; i <= 160; i++ {
		times = append(times, float64(i)*0.1)
	}
	times = append(times, tr.Breakpoints()...)
	times = dedupe(times)
	ser := Sample(times, []string{"travel_x_m_per_s", "slew_deg"}, []Profile{tr, tr}, []float64{1, math.Pi / 180})
	var buf bytes.Buffer
	if err := WriteCSV(&buf, ser); err != nil {
		t.Fatal(err)
	}
	text := buf.String()
	back, err := ParseCSV(strings.NewReader(text))
	if err != nil {
		t.Fatal(err)
	}
	var buf2 bytes.Buffer
	WriteCSV(&buf2, back)
	if buf2.String() != text {
		t.Errorf("round trip changed the text")
	}
	p, err := back.Profile("travel_x_m_per_s", 1)
	if err != nil {
		t.Fatal(err)
	}
	for x := 0.0; x < 16; x += 0.173 {
		if a, b := p.At(x), tr.At(x); math.Abs(a.Pos-b.Pos) > 1e-12 || math.Abs(a.Vel-b.Vel) > 1e-12 {
			t.Fatalf("speed record at %g: %+v, the move %+v", x, a, b)
		}
	}
	// Position record: clamped spline through the samples, at rest at both
	// ends, exact at every sample.
	q, err := back.Profile("slew_deg", math.Pi/180)
	if err != nil {
		t.Fatal(err)
	}
	consistent(t, "spline", q, -1, 17)
	for _, x := range times {
		if a, b := q.At(x).Pos, tr.At(x).Pos; math.Abs(a-b) > 1e-9 {
			t.Fatalf("spline at sample %g: %g, want %g", x, a, b)
		}
	}
	if s := q.At(times[len(times)-1]); math.Abs(s.Vel) > 1e-12 {
		t.Errorf("spline ends moving at %g", s.Vel)
	}
}

func TestCSVErrors(t *testing.T) {
	for _, c := range []struct{ name, text, want string }{
		{"empty", "", "line 1: the record is empty"},
		{"header", "t,x_m\n0,0\n1,0\n", "line 1, column 1: is \"t\": the first column must be time_s"},
		{"one sample", "time_s,x_m\n0,0\n", "line 1: the record has 1 samples"},
		{"unsorted", "time_s,x_m\n0,0\n1,0.1\n0.5,0.2\n", "line 4, column time_s: time 0.5 s does not come after 1 s on line 3"},
		{"repeated", "time_s,x_m\n0,0\n1,0.1\n1,0.2\n", "line 4, column time_s: time 1 s does not come after 1 s"},
		{"bad number", "time_s,x_m\n0,0\n1,abc\n", "line 3, column x_m: \"abc\" is not a number"},
		{"nan", "time_s,x_m\n0,0\n1,NaN\n", "line 3, column x_m: \"NaN\" is not a number"},
		{"missing", "time_s,x_m,y_m\n0,0,0\n1,,0\n", "line 3, column x_m: the value is missing"},
		{"short row", "time_s,x_m\n0,0\n1\n", "line 3: has 1 values: the header names 2 columns"},
		{"gap", "time_s,x_m\n0,0\n0.1,0\n0.2,0\n0.3,0\n9,0\n", "line 6, column time_s: a gap of 8.7 s after 0.3 s (line 5)"},
		{"twice", "time_s,x_m,x_m\n0,0,0\n1,0,0\n", "line 1, column x_m: the column is named twice"},
		{"too close", "time_s,x_m\n0,0\n1e-9,0\n", "line 3, column time_s: time 1e-09 s is only 1e-09 s after line 2"},
		{"too large", "time_s,x_m\n0,0\n1,1e308\n", "line 3, column x_m: 1e308 is too large: accepted from -1e+06 to 1e+06"},
		{"comment lines count", "# recorded on the bay crane\ntime_s,x_m\n0,0\n1,x\n", "line 4, column x_m"},
	} {
		_, err := ParseCSV(strings.NewReader(c.text))
		if err == nil || !strings.HasPrefix(err.Error(), c.want) {
			t.Errorf("%s: error %v, want it to start %q", c.name, err, c.want)
		}
	}
	s, err := ParseCSV(strings.NewReader("time_s,x_m_per_s\n0,0\n1,0.5\n2,0.5\n"))
	if err != nil {
		t.Fatal(err)
	}
	if _, err := s.Profile("x_m_per_s", 1); err == nil || !strings.Contains(err.Error(), "line 4, column x_m_per_s: the last speed is 0.5: the record must end at rest") {
		t.Errorf("moving at the end: %v", err)
	}
	if _, err := s.Profile("y_m", 1); err == nil || !strings.Contains(err.Error(), "no such column") {
		t.Errorf("unknown column: %v", err)
	}
}
