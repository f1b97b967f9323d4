package clearance

import (
	"errors"
	"fmt"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
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
	opt = opt.defaults()
	site, nominal, err := prepare(s)
	if err != nil {
		return nil, err
	}
	part, err := evaluatePart(s, site, nominal, 0, runs, variant, opt)
	if err != nil {
		return nil, err
	}
	return join(site, nominal, runs, seed, []Part{*part}, opt)
}

// assumptions state what the check takes for granted.
func assumptions(opt Options) []string {
	return []string{
		"The load is a ball of the stated size about its centre of mass; obstacles are upright shapes standing from the floor up to their top height.",
		fmt.Sprintf("Each run's path is taken as straight between the simulation's time samples and checked at points at most %.2f m apart; the clearance between them can be smaller by at most half that gap.", opt.StepM),
		"The runs spread as stated (each a normal scatter about the scenario's value, cut at three standard deviations); they say how the path spreads when the inputs do, not how likely any input is.",
		"The 95 % envelope holds the paths of the runs that stray least from the path with no spread, as many as it takes to be 95 % sure that it holds 95 % of all possible runs (a tolerance region; with few runs, all of them, and the confidence is stated).",
	}
}

// Check runs the clearance check the scenario's site block asks for: its
// spread's runs (scenario.DefaultSiteRuns when it gives none) drawn by
// package draws with its seed; with no spread, one run.
func Check(s *scenario.Scenario, opt Options) (*Report, error) {
	sp, err := SpecOf(s)
	if err != nil {
		return nil, err
	}
	return Evaluate(s, sp.Runs, sp.Seed, sp.Variant, opt)
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

// RunOf takes a run's path from an evaluation's time histories.
func RunOf(h *sway.History) Run {
	return Run{TimeS: h.TimeS, RelXM: h.RelXM, RelYM: h.RelYM, RelZM: h.RelZM,
		SuspensionXM: h.SuspensionXM, SuspensionYM: h.SuspensionYM}
}
