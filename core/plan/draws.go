package plan

import (
	"math"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/units"
)

// Which drawn timings of a pendant option are simulated (issue 16).
//
// The option's figures at a rope length are the 90th percentile of each
// figure over all n = TimingDraws drawn timings: the k-th smallest, k =
// ceil(0.9*n) (36 of 40), which is the (n-k+1)-th largest (the 5th). Only
// the draws that can be among the n-k+1 largest decide it. The linear
// theory of the pendulum (linearSwing, the per-piece exact solution of the
// small-angle pendulum under the drawn speed profile) estimates every
// draw's peak and residual swing for next to nothing; on the gantry
// pendant example it matches the simulation within 0.0015 deg for all 200
// draws (40 at each of 5 rope lengths, peak and residual), so the margin
// below (0.03 deg at 2 deg) leaves ten times that.
//
// So at a rope length, with e the (n-k+1)-th largest estimate of a swing
// figure and m(e) = drawMarginDeg + drawMarginShare*e, every draw whose
// estimate of the peak or of the residual swing is at least e - m(e) is
// simulated, and the others are not. If every estimate is within m(e)/2 of
// the simulation, a draw left out is below at least n-k+1 simulated ones
// (its simulated figure < e - m/2 <= each of theirs), so it cannot be the
// percentile: the percentile of all n is the (n-k+1)-th largest of those
// simulated, exactly. That is checked on every draw simulated (the
// extremes, where the small-angle theory is least accurate): should one
// differ from its estimate by more than m/2, the draws are simulated as
// without the estimates (in the seeded order until the verdict of all n is
// decided, verify.go decided).
// The excursions of one rope of fixed length are L*sin of the swing and
// follow the same draws; the tension factor (no limit) is taken from the
// same draws, which may leave it a little low (by 4e-5 of the load's
// weight in one of ten rope lengths of TestTimingDrawsByLinearTheory).
//
// The verdict "outside" then rests on simulation alone (n-k+1 simulated
// draws beyond a limit); "within" also on the estimates of the draws left
// out, so the option recommended is checked again at the default accuracy
// with every drawn timing in the seeded order until the verdict of all n
// is decided by simulation alone (recheck; verify.go decided).
const (
	drawMarginDeg   = 0.01
	drawMarginShare = 0.01
)

// linearDraws reports whether the drawn timings can be chosen by the
// linear theory: one rope (no hook block, no rigid load), no wind or
// initial swing, an axis that moves the hook straight (no slew lean), and
// the draws' profiles at hand.
func (rq *request) linearDraws(o *Option) bool {
	return screening && !rq.multi() && !rq.leans() && rq.linearOK() &&
		len(o.drawProfiles) == len(o.draws) && len(o.draws) > 0
}

// drawnBound simulates the draws of o at rope length rope that can be the
// percentile (above) and returns their figures, or ok false when an
// estimate was off by more than its margin (the caller then simulates the
// draws in the seeded order). The figures come in the draws' seeded order.
func (rq *request) drawnBound(o *Option, rope, tol float64) (ds []Verified, ok bool, err error) {
	n := len(o.draws)
	w := rq.modesAt(rope).omega[0]
	peak := make([]float64, n)
	res := make([]float64, n)
	for d, p := range o.drawProfiles {
		pk, rs := linearSwingOf(p, o.drawPieces[d], rq.k, w)
		peak[d], res[d] = pk/units.Degree, rs/units.Degree
	}
	top := n - int(math.Ceil(float64(TimingPercentile)/100*float64(n))) + 1
	pe, re := largest(peak, top), largest(res, top)
	pm, rm := drawMarginDeg+drawMarginShare*pe, drawMarginDeg+drawMarginShare*re
	for d := range o.draws {
		if peak[d] < pe-pm && res[d] < re-rm {
			continue
		}
		v, err := rq.simulate(&o.draws[d], rope, tol)
		if err != nil {
			return nil, false, err
		}
		if math.Abs(v.PeakSwingDeg-peak[d]) > pm/2 || math.Abs(v.ResidualSwingDeg-res[d]) > rm/2 {
			return nil, false, nil
		}
		ds = append(ds, v)
	}
	return ds, true, nil
}

// largest is the j-th largest of xs (j from 1), which it leaves as it is.
func largest(xs []float64, j int) float64 {
	s := append([]float64(nil), xs...)
	sorts.Floats(s)
	return s[max(0, len(s)-j)]
}
