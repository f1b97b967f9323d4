package plan

import (
	"fmt"
	"math"
	"strings"

	"swaysheet/core/motion"
	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// Hook block and rigging (load.hook): the hook of mass m1 on the rope L1
// and the load m2 on rigging L2 swing in two modes, whose frequencies are
// those of the linearised two-mass pendulum (pendulum.LinearModes; with
// R = m2/m1, w^2 = (g/2)[(1+R)(1/L1+1/L2) -/+ sqrt((1+R)^2 (1/L1+1/L2)^2 -
// 4(1+R)/(L1 L2))], the standard result). The planned rope lengths are L1.
//
// Single-mode options are tuned to the slower mode (period_s), as the
// whole-period ramps are. Beside them the planner offers two-mode shapers:
// the convolution of a shaper of each kind for the first mode with one
// for the second (impulses at all sums of the times, amplitudes the
// products; its residual vibration is the product of the two, zero at
// both design frequencies: shaper.Convolve, after Singer & Seering 1990
// and Singhose, Crain & Seering 1997, "Convolved and simultaneous two-mode
// input shapers", from memory). Each mode's design frequency is the
// middle of that mode's frequencies over the rope-length range. Every
// option is verified by the nonlinear simulation of both masses
// (pendulum.Double), so what a single-mode option leaves in the second
// mode shows in its verified residual.

// modeSet is the linear sway of the load at one rope length: the mode
// frequencies and each mode's share of the load's swing after a sudden
// start (one mode with share 1 for the single pendulum).
type modeSet struct {
	omega, share []float64
	kinds        []string // rigid load: what moves most in each mode
}

// modesAt returns the modes at rope length l (to the hook when there is
// one).
func (rq *request) modesAt(l float64) modeSet {
	g := units.StandardGravity
	if rq.body != nil {
		return rq.rigidModes(l)
	}
	h := rq.s.Load.Hook
	if h == nil {
		return modeSet{omega: []float64{math.Sqrt(g / l)}, share: []float64{1}}
	}
	md := pendulum.LinearModes(*h.MassKg, *rq.s.Load.MassKg, l, *h.RiggingLengthM, g)
	return modeSet{omega: md.Omega[:], share: md.LoadShare[:]}
}

// loadResidual bounds the load's residual swing of an impulse sequence in
// linear theory, as a fraction of the unshaped move's: the modes' shares
// times the residual vibration of each, added as if in phase.
func (ms modeSet) loadResidual(imps []motion.Impulse, zeta float64) float64 {
	v := 0.0
	for i, w := range ms.omega {
		v += ms.share[i] * shaper.Residual(imps, w, zeta)
	}
	return v
}

// twoMode reports whether the request has a hook block whose second mode
// matters (sway.SecondModeWarnShare of the load's swing or more at some
// rope length).
func (rq *request) twoMode() bool { return rq.share2 >= sway.SecondModeWarnShare }

// setModes fills the design periods of both modes, the second mode's
// largest share and the rigging length, for a scenario with a hook block.
func (rq *request) setModes(lo, hi float64) {
	a, b := rq.modesAt(lo), rq.modesAt(hi)
	rq.designT = 4 * math.Pi / (a.omega[0] + b.omega[0])
	rq.designT2 = 4 * math.Pi / (a.omega[1] + b.omega[1])
	if h := rq.s.Load.Hook; h != nil {
		rq.rig = *h.RiggingLengthM
	}
	for _, l := range rq.ropes {
		rq.share2 = math.Max(rq.share2, rq.modesAt(l).share[1])
	}
}

// designRope is the rope length whose slower mode has the design period:
// g*T^2/(4 pi^2) for the single pendulum; with a hook block found by
// bisection (the slower period grows with the rope).
func (rq *request) designRope() float64 {
	g := units.StandardGravity
	single := g * rq.designT * rq.designT / (4 * math.Pi * math.Pi)
	if !rq.multi() {
		return single
	}
	w := 2 * math.Pi / rq.designT
	lo, hi := scenario.MinRopeM, single
	for range 100 {
		m := 0.5 * (lo + hi)
		if rq.modesAt(m).omega[0] > w {
			lo = m
		} else {
			hi = m
		}
	}
	return 0.5 * (lo + hi)
}

// modeResidual is the worst, over the rope lengths simulated, linear-theory
// residual vibration V (%) of an impulse sequence in each mode.
func (rq *request) modeResidual(imps []motion.Impulse, zeta float64) []float64 {
	var out []float64
	for _, l := range rq.ropes {
		ms := rq.modesAt(l)
		for i, w := range ms.omega {
			if i >= len(out) {
				out = append(out, 0)
			}
			out[i] = math.Max(out[i], 100*shaper.Residual(imps, w, zeta))
		}
	}
	return out
}

// designTwoMode returns the two-mode shaper of the given kind.
func (rq *request) designTwoMode(kind string) (*shaper.Shaper, error) {
	z := rq.zeta
	if kind == shaper.EI {
		z = 0
	}
	return shaper.NewTwoMode(kind, rq.designT, rq.designT2, z, rq.tol)
}

// markModes adds to a shaped option what it leaves in each mode, and for
// one tuned to the first mode only, says so in its settings.
func (rq *request) markModes(o *Option, sh *shaper.Shaper) {
	if !rq.multi() {
		return
	}
	o.ModeResidualPct = rq.modeResidual(sh.Impulses, sh.Damping)
	if sh.SecondPeriodS > 0 {
		o.TwoMode = true
		o.add(say(fmt.Sprintf("Designed for both sway modes, {0} and {1}: in linear theory it leaves at most %.2g %% and %.2g %% of the drive-limits move's swing in them over the rope-length range.",
			o.ModeResidualPct[0], o.ModeResidualPct[1]), qTime(rq.designT), qTime(rq.designT2)))
		return
	}
	o.add(say(fmt.Sprintf("Tuned to the first sway mode ({0}) only: in linear theory it leaves up to %.2g %% of the drive-limits move's swing in the second mode ({1}), which carries about %.0f %% of the load's swing.",
		o.ModeResidualPct[1], 100*rq.share2), qTime(rq.designT), qTime(rq.designT2)))
}

// MinSecondShare is the second mode's share of the load's swing below
// which no two-mode options are offered: the single-mode ones leave at
// most that much of it.
const MinSecondShare = 0.01

// minSecondPeriodS is the shortest second-mode period a two-mode shaper is
// designed for (the scenario format's bound on shaper.second_period_s).
const minSecondPeriodS = 0.1

// twoModeOptions are the two-mode shaped options: a speed profile of each
// kind for a variable-speed drive and, with four steps, ZV*ZV pendant
// steps (the kinds with more impulses need more speed steps than a
// pendant has). None are offered when the second mode carries less than
// MinSecondShare of the load's swing.
func (rq *request) twoModeOptions() ([]*Option, error) {
	var out []*Option
	if rq.share2 < MinSecondShare || rq.designT2 < minSecondPeriodS {
		return nil, nil
	}
	{
		for _, kind := range shaper.Kinds {
			sh, err := rq.designTwoMode(kind)
			if err != nil {
				return nil, err
			}
			out = append(out, rq.shapedDriveWith(sh, kind, kind+"2_"+scenario.DriveVariableSpeed,
				"Two-mode "+shaperLabel(kind)+"-shaped speed profile (variable-speed drive)"))
		}
	}
	return out, nil
}

// modeNotes describe the two modes for the plan's notes, their
// quantities marked.
func (rq *request) modeNotes() []Sentence {
	if rq.body != nil {
		return rq.rigidNotes()
	}
	if rq.s.Load.Hook == nil {
		return nil
	}
	word := "small: the options tuned to the first mode are enough in linear theory, and the simulation of both masses checks them"
	if rq.share2 < MinSecondShare || rq.designT2 < minSecondPeriodS {
		word = "too little for two-mode shapers: none are offered, and the simulation of both masses checks the others"
	}
	if rq.twoMode() {
		word = "enough to matter: options tuned to the first mode only leave the second ringing, and the two-mode shapers cancel both"
	}
	qs := []Quantity{qTime(rq.designT), qTime(rq.designT2), qLen(rq.rig)}
	ropes := make([]string, len(rq.ropes))
	for i, l := range rq.ropes {
		ropes[i] = fmt.Sprintf("{%d}", len(qs))
		qs = append(qs, qLen(l).digits(4))
	}
	return []Sentence{say(fmt.Sprintf("Hook block and rigging swing in two modes, with design periods of {0} and {1} (rope to the hook %s, rigging {2}). The second carries up to %.0f %% of the load's swing after a sudden start, %s. Single-mode shapers and whole-period ramps are tuned to the first.",
		strings.Join(ropes, ", "), 100*rq.share2, word), qs...)}
}

// twoModeAssumption is added to the assumptions for a hook block.
const twoModeAssumption = "Hook block and rigging are two point masses (rope to the hook, rigging from the hook to the load's centre of mass); the mode periods are those of the linearised two-mass pendulum, and the swing figures are of the line from the suspension point to the load."

// modeReason says how the recommended option treats the two modes.
func (rq *request) modeReason(o *Option) Sentence {
	modes := fmt.Sprintf("the two sway modes %s ({0} and {1}; the second carries up to %.0f %% of the load's swing)", rq.modesOf(), 100*rq.share2)
	ts := []Quantity{qTime(rq.designT), qTime(rq.designT2)}
	switch {
	case o.TwoMode && o.RampTimeS > 0:
		return say("Its ramp time is chosen with "+modes+" in view, and "+rq.simWords()+" confirms it.", ts...)
	case o.TwoMode:
		return say("It is designed for "+modes+", and "+rq.simWords()+" confirms it.", ts...)
	}
	left := ""
	if len(o.ModeResidualPct) == 2 {
		left = fmt.Sprintf(" (in linear theory it leaves %.2g %% of the drive-limits move's swing in the second)", o.ModeResidualPct[1])
	}
	return say("Of "+modes+" it is tuned to the first only"+left+"; "+rq.simWords()+" keeps the residual swing inside the limit.", ts...)
}

// steadyLean is the steady angle from the vertical of the line from the
// suspension point to the load under a steady horizontal force f (N) on
// the load: atan(f/(m*g)) for the single pendulum; with a hook block the
// rope leans atan(f/((m1+m2)*g)) and the rigging atan(f/(m2*g)) (statics
// of the two masses), at the shortest rope simulated (the largest angle).
func (rq *request) steadyLean(f float64) float64 {
	// The shortest rope of the range leans the line to the load the most.
	l1 := rq.ropes[0]
	for _, l := range rq.ropes {
		l1 = math.Min(l1, l)
	}
	if rq.body != nil {
		return rq.body.WindLeanRad(f, l1)
	}
	return sway.WindLeanRad(rq.s, f, l1)
}
