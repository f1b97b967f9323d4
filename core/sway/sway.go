// Package sway evaluates a scenario: it integrates the nonlinear
// three-dimensional hook-load model of package pendulum through the crane
// motions of the scenario and reports the figures a lift plan needs: sway
// period, peak and residual swing, load excursion and rope tension, with
// time histories for plots, the checks against the plan's limits and
// warnings in plain words.
package sway

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mathext"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// Result is what an evaluation reports. SI units, angles in degrees.
type Result struct {
	Name string `json:"name"`
	// PeriodS is the small-amplitude period 2*pi*sqrt(L/g) at the rope
	// length at the end of the run; with a hook block the slower mode's,
	// with a rigid load (load.body) the slowest mode's (Body.Modes).
	PeriodS float64 `json:"period_s"`
	// PeriodAmplitudeS is the period of a free swing of the residual
	// amplitude, 4*sqrt(L/g)*K(sin^2(theta/2)); zero when the swing goes
	// over the top (179 deg or more), where there is no swing period.
	PeriodAmplitudeS float64 `json:"period_amplitude_s"`
	// PeakSwingDeg is the largest rope angle from the vertical over the run.
	PeakSwingDeg   float64 `json:"peak_swing_deg"`
	PeakSwingTimeS float64 `json:"peak_swing_time_s"`
	// PeakExcursionM is the largest horizontal distance of the load from
	// the point under the suspension point.
	PeakExcursionM float64 `json:"peak_excursion_m"`
	// ResidualSwingDeg is the largest rope angle from the vertical after
	// the last motion has ended (over at least two periods).
	ResidualSwingDeg   float64 `json:"residual_swing_deg"`
	ResidualExcursionM float64 `json:"residual_excursion_m"`
	TensionMaxN        float64 `json:"tension_max_n"`
	TensionMinN        float64 `json:"tension_min_n"`
	// TensionFactor is TensionMaxN / (m*g), with the hook block's mass in
	// m when it is modelled.
	TensionFactor float64 `json:"tension_factor"`
	// StaticTensionN is m*g.
	StaticTensionN float64 `json:"static_tension_n"`
	// WindForceN and WindLeanDeg are the steady wind force and the rope's
	// steady lean under it, atan(F/(m*g)).
	WindForceN  float64 `json:"wind_force_n"`
	WindLeanDeg float64 `json:"wind_lean_deg"`
	// WindDampingRatio is the damping ratio the air drag gives a small
	// swing along the wind about the steady lean (linearised drag on the
	// speed relative to the air; Air.DampingRatio); across the wind it is
	// about half. Zero without wind and drag, and with a hook block.
	WindDampingRatio float64 `json:"wind_damping_ratio,omitempty"`
	// WindOffsetM is how far the load hangs off plumb in the steady wind
	// (WindOffsetM, at the rope length at the end of the run).
	WindOffsetM float64 `json:"wind_offset_m"`

	RopeLengthStartM float64 `json:"rope_length_start_m"`
	RopeLengthEndM   float64 `json:"rope_length_end_m"`
	MotionEndS       float64 `json:"motion_end_s"`
	RunS             float64 `json:"run_s"`

	// Rigging is present when the scenario models hook block and rigging.
	Rigging *Rigging `json:"rigging,omitempty"`
	// Body is present when the scenario models the load as a rigid body.
	Body *Body `json:"body,omitempty"`

	Checks   []Check  `json:"checks"`
	Warnings []string `json:"warnings"`
	// WarningSentences are the warnings with their quantities marked
	// (core/words), to be shown in the units people chose; Warnings is
	// their plain SI text, one for one.
	WarningSentences []words.Sentence `json:"warning_sentences"`
	Assumptions      []string         `json:"assumptions"`
	Phases           []Phase          `json:"phases"`
	History          History          `json:"history"`
	Solver           Stats            `json:"solver"`
}

// Check is one result held against one of the plan's limits.
type Check struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Name   string  `json:"name"` // the Result field checked
	Label  string  `json:"label"`
	Value  float64 `json:"value"`
	Limit  float64 `json:"limit"`
	Unit   string  `json:"unit"`
	Within bool    `json:"within"`
}

// Phase is the time span of one move, for marking plots.
type Phase struct {
	_           [0]func() // never compared: no equality code in the wasm
	Motion      int       `json:"motion"`
	Axis        string    `json:"axis"`
	StartS      float64   `json:"start_s"`
	AccelEndS   float64   `json:"accel_end_s"`
	DecelStartS float64   `json:"decel_start_s"`
	EndS        float64   `json:"end_s"`
}

// History holds evenly sampled time series, one slice per quantity.
type History struct {
	TimeS        []float64 `json:"time_s"`
	SwingDeg     []float64 `json:"swing_deg"`
	RelXM        []float64 `json:"rel_x_m"` // load relative to the suspension point
	RelYM        []float64 `json:"rel_y_m"`
	RelZM        []float64 `json:"rel_z_m"`
	LoadXM       []float64 `json:"load_x_m"` // load on the ground frame
	LoadYM       []float64 `json:"load_y_m"`
	SuspensionXM []float64 `json:"suspension_x_m"` // suspension point on the ground frame
	SuspensionYM []float64 `json:"suspension_y_m"`
	TensionN     []float64 `json:"tension_n"`
	RopeM        []float64 `json:"rope_m"`
	// HookRelXM, HookRelYM, HookRelZM are the hook (the hoist rope's lower
	// end) relative to the suspension point, with a hook block or a rigid
	// load on a hook; nil otherwise (the rope ends at the load). Kept for
	// the clearance check's rope (core/clearance), not sent as JSON.
	HookRelXM []float64 `json:"-"`
	HookRelYM []float64 `json:"-"`
	HookRelZM []float64 `json:"-"`
}

// Stats describe the integration.
type Stats struct {
	RelTol   float64 `json:"rel_tol"`
	Steps    int     `json:"steps"`
	Rejected int     `json:"rejected"`
	Evals    int     `json:"evals"`
	// ConstraintError is the largest relative rope length error |n|-1
	// seen before each projection.
	ConstraintError float64 `json:"constraint_error"`
}

// Options control an evaluation beyond the scenario's own settings.
type Options struct {
	// NoHistory skips the time histories (for the planner's many runs).
	NoHistory bool
	// MaxSteps bounds the integration steps, accepted and rejected; zero
	// means 500,000. The evaluation ends with ErrStepLimit when hit.
	MaxSteps int
	// Budget is the work allowance the evaluation draws on (see
	// budget.go); nil gives it its own of DefaultWork.
	Budget *Budget
	// NoModePeriods skips measuring the two mode periods on the nonlinear
	// model with a hook block (rigging.simulated_periods_s stays zero;
	// for the planner's many runs).
	NoModePeriods bool
	// General integrates on the general path even when the specialised
	// single-rope path fits the scenario (fast.go; for tests and the bench).
	General bool
	// Validated says the caller has validated the scenario and not
	// changed it since (scenario.Parse and Decode validate): it is not
	// validated again.
	Validated bool
	// PathOnly says only the time histories are wanted (the clearance
	// check's runs): the specialised path then makes no peak search, so
	// the result's peak and residual figures are not to be read. The
	// general path ignores it.
	PathOnly bool
	// HistoryBuffer, when set, is memory for the time histories' series
	// (a rigid load's body history's too), used when large enough and
	// replaced by the larger one made when not: a caller making many runs
	// one after another (the clearance check's) reuses it, and reads each
	// result's histories only until its next run.
	HistoryBuffer *[]float64
	// LegEnds records a rigid load's sling legs' (or hook ropes') ends in
	// its body history (BodyHistory.LegTopXM to LegEndZM), for the
	// clearance check's lines; without it they stay nil, and a run of a
	// load on two legs writes 28 series a sample, not 40.
	LegEnds bool
	// CountedChecks says the limit checks' warnings are only counted: each
	// is an empty string in Result.Warnings (and an empty sentence), not
	// worded, for callers that read only how many there are (the
	// planner's runs, whose drawn timings are often outside a limit).
	CountedChecks bool
	// kinSamples makes the specialised path take every history sample
	// the plain way, through fastSolver.dense, project, kinOf and rel
	// (fasthistory.go), and on travel moves with air the right-hand side
	// through kinOf too, as with other moves (for tests).
	kinSamples bool
	// loopedStages makes the specialised path's steps take the stages'
	// sums as loops, as in wasm, where natively they are written out
	// (faststages.go; for tests).
	loopedStages bool
}

// Tolerances of the "default" and "tight" accuracy settings.
const (
	DefaultRelTol = 1e-7
	TightRelTol   = 1e-11
)

// SwingValidityDeg is the rope angle above which a warning says the
// results leave the range this tool is meant for.
const SwingValidityDeg = 30.0

// overTopDeg is the residual swing from which the load is taken to whirl
// over the top; PeriodAmplitudeS is then zero.
const overTopDeg = 179.0

// maxSteps bounds the work of one evaluation.
const maxSteps = 500_000

// Assumptions is what the model takes for granted, in plain words.
var Assumptions = []string{
	"The load is a point mass at its centre of mass on a straight, massless rope that does not stretch; hook block and rigging are part of the rope length.",
	"The rope length runs from the rope's upper point of rotation (trolley sheave, boom or jib tip) to the load's centre of mass.",
	"The crane structure is rigid: boom, jib and bridge do not deflect or bounce.",
	"The drive follows the commanded motion exactly; real drives lag and overshoot.",
	"The load does not spin. Swing of the load relative to the hook is modelled only when hook block and rigging are entered (two point masses); otherwise hook and load swing as one.",
	"Wind is a steady horizontal force once risen (a gust is a step or a ramp); air drag, if set, acts on the speed relative to the air.",
	"Swing is computed in full 3D without small-angle approximation; results above 30 deg are outside the range this tool is meant for.",
}

// Evaluate runs one scenario with default options.
func Evaluate(s *scenario.Scenario) (*Result, error) {
	return EvaluateWith(s, Options{})
}

// EvaluateWith runs one scenario.
func EvaluateWith(s *scenario.Scenario, opt Options) (*Result, error) {
	su, err := build(s, !opt.Validated)
	if err != nil {
		return nil, err
	}
	g := units.StandardGravity
	mass := *s.Load.MassKg
	var st scenario.Settings
	if s.Settings != nil {
		st = *s.Settings
	}
	relTol := DefaultRelTol
	if st.Accuracy == "tight" {
		relTol = TightRelTol
	}
	if st.RelTol != 0 {
		relTol = st.RelTol
	}
	settle := st.SettlePeriods
	if settle == 0 {
		settle = 3
	}
	samples := st.Samples
	if samples == 0 {
		samples = 601
	}
	period := 2 * math.Pi * math.Sqrt(su.ropeEnd/g)
	staticN := mass * g
	if h := s.Load.Hook; h != nil {
		// The slower of the two modes is the sway period people see.
		period = 2 * math.Pi / modes(h, mass, su.ropeEnd).Omega[0]
		staticN = (mass + *h.MassKg) * g
	}
	rigid, _ := su.model.(*pendulum.Rigid)
	var bodyMd []pendulum.RigidMode
	if rigid != nil {
		if bodyMd, period, err = bodyModes(rigid, su.ropeEnd); err != nil {
			return nil, err
		}
		staticN = (mass + s.Load.Body.HookMassKg) * g
	}
	tEnd := math.Max(su.activityEnd+settle*period, st.DurationS)
	if tEnd > scenario.MaxRunS {
		return nil, scenario.Errors{{Field: "settings.duration_s", Message: fmt.Sprintf(
			"the run would last %.4g s (motions end at %.4g s, then %.3g periods of %.4g s to measure the residual swing): at most %g s is simulated",
			tEnd, su.activityEnd, settle, period, scenario.MaxRunS)}}
	}

	res := &Result{
		Name:             s.Name,
		PeriodS:          period,
		StaticTensionN:   staticN,
		WindForceN:       su.windForce,
		WindLeanDeg:      WindLeanRad(s, su.windForce, su.ropeEnd) / units.Degree,
		WindOffsetM:      WindOffsetM(s, su.windForce, su.ropeEnd),
		RopeLengthStartM: su.ropeStart,
		RopeLengthEndM:   su.ropeEnd,
		MotionEndS:       su.motionEnd,
		RunS:             tEnd,
		Assumptions:      Assumptions,
		Phases:           su.phases,
	}
	for _, w := range su.warnings {
		res.warn(w)
	}
	if res.Phases == nil {
		res.Phases = []Phase{}
	}
	if s.Load.Hook == nil && s.Load.Body == nil { // one rope and a point load only
		res.WindDampingRatio, _ = su.air.DampingRatio(mass, su.ropeEnd)
	}
	if rigid != nil {
		res.Assumptions = bodyAssumptions(s.Load.Body)
		lean, off := bodyWind(rigid, su.windForce, su.ropeEnd)
		res.WindLeanDeg, res.WindOffsetM = lean/units.Degree, off
	}
	if opt.Budget == nil {
		opt.Budget = NewBudget(DefaultWork, "")
	}
	var hist *History
	if !opt.NoHistory {
		hist = &res.History
	}
	sc, general, stats, err := integrate(su, opt, hist, tEnd, relTol, samples)
	if err != nil {
		return nil, err
	}
	res.PeakSwingDeg = swingRad(sc.ext[qSwing].max) / units.Degree
	res.PeakSwingTimeS = sc.ext[qSwing].at
	res.PeakExcursionM = excursionM(sc.ext[qExcursion].max)
	res.ResidualSwingDeg = swingRad(sc.resSwing.max) / units.Degree
	res.ResidualExcursionM = excursionM(sc.resExcursion.max)
	res.TensionMaxN = sc.ext[qTension].max
	res.TensionMinN = -sc.ext[qTensionLow].max
	res.TensionFactor = res.TensionMaxN / res.StaticTensionN
	// A swing that reaches the top of its circle (179 deg and more, where
	// the elliptic integral grows without bound) whirls round the
	// suspension point and has no swing period.
	if res.ResidualSwingDeg < overTopDeg {
		k := math.Sin(res.ResidualSwingDeg * units.Degree / 2)
		// Amplitude correction of the plane pendulum, 2K(k^2)/pi, applied
		// to the period (for a hook block and rigging, to the slower mode).
		res.PeriodAmplitudeS = period * 2 * mathext.CompleteK(k*k) / math.Pi
	} else {
		res.warn(words.Plain("The load swings over the top of its circle: it whirls round the suspension point and has no swing period."))
	}
	if s.Load.Hook != nil {
		if err := rigging(s, sc, su.ropeEnd, res, !opt.NoModePeriods); err != nil {
			return nil, err
		}
	}
	if rigid != nil {
		if err := body(s, rigid, bodyMd, general, su.ropeEnd, res, !opt.NoModePeriods); err != nil {
			return nil, err
		}
		res.Body.History = general.bodyHist
	}
	res.Solver = stats

	res.Checks = checks(s, res, !opt.CountedChecks)
	res.markWarnings()
	return res, nil
}

// WindLeanRad is the steady lean of the line from the suspension point to
// the load under a steady horizontal force F on the load (static
// equilibrium): atan(F/(m*g)) for one rope; with a hook block, the rope
// leans atan(F/((m1+m2)*g)) and the rigging atan(F/(m2*g)), and the line to
// the load lies between (rope: the rope length to the hook block).
func WindLeanRad(s *scenario.Scenario, force, rope float64) float64 {
	g := units.StandardGravity
	m2 := *s.Load.MassKg
	h := s.Load.Hook
	if h == nil {
		return math.Atan2(force, m2*g)
	}
	l2 := *h.RiggingLengthM
	t1 := math.Atan2(force, (m2+*h.MassKg)*g)
	t2 := math.Atan2(force, m2*g)
	x := rope*math.Sin(t1) + l2*math.Sin(t2)
	z := rope*math.Cos(t1) + l2*math.Cos(t2)
	return math.Atan2(x, z)
}

// checks compares the result's figures with the scenario's limits and
// warns of each outside them (worded false: counted only, an empty
// warning each; Options.CountedChecks), of a wind lean past the swing
// limit, a slack rope and a swing past SwingValidityDeg.
func checks(s *scenario.Scenario, r *Result, worded bool) []Check {
	out := []Check{}
	add := func(name, label, crew string, v float64, lim *float64, unit string) {
		if lim == nil {
			return
		}
		c := Check{Name: name, Label: label, Value: v, Limit: *lim, Unit: unit, Within: v <= *lim}
		out = append(out, c)
		if !c.Within {
			var w words.Sentence // counted only (Options.CountedChecks) unless worded
			if worded {
				w = words.Say(crew+" of {0} is outside the plan's limit of {1}.", words.Of(v, unit), words.Of(*lim, unit))
			}
			r.warn(w)
		}
	}
	if l := s.Limits; l != nil {
		add("peak_swing_deg", "Peak swing", "The largest swing", r.PeakSwingDeg, l.PeakSwingDeg, "deg")
		add("peak_excursion_m", "Peak excursion", "The load's largest swing-out", r.PeakExcursionM, l.PeakExcursionM, "m")
		add("residual_swing_deg", "Residual swing", "The swing left after stopping", r.ResidualSwingDeg, l.ResidualSwingDeg, "deg")
		add("residual_excursion_m", "Residual excursion", "The swing-out left after stopping", r.ResidualExcursionM, l.ResidualExcursionM, "m")
		add("tension_factor", "Tension factor", "The rope pull increase (times the load's weight)", r.TensionFactor, l.TensionFactor, "")
		if r.Body != nil {
			// A point load has no tilt: no check.
			add("peak_tilt_deg", "Peak tilt", "The load's largest tilt", r.Body.PeakTiltDeg, l.PeakTiltDeg, "deg")
		}
		if l.PeakSwingDeg != nil && r.WindLeanDeg > *l.PeakSwingDeg {
			r.warn(words.Say("The wind alone leans the rope {0}, more than the plan's swing limit of {1}: no drive setting can keep the load inside it. Wait for less wind or change the limit.",
				words.Angle(r.WindLeanDeg), words.Angle(*l.PeakSwingDeg)))
		}
	}
	if r.TensionMinN <= 0 {
		r.warn(words.Plain("The rope goes slack (tension reaches zero): the model no longer holds, and the load can snatch the rope when it tightens. Reduce the motion."))
	}
	if r.PeakSwingDeg > SwingValidityDeg {
		r.warn(words.Say("The rope swings {0} from the vertical, above {1}: this is outside the range the tool is meant for, and rigging, hook and crane behave in ways the model leaves out.",
			words.Angle(r.PeakSwingDeg), words.Angle(SwingValidityDeg)))
	}
	return out
}

// warn adds a warning: its sentence and its plain SI text.
func (r *Result) warn(w words.Sentence) {
	r.WarningSentences = append(r.WarningSentences, w)
	r.Warnings = append(r.Warnings, w.String())
}

// markWarnings makes WarningSentences one for one with Warnings: a
// warning added as plain text alone gets a sentence without quantities.
func (r *Result) markWarnings() {
	if r.Warnings == nil {
		r.Warnings = []string{}
	}
	if len(r.WarningSentences) == len(r.Warnings) {
		// warn adds to both: they are one for one already (and a
		// sentence's text is not made twice).
		if r.WarningSentences == nil {
			r.WarningSentences = []words.Sentence{}
		}
		return
	}
	out := make([]words.Sentence, len(r.Warnings))
	k := 0
	for i, w := range r.Warnings {
		if k < len(r.WarningSentences) && r.WarningSentences[k].String() == w {
			out[i] = r.WarningSentences[k]
			k++
			continue
		}
		out[i] = words.Plain(w)
	}
	r.WarningSentences = out
}

// ErrStepLimit is returned when an evaluation needs more integration steps
// than it is allowed.
var ErrStepLimit = errors.New("This run needs more computing than allowed: shorten the moves or the run time, or set a looser accuracy (settings.rel_tol)")
