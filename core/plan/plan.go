// Package plan turns a planning request (scenario.Plan) into drive
// settings a crew can use on the crane's own drive, each verified by the
// full nonlinear 3D simulation of package sway at the nominal rope length,
// both ends of the rope-length range and two lengths between them.
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
//     speed profile;
//   - a variable-speed drive's one ramp time (and S-curve rounding) for
//     the whole rope-length range (ramp.go);
//   - for a step-speed pendant, cues for the crane's own steps: counts in
//     half seconds and release marks, checked with a person's timing
//     (pendant.go, timing.go). The planner never invents steps.
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
	"fmt"
	"math"
	"sync"
	"sync/atomic"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// RelTol is the integrator tolerance of the planner's simulations of the
// options that can decide the recommendation; their figures agree with the
// SciPy reference to about 1e-4 deg (TestPlannerAgainstReference). The
// option recommended is simulated again at CheckRelTol, the default
// accuracy of package sway, at every checked rope length (or at once, when
// the screen guesses it will be: atCheckTol).
const (
	RelTol      = 1e-5
	CheckRelTol = sway.DefaultRelTol
)

// Assumptions of the planner, beyond those of the simulation.
var Assumptions = []string{
	"Each option is simulated with the full nonlinear 3D model at the nominal rope length, both ends of the range and two lengths between them, each held constant through the move.",
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
	axis       crane.Axis  // the planned axis (core/crane: its kind and geometry)
	start      crane.Start // where the crane stands at the start
	dist       float64     // m or rad (signed)
	vmax, amax float64     // m/s or rad/s, m/s^2 or rad/s^2
	radius     float64     // m: the hook radius (a slew's arc)
	k          float64     // hook metres per axis unit: 1 or R (crane.Axis.HookPerUnit)
	ropes      []float64   // nominal, then the range ends
	checked    []float64   // ropes, then two between the ends
	lim        Limits
	zeta, tol  float64
	drive      string
	// driveAssumed: plan.drive was empty and drive is what it was read as.
	driveAssumed bool
	designT      float64
	// With a hook block: the second mode's design period, its largest
	// share of the load's swing, the rigging length (m).
	designT2, share2, rig float64
	// With a rigid load (load.body): the load under a still suspension
	// point, the move's direction and the modes found at each rope length
	// (rigid.go).
	body     *sway.RigidLoad
	dir      r3.Vec
	bodyMu   sync.Mutex
	bodyMemo map[float64]modeSet
	// budget is the work all the plan's runs draw on together.
	budget *sway.Budget
	// rampFailed is the index of the grid rope length where the ramp
	// search's last setting failed its screening (rampOK).
	rampFailed int
	// sims counts the simulations run.
	sims atomic.Int64
}

// linearOK reports whether the linear theory of the pendulum can stand for
// the simulation: it leaves out wind and an initial swing.
func (rq *request) linearOK() bool { return rq.s.Wind == nil && rq.s.Initial == nil }

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

// MakeValidated is Make for a scenario that scenario.Parse returned
// unchanged: it was validated there and is not validated again (the
// page's plan call reads and validates its scenario once).
func MakeValidated(s *scenario.Scenario) (*Result, error) {
	if s.Plan == nil {
		return nil, noPlan()
	}
	return makeValid(s, sway.NewBudget(Work, budgetMessage))
}

func noPlan() error {
	return scenario.Errors{{Field: "plan", Message: "is required: the scenario has no planning request; add a \"plan\" block (see testdata/scenarios/plan-bay-travel.json)"}}
}

func makeWith(s *scenario.Scenario, budget *sway.Budget) (*Result, error) {
	if s.Plan == nil {
		return nil, noPlan()
	}
	if err := s.Validate(); err != nil {
		return nil, err
	}
	return makeValid(s, budget)
}

// makeValid plans the validated scenario s, which has a plan block.
func makeValid(s *scenario.Scenario, budget *sway.Budget) (*Result, error) {
	rq, err := newRequest(s)
	if err != nil {
		return nil, err
	}
	rq.budget = budget
	res := &Result{
		Name: s.Name, Axis: s.Plan.Axis, RopeLengthM: *s.Load.RopeLengthM, RopeLengthsM: rq.ropes,
		CheckedRopeLengthsM: rq.checked, Drive: rq.drive, DriveAssumed: rq.driveAssumed,
		PeriodS: period(*s.Load.RopeLengthM), DesignPeriodS: rq.designT,
		DesignRopeM: rq.designRope(),
		Limits:      rq.lim, Recommended: -1, Assumptions: Assumptions, Cautions: Cautions,
		Options: []Option{}, Dropped: []string{},
		InfeasibleSentences: []Sentence{}, NoteSentences: []Sentence{},
	}
	defer res.fillText()
	note := func(x Sentence) { res.NoteSentences = append(res.NoteSentences, x) }
	if rq.driveAssumed {
		note(plain("plan.drive is not given: planned for a variable-speed drive (for a pendant, set \"pendant\" and its steps)."))
	}
	if rq.multi() {
		ms := rq.modesAt(*s.Load.RopeLengthM)
		res.ModePeriodsS = []float64{2 * math.Pi / ms.omega[0], 2 * math.Pi / ms.omega[1]}
		res.PeriodS = res.ModePeriodsS[0]
		res.SecondDesignPeriodS, res.SecondModeShare = rq.designT2, rq.share2
		res.ModesOf = rq.modesOf()
		res.Assumptions = rq.assumptions()
		for _, n := range rq.modeNotes() {
			note(n)
		}
	}
	if rq.drive == scenario.DrivePendant {
		res.Assumptions = append(append([]string{}, res.Assumptions...), timingAssumption(rq.timing()))
	}
	*crane.Pick(rq.axis.Kind, &res.DistanceM, &res.AngleDeg) = rq.inAxis(rq.dist)
	*crane.Pick(rq.axis.Kind, &res.TopSpeedMPerS, &res.TopRateDegPerS) = rq.inAxis(rq.vmax)
	if rq.leans() {
		res.RadiusM = rq.radius
		res.SlewLeanDeg = rq.lean(rq.vmax) / units.Degree
	}
	res.Curves = curves(rq)
	if msgs := rq.precheck(); len(msgs) > 0 {
		res.InfeasibleSentences = msgs
		res.ReasonSentence = msgs[0]
		res.ReasonSentence.Text = "No option is offered: " + msgs[0].Text
		return res, nil
	}
	base := motion.NewTrapezoid(0, rq.dist, rq.vmax, rq.amax, rq.amax)
	if base.Triangular() {
		note(say("The move is too short to reach the top speed of {0} at the largest acceleration: the fastest move peaks at {1}.",
			rq.speedQ(rq.vmax), rq.speedQ(base.PeakSpeed())))
	}
	if rq.zeta > 0 {
		note(plain(fmt.Sprintf("ZV and ZVD are designed for the damping ratio %.3g; EI uses its undamped form.", rq.zeta)))
	}
	var cands []candidate
	add := func(o *Option) { cands = append(cands, rq.fixed(o)) }
	fastest := rq.trapezoidOption("drive_limits", "Drive limits, no sway control", rq.amax, rq.vmax)
	fastest.Drive = rq.drive
	add(fastest)
	var searchNotes []Sentence
	if rq.drive == scenario.DriveVariableSpeed {
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
		if rq.multi() {
			two, err := rq.twoModeOptions()
			if err != nil {
				return nil, err
			}
			for _, o := range two {
				add(o)
			}
		}
		// The drive's single settings: found by linear theory, then
		// simulated (and the next setting tried) if they can decide.
		var rc []candidate
		rc, searchNotes = rq.rampCandidates()
		cands = append(cands, rc...)
		if c := rq.peakCandidate(); c != nil {
			cands = append(cands, *c)
		}
	} else {
		// Steps that cannot be laid out for this move (far too short for
		// them) leave the option out, named, rather than the whole plan.
		if o, err := rq.ownPendant(s.Plan.PendantStepsPct); err != nil {
			d := "Your pendant steps: left out, the move is too short for these steps and counts (" + err.Error() + ")."
			res.Dropped = append(res.Dropped, d)
			note(plain(d))
		} else {
			add(o)
		}
	}
	kept, dropped := rq.screen(cands)
	if rq.budget.Left() < 0 {
		return nil, &sway.WorkError{Message: budgetMessage}
	}
	res.Dropped = append(res.Dropped, dropped...)
	for _, d := range dropped {
		note(plain(d))
	}
	for _, n := range searchNotes {
		note(n)
	}
	// The option to recommend is simulated again at the check tolerance at
	// every checked rope length; should that put it outside, the next is.
	for {
		rank(kept, fastest.MoveTimeS)
		best := rq.choose(kept)
		if best < 0 || kept[best].rechecked {
			break
		}
		if rq.recheck(kept[best]); !kept[best].Within {
			kept = rq.unscreen(kept)
		}
	}
	for _, o := range kept {
		if o.NotSimulated != "" {
			finishScreened(o)
			rq.estimatedSentences(o)
		} else {
			rq.checkedSentences(o)
		}
	}
	res.Simulations = int(rq.sims.Load())
	rq.recommend(res, kept)
	return res, nil
}

// fillText writes the plain SI text of every sentence into the plan's
// string fields.
func (res *Result) fillText() {
	res.Reason = res.ReasonSentence.String()
	res.Infeasible = texts(res.InfeasibleSentences)
	res.Notes = texts(res.NoteSentences)
	for i := range res.Options {
		o := &res.Options[i]
		o.Settings, o.Findings = texts(o.Sentences), texts(o.FindingSentences)
	}
}

func period(l float64) float64 { return 2 * math.Pi * math.Sqrt(l/units.StandardGravity) }

func newRequest(s *scenario.Scenario) (*request, error) {
	p := s.Plan
	rq := &request{s: s, zeta: p.DampingRatio, tol: p.EITolerancePct / 100, drive: p.Drive, k: 1}
	if rq.drive == "" {
		// Files written before the drive was required: a pendant when its
		// steps are given, else a variable-speed drive (never invented steps).
		rq.drive, rq.driveAssumed = scenario.DriveVariableSpeed, true
		if len(p.PendantStepsPct) > 0 {
			rq.drive = scenario.DrivePendant
		}
	}
	// Validated: the axis is plannable and its three fields are given.
	ax, dist, v, a, _ := p.Move()
	rq.axis, rq.start = ax, s.Crane.Start()
	u := ax.Kind.ToSI
	rq.dist, rq.vmax, rq.amax = *dist*u, *v*u, *a*u
	rq.radius, rq.k = rq.start.RadiusM, ax.HookPerUnit(rq.start)
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
	rq.checked = append([]float64{}, rq.ropes...)
	if hi > lo {
		// Two more between the ends, a quarter of the range from each.
		rq.checked = append(rq.checked, lo+(hi-lo)/4, hi-(hi-lo)/4)
	}
	w := (math.Sqrt(units.StandardGravity/lo) + math.Sqrt(units.StandardGravity/hi)) / 2
	rq.designT = 2 * math.Pi / w
	if s.Load.Body != nil {
		if err := rq.setBody(); err != nil {
			return nil, err
		}
	}
	if rq.multi() {
		rq.setModes(lo, hi)
	}
	if lm := s.Limits; lm != nil {
		if lm.PeakSwingDeg != nil {
			rq.lim.PeakSwingDeg = *lm.PeakSwingDeg
		}
		if lm.PeakExcursionM != nil {
			rq.lim.PeakExcursionM = *lm.PeakExcursionM
		}
		if lm.ResidualSwingDeg != nil {
			rq.lim.ResidualSwingDeg = *lm.ResidualSwingDeg
		}
		if lm.ResidualExcursionM != nil {
			rq.lim.ResidualExcursionM = *lm.ResidualExcursionM
		}
	}
	return rq, nil
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
func (rq *request) precheck() []Sentence {
	var msgs []Sentence
	g := units.StandardGravity
	th := rq.angleLimit()
	if w := rq.s.Wind; w != nil {
		lean := rq.steadyLean(sway.WindForceN(rq.s))
		if lean >= th {
			msgs = append(msgs, say("The wind alone leans the rope {0}, at or above the swing allowed by the limits ({1}): no drive setting can keep the load inside them. Wait for less wind, or change the limits.",
				qAngle(lean/units.Degree).digits(3), qAngle(th/units.Degree).digits(3)))
		}
		lo, _ := rq.ropeRange()
		if res := rq.resLimitRad(lo); w.DurationS == 0 && lean >= res {
			msgs = append(msgs, say("The wind alone leans the rope {0}, at or above the residual swing allowed ({1}): the load cannot come to rest inside it. Wait for less wind, or raise limits.residual_swing_deg / limits.residual_excursion_m.",
				qAngle(lean/units.Degree).digits(3), qAngle(res/units.Degree).digits(3)))
		}
	}
	if rq.leans() {
		lean := rq.lean(rq.vmax)
		if lean >= th {
			wmax := math.Sqrt(g * math.Tan(th) / rq.radius)
			msgs = append(msgs, say("At the top slew rate of {0} the load leans out {1} at {2} radius, at or above the swing allowed ({3}). Lower plan.top_rate_deg_per_s below {4} (better: to about {5}), or slew at a smaller radius.",
				rq.speedQ(rq.vmax), qAngle(lean/units.Degree).digits(3), qLen(rq.radius).digits(4), qAngle(th/units.Degree).digits(3), rq.speedQ(wmax), rq.speedQ(wmax*0.7)))
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

// peakRatio is how far the option's worst peak is from the peak limits
// (1 = on the limit).
func (o *Option) peakRatio(lim Limits) float64 {
	return ratio(o.WorstPeakSwingDeg, lim.PeakSwingDeg, o.WorstPeakExcursionM, lim.PeakExcursionM)
}

// accel is the option's acceleration setting in SI (m/s² or rad/s²).
func (o *Option) accel() float64 { return o.accelSI }
