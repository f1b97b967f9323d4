package sway

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

func pf(v float64) *float64 { return &v }

func travel(l float64, ms ...scenario.Motion) *scenario.Scenario {
	return &scenario.Scenario{Format: scenario.FormatName, Version: 1, Name: "profile test",
		Load: scenario.Load{MassKg: pf(2000), RopeLengthM: pf(l)}, Motions: ms}
}

func eval(t *testing.T, s *scenario.Scenario) *Result {
	t.Helper()
	r, err := EvaluateWith(s, Options{NoHistory: true})
	if err != nil {
		t.Fatal(err)
	}
	return r
}

func trap(d, v, a float64) scenario.Motion {
	return scenario.Motion{Axis: "travel_x", DistanceM: pf(d), SpeedMPerS: pf(v), AccelMPerS2: pf(a)}
}

// An S-curve whose rounding time is one sway period is the trapezoid seen
// through a moving average of width T, whose transfer function
// sin(wT/2)/(wT/2) is zero at w = 2*pi/T (any signal-processing text): in
// the linear model it leaves no residual swing whatever the trapezoid. At
// the 2 to 3 deg of this move the nonlinear model leaves under 0.02 deg.
func TestSCurveRoundingOnePeriod(t *testing.T) {
	l := 6.0
	T := 2 * math.Pi * math.Sqrt(l/units.StandardGravity)
	bare := eval(t, travel(l, trap(12, 0.6, 0.4)))
	m := trap(12, 0.6, 0.4)
	m.Profile = scenario.ProfileSCurve
	m.RoundingS = pf(T)
	r := eval(t, travel(l, m))
	if bare.ResidualSwingDeg < 1 {
		t.Fatalf("the bare trapezoid leaves only %g deg: pick a harsher move", bare.ResidualSwingDeg)
	}
	if r.ResidualSwingDeg > 0.02 {
		t.Errorf("S-curve rounded over one period leaves %g deg (trapezoid %g deg)", r.ResidualSwingDeg, bare.ResidualSwingDeg)
	}
}

// A ZV shaper designed for the rope length leaves no residual swing at the
// design frequency in the linear model (Singer & Seering 1990); the
// nonlinear model at a few degrees leaves under 0.02 deg.
func TestShapedMoveAtDesign(t *testing.T) {
	for _, kind := range []string{"zv", "zvd", "ei"} {
		m := trap(12, 0.6, 0.4)
		m.Shaper = &scenario.ShaperSpec{Kind: kind}
		r := eval(t, travel(6, m))
		limit := 0.02
		if kind == "ei" {
			// EI keeps V = 5 % at its design frequency (Singhose, Seering &
			// Singer 1994): 5 % of the bare move's residual.
			limit = 0.05*eval(t, travel(6, trap(12, 0.6, 0.4))).ResidualSwingDeg + 0.02
		}
		if r.ResidualSwingDeg > limit {
			t.Errorf("%s-shaped move leaves %g deg, want below %g", kind, r.ResidualSwingDeg, limit)
		}
	}
}

// A speed record sampled at every breakpoint of a trapezoid is linear
// between samples, so the series profile is the trapezoid exactly and the
// simulation gives the same figures.
func TestSeriesMatchesTrapezoid(t *testing.T) {
	m := trap(8, 0.5, 0.3)
	m.StartS = 1
	p := Profile(&m)
	times := []float64{0}
	for x := 0.25; x < p.End()+1; x += 0.25 {
		times = append(times, x)
	}
	times = append(times, p.Breakpoints()...)
	sortDedupe(&times)
	var buf bytes.Buffer
	if err := motion.WriteCSV(&buf, motion.Sample(times, []string{"travel_x_m_per_s"}, []motion.Profile{p}, []float64{1})); err != nil {
		t.Fatal(err)
	}
	ser := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileSeries}
	ser.CSV = buf.String()
	a, b := eval(t, travel(5, m)), eval(t, travel(5, ser))
	if math.Abs(a.PeakSwingDeg-b.PeakSwingDeg) > 1e-6 || math.Abs(a.ResidualSwingDeg-b.ResidualSwingDeg) > 1e-6 {
		t.Errorf("trapezoid peak %g residual %g; its record peak %g residual %g", a.PeakSwingDeg, a.ResidualSwingDeg, b.PeakSwingDeg, b.ResidualSwingDeg)
	}
}

func sortDedupe(ts *[]float64) {
	s := *ts
	for i := 1; i < len(s); i++ {
		for j := i; j > 0 && s[j] < s[j-1]; j-- {
			s[j], s[j-1] = s[j-1], s[j]
		}
	}
	out := s[:0]
	for _, x := range s {
		if len(out) == 0 || x-out[len(out)-1] > 1e-9 {
			out = append(out, x)
		}
	}
	*ts = out
}

// A hard stop at deceleration d over t_d = v/d leaves 2*(d/g)*|sin(pi*t_d/T)|
// rad in linear theory (the residual of one constant-acceleration
// phase of a linear oscillator, any vibrations text): a near-instant stop leaves about
// v*w/g; at a few degrees the nonlinear model agrees within 1 %.
func TestHardStop(t *testing.T) {
	m := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileHardStop,
		SpeedMPerS: pf(0.6667), DecelMPerS2: pf(1.2)}
	m.BrakeAtS = pf(2)
	l := 5.0
	r := eval(t, travel(l, m))
	g := units.StandardGravity
	T := 2 * math.Pi * math.Sqrt(l/g)
	td := 0.6667 / 1.2
	lin := 2 * (1.2 / g) * math.Abs(math.Sin(math.Pi*td/T)) / units.Degree
	if math.Abs(r.ResidualSwingDeg-lin) > 0.01*lin {
		t.Errorf("hard stop residual %g deg, linear theory %g deg", r.ResidualSwingDeg, lin)
	}
	if len(r.Phases) != 1 || r.Phases[0].DecelStartS != 2 {
		t.Errorf("phases %+v", r.Phases)
	}
}

// Pendant steps timed as a ZV shaper (half speed, then full speed half a
// period later; the same to stop) leave almost no residual swing: the
// operators' practice of timing the second step half a period after the
// first (common practice), which is the undamped ZV shaper (Singer &
// Seering 1990).
func TestPendantHalfPeriod(t *testing.T) {
	l := 7.0
	T := 2 * math.Pi * math.Sqrt(l/units.StandardGravity)
	m := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileSteps, AccelMPerS2: pf(0.5)}
	m.Steps = []scenario.SpeedStep{{AtS: 0, SpeedMPerS: pf(0.25)}, {AtS: T / 2, SpeedMPerS: pf(0.5)},
		{AtS: 20, SpeedMPerS: pf(0.25)}, {AtS: 20 + T/2, SpeedMPerS: pf(0)}}
	r := eval(t, travel(l, m))
	if r.ResidualSwingDeg > 0.02 {
		t.Errorf("half-period steps leave %g deg", r.ResidualSwingDeg)
	}
	m.Steps[1].AtS = T / 4
	m.Steps[3].AtS = 20 + T/4
	if r2 := eval(t, travel(l, m)); r2.ResidualSwingDeg < 0.5 {
		t.Errorf("quarter-period steps leave only %g deg: the check above proves nothing", r2.ResidualSwingDeg)
	}
}

func TestProfileMessages(t *testing.T) {
	sc := trap(5, 0.5, 0.3)
	sc.Profile = scenario.ProfileSCurve
	st := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileSteps, AccelMPerS2: pf(0.3)}
	st.Steps = []scenario.SpeedStep{{AtS: 2, SpeedMPerS: pf(0.3)}, {AtS: 1, SpeedMPerS: pf(0.2)}}
	hs := scenario.Motion{Axis: "slew", Profile: scenario.ProfileHardStop, StartS: 3, RateDegPerS: pf(2), DistanceM: pf(3)}
	se := scenario.Motion{Axis: "travel_y", Profile: scenario.ProfileSeries}
	se.CSV = "time_s,travel_y_m_per_s\n0,0\n1,0.2\n0.5,0\n"
	tr := trap(5, 0.5, 0.3)
	tr.RoundingS = pf(1)
	tr.Shaper = &scenario.ShaperSpec{Kind: "zz", PeriodS: pf(5), RopeLengthM: pf(5)}
	sr := scenario.Motion{Axis: "travel_x", Profile: scenario.ProfileSineRamp, DistanceM: pf(5), AccelMPerS2: pf(0.3)}
	sr.RoundingS = pf(1)
	err := travel(5, sc, st, hs, se, tr, sr).Validate()
	if err == nil {
		t.Fatal("no error")
	}
	for _, want := range []string{
		"motions[0].rounding_s: give exactly one of rounding_s",
		"motions[1].steps[1].at_s: 1 s comes before step 0 at 2 s",
		"motions[1].steps[1].speed_m_per_s: is 0.2: the last step must be to 0",
		"motions[2].start_s: does not apply to a hard stop",
		"motions[2].brake_at_s: is required",
		"motions[2].distance_m: does not apply here",
		"motions[2].decel_deg_per_s2: is required",
		"motions[3].csv: line 4, column time_s: time 0.5 s does not come after 1 s on line 3",
		"motions[4].rounding_s: does not apply to profile \"trapezoid\"",
		"motions[4].shaper.kind: is \"zz\"",
		"motions[4].shaper.period_s: give either period_s or rope_length_m",
		"motions[5].rounding_s: does not apply to profile \"sine_ramp\"",
		"motions[5].speed_m_per_s: is required",
	} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("missing %q in\n%v", want, err)
		}
	}
}

// A sine ramp against the linear theory of a pendulum whose suspension
// point is accelerated by a(t) (any mechanics text: the Duhamel integral
// of d²theta/dt² + w²*theta = -a(t)/L). After the forcing the swing's
// amplitude is |integral of a(t)*exp(-i*w*t) dt| * w/g. A half-sine pulse of peak A and
// duration T gives A*(pi/T)*2*|cos(w*T/2)| / |(pi/T)² - w²|, and a move's
// two ramps (the second the first reversed, starting t2 later) multiply it
// by 2*|sin(w*t2/2)|. So:
//   - ramps of one sway period each, the second starting 1.5 periods after
//     the first: the residual swing is 2 * (4/3) * A/g rad, where a linear
//     ramp of one period leaves none (the nonlinear model at 0.8 deg is
//     within 1e-5 of it);
//   - ramps of 1.5 periods: cos(3*pi/2) = 0, no residual swing whatever
//     the cruise, where a linear ramp of the same length leaves the most.
func TestSineRampLinearTheory(t *testing.T) {
	l := 6.0
	T := 2 * math.Pi * math.Sqrt(l/units.StandardGravity)
	sine := func(d, v, a float64) scenario.Motion {
		m := trap(d, v, a)
		m.Profile = scenario.ProfileSineRamp
		return m
	}
	// Ramp of one period: V = 2*A*T/pi; ramps cover V*T, the cruise 0.5*T.
	a := 0.05
	v := 2 * a * T / math.Pi
	r := eval(t, travel(l, sine(1.5*v*T, v, a)))
	want := 8.0 / 3 * a / units.StandardGravity / units.Degree
	if math.Abs(r.ResidualSwingDeg-want) > 0.001*want {
		t.Errorf("sine ramps of one period: residual %.5f deg, want %.5f deg (linear theory)", r.ResidualSwingDeg, want)
	}
	if lin := eval(t, travel(l, trap(1.5*v*T, v, v/T))); lin.ResidualSwingDeg > 0.01*want {
		t.Errorf("linear ramps of one period leave %g deg, want about 0", lin.ResidualSwingDeg)
	}
	// Ramps of 1.5 periods, cruise 2 s.
	a = 0.3
	v = 2 * a * 1.5 * T / math.Pi
	r = eval(t, travel(l, sine(v*1.5*T+2*v, v, a)))
	lin := eval(t, travel(l, trap(v*1.5*T+2*v, v, v/(1.5*T))))
	if lin.ResidualSwingDeg < 0.5 {
		t.Fatalf("linear ramps of 1.5 periods leave only %g deg: pick a harsher move", lin.ResidualSwingDeg)
	}
	if r.ResidualSwingDeg > 0.01 {
		t.Errorf("sine ramps of 1.5 periods leave %g deg, want about 0 (linear ramps: %g deg)", r.ResidualSwingDeg, lin.ResidualSwingDeg)
	}
}
