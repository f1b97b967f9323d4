package figures

import (
	"swaysheet/core/clearance"
	"swaysheet/core/units"
)

// ClearanceFigure is one figure of an obstacle in the clearance check
// (clearance.ObstacleReport), presented like a result's figures.
type ClearanceFigure struct {
	// Key is its JSON path in the obstacle's report ("vertical.smallest_m").
	Key                       string
	Crew, Technical, Unit, Qu string
	Value                     func(o *clearance.ObstacleReport) (float64, bool)
	// Detail: a figure for engineers (Row.Detail).
	Detail bool
}

// ObstacleTable is every figure of an obstacle, in the order a crew reads
// them: does the lift keep the margin from it (load and rope), does
// anything strike it and when first, how close the load comes, how close
// the rope comes and how high up, the room under the load passing over
// it; then the engineers' figures.
var ObstacleTable = []ClearanceFigure{
	{Key: "share_keep_margin", Crew: "runs that keep the margin (load and rope)", Technical: "share of the runs in which the load and its rope keep the margin and strike nothing", Qu: "share",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.ShareKeepMargin, true }},
	{Key: "share_strike", Crew: "runs where it is struck (load or rope)", Technical: "share of the runs in which the load or its rope (hoist rope, rigging, sling or spreader legs, hook ropes) touches or passes into it, a run counted once", Qu: "share",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.ShareStrike, true }},
	{Key: "share_keep_margin_low", Crew: "of all runs, at least (95 % sure)", Technical: "lower 95 % confidence bound of that share (Clopper-Pearson)", Qu: "share", Detail: true,
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.ShareKeepMarginLow, true }},
	{Key: "first_strike_s", Crew: "first struck at", Technical: "earliest moment of a strike by the load or its rope over the runs (first_strike_by and first_strike_line say which; the verdict names it)", Unit: "s",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.FirstStrikeS, o.Strikes > 0 }},
	{Key: "first_strike_at_distance_m", Crew: "first struck where, along the path", Technical: "distance along the crane's path of the earliest strike (the load's centre, or the rope's point in it)", Unit: "m",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.FirstStrikeAtDistanceM, o.Strikes > 0 }},
	{Key: "rope.first_strike_s", Crew: "rope first passes through it at", Technical: "earliest moment the hoist rope (or rigging, a sling or spreader leg, a hook rope) passes through it over the runs", Unit: "s",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.FirstStrikeS, r.Strikes > 0 })},
	{Key: "rope.first_strike_at_distance_m", Crew: "rope first passes through it where, along the path", Technical: "distance along the crane's path of that point of the rope", Unit: "m",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.FirstStrikeAtDistanceM, r.Strikes > 0 })},
	{Key: "rope.first_strike_at_height_m", Crew: "rope first passes through it how high up", Technical: "height above the floor of that point of the rope", Unit: "m",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.FirstStrikeAtHeightM, r.Strikes > 0 })},
	{Key: "clearance_p5_m", Crew: "room the load keeps in 95 of 100 runs", Technical: "load's clearance kept by 95 % of the runs (5th percentile of each run's smallest)", Unit: "m",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.ClearanceP5M, true }},
	{Key: "smallest_m", Crew: "closest the load comes", Technical: "load's smallest clearance over every run (negative: it strikes)", Unit: "m",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.SmallestM, true }},
	{Key: "smallest_at_distance_m", Crew: "closest where, along the path", Technical: "distance along the crane's path of the load's smallest clearance", Unit: "m",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.SmallestAtDistanceM, true }},
	{Key: "smallest_at_s", Crew: "closest at", Technical: "time of the load's smallest clearance", Unit: "s",
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.SmallestAtS, true }},
	{Key: "rope.clearance_p5_m", Crew: "room the rope keeps in 95 of 100 runs", Technical: "clearance of the hoist rope (rigging, sling or spreader legs, hook ropes) kept by 95 % of the runs", Unit: "m",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.ClearanceP5M, true })},
	{Key: "rope.smallest_m", Crew: "closest the rope comes", Technical: "smallest clearance of the hoist rope (rigging, sling or spreader legs, hook ropes) over every run (negative: it passes through)", Unit: "m",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.SmallestM, true })},
	{Key: "rope.smallest_at_height_m", Crew: "rope closest how high up", Technical: "height above the floor of the rope's nearest point", Unit: "m",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.SmallestAtHeightM, true })},
	{Key: "rope.smallest_at_distance_m", Crew: "rope closest where, along the path", Technical: "distance along the crane's path of the rope's nearest point", Unit: "m",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.SmallestAtDistanceM, true })},
	{Key: "rope.smallest_at_s", Crew: "rope closest at", Technical: "time of the rope's smallest clearance", Unit: "s",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.SmallestAtS, true })},
	{Key: "rope.share_keep_margin", Crew: "runs where the rope keeps the margin", Technical: "share of the runs in which the rope alone keeps the margin and passes through nothing", Qu: "share",
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.ShareKeepMargin, true })},
	{Key: "vertical.smallest_m", Crew: "least room under the load over it", Technical: "smallest height of the load's lowest point above its top while over it", Unit: "m",
		Value: func(o *clearance.ObstacleReport) (float64, bool) {
			return vertical(o, func(v *clearance.Vertical) float64 { return v.SmallestM })
		}},
	{Key: "vertical.at_distance_m", Crew: "least room under the load where", Technical: "distance along the crane's path of that", Unit: "m",
		Value: func(o *clearance.ObstacleReport) (float64, bool) {
			return vertical(o, func(v *clearance.Vertical) float64 { return v.AtDistanceM })
		}},
	{Key: "error_bound_m", Crew: "load checked to within", Technical: "what the load's points checked can miss between samples", Unit: "m", Detail: true,
		Value: func(o *clearance.ObstacleReport) (float64, bool) { return o.ErrorBoundM, true }},
	{Key: "rope.error_bound_m", Crew: "rope checked to within", Technical: "what the rope's moments checked can miss between samples", Unit: "m", Detail: true,
		Value: rope(func(r *clearance.RopeReport) (float64, bool) { return r.ErrorBoundM, true })},
}

// rope reads a figure of the obstacle's rope report, when there is one.
func rope(f func(*clearance.RopeReport) (float64, bool)) func(*clearance.ObstacleReport) (float64, bool) {
	return func(o *clearance.ObstacleReport) (float64, bool) {
		if o.Rope == nil {
			return 0, false
		}
		return f(o.Rope)
	}
}

func vertical(o *clearance.ObstacleReport, f func(*clearance.Vertical) float64) (float64, bool) {
	if o.Vertical == nil {
		return 0, false
	}
	return f(o.Vertical), true
}

// SiteFigure is one figure of the clearance check as a whole.
type SiteFigure struct {
	Key                       string // JSON path in clearance.Report
	Crew, Technical, Unit, Qu string
	Value                     func(r *clearance.Report) (float64, bool)
}

// SiteTable is the check's own figures and the spreads its runs were
// drawn with.
var SiteTable = []SiteFigure{
	{"margin_m", "margin to keep", "clearance the lift plan asks to keep from every obstacle", "m", "",
		func(r *clearance.Report) (float64, bool) { return r.MarginM, true }},
	{"envelope_95.area_m2", "keep-out area (95 % of runs)", "area of the 95 % envelope, the exclusion zone", "m²", "",
		func(r *clearance.Report) (float64, bool) { return r.Envelope95.AreaM2, true }},
	{"envelope_95.stray_m", "strays from the planned path by up to", "largest stray of the runs inside the 95 % envelope", "m", "",
		func(r *clearance.Report) (float64, bool) { return r.Envelope95.StrayM, true }},
	{"envelope_95.confidence", "sure that it holds 95 % of all runs", "confidence of the 95 % envelope's coverage (binomial, with the runs drawn)", "", "share",
		func(r *clearance.Report) (float64, bool) { return r.Envelope95.Confidence, true }},
	{"envelope_50.area_m2", "area the load stays in half the runs", "area of the 50 % envelope", "m²", "",
		func(r *clearance.Report) (float64, bool) { return r.Envelope50.AreaM2, true }},
	{"spread.rope_length_m", "rope length spread", "standard deviation of the rope length", "m", "",
		spread(func(s *clearance.Report) float64 { return s.Spread.RopeLengthM })},
	{"spread.centre_depth_m", "centre of mass depth spread", "standard deviation of the centre of mass depth", "m", "",
		spread(func(s *clearance.Report) float64 { return s.Spread.CentreDepthM })},
	{"spread.press_s", "press timing spread", "standard deviation of each press time", "s", "",
		spread(func(s *clearance.Report) float64 { return s.Spread.PressS })},
	{"spread.gust_pct", "gust strength spread", "standard deviation of the wind force", "", "share",
		spread(func(s *clearance.Report) float64 { return s.Spread.GustPct / 100 })},
	{"spread.gust_s", "gust timing spread", "standard deviation of when the wind sets in", "s", "",
		spread(func(s *clearance.Report) float64 { return s.Spread.GustS })},
	{"spread.emergency_stop.reaction_s", "emergency stop: reaction time", "time the crane keeps its speed after the stop command", "s", "",
		func(r *clearance.Report) (float64, bool) {
			if r.Spread == nil || r.Spread.EmergencyStop == nil || r.Spread.EmergencyStop.ReactionS == nil {
				return 0, false
			}
			return *r.Spread.EmergencyStop.ReactionS, true
		}},
}

// spread reads a spread that is set (non-zero).
func spread(f func(*clearance.Report) float64) func(*clearance.Report) (float64, bool) {
	return func(r *clearance.Report) (float64, bool) {
		if r.Spread == nil {
			return 0, false
		}
		v := f(r)
		return v, v != 0
	}
}

// ClearanceReport is the clearance check presented: the check's rows,
// then each obstacle's, in the units chosen.
type ClearanceReport struct {
	Rows      []Row          `json:"rows"`
	Obstacles []ObstacleRows `json:"obstacles"`
	// WorstFirst lists the obstacles' indices, the one kept clear in the
	// fewest runs first (then the closest approach): the order a crew
	// reads them in (clearanceverdict.go).
	WorstFirst []int `json:"worst_first"`
}

// ObstacleRows are one obstacle's figures. RopePart names the line of
// the hoisting gear that comes closest ("hoist rope", "rigging", "sling
// leg 2", "spreader leg 1", "hook rope 1"; the rope rows are of it), empty when the rope
// was not checked.
type ObstacleRows struct {
	Name     string `json:"name"`
	RopePart string `json:"rope_part,omitempty"`
	Rows     []Row  `json:"rows"`
	// Keeps is true when the obstacle keeps the margin in at least
	// clearance.Required of the runs; Verdict says so in words, in the
	// units shown (clearanceverdict.go).
	Keeps   bool   `json:"keeps"`
	Verdict string `json:"verdict"`
}

// PresentClearance gives the rows of the check and of each obstacle, in
// the units of u (each row's Key is its JSON path in the report, or in
// the obstacle's report).
func PresentClearance(r *clearance.Report, u units.Choice) ClearanceReport {
	out := ClearanceReport{Rows: []Row{}, Obstacles: []ObstacleRows{}}
	for _, f := range SiteTable {
		if v, ok := f.Value(r); ok {
			out.Rows = append(out.Rows, Figure{Key: f.Key, Crew: f.Crew, Technical: f.Technical, Unit: f.Unit, Quantity: f.Qu}.row(v, u))
		}
	}
	for i := range r.Obstacles {
		o := &r.Obstacles[i]
		rows := ObstacleRows{Name: o.Name, Rows: []Row{}}
		if o.Rope != nil {
			rows.RopePart = o.Rope.Part
		}
		for _, f := range ObstacleTable {
			if v, ok := f.Value(o); ok {
				rows.Rows = append(rows.Rows, Figure{Key: f.Key, Crew: f.Crew, Technical: f.Technical, Unit: f.Unit, Quantity: f.Qu, Detail: f.Detail}.row(v, u))
			}
		}
		rows.Keeps, rows.Verdict = obstacleVerdict(o, r.MarginM, u)
		out.Obstacles = append(out.Obstacles, rows)
	}
	out.WorstFirst = worstFirst(r.Obstacles)
	return out
}
