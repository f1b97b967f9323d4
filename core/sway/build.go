package sway

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// setup is a scenario turned into a model ready to integrate.
type setup struct {
	model       pendulum.System
	y0          []float64
	breaks      []float64 // restart times, ascending, within [0, end]
	motionEnd   float64   // last motion at rest
	activityEnd float64   // last motion or wind change
	ropeEnd     float64   // rope length when all motion has ended, m
	ropeStart   float64
	windForce   float64 // N, while the wind blows
	air         *Air    // wind and drag; nil when neither
	phases      []Phase
	warnings    []words.Sentence
	drives      crane.Drives // each axis' moves
	fast        *fastModel   // the specialised path's model, nil when it does not fit
	// general builds model when the specialised path is set up instead
	// (nil otherwise): model is nil until then.
	general func() pendulum.System
}

func deref(p *float64, def float64) float64 {
	if p == nil {
		return def
	}
	return *p
}

// Profile builds the trapezoidal profile of one validated move, in the
// axis' SI unit (m or rad), from its distance, speed and ramps (start_s
// included, shaper not). BuildProfile builds every profile kind.
func Profile(m *scenario.Motion) *motion.Trapezoid {
	d, _ := m.Drive()     // Validate rejects unknown axes first
	f := d.Axis.Kind.ToSI // 1 for metres: x*1 is x exactly
	return motion.NewTrapezoid(m.StartS, *d.Distance*f, *d.Speed*f, *d.Accel*f, deref(d.Decel, *d.Accel)*f)
}

// kindOf is the kind of a validated move's axis.
func kindOf(m *scenario.Motion) *crane.Kind {
	a, _ := crane.Of(m.Axis)
	return a.Kind
}

func build(s *scenario.Scenario, validate bool) (*setup, error) {
	if validate {
		if err := s.Validate(); err != nil {
			return nil, err
		}
	}
	su := &setup{}
	var ax crane.Drives
	var breaks []float64
	for i := range s.Motions {
		m := &s.Motions[i]
		p, err := BuildProfile(s, m)
		if err != nil {
			return nil, err
		}
		if err := moveTooLong(i, m, p); err != nil {
			return nil, err
		}
		axis, _ := crane.Of(m.Axis) // Validate rejects unknown axes first
		sum := ax.Of(axis)
		*sum = append(*sum, p)
		breaks = append(breaks, p.Breakpoints()...)
		su.motionEnd = math.Max(su.motionEnd, p.End())
		if w, ok := profileWarning(i, m, p, s.Crane.Kind); ok {
			su.warnings = append(su.warnings, w)
		}
		su.phases = append(su.phases, phaseOf(i, m.Axis, p))
	}
	su.activityEnd = su.motionEnd

	l0 := *s.Load.RopeLengthM
	mass := *s.Load.MassKg
	r0 := s.Crane.RadiusM

	// The rope's and the radius' moves added together, evaluated at a cost
	// that does not grow with the number of moves and shaper impulses; the
	// other axes' are combined when the general path runs (combinedAxes).
	hoist, reach := combined(ax[crane.Rope]), combined(ax[crane.Reach])
	su.drives = ax

	// The rope and the radius must stay in range over the whole run.
	if err := checkSpan(hoist, func(h float64) float64 { return l0 - h }, scenario.MinRopeM, 500,
		"load.rope_length_m", "the rope length", "m"); err != nil {
		return nil, err
	}
	if b := s.Load.Body; b != nil && b.Tandem != nil {
		// Each hook rope follows the rope length: L(t) + (l_i - L0).
		for i, l := range s.TandemLengths() {
			extra := l - l0
			if err := checkSpan(hoist, func(h float64) float64 { return l0 - h + extra }, scenario.MinRopeM, 500,
				fmt.Sprintf("load.body.tandem.ropes[%d].length_m", i), fmt.Sprintf("hook rope %d's length", i+1), "m"); err != nil {
				return nil, err
			}
		}
	}
	if err := checkSpan(reach, func(d float64) float64 { return r0 + d }, 0, scenario.MaxRadiusM,
		"crane.radius_m", "the slew radius", "m"); err != nil {
		return nil, err
	}
	su.ropeStart = l0
	su.ropeEnd = l0 - hoist.At(su.motionEnd+1).Pos
	if len(ax[crane.Turn]) > 0 && r0 == 0 && len(ax[crane.Reach]) == 0 {
		su.warnings = append(su.warnings, words.Say("The crane slews with the load at radius {0}: slewing then does not move the suspension point. Set crane.radius_m to the hook radius.", words.Length(0)))
	}

	// Wind and drag (air.go).
	air, err := NewAir(s)
	if err != nil {
		return nil, err
	}
	if air != nil {
		su.windForce = air.ForceN
		su.air = air
		breaks = append(breaks, air.Breaks()...)
		su.activityEnd = math.Max(su.activityEnd, air.LastChange())
	}

	var force func(t float64, pos, vel r3.Vec) r3.Vec
	if air != nil {
		force = func(t float64, _, vel r3.Vec) r3.Vec { return air.Force(t, vel) }
	}
	hook := s.Load.Hook
	if s.Load.Body == nil && hook == nil {
		su.fast = newFastModel(&ax, l0, s.Crane.Start(), mass, air)
	}
	if su.fast != nil {
		// The general path's model is built only when it runs (Options.General):
		// combining the profiles into the suspension point's motion costs
		// more than the specialised path's whole set-up (in wasm most of all).
		su.general = func() pendulum.System {
			return &pendulum.Model{Mass: mass, Suspension: ax.Suspension(s.Crane.Start()), Rope: ax.RopeLength(l0), Force: force}
		}
	}
	var susp func(float64) pendulum.Kinematics
	var rope func(float64) (float64, float64, float64)
	if su.fast == nil && (s.Load.Body != nil || hook == nil) {
		susp, rope = ax.Suspension(s.Crane.Start()), ax.RopeLength(l0)
	}
	if s.Load.Body != nil {
		r, y0, err := rigidModel(s, susp, rope, force, ax[crane.Turn])
		if err != nil {
			return nil, err
		}
		r.Travel = travelOf(&ax, l0, s.Crane.Start())
		su.model, su.y0, su.breaks = r, y0, breaks
		return su, nil
	}
	if hook == nil {
		if su.fast == nil {
			su.model = &pendulum.Model{Mass: mass, Suspension: susp, Rope: rope, Force: force}
		}
	} else {
		general := func() pendulum.System {
			return &pendulum.Double{M1: *hook.MassKg, M2: mass, L2: *hook.RiggingLengthM,
				Suspension: ax.Suspension(s.Crane.Start()), Rope: ax.RopeLength(l0), Force: force}
		}
		// The concrete two-mass model (fastdouble.go) when the suspension
		// point's motion flattens into span tables; the general one else.
		if k := newFastModel(&ax, l0, s.Crane.Start(), mass, air); k != nil {
			su.model, su.general = newFastDouble(k, *hook.MassKg, mass, *hook.RiggingLengthM, units.StandardGravity), general
		} else {
			su.model = general()
		}
	}

	// Initial state.
	var in scenario.Initial
	if s.Initial != nil {
		in = *s.Initial
	}
	if hook == nil {
		su.y0 = pendulum.StateFromSwing(in.SwingDeg*units.Degree, in.TowardDeg*units.Degree,
			in.VelocityXMPerS, in.VelocityYMPerS, l0)
	} else {
		su.y0 = pendulum.DoubleStateFromSwing(in.SwingDeg*units.Degree, in.TowardDeg*units.Degree,
			in.VelocityXMPerS, in.VelocityYMPerS, l0, *hook.RiggingLengthM)
	}
	su.breaks = breaks
	return su, nil
}

// combined is the moves of one axis added together (motion.Combine), or
// the empty sum when there are none (at rest, +0 everywhere, as Combine's;
// its index is not built for nothing).
func combined(ps motion.Sum) motion.Profile {
	if len(ps) == 0 {
		return ps
	}
	return motion.Combine(ps...)
}

// combinedAxes is each axis' moves combined, for the general path's work
// budget (budget.go, which counts their moving pieces).
func (su *setup) combinedAxes() []motion.Profile {
	axes := make([]motion.Profile, 0, len(su.drives))
	for r := range su.drives {
		axes = append(axes, motion.Combine(su.drives[r]...))
	}
	return axes
}

// WindForceN is the steady wind force on the load of a validated scenario,
// given directly or as q*A*c with q = 0.5*rho*v^2; zero without wind.
func WindForceN(s *scenario.Scenario) float64 {
	w := s.Wind
	if w == nil {
		return 0
	}
	if w.ForceN != nil {
		return *w.ForceN
	}
	rho := w.AirDensityKgPerM3
	if rho == 0 {
		rho = units.AirDensity
	}
	return 0.5 * rho * *w.SpeedMPerS * *w.SpeedMPerS * s.Load.AreaM2 * w.ShapeFactor
}

// checkSpan reports an error if value(position of the summed profile)
// leaves [lo, hi] at any time up to end.
//
// Between two breakpoints every profile is a polynomial of degree three
// at most (constant jerk), so the position is a cubic there and its speed
// v(u) = v0 + a0 u + j u²/2 a quadratic, with j from the accelerations at
// the two ends. The position's extremes inside the span are at the roots
// of that quadratic, found exactly; with the span ends they are every
// candidate.
func checkSpan(p motion.Profile, value func(float64) float64, lo, hi float64, field, what, unit string) error {
	bp := p.Breakpoints()
	if len(bp) == 0 {
		return nil
	}
	ts := append([]float64(nil), bp...)
	for i := 0; i+1 < len(bp); i++ {
		a, b := bp[i], bp[i+1]
		h := b - a
		e := 1e-9 * h
		sa, sb := p.At(a+e), p.At(b-e)
		j := (sb.Acc - sa.Acc) / (h - 2*e)
		for _, u := range quadRoots(j/2, sa.Acc, sa.Vel) {
			if u > 0 && u < h-2*e {
				ts = append(ts, a+e+u)
			}
		}
	}
	worst, at, bad := 0.0, 0.0, false
	for _, t := range ts {
		v := value(p.At(t).Pos)
		over := math.Max(lo-v, v-hi)
		if over > 1e-9 && (!bad || over > math.Max(lo-worst, worst-hi)) {
			worst, at, bad = v, t, true
		}
	}
	if bad {
		return scenario.Errors{{Field: field, Message: fmt.Sprintf(
			"the motions take %s to %.4g %s at t = %.4g s: it must stay from %g to %g %s", what, worst, unit, at, lo, hi, unit)}}
	}
	return nil
}

// quadRoots returns the real roots of a x² + b x + c (of b x + c when a is
// 0, or nothing when both are), computed without cancellation.
func quadRoots(a, b, c float64) []float64 {
	if a == 0 {
		if b == 0 {
			return nil
		}
		return []float64{-c / b}
	}
	d := b*b - 4*a*c
	if d < 0 {
		return nil
	}
	q := -0.5 * (b + math.Copysign(math.Sqrt(d), b))
	if q == 0 {
		return []float64{0}
	}
	return []float64{q / a, c / q}
}
