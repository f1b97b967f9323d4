package sway

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// The rule of scenario.Wind: at rest the air's force is s(t)^2*F_w*e with or
// without drag (nothing counted twice); a typed force with drag, or a speed
// whose shape factor is the drag coefficient, gives exactly the drag on the
// speed relative to the air, -k*|v - w|(v - w). Checked against the
// formulas written out here (the documentation, not the code).
func TestAirForceRule(t *testing.T) {
	vel := r3.Vec{X: 0.7, Y: -0.4, Z: 0.1}
	for _, c := range []struct {
		name string
		load scenario.Load
		wind scenario.Wind
	}{
		{"speed, drag = shape factor", scenario.Load{AreaM2: 12, DragCoefficient: 1.5}, scenario.Wind{SpeedMPerS: f(12), ShapeFactor: 1.5, TowardDeg: 30, RampS: 4, StartS: 1}},
		{"speed, other drag", scenario.Load{AreaM2: 12, DragCoefficient: 1.1}, scenario.Wind{SpeedMPerS: f(12), ShapeFactor: 1.5, TowardDeg: 30, RampS: 4, StartS: 1}},
		{"force with drag", scenario.Load{AreaM2: 15, DragCoefficient: 1.3}, scenario.Wind{ForceN: f(6000), TowardDeg: 100, RampS: 4, StartS: 1}},
		{"force, no drag", scenario.Load{AreaM2: 15}, scenario.Wind{ForceN: f(6000), TowardDeg: 100, RampS: 4, StartS: 1}},
	} {
		s := still(4000, 25)
		c.load.MassKg, c.load.RopeLengthM = s.Load.MassKg, s.Load.RopeLengthM
		s.Load = c.load
		s.Wind = &c.wind
		a, err := NewAir(s)
		if err != nil {
			t.Fatal(err)
		}
		fw := WindForceN(s)
		e := r3.Vec{X: math.Cos(c.wind.TowardDeg * units.Degree), Y: math.Sin(c.wind.TowardDeg * units.Degree)}
		k := 0.5 * units.AirDensity * c.load.DragCoefficient * c.load.AreaM2
		for _, tt := range []float64{0, 1, 2, 3, 5, 50} {
			sp := math.Min(1, math.Max(0, (tt-1)/4))
			if got, want := a.Force(tt, r3.Vec{}), r3.Scale(sp*sp*fw, e); r3.Norm(r3.Sub(got, want)) > 1e-12*fw {
				t.Errorf("%s: at rest, t = %g: force %v, want s^2*F_w*e = %v", c.name, tt, got, want)
			}
			exact := c.wind.ForceN != nil || c.load.DragCoefficient == c.wind.ShapeFactor
			if k == 0 || !exact {
				continue
			}
			rel := r3.Sub(vel, r3.Scale(sp*math.Sqrt(fw/k), e))
			want := r3.Scale(-k*r3.Norm(rel), rel)
			if got := a.Force(tt, vel); r3.Norm(r3.Sub(got, want)) > 1e-12*fw {
				t.Errorf("%s: moving, t = %g: force %v, want -k|v-w|(v-w) = %v", c.name, tt, got, want)
			}
		}
	}
}

// Source: steady wind lean atan(F/(m*g)) (exact statics, any mechanics
// text), with F = 0.5*rho*v^2*A*c (the form used in EN 13001-2, rho =
// 1.25 kg/m^3; from memory). A load started at that lean in a steady wind
// stays there, with drag on the speed relative to the air whatever the
// drag coefficient: the steady force is the wind force, counted once.
func TestWindLeanWithDrag(t *testing.T) {
	for _, cd := range []float64{0, 1.5, 0.8} {
		s := still(4000, 25)
		s.Load.AreaM2, s.Load.DragCoefficient = 12, cd
		s.Wind = &scenario.Wind{SpeedMPerS: f(12), ShapeFactor: 1.5, TowardDeg: 90}
		force := 0.5 * 1.25 * 12 * 12 * 12 * 1.5
		lean := math.Atan(force/(4000*g)) / units.Degree
		s.Initial = &scenario.Initial{SwingDeg: lean, TowardDeg: 90}
		s.Settings = &scenario.Settings{Accuracy: "tight", DurationS: 60}
		r := mustEval(t, s)
		if math.Abs(r.WindForceN/force-1) > 1e-12 {
			t.Errorf("drag %g: wind force %v N, want %v N", cd, r.WindForceN, force)
		}
		worst := 0.0
		for _, sw := range r.History.SwingDeg {
			worst = math.Max(worst, math.Abs(sw-lean))
		}
		t.Logf("drag %g: largest distance from the lean atan(F/mg) = %.6f deg over 60 s: %.2g deg", cd, lean, worst)
		if worst > 1e-10 {
			t.Errorf("drag %g: the load moves %.3g deg from the steady lean atan(F/mg) = %.10f deg", cd, worst, lean)
		}
	}
}

// Source: the drag linearised about the load at rest in a steady wind
// (v_rel = -v_wind) is the damping force -k*V*(dv + (e.dv) e), k =
// 0.5*rho*c*A (a first-order Taylor expansion of -k|v|v); a small swing
// about the lean then decays as exp(-zeta*w*t) with zeta from
// Air.DampingRatio (linear damped oscillator, any vibrations text). The
// simulated swing about the lean, along the wind and across it, is held
// against that decay over six periods.
func TestWindDampingDecay(t *testing.T) {
	const m, l = 4000.0, 25.0
	force := 0.5 * 1.25 * 12 * 12 * 12 * 1.5
	lean := math.Atan(force / (m * g))
	for _, along := range []bool{true, false} {
		s := still(m, l)
		s.Load.AreaM2, s.Load.DragCoefficient = 12, 1.5
		s.Wind = &scenario.Wind{SpeedMPerS: f(12), ShapeFactor: 1.5, TowardDeg: 90}
		// Start at the lean, moved by 1 deg along the wind or pushed
		// across it (x) at the speed of a 1 deg swing.
		geff := math.Hypot(g, force/m)
		w := math.Sqrt(geff / l)
		if along {
			s.Initial = &scenario.Initial{SwingDeg: lean/units.Degree + 1, TowardDeg: 90}
		} else {
			s.Initial = &scenario.Initial{SwingDeg: lean / units.Degree, TowardDeg: 90, VelocityXMPerS: w * l * units.Degree}
		}
		period := 2 * math.Pi / w
		s.Settings = &scenario.Settings{Accuracy: "tight", DurationS: 6 * period, Samples: 5000}
		r := mustEval(t, s)
		a, _ := NewAir(s)
		zAlong, zAcross := a.DampingRatio(m, l)
		zeta := zAcross
		if along {
			zeta = zAlong
		}
		// Amplitude of the swing about the lean: the largest distance of
		// the load from its steady place in each half period.
		h := r.History
		px := l * math.Sin(lean) // steady place: y = l*sin(lean), z = -l*cos(lean)
		var amps, times []float64
		half := period / 2
		for k := 0; (float64(k)+1)*half <= h.TimeS[len(h.TimeS)-1]; k++ {
			best, at := 0.0, 0.0
			for i, tt := range h.TimeS {
				if tt < float64(k)*half || tt >= float64(k+1)*half {
					continue
				}
				d := math.Hypot(math.Hypot(h.RelXM[i], h.RelYM[i]-px), h.RelZM[i]+l*math.Cos(lean))
				if d > best {
					best, at = d, tt
				}
			}
			amps, times = append(amps, best), append(times, at)
		}
		// Decay rate from the first and last amplitude.
		n := len(amps) - 1
		rate := math.Log(amps[0]/amps[n]) / (times[n] - times[0])
		want := zeta * w
		t.Logf("along %v: zeta %.5f (linearised), decay rate %.6f 1/s simulated, %.6f 1/s linearised (%.2f %%)",
			along, zeta, rate, want, 100*(rate/want-1))
		if math.Abs(rate/want-1) > 0.02 {
			t.Errorf("along %v: decay rate %.6f 1/s, linearised drag gives zeta*w = %.6f 1/s", along, rate, want)
		}
	}
}

// Source: linear theory of a forced oscillator (any vibrations text): a
// force u(t)*F that rises from 0 to F over t_r leaves a swing about the new
// lean of |integral from 0 to t_r of u'(tau) exp(-i w tau) dtau| times the
// step's (the lean itself). The wind speed rises linearly, so the force as
// u = (t/t_r)^2, and with th = w*t_r the integral is
// (2/th^2)*|(1 + i th) exp(-i th) - 1|: 1/pi at t_r = T, 1/(2 pi) at 2T,
// 2*sqrt(4 + pi^2)/pi^2 at T/2, 1 for a step. A small force keeps the
// swing linear (lean 0.3 deg).
func TestWindRamp(t *testing.T) {
	const m, l = 2000.0, 10.0
	period := 2 * math.Pi * math.Sqrt(l/g)
	force := m * g * math.Tan(0.3*units.Degree)
	lean := 0.3
	for _, c := range []struct{ ramp, want float64 }{
		{period, 1 / math.Pi}, {2 * period, 1 / (2 * math.Pi)}, {period / 2, 2 * math.Sqrt(4+math.Pi*math.Pi) / (math.Pi * math.Pi)}, {0, 1}} {
		s := still(m, l)
		s.Wind = &scenario.Wind{ForceN: f(force), StartS: 1, RampS: c.ramp}
		s.Settings = &scenario.Settings{Accuracy: "tight", Samples: 4000}
		r := mustEval(t, s)
		// The swing about the lean after the ramp has ended.
		var amp float64
		for i, tt := range r.History.TimeS {
			if tt > 1+c.ramp {
				amp = math.Max(amp, math.Abs(r.History.SwingDeg[i]-lean))
			}
		}
		got := amp / lean
		t.Logf("ramp %.4g s (T = %.4g s): swing about the lean %.6f of the lean, linear theory %.6f", c.ramp, period, got, c.want)
		if math.Abs(got-c.want) > 1e-4 {
			t.Errorf("ramp %.4g s: swing about the lean %.6f of the lean, want %.6f", c.ramp, got, c.want)
		}
	}
}

// A typed force with drag that would need an air speed past the accepted
// wind speeds is refused, naming the field.
func TestAirSpeedFromForceRange(t *testing.T) {
	s := still(4000, 25)
	s.Load.AreaM2, s.Load.DragCoefficient = 1, 0.01
	s.Wind = &scenario.Wind{ForceN: f(5000)}
	_, err := Evaluate(s)
	es, ok := err.(scenario.Errors)
	if !ok || es[0].Field != "wind.force_n" {
		t.Fatalf("want a wind.force_n error, got %v", err)
	}
	t.Log(es[0].Message)
}
