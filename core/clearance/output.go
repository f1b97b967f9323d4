package clearance

// The JSON the clearance check adds beside Report's verdict and plan-view
// envelopes: the vertical section along the path, where each obstacle is
// passed, and the planner's use of the check (SitePlan). Every length is
// in metres up from the floor (heights) or along the crane's path
// (distances), every time in seconds from the scenario's t = 0.

import "swaysheet/core/words"

// Outline kinds: how the load's extent is taken.
const (
	// OutlineBall is a point load: a ball of site.load_radius_m about its
	// centre of mass.
	OutlineBall = "ball"
	// OutlineBox is a rigid load (load.body): its box, corners from the
	// simulated attitude at each moment.
	OutlineBox = "box corners"
)

// Section is the vertical section along the crane's path: the height of
// the load's lowest point against the distance along the path.
//
// The distance along the path of a point seen from above is the arc length
// of the nominal suspension point's track (the crane's path with every
// spread at zero) up to the point of that track nearest to it; beyond the
// track's ends it carries on straight along the end piece (a load that
// swings past the stop shows past the path's end, and a load that lags at
// the start shows before zero).
type Section struct {
	// PathLengthM is the length of the crane's path seen from above (the
	// suspension point's track with no spread: R*angle for a slew).
	PathLengthM float64 `json:"path_length_m"`
	// SuspensionHeightM is the rope's upper point (site.suspension_height_m).
	SuspensionHeightM float64 `json:"suspension_height_m"`
	// Nominal is the run with every spread at zero, sample by sample.
	Nominal []SectionPoint `json:"nominal"`
	// Envelope50 and Envelope95 are the bands the lowest point stays in
	// over the same runs as the plan-view envelopes of the same level.
	Envelope50 SectionBand `json:"envelope_50"`
	Envelope95 SectionBand `json:"envelope_95"`
	// Obstacles are the obstacles the path passes, with their tops.
	Obstacles []SectionObstacle `json:"obstacles"`
}

// SectionPoint is one moment of a run in the section.
type SectionPoint struct {
	TimeS     float64 `json:"time_s"`
	DistanceM float64 `json:"distance_m"`
	// LowM is the height of the load's lowest point: the ball's bottom,
	// or the lowest corner of a rigid load's box.
	LowM float64 `json:"low_m"`
	// HookM is the height of the rope's lower end (the hook, or the hook
	// block's centre with a hook block).
	HookM float64 `json:"hook_m"`
}

// SectionBand is the lowest point's band at one level: in each bin of
// distance, from DistanceM[i] to DistanceM[i] + BinM, the lowest and the
// highest height of the load's lowest point over the Inside runs. Bins no
// run reaches are left out (the arrays stay the same length).
type SectionBand struct {
	Level  float64   `json:"level"`
	Inside int       `json:"inside"`
	BinM   float64   `json:"bin_m"`
	DistM  []float64 `json:"distance_m"`
	LowM   []float64 `json:"low_m"`
	HighM  []float64 `json:"high_m"`
}

// SectionObstacle is where the path passes an obstacle: the distances
// along the path over which the obstacle's outline, seen from above, is
// within reach of the load in the 95 % runs (the load's half size, how far
// the 95 % runs stray from the nominal path and the margin, about the
// nominal centre's track), and its top.
type SectionObstacle struct {
	_     [0]func() // never compared: no equality code in the wasm
	Name  string    `json:"name"`
	FromM float64   `json:"from_m"`
	ToM   float64   `json:"to_m"`
	TopM  float64   `json:"top_m"`
}

// Vertical is the smallest height of the load's lowest point above an
// obstacle's top while the load, seen from above, overlaps the obstacle's
// outline (it passes over it); negative when it is below the top there
// (a strike).
type Vertical struct {
	// Runs is how many runs pass over the obstacle.
	Runs int `json:"runs"`
	// SmallestM over every run, at AtS and AtDistanceM; P5M the gap that
	// 95 % of the runs passing over keep (5th percentile, nearest rank).
	SmallestM   float64 `json:"smallest_m"`
	AtS         float64 `json:"at_s"`
	AtDistanceM float64 `json:"at_distance_m"`
	P5M         float64 `json:"p5_m"`
}

// SitePlan is the planner's options checked against the site: for a
// scenario with both a plan and a site block, each option's move (in the
// plan's order) run with the site's spreads, and the largest top speed
// whose 95 % envelope keeps the margin. It is the result of the bridge
// call `site_plan` (input: the scenario JSON; the option indices are those
// of the `plan` call's result for the same scenario) and of
// `swaysheet -site-plan [-json]`.
type SitePlan struct {
	// RunsPerCheck is the number of runs each check draws (the site's
	// spread runs, at most MaxPlanRuns); Seed their seed.
	RunsPerCheck int `json:"runs_per_check"`
	Seed         int `json:"seed"`
	// Options are the plan's options, in the plan's order. They are
	// checked fastest first until one clears, and the plan's recommended
	// option besides.
	Options []SiteOption `json:"options"`
	// Fastest is the index in the plan's options of the fastest one that
	// clears every obstacle with the margin in 95 % of runs, -1 if none
	// does (or none was checked).
	Fastest int `json:"fastest"`
	// TopSpeed is the largest top speed found that clears, for the plan's
	// drive-limits move (its acceleration kept); nil when not searched.
	TopSpeed *TopSpeed `json:"top_speed,omitempty"`
	// Words say the outcome; Messages what was left unchecked and what to
	// shorten (the work budget).
	Words    []string `json:"words"`
	Messages []string `json:"messages"`
	// WordSentences are Words with their quantities marked (core/words),
	// one for one.
	WordSentences []words.Sentence `json:"word_sentences"`
}

// SiteOption is one plan option's clearance check.
type SiteOption struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	// Index in the plan's options; Key and Label as there.
	Index     int     `json:"index"`
	Key       string  `json:"key"`
	Label     string  `json:"label"`
	MoveTimeS float64 `json:"move_time_s"`
	// Checked is false when the option was not checked: Skipped says
	// why (a faster option already clears, or the work budget ran out).
	Checked bool   `json:"checked"`
	Skipped string `json:"skipped,omitempty"`
	Clears  bool   `json:"clears"`
	// Worst names the obstacle kept clear in the fewest runs, with that
	// share and the load's smallest clearance; Strikes is how many runs
	// strike it (by the load or its rope, a run once) and FirstStrikeBy
	// and FirstStrikeLine what struck first (ObstacleReport's).
	Worst           string  `json:"worst,omitempty"`
	ShareKeepMargin float64 `json:"share_keep_margin"`
	SmallestM       float64 `json:"smallest_m"`
	Strikes         int     `json:"strikes,omitempty"`
	FirstStrikeBy   string  `json:"first_strike_by,omitempty"`
	FirstStrikeLine string  `json:"first_strike_line,omitempty"`
}

// TopSpeed is the search for the drive-limits move's largest top speed
// that keeps the margin, its acceleration kept (see topSpeed): a grid of
// top speeds from a tenth of the plan's to the plan's, then halvings
// between the slowest grid speed that fails and the one below it. Unit is
// "m/s" for travel and "deg/s" for a slew. Speed is the largest speed
// tested such that it and every slower speed tested keep the margin (0
// when not even a tenth does); Above the slowest speed tested that does
// not (0 when every speed tested does). Checks counts the checks made,
// each of RunsPerCheck runs with the same seed (the plan's own top speed
// reuses the option's check). Swing is not monotonic in the top speed, so
// no speed between those tested is promised.
type TopSpeed struct {
	Unit   string  `json:"unit"`
	Speed  float64 `json:"speed"`
	Above  float64 `json:"above"`
	Checks int     `json:"checks"`
	// Clears is false when even the slowest speed tried does not clear.
	Clears bool `json:"clears"`
	// Tested is every top speed checked, slowest first.
	Tested []SpeedTried `json:"tested"`
	// FasterClears are the grid speeds above Above that keep the margin
	// again (the swing's dependence on the ramp time); not advised.
	FasterClears []float64 `json:"faster_clears,omitempty"`
}

// SpeedTried is one top speed checked: whether its runs keep the margin
// from every obstacle, and the share of runs keeping it from the worst.
type SpeedTried struct {
	Speed           float64 `json:"speed"`
	Clears          bool    `json:"clears"`
	ShareKeepMargin float64 `json:"share_keep_margin"`
}

// MaxPlanRuns bounds the runs of each of the planner's clearance checks.
const MaxPlanRuns = 100
