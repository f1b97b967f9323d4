package main

import (
	"math"
	"slices"

	"swaysheet/core/crane"
	"swaysheet/core/ode"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// The floor kernel: what integrating a travel scenario costs at the least,
// as a yardstick for the core's evaluation. It integrates the same
// equation of motion (rope direction n and u = dn/dt, rope of fixed
// length, suspension point on travel moves with trapezoidal speed) with
// the same Dormand-Prince 5(4) pair, error control, tolerances, restarts at
// every breakpoint and projection after every step as the core, on
// fixed-size arrays with the right-hand side written inline; and nothing
// else: no peak search, no dense output, no figures, no checks. It is kept
// apart from the core's code on purpose: a yardstick must not share the
// code it measures. The one exception is the step-size control's
// arithmetic (ode.StepControl), the least any stepper with this control
// must do between two steps; a copy of it here would time the same
// instructions, and the floor with a slower control of its own would no
// longer be the least.

// floorRun is the travel scenario reduced to what the kernel needs: the
// acceleration of each axis between consecutive breakpoints.
type floorRun struct {
	cuts   []float64    // segment ends, ascending, the last is the run's end
	acc    [][2]float64 // suspension acceleration (x, y) in each segment
	l      float64      // rope length, m
	relTol float64
	steps  int // accepted steps of the last run
}

// newFloorRun prepares s, which must have travel moves only (trapezoids),
// no wind, no hoist and no initial swing; ok is false otherwise.
func newFloorRun(s *scenario.Scenario) (f *floorRun, ok bool) {
	if s.Load.Hook != nil || s.Wind != nil || s.Initial != nil || s.Load.DragCoefficient != 0 {
		return nil, false
	}
	// Per axis: the move's start, end of ramp up, start of ramp down, end,
	// and the signed accelerations of the two ramps.
	type ramp struct{ t1, t2, t3, t4, a, d float64 }
	var axes [2][]ramp
	for i := range s.Motions {
		m := &s.Motions[i]
		if (m.Profile != "" && m.Profile != scenario.ProfileTrapezoid) || m.Shaper != nil {
			return nil, false
		}
		ax, _ := crane.Of(m.Axis)
		k := 0
		switch {
		case ax.Role == crane.AlongX && ax.Kind == crane.Linear:
		case ax.Role == crane.AlongY && ax.Kind == crane.Linear:
			k = 1
		default:
			return nil, false
		}
		p := sway.Profile(m)
		v := p.PeakSpeed()
		sg := math.Copysign(1, p.Distance)
		axes[k] = append(axes[k], ramp{p.Start, p.Start + v/p.Accel, p.End() - v/p.Decel, p.End(), sg * p.Accel, -sg * p.Decel})
	}
	res, err := sway.EvaluateWith(s, sway.Options{NoHistory: true, General: true})
	if err != nil {
		return nil, false
	}
	f = &floorRun{l: *s.Load.RopeLengthM, relTol: res.Solver.RelTol}
	var bs []float64
	for _, rs := range axes {
		for _, r := range rs {
			bs = append(bs, r.t1, r.t2, r.t3, r.t4)
		}
	}
	slices.Sort(bs)
	for _, b := range bs {
		if b > 1e-12 && b < res.RunS-1e-12 {
			f.cuts = append(f.cuts, b)
		}
	}
	f.cuts = append(slices.Compact(f.cuts), res.RunS)
	t := 0.0
	for _, c := range f.cuts {
		mid := 0.5 * (t + c)
		var a [2]float64
		for k, rs := range axes {
			for _, r := range rs {
				switch {
				case mid > r.t1 && mid < r.t2:
					a[k] += r.a
				case mid > r.t3 && mid < r.t4:
					a[k] += r.d
				}
			}
		}
		f.acc = append(f.acc, a)
		t = c
	}
	return f, true
}

// run integrates from rest to the end and returns the final state.
func (f *floorRun) run() [6]float64 {
	const g = units.StandardGravity
	y := [6]float64{0, 0, -1, 0, 0, 0}
	il := 1 / f.l
	rtol, atol := f.relTol, f.relTol*1e-2
	var ax, ay float64
	rhs := func(y, dy *[6]float64) {
		radial := -ax*y[0] - ay*y[1] - g*y[2]
		uu := y[3]*y[3] + y[4]*y[4] + y[5]*y[5]
		cn := -radial*il - uu
		dy[0], dy[1], dy[2] = y[3], y[4], y[5]
		dy[3] = -ax*il + cn*y[0]
		dy[4] = -ay*il + cn*y[1]
		dy[5] = -g*il + cn*y[2]
	}
	meanSquare := func(y0, y1, e *[6]float64) float64 {
		var sum float64
		for i := range 6 {
			a, b := y0[i], y1[i]
			if a < 0 {
				a = -a
			}
			if b < 0 {
				b = -b
			}
			if b > a {
				a = b
			}
			r := e[i] * (1 / (atol + rtol*a))
			sum += r * r
		}
		return sum * (1.0 / 6)
	}
	var ctl ode.StepControl
	var k [7][6]float64
	var tmp, yn [6]float64
	t, h := 0.0, 0.0
	f.steps = 0
	for s, cut := range f.cuts {
		ax, ay = f.acc[s][0], f.acc[s][1]
		rhs(&y, &k[0])
		ctl.Restart()
		if h == 0 {
			h = 1e-3 // the core's starting heuristic is not the point here
		}
		for t < cut {
			last := false
			hh := h
			if hh >= (cut-t)*(1-1e-12) {
				hh, last = cut-t, true
			}
			for i := range 6 {
				tmp[i] = y[i] + hh*0.2*k[0][i]
			}
			rhs(&tmp, &k[1])
			for i := range 6 {
				tmp[i] = y[i] + hh*(3.0/40*k[0][i]+9.0/40*k[1][i])
			}
			rhs(&tmp, &k[2])
			for i := range 6 {
				tmp[i] = y[i] + hh*(44.0/45*k[0][i]-56.0/15*k[1][i]+32.0/9*k[2][i])
			}
			rhs(&tmp, &k[3])
			for i := range 6 {
				tmp[i] = y[i] + hh*(19372.0/6561*k[0][i]-25360.0/2187*k[1][i]+64448.0/6561*k[2][i]-212.0/729*k[3][i])
			}
			rhs(&tmp, &k[4])
			for i := range 6 {
				tmp[i] = y[i] + hh*(9017.0/3168*k[0][i]-355.0/33*k[1][i]+46732.0/5247*k[2][i]+49.0/176*k[3][i]-5103.0/18656*k[4][i])
			}
			rhs(&tmp, &k[5])
			for i := range 6 {
				yn[i] = y[i] + hh*(35.0/384*k[0][i]+500.0/1113*k[2][i]+125.0/192*k[3][i]-2187.0/6784*k[4][i]+11.0/84*k[5][i])
			}
			rhs(&yn, &k[6])
			for i := range 6 {
				tmp[i] = hh * (71.0/57600*k[0][i] - 71.0/16695*k[2][i] + 71.0/1920*k[3][i] - 17253.0/339200*k[4][i] + 22.0/525*k[5][i] - 1.0/40*k[6][i])
			}
			// The core's step control, the same arithmetic.
			ratio, accept := ctl.Next(meanSquare(&y, &yn, &tmp))
			if !accept {
				h = hh * ratio
				continue
			}
			f.steps++
			y = yn
			k[0] = k[6]
			// Projection onto |n| = 1, n.u = 0.
			nn := math.Sqrt(y[0]*y[0] + y[1]*y[1] + y[2]*y[2])
			y[0], y[1], y[2] = y[0]/nn, y[1]/nn, y[2]/nn
			d := y[0]*y[3] + y[1]*y[4] + y[2]*y[5]
			y[3], y[4], y[5] = y[3]-d*y[0], y[4]-d*y[1], y[5]-d*y[2]
			if last {
				t = cut
			} else {
				t += hh
			}
			h = hh * ratio
		}
	}
	return y
}
