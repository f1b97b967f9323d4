package plan

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// A rigid load (load.body) swings in the modes of the linearised
// rigid-load model (sway.RigidLoad, pendulum.Rigid.ModesAlong): its first
// mode is slower than a point at the hook or at its centre of mass would
// swing, and a long load pitches (or rolls) in a second mode that the
// move also excites. At each rope length (to the hook) the planner takes
// the modes and each one's share of the load's swing along the move after
// a sudden start (modal superposition; any vibration text): the mode with
// the largest share first (for a move along a long load, the first mode,
// sway.RigidFirstMode), then the others by their share. Single-mode
// shapers and whole-period ramps are tuned to the first, two-mode shapers
// (twomode.go) to the first and the one with the next largest share.
//
// Criterion for the second mode (the same as for a hook block, and with
// the same source: the share of the load's swing in linear modal
// superposition, thresholds chosen for this tool): from MinSecondShare
// (1 %) of the swing two-mode shapers are offered; from
// sway.SecondModeWarnShare (5 %) the plan warns that single-mode options
// leave it ringing and recommends a two-mode option within 5 % of the
// fastest option's move time. Every option is verified by the nonlinear
// simulation of the rigid load (sway.Evaluate of the scenario with its
// body), never by the point model.

// multi reports whether the load swings in more than one mode that the
// planner tunes to: a hook block or a rigid load.
func (rq *request) multi() bool { return rq.s.Load.Hook != nil || rq.body != nil }

// modesOf says whose modes they are, after "the sway modes".
func (rq *request) modesOf() string {
	if rq.body != nil {
		return "of the rigid load"
	}
	return "of hook block and rigging"
}

// simWords names the simulation that verifies the options.
func (rq *request) simWords() string {
	if rq.body != nil {
		return "the simulation of the rigid load"
	}
	return "the simulation of both masses"
}

// setBody builds the rigid load and the move's direction: along the
// travel axis, or for a slew the hook's direction of travel at the start
// (crane.Axis.HookDirection).
func (rq *request) setBody() error {
	b, err := sway.NewRigidLoad(rq.s)
	if err != nil {
		return err
	}
	rq.body, rq.bodyMemo = b, map[float64]modeSet{}
	rq.dir = rq.axis.HookDirection(rq.start)
	sw, err := b.Swing(*rq.s.Load.RopeLengthM, rq.dir)
	if err != nil {
		return err
	}
	rq.rig = sw.DepthM
	return nil
}

// rigidModes is the rigid load's modeSet at rope length l: the mode with
// the largest share of the swing first, then the others by share. Each
// set always has two modes (a second with no share if the load has only
// one).
func (rq *request) rigidModes(l float64) modeSet {
	rq.bodyMu.Lock()
	ms, ok := rq.bodyMemo[l]
	rq.bodyMu.Unlock()
	if ok {
		return ms
	}
	sw, err := rq.body.Swing(l, rq.dir)
	if err != nil {
		// Not expected for a load that prepared: one rope to the centre
		// of mass, the simulation checks every option anyway.
		w := math.Sqrt(units.StandardGravity / (l + rq.rig))
		ms = modeSet{omega: []float64{w, w}, share: []float64{1, 0}, kinds: []string{"swing", "none"}}
	} else {
		idx := make([]int, len(sw.PeriodsS))
		for i := range idx {
			idx[i] = i
		}
		sort.SliceStable(idx, func(a, b int) bool { return sw.Shares[idx[a]] > sw.Shares[idx[b]] })
		for _, i := range idx {
			ms.omega = append(ms.omega, 2*math.Pi/sw.PeriodsS[i])
			ms.share = append(ms.share, sw.Shares[i])
			ms.kinds = append(ms.kinds, sw.Kinds[i])
		}
		if len(ms.omega) < 2 {
			ms.omega, ms.share, ms.kinds = append(ms.omega, ms.omega[0]), append(ms.share, 0), append(ms.kinds, "none")
		}
	}
	rq.bodyMu.Lock()
	rq.bodyMemo[l] = ms
	rq.bodyMu.Unlock()
	return ms
}

// rigidNotes describe the rigid load's modes for the plan's notes, their
// quantities marked, with the warning when the second carries enough of
// the swing.
func (rq *request) rigidNotes() []Sentence {
	l := *rq.s.Load.RopeLengthM
	ms := rq.modesAt(l)
	point := 2 * math.Pi * math.Sqrt(l/units.StandardGravity)
	rope, ropes := "rope of {2} to the hook", "rope to the hook"
	switch {
	case rq.s.Load.Body.Spreader != nil:
		rope, ropes = "spreader legs of {2}", "spreader legs"
	case rq.s.Load.Body.Tandem != nil:
		rope, ropes = "rope length of {2} (load.rope_length_m; each hook rope's own length follows it)", "rope length"
	}
	qs := []Quantity{qTime(2 * math.Pi / ms.omega[0]), qTime(point), qLen(l).digits(4), qTime(rq.designT)}
	list := make([]string, len(rq.ropes))
	for i, r := range rq.ropes {
		list[i] = fmt.Sprintf("{%d}", len(qs))
		qs = append(qs, qLen(r).digits(4))
	}
	out := []Sentence{say(fmt.Sprintf("The load is a rigid body: the mode this move excites most (%s) has a period of {0} at the nominal "+rope+", where 2*pi*sqrt(L/g) of that length alone would give {1}. Shapers and whole-period ramps are tuned to {3}, the middle of that mode's frequencies over the rope lengths ("+ropes+" %s).",
		ms.kinds[0], strings.Join(list, ", ")), qs...)}
	second := fmt.Sprintf("The next mode the move excites (%s, design period {0}) carries up to %.0f %% of the load's swing after a sudden start (linear modal analysis of the rigid load)",
		ms.kinds[1], 100*rq.share2)
	t2 := qTime(rq.designT2)
	switch {
	case rq.twoMode():
		out = append(out, say(fmt.Sprintf("Warning: %s, %.0f %% or more: options tuned to the first mode only leave it ringing. Two-mode shapers are offered and preferred; the simulation of the rigid load checks every option.", second, 100*sway.SecondModeWarnShare), t2))
	case rq.share2 >= MinSecondShare && rq.designT2 >= minSecondPeriodS:
		out = append(out, say(second+": small; two-mode shapers are offered beside the others, and the simulation of the rigid load checks every option.", t2))
	default:
		out = append(out, say(second+": too little for two-mode shapers; the simulation of the rigid load checks every option.", t2))
	}
	return out
}

// rigidAssumption is added to the assumptions for a rigid load.
const rigidAssumption = "The load is a rigid body: its modes and their shares of the swing come from the linearised rigid-load model at each rope length, and every option is simulated with that model."

// assumptions are the planner's for a hook block or a rigid load: the
// design period is that load's first mode, not 2*pi*sqrt(L/g).
func (rq *request) assumptions() []string {
	out := append([]string{}, Assumptions...)
	for i, a := range out {
		if a == Assumptions[2] {
			out[i] = "Shapers and whole-period ramps are tuned to the middle of the range of the first mode's frequencies (" + map[bool]string{true: "the rigid load's", false: "of the two-mass pendulum"}[rq.body != nil] + "), not 2*pi*sqrt(L/g)."
		}
	}
	if rq.body != nil {
		return append(out, rigidAssumption)
	}
	return append(out, twoModeAssumption)
}
