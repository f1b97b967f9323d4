package sway

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// Air is the air's force on the load: the wind and the air drag of a
// scenario, as scenario.Wind documents them. With s(t) the wind speed's
// fraction of full (0 to 1, linear over the ramps), e the unit vector the
// wind blows toward, F_w the wind force on the load at rest at full wind,
// V the full air speed and k = 0.5*rho*c_d*A the drag factor,
//
//	air velocity  w(t)    = s(t) * V * e
//	force         F(t, v) = s^2*F_w*e - k*( |v - w|(v - w) + s^2*V^2*e )
//
// for a load moving at ground velocity v. The drag is on the speed relative
// to the air, less the drag the load at rest would feel, which the wind
// force already holds: at v = 0 the force is s^2*F_w*e whatever k is. V is
// the typed wind speed; for a typed force with drag it is the speed whose
// drag on the load at rest is that force, V = sqrt(F_w/k), so that the
// force is then exactly -k*|v - w|(v - w). Without drag the force is
// s^2*F_w*e, without wind -k*|v|*v (the air still). Everything but the
// |v - w| is polynomial in t between the ramps' corners (Breaks).
//
// Linearised about the load at rest in a steady wind (v small against V),
// the drag adds the damping force -k*V*(dv + (e.dv) e): twice k*V along
// the wind, k*V across it. DampingRatio gives what that does to a small
// swing about the wind's lean.
type Air struct {
	Dir       r3.Vec  // unit vector the wind blows toward (horizontal)
	ForceN    float64 // F_w, the steady force on the load at rest, N
	AirSpeed  float64 // V, m/s (zero without wind or without drag and speed)
	DragK     float64 // k = 0.5*rho*c_d*A, N per (m/s)^2; zero without drag
	StartS    float64 // wind on from here; +Inf without wind
	DurationS float64 // zero: to the end of the run
	RampS     float64 // rise and fall time; zero: steps
}

// maxAirSpeed is the largest air speed the model accepts, m/s: the range of
// wind.speed_m_per_s, also for the speed a typed force implies with drag.
var maxAirSpeed = scenario.Ranges["wind.speed_m_per_s"].Max

// NewAir returns the air's force of a validated scenario, or nil when it
// has neither wind nor drag. The error names the fields when a typed wind
// force with drag implies an air speed above the accepted wind speeds.
func NewAir(s *scenario.Scenario) (*Air, error) {
	rho := units.AirDensity
	w := s.Wind
	if w != nil && w.AirDensityKgPerM3 > 0 {
		rho = w.AirDensityKgPerM3
	}
	a := &Air{StartS: math.Inf(1), DragK: 0.5 * rho * s.Load.DragCoefficient * s.Load.AreaM2}
	if w == nil {
		if a.DragK == 0 {
			return nil, nil
		}
		return a, nil
	}
	th := w.TowardDeg * units.Degree
	a.Dir = r3.Vec{X: math.Cos(th), Y: math.Sin(th)}
	a.ForceN = WindForceN(s)
	a.StartS, a.DurationS, a.RampS = w.StartS, w.DurationS, w.RampS
	switch {
	case w.SpeedMPerS != nil:
		a.AirSpeed = *w.SpeedMPerS
	case a.DragK > 0:
		a.AirSpeed = math.Sqrt(a.ForceN / a.DragK)
		if a.AirSpeed > maxAirSpeed {
			return nil, scenario.Errors{{Field: "wind.force_n", Message: fmt.Sprintf(
				"with load.drag_coefficient %g on load.area_m2 %g m² the air would have to blow at %.4g m/s to push the load with %g N (at most %g m/s): give the wind as wind.speed_m_per_s with wind.shape_factor, or check the drag coefficient and the area",
				s.Load.DragCoefficient, s.Load.AreaM2, a.AirSpeed, a.ForceN, maxAirSpeed)}}
		}
	}
	return a, nil
}

// Strength is s(t), the wind speed's fraction of full at time t, 0 to 1:
// clamp((t - start)/ramp) - clamp((t - start - duration)/ramp), steps when
// the ramp is zero; the second term only with a duration.
func (a *Air) Strength(t float64) float64 {
	r := a.rise(t - a.StartS)
	if a.DurationS > 0 {
		r -= a.rise(t - a.StartS - a.DurationS)
	}
	return r
}

// rise is 0 before 0, 1 after the ramp, linear between (a step at 0 when
// the ramp is zero, on from 0 itself).
func (a *Air) rise(s float64) float64 {
	switch {
	case s < 0:
		return 0
	case s >= a.RampS:
		return 1
	}
	return s / a.RampS
}

// Force is the air's force on the load moving at ground velocity vel at
// time t, N.
func (a *Air) Force(t float64, vel r3.Vec) r3.Vec {
	s := a.Strength(t)
	f := r3.Scale(s*s*a.ForceN, a.Dir)
	if a.DragK == 0 {
		return f
	}
	rel := r3.Sub(vel, r3.Scale(s*a.AirSpeed, a.Dir))
	// -k*(|rel| rel + s^2 V^2 e)
	d := r3.Add(r3.Scale(r3.Norm(rel), rel), r3.Scale(s*s*a.AirSpeed*a.AirSpeed, a.Dir))
	return r3.Sub(f, r3.Scale(a.DragK, d))
}

// Breaks are the times at which the wind speed's fraction has a corner: its
// start, the end of its rise and, with a duration, the start and end of its
// fall. None without wind.
func (a *Air) Breaks() []float64 {
	if math.IsInf(a.StartS, 1) {
		return nil
	}
	b := []float64{a.StartS}
	if a.RampS > 0 {
		b = append(b, a.StartS+a.RampS)
	}
	if a.DurationS > 0 {
		b = append(b, a.StartS+a.DurationS)
		if a.RampS > 0 {
			b = append(b, a.StartS+a.DurationS+a.RampS)
		}
	}
	return b
}

// LastChange is the time after which the wind no longer changes (the last
// of Breaks), or -Inf without wind.
func (a *Air) LastChange() float64 {
	last := math.Inf(-1)
	for _, b := range a.Breaks() {
		last = math.Max(last, b)
	}
	return last
}

// DampingRatio is the damping ratio the drag gives a small swing of one
// rope about the steady wind's lean, along the wind and across it, from
// the linearised drag above. The load (mass m) on rope l leans by th with
// tan(th) = F_w/(m*g); it swings at w = sqrt(g_eff/l) with
// g_eff = sqrt(g^2 + (F_w/m)^2). Its velocity along the swing is tilted by
// th from the horizontal, so the along-wind damping force on it is
// k*V*(1 + cos^2(th)) per unit speed, across the wind k*V; the ratios are
// those over 2*m*w. Zero without drag or air speed.
func (a *Air) DampingRatio(m, l float64) (along, across float64) {
	if a == nil || a.DragK == 0 || a.AirSpeed == 0 {
		return 0, 0
	}
	g := units.StandardGravity
	fm := a.ForceN / m
	geff := math.Hypot(g, fm)
	w := math.Sqrt(geff / l)
	c2 := g * g / (geff * geff) // cos^2 of the lean
	kv := a.DragK * a.AirSpeed
	return kv * (1 + c2) / (2 * m * w), kv / (2 * m * w)
}
