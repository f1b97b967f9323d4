package plan

import (
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
)

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
	PeriodS       float64   `json:"period_s"`       // 2*pi*sqrt(L/g) at the nominal length (the first mode with a hook block or a rigid load)
	DesignPeriodS float64   `json:"design_period_s"`
	// With a hook block: both mode periods at the nominal rope length,
	// the second mode's design period and its largest share of the load's
	// swing over the rope lengths (see twomode.go).
	ModePeriodsS        []float64 `json:"mode_periods_s,omitempty"`
	SecondDesignPeriodS float64   `json:"second_design_period_s,omitempty"`
	SecondModeShare     float64   `json:"second_mode_share,omitempty"`
	// ModesOf says whose modes they are: "of hook block and rigging" or
	// "of the rigid load".
	ModesOf     string  `json:"modes_of,omitempty"`
	DesignRopeM float64 `json:"design_rope_length_m"`
	Limits      Limits  `json:"limits"`
	// CheckedRopeLengthsM are all the rope lengths each option is
	// simulated at: those of RopeLengthsM, then two between the ends.
	CheckedRopeLengthsM []float64 `json:"checked_rope_lengths_m"`
	// Drive is the crane's drive planned for (plan.drive, or what an empty
	// plan.drive was read as: DriveAssumed is then set).
	Drive        string   `json:"drive"`
	DriveAssumed bool     `json:"drive_assumed,omitempty"`
	Options      []Option `json:"options"`
	Recommended  int      `json:"recommended"` // index in Options (0 when one is recommended), -1 if none
	Reason       string   `json:"reason"`
	Infeasible   []string `json:"infeasible"` // what to change, when nothing fits
	Notes        []string `json:"notes"`
	// The same sentences with their quantities marked (see Sentence):
	// Reason, Infeasible and Notes are their plain SI text.
	ReasonSentence      Sentence   `json:"reason_sentence"`
	InfeasibleSentences []Sentence `json:"infeasible_sentences"`
	NoteSentences       []Sentence `json:"note_sentences"`
	// Dropped lists the options left out because they could not be
	// verified (the simulation's work or step limit), with why.
	Dropped     []string `json:"dropped"`
	Curves      Curves   `json:"curves"`
	Assumptions []string `json:"assumptions"`
	Cautions    []string `json:"cautions"`
	Simulations int      `json:"simulations"`
}

// Limits are the plan's limits; a zero means not given.
type Limits struct {
	PeakSwingDeg       float64 `json:"peak_swing_deg,omitempty"`
	PeakExcursionM     float64 `json:"peak_excursion_m,omitempty"`
	ResidualSwingDeg   float64 `json:"residual_swing_deg,omitempty"`
	ResidualExcursionM float64 `json:"residual_excursion_m,omitempty"`
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

	// Verified holds the figures at each checked rope length. For a
	// pendant option they are the 90th percentiles over the drawn press
	// times (Timing), each with its exact-timing figures in Exact.
	Verified              []Verified `json:"verified"`
	WorstPeakSwingDeg     float64    `json:"worst_peak_swing_deg"`
	WorstPeakExcursionM   float64    `json:"worst_peak_excursion_m"`
	WorstResidualSwingDeg float64    `json:"worst_residual_swing_deg"`
	WorstResidualExcM     float64    `json:"worst_residual_excursion_m"`
	// The rope lengths at which the worst peak swing and the worst
	// residual swing occur.
	WorstPeakRopeM     float64  `json:"worst_peak_rope_length_m"`
	WorstResidualRopeM float64  `json:"worst_residual_rope_length_m"`
	Within             bool     `json:"within"`
	Outside            []string `json:"outside"` // which limits it breaks
	// OutsideSentences are Outside with the quantities marked (one for
	// one).
	OutsideSentences []Sentence `json:"outside_sentences"`
	// Basis says what the figures are: "exact timing" (the drive times
	// the move) or "90th percentile of a person's timing".
	Basis string `json:"basis"`
	// Timing is the model of a person's timing a pendant option was
	// checked with.
	Timing *Timing `json:"timing,omitempty"`
	// RampTimeS and SCurveRoundingS are a variable-speed drive's single
	// settings (time from 0 to full speed; S-curve rounding) for the
	// options that are one setting of the drive.
	RampTimeS       float64 `json:"ramp_time_s,omitempty"`
	SCurveRoundingS float64 `json:"s_curve_rounding_s,omitempty"`

	// Crew settings: Settings is the plain SI text of Sentences.
	Settings  []string   `json:"settings"`
	Sentences []Sentence `json:"sentences"`
	// What the simulation found, in words that match the figures (the
	// worst over the checked rope lengths and where; for a pendant, the
	// percentile of a person's timing and the exact-timing figure):
	// Findings is the plain SI text of FindingSentences.
	Findings         []string   `json:"findings"`
	FindingSentences []Sentence `json:"finding_sentences"`
	SpeedProfile     []Knot     `json:"speed_profile,omitempty"` // variable-speed drive
	Presses          []Press    `json:"presses,omitempty"`       // step-speed pendant
	// NotSimulated says why a screened option was not simulated (screen.go);
	// its figures are then linear-theory estimates, in Estimated, and
	// Verified is empty. Empty for a simulated option.
	NotSimulated string     `json:"not_simulated,omitempty"`
	Estimated    []Estimate `json:"estimated,omitempty"`
	// Motion is the option as a scenario move, to save or evaluate.
	Motion scenario.Motion `json:"motion"`

	profile motion.Profile
	accelSI float64
	draws   []scenario.Motion // the move as pressed, one per drawn timing
	// drawProfiles are the draws' speed profiles (linear estimates), and
	// drawPieces their pieces (linearPieces), made once for every rope
	// length (verifyWith).
	drawProfiles []motion.Profile
	drawPieces   [][]linearPiece
	checked      func(*Option) // adds sentences once the figures are known
	// estimated: the linear-theory figures; rechecked: simulated at the
	// check tolerance (CheckRelTol).
	estimated []Verified
	rechecked bool
	verify    func() (*Option, []string) // a screened option's simulation
}

// Estimate is an option's linear-theory figures at one rope length, for an
// option that was not simulated (screen.go).
type Estimate struct {
	RopeLengthM        float64 `json:"rope_length_m"`
	PeakSwingDeg       float64 `json:"peak_swing_deg"`
	PeakExcursionM     float64 `json:"peak_excursion_m"`
	ResidualSwingDeg   float64 `json:"residual_swing_deg"`
	ResidualExcursionM float64 `json:"residual_excursion_m"`
}

// add appends a sentence to the option's settings.
//
//go:noinline
func (o *Option) add(s Sentence) { o.Sentences = append(o.Sentences, s) }

// found appends a sentence to the option's findings.
//
//go:noinline
func (o *Option) found(s Sentence) { o.FindingSentences = append(o.FindingSentences, s) }

// Verified is one simulation of an option.
type Verified struct {
	_                [0]func() // never compared: no equality code in the wasm
	RopeLengthM      float64   `json:"rope_length_m"`
	PeakSwingDeg     float64   `json:"peak_swing_deg"`
	PeakExcursionM   float64   `json:"peak_excursion_m"`
	ResidualSwingDeg float64   `json:"residual_swing_deg"`
	TensionFactor    float64   `json:"tension_factor"`
	// PeakRiggingAngleDeg is the largest angle between rope and rigging,
	// with a hook block.
	PeakRiggingAngleDeg float64 `json:"peak_rigging_angle_deg,omitempty"`
	ResidualExcursionM  float64 `json:"residual_excursion_m"`
	Warnings            int     `json:"warnings"`
	// Draws is the number of drawn timings a pendant option's percentiles
	// are over at this rope length (fewer than Timing.Draws when the
	// answer was decided early: see verify.go; all of them when the draws
	// that can be the percentile were found by linear theory: draws.go).
	Draws int `json:"draws,omitempty"`
	// Exact holds a pendant option's figures with the presses exactly at
	// their cues (the Verified figures are then 90th percentiles).
	Exact *Verified `json:"exact,omitempty"`
	// simulated is how many of the Draws were simulated (draws.go).
	simulated int
}

// Knot is one corner of a piecewise linear speed profile (speed in the
// axis' unit per second: m/s or deg/s).
type Knot struct {
	TS    float64 `json:"t_s"`
	Speed float64 `json:"speed"`
}

// Press is one moment to press or release a pendant step.
type Press struct {
	AtS   float64 `json:"at_s"`     // planned moment, s from the first press
	Pct   float64 `json:"step_pct"` // speed after the press, % of top speed
	Speed float64 `json:"speed"`    // axis unit per second
	// CountS is the cue: seconds to count from the previous press (a
	// multiple of CueStepS; 0 for the first press and the release at the
	// mark).
	CountS  float64 `json:"count_s"`
	Release bool    `json:"release,omitempty"`
	// ByMark marks the release made at a mark rather than on a count; every
	// release carries its mark, the distance (travel) or slew angle
	// (slew) before the stop point.
	ByMark        bool    `json:"by_mark,omitempty"`
	BeforeStopM   float64 `json:"before_stop_m,omitempty"`
	BeforeStopDeg float64 `json:"before_stop_deg,omitempty"`
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
