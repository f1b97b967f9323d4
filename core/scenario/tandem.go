package scenario

import "fmt"

// Tandem hangs a rigid load (load.body) from two hook ropes: a tandem
// lift by two hoists or trolleys on one crane (a gantry's two hoists, an
// overhead crane's two trolleys), each rope from its own suspension point
// to its own attach point on the load. The two suspension points move
// together with the crane's suspension point: they lie on a horizontal
// line along the load's heading (load.body.heading_deg, turned with the
// crane's slew), SpacingM apart and centred on it; rope 0 hangs from the
// point toward +heading, rope 1 from the other.
//
// Each rope's length runs from its suspension point (the upper point of
// rotation) to its attach point; it defaults to load.rope_length_m, and
// when the rope length changes (hoisting, the planner's rope lengths)
// both ropes change by the same amount as load.rope_length_m: the hoists
// work together.
type Tandem struct {
	// SpacingM is the distance between the two suspension points; default
	// the attach points' distance along the load's length
	// (ropes[0].attach_x_m - ropes[1].attach_x_m), so that equal ropes
	// hang plumb.
	SpacingM *float64   `json:"spacing_m,omitempty"`
	Ropes    []HookRope `json:"ropes"`
}

// HookRope is one hook rope of a tandem lift: its length, and its attach
// point from the load's centre of mass in the load's axes (x along its
// length, y across, z up).
type HookRope struct {
	LengthM  *float64 `json:"length_m,omitempty"`
	AttachXM *float64 `json:"attach_x_m"`
	AttachYM float64  `json:"attach_y_m,omitempty"`
	// AttachZM defaults to half the load's height (its top face).
	AttachZM *float64 `json:"attach_z_m,omitempty"`
}

func init() {
	addRanges([]fieldRange{
		{"load.body.tandem.spacing_m", Range{Min: 0.1, Max: 100, Unit: "m"}},
		{"load.body.tandem.ropes[].length_m", Range{Min: 0.1, Max: 500, Unit: "m"}},
		{"load.body.tandem.ropes[].attach_x_m", Range{Min: -60, Max: 60, Unit: "m"}},
		{"load.body.tandem.ropes[].attach_y_m", Range{Min: -60, Max: 60, Unit: "m"}},
		{"load.body.tandem.ropes[].attach_z_m", Range{Min: -60, Max: 60, Unit: "m"}},
	})
}

func (t *Tandem) validate(c *checker, s *Scenario) {
	const at = "load.body.tandem."
	b := s.Load.Body
	c.optional(at+"spacing_m", at+"spacing_m", t.SpacingM)
	if b.HookMassKg != 0 {
		c.add("load.body.hook_mass_kg", "does not apply with two hook ropes: give each hook block's mass with the load's")
	}
	if len(t.Ropes) != 2 {
		c.add(at+"ropes", "has %d ropes: a tandem lift has two hook ropes", len(t.Ropes))
		return
	}
	for i := range t.Ropes {
		r := &t.Ropes[i]
		f := fmt.Sprintf(at+"ropes[%d].", i)
		c.optional(f+"length_m", at+"ropes[].length_m", r.LengthM)
		c.required(f+"attach_x_m", at+"ropes[].attach_x_m", r.AttachXM)
		c.value(f+"attach_y_m", at+"ropes[].attach_y_m", r.AttachYM)
		c.optional(f+"attach_z_m", at+"ropes[].attach_z_m", r.AttachZM)
	}
	// Both ropes follow the rope length: at the plan's shortest, each
	// must still be in range.
	if p, l0 := s.Plan, s.Load.RopeLengthM; p != nil && p.RopeLengthMinM != nil && l0 != nil {
		for i, r := range t.Ropes {
			if r.LengthM == nil {
				continue
			}
			if l := *p.RopeLengthMinM + *r.LengthM - *l0; l < MinRopeM {
				c.add(fmt.Sprintf(at+"ropes[%d].length_m", i), "is %g m less than load.rope_length_m, so at plan.rope_length_min_m this rope would be %.4g m long: it must stay at least %g m", *l0-*r.LengthM, l, MinRopeM)
			}
		}
	}
	if x0, x1 := t.Ropes[0].AttachXM, t.Ropes[1].AttachXM; x0 != nil && x1 != nil && !(*x0 > *x1) {
		c.add(at+"ropes[1].attach_x_m", "is %g m, not behind ropes[0].attach_x_m (%g m): rope 0 hangs from the suspension point toward the load's +x end, rope 1 from the other, so rope 0 attaches further along +x", *x1, *x0)
	}
}

// TandemLengths are the two hook ropes' lengths at load.rope_length_m
// (each defaults to it) of a validated scenario with load.body.tandem.
func (s *Scenario) TandemLengths() [2]float64 {
	var out [2]float64
	for i, r := range s.Load.Body.Tandem.Ropes {
		out[i] = *s.Load.RopeLengthM
		if r.LengthM != nil {
			out[i] = *r.LengthM
		}
	}
	return out
}
