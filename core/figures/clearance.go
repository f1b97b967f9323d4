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
}

// ObstacleTable is every figure of an obstacle, in the order people read
// them.
var ObstacleTable = []ClearanceFigure{
	{"clearance_p5_m", "room kept in 95 of 100 runs", "clearance kept by 95 % of the runs (5th percentile of each run's smallest)", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.ClearanceP5M, true }},
	{"smallest_m", "closest the load comes", "smallest clearance over every run (negative: it strikes)", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.SmallestM, true }},
	{"smallest_at_s", "closest at", "time of the smallest clearance", "s", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.SmallestAtS, true }},
	{"smallest_at_distance_m", "closest where, along the path", "distance along the crane's path of the smallest clearance", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.SmallestAtDistanceM, true }},
	{"share_keep_margin", "runs that keep the margin", "share of the runs keeping the margin", "", "share",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.ShareKeepMargin, true }},
	{"share_strike", "runs that strike it", "share of the runs whose load touches or passes into it", "", "share",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.ShareStrike, true }},
	{"share_keep_margin_low", "of all runs, at least (95 % sure)", "lower 95 % confidence bound of that share (Clopper-Pearson)", "", "share",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.ShareKeepMarginLow, true }},
	{"first_strike_s", "first strike at", "earliest moment of a strike over the runs", "s", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.FirstStrikeS, o.Strikes > 0 }},
	{"first_strike_at_distance_m", "first strike where, along the path", "distance along the crane's path of the earliest strike", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.FirstStrikeAtDistanceM, o.Strikes > 0 }},
	{"vertical.smallest_m", "least room under the load over it", "smallest height of the load's lowest point above its top while over it", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) {
			return vertical(o, func(v *clearance.Vertical) float64 { return v.SmallestM })
		}},
	{"vertical.at_distance_m", "least room under the load where", "distance along the crane's path of that", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) {
			return vertical(o, func(v *clearance.Vertical) float64 { return v.AtDistanceM })
		}},
	{"error_bound_m", "checked to within", "what the points checked can miss between samples", "m", "",
		func(o *clearance.ObstacleReport) (float64, bool) { return o.ErrorBoundM, true }},
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

// ObstacleRows are one obstacle's figures.
type ObstacleRows struct {
	Name string `json:"name"`
	Rows []Row  `json:"rows"`
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
		for _, f := range ObstacleTable {
			if v, ok := f.Value(o); ok {
				rows.Rows = append(rows.Rows, Figure{Key: f.Key, Crew: f.Crew, Technical: f.Technical, Unit: f.Unit, Quantity: f.Qu}.row(v, u))
			}
		}
		rows.Keeps, rows.Verdict = obstacleVerdict(o, r.MarginM, u)
		markDetail(rows.Rows)
		out.Obstacles = append(out.Obstacles, rows)
	}
	out.WorstFirst = worstFirst(r.Obstacles)
	return out
}
