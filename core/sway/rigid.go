package sway

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// Body reports a load modelled as a rigid body (load.body).
type Body struct {
	// Suspension is "four legs", "two legs", "spreader" or "two ropes"
	// (load.body.tandem).
	Suspension string `json:"suspension"`
	// Modes are the small-swing modes at the rope length at the end of
	// the run, slowest first (modal analysis of the linearised model);
	// period_s of the result is the first.
	Modes []BodyMode `json:"modes"`
	// TwistRestrained is false on one hook: nothing turns the load back
	// when it twists.
	TwistRestrained bool `json:"twist_restrained"`
	// With a spreader or two ropes: the twist period of the bifilar
	// formula 2*pi*(k/a)*sqrt(h/g) (two ropes: a half the attach points'
	// distance, h the ropes' mean length; exact for parallel equal ropes
	// only) and as simulated (free twist of 0.05 deg).
	BifilarTwistPeriodS   float64 `json:"bifilar_twist_period_s,omitempty"`
	SimulatedTwistPeriodS float64 `json:"simulated_twist_period_s,omitempty"`
	// RestTiltDeg is the load's tilt hanging still (unequal legs or attach
	// points not centred over the centre of mass).
	RestTiltDeg float64 `json:"rest_tilt_deg"`
	// PeakTiltDeg is the largest angle of the load's height axis from the
	// vertical; PeakTwistDeg its largest turn about the vertical from its
	// heading at the start (with a spreader or two hook ropes: relative to
	// the crane, which turns them when it slews; with two ropes from its
	// heading hanging still at the present rope length).
	PeakTiltDeg  float64 `json:"peak_tilt_deg"`
	PeakTwistDeg float64 `json:"peak_twist_deg"`
	// PeakCornerSwingM is the largest horizontal distance of a corner of
	// the load from where it hangs still under the suspension point.
	PeakCornerSwingM float64 `json:"peak_corner_swing_m"`
	// PitchPeriodS is the period of the first mode in which the load
	// pitches most; TwistPeriodS of the one in which it twists (zero when
	// its twist is not restrained).
	PitchPeriodS float64 `json:"pitch_period_s"`
	TwistPeriodS float64 `json:"twist_period_s"`
	// LegTensionMaxN and LegTensionMinN are the largest and smallest
	// tension of any leg.
	LegTensionMaxN float64 `json:"leg_tension_max_n"`
	LegTensionMinN float64 `json:"leg_tension_min_n"`
	// Legs are the sling legs' (with a spreader its legs', with two
	// ropes the ropes') tensions, in the order given.
	Legs []LegLoad `json:"legs"`
	// History holds the load's tilt, twist, leg tensions and corner
	// paths at the result's history times.
	History *BodyHistory `json:"history,omitempty"`
}

// BodyMode is one small-swing mode of a rigid load.
type BodyMode struct {
	PeriodS float64 `json:"period_s"`
	// Kind is what moves most: "swing along", "swing across", "pitch",
	// "roll", "twist", "hook" (see pendulum.RigidMode).
	Kind string `json:"kind"`
}

// LegLoad is one sling leg's (or spreader leg's) tension.
type LegLoad struct {
	StaticN     float64 `json:"static_n"`
	TensionMaxN float64 `json:"tension_max_n"`
	TensionMinN float64 `json:"tension_min_n"`
	// WeightShare is a hook rope's share of the load's weight hanging
	// still: the upward part of its pull over m g (two ropes only; the
	// two add up to 1).
	WeightShare float64 `json:"weight_share,omitempty"`
	// Slack marks a hook rope whose tension reached zero or below (two
	// ropes only; a warning says so too).
	Slack bool `json:"slack,omitempty"`
}

// BodyHistory are time series beside History.
type BodyHistory struct {
	TiltDeg     []float64   `json:"tilt_deg"`
	TwistDeg    []float64   `json:"twist_deg"`
	LegTensionN [][]float64 `json:"leg_tension_n"` // [leg][sample]
	// Corners of the box on the ground frame, [corner][sample]; corner i
	// is at (+/-length/2, +/-width/2, +/-height/2) with the minus signs
	// where bits 0, 1, 2 of i are set.
	CornerXM [][]float64 `json:"corner_x_m"`
	CornerYM [][]float64 `json:"corner_y_m"`
	CornerZM [][]float64 `json:"corner_z_m"`
	// LegTopXM ... LegEndZM are each sling leg's ends on the ground frame,
	// [leg][sample] (pendulum.BodyPoint's LegTop, LegEnd): for the
	// clearance check's lines (core/clearance), not sent as JSON; only
	// with Options.LegEnds, nil otherwise.
	LegTopXM, LegTopYM, LegTopZM [][]float64 `json:"-"`
	LegEndXM, LegEndYM, LegEndZM [][]float64 `json:"-"`

	flat    []float64 // every series' samples, one after another (carve)
	legEnds bool      // the legs' ends are recorded (Options.LegEnds)
}

// bodySeries is how many series a rigid load's body history has with
// nLegs legs: its tilt and twist, each leg's tension (with legEnds also
// the three coordinates of each of the leg's two ends) and the three
// coordinates of each of the eight corners.
func bodySeries(nLegs int, legEnds bool) int {
	perLeg := 1
	if legEnds {
		perLeg = 7
	}
	return 2 + nLegs*perLeg + 3*8
}

// carve makes every series of h a part of flat, which holds
// bodySeries(nLegs, h.legEnds)*n: series j, in the order add writes them,
// is flat[j*n:(j+1)*n], full length from the start (a run that ends
// without error records every sample; one that fails returns no
// history).
func (h *BodyHistory) carve(flat []float64, nLegs, n int) {
	h.LegTensionN = make([][]float64, nLegs)
	h.CornerXM, h.CornerYM, h.CornerZM = make([][]float64, 8), make([][]float64, 8), make([][]float64, 8)
	var legs []*[][]float64
	if h.legEnds {
		legs = []*[][]float64{&h.LegTopXM, &h.LegTopYM, &h.LegTopZM, &h.LegEndXM, &h.LegEndYM, &h.LegEndZM}
		for _, a := range legs {
			*a = make([][]float64, nLegs)
		}
	}
	series := []*[]float64{&h.TiltDeg, &h.TwistDeg}
	for i := range nLegs {
		series = append(series, &h.LegTensionN[i])
		for _, a := range legs {
			series = append(series, &(*a)[i])
		}
	}
	for i := range 8 {
		series = append(series, &h.CornerXM[i], &h.CornerYM[i], &h.CornerZM[i])
	}
	for j, c := range series {
		*c = flat[j*n : (j+1)*n : (j+1)*n]
	}
	h.flat = flat
}

// add writes the sample p as sample k of samples, each value in place in
// its series, a store apart by samples (the recorder's reserve carves the
// series beforehand, in the same allocation as the History's). Grown
// sample by sample, the copies and the collector made bay-girder-rigid's
// full evaluation about 12 % slower as wasm, 4 % natively; appended into
// the 54 series of a rigid load's [leg][sample] and [corner][sample]
// slices, each sample loaded and stored every slice's header (about 5x
// native under node). The legs
// written are the series' (len(LegTensionN)); Eval reports as many
// (pendulum.Rigid.LegCount).
func (h *BodyHistory) add(p *pendulum.Point, k, samples int) {
	b := p.Body
	n := max(samples, 1)
	f, o := h.flat, k
	f[o] = b.TiltRad / units.Degree
	o += n
	f[o] = b.TwistRad / units.Degree
	// Written out, not a loop over the seven inside the loop over the
	// legs (a loop inside another goes round wasm's dispatch loop).
	if h.legEnds {
		for i := range len(h.LegTensionN) {
			t, e := &b.LegTop[i], &b.LegEnd[i]
			f[o+n], f[o+2*n], f[o+3*n], f[o+4*n] = b.Legs[i], t.X, t.Y, t.Z
			f[o+5*n], f[o+6*n], f[o+7*n] = e.X, e.Y, e.Z
			o += 7 * n
		}
	} else {
		for i := range len(h.LegTensionN) {
			o += n
			f[o] = b.Legs[i]
		}
	}
	for _, c := range b.Corners {
		o += n
		f[o] = c.X
		o += n
		f[o] = c.Y
		o += n
		f[o] = c.Z
	}
}

// bodyValue is quantity q of a rigid load (see scanner.value).
func bodyValue(q quantity, b *pendulum.BodyPoint) float64 {
	switch {
	case q == qTilt:
		return b.TiltRad
	case q == qTwist:
		return math.Abs(b.TwistRad)
	case q == qCorner:
		return b.CornerSwing2
	case q >= qLegLow:
		return -b.Legs[q-qLegLow]
	}
	return b.Legs[q-qLeg]
}

// LongLoadM is the longest horizontal side from which a load on one hook
// gets the warning that its twist is not restrained (tag lines for long
// loads: common practice).
const LongLoadM = 3.0

// travelOf is a rigid load's suspension point and rope as the span tables
// of the specialised path (pendulum.Travel) when the crane has no slewing
// arm and every profile flattens; nil otherwise, for the closures over the
// combined profiles. Options.General leaves it out (integrate).
func travelOf(ax *crane.Drives, l0 float64, at crane.Start) *pendulum.Travel {
	k := newFastModel(ax, l0, at, 0, nil)
	if k == nil || k.slewing {
		return nil
	}
	return pendulum.NewTravel(k.x, k.y, k.hoist, l0)
}

// rigidModel is the rigid-load model of a validated scenario with
// load.body, and its initial state.
func rigidModel(s *scenario.Scenario, susp func(float64) pendulum.Kinematics,
	rope func(float64) (float64, float64, float64), force func(float64, r3.Vec, r3.Vec) r3.Vec,
	slew motion.Sum) (*pendulum.Rigid, []float64, error) {
	b := s.Load.Body
	a, w, h := *b.LengthM, *b.WidthM, *b.HeightM
	k := r3.Vec{
		X: deref(b.GyrationLengthM, math.Sqrt((w*w+h*h)/12)),
		Y: deref(b.GyrationWidthM, math.Sqrt((a*a+h*h)/12)),
		Z: deref(b.GyrationHeightM, math.Sqrt((a*a+w*w)/12)),
	}
	r := &pendulum.Rigid{Mass: *s.Load.MassKg, Gyration: k, HookMass: b.HookMassKg,
		Size: r3.Vec{X: a, Y: w, Z: h}, Heading: b.HeadingDeg * units.Degree,
		Suspension: susp, Rope: rope, Force: force}
	if len(slew) > 0 {
		r.Yaw = func(t float64) (float64, float64, float64) {
			p := slew.At(t)
			return p.Pos, p.Vel, p.Acc
		}
	}
	if sp := b.Spreader; sp != nil {
		r.Spreader = *sp.SpacingM / 2
		r.SpreaderZ = deref(sp.AttachZM, h/2)
	}
	if tr := b.Tandem; tr != nil {
		r.Tandem = tandemRopes(s)
	}
	for _, l := range b.Legs {
		r.Legs = append(r.Legs, pendulum.Leg{Length: *l.LengthM,
			Attach: r3.Vec{X: l.AttachXM, Y: l.AttachYM, Z: *l.AttachZM}})
	}
	if err := r.Prepare(); err != nil {
		var ge *pendulum.GeometryError
		field := "load.body.legs"
		switch {
		case b.Tandem != nil:
			field = "load.body.tandem"
			if errors.As(err, &ge) && ge.Leg >= 0 && ge.Leg < 2 {
				field = fmt.Sprintf("load.body.tandem.ropes[%d].length_m", ge.Leg)
			}
		case errors.As(err, &ge) && ge.Leg >= 0 && ge.Leg < len(b.Legs):
			field = fmt.Sprintf("load.body.legs[%d].length_m", ge.Leg)
		}
		return nil, nil, scenario.Errors{{Field: field, Message: err.Error()}}
	}
	var in scenario.Initial
	if s.Initial != nil {
		in = *s.Initial
	}
	y0 := r.Initial(in.SwingDeg*units.Degree, in.TowardDeg*units.Degree, in.VelocityXMPerS, in.VelocityYMPerS)
	return r, y0, nil
}

// bodyWind is the steady lean of the line from the suspension point to
// the load's centre of mass and the load's offset from plumb under a
// steady horizontal force F at the load's centre of mass (static
// equilibrium, as WindLeanRad and WindOffsetM for a hook block): the rope
// to the hook carries load and hook block and leans atan(F/((m+m_h) g));
// the load with its legs is held at the hook alone, so the line from the
// hook to its centre of mass lies along the resultant of F and its weight,
// atan(F/(m g)). With a spreader the parallel legs lean atan(F/(m g)) and
// the load moves without turning (its roll under a force across it, which
// the attach points' height brings, is left out of this figure). Two hook
// ropes are taken as parallel legs of their mean length (exact for
// parallel equal ropes; an estimate otherwise).
func bodyWind(r *pendulum.Rigid, force, rope float64) (leanRad, offsetM float64) {
	g := units.StandardGravity
	t2 := math.Atan2(force, r.Mass*g)
	if r.TwoTops() {
		depth := r.TopDepthM(rope)
		if r.Tandem != nil {
			mean := (r.Tandem.Extra[0] + r.Tandem.Extra[1]) / 2
			rope, depth = rope+mean, depth-mean
		}
		x := rope * math.Sin(t2)
		return math.Atan2(x, rope*math.Cos(t2)+depth), x
	}
	t1 := math.Atan2(force, (r.Mass+r.HookMass)*g)
	d := r.HookDepthM()
	x := rope*math.Sin(t1) + d*math.Sin(t2)
	return math.Atan2(x, rope*math.Cos(t1)+d*math.Cos(t2)), x
}

// bodyModes returns the modes of a rigid load at rope length l and the
// period of the slowest one that swings back.
func bodyModes(r *pendulum.Rigid, l float64) ([]pendulum.RigidMode, float64, error) {
	modes, err := r.Modes(l)
	if err != nil {
		return nil, 0, err
	}
	if len(modes) == 0 || modes[0].Free {
		return nil, 0, errors.New("sway: the rigid load has no swinging mode")
	}
	return modes, modes[0].PeriodS, nil
}

// body fills the rigid-load figures and their warnings.
func body(s *scenario.Scenario, r *pendulum.Rigid, modes []pendulum.RigidMode, sc *scanner, ropeEnd float64, res *Result, measure bool) error {
	b := s.Load.Body
	out := &Body{TwistRestrained: true, Legs: []LegLoad{}}
	switch {
	case b.Tandem != nil:
		out.Suspension = TwoRopes
	case b.Spreader != nil:
		out.Suspension = Spreader
	case len(b.Legs) == 2:
		out.Suspension = "two legs"
	default:
		out.Suspension = "four legs"
	}
	var twist *pendulum.RigidMode
	for i := range modes {
		m := &modes[i]
		if m.Free {
			out.TwistRestrained = false
			continue
		}
		out.Modes = append(out.Modes, BodyMode{PeriodS: m.PeriodS, Kind: m.Kind})
		if m.Kind == "twist" && twist == nil {
			twist = m
			out.TwistPeriodS = m.PeriodS
		}
		if m.Kind == "pitch" && out.PitchPeriodS == 0 {
			out.PitchPeriodS = m.PeriodS
		}
	}
	fixed := r.Fixed(ropeEnd)
	var rest pendulum.Point
	fixed.Eval(0, fixed.Rest(0), &rest)
	out.RestTiltDeg = rest.Body.TiltRad / units.Degree
	for i := range rest.Body.NLegs {
		l := LegLoad{StaticN: rest.Body.Legs[i],
			TensionMaxN: sc.ext[qLeg+quantity(i)].max, TensionMinN: -sc.ext[qLegLow+quantity(i)].max}
		out.Legs = append(out.Legs, l)
		if i == 0 || l.TensionMaxN > out.LegTensionMaxN {
			out.LegTensionMaxN = l.TensionMaxN
		}
		if i == 0 || l.TensionMinN < out.LegTensionMinN {
			out.LegTensionMinN = l.TensionMinN
		}
	}
	out.PeakTiltDeg = sc.ext[qTilt].max / units.Degree
	out.PeakTwistDeg = sc.ext[qTwist].max / units.Degree
	out.PeakCornerSwingM = excursionM(sc.ext[qCorner].max)
	if b.Spreader != nil || b.Tandem != nil {
		// Source: bifilar suspension (any mechanics text), checked in
		// core/pendulum against the modal analysis and a free twist.
		k := deref(b.GyrationHeightM, math.Sqrt((*b.LengthM**b.LengthM+*b.WidthM**b.WidthM)/12))
		a, h := r.Spreader, ropeEnd
		if r.Tandem != nil {
			a, h = bifilarTandem(r.Tandem, ropeEnd)
		}
		out.BifilarTwistPeriodS = 2 * math.Pi * (k / a) * math.Sqrt(h/units.StandardGravity)
		if measure && twist != nil {
			p, err := twistPeriod(fixed, twist)
			if err != nil {
				return err
			}
			out.SimulatedTwistPeriodS = p
		}
	}
	res.Body = out
	long := math.Max(*b.LengthM, *b.WidthM)
	if !out.TwistRestrained && long >= LongLoadM {
		res.warn(words.Say(
			"The load ({0} long) hangs from one hook, which does not restrain its twist: once it turns, nothing turns it back. Control it with tag lines, or carry it on a spreader with two legs held by the crane.", words.Length(long)))
	}
	if b.Tandem != nil {
		tandemFigures(out, rest.Body, *s.Load.MassKg, res)
	}
	for i, l := range out.Legs {
		if b.Tandem == nil && l.TensionMinN <= 0 {
			// "Sling leg 2", "Spreader leg 1": both start with an s.
			res.warn(words.Plain("S" + LegName(out.Suspension, i)[1:] +
				" goes slack (its tension reaches zero): the load shifts onto the other legs and can snatch this one when it tightens; the model, which keeps every leg straight, no longer holds. Reduce the motion or change the rigging."))
		}
	}
	if out.RestTiltDeg > 2 {
		res.warn(words.Say(
			"The load hangs tilted {0} at rest: the legs' lengths and attach points do not centre the hook over its centre of mass.", words.Angle(out.RestTiltDeg)))
	}
	return nil
}

// twistPeriod measures the twist mode's period on the nonlinear model
// under a still suspension point: released from rest in the mode shape at
// 0.05 deg, the time between up-crossings of the vertical angular
// velocity.
func twistPeriod(r *pendulum.Rigid, m *pendulum.RigidMode) (float64, error) {
	y := r.Rest(0)
	r.Displace(y, m.Shape, 0.05*units.Degree)
	const wz = 13 // the angular velocity's vertical part in the state
	return pendulum.CrossingPeriod(r, y, wz, 4, 20*m.PeriodS)
}

// bodyAssumptions are the assumptions of an evaluation with load.body:
// those of the point model, less the two it replaces, after the rigid
// load's own.
func bodyAssumptions(b *scenario.Body) []string {
	out := []string{
		"The load is a rigid box on slings that do not stretch: four legs are a rigid frame sharing the load by their stiffness; two legs let it roll about their attach line; a spreader's parallel legs hang from points fixed to the crane.",
		"The rope length runs from the rope's upper point of rotation to the hook (with a spreader: to the load).",
		"Wind and drag act at the centre of the load's area, for a uniform box its centre of mass: no moment tilts or turns it.",
	}
	if b.Tandem != nil {
		out[0] = "The load is a rigid box on two straight hook ropes that do not stretch and stay taut (a slack rope is flagged), from two points moving with the crane; hook blocks count with the load."
		out[1] = "Each rope runs from its upper point of rotation to the load; both change with the rope length. Swing is measured from where the load hangs still."
	}
	for _, a := range Assumptions {
		if strings.HasPrefix(a, "The load is a point mass") || strings.HasPrefix(a, "The rope length runs") || strings.HasPrefix(a, "The load does not spin") {
			continue
		}
		out = append(out, a)
	}
	return out
}

// RigidFirstMode is the slowest small-swing mode of a scenario's rigid
// load (load.body) hanging from a still suspension point at rope length
// ropeM (to the hook; with a spreader, the parallel legs' length): its
// period, what moves most in it, and the effective length of the single
// rope with the same period, L = g (T / (2 pi))^2, for a planner to tune a
// drive setting or a shaper to. The other modes are in Result.Body.Modes.
func RigidFirstMode(s *scenario.Scenario, ropeM float64) (periodS, effectiveLengthM float64, kind string, err error) {
	b, err := NewRigidLoad(s)
	if err != nil {
		return 0, 0, "", err
	}
	if r := scenario.Ranges["load.rope_length_m"]; !(ropeM >= r.Min && ropeM <= r.Max) {
		return 0, 0, "", scenario.Errors{{Field: "load.rope_length_m", Message: fmt.Sprintf("%g is out of range: %s", ropeM, r.Text())}}
	}
	modes, period, err := bodyModes(b.r, ropeM)
	if err != nil {
		return 0, 0, "", err
	}
	w := 2 * math.Pi / period
	return period, units.StandardGravity / (w * w), modes[0].Kind, nil
}
