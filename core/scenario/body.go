package scenario

import "fmt"

// Body, when present in load.body, models the load as a rigid box hung by
// a sling set, in place of a point at its centre of mass. The box's axes:
// x along its length, y across (width), z up (height); its centre of mass
// is the box's centre. Then load.mass_kg is the load without the hook
// block, and load.rope_length_m runs from the rope's upper point of
// rotation to the hook where the legs meet (with a spreader: to the
// attach points on the load, the length of each parallel leg).
type Body struct {
	LengthM *float64 `json:"length_m"`
	WidthM  *float64 `json:"width_m"`
	HeightM *float64 `json:"height_m"`
	// Radii of gyration about the length, width and height axes through
	// the centre of mass; each defaults to that of a solid box,
	// sqrt((b^2 + c^2)/12) of the other two sides.
	GyrationLengthM *float64 `json:"gyration_length_m,omitempty"`
	GyrationWidthM  *float64 `json:"gyration_width_m,omitempty"`
	GyrationHeightM *float64 `json:"gyration_height_m,omitempty"`
	// HeadingDeg is the direction of the load's length axis at the start,
	// degrees from +x toward +y.
	HeadingDeg float64 `json:"heading_deg,omitempty"`
	// HookMassKg is the hook block's mass at the hook where the legs meet
	// (needed with two legs).
	HookMassKg float64 `json:"hook_mass_kg,omitempty"`
	// Legs are two or four sling legs from one hook; or give Spreader or
	// Tandem.
	Legs []BodyLeg `json:"legs,omitempty"`
	// Spreader hangs the load from two parallel legs held by the crane.
	Spreader *Spreader `json:"spreader,omitempty"`
	// Tandem hangs the load from two hook ropes of their own (tandem.go).
	Tandem *Tandem `json:"tandem,omitempty"`
}

// BodyLeg is one sling leg: its length from the hook to the attach point,
// and the attach point from the load's centre of mass in the load's axes.
type BodyLeg struct {
	LengthM  *float64 `json:"length_m"`
	AttachXM float64  `json:"attach_x_m,omitempty"`
	AttachYM float64  `json:"attach_y_m,omitempty"`
	AttachZM *float64 `json:"attach_z_m"`
}

// Spreader is two parallel vertical legs a distance SpacingM apart along
// the load's length, from two points that move with the crane's
// suspension point and turn with its slew (two hoist ropes, or a spreader
// beam held level and square by the crane's reeving), each of length
// load.rope_length_m, attached at (+/-spacing/2, 0, AttachZM) on the load.
type Spreader struct {
	SpacingM *float64 `json:"spacing_m"`
	// AttachZM is the attach points' height above the centre of mass;
	// default half the load's height (its top face).
	AttachZM *float64 `json:"attach_z_m,omitempty"`
}

func init() {
	addRanges([]fieldRange{
		{"load.body.length_m", Range{Min: 0.01, Max: 100, Unit: "m"}},
		{"load.body.width_m", Range{Min: 0.01, Max: 100, Unit: "m"}},
		{"load.body.height_m", Range{Min: 0.01, Max: 100, Unit: "m"}},
		{"load.body.gyration_length_m", Range{Min: 0.001, Max: 100, Unit: "m"}},
		{"load.body.gyration_width_m", Range{Min: 0.001, Max: 100, Unit: "m"}},
		{"load.body.gyration_height_m", Range{Min: 0.001, Max: 100, Unit: "m"}},
		{"load.body.heading_deg", Range{Min: -360, Max: 360, Unit: "deg"}},
		{"load.body.hook_mass_kg", Range{Min: 0, Max: 2e5, Unit: "kg"}},
		{"load.body.legs[].length_m", Range{Min: 0.1, Max: 100, Unit: "m"}},
		{"load.body.legs[].attach_x_m", Range{Min: -60, Max: 60, Unit: "m"}},
		{"load.body.legs[].attach_y_m", Range{Min: -60, Max: 60, Unit: "m"}},
		{"load.body.legs[].attach_z_m", Range{Min: -60, Max: 60, Unit: "m"}},
		{"load.body.spreader.spacing_m", Range{Min: 0.1, Max: 100, Unit: "m"}},
		{"load.body.spreader.attach_z_m", Range{Min: -60, Max: 60, Unit: "m"}},
	})
}

// MinHookShare is the smallest hook block mass accepted with two legs, as a
// share of the load's mass: the hook moves between the legs, and a hook
// far lighter makes that motion too fast to follow.
const MinHookShare = 1e-3

func (b *Body) validate(c *checker, s *Scenario) {
	const at = "load.body."
	c.required(at+"length_m", at+"length_m", b.LengthM)
	c.required(at+"width_m", at+"width_m", b.WidthM)
	c.required(at+"height_m", at+"height_m", b.HeightM)
	c.optional(at+"gyration_length_m", at+"gyration_length_m", b.GyrationLengthM)
	c.optional(at+"gyration_width_m", at+"gyration_width_m", b.GyrationWidthM)
	c.optional(at+"gyration_height_m", at+"gyration_height_m", b.GyrationHeightM)
	b.validateGyration(c)
	c.value(at+"heading_deg", at+"heading_deg", b.HeadingDeg)
	c.value(at+"hook_mass_kg", at+"hook_mass_kg", b.HookMassKg)
	if s.Load.Hook != nil {
		c.add("load.hook", "does not apply with load.body: give the hook block's mass as load.body.hook_mass_kg and the slings as load.body.legs")
	}
	switch {
	case b.Tandem != nil && (b.Spreader != nil || len(b.Legs) > 0):
		c.add(at+"tandem", "give one of load.body.legs (one hook), load.body.spreader (two parallel legs) or load.body.tandem (two hook ropes), not more")
	case b.Tandem != nil:
		b.Tandem.validate(c, s)
	case b.Spreader != nil && len(b.Legs) > 0:
		c.add(at+"legs", "give either load.body.legs (one hook) or load.body.spreader (two parallel legs), not both")
	case b.Spreader != nil:
		c.required(at+"spreader.spacing_m", at+"spreader.spacing_m", b.Spreader.SpacingM)
		c.optional(at+"spreader.attach_z_m", at+"spreader.attach_z_m", b.Spreader.AttachZM)
		if b.HookMassKg != 0 {
			c.add(at+"hook_mass_kg", "does not apply with a spreader: the parallel legs hang from points that move with the crane")
		}
	case len(b.Legs) == 2 || len(b.Legs) == 4:
		for i := range b.Legs {
			l := &b.Legs[i]
			f := fmt.Sprintf(at+"legs[%d].", i)
			c.required(f+"length_m", at+"legs[].length_m", l.LengthM)
			c.value(f+"attach_x_m", at+"legs[].attach_x_m", l.AttachXM)
			c.value(f+"attach_y_m", at+"legs[].attach_y_m", l.AttachYM)
			c.required(f+"attach_z_m", at+"legs[].attach_z_m", l.AttachZM)
		}
		if m := s.Load.MassKg; len(b.Legs) == 2 && m != nil && b.HookMassKg < MinHookShare**m {
			c.add(at+"hook_mass_kg", "is required with two legs, at least %g kg here (%g %% of the load's mass): the hook moves between the two legs", MinHookShare**m, 100*MinHookShare)
		}
	default:
		c.add(at+"legs", "has %d legs: give two or four legs meeting at the hook, load.body.spreader for two parallel legs, or load.body.tandem for two hook ropes", len(b.Legs))
	}
}

// validateGyration checks that the radii of gyration (given or of the box)
// can belong to a body: each moment of inertia is at most the sum of the
// other two (I_x <= I_y + I_z, from I_x = integral of y^2 + z^2 dm), so
// k_x^2 <= k_y^2 + k_z^2 and so on.
func (b *Body) validateGyration(c *checker) {
	if b.LengthM == nil || b.WidthM == nil || b.HeightM == nil {
		return
	}
	a, w, h := *b.LengthM, *b.WidthM, *b.HeightM
	k := [3]float64{(w*w + h*h) / 12, (a*a + h*h) / 12, (a*a + w*w) / 12}
	names := [3]string{"gyration_length_m", "gyration_width_m", "gyration_height_m"}
	for i, p := range [3]*float64{b.GyrationLengthM, b.GyrationWidthM, b.GyrationHeightM} {
		if p != nil {
			k[i] = *p * *p
		}
	}
	for i := range 3 {
		if k[i] > k[(i+1)%3]+k[(i+2)%3] {
			c.add("load.body."+names[i], "is too large for the other two radii of gyration: the square of each is at most the sum of the squares of the other two (a body's moment of inertia about one axis is at most the sum of those about the other two)")
		}
	}
}
