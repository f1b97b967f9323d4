package sway

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"swaysheet/core/internal/testscenario"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// withBody gives s a box load of the given size on four legs of length
// leg to the corners of its top face.
func withBody(s *scenario.Scenario, a, b, c, leg float64) *scenario.Scenario {
	bd := &scenario.Body{LengthM: f(a), WidthM: f(b), HeightM: f(c)}
	for _, sg := range [][2]float64{{1, 1}, {-1, 1}, {-1, -1}, {1, -1}} {
		bd.Legs = append(bd.Legs, scenario.BodyLeg{LengthM: f(leg), AttachXM: sg[0] * a / 2, AttachYM: sg[1] * b / 2, AttachZM: f(c / 2)})
	}
	s.Load.Body = bd
	return s
}

// A short, compact load tends to the point mass at its centre of mass
// (the limit of the rigid body as its size goes to zero, with the hook
// above its centre of mass): a 1 cm cube on four legs meeting 2.5 m above
// its centre of mass, rope 6 m, against a point on 8.5 m. The size shifts
// the period by about 1e-7 here (the compound pendulum's k^2 against d^2,
// diluted by the rope). The move's ramps last half a period and its two ramps start
// 2.5 periods apart, so that the residual swing is at its largest and
// first-order insensitive to that shift.
func TestRigidCompactLoadIsAPoint(t *testing.T) {
	point := still(7200, 8.5)
	point.Motions = []scenario.Motion{move(1, 7.312, 0.5, 0.17095, 0.17095)}
	a := mustEval(t, point)
	const side = 0.01
	leg := math.Sqrt(2.495*2.495 + 2*side*side/4)
	rigid := withBody(still(7200, 6), side, side, side, leg)
	rigid.Motions = point.Motions
	b := mustEval(t, rigid)
	compareFigures(t, a, b, 7, 1e-6)
}

// compareFigures fails the test when any of the first n of period,
// peak swing and excursion, residual swing and excursion, largest and
// smallest rope tension of b differs from a's by more than rel, relative.
func compareFigures(t *testing.T, a, b *Result, n int, rel float64) {
	t.Helper()
	for _, q := range []struct {
		name string
		x, y float64
	}{
		{"period_s", a.PeriodS, b.PeriodS},
		{"peak_swing_deg", a.PeakSwingDeg, b.PeakSwingDeg},
		{"peak_excursion_m", a.PeakExcursionM, b.PeakExcursionM},
		{"residual_swing_deg", a.ResidualSwingDeg, b.ResidualSwingDeg},
		{"residual_excursion_m", a.ResidualExcursionM, b.ResidualExcursionM},
		{"tension_max_n", a.TensionMaxN, b.TensionMaxN},
		{"tension_min_n", a.TensionMinN, b.TensionMinN},
	}[:n] {
		d := math.Abs(q.y/q.x - 1)
		t.Logf("%s: %.10g and %.10g, relative difference %.2g", q.name, q.x, q.y, d)
		if d > rel {
			t.Errorf("%s: %.10g and %.10g differ by %.2g relative, more than %g", q.name, q.x, q.y, d, rel)
		}
	}
}

func hasWarning(r *Result, part string) bool {
	for _, w := range r.Warnings {
		if strings.Contains(w, part) {
			return true
		}
	}
	return false
}

// The bay girder example, moved 18 m: carried lengthwise on slings it swings slower
// than a point at the same depth and pitches (the figures: 6.4 to
// 7.3 s against 5.85 s, pitch 2.4 to 4.3 s); its twist is not restrained
// on one hook, which the warnings say.
func TestRigidBayGirder(t *testing.T) {
	s := testscenario.Example(t, "bay-girder-rigid.json")
	// The example asks the planner for its move; here it makes the 18 m
	// travel at 0.25 m/s² itself.
	s.Motions = []scenario.Motion{{Axis: "travel_x", Profile: scenario.ProfileTrapezoid, StartS: 1,
		DistanceM: f(18), SpeedMPerS: f(0.5), AccelMPerS2: f(0.25), DecelMPerS2: f(0.25)}}
	r := mustEval(t, s)
	b := r.Body
	if b == nil || b.Suspension != "two legs" || len(b.Legs) != 2 {
		t.Fatalf("body block %+v", b)
	}
	if r.PeriodS < 6.4 || r.PeriodS > 7.3 || b.Modes[0].Kind != "swing along" {
		t.Errorf("first mode %+v, period_s %v", b.Modes[0], r.PeriodS)
	}
	pitch := 0.0
	for _, m := range b.Modes {
		if m.Kind == "pitch" {
			pitch = m.PeriodS
		}
	}
	if pitch < 2.4 || pitch > 4.3 {
		t.Errorf("pitch period %v s; modes %+v", pitch, b.Modes)
	}
	if b.TwistRestrained || !hasWarning(r, "does not restrain its twist") {
		t.Errorf("twist restrained %v, warnings %q", b.TwistRestrained, r.Warnings)
	}
	// Static: both legs carry half the girder at their angle, 3 m high
	// over 5 m: T = (m g / 2) / cos(beta), cos(beta) = 3/5.831.
	want := 7200 * g / 2 / (3 / 5.831)
	for i, l := range b.Legs {
		if math.Abs(l.StaticN/want-1) > 1e-3 || l.TensionMinN <= 0 || l.TensionMaxN < l.StaticN {
			t.Errorf("leg %d: %+v, static want about %.6g N", i, l, want)
		}
	}
	if h := b.History; h == nil || len(h.TiltDeg) != len(r.History.TimeS) || len(h.CornerXM) != 8 || len(h.CornerXM[7]) != len(r.History.TimeS) {
		t.Errorf("body history missing or short")
	}
	for _, a := range r.Assumptions {
		if strings.HasPrefix(a, "The load is a point mass") || strings.HasPrefix(a, "The load does not spin") {
			t.Errorf("a rigid load's assumptions keep the point model's %q", a)
		}
	}
	if !strings.HasPrefix(r.Assumptions[0], "The load is a rigid box") {
		t.Errorf("assumptions %q", r.Assumptions)
	}
	if b.PeakTiltDeg <= 0 || b.PeakCornerSwingM <= r.PeakExcursionM*0.5 {
		t.Errorf("tilt %v deg, corner swing %v m", b.PeakTiltDeg, b.PeakCornerSwingM)
	}
}

// The spreader example: the simulated twist period agrees with the
// bifilar formula (source: bifilar suspension, any mechanics text), and no
// twist warning.
func TestRigidSpreaderTwist(t *testing.T) {
	r := mustEval(t, testscenario.Example(t, "precast-panel-spreader.json"))
	b := r.Body
	if b == nil || !b.TwistRestrained || hasWarning(r, "twist") {
		t.Fatalf("body %+v, warnings %q", b, r.Warnings)
	}
	rel := b.SimulatedTwistPeriodS/b.BifilarTwistPeriodS - 1
	t.Logf("twist: simulated %.10g s, bifilar %.10g s, relative difference %.2g", b.SimulatedTwistPeriodS, b.BifilarTwistPeriodS, rel)
	if math.Abs(rel) > 1e-6 {
		t.Errorf("twist period: simulated %v s, bifilar %v s", b.SimulatedTwistPeriodS, b.BifilarTwistPeriodS)
	}
}

// A hard stop of a long pipe on two close, steep legs (0.5 m either
// side of its centre, 3 m high) pitches it enough to unload its legs in
// turn: the warning says so.
func TestRigidSlackLegWarning(t *testing.T) {
	s := still(4000, 1)
	leg := math.Sqrt(9 + 0.25)
	s.Load.Body = &scenario.Body{LengthM: f(12), WidthM: f(0.5), HeightM: f(0.5), HookMassKg: 100,
		Legs: []scenario.BodyLeg{{LengthM: f(leg), AttachXM: 0.5, AttachZM: f(0.25)}, {LengthM: f(leg), AttachXM: -0.5, AttachZM: f(0.25)}}}
	s.Motions = []scenario.Motion{{Axis: "travel_x", Profile: scenario.ProfileHardStop,
		SpeedMPerS: f(1.5), DecelMPerS2: f(5), ProfileFields: scenario.ProfileFields{BrakeAtS: f(1)}}}
	r := mustEval(t, s)
	if !hasWarning(r, "Sling leg 1 goes slack") || !hasWarning(r, "Sling leg 2 goes slack") {
		t.Errorf("legs %+v, warnings %q", r.Body.Legs, r.Warnings)
	}
}

// Arrangements the model cannot take get a message naming the leg.
func TestRigidGeometryErrors(t *testing.T) {
	miss := withBody(still(4000, 5), 4, 2, 1, 3)
	*miss.Load.Body.Legs[2].LengthM = 3.2
	below := still(4000, 5)
	below.Load.Body = &scenario.Body{LengthM: f(6), WidthM: f(0.5), HeightM: f(1), HookMassKg: 100,
		Legs: []scenario.BodyLeg{{LengthM: f(4), AttachXM: 2, AttachZM: f(-0.5)}, {LengthM: f(4), AttachXM: -2, AttachZM: f(-0.5)}}}
	short := still(4000, 5)
	short.Load.Body = &scenario.Body{LengthM: f(6), WidthM: f(0.5), HeightM: f(1), HookMassKg: 100,
		Legs: []scenario.BodyLeg{{LengthM: f(1), AttachXM: 2, AttachZM: f(0.5)}, {LengthM: f(1), AttachXM: -2, AttachZM: f(0.5)}}}
	for _, c := range []struct {
		name  string
		s     *scenario.Scenario
		field string
		says  string
	}{
		{"four legs that miss", miss, "load.body.legs[", "do not meet at one hook"},
		{"two legs below the centre of mass", below, "load.body.legs[0].length_m", "above the load's centre of mass"},
		{"two short legs", short, "load.body.legs[0].length_m", "cannot reach"},
	} {
		c.s.Motions = []scenario.Motion{move(0, 4, 0.5, 0.3, 0.3)}
		_, err := Evaluate(c.s)
		var es scenario.Errors
		if !errors.As(err, &es) || !strings.HasPrefix(es[0].Field, c.field) || !strings.Contains(es[0].Message, c.says) {
			t.Errorf("%s: got %v", c.name, err)
		}
	}
}

// RigidFirstMode gives the planner the slowest mode: the same period as
// the evaluation, and the length of the single rope with that period.
func TestRigidFirstMode(t *testing.T) {
	s := testscenario.Example(t, "bay-girder-rigid.json")
	r := mustEval(t, s)
	p, l, kind, err := RigidFirstMode(s, *s.Load.RopeLengthM)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(p/r.PeriodS-1) > 1e-12 || kind != "swing along" {
		t.Errorf("first mode %v s (%s), evaluation %v s", p, kind, r.PeriodS)
	}
	// Pendulum period 2 pi sqrt(L/g) (handbook formula) at the effective length.
	if q := 2 * math.Pi * math.Sqrt(l/g); math.Abs(q/p-1) > 1e-12 || l < 8.5 {
		t.Errorf("effective length %v m gives %v s", l, q)
	}
	if _, _, _, err := RigidFirstMode(still(1000, 5), 5); err == nil {
		t.Error("a point load has no rigid first mode: want an error")
	}
}

// Steady wind on a rigid load on one hook: the load settles where the
// static equilibrium puts it (rope along the resultant of the wind and the
// whole weight, the hook-to-load line along the wind and the load's own
// weight; Meriam & Kraige, Engineering Mechanics: Statics). Heavy drag
// damps the swing; the mean over the last 200 s of the run is compared.
func TestRigidSteadyWind(t *testing.T) {
	for _, legs := range []int{2, 4} {
		s := withBody(still(2000, 4), 3, 1, 0.8, 2.5)
		if legs == 2 {
			s.Load.Body.Legs = []scenario.BodyLeg{{LengthM: f(2.5), AttachXM: 1, AttachZM: f(0.4)}, {LengthM: f(2.5), AttachXM: -1, AttachZM: f(0.4)}}
		}
		s.Load.Body.HookMassKg = 200
		s.Load.AreaM2, s.Load.DragCoefficient = 2000, 3
		s.Wind = &scenario.Wind{ForceN: f(3000), TowardDeg: 30}
		s.Settings = &scenario.Settings{DurationS: 600, Samples: 5000}
		r := mustEval(t, s)
		h := r.History
		var x, y, z float64
		n := 0
		for i, tt := range h.TimeS {
			if tt >= 400 {
				x, y, z, n = x+h.RelXM[i], y+h.RelYM[i], z+h.RelZM[i], n+1
			}
		}
		x, y, z = x/float64(n), y/float64(n), z/float64(n)
		off := math.Hypot(x, y)
		lean := math.Atan2(off, -z) / units.Degree
		t.Logf("%d legs: offset %.6g m (static %.6g m), lean %.6g deg (static %.6g deg)", legs, off, r.WindOffsetM, lean, r.WindLeanDeg)
		if math.Abs(off-r.WindOffsetM) > 5e-5 || math.Abs(lean-r.WindLeanDeg) > 5e-4 {
			t.Errorf("%d legs: the load settles at %.6g m, %.6g deg; static %.6g m, %.6g deg", legs, off, lean, r.WindOffsetM, r.WindLeanDeg)
		}
	}
}

// BodyHistory.add writes each sample in place, one series after another
// in one buffer: every series holds every sample, and each is the series
// it is named for. Geometry checks that a mix-up would break: a sling
// leg's two ends stay its length apart (an inextensible leg, held by the
// projection to about 1e-9 of it), and corners 0 and 1 (bit 0: the
// length) stay the box's length apart, 0 and 2 its width, 0 and 4 its
// height (a rigid body), their middle near the load's centre of mass
// (within the box's size: the centre of mass need not be the box's
// middle). The ropes of a spreader or tandem lift change
// length with the hoist, so there only the corners are checked. The legs'
// ends are there with Options.LegEnds (and then as many as the leg
// tensions); without it they are nil and every other series the same to
// the bit.
func TestBodyHistorySeries(t *testing.T) {
	ex := loadExamples(t)
	for _, name := range []string{"bay-girder-rigid", "precast-beam-tandem", "precast-panel-spreader"} {
		s := ex[name]
		r, err := EvaluateWith(s, Options{LegEnds: true})
		if err != nil {
			t.Fatal(err)
		}
		n := len(r.History.TimeS)
		h := r.Body.History
		if len(h.LegTopXM) != len(h.LegTensionN) || len(h.LegEndZM) != len(h.LegTensionN) || len(h.LegTensionN) == 0 {
			t.Fatalf("%s: %d legs' tops and %d ends for %d leg tensions", name, len(h.LegTopXM), len(h.LegEndZM), len(h.LegTensionN))
		}
		plain := mustEval(t, s).Body.History
		if plain.LegTopXM != nil || plain.LegEndZM != nil {
			t.Errorf("%s: legs' ends recorded without Options.LegEnds", name)
		}
		same := [][2][][]float64{{{h.TiltDeg, h.TwistDeg}, {plain.TiltDeg, plain.TwistDeg}},
			{h.LegTensionN, plain.LegTensionN}, {h.CornerXM, plain.CornerXM}, {h.CornerYM, plain.CornerYM}, {h.CornerZM, plain.CornerZM}}
		for _, sm := range same {
			if !reflect.DeepEqual(sm[0], sm[1]) {
				t.Errorf("%s: the body history differs with and without the legs' ends", name)
			}
		}
		all := [][]float64{h.TiltDeg, h.TwistDeg}
		for _, ss := range [][][]float64{h.LegTensionN, h.CornerXM, h.CornerYM, h.CornerZM,
			h.LegTopXM, h.LegTopYM, h.LegTopZM, h.LegEndXM, h.LegEndYM, h.LegEndZM} {
			all = append(all, ss...)
		}
		for i, c := range all {
			if len(c) != n {
				t.Fatalf("%s: series %d has %d samples, want %d", name, i, len(c), n)
			}
		}
		b := s.Load.Body
		dist := func(x, y, z [][]float64, i, j, k int) float64 {
			return math.Sqrt((x[i][k]-x[j][k])*(x[i][k]-x[j][k]) + (y[i][k]-y[j][k])*(y[i][k]-y[j][k]) + (z[i][k]-z[j][k])*(z[i][k]-z[j][k]))
		}
		for k := range n {
			for _, c := range []struct {
				j    int
				want float64
			}{{1, *b.LengthM}, {2, *b.WidthM}, {4, *b.HeightM}} {
				if d := dist(h.CornerXM, h.CornerYM, h.CornerZM, 0, c.j, k); math.Abs(d-c.want) > 1e-9*c.want {
					t.Fatalf("%s, sample %d: corners 0 and %d %.12g m apart, want %g", name, k, c.j, d, c.want)
				}
			}
			// The corners' middle within the box of the load's centre
			// of mass (the history's LoadXM, LoadYM): the loads travel
			// metres, so axes mixed up are far apart.
			var cx, cy float64
			for i := range 8 {
				cx, cy = cx+h.CornerXM[i][k]/8, cy+h.CornerYM[i][k]/8
			}
			if math.Hypot(cx-r.History.LoadXM[k], cy-r.History.LoadYM[k]) > *b.LengthM+*b.WidthM+*b.HeightM {
				t.Fatalf("%s, sample %d: corners' middle (%g, %g) m, load at (%g, %g) m", name, k, cx, cy, r.History.LoadXM[k], r.History.LoadYM[k])
			}
			if r.Body.Suspension == Spreader || r.Body.Suspension == TwoRopes {
				continue
			}
			for i := range h.LegTopXM {
				top := [][]float64{h.LegTopXM[i], h.LegEndXM[i]}
				d := dist(top, [][]float64{h.LegTopYM[i], h.LegEndYM[i]}, [][]float64{h.LegTopZM[i], h.LegEndZM[i]}, 0, 1, k)
				d0 := dist(top, [][]float64{h.LegTopYM[i], h.LegEndYM[i]}, [][]float64{h.LegTopZM[i], h.LegEndZM[i]}, 0, 1, 0)
				if math.Abs(d-d0) > 1e-9*d0 {
					t.Fatalf("%s, sample %d: leg %d's ends %.12g m apart, %.12g m at the start", name, k, i, d, d0)
				}
			}
		}
	}
}
