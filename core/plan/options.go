package plan

import (
	"fmt"
	"math"
	"strings"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/units"
)

// axisUnit is the axis' scenario unit per SI unit (1 for m, 1/deg for
// rad: its kind's).
func (rq *request) axisUnit() float64 { return 1 / rq.axis.Kind.ToSI }

// inAxis is x (SI: m or rad, per s, per s²) in the axis' scenario unit.
func (rq *request) inAxis(x float64) float64 { return x / rq.axis.Kind.ToSI }

// leans reports whether moving the axis leans the load out (a slew: the
// hook goes round an arc; crane.Axis.OutwardAccel).
func (rq *request) leans() bool { return rq.axis.OutwardAccel(rq.start, 1) > 0 }

// lean is the load's outward lean while the axis moves at speed v (SI),
// rad: atan(a_out/g), 0 for an axis that moves the hook straight.
func (rq *request) lean(v float64) float64 {
	return math.Atan(rq.axis.OutwardAccel(rq.start, v) / units.StandardGravity)
}

// motionFor is a trapezoidal scenario move of the planned axis, SI inputs.
func (rq *request) motionFor(a, v float64) scenario.Motion {
	f := func(x float64) *float64 { return &x }
	m := scenario.Motion{Axis: rq.s.Plan.Axis, Profile: scenario.ProfileTrapezoid}
	k := rq.axis.Kind
	*crane.Pick(k, &m.DistanceM, &m.AngleDeg) = f(rq.inAxis(rq.dist))
	*crane.Pick(k, &m.SpeedMPerS, &m.RateDegPerS) = f(rq.inAxis(v))
	*crane.Pick(k, &m.AccelMPerS2, &m.AccelDegPerS2) = f(rq.inAxis(a))
	*crane.Pick(k, &m.DecelMPerS2, &m.DecelDegPerS2) = f(rq.inAxis(a))
	return m
}

func (rq *request) setAccel(o *Option, a, v float64) {
	o.accelSI = a
	*crane.Pick(rq.axis.Kind, &o.AccelMPerS2, &o.AccelDegPerS2) = rq.inAxis(a)
	*crane.Pick(rq.axis.Kind, &o.TopSpeedMPerS, &o.TopRateDegPerS) = rq.inAxis(v)
}

// trapezoidOption is a plain ramp setting: acceleration a, top speed v.
func (rq *request) trapezoidOption(key, label string, a, v float64) *Option {
	p := motion.NewTrapezoid(0, rq.dist, v, a, a)
	o := &Option{Key: key, Label: label, Drive: scenario.DriveVariableSpeed, Motion: rq.motionFor(a, v), profile: p}
	rq.setAccel(o, a, v)
	o.RampS = p.PeakSpeed() / a
	o.MoveTimeS = p.Duration()
	o.add(say("Acceleration and deceleration {0}: ramp time {1} to {2}.", rq.accelQ(a), qTime(o.RampS), rq.speedQ(p.PeakSpeed())))
	if p.Triangular() {
		o.add(say("The move is too short to reach {0}: the drive starts braking as soon as it peaks at {1}.",
			rq.speedQ(v), rq.speedQ(p.PeakSpeed())))
	}
	return o
}

func (rq *request) wholePeriodOption(n int) *Option {
	a, v := rq.wholePeriodAccel(n)
	word := "periods"
	if n == 1 {
		word = "period"
	}
	o := rq.trapezoidOption(fmt.Sprintf("whole_periods_%d", n), fmt.Sprintf("Ramp time of %d sway %s", n, word), a, v)
	claim := "each ramp then leaves no residual swing in linear theory."
	if rq.leans() {
		// The outward lean R*w^2/g is released as the slew slows: a whole
		// number of periods cancels the swing of the slew's acceleration,
		// not that release (see ramp.go); the simulated figures say what
		// is left.
		claim = "that cancels the swing from the slew's acceleration in linear theory, but not the outward lean, which is released as the slew slows: the simulated figures below say what is left."
	}
	o.Sentences = append([]Sentence{say(fmt.Sprintf("Set the ramp time to %d × {0} = {1} (%d whole sway %s) for starting and for stopping: %s", n, n, word, claim),
		qTime(rq.designT), qTime(float64(n)*rq.designT))}, o.Sentences...)
	return o
}

// design returns the shaper of the given kind for the request.
func (rq *request) design(kind string) (*shaper.Shaper, error) {
	z := rq.zeta
	if kind == shaper.EI {
		z = 0 // the EI formula used is the undamped one
	}
	return shaper.New(kind, rq.designT, z, rq.tol)
}

func shaperLabel(kind string) string { return strings.ToUpper(kind) }

// shapedDrive is the drive-limits move through a shaper, for a
// variable-speed drive.
func (rq *request) shapedDrive(kind string) (*Option, error) {
	sh, err := rq.design(kind)
	if err != nil {
		return nil, err
	}
	return rq.shapedDriveWith(sh, kind, kind+"_"+scenario.DriveVariableSpeed, shaperLabel(kind)+"-shaped speed profile (variable-speed drive)"), nil
}

// shapedDriveWith is the drive-limits move through the shaper sh (of the
// given kind, single- or two-mode).
func (rq *request) shapedDriveWith(sh *shaper.Shaper, kind, key, label string) *Option {
	base := motion.NewTrapezoid(0, rq.dist, rq.vmax, rq.amax, rq.amax)
	p := sh.Apply(base)
	o := &Option{Key: key, Label: label,
		Drive: scenario.DriveVariableSpeed, Shaper: kind, profile: p, Motion: rq.motionFor(rq.amax, rq.vmax)}
	o.Motion.Shaper = &scenario.ShaperSpec{Kind: kind, PeriodS: &rq.designT, DampingRatio: sh.Damping, TolerancePct: sh.Tolerance * 100}
	tuned := say("Program the drive's speed profile (multi-segment ramps or the drive's own sway-control function), tuned to a sway period of {0}:", qTime(rq.designT))
	if sh.SecondPeriodS > 0 {
		t2 := sh.SecondPeriodS
		o.Motion.Shaper.SecondPeriodS = &t2
		tuned = say("Program the drive's speed profile (multi-segment ramps or the drive's own sway-control function), tuned to sway periods of {0} and {1}:", qTime(rq.designT), qTime(t2))
	}
	rq.setAccel(o, rq.amax, rq.vmax)
	o.RampS = base.PeakSpeed()/rq.amax + sh.Duration()
	o.MoveTimeS = p.End()
	// The shaped speed is piecewise linear: its corners are the breakpoints.
	for _, t := range p.Breakpoints() {
		o.SpeedProfile = append(o.SpeedProfile, Knot{TS: t, Speed: p.At(t).Vel * rq.axisUnit()})
	}
	o.add(tuned)
	o.Sentences = append(o.Sentences, rq.segments(o.SpeedProfile)...)
	o.add(say("Each start and each stop takes {0} in all (the drive's ramp of {1} spread over {2} more).",
		qTime(o.RampS), qTime(base.PeakSpeed()/rq.amax), qTime(sh.Duration())))
	rq.markModes(o, sh)
	return o
}

// segments describes a piecewise linear speed profile in words.
func (rq *request) segments(ks []Knot) []Sentence {
	// Knot speeds are in the axis' unit: m/s, or deg/s for a slew.
	k := rq.axis.Kind
	sp := func(x float64) Quantity {
		// short: one unit in the plain text of a table-like line
		return Quantity{Value: x, Quantity: k.SpeedQuantity, Digits: 3, short: true}
	}
	acc := func(x float64) Quantity { return Quantity{Value: x, Quantity: k.AccelQuantity, Digits: 3} }
	tq := func(t float64) Quantity { return qTime(t).digits(4) }
	var out []Sentence
	for i := 0; i+1 < len(ks); i++ {
		a, b := ks[i], ks[i+1]
		if math.Abs(b.Speed-a.Speed) < 1e-9 {
			if i+2 < len(ks) && math.Abs(a.Speed) > 1e-9 {
				out = append(out, say("  {0}–{1}: hold {2}", tq(a.TS), tq(b.TS), sp(a.Speed)))
			}
			continue
		}
		out = append(out, say("  {0}–{1}: ramp {2} → {3} ({4})", tq(a.TS), tq(b.TS), sp(a.Speed), sp(b.Speed),
			acc((b.Speed-a.Speed)/(b.TS-a.TS))))
	}
	return out
}

// curves computes the plot data in linear theory. The points are drawn,
// never read as figures: they are rounded to 1e-4 of their unit (s, deg,
// %; plotted), far below a pixel of the charts (a scale of a few degrees
// or 100 % over a few hundred pixels), which halves the curves' part of
// the reply (about 17 kB of 59 kB) and of the page's plot calls.
func curves(rq *request) Curves {
	g := units.StandardGravity
	var c Curves
	at := &c.AccelTime
	at.Basis = "linear theory: one ramp of time t_a to the top speed V leaves 2*(a/g)*|sin(pi*t_a/T)| rad with a = V/t_a (hook speed R*w for a slew)"
	const n = 121
	vHook := rq.vmax * rq.k
	for i := range n {
		q := 3 * float64(i) / (n - 1)
		at.RampS = append(at.RampS, plotted(q*rq.designT, 1e4))
		at.Periods = append(at.Periods, q)
	}
	if rq.multi() {
		at.Basis += "; with a hook block, the sum over both modes of each mode's share of the load's swing times that, T the mode's period (in phase: an upper bound)"
	}
	for _, l := range rq.ropes {
		ms := rq.modesAt(l)
		s := RampSeries{RopeLengthM: l}
		for _, q := range at.Periods {
			t, r := q*rq.designT, 0.0 // RampS rounded for the plot
			for i, w := range ms.omega {
				tl := 2 * math.Pi / w
				ri := vHook * w / g // limit t -> 0: V*w/g
				if t > 0 {
					ri = 2 * vHook / (g * t) * math.Abs(math.Sin(math.Pi*t/tl))
				}
				r += ms.share[i] * ri
			}
			s.ResidualDeg = append(s.ResidualDeg, plotted(r/units.Degree, 1e4))
		}
		at.Series = append(at.Series, s)
	}
	re := &c.RopeError
	re.Basis = "percentage residual vibration V(w, zeta) of the shaper (Singer & Seering 1990), w = sqrt(g/L)"
	if rq.multi() {
		re.Basis = "percentage residual vibration V(w, zeta) of the shaper (Singer & Seering 1990) in each mode " + rq.modesOf() + ", weighted by the mode's share of the load's swing and added (an upper bound); L is the rope to the hook"
	}
	ld := rq.designRope()
	lo, hi := rq.ropes[0], rq.ropes[0]
	for _, l := range rq.ropes {
		lo, hi = math.Min(lo, l), math.Max(hi, l)
	}
	re.RangePct = [2]float64{100 * (lo/ld - 1), 100 * (hi/ld - 1)}
	for i := -50; i <= 50; i++ {
		re.ErrorPct = append(re.ErrorPct, float64(i))
	}
	var shapers []*shaper.Shaper
	for _, kind := range shaper.Kinds {
		if sh, err := rq.design(kind); err == nil {
			shapers = append(shapers, sh)
		}
	}
	if rq.multi() {
		for _, kind := range shaper.Kinds {
			if sh, err := rq.designTwoMode(kind); err == nil {
				shapers = append(shapers, sh)
			}
		}
	}
	mss := make([]modeSet, len(re.ErrorPct)) // the modes at each rope length, for every shaper
	for i, e := range re.ErrorPct {
		mss[i] = rq.modesAt(ld * (1 + e/100))
	}
	for _, sh := range shapers {
		s := ShaperSeries{Shaper: sh.Kind}
		for _, ms := range mss {
			s.ResidualPct = append(s.ResidualPct, plotted(100*ms.loadResidual(sh.Impulses, sh.Damping), 1e4))
		}
		re.Series = append(re.Series, s)
	}
	return c
}

// plotted is x rounded to a whole number of 1/perUnit (perUnit a power of
// ten, at most 1e22 so that it is exact): the division is then correctly
// rounded, so the result's shortest decimal is that number's few digits.
// (RoundToEven: one wasm instruction, f64.nearest.)
func plotted(x, perUnit float64) float64 { return math.RoundToEven(x*perUnit) / perUnit }
