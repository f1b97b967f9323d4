package scenario

import (
	"fmt"

	"swaysheet/core/crane"
)

// Site is what stands along the load's path, for the clearance check: the
// obstacles seen from above with their top heights, the margin the lift
// plan asks to keep from them, and the spread of runs that gives the
// load's likely swept envelope (package clearance).
type Site struct {
	// SuspensionHeightM is the height of the rope's upper point of rotation
	// (trolley sheave, jib or boom tip) above the floor or ground the
	// obstacles stand on.
	SuspensionHeightM *float64 `json:"suspension_height_m"`
	// MarginM is the clearance to keep from every obstacle.
	MarginM float64 `json:"margin_m,omitempty"`
	// LoadRadiusM is the load's size about its centre of mass, seen as a
	// ball: half the load's largest dimension is the safe choice.
	LoadRadiusM *float64       `json:"load_radius_m"`
	Obstacles   []SiteObstacle `json:"obstacles"`
	Spread      *SiteSpread    `json:"spread,omitempty"`
}

// SiteObstacle is one obstacle: an outline seen from above, as corners or
// as a box, standing from the floor up to TopM.
type SiteObstacle struct {
	Name string   `json:"name"`
	TopM *float64 `json:"top_m"`
	// Corners are the outline's corners in order.
	Corners []SiteCorner `json:"corners,omitempty"`
	Box     *SiteBox     `json:"box,omitempty"`
}

// SiteCorner is one corner of an outline seen from above.
type SiteCorner struct {
	XM float64 `json:"x_m"`
	YM float64 `json:"y_m"`
}

// SiteBox is a rectangle seen from above.
type SiteBox struct {
	CentreXM float64  `json:"centre_x_m"`
	CentreYM float64  `json:"centre_y_m"`
	LengthM  *float64 `json:"length_m"`
	WidthM   *float64 `json:"width_m"`
	// AngleDeg turns the length from the x axis toward y.
	AngleDeg float64 `json:"angle_deg,omitempty"`
}

// SiteSpread is how the runs of the clearance check spread: each a
// standard deviation about the scenario's value (zero keeps it), the
// number of runs and the seed that makes them reproducible.
type SiteSpread struct {
	Runs         int     `json:"runs,omitempty"` // default DefaultSiteRuns
	Seed         int     `json:"seed,omitempty"`
	RopeLengthM  float64 `json:"rope_length_m,omitempty"`
	CentreDepthM float64 `json:"centre_depth_m,omitempty"`
	PressS       float64 `json:"press_s,omitempty"`
	GustPct      float64 `json:"gust_pct,omitempty"`
	GustS        float64 `json:"gust_s,omitempty"`
	// EmergencyStop, given, stops every run at a random moment.
	EmergencyStop *EmergencyStop `json:"emergency_stop,omitempty"`
}

// EmergencyStop is an emergency stop at a moment drawn uniformly over the
// move (from the first motion's start to the last one's end), a fresh
// moment in each run: every axis keeps its speed at that moment for
// ReactionS (the operator's reaction and the control's delay), then
// brakes at a constant rate to rest. The rate is each move's own
// deceleration (decel_*, or accel_* when it has none), or the stated
// emergency deceleration for travel and hoist axes (DecelMPerS2) and for
// the slew (DecelDegPerS2). A recorded move (series) has no rate of its
// own and needs the stated one.
type EmergencyStop struct {
	ReactionS     *float64 `json:"reaction_s"`
	DecelMPerS2   *float64 `json:"decel_m_per_s2,omitempty"`
	DecelDegPerS2 *float64 `json:"decel_deg_per_s2,omitempty"`
}

// DefaultSiteRuns is the number of runs when the spread gives none.
const DefaultSiteRuns = 200

func init() {
	addRanges([]fieldRange{
		{"site.suspension_height_m", Range{Min: 0.5, Max: 300, Unit: "m"}},
		{"site.margin_m", Range{Min: 0, Max: 20, Unit: "m"}},
		{"site.load_radius_m", Range{Min: 0, Max: 50, Unit: "m"}},
		{"site.obstacles[].top_m", Range{Min: 0.01, Max: 300, Unit: "m"}},
		{"site.obstacles[].corners[].x_m", Range{Min: -5000, Max: 5000, Unit: "m"}},
		{"site.obstacles[].corners[].y_m", Range{Min: -5000, Max: 5000, Unit: "m"}},
		{"site.obstacles[].box.centre_x_m", Range{Min: -5000, Max: 5000, Unit: "m"}},
		{"site.obstacles[].box.centre_y_m", Range{Min: -5000, Max: 5000, Unit: "m"}},
		{"site.obstacles[].box.length_m", Range{Min: 0.01, Max: 1000, Unit: "m"}},
		{"site.obstacles[].box.width_m", Range{Min: 0.01, Max: 1000, Unit: "m"}},
		{"site.obstacles[].box.angle_deg", Range{Min: -360, Max: 360, Unit: "deg"}},
		{"site.spread.runs", Range{Min: 1, Max: MaxSiteRuns, Unit: "runs"}},
		{"site.spread.seed", Range{Min: 0, Max: 1<<32 - 1, Unit: ""}},
		{"site.spread.rope_length_m", Range{Min: 0, Max: 20, Unit: "m"}},
		{"site.spread.centre_depth_m", Range{Min: 0, Max: 10, Unit: "m"}},
		{"site.spread.press_s", Range{Min: 0, Max: 5, Unit: "s"}},
		{"site.spread.gust_pct", Range{Min: 0, Max: 100, Unit: "%"}},
		{"site.spread.gust_s", Range{Min: 0, Max: MaxRunS, Unit: "s"}},
		{"site.spread.emergency_stop.reaction_s", Range{Min: 0, Max: 10, Unit: "s"}},
		{"site.spread.emergency_stop.decel_m_per_s2", Range{Min: 0.01, Max: 20, Unit: "m/s²"}},
		{"site.spread.emergency_stop.decel_deg_per_s2", Range{Min: 0.01, Max: 100, Unit: "deg/s²"}},
	})
}

// Bounds of the site block.
const (
	// MaxObstacles and MaxCorners bound the site's size.
	MaxObstacles = 100
	MaxCorners   = 64
	// MaxSiteRuns bounds the clearance check's runs.
	MaxSiteRuns = 5000
)

// validateSite checks the site block.
func (s *Scenario) validateSite(c *checker) {
	st := s.Site
	if st == nil {
		return
	}
	c.required("site.suspension_height_m", "site.suspension_height_m", st.SuspensionHeightM)
	c.value("site.margin_m", "site.margin_m", st.MarginM)
	c.required("site.load_radius_m", "site.load_radius_m", st.LoadRadiusM)
	if len(st.Obstacles) > MaxObstacles {
		c.add("site.obstacles", "has %d obstacles: at most %d", len(st.Obstacles), MaxObstacles)
		return
	}
	for i, o := range st.Obstacles {
		p := fmt.Sprintf("site.obstacles[%d]", i)
		c.required(p+".top_m", "site.obstacles[].top_m", o.TopM)
		switch {
		case o.Box != nil && o.Corners != nil:
			c.add(p, "has both corners and box: give one outline")
		case o.Box != nil:
			b := o.Box
			c.value(p+".box.centre_x_m", "site.obstacles[].box.centre_x_m", b.CentreXM)
			c.value(p+".box.centre_y_m", "site.obstacles[].box.centre_y_m", b.CentreYM)
			c.required(p+".box.length_m", "site.obstacles[].box.length_m", b.LengthM)
			c.required(p+".box.width_m", "site.obstacles[].box.width_m", b.WidthM)
			c.value(p+".box.angle_deg", "site.obstacles[].box.angle_deg", b.AngleDeg)
		case len(o.Corners) < 3 || len(o.Corners) > MaxCorners:
			c.add(p+".corners", "has %d corners: give from 3 to %d corners (x_m, y_m), or a box", len(o.Corners), MaxCorners)
		default:
			for j, xy := range o.Corners {
				q := fmt.Sprintf("%s.corners[%d]", p, j)
				c.value(q+".x_m", "site.obstacles[].corners[].x_m", xy.XM)
				c.value(q+".y_m", "site.obstacles[].corners[].y_m", xy.YM)
			}
		}
	}
	if sp := st.Spread; sp != nil {
		if sp.Runs != 0 {
			c.value("site.spread.runs", "site.spread.runs", float64(sp.Runs))
		}
		c.value("site.spread.seed", "site.spread.seed", float64(sp.Seed))
		c.value("site.spread.rope_length_m", "site.spread.rope_length_m", sp.RopeLengthM)
		c.value("site.spread.centre_depth_m", "site.spread.centre_depth_m", sp.CentreDepthM)
		c.value("site.spread.press_s", "site.spread.press_s", sp.PressS)
		c.value("site.spread.gust_pct", "site.spread.gust_pct", sp.GustPct)
		c.value("site.spread.gust_s", "site.spread.gust_s", sp.GustS)
		if e := sp.EmergencyStop; e != nil {
			const p = "site.spread.emergency_stop"
			c.required(p+".reaction_s", p+".reaction_s", e.ReactionS)
			c.optional(p+".decel_m_per_s2", p+".decel_m_per_s2", e.DecelMPerS2)
			c.optional(p+".decel_deg_per_s2", p+".decel_deg_per_s2", e.DecelDegPerS2)
			for i, m := range s.Motions {
				a, ok := crane.Of(m.Axis)
				if !ok || m.Profile != ProfileSeries {
					continue
				}
				if a.Kind == crane.Angular && e.DecelDegPerS2 == nil {
					c.add(p+".decel_deg_per_s2", "is required: motion %d is a record, which has no braking rate of its own", i+1)
				} else if a.Kind == crane.Linear && e.DecelMPerS2 == nil {
					c.add(p+".decel_m_per_s2", "is required: motion %d is a record, which has no braking rate of its own", i+1)
				}
			}
		}
	}
}
