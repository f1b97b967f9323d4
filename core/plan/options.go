package plan

import (
	"fmt"
	"math"
	"strings"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/shaper"
	"swaysheet/core/units"
)

// axisUnit is the axis' display unit per SI unit (1 for m, 1/deg for rad).
func (rq *request) axisUnit() float64 {
	if rq.slew {
		return 1 / units.Degree
	}
	return 1
}

func (rq *request) speedText(v float64) string {
	if rq.slew {
		d := v / units.Degree
		rpm, _ := units.FromSI("angular_speed", "rpm", d)
		return fmt.Sprintf("%.3g deg/s (%.3g rpm)", d, rpm)
	}
	mpm, _ := units.FromSI("speed", "m/min", v)
	return fmt.Sprintf("%.3g m/s (%.3g m/min)", v, mpm)
}

func (rq *request) accelText(a float64) string {
	if rq.slew {
		return fmt.Sprintf("%.3g deg/s²", a/units.Degree)
	}
	return fmt.Sprintf("%.3g m/s²", a)
}

// motionFor is a trapezoidal scenario move of the planned axis, SI inputs.
func (rq *request) motionFor(a, v float64) scenario.Motion {
	f := func(x float64) *float64 { return &x }
	m := scenario.Motion{Axis: rq.s.Plan.Axis, Profile: scenario.ProfileTrapezoid}
	if rq.slew {
		d := units.Degree
		m.AngleDeg, m.RateDegPerS, m.AccelDegPerS2, m.DecelDegPerS2 = f(rq.dist/d), f(v/d), f(a/d), f(a/d)
	} else {
		m.DistanceM, m.SpeedMPerS, m.AccelMPerS2, m.DecelMPerS2 = f(rq.dist), f(v), f(a), f(a)
	}
	return m
}

func (rq *request) setAccel(o *Option, a, v float64) {
	o.accelSI = a
	if rq.slew {
		o.AccelDegPerS2, o.TopRateDegPerS = a/units.Degree, v/units.Degree
	} else {
		o.AccelMPerS2, o.TopSpeedMPerS = a, v
	}
}

// trapezoidOption is a plain ramp setting: acceleration a, top speed v.
func (rq *request) trapezoidOption(key, label string, a, v float64) *Option {
	p := motion.NewTrapezoid(0, rq.dist, v, a, a)
	o := &Option{Key: key, Label: label, Drive: scenario.DriveVariableSpeed, Motion: rq.motionFor(a, v), profile: p}
	rq.setAccel(o, a, v)
	o.RampS = p.PeakSpeed() / a
	o.MoveTimeS = p.Duration()
	o.Settings = []string{fmt.Sprintf("Acceleration and deceleration %s: ramp time %.3g s to %s.",
		rq.accelText(a), o.RampS, rq.speedText(p.PeakSpeed()))}
	if p.Triangular() {
		o.Settings = append(o.Settings, fmt.Sprintf("The move is too short to reach %s: the drive starts braking as soon as it peaks at %s.",
			rq.speedText(v), rq.speedText(p.PeakSpeed())))
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
	o.Settings = append([]string{fmt.Sprintf("Set the ramp time to %d × %.3g s = %.3g s (%d whole sway %s) for starting and for stopping: each ramp then leaves no residual swing in linear theory.",
		n, rq.designT, float64(n)*rq.designT, n, word)}, o.Settings...)
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
	tuned := fmt.Sprintf("%.3g s", rq.designT)
	if sh.SecondPeriodS > 0 {
		t2 := sh.SecondPeriodS
		o.Motion.Shaper.SecondPeriodS = &t2
		tuned = fmt.Sprintf("%.3g s and %.3g s", rq.designT, t2)
	}
	rq.setAccel(o, rq.amax, rq.vmax)
	o.RampS = base.PeakSpeed()/rq.amax + sh.Duration()
	o.MoveTimeS = p.End()
	// The shaped speed is piecewise linear: its corners are the breakpoints.
	for _, t := range p.Breakpoints() {
		o.SpeedProfile = append(o.SpeedProfile, Knot{TS: t, Speed: p.At(t).Vel * rq.axisUnit()})
	}
	o.Settings = []string{fmt.Sprintf("Program the drive's speed profile (multi-segment ramps or the drive's own sway-control function), tuned to sway periods of %s:", tuned)}
	if sh.SecondPeriodS == 0 {
		o.Settings[0] = fmt.Sprintf("Program the drive's speed profile (multi-segment ramps or the drive's own sway-control function), tuned to a sway period of %s:", tuned)
	}
	o.Settings = append(o.Settings, rq.segments(o.SpeedProfile)...)
	o.Settings = append(o.Settings, fmt.Sprintf("Each start and each stop takes %.3g s in all (the drive's ramp of %.3g s spread over %.3g s more).",
		o.RampS, base.PeakSpeed()/rq.amax, sh.Duration()))
	rq.markModes(o, sh)
	return o
}

// segments describes a piecewise linear speed profile in words.
func (rq *request) segments(ks []Knot) []string {
	unit, acc := "m/s", "m/s²"
	if rq.slew {
		unit, acc = "deg/s", "deg/s²"
	}
	var out []string
	for i := 0; i+1 < len(ks); i++ {
		a, b := ks[i], ks[i+1]
		if math.Abs(b.Speed-a.Speed) < 1e-9 {
			if i+2 < len(ks) && math.Abs(a.Speed) > 1e-9 {
				out = append(out, fmt.Sprintf("  %.2f–%.2f s: hold %.3g %s", a.TS, b.TS, a.Speed, unit))
			}
			continue
		}
		out = append(out, fmt.Sprintf("  %.2f–%.2f s: ramp %.3g → %.3g %s (%.3g %s)", a.TS, b.TS, a.Speed, b.Speed, unit,
			(b.Speed-a.Speed)/(b.TS-a.TS), acc))
	}
	return out
}

// shapedPendant is the shaper as pendant steps: step k is pressed so that
// its ramp (at the drive's acceleration) is centred where the k-th impulse
// of the shaper falls, and its speed is the sum of the first k impulse
// amplitudes times the top speed. The stop releases the steps in the same
// pattern D/V later, which covers the distance D exactly.
func (rq *request) shapedPendant(kind string) (*Option, error) {
	sh, err := rq.design(kind)
	if err != nil {
		return nil, err
	}
	o, err := rq.pendant(kind+"_"+scenario.DrivePendant, shaperLabel(kind)+" pendant steps (step-speed drive)", kind, sh.Impulses)
	if err != nil {
		return nil, err
	}
	rq.markModes(o, sh)
	return o, nil
}

// pendant lays out pendant presses for an impulse sequence (see
// shapedPendant).
func (rq *request) pendant(key, label, kind string, imps []motion.Impulse) (*Option, error) {
	n := len(imps)
	// The stop releases the steps from the top down: the time-reversed
	// sequence B_j = A_(n+1-j) at t_n - t_(n+1-j), whose residual V(w) has
	// the same size at every frequency (its sum is the complex conjugate of
	// the start's, turned by w*t_n).
	rev := make([]motion.Impulse, n)
	for j := range imps {
		rev[j] = motion.Impulse{A: imps[n-1-j].A, T: imps[n-1].T - imps[n-1-j].T}
	}
	d := math.Abs(rq.dist)
	sign := math.Copysign(1, rq.dist)
	v := rq.vmax
	// layout puts the presses of a sequence so that each ramp (at the
	// drive's acceleration) is centred where its impulse falls, and returns
	// the press times, the time full change is reached and the distance lag
	// sum A_i*(press_i + ramp_i/2) against one instant change at 0, s.
	layout := func(seq []motion.Impulse, v float64) (press []float64, full, lag float64) {
		tau0 := seq[0].A * v / rq.amax
		for _, im := range seq {
			tau := im.A * v / rq.amax
			t := math.Max(0, im.T-tau/2+tau0/2)
			if k := len(press); k > 0 {
				t = math.Max(t, press[k-1]) // pressed in order
			}
			press = append(press, t)
			full = math.Max(full, t+tau)
			lag += im.A * (t + tau/2)
		}
		return press, full, lag
	}
	var up, down []float64
	var ts float64
	// Full speed must be reached before the first release: lower the top
	// speed for a short move. The distance is V*(ts - lag_up + lag_down).
	for range 30 {
		var full, lagUp, lagDown float64
		up, full, lagUp = layout(imps, v)
		down, _, lagDown = layout(rev, v)
		ts = d/v + lagUp - lagDown
		if ts+down[0] >= full {
			break
		}
		v *= 0.97
	}
	cum := make([]float64, n)
	c := 0.0
	for i, im := range imps {
		c += im.A
		cum[i] = c
	}
	press := up
	var steps []scenario.SpeedStep
	var ms []motion.Step
	o := &Option{Key: key, Label: label, Drive: scenario.DrivePendant, Shaper: kind}
	addStep := func(t, frac float64) {
		sp := sign * frac * v * rq.axisUnit()
		if math.Abs(frac) < 1e-12 {
			sp = 0
		}
		if k := len(o.Presses); k > 0 && t-o.Presses[k-1].AtS < 1e-9 {
			// Two steps at one moment: press straight to the second.
			steps, ms, o.Presses = steps[:k-1], ms[:k-1], o.Presses[:k-1]
		}
		st := scenario.SpeedStep{AtS: t}
		if rq.slew {
			st.RateDegPerS = &sp
		} else {
			st.SpeedMPerS = &sp
		}
		steps = append(steps, st)
		ms = append(ms, motion.Step{AtS: t, Speed: sign * frac * v})
		o.Presses = append(o.Presses, Press{AtS: t, Pct: 100 * frac, Speed: sp})
	}
	for i := range up {
		addStep(up[i], cum[i])
	}
	for j := range down {
		rest := 0.0 // speed left after release j: the steps below it
		if j+1 < n {
			rest = cum[n-2-j]
		}
		addStep(ts+down[j], rest)
	}
	p, err := motion.NewSteps(ms, rq.amax, rq.amax)
	if err != nil {
		// The layout found no top speed at which the releases come after
		// the presses: the move is too short for these steps.
		f := "plan.distance_m and plan.max_accel_m_per_s2"
		if rq.slew {
			f = "plan.angle_deg and plan.max_accel_deg_per_s2"
		}
		return &Option{Key: key, Label: label, Drive: scenario.DrivePendant, Shaper: kind, Settings: []string{""},
			rejected: fmt.Sprintf("%s is not offered: the move is too short for these steps at this acceleration (%s): a release would come before the last press.", label, f)}, nil
	}
	o.profile = p
	a := rq.amax
	m := scenario.Motion{Axis: rq.s.Plan.Axis, Profile: scenario.ProfileSteps}
	m.Steps = steps
	if rq.slew {
		ad := a / units.Degree
		m.AccelDegPerS2, m.DecelDegPerS2 = &ad, &ad
	} else {
		m.AccelMPerS2, m.DecelMPerS2 = &a, &a
	}
	o.Motion = m
	rq.setAccel(o, a, v)
	o.RampS = press[n-1] + imps[n-1].A*v/a
	o.MoveTimeS = p.End()
	pcts := make([]string, len(cum))
	for i, c := range cum {
		pcts[i] = fmt.Sprintf("%.0f %%", 100*c)
	}
	need := "The pendant needs speed steps at %s of %s (set the drive's step speeds to these), with the drive's ramp of %s; tuned to a sway period of %.3g s."
	if kind == "" {
		need = "The pendant's own speed steps at %s of %s, with the drive's ramp of %s; press times chosen for a sway period of %.3g s and the rope-length range."
	}
	o.Settings = []string{fmt.Sprintf(need, strings.Join(pcts, ", "), rq.speedText(v), rq.accelText(a), rq.designT)}
	for _, pr := range o.Presses {
		verb := "press to"
		if pr.AtS >= ts+down[0]-1e-9 {
			verb = "release to"
		}
		what := fmt.Sprintf("%.0f %%, %s", pr.Pct, rq.speedText(math.Abs(pr.Speed)/rq.axisUnit()))
		if pr.Pct < 1e-9 {
			what = "stop"
		}
		o.Settings = append(o.Settings, fmt.Sprintf("  at %.2f s: %s %s", pr.AtS, verb, what))
	}
	if v < rq.vmax*(1-1e-9) {
		o.Settings = append(o.Settings, fmt.Sprintf("The move is too short for the steps at full speed: the top step is lowered to %s.", rq.speedText(v)))
	}
	return o, nil
}

// curves computes the plot data in linear theory.
func curves(rq *request) Curves {
	g := units.StandardGravity
	var c Curves
	at := &c.AccelTime
	at.Basis = "linear theory: one ramp of time t_a to the top speed V leaves 2*(a/g)*|sin(pi*t_a/T)| rad with a = V/t_a (hook speed R*w for a slew)"
	const n = 121
	vHook := rq.vmax * rq.k
	for i := range n {
		q := 3 * float64(i) / (n - 1)
		at.RampS = append(at.RampS, q*rq.designT)
		at.Periods = append(at.Periods, q)
	}
	if rq.s.Load.Hook != nil {
		at.Basis += "; with a hook block, the sum over both modes of each mode's share of the load's swing times that, T the mode's period (in phase: an upper bound)"
	}
	for _, l := range rq.ropes {
		ms := rq.modesAt(l)
		s := RampSeries{RopeLengthM: l}
		for _, t := range at.RampS {
			r := 0.0
			for i, w := range ms.omega {
				tl := 2 * math.Pi / w
				ri := vHook * w / g // limit t -> 0: V*w/g
				if t > 0 {
					ri = 2 * vHook / (g * t) * math.Abs(math.Sin(math.Pi*t/tl))
				}
				r += ms.share[i] * ri
			}
			s.ResidualDeg = append(s.ResidualDeg, r/units.Degree)
		}
		at.Series = append(at.Series, s)
	}
	re := &c.RopeError
	re.Basis = "percentage residual vibration V(w, zeta) of the shaper (Singer & Seering 1990), w = sqrt(g/L)"
	if rq.s.Load.Hook != nil {
		re.Basis = "percentage residual vibration V(w, zeta) of the shaper (Singer & Seering 1990) in each mode of hook block and rigging, weighted by the mode's share of the load's swing and added (an upper bound); L is the rope to the hook"
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
	if rq.s.Load.Hook != nil {
		for _, kind := range shaper.Kinds {
			if sh, err := rq.designTwoMode(kind); err == nil {
				shapers = append(shapers, sh)
			}
		}
	}
	for _, sh := range shapers {
		s := ShaperSeries{Shaper: sh.Kind}
		for _, e := range re.ErrorPct {
			ms := rq.modesAt(ld * (1 + e/100))
			s.ResidualPct = append(s.ResidualPct, 100*ms.loadResidual(sh.Impulses, sh.Damping))
		}
		re.Series = append(re.Series, s)
	}
	return c
}

// ownPendant times the presses of the crew's own pendant steps (fractions
// c_1 < ... < c_n = 1 of top speed, so impulses A_i = c_i - c_(i-1)). In
// linear theory the residual of presses at t_i is the shaper residual
// V(w) of the impulses (A_i, t_i) (Singer & Seering 1990); the times are
// chosen to make the worst V over five sway frequencies across the rope-
// length range as small as can be (coordinate search on a grid of T/60 up
// to 1.5 T; t_1 = 0; a small weight on the last time prefers short
// sequences). Two steps come out at 0 and about T/2, the operators' rule
// (common practice), leaving |2c_1 - 1| of the vibration.
func (rq *request) ownPendant(pcts []float64) (*Option, float64, error) {
	n := len(pcts)
	imps := make([]motion.Impulse, n)
	prev := 0.0
	for i, p := range pcts {
		imps[i] = motion.Impulse{A: p/100 - prev, T: float64(i) * rq.designT / 2}
		prev = p / 100
	}
	lo, hi := rq.ropes[0], rq.ropes[0]
	for _, l := range rq.ropes {
		lo, hi = math.Min(lo, l), math.Max(hi, l)
	}
	// With a hook block both modes count, each by its share of the load's
	// swing (modeSet.loadResidual).
	var ws []modeSet
	for j := range 5 {
		l := lo + (hi-lo)*float64(j)/4
		ws = append(ws, rq.modesAt(l))
	}
	cost := func() float64 {
		worst := 0.0
		for _, w := range ws {
			worst = math.Max(worst, w.loadResidual(imps, 0))
		}
		return worst + 0.002*imps[n-1].T/rq.designT
	}
	step := rq.designT / 60
	// descend is a coordinate search from the times in imps, keeping
	// t_(i-1) <= t_i <= t_(i+1) (steps are pressed in order).
	descend := func() float64 {
		best := cost()
		for range 30 {
			improved := false
			for i := 1; i < n; i++ {
				keep := imps[i].T
				lo, hi := imps[i-1].T, 90*step
				if i+1 < n {
					hi = imps[i+1].T
				}
				for k := math.Ceil(lo/step - 1e-9); k*step <= hi+1e-9; k++ {
					imps[i].T = k * step
					if c := cost(); c < best-1e-12 {
						best, keep, improved = c, imps[i].T, true
					}
				}
				imps[i].T = keep
			}
			if !improved {
				break
			}
		}
		return best
	}
	// Starts: evenly spaced presses 1/n, 1/(n-1), ..., 1/2 of a period
	// apart (equal steps 1/n apart cancel exactly), and for three steps
	// every pair of times on the grid.
	bestCost := math.Inf(1)
	bestT := make([]float64, n)
	try := func() {
		if c := descend(); c < bestCost {
			bestCost = c
			for i := range imps {
				bestT[i] = imps[i].T
			}
		}
	}
	for m := n; m >= 2; m-- {
		for i := range imps {
			imps[i].T = float64(i) * rq.designT / float64(m)
		}
		try()
	}
	if n == 3 {
		for k2 := 0; k2 <= 90; k2 += 3 {
			for k3 := k2; k3 <= 90; k3 += 3 {
				imps[1].T, imps[2].T = float64(k2)*step, float64(k3)*step
				if c := cost(); c < bestCost {
					try()
				}
			}
		}
	}
	for i := range imps {
		imps[i].T = bestT[i]
	}
	worst := 0.0
	for _, w := range ws {
		worst = math.Max(worst, w.loadResidual(imps, 0))
	}
	words := make([]string, n)
	for i, p := range pcts {
		words[i] = fmt.Sprintf("%.3g %%", p)
	}
	o, err := rq.pendant("own_pendant", "Your pendant steps ("+strings.Join(words, ", ")+") timed for the sway", "", imps)
	if err != nil {
		return nil, 0, err
	}
	o.Settings = append(o.Settings, fmt.Sprintf("Linear theory: these press times leave at most %.2g %% of the swing an instant press to full speed would leave, over the rope-length range.", 100*worst))
	if rq.s.Load.Hook != nil {
		o.ModeResidualPct = rq.modeResidual(imps, 0)
		if rq.share2 >= MinSecondShare {
			o.TwoMode = true
			o.Settings = append(o.Settings, fmt.Sprintf("The times are chosen for both sway modes of hook block and rigging (%.3g s and %.3g s), each weighted by its share of the load's swing: they leave at most %.2g %% and %.2g %% in each mode.",
				rq.designT, rq.designT2, o.ModeResidualPct[0], o.ModeResidualPct[1]))
		}
	}
	return o, worst, nil
}
