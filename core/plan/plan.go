// Package plan turns a planning request (scenario.Plan) into drive
// settings a crew can use, each verified by the full nonlinear 3D
// simulation of package sway at the nominal rope length and at both ends of
// the rope-length range.
//
// The options, for a travel move of distance D (or a slew of angle phi at
// radius R) with top speed V and largest acceleration a_max:
//
//   - drive limits: the trapezoidal move at V and a_max, the fastest move
//     and the reference for every option's time penalty;
//   - peak-limited acceleration: a sudden acceleration a from rest swings
//     the rope between 0 and 2*atan(a/g) (exact, not a small-angle result),
//     so a = g*tan(theta_lim/2) keeps one ramp inside theta_lim; it is then
//     refined by simulation (a is scaled by limit/peak until the simulated
//     peak is inside the limit at every rope length);
//   - whole-period ramps: in linear theory one ramp of duration t_a leaves a
//     residual swing of amplitude 2*(a/g)*|sin(pi*t_a/T)| rad, zero when
//     t_a is a whole number n of sway periods T; the acceleration is V/(nT)
//     (or D/(nT)^2 for a move too short to reach V);
//   - input-shaped moves: the drive-limits move convolved with a ZV, ZVD
//     or EI shaper (package shaper), for a variable-speed drive as a shaped
//     speed profile and for a step-speed pendant as the moments to press
//     and release each speed step.
//
// Slewing: the tangential acceleration of the hook is R*alpha and the
// outward lean at slew rate w is atan(R*w^2/g); the simulation counts both
// against the swing limit, and the peak-limited acceleration leaves room
// for the lean at the top rate.
//
// With a range of rope lengths the shapers and whole-period ramps are tuned
// to the middle of the range of sway frequencies, w_mid = (w(Lmin) +
// w(Lmax))/2, which keeps the worst residual at the two ends equal.
//
// With a hook block and rigging (load.hook) the load swings in two modes;
// the single-mode options are tuned to the slower one and two-mode shapers
// (two shapers convolved) are offered beside them: see twomode.go.
package plan

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"sort"
	"sync"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// RelTol is the integrator tolerance of the planner's simulations; the
// figures it verifies agree with the default accuracy to about 1e-4 deg.
const RelTol = 1e-6

// Result is a plan: options ranked, the recommended one, the curves.
type Result struct {
	Name string `json:"name"`
	Axis string `json:"axis"`
	// Move in the axis' unit: metres (travel) or degrees (slew).
	DistanceM      float64 `json:"distance_m,omitempty"`
	AngleDeg       float64 `json:"angle_deg,omitempty"`
	RadiusM        float64 `json:"radius_m,omitempty"`
	TopSpeedMPerS  float64 `json:"top_speed_m_per_s,omitempty"`
	TopRateDegPerS float64 `json:"top_rate_deg_per_s,omitempty"`
	// SlewLeanDeg is the outward lean atan(R*w^2/g) at the top slew rate.
	SlewLeanDeg float64 `json:"slew_lean_deg,omitempty"`

	RopeLengthM   float64   `json:"rope_length_m"`
	RopeLengthsM  []float64 `json:"rope_lengths_m"` // simulated: nominal, then range ends
	PeriodS       float64   `json:"period_s"`       // 2*pi*sqrt(L/g) at the nominal length (the slower mode with a hook block)
	DesignPeriodS float64   `json:"design_period_s"`
	// With a hook block: both mode periods at the nominal rope length,
	// the second mode's design period and its largest share of the load's
	// swing over the rope lengths (see twomode.go).
	ModePeriodsS        []float64 `json:"mode_periods_s,omitempty"`
	SecondDesignPeriodS float64   `json:"second_design_period_s,omitempty"`
	SecondModeShare     float64   `json:"second_mode_share,omitempty"`
	DesignRopeM         float64   `json:"design_rope_length_m"`
	Limits              Limits    `json:"limits"`
	Options             []Option  `json:"options"`
	Recommended         int       `json:"recommended"` // index in Options, -1 if none
	Reason              string    `json:"reason"`
	Infeasible          []string  `json:"infeasible"` // what to change, when nothing fits
	Notes               []string  `json:"notes"`
	Curves              Curves    `json:"curves"`
	Assumptions         []string  `json:"assumptions"`
	Cautions            []string  `json:"cautions"`
	Simulations         int       `json:"simulations"`
}

// Limits are the plan's limits; a zero means not given.
type Limits struct {
	PeakSwingDeg     float64 `json:"peak_swing_deg,omitempty"`
	PeakExcursionM   float64 `json:"peak_excursion_m,omitempty"`
	ResidualSwingDeg float64 `json:"residual_swing_deg"`
}

// Option is one way to drive the move, with its verified figures.
type Option struct {
	Rank   int    `json:"rank"` // 1 is best
	Key    string `json:"key"`
	Label  string `json:"label"`
	Drive  string `json:"drive"` // variable_speed or pendant
	Shaper string `json:"shaper,omitempty"`
	// TwoMode marks a shaper designed for both modes of hook block and
	// rigging; ModeResidualPct is a shaped option's linear-theory residual
	// vibration in each mode (% of the drive-limits move's), the worst
	// over the rope lengths, when there is a hook block.
	TwoMode         bool      `json:"two_mode,omitempty"`
	ModeResidualPct []float64 `json:"mode_residual_pct,omitempty"`

	// Settings in the axis' unit (one pair is set).
	AccelMPerS2    float64 `json:"accel_m_per_s2,omitempty"`
	AccelDegPerS2  float64 `json:"accel_deg_per_s2,omitempty"`
	TopSpeedMPerS  float64 `json:"top_speed_m_per_s,omitempty"`
	TopRateDegPerS float64 `json:"top_rate_deg_per_s,omitempty"`
	RampS          float64 `json:"ramp_s"` // time of one speed ramp at the setting

	MoveTimeS float64 `json:"move_time_s"`
	PenaltyS  float64 `json:"penalty_s"` // against the drive-limits move

	Verified              []Verified `json:"verified"`
	WorstPeakSwingDeg     float64    `json:"worst_peak_swing_deg"`
	WorstPeakExcursionM   float64    `json:"worst_peak_excursion_m"`
	WorstResidualSwingDeg float64    `json:"worst_residual_swing_deg"`
	Within                bool       `json:"within"`
	Outside               []string   `json:"outside"` // which limits it breaks

	// Crew settings.
	Settings     []string `json:"settings"`
	SpeedProfile []Knot   `json:"speed_profile,omitempty"` // variable-speed drive
	Presses      []Press  `json:"presses,omitempty"`       // step-speed pendant
	// Motion is the option as a scenario move, to save or evaluate.
	Motion scenario.Motion `json:"motion"`

	profile motion.Profile
	accelSI float64
	// rejected says why the option is not offered (its move is not one the
	// tool accepts); empty when it is.
	rejected string
}

// Verified is one simulation of an option.
type Verified struct {
	RopeLengthM      float64 `json:"rope_length_m"`
	PeakSwingDeg     float64 `json:"peak_swing_deg"`
	PeakExcursionM   float64 `json:"peak_excursion_m"`
	ResidualSwingDeg float64 `json:"residual_swing_deg"`
	TensionFactor    float64 `json:"tension_factor"`
	// PeakRiggingAngleDeg is the largest angle between rope and rigging,
	// with a hook block.
	PeakRiggingAngleDeg float64 `json:"peak_rigging_angle_deg,omitempty"`
	Warnings            int     `json:"warnings"`
}

// Knot is one corner of a piecewise linear speed profile (speed in the
// axis' unit per second: m/s or deg/s).
type Knot struct {
	TS    float64 `json:"t_s"`
	Speed float64 `json:"speed"`
}

// Press is one moment to press or release a pendant step.
type Press struct {
	AtS   float64 `json:"at_s"`
	Pct   float64 `json:"step_pct"` // speed after the press, % of top speed
	Speed float64 `json:"speed"`    // axis unit per second
}

// Curves are ready to plot.
type Curves struct {
	// AccelTime: residual swing after one ramp to top speed against the
	// ramp time, linear theory 2*(a/g)*|sin(pi*t_a/T)| with a = V/t_a,
	// for each simulated rope length.
	AccelTime AccelTimeCurve `json:"accel_time"`
	// RopeError: percentage residual vibration V(w, zeta) of each shaper
	// against the error of the rope length from the design length.
	RopeError RopeErrorCurve `json:"rope_error"`
}

// AccelTimeCurve is the residual against ramp time.
type AccelTimeCurve struct {
	RampS   []float64    `json:"ramp_s"`
	Periods []float64    `json:"periods"` // ramp time in design periods
	Series  []RampSeries `json:"series"`
	Basis   string       `json:"basis"`
}

// RampSeries is one rope length's curve.
type RampSeries struct {
	RopeLengthM float64   `json:"rope_length_m"`
	ResidualDeg []float64 `json:"residual_deg"`
}

// RopeErrorCurve is each shaper's residual against rope-length error.
type RopeErrorCurve struct {
	ErrorPct []float64      `json:"error_pct"` // (L - L_design)/L_design, %
	RangePct [2]float64     `json:"range_pct"` // the plan's range on this axis
	Series   []ShaperSeries `json:"series"`
	Basis    string         `json:"basis"`
}

// ShaperSeries is one shaper's curve.
type ShaperSeries struct {
	Shaper      string    `json:"shaper"`
	ResidualPct []float64 `json:"residual_pct"`
}

// Assumptions of the planner, beyond those of the simulation.
var Assumptions = []string{
	"Each option is simulated with the full nonlinear 3D model at the nominal rope length and at both ends of the range, each held constant through the move.",
	"Only the planned move is simulated; other motions in the scenario are left out. Wind and initial swing are included.",
	"Shapers and whole-period ramps are tuned to the middle of the range of sway frequencies; the small-swing period 2*pi*sqrt(L/g) is used.",
	"The drive follows the planned speed profile exactly: real drives lag, and a drive's ramp settings must be checked against these figures on site.",
	"The residual swing is the largest rope angle from the vertical in the two sway periods after the move ends.",
}

// Cautions go with every plan.
var Cautions = []string{
	"These settings are an estimate from a simplified model. The crane manufacturer's instructions, load charts and limits, the approved lift plan, local codes and the person in charge of the lift take precedence.",
	"Try a new setting first without a load or with a light test load, in a clear area.",
	"Nobody stands or works under a suspended load. Use tag lines where the plan calls for them.",
	"Stop when sway or wind exceeds the plan's limits. A qualified person approves the lift.",
}

// request is the plan in SI.
type request struct {
	s          *scenario.Scenario
	slew       bool
	dist       float64 // m or rad (signed)
	vmax, amax float64 // m/s or rad/s, m/s^2 or rad/s^2
	radius     float64 // m (slew)
	k          float64 // hook metres per axis unit: 1 or R
	ropes      []float64
	lim        Limits
	zeta, tol  float64
	drive      string
	designT    float64
	// With a hook block: the second mode's design period, its largest
	// share of the load's swing, the rigging length (m).
	designT2, share2, rig float64
	// budget is the work all the plan's runs draw on together.
	budget *sway.Budget
}

// Make plans the move of s.Plan. s must carry a plan block; it is
// validated first.
func Make(s *scenario.Scenario) (*Result, error) {
	return makeWith(s, sway.NewBudget(Work, budgetMessage))
}

// Work is the work budget of one plan, shared by all its runs (see
// sway.Budget): about 5 s of one core, 2.6 s on two. A 1500 m travel with
// a hook block over rope lengths 5 to 40 m needs about half of it; the
// example plans need 1 % or less.
const Work = 400_000_000

const budgetMessage = "This plan needs more computing than allowed: narrow the rope-length range (plan.rope_length_min_m to plan.rope_length_max_m) or shorten the move (plan.distance_m or plan.angle_deg)."

func makeWith(s *scenario.Scenario, budget *sway.Budget) (*Result, error) {
	if s.Plan == nil {
		return nil, scenario.Errors{{Field: "plan", Message: "is required: the scenario has no planning request; add a \"plan\" block (see testdata/scenarios/plan-bay-travel.json)"}}
	}
	if err := s.Validate(); err != nil {
		return nil, err
	}
	rq := newRequest(s)
	rq.budget = budget
	g := units.StandardGravity
	res := &Result{
		Name: s.Name, Axis: s.Plan.Axis, RopeLengthM: *s.Load.RopeLengthM, RopeLengthsM: rq.ropes,
		PeriodS: period(*s.Load.RopeLengthM), DesignPeriodS: rq.designT,
		DesignRopeM: rq.designRope(),
		Limits:      rq.lim, Recommended: -1, Assumptions: Assumptions, Cautions: Cautions,
		Infeasible: []string{}, Notes: []string{}, Options: []Option{},
	}
	if s.Load.Hook != nil {
		ms := rq.modesAt(*s.Load.RopeLengthM)
		res.ModePeriodsS = []float64{2 * math.Pi / ms.omega[0], 2 * math.Pi / ms.omega[1]}
		res.PeriodS = res.ModePeriodsS[0]
		res.SecondDesignPeriodS, res.SecondModeShare = rq.designT2, rq.share2
		res.Assumptions = append(append([]string{}, Assumptions...), twoModeAssumption)
		res.Notes = append(res.Notes, rq.modeNotes()...)
	}
	if rq.slew {
		res.AngleDeg = rq.dist / units.Degree
		res.RadiusM = rq.radius
		res.TopRateDegPerS = rq.vmax / units.Degree
		res.SlewLeanDeg = math.Atan(rq.radius*rq.vmax*rq.vmax/g) / units.Degree
	} else {
		res.DistanceM = rq.dist
		res.TopSpeedMPerS = rq.vmax
	}
	res.Curves = curves(rq)
	if msgs := rq.precheck(res); len(msgs) > 0 {
		res.Infeasible = msgs
		res.Reason = "No option is offered: " + msgs[0]
		return res, nil
	}
	base := motion.NewTrapezoid(0, rq.dist, rq.vmax, rq.amax, rq.amax)
	if base.Triangular() {
		res.Notes = append(res.Notes, fmt.Sprintf("The move is too short to reach the top speed of %s at the largest acceleration: the fastest move peaks at %s.",
			rq.speedText(rq.vmax), rq.speedText(base.PeakSpeed())))
	}

	if rq.zeta > 0 {
		res.Notes = append(res.Notes, fmt.Sprintf("ZV and ZVD are designed for the damping ratio %.3g; EI uses its undamped form.", rq.zeta))
	}
	var opts []*Option
	add := func(o *Option) { opts = append(opts, o) }
	fastest := rq.trapezoidOption("drive_limits", "Drive limits, no sway control", rq.amax, rq.vmax)
	add(fastest)
	var peak *Option
	if rq.drive != scenario.DrivePendant {
		for _, n := range rq.wholePeriods() {
			add(rq.wholePeriodOption(n))
		}
		for _, kind := range shaper.Kinds {
			o, err := rq.shapedDrive(kind)
			if err != nil {
				return nil, err
			}
			add(o)
		}
	}
	if s.Load.Hook != nil {
		two, err := rq.twoModeOptions()
		if err != nil {
			return nil, err
		}
		opts = append(opts, two...)
	}
	if own := s.Plan.PendantStepsPct; len(own) > 0 && rq.drive != scenario.DriveVariableSpeed {
		o, _, err := rq.ownPendant(own)
		if err != nil {
			return nil, err
		}
		add(o)
	} else if rq.drive != scenario.DriveVariableSpeed {
		for _, kind := range shaper.Kinds {
			o, err := rq.shapedPendant(kind)
			if err != nil {
				return nil, err
			}
			if o != nil {
				add(o)
			}
		}
	}
	// The peak search runs beside the verification of the other options.
	var peakSims int
	var peakErr error
	done := make(chan struct{})
	go func() {
		defer close(done)
		if rq.drive != scenario.DrivePendant {
			peak, peakSims, peakErr = rq.peakLimited()
		}
	}()
	err := rq.verifyAll(opts)
	<-done
	if err != nil {
		return nil, err
	}
	if peakErr != nil {
		return nil, peakErr
	}
	res.Simulations = len(opts)*len(rq.ropes) + peakSims
	if peak != nil {
		opts = append(opts, peak)
	}
	offered := opts[:0]
	for _, o := range opts {
		if o.rejected != "" {
			res.Notes = append(res.Notes, o.rejected)
			continue
		}
		offered = append(offered, o)
	}
	opts = offered
	res.Options = rank(opts, fastest.MoveTimeS)
	rq.recommend(res)
	return res, nil
}

func period(l float64) float64 { return 2 * math.Pi * math.Sqrt(l/units.StandardGravity) }

func newRequest(s *scenario.Scenario) *request {
	p := s.Plan
	rq := &request{s: s, zeta: p.DampingRatio, tol: p.EITolerancePct / 100, drive: p.Drive, k: 1}
	if p.Axis == scenario.Slew {
		rq.slew = true
		rq.dist = *p.AngleDeg * units.Degree
		rq.vmax = *p.TopRateDegPerS * units.Degree
		rq.amax = *p.MaxAccelDegPerS2 * units.Degree
		rq.radius = s.Crane.RadiusM
		rq.k = rq.radius
	} else {
		rq.dist, rq.vmax, rq.amax = *p.DistanceM, *p.TopSpeedMPerS, *p.MaxAccelMPerS2
	}
	l := *s.Load.RopeLengthM
	rq.ropes = []float64{l}
	lo, hi := l, l
	if p.RopeLengthMinM != nil {
		lo, hi = *p.RopeLengthMinM, *p.RopeLengthMaxM
		for _, x := range []float64{lo, hi} {
			if math.Abs(x-l) > 1e-9 {
				rq.ropes = append(rq.ropes, x)
			}
		}
	}
	w := (math.Sqrt(units.StandardGravity/lo) + math.Sqrt(units.StandardGravity/hi)) / 2
	rq.designT = 2 * math.Pi / w
	if s.Load.Hook != nil {
		rq.setModes(lo, hi)
	}
	if lm := s.Limits; lm != nil {
		if lm.PeakSwingDeg != nil {
			rq.lim.PeakSwingDeg = *lm.PeakSwingDeg
		}
		if lm.PeakExcursionM != nil {
			rq.lim.PeakExcursionM = *lm.PeakExcursionM
		}
		rq.lim.ResidualSwingDeg = *lm.ResidualSwingDeg
	}
	return rq
}

// maxRope is the longest rope simulated, to the load (rigging included).
func (rq *request) maxRope() float64 {
	m := 0.0
	for _, l := range rq.ropes {
		m = math.Max(m, l)
	}
	return m + rq.rig
}

// angleLimit is the swing angle allowed by the limits at the longest rope,
// radians (the excursion limit as asin(e/L)).
func (rq *request) angleLimit() float64 {
	th := math.Inf(1)
	if rq.lim.PeakSwingDeg > 0 {
		th = rq.lim.PeakSwingDeg * units.Degree
	}
	if e := rq.lim.PeakExcursionM; e > 0 {
		th = math.Min(th, math.Asin(math.Min(1, e/rq.maxRope())))
	}
	return th
}

// precheck finds requests no drive setting can meet.
func (rq *request) precheck(res *Result) []string {
	var msgs []string
	g := units.StandardGravity
	th := rq.angleLimit()
	if w := rq.s.Wind; w != nil {
		lean := rq.steadyLean(sway.WindForceN(rq.s))
		if lean >= th {
			msgs = append(msgs, fmt.Sprintf("The wind alone leans the rope %.3g deg, at or above the swing allowed by the limits (%.3g deg): no drive setting can keep the load inside them. Wait for less wind, or change the limits.",
				lean/units.Degree, th/units.Degree))
		}
		if w.DurationS == 0 && lean/units.Degree >= rq.lim.ResidualSwingDeg {
			msgs = append(msgs, fmt.Sprintf("The wind alone leans the rope %.3g deg, at or above the residual swing limit of %.3g deg: the load cannot come to rest inside it. Wait for less wind, or raise limits.residual_swing_deg.",
				lean/units.Degree, rq.lim.ResidualSwingDeg))
		}
	}
	if rq.slew {
		lean := math.Atan(rq.radius * rq.vmax * rq.vmax / g)
		if lean >= th {
			wmax := math.Sqrt(g * math.Tan(th) / rq.radius)
			msgs = append(msgs, fmt.Sprintf("At the top slew rate of %s the load leans out %.3g deg at %.4g m radius, at or above the swing allowed (%.3g deg). Lower plan.top_rate_deg_per_s below %s (better: to about %s), or slew at a smaller radius.",
				rq.speedText(rq.vmax), lean/units.Degree, rq.radius, th/units.Degree, rq.speedText(wmax), rq.speedText(wmax*0.7)))
		}
	}
	return msgs
}

// wholePeriods lists the first two whole numbers of design periods whose
// ramp needs no more than the largest acceleration.
func (rq *request) wholePeriods() []int {
	var ns []int
	for n := 1; n <= 20 && len(ns) < 2; n++ {
		a, _ := rq.wholePeriodAccel(n)
		if a <= rq.amax*(1+1e-12) {
			ns = append(ns, n)
		}
	}
	return ns
}

// wholePeriodAccel is the acceleration and top speed of a move whose ramps
// last n design periods: V/(nT), or D/(nT)^2 if the move cannot reach V.
func (rq *request) wholePeriodAccel(n int) (a, v float64) {
	ta := float64(n) * rq.designT
	d := math.Abs(rq.dist)
	if rq.vmax*ta <= d {
		return rq.vmax / ta, rq.vmax
	}
	return d / (ta * ta), d / ta
}

// verifyAll simulates every option at every rope length, in parallel.
func (rq *request) verifyAll(opts []*Option) error {
	type job struct{ o, l int }
	jobs := make(chan job)
	results := make([][]Verified, len(opts))
	for i := range results {
		results[i] = make([]Verified, len(rq.ropes))
	}
	var wg sync.WaitGroup
	var mu sync.Mutex
	var firstErr error
	workers := runtime.GOMAXPROCS(0)
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for j := range jobs {
				v, err := rq.simulate(&opts[j.o].Motion, rq.ropes[j.l])
				var es scenario.Errors
				if errors.As(err, &es) {
					// The option's own move is not one the tool accepts
					// (below what a drive does, or too long): not offered.
					mu.Lock()
					if opts[j.o].rejected == "" {
						opts[j.o].rejected = fmt.Sprintf("%s is not offered: its move is outside what the tool accepts (%v).", opts[j.o].Label, es[0])
					}
					mu.Unlock()
					continue
				}
				if err != nil {
					mu.Lock()
					switch {
					case firstErr != nil:
					case errors.Is(err, sway.ErrWorkLimit):
						firstErr = err // the plan's own message
					default:
						firstErr = fmt.Errorf("%s at rope length %g m: %w", opts[j.o].Label, rq.ropes[j.l], err)
					}
					mu.Unlock()
					continue
				}
				results[j.o][j.l] = v
			}
		}()
	}
	for o := range opts {
		if opts[o].rejected != "" {
			continue
		}
		for l := range rq.ropes {
			jobs <- job{o, l}
		}
	}
	close(jobs)
	wg.Wait()
	if firstErr != nil {
		return firstErr
	}
	for i, o := range opts {
		o.setVerified(results[i], rq.lim)
	}
	return nil
}

// simulate runs one move at one rope length.
func (rq *request) simulate(m *scenario.Motion, rope float64) (Verified, error) {
	sc := *rq.s
	sc.Plan = nil
	sc.Motions = []scenario.Motion{*m}
	sc.Load.RopeLengthM = &rope
	sc.Settings = &scenario.Settings{RelTol: RelTol, SettlePeriods: 2}
	r, err := sway.EvaluateWith(&sc, sway.Options{NoHistory: true, NoModePeriods: true, Budget: rq.budget})
	if errors.Is(err, sway.ErrStepLimit) {
		err = &sway.WorkError{Message: budgetMessage}
	}
	if err != nil {
		return Verified{}, err
	}
	v := Verified{RopeLengthM: rope, PeakSwingDeg: r.PeakSwingDeg, PeakExcursionM: r.PeakExcursionM,
		ResidualSwingDeg: r.ResidualSwingDeg, TensionFactor: r.TensionFactor, Warnings: len(r.Warnings)}
	if r.Rigging != nil {
		v.PeakRiggingAngleDeg = r.Rigging.PeakRiggingAngleDeg
	}
	return v, nil
}

func (o *Option) setVerified(vs []Verified, lim Limits) {
	o.Verified = vs
	o.WorstPeakSwingDeg, o.WorstPeakExcursionM, o.WorstResidualSwingDeg = 0, 0, 0
	for _, v := range vs {
		o.WorstPeakSwingDeg = math.Max(o.WorstPeakSwingDeg, v.PeakSwingDeg)
		o.WorstPeakExcursionM = math.Max(o.WorstPeakExcursionM, v.PeakExcursionM)
		o.WorstResidualSwingDeg = math.Max(o.WorstResidualSwingDeg, v.ResidualSwingDeg)
	}
	o.Outside = []string{}
	if lim.PeakSwingDeg > 0 && o.WorstPeakSwingDeg > lim.PeakSwingDeg {
		o.Outside = append(o.Outside, fmt.Sprintf("peak swing %.3g deg > %.3g deg", o.WorstPeakSwingDeg, lim.PeakSwingDeg))
	}
	if lim.PeakExcursionM > 0 && o.WorstPeakExcursionM > lim.PeakExcursionM {
		o.Outside = append(o.Outside, fmt.Sprintf("peak excursion %.3g m > %.3g m", o.WorstPeakExcursionM, lim.PeakExcursionM))
	}
	if o.WorstResidualSwingDeg > lim.ResidualSwingDeg {
		o.Outside = append(o.Outside, fmt.Sprintf("residual swing %.3g deg > %.3g deg", o.WorstResidualSwingDeg, lim.ResidualSwingDeg))
	}
	o.Within = len(o.Outside) == 0
}

// peakRatio is how far the option's worst peak is from the peak limits
// (1 = on the limit).
func (o *Option) peakRatio(lim Limits) float64 {
	r := 0.0
	if lim.PeakSwingDeg > 0 {
		r = math.Max(r, o.WorstPeakSwingDeg/lim.PeakSwingDeg)
	}
	if lim.PeakExcursionM > 0 {
		r = math.Max(r, o.WorstPeakExcursionM/lim.PeakExcursionM)
	}
	return r
}

// peakLimited finds the largest acceleration whose simulated peak is inside
// the peak limits at every rope length. The first guess is the largest
// acceleration, from g*tan(theta/2) (less the slew lean) down in steps of
// 2 %, whose linear-theory peak (linearPeak) is inside the limits; the
// simulation then corrects it (scaling by limit/peak). It returns nil when
// the answer is the drive's largest acceleration, which the drive-limits
// option already is.
func (rq *request) peakLimited() (*Option, int, error) {
	g := units.StandardGravity
	th := rq.angleLimit()
	if rq.slew {
		th -= math.Atan(rq.radius * rq.vmax * rq.vmax / g)
	}
	a0 := math.Min(rq.amax, g*math.Tan(th/2)/rq.k)
	a := a0
	for range 200 {
		if rq.linearRatio(a) <= 0.99 {
			break
		}
		a *= 0.98
	}
	var best *Option
	sims := 0
	for range 6 {
		o := rq.trapezoidOption("peak_limited", "Acceleration for the peak limit", a, rq.vmax)
		if err := rq.verifyAll([]*Option{o}); err != nil {
			return nil, sims, err
		}
		sims += len(rq.ropes)
		if o.rejected != "" {
			if best == nil {
				best = o // offered as not offered, with its reason
			}
			break
		}
		r := o.peakRatio(rq.lim)
		if r <= 1 {
			if best == nil || o.accel() > best.accel() {
				best = o
			}
			if r > 0.95 || a >= rq.amax {
				break
			}
		}
		// The peak grows about in proportion to the acceleration.
		next := math.Min(rq.amax, a*0.985/r)
		if best != nil && next <= best.accel()*1.01 {
			break
		}
		a = next
	}
	if best == nil || best.accel() >= rq.amax*(1-1e-9) {
		return nil, sims, nil
	}
	best.Settings = append(best.Settings, fmt.Sprintf("Found from g*tan(theta_lim/2) = %s (one sudden ramp), lowered until the linear theory of the whole move keeps inside the limits, then corrected by simulation at every rope length.",
		rq.accelText(a0)))
	return best, sims, nil
}

// accel is the option's acceleration setting in SI (m/s² or rad/s²).
func (o *Option) accel() float64 { return o.accelSI }

// rank sorts options: those within every limit first, fastest first;
// then the others, fastest first.
func rank(opts []*Option, fastest float64) []Option {
	sort.SliceStable(opts, func(i, j int) bool {
		a, b := opts[i], opts[j]
		if a.Within != b.Within {
			return a.Within
		}
		if math.Abs(a.MoveTimeS-b.MoveTimeS) > 1e-6 {
			return a.MoveTimeS < b.MoveTimeS
		}
		return a.WorstResidualSwingDeg < b.WorstResidualSwingDeg
	})
	out := make([]Option, len(opts))
	for i, o := range opts {
		o.Rank = i + 1
		o.PenaltyS = o.MoveTimeS - fastest
		out[i] = *o
	}
	return out
}

// recommend marks the recommended option and states why, or says what to
// change when no option keeps inside the limits.
func (rq *request) recommend(res *Result) {
	lengths := ""
	for i, l := range rq.ropes {
		if i > 0 {
			lengths += ", "
		}
		lengths += fmt.Sprintf("%.4g", l)
	}
	if len(res.Options) == 0 || !res.Options[0].Within {
		res.Infeasible = rq.whatToChange(res.Options)
		res.Reason = "No option keeps the load inside every limit at rope lengths " + lengths + " m."
		return
	}
	best := 0
	// An option almost as fast (within 5 %) that is less sensitive wins.
	// When the second mode of hook block and rigging matters, one designed
	// for both modes wins over one tuned to the first only: what the
	// latter leaves in the second mode depends on how the two periods fall
	// and changes with the rope length and the rigging.
	both := rq.twoMode()
	for i := 1; i < len(res.Options); i++ {
		o := res.Options[i]
		if !o.Within || o.MoveTimeS > res.Options[0].MoveTimeS*1.05 {
			break
		}
		b := res.Options[best]
		switch {
		case both && o.TwoMode && !b.TwoMode:
			best = i
		case both && !o.TwoMode && b.TwoMode:
		case o.WorstResidualSwingDeg < 0.5*b.WorstResidualSwingDeg:
			best = i
		}
	}
	res.Recommended = best
	o := res.Options[best]
	why := fmt.Sprintf("fastest option that keeps peak and residual swing inside the limits at every rope length simulated (%s m)", lengths)
	if best != 0 {
		why = fmt.Sprintf("within 5 %% of the fastest option's move time and less sensitive to the rope length; it keeps inside the limits at every rope length simulated (%s m)", lengths)
		if both && o.TwoMode && !res.Options[0].TwoMode {
			why = fmt.Sprintf("within 5 %% of the fastest option's move time and designed for both sway modes, where the faster one is tuned to the first only; it keeps inside the limits at every rope length simulated (%s m)", lengths)
		}
	}
	res.Reason = fmt.Sprintf("Recommended: %s — %s. Move time %.3g s, %.3g s longer than at the drive limits; worst residual swing %.2g deg (limit %.3g deg).",
		o.Label, why, o.MoveTimeS, o.PenaltyS, o.WorstResidualSwingDeg, rq.lim.ResidualSwingDeg)
	if rq.s.Load.Hook != nil {
		res.Reason += " " + rq.modeReason(&o)
	}
}

// whatToChange explains, from the options' failures, what would make the
// request feasible.
func (rq *request) whatToChange(opts []Option) []string {
	var msgs []string
	peakOK, resOK, resNominal := false, false, false
	for _, o := range opts {
		if o.peakRatio(rq.lim) <= 1 {
			peakOK = true
			if o.WorstResidualSwingDeg <= rq.lim.ResidualSwingDeg {
				resOK = true
			}
			if o.Verified[0].ResidualSwingDeg <= rq.lim.ResidualSwingDeg {
				resNominal = true
			}
		}
	}
	switch {
	case !peakOK:
		msgs = append(msgs, "No option keeps the peak swing inside the limit. Lower the top speed (a shaped move's peak grows with the speed), give more acceleration room, or raise limits.peak_swing_deg / limits.peak_excursion_m if the clearance allows.")
	case !resOK && resNominal && len(rq.ropes) > 1:
		msgs = append(msgs, "Options meet the residual limit at the nominal rope length but not at the ends of the range. Narrow the rope-length range (measure the rope to the load's centre of mass, or plan hoisting before or after the move), or raise limits.residual_swing_deg.")
	case !resOK:
		msgs = append(msgs, "No option that keeps the peak inside the limit also leaves the residual swing inside its limit. Lower the top speed, narrow the rope-length range, or raise limits.residual_swing_deg.")
	}
	if len(msgs) == 0 {
		msgs = append(msgs, "No single option meets every limit together; change the limits or the move.")
	}
	return msgs
}
