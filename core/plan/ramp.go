package plan

import (
	"math"
	"math/cmplx"

	"swaysheet/core/motion"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// A variable-speed drive's ramp is one setting for every lift: the time
// from 0 to full speed (common practice), here the plan's top speed V, so
// the acceleration is V/t_r; some drives add an S-curve rounding r (the
// s_curve profile: the trapezoid averaged over a window of r seconds).
// The planner looks for the shortest such setting, on a grid of 0.1 s for
// the ramp and 0.5 s for the rounding (coarser for very long ramps), that keeps each ramp alone within
// half the residual limit at every one of rampGrid rope lengths over the
// range, in linear theory: then the start's and the stop's residuals
// cannot add past the limit whenever the stop is called, and the setting
// does not depend on the move's length. Per ramp from 0 to v_p lasting
// t_a = v_p/a (linear theory of the pendulum with a moving support):
//
//   - travel (and a slew's tangential swing, hook acceleration R*alpha):
//     2*(a_hook/g)*|sin(w*t_a/2)| rad, times |sinc(w*r/2)| for the
//     rounding (the window average multiplies every frequency by it);
//   - a slew's outward lean R*w(t)^2/g is an equilibrium that moves as
//     the rate changes; with rate alpha*t the swing it leaves is
//     |integral of 2*R*alpha^2*t/g * exp(-i*w*t) dt over the ramp| =
//     (2*R*alpha^2/g)*|exp(-i*w*t_a)*(1 + i*w*t_a) - 1|/w^2 (the
//     response of an undamped oscillator to a moving equilibrium), the
//     same factor for the rounding as an estimate;
//   - the two are at right angles, and the larger swing of the two
//     together is at most the root of the sum of their squares.
//
// With a hook block each mode counts by its share of the load's swing.
// The linear peak (linearPeak, plus the lean at the top rate) must be
// inside the peak limits. The setting found is then simulated at every
// checked rope length, and the next longer one tried when the simulation
// disagrees.

// rampGrid is the number of rope lengths of the linear screening.
const rampGrid = 9

// rampSearch is what the ramp search runs over: the modes at rampGrid
// rope lengths ls evenly over the range, and the ramp times from the
// shortest the drive allows (to 0.1 s) up to four periods at the longest
// rope (at most 120 s).
func (rq *request) rampSearch() (grid []modeSet, ls []float64, tmin, tmax float64) {
	lo, hi := rq.ropeRange()
	grid = make([]modeSet, rampGrid)
	ls = make([]float64, rampGrid)
	for i := range grid {
		ls[i] = lo + (hi-lo)*float64(i)/(rampGrid-1)
		grid[i] = rq.modesAt(ls[i])
	}
	tmin = math.Ceil(rq.vmax/rq.amax*10-1e-9) / 10
	tmax = math.Min(120, 4*rq.periodAt(hi))
	return grid, ls, tmin, tmax
}

// rampResidual is the linear-theory residual of one ramp with ramp time
// tr (0 to full speed) and rounding r at rope length l, rad; for a slew,
// of the whole slew (slewResidual).
func (rq *request) rampResidual(tr, r float64, ms modeSet) float64 {
	g := units.StandardGravity
	a := rq.vmax / tr
	var p motion.Profile = motion.NewTrapezoid(0, rq.dist, rq.vmax, a, a)
	if r > 0 {
		p = motion.NewSCurve(0, rq.dist, rq.vmax, a, a, r)
	}
	vp := motion.NewTrapezoid(0, rq.dist, rq.vmax, a, a).PeakSpeed()
	ta := vp / a
	var tot float64
	for i, w := range ms.omega {
		var res float64
		if rq.leans() {
			res = rq.slewResidual(p, w)
		} else {
			res = 2 * (a / g) * math.Abs(math.Sin(w*ta/2))
			if x := w * r / 2; x > 1e-9 {
				res *= math.Abs(math.Sin(x) / x)
			}
		}
		tot += ms.share[i] * res
	}
	return tot
}

// slewResidual is the linear-theory swing (rad) left after the slew p at
// radius R, for a pendulum of circular frequency w: in a fixed frame the
// hook moves on the circle R*(cos phi, sin phi) with acceleration
// R*(phi”*e_t - phi'^2*e_r), and each horizontal axis is a small-angle
// pendulum driven by it, whose free swing after the forcing has the
// complex amplitude (w/g)*integral of a(t)*exp(-i*w*t) dt (any text on
// the forced undamped oscillator). The two axes swing at right angles at
// one frequency: the load runs on an ellipse whose largest radius is
// returned. In
// this frame the turning of the jib during a ramp (the direction of the
// slew's acceleration turns with it) and the outward lean's release are
// both counted. Simpson's rule on each span of the profile (4 points a
// period at least).
func slewResidual(p motion.Profile, R, w float64) float64 {
	bps := append(p.Breakpoints(), p.End())
	var x, y complex128
	for i := 0; i+1 < len(bps); i++ {
		t0, t1 := bps[i], bps[i+1]
		if t1 <= t0 {
			continue
		}
		if st := p.At(0.5 * (t0 + t1)); st.Acc == 0 && p.At(t0).Vel == p.At(t1).Vel {
			// Steady rate W: the hook's acceleration R*W^2 turns with the
			// jib, phi = phi0 + W*(t - t0), and its integral is closed.
			cx, cy := steadyTurn(p.At(t0).Pos, st.Vel, R, w, t0, t1)
			x += cx
			y += cy
			continue
		}
		n := 2 * int(math.Ceil((t1-t0)*w/(2*math.Pi)*8/2+1))
		h := (t1 - t0) / float64(n)
		// exp(-i*w*t) at t = t0 + k*h, by turning a step at a time.
		e, turn := cmplx.Exp(complex(0, -w*t0)), cmplx.Exp(complex(0, -w*h))
		for k := 0; k <= n; k++ {
			t := t0 + float64(k)*h
			st := p.At(t)
			sin, cos := math.Sincos(st.Pos)
			ax := R * (-st.Acc*sin - st.Vel*st.Vel*cos)
			ay := R * (st.Acc*cos - st.Vel*st.Vel*sin)
			wt := 2.0
			if k == 0 || k == n {
				wt = 1
			} else if k%2 == 1 {
				wt = 4
			}
			f := e * complex(wt*h/3, 0)
			x += complex(ax, 0) * f
			y += complex(ay, 0) * f
			e *= turn
		}
	}
	// x(t) = Re(X e^(iwt)), y(t) = Re(Y e^(iwt)): the largest radius of
	// that ellipse squared is (|X|^2 + |Y|^2 + |X^2 + Y^2|)/2.
	ax, ay := cmplx.Abs(x), cmplx.Abs(y)
	return w / units.StandardGravity * math.Sqrt((ax*ax+ay*ay+cmplx.Abs(x*x+y*y))/2)
}

// slewResidual is slewResidual of the request's slew radius, charged to
// the plan's budget: the quadrature's points (slewResidualPoints), each
// about as costly as 4 work units. Once the budget is spent it returns
// +Inf without computing (the option fails the screening, and the plan
// ends with the budget's message right after the screening).
func (rq *request) slewResidual(p motion.Profile, w float64) float64 {
	if !rq.budget.Spend(4 * slewResidualPoints(p, w)) {
		return math.Inf(1)
	}
	return slewResidual(p, rq.radius, w)
}

// slewResidualPoints is about the number of points slewResidual's
// quadrature takes for the slew p at circular frequency w (8 a period and
// a few per span): its work, for the budget.
func slewResidualPoints(p motion.Profile, w float64) int64 {
	return int64(p.End()*w*8/(2*math.Pi)) + 4*int64(len(p.Breakpoints())+1)
}

// rampOK reports whether one ramp setting passes the linear screening at
// each of the grid's rope lengths; unless full, it stops at the first
// that fails (those not tried then read false), trying first the rope
// length where the last setting failed: the settings are tried in order
// of ramp time, and one that fails mostly fails where the one before did
// (in the tower-slew example this saves two in five of the search's
// slew residuals, the costliest part of that plan after its
// simulations). Whether every length passes does not depend on the order.
// Unless full, the residual at that first rope length is also tried
// before the linear peak (linearRatio), which is then needed only when it
// passes: a failure there reads the same whatever the peak (nothing
// passes, and the length to try first stays the same), and most settings
// tried fail there (in the tower-slew example 2 in 3; in the bay-travel
// example, whose residual is a closed form, that saves most of the
// search's work).
func (rq *request) rampOK(tr, r float64, grid []modeSet, ls []float64, full bool) []bool {
	out := make([]bool, len(grid))
	share := 0.5 // each ramp alone within half the limit
	if rq.leans() {
		share = 0.8 // the whole slew, with room for what linear theory leaves out
	}
	first := 0
	if !full && rq.rampFailed < len(grid) {
		first = rq.rampFailed
	}
	// With full the peak first (no residual is needed without it), else
	// after the first residual, and only when that passes.
	peakOK := full && rq.linearRatio(rq.vmax/tr) <= 1
	for k := range grid {
		i := (first + k) % len(grid)
		out[i] = (peakOK || !full) && rq.rampResidual(tr, r, grid[i]) <= share*rq.resLimitRad(ls[i])
		if k == 0 && out[i] && !full {
			peakOK = rq.linearRatio(rq.vmax/tr) <= 1
		}
		out[i] = out[i] && peakOK
		if !out[i] && !full {
			if peakOK {
				rq.rampFailed = i
			}
			break
		}
	}
	return out
}

// rampSetting finds the shortest ramp (and rounding, up to maxR) passing
// the screening at every grid rope length; ok is false when none does,
// and then cover is the widest run of rope lengths one setting covers.
type rampSetting struct {
	tr, r      float64
	ok         bool
	coverLo    float64
	coverHi    float64
	candidates [][2]float64 // passing settings, shortest first
}

func (rq *request) findRamp(maxR float64) rampSetting {
	grid, ls, tmin, tmax := rq.rampSearch()
	best := rq.scanRamps(tmin, tmax, maxR, grid, ls, false)
	if len(best.candidates) == 0 {
		// None passes: again, every rope length of every setting, for the
		// widest run of lengths one setting covers.
		best = rq.scanRamps(tmin, tmax, maxR, grid, ls, true)
	}
	if len(best.candidates) > 0 {
		// Shortest total time (ramp plus rounding) first.
		c := best.candidates
		for i := range c {
			for j := i + 1; j < len(c); j++ {
				if c[j][0]+c[j][1] < c[i][0]+c[i][1] {
					c[i], c[j] = c[j], c[i]
				}
			}
		}
		best.ok, best.tr, best.r = true, c[0][0], c[0][1]
	}
	return best
}

// scanRamps tries the settings in order, up to four passing ones for each
// rounding; with full it also tracks the widest run of passing lengths.
func (rq *request) scanRamps(tmin, tmax, maxR float64, grid []modeSet, ls []float64, full bool) rampSetting {
	var best rampSetting
	bestCover := -1.0
	// The grids: 0.1 s and 0.5 s, coarser (in whole tenths) when the range
	// would take more than about 400 ramp times or 12 roundings, which
	// bounds the work for any input.
	dt := math.Max(0.1, math.Ceil((tmax-tmin)/400*10)/10)
	dr := math.Max(0.5, math.Ceil(maxR/12*2)/2)
	for r := 0.0; r <= maxR+1e-9; r += dr {
		found := 0
		for tr := tmin; tr <= tmax+1e-9 && found < 4; tr += dt {
			tr = math.Round(tr*10) / 10
			ok := rq.rampOK(tr, r, grid, ls, full)
			all := true
			// The widest run of passing lengths.
			run, start := 0, 0
			for i, x := range ok {
				if !x {
					all = false
					start = i + 1
					continue
				}
				if i-start+1 > run {
					run = i - start + 1
					if c := ls[i] - ls[start]; c > bestCover && !best.ok {
						bestCover = c
						best.tr, best.r, best.coverLo, best.coverHi = tr, r, ls[start], ls[i]
					}
				}
			}
			if all {
				best.candidates = append(best.candidates, [2]float64{tr, r})
				found++ // a few longer ones, should the simulation disagree
			}
		}
	}
	return best
}

// periodAt is the slower mode's period at rope length l.
func (rq *request) periodAt(l float64) float64 { return 2 * math.Pi / rq.modesAt(l).omega[0] }

// rampOption is the option of one ramp time tr (and S-curve rounding r).
func (rq *request) rampOption(tr, r float64) *Option {
	a := rq.vmax / tr
	var o *Option
	if r == 0 {
		o = rq.trapezoidOption("ramp_time", "One ramp time for every rope length", a, rq.vmax)
	} else {
		o = rq.trapezoidOption("ramp_time_s_curve", "One ramp time with S-curve rounding for every rope length", a, rq.vmax)
		p := motion.NewSCurve(0, rq.dist, rq.vmax, a, a, r)
		o.profile = p
		o.Motion.Profile = scenario.ProfileSCurve
		o.Motion.RoundingS = &r
		o.MoveTimeS = p.End()
		o.RampS += r
		o.SCurveRoundingS = r
	}
	o.RampTimeS = tr
	lo, hi := rq.ropeRange()
	s := say("Set the drive's ramp time (0 to full speed {0}) to {1} for starting and for stopping, one setting for every rope length from {2} to {3}.",
		rq.speedQ(rq.vmax), qTime(tr).digits(3), qLen(lo).digits(4), qLen(hi).digits(4))
	if r > 0 {
		s = say("Set the drive's ramp time (0 to full speed {0}) to {1} and its S-curve rounding to {2}, for starting and for stopping, one setting for every rope length from {3} to {4}.",
			rq.speedQ(rq.vmax), qTime(tr).digits(3), qTime(r).digits(3), qLen(lo).digits(4), qLen(hi).digits(4))
	}
	why := plain("In linear theory each ramp alone leaves at most half the residual limit at every rope length in the range, so the start and the stop cannot add past it wherever the stop is called.")
	if rq.leans() {
		why = plain("In linear theory (the hook's path in a fixed frame: the jib turning during each ramp and the outward lean's release counted) this slew leaves at most 0.8 of the residual limit at every rope length in the range; for another slew angle check again.")
	}
	o.Sentences = append([]Sentence{s, why}, o.Sentences...)
	if rq.multi() && rq.share2 >= MinSecondShare {
		// The screening weighs both modes of hook block and rigging by
		// their shares of the load's swing (rampResidual).
		o.TwoMode = true
		o.add(plain("The screening counts the sway modes " + rq.modesOf() + ", each by its share of the load's swing; " + rq.simWords() + " checks it."))
	}
	return o
}

// speedQ is a speed of the axis (SI in) as a quantity.
//
//go:noinline
func (rq *request) speedQ(v float64) Quantity {
	return Quantity{Value: rq.inAxis(v), Quantity: rq.axis.Kind.SpeedQuantity, Digits: 3}
}

// rampCandidates offer the drive's single ramp setting (and one with
// S-curve rounding when the drive has it): the shortest passing the
// screening, and when it can decide the recommendation (screen.go), the
// shortest whose simulation keeps inside the limits, trying up to four
// candidates each. When no setting passes it says which rope lengths the
// best one covers, and offers it for what it is.
func (rq *request) rampCandidates() (out []candidate, notes []Sentence) {
	maxR := rq.s.Plan.SCurveMaxRoundingS
	for _, withR := range []bool{false, true} {
		if withR && maxR <= 0 {
			continue
		}
		rs := rq.findRamp(0)
		if withR {
			rs = rq.findRamp(maxR)
			var cs [][2]float64
			for _, c := range rs.candidates {
				if c[1] > 0 {
					cs = append(cs, c)
				}
			}
			if len(cs) == 0 {
				continue // rounding does not shorten the move: the plain ramp is the answer
			}
			rs.candidates = cs
		}
		if !rs.ok {
			// Offered for what it is: the simulation at the checked
			// lengths decides whether it is within the limits, and the
			// note says what linear theory found between them.
			lo, hi := rq.ropeRange()
			if rs.tr == 0 {
				notes = append(notes, say("No single ramp time up to four sway periods keeps the swing within the limits at any rope length from {0} to {1} in linear theory.",
					qLen(lo).digits(4), qLen(hi).digits(4)))
				continue
			}
			notes = append(notes, say("Linear theory finds no single ramp time that keeps the residual swing within its screening bound from {0} to {1}; the best, {2}, covers {3} to {4}. Its option is simulated at the checked rope lengths; between them, or to be sure, narrow the rope-length range or use a shaped speed profile.",
				qLen(lo).digits(4), qLen(hi).digits(4), qTime(rs.tr).digits(3), qLen(rs.coverLo).digits(4), qLen(rs.coverHi).digits(4)))
			o := rq.rampOption(rs.tr, rs.r)
			out = append(out, candidate{o: o, verify: func(tol float64) (*Option, []string) {
				kept, _ := rq.verifyAll([]*Option{o}, tol)
				if len(kept) == 0 {
					return nil, nil
				}
				if !o.Within {
					o.Label += " (does not cover the whole range)"
				}
				return o, nil
			}})
			continue
		}
		cs := rs.candidates
		out = append(out, candidate{o: rq.rampOption(cs[0][0], cs[0][1]), verify: func(tol float64) (*Option, []string) {
			var last *Option
			for i, c := range cs {
				if i >= 4 {
					break
				}
				o := rq.rampOption(c[0], c[1])
				if kept, _ := rq.verifyAll([]*Option{o}, tol); len(kept) == 0 {
					continue
				}
				last = o
				if o.Within {
					break
				}
			}
			return last, nil
		}})
	}
	return out, notes
}

// steadyTurn is the integral over [t0, t1] of the hook's acceleration
// -R*W^2*(cos phi, sin phi), phi = phi0 + W*(t - t0), times exp(-i*w*t),
// per axis: with cos = (e^(i phi) + e^(-i phi))/2 and sin = (e^(i phi) -
// e^(-i phi))/(2i), each term integrates to e^(i c)*(e^(i k t1) -
// e^(i k t0))/(i k).
func steadyTurn(phi0, W, R, w, t0, t1 float64) (x, y complex128) {
	term := func(sign float64) complex128 {
		c := sign * (phi0 - W*t0)
		k := sign*W - w
		if math.Abs(k) < 1e-12 {
			return cmplx.Exp(complex(0, c)) * complex(t1-t0, 0)
		}
		return cmplx.Exp(complex(0, c)) * (cmplx.Exp(complex(0, k*t1)) - cmplx.Exp(complex(0, k*t0))) / complex(0, k)
	}
	p, m := term(1), term(-1)
	f := complex(-R*W*W, 0)
	return f * (p + m) / 2, f * (p - m) / complex(0, 2)
}
