package sway

import (
	"errors"
	"math"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// tandemBeam is a 16 t beam 14 m long on two hook ropes to attach points
// at +/-5.5 m on its top face, rope length l, move distance dist along x
// (none when 0), heading along x.
func tandemBeam(l, spacing float64, lens [2]float64, dist float64) *scenario.Scenario {
	s := still(16000, l)
	s.Load.Body = &scenario.Body{LengthM: f(14), WidthM: f(0.5), HeightM: f(0.9),
		Tandem: &scenario.Tandem{SpacingM: f(spacing), Ropes: []scenario.HookRope{
			{LengthM: f(lens[0]), AttachXM: f(5.5)}, {LengthM: f(lens[1]), AttachXM: f(-5.5)}}}}
	if dist > 0 {
		s.Motions = []scenario.Motion{move(1, dist, 0.5, 0.3, 0.3)}
	}
	return s
}

// Two equal parallel hook ropes: the first mode along their plane is a
// point pendulum of the ropes' length, 2*pi*sqrt(h/g) (the load swings
// without turning, a parallelogram linkage: any mechanics text); the
// simulated free twist agrees with the bifilar formula 2*pi*(k/a)*sqrt(h/g)
// (bifilar suspension, any mechanics text); the ropes share the weight
// equally.
func TestTandemParallelFormulas(t *testing.T) {
	const h = 6.0
	r := mustEval(t, tandemBeam(h, 11, [2]float64{h, h}, 8))
	b := r.Body
	if b == nil || b.Suspension != "two ropes" || !b.TwistRestrained || len(b.Legs) != 2 {
		t.Fatalf("body %+v", b)
	}
	var along float64
	for _, m := range b.Modes {
		if m.Kind == "swing along" {
			along = m.PeriodS
		}
	}
	// Source: parallelogram linkage, 2*pi*sqrt(h/g) (any mechanics text).
	want := 2 * math.Pi * math.Sqrt(h/units.StandardGravity)
	if math.Abs(along/want-1) > 1e-8 {
		t.Errorf("swing along %.10g s, 2 pi sqrt(h/g) %.10g s", along, want)
	}
	// Source: bifilar suspension (any mechanics text), k = sqrt((14^2 + 0.5^2)/12), a = 5.5 m.
	k := math.Sqrt((14*14 + 0.5*0.5) / 12)
	bif := 2 * math.Pi * (k / 5.5) * math.Sqrt(h/units.StandardGravity)
	rel := b.SimulatedTwistPeriodS/bif - 1
	t.Logf("along %.10g s (2 pi sqrt(h/g) %.10g s); twist simulated %.10g s, bifilar %.10g s, relative difference %.2g",
		along, want, b.SimulatedTwistPeriodS, bif, rel)
	if math.Abs(rel) > 1e-6 || math.Abs(b.BifilarTwistPeriodS/bif-1) > 1e-12 || math.Abs(b.TwistPeriodS/bif-1) > 1e-8 {
		t.Errorf("twist: simulated %v s, modal %v s, figure %v s, bifilar %v s", b.SimulatedTwistPeriodS, b.TwistPeriodS, b.BifilarTwistPeriodS, bif)
	}
	for i, l := range b.Legs {
		if math.Abs(l.WeightShare-0.5) > 1e-12 || l.Slack {
			t.Errorf("rope %d: %+v, want half the weight and taut", i, l)
		}
	}
	if b.RestTiltDeg > 1e-9 || hasWarning(r, "slack") {
		t.Errorf("rest tilt %g deg, warnings %q", b.RestTiltDeg, r.Warnings)
	}
}

// Unequal, splayed ropes: hanging still, the load does not swing (swing
// is measured from where it hangs still), it tilts toward the short
// rope's side, and the ropes'
// upward pulls add up to its weight (statics, any mechanics text).
func TestTandemUnequalStill(t *testing.T) {
	s := tandemBeam(6, 12, [2]float64{6, 6.4}, 0)
	s.Settings = &scenario.Settings{DurationS: 20}
	r := mustEval(t, s)
	b := r.Body
	// The rest is found to about 1e-12 (its acceleration); the
	// integrator's tolerance lets that grow to about 1e-8 m over the run.
	if r.PeakSwingDeg > 1e-5 || r.PeakExcursionM > 1e-6 || b.PeakCornerSwingM > 1e-6 || math.Abs(b.PeakTiltDeg-b.RestTiltDeg) > 1e-5 {
		t.Errorf("still load: swing %g deg, excursion %g m, corner %g m, tilt %g deg at rest %g deg",
			r.PeakSwingDeg, r.PeakExcursionM, b.PeakCornerSwingM, b.PeakTiltDeg, b.RestTiltDeg)
	}
	if sum := b.Legs[0].WeightShare + b.Legs[1].WeightShare; math.Abs(sum-1) > 1e-9 {
		t.Errorf("weight shares %g and %g add up to %g", b.Legs[0].WeightShare, b.Legs[1].WeightShare, sum)
	}
	if b.RestTiltDeg < 0.5 || b.RestTiltDeg > 3 {
		t.Errorf("rest tilt %g deg with one rope 0.4 m longer over 11 m", b.RestTiltDeg)
	}
	t.Logf("rest tilt %.4g deg, shares %.4g and %.4g", b.RestTiltDeg, b.Legs[0].WeightShare, b.Legs[1].WeightShare)
}

// A rope that goes slack is flagged and warned of; ropes that cannot
// reach the attach points are a field error naming the rope.
func TestTandemSlackAndBadGeometry(t *testing.T) {
	s := tandemBeam(4, 10, [2]float64{4, 4}, 0)
	s.Load.Body.Tandem.Ropes[0].AttachXM = f(0.4)
	s.Initial = &scenario.Initial{SwingDeg: 50}
	s.Motions = []scenario.Motion{move(0.5, 4, 1, 2, 2)}
	r := mustEval(t, s)
	var es scenario.Errors
	slack := false
	for _, l := range r.Body.Legs {
		slack = slack || l.Slack
	}
	if !slack || !hasWarning(r, "Hook rope") {
		t.Errorf("no slack rope flagged: legs %+v, warnings %q", r.Body.Legs, r.Warnings)
	}
	// Hoisting 3 m takes the 1 m shorter rope below the shortest rope.
	up := tandemBeam(4, 11, [2]float64{4, 3}, 0)
	up.Motions = []scenario.Motion{{Axis: "hoist", StartS: 1, DistanceM: f(3), SpeedMPerS: f(0.2), AccelMPerS2: f(0.2)}}
	if _, err := Evaluate(up); !errors.As(err, &es) || es[0].Field != "load.body.tandem.ropes[1].length_m" {
		t.Errorf("a rope hoisted too short: %v", err)
	}
	bad := tandemBeam(4, 30, [2]float64{4, 4}, 0)
	_, err := Evaluate(bad)
	if !errors.As(err, &es) || es[0].Field != "load.body.tandem.ropes[0].length_m" {
		t.Errorf("ropes that cannot reach: %v", err)
	}
}

// The demo example evaluates and plans like any rigid load.
func TestTandemExample(t *testing.T) {
	r := mustEval(t, testscenario.Example(t, "precast-beam-tandem.json"))
	if r.Body == nil || r.Body.Suspension != "two ropes" || r.Body.TwistPeriodS == 0 {
		t.Fatalf("body %+v", r.Body)
	}
	if _, _, _, err := RigidFirstMode(testscenario.Example(t, "precast-beam-tandem.json"), 6); err != nil {
		t.Error(err)
	}
}

// Hoisting unequal, splayed ropes slowly moves where the load hangs still
// (its plumb and tilt follow the rope length): swing and corner swing,
// measured from there at each moment, stay small, and the tilt at the end
// is the rest tilt at the shorter rope (quasi-static: a slow hoist keeps
// the load near its rest; Landau & Lifshitz, Mechanics, sec. 49).
func TestTandemHoistFollowsRest(t *testing.T) {
	s := tandemBeam(6, 12, [2]float64{6, 6.4}, 0)
	s.Motions = []scenario.Motion{{Axis: "hoist", StartS: 1, DistanceM: f(2), SpeedMPerS: f(0.1), AccelMPerS2: f(0.05)}}
	r := mustEval(t, s)
	b := r.Body
	h := b.History
	end := h.TiltDeg[len(h.TiltDeg)-1]
	t.Logf("peak swing %.3g deg, corner %.3g m, tilt at the end %.6g deg, rest tilt at 4 m %.6g deg", r.PeakSwingDeg, b.PeakCornerSwingM, end, b.RestTiltDeg)
	if r.PeakSwingDeg > 0.05 || b.PeakCornerSwingM > 0.01 || math.Abs(end-b.RestTiltDeg) > 0.05 {
		t.Errorf("slow hoist: swing %g deg, corner %g m, tilt %g deg at the end against %g deg at rest", r.PeakSwingDeg, b.PeakCornerSwingM, end, b.RestTiltDeg)
	}
}
