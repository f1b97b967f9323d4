package sway

import (
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// TwoRopes is Body.Suspension for a load on two hook ropes
// (load.body.tandem).
const TwoRopes = "two ropes"

// Spreader is Body.Suspension for a load on a spreader's two parallel
// legs (load.body.spreader).
const Spreader = "spreader"

// HookRope names hook rope i (from 0) of a load on two hook ropes, rope 0
// hanging from the suspension point toward +heading: the one name the
// figures, the warnings and the clearance check's rope lines give it.
func HookRope(i int) string { return LegName(TwoRopes, i) }

// LegName names leg i (from 0) of a rigid load hung as suspension
// (Body.Suspension) says, in the order given: a hook rope (HookRope), a
// spreader leg (down from the spreader beam to the load), or a sling leg
// (from the hook): the one name the figures and the clearance check's
// rope lines give it.
func LegName(suspension string, i int) string {
	kind := "sling leg "
	switch suspension {
	case TwoRopes:
		kind = "hook rope "
	case Spreader:
		kind = "spreader leg "
	}
	return kind + strconv.Itoa(i+1)
}

// tandemRopes are the two hook ropes of a validated scenario with
// load.body.tandem: suspension points +/- spacing/2 along the heading
// (spacing by default the attach points' distance along the load's
// length), each rope's length less load.rope_length_m as its Extra (both
// follow the rope length's changes).
func tandemRopes(s *scenario.Scenario) *pendulum.TandemRopes {
	b := s.Load.Body
	tr := b.Tandem
	out := &pendulum.TandemRopes{}
	lens := s.TandemLengths()
	for i, rp := range tr.Ropes {
		out.Attach[i] = r3.Vec{X: *rp.AttachXM, Y: rp.AttachYM, Z: deref(rp.AttachZM, *b.HeightM/2)}
		out.Extra[i] = lens[i] - *s.Load.RopeLengthM
	}
	spacing := deref(tr.SpacingM, out.Attach[0].X-out.Attach[1].X)
	out.Top = [2]float64{spacing / 2, -spacing / 2}
	return out
}

// tandemFigures fills what two hook ropes add to the rigid load's
// figures: each rope's share of the load's weight hanging still (the
// upward part of its pull over m g; the two add up to 1, statics), and
// the slack flag and warning of a rope whose tension reached zero.
func tandemFigures(out *Body, rest *pendulum.BodyPoint, massKg float64, res *Result) {
	for i := range out.Legs {
		l := &out.Legs[i]
		l.WeightShare = rest.LegsUp[i] / (massKg * units.StandardGravity)
		if l.TensionMinN <= 0 {
			l.Slack = true
			name := HookRope(i)
			res.warn(words.Plain(strings.ToUpper(name[:1]) + name[1:] +
				" goes slack (its tension reaches zero): the load drops onto the other rope and snatches this one when it tightens; the model, which keeps both ropes straight, no longer holds. Reduce the motion or change the rigging."))
		}
	}
}

// bifilarTandem is the half spacing a and the length h the bifilar
// formula 2*pi*(k/a)*sqrt(h/g) takes for two hook ropes: half the attach
// points' horizontal distance and the ropes' mean length at rope length
// ropeM. The formula is exact for parallel equal ropes (small twist; any
// mechanics text); otherwise it is an estimate beside the modal analysis.
func bifilarTandem(t *pendulum.TandemRopes, ropeM float64) (a, h float64) {
	d := r3.Sub(t.Attach[0], t.Attach[1])
	return math.Hypot(d.X, d.Y) / 2, ropeM + (t.Extra[0]+t.Extra[1])/2
}
