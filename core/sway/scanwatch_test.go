package sway

import (
	"slices"
	"testing"

	"swaysheet/core/pendulum"
)

// TestWatchedQuantities: the general scan watches the quantities a load
// has. A rigid load on two hook ropes or a spreader (two legs) has no hook
// block's rigging and no third or fourth leg; on one hook, four legs; a
// hook block with rigging all eight of the rope's and rigging's.
func TestWatchedQuantities(t *testing.T) {
	two := watched(nQuantities, &pendulum.Point{Body: &pendulum.BodyPoint{NLegs: 2}})
	want := []quantity{qSwing, qExcursion, qTension, qTensionLow, qTilt, qTwist, qCorner, qLeg, qLeg + 1, qLegLow, qLegLow + 1}
	if !slices.Equal(two, want) {
		t.Errorf("two legs: watched %v, want %v", two, want)
	}
	four := watched(nQuantities, &pendulum.Point{Body: &pendulum.BodyPoint{NLegs: 4}})
	if len(four) != len(want)+4 || slices.Contains(four, qRigTension) {
		t.Errorf("four legs: watched %v", four)
	}
	hook := watched(qTilt, &pendulum.Point{})
	if len(hook) != int(qTilt) || hook[qRigTensionLow] != qRigTensionLow {
		t.Errorf("hook block: watched %v", hook)
	}
}
