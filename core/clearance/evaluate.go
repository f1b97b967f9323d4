package clearance

import (
	"errors"
	"fmt"

	"swaysheet/core/draws"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/words"
)

// Report is the clearance check of a scenario's site block.
type Report struct {
	Runs      int              `json:"runs"`
	Seed      int              `json:"seed"`
	MarginM   float64          `json:"margin_m"`
	Obstacles []ObstacleReport `json:"obstacles"`
	// Clears is true when every obstacle keeps the margin in at least
	// Required of the runs; Words says so, or which do not.
	Clears bool     `json:"clears"`
	Words  []string `json:"words"`
	// WordSentences are Words with their quantities marked (core/words),
	// one for one, for the units shown.
	WordSentences []words.Sentence `json:"word_sentences"`
	// Envelope50 and Envelope95 are the areas, seen from above, that the
	// load stays inside in half and in 95 % of the runs. Envelope95 is the
	// exclusion zone, the area where nobody stands: it holds as many runs
	// as it takes to be ExclusionConfidence sure that it holds 95 % of all
	// possible runs (196 of 200; with fewer than 59 runs every run, and
	// the confidence it then has is stated).
	Envelope50 EnvelopeOut `json:"envelope_50"`
	Envelope95 EnvelopeOut `json:"envelope_95"`
	// Nominal is the load's path with every spread at zero.
	Nominal []Point2 `json:"nominal"`
	// Outline is how the load's extent is taken (OutlineBall or
	// OutlineBox); LoadRadiusM the ball's radius (zero for a box).
	Outline     string  `json:"outline"`
	LoadRadiusM float64 `json:"load_radius_m"`
	// Spread is the spreads the runs were drawn with (nil: one run, none).
	Spread *draws.Spread `json:"spread,omitempty"`
	// Section is the vertical section along the crane's path.
	Section Section `json:"section"`
	// Assumptions state what the check takes for granted.
	Assumptions []string `json:"assumptions"`
}

// EnvelopeOut is an envelope as drawn: row spans of covered cells.
type EnvelopeOut struct {
	Level      float64 `json:"level"`
	Inside     int     `json:"inside"`
	StrayM     float64 `json:"stray_m"`
	CellM      float64 `json:"cell_m"`
	AreaM2     float64 `json:"area_m2"`
	Confidence float64 `json:"confidence"`
	Spans      []Span  `json:"spans"`
}

// Variant gives run i of the check: a copy of the scenario with its
// spread drawn (package draws); nil for run i is the scenario itself.
type Variant func(i int) *scenario.Scenario

// Options tune the check; the zero value is the default.
type Options struct {
	// Workers evaluates the runs on this many goroutines (zero: one per
	// processor).
	Workers int
	// StepM is the largest gap between points checked along a path
	// (zero: 0.02 m); CellM the envelope's cell (zero: 0.1 m).
	StepM, CellM float64
	// Budget, given, is the work allowance every run draws on (see
	// sway.Budget); nil: each run has its own.
	Budget *sway.Budget
}

// ExclusionConfidence is how sure the exclusion zone must be that it
// holds Required of all possible runs (a 95 %/95 % tolerance region).
const ExclusionConfidence = 0.95

// ErrNoSite is returned for a scenario without a site block.
var ErrNoSite = errors.New("clearance: the scenario has no site block")

// Evaluate runs the scenario's site check: runs runs of the scenario
// (variant(i) for each), each checked against every obstacle, with the
// 50 % and 95 % envelopes. s must be valid.
func Evaluate(s *scenario.Scenario, runs int, seed int, variant Variant, opt Options) (*Report, error) {
	if s.Site == nil {
		return nil, ErrNoSite
	}
	if runs < 1 {
		return nil, errors.New("clearance: at least one run")
	}
	c, err := prepare(s, opt.defaults())
	if err != nil {
		return nil, err
	}
	part, err := c.part(s, 0, runs, variant)
	if err != nil {
		return nil, err
	}
	// The runs go through their block of bytes as a part's do.
	rs, err := c.decodePart(runs, *part)
	if err != nil {
		return nil, err
	}
	return c.joinRuns(seed, rs)
}

// assumptions state what the check takes for granted.
func assumptions(outline string, opt Options) []string {
	load := "The load is a ball of the stated size about its centre of mass"
	if outline == OutlineBox {
		load = "The load is its box, corners as simulated, taken against each obstacle as the upright prism that holds it (exact for a level load, on the safe side for a tilted one)"
	}
	return []string{
		load + "; obstacles are upright shapes standing from the floor up to their top height.",
		"The hoist rope (and the rigging below a hook block, a rigid load's sling or spreader legs) is a straight line of no thickness from the suspension point to the hook (a point load's rope ends at its ball): sag, sheaves and the rope's own diameter are left out, so keep the margin for them.",
		fmt.Sprintf("Each run's path is taken as straight between the simulation's time samples and checked at points at most %.2f m apart; the clearance between them can be smaller by at most half that gap.", opt.StepM),
		"The runs spread as stated (each a normal scatter about the scenario's value, cut at three standard deviations; an emergency stop at a moment drawn evenly over the move); they say how the path spreads when the inputs do, not how likely any input is.",
		"The 95 % envelope holds the paths of the runs that stray least from the path with no spread, as many as it takes to be 95 % sure that it holds 95 % of all possible runs (a tolerance region; with few runs, all of them, and the confidence is stated).",
	}
}

// CheckWork is the work budget of one clearance check, shared by all its
// runs (see sway.Budget): about 26 s of one core. The examples' 200 runs
// need 1e7 (a point load); a rigid load's run needs 0.24 to 1.7 million
// (the rigid examples, charged sway.WorkPerRigidEval an evaluation).
const CheckWork = 2_000_000_000

const checkBudgetMessage = "This clearance check needs more computing than allowed: use fewer runs (site.spread.runs), shorten the moves, or set a looser accuracy (settings.rel_tol)."

// Check runs the clearance check the scenario's site block asks for: its
// spread's runs (scenario.DefaultSiteRuns when it gives none) drawn by
// package draws with its seed; with no spread, one run. The runs share
// opt.Budget, or one of CheckWork.
func Check(s *scenario.Scenario, opt Options) (*Report, error) {
	sp, err := SpecOf(s)
	if err != nil {
		return nil, err
	}
	if opt.Budget == nil {
		opt.Budget = sway.NewBudget(CheckWork, checkBudgetMessage)
	}
	rep, err := Evaluate(s, sp.Runs, sp.Seed, sp.Variant, opt)
	if rep != nil {
		rep.Spread = sp.Spread
	}
	return rep, err
}

// SiteOf turns the scenario's site block into obstacles.
func SiteOf(st *scenario.Site) *Site {
	out := &Site{SuspensionHeightM: *st.SuspensionHeightM, MarginM: st.MarginM, LoadRadiusM: *st.LoadRadiusM}
	for _, o := range st.Obstacles {
		ob := Obstacle{Name: o.Name, TopM: *o.TopM}
		if b := o.Box; b != nil {
			ob.Outline = Rectangle(b.CentreXM, b.CentreYM, *b.LengthM, *b.WidthM, b.AngleDeg)
		}
		for _, c := range o.Corners {
			ob.Outline = append(ob.Outline, Point2{c.XM, c.YM})
		}
		out.Obstacles = append(out.Obstacles, ob)
	}
	return out
}
