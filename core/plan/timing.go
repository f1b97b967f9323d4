package plan

import (
	"fmt"
	"math"
	"math/cmplx"
	"math/rand/v2"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/scenario"
)

// A person's timing. On a step-speed pendant the person, not the drive,
// times each press and release, and is off by a random amount each time.
// The planner models it so (common practice for a person pressing on a
// count: about 0.2 to 0.3 s standard deviation, and a reaction of about
// 1 s to a stop call; both figures from memory):
//
//   - the first press defines time zero;
//   - each later press of the start, and each release after the first, is
//     made on a count from the previous press: its gap is the cue's count
//     plus the reaction delay d plus a normal error of standard deviation
//     sigma (so the errors of one group add up);
//   - the first release is made at a mark (a distance before the stop
//     point, or an angle before the stop angle): the person releases when
//     the load's crane reaches it, d plus a normal error late; a late start
//     reaches the mark late by sum_i A_i*e_i (A_i the step's share of the
//     top speed, e_i the press's error), exactly for ramps that do not
//     overlap.
//
// The cues are counts rounded to CueStepS (people count in half seconds at
// best) and the planner picks them on that grid: it ranks the counts by
// the 90th percentile, over TimingDraws seeded draws and the rope lengths,
// of the linear-theory residual (the sum of each step's rotating vector,
// A_i*sinc(w*tau_i/2)*exp(i*w*(t_i + tau_i/2)) for a ramp of tau_i at the
// drive's acceleration; Singer & Seering 1990 for impulses), start and
// stop each. The chosen cues are then simulated for every draw at every
// rope length, and the option is ranked and checked by the 90th
// percentile (nearest rank: the 36th smallest of 40) of its residual
// swing, peak swing and excursions.

// Timing states the model of a person's timing the pendant options were
// checked with.
type Timing struct {
	_              [0]func() // never compared: no equality code in the wasm
	SigmaS         float64   `json:"sigma_s"`
	ReactionDelayS float64   `json:"reaction_delay_s"`
	Draws          int       `json:"draws"`
	Seed           uint64    `json:"seed"`
	Percentile     float64   `json:"percentile"`
	CueStepS       float64   `json:"cue_step_s"`
	Source         string    `json:"source"`
}

// Settings of the timing model.
const (
	TimingDraws      = 40
	TimingSeed       = 1
	TimingPercentile = 90
	CueStepS         = 0.5
)

// timingSource says where the default scatter comes from.
const timingSource = "A person pressing on a count is off by roughly 0.2 to 0.3 s (standard deviation); default 0.25 s (from memory). Reaction delay default 0 s."

// timing is the request's model.
func (rq *request) timing() Timing {
	sig := scenario.DefaultTimingSigmaS
	if p := rq.s.Plan.TimingSigmaS; p != nil {
		sig = *p
	}
	return Timing{SigmaS: sig, ReactionDelayS: rq.s.Plan.ReactionDelayS, Draws: TimingDraws, Seed: TimingSeed,
		Percentile: TimingPercentile, CueStepS: CueStepS, Source: timingSource}
}

// errors are the draws of the timing errors: errs[d][k] is press k's
// normal error (sigma 1) in draw d, for up to n presses. The same seed
// gives the same draws on every platform (PCG, math/rand/v2).
func timingErrors(n int) [][]float64 {
	r := rand.New(rand.NewPCG(TimingSeed, 0x5eed))
	out := make([][]float64, TimingDraws)
	for d := range out {
		out[d] = make([]float64, n)
		for k := range out[d] {
			out[d][k] = r.NormFloat64()
		}
	}
	return out
}

// percentile is the nearest-rank p-th percentile of xs (which it sorts).
func percentile(xs []float64, p float64) float64 {
	return percentileOf(xs, len(xs), p)
}

// percentileOf is the nearest-rank p-th percentile of n values of which xs
// (sorted here) are the largest: the k-th smallest of n, k = ceil(p*n), is
// the (n-k+1)-th largest, of xs as of all n.
func percentileOf(xs []float64, n int, p float64) float64 {
	if len(xs) == 0 {
		return 0
	}
	sorts.Floats(xs)
	k := int(math.Ceil(p/100*float64(n))) - 1 - (n - len(xs))
	return xs[max(0, min(k, len(xs)-1))]
}

// group is one group of presses (the start's, or the stop's): step k
// changes the speed by share[k] of the top speed, over a ramp of tau[k]
// seconds at the drive's acceleration.
type group struct {
	share, tau []float64
}

// vector is the linear-theory residual of the group pressed at times t,
// as a fraction of an instant change by the whole top speed, at circular
// frequency w.
func (g group) vector(t []float64, w float64) complex128 {
	var s complex128
	for k, a := range g.share {
		x := w * g.tau[k] / 2
		sinc := 1.0
		if x > 1e-9 {
			sinc = math.Sin(x) / x
		}
		s += complex(a*sinc, 0) * cmplx.Exp(complex(0, w*(t[k]+g.tau[k]/2)))
	}
	return s
}

// counted returns the press times of a group from its gaps (gaps[0] is
// ignored: the group's first press is at 0), with the draw's errors.
func counted(gaps []float64, delay, sigma float64, errs []float64, out []float64) []float64 {
	out = out[:0]
	t := 0.0
	for k, g := range gaps {
		if k > 0 {
			t = math.Max(t, t+g+delay+sigma*errs[k])
		}
		out = append(out, t)
	}
	return out
}

// robustCost is the p90 over draws and rope lengths of a group's residual
// with the gaps given (the first unused).
func robustCost(g group, gaps []float64, ws []modeSet, tm Timing, errs [][]float64) float64 {
	vals := make([]float64, 0, len(errs)*len(ws))
	buf := make([]float64, 0, len(gaps))
	for _, e := range errs {
		t := counted(gaps, tm.ReactionDelayS, tm.SigmaS, e, buf)
		for _, ms := range ws {
			v := 0.0 // each mode by its share of the load's swing
			for i, w := range ms.omega {
				v += ms.share[i] * cmplx.Abs(g.vector(t, w))
			}
			vals = append(vals, v)
		}
	}
	return percentile(vals, tm.Percentile)
}

// costTable is robustCost for counts on the grid 0, CueStepS, ...,
// steps*CueStepS, with the rotating vectors tabled: a press made a gap
// x = max(0, count + delay + sigma*e) after the one before turns every later
// step's vector by exp(i*w*x), so the group's vector is the sum over steps
// k of C_k*prod_(j<=k) P_j with C_k = A_k*sinc(w*tau_k/2)*exp(i*w*tau_k/2)
// and P_j the turn of press j's gap (the same sum as group.vector, as
// products instead of one exponential each). The tables are flat slices
// and cost's work space is kept, so a search of hundreds of counts
// allocates nothing per count.
type costTable struct {
	g     group
	ws    []modeSet
	tm    Timing
	steps int
	draws int
	// turn[((d*(n-1)+k-1)*(steps+1)+c)*nm+m] is press k's turn (k >= 1:
	// the first press has no gap) in draw d with count c, for the m-th of
	// the nm frequencies (rope lengths, then modes, flattened);
	// coef[k*nm+m] is C_k.
	turn  []complex128
	coef  []complex128
	nm    int
	share []float64
	vals  []float64
	// cost's work space.
	idx      []int
	rot, sum []complex128
}

// turnOf is exp(i*y) (cmplx.Exp of a pure imaginary, bit for bit).
func turnOf(y float64) complex128 {
	s, c := math.Sincos(y)
	return complex(c, s)
}

// turns sets dst[m] to turnOf(om[m]*x).
func turns(dst []complex128, om []float64, x float64) {
	for m, w := range om {
		dst[m] = turnOf(w * x)
	}
}

func newCostTable(g group, steps int, ws []modeSet, tm Timing, errs [][]float64) *costTable {
	ct := &costTable{g: g, ws: ws, tm: tm, steps: steps, draws: len(errs)}
	var om []float64
	for _, ms := range ws {
		om = append(om, ms.omega...)
		ct.share = append(ct.share, ms.share...)
	}
	n, nm := len(g.share), len(om)
	ct.nm = nm
	ct.coef = make([]complex128, n*nm)
	for k, a := range g.share {
		for m, w := range om {
			x := w * g.tau[k] / 2
			sinc := 1.0
			if x > 1e-9 {
				sinc = math.Sin(x) / x
			}
			ct.coef[k*nm+m] = complex(a*sinc, 0) * turnOf(w*g.tau[k]/2)
		}
	}
	// A gap's turn exp(i*w*x), x = c*CueStepS + b with b the draw's
	// delay and scatter, as the product of the count's turn (tabled once)
	// and the draw's (once per press and draw): two rounded turns and a
	// product, a few units in the last place from turnOf(w*x), for a
	// Sincos per count and frequency instead of one per entry. A gap the
	// scatter makes negative is 0 (no turn).
	grid := make([]complex128, (steps+2)*nm) // the counts' turns, then a draw's
	for c := 0; c <= steps; c++ {
		turns(grid[c*nm:], om, float64(c)*CueStepS)
	}
	bt := grid[(steps+1)*nm:]
	ct.turn = make([]complex128, len(errs)*(n-1)*(steps+1)*nm)
	row := ct.turn
	for _, e := range errs {
		for k := 1; k < n; k++ {
			b := tm.ReactionDelayS + tm.SigmaS*e[k]
			turns(bt, om, b)
			for c := 0; c <= steps; c++ {
				for m := range bt {
					row[m] = 1
					if float64(c)*CueStepS+b > 0 {
						row[m] = grid[c*nm+m] * bt[m]
					}
				}
				row = row[nm:]
			}
		}
	}
	ct.vals = make([]float64, 0, len(errs)*len(ws))
	ct.idx = make([]int, n)
	ct.rot, ct.sum = make([]complex128, nm), make([]complex128, nm)
	return ct
}

// cost is the p90 of the counts c (c[0] unused), which must be on the
// table's grid; or +Inf as soon as it is known to be at least bound (the
// nearest-rank percentile of N values is the k-th smallest, so it is at
// least bound once N - k + 1 values are), which leaves the search's
// choice as it was and skips most of the work for poor counts.
func (ct *costTable) cost(counts []float64, bound float64) float64 {
	n, nm := len(ct.g.share), ct.nm
	idx := ct.idx[:n]
	for k := 1; k < n; k++ {
		idx[k] = int(math.Round(counts[k]/CueStepS)) * nm
	}
	vals := ct.vals[:0]
	total := ct.draws * len(ct.ws)
	stop := total - int(math.Ceil(ct.tm.Percentile/100*float64(total))) + 1
	over := 0
	// The tables and work space as locals of one length (nm), so that the
	// inner loop's reads need no bounds checks.
	rot, sum, coef, turn, ws := ct.rot[:nm], ct.sum[:nm], ct.coef, ct.turn, ct.ws
	stride := (ct.steps + 1) * nm
	for d := range ct.draws {
		c0 := coef[:nm]
		for m := range rot {
			rot[m], sum[m] = 1, c0[m]
		}
		row := turn[d*(n-1)*stride:]
		for k := 1; k < n; k++ {
			tr := row[(k-1)*stride+idx[k]:][:nm]
			cf := coef[k*nm:][:nm]
			for m := range rot {
				rot[m] *= tr[m]
				sum[m] += cf[m] * rot[m]
			}
		}
		m := 0
		for j := range ws {
			ms := &ws[j]
			v := 0.0
			for i := range ms.omega {
				v += ms.share[i] * cmplx.Abs(sum[m+i])
			}
			m += len(ms.omega)
			vals = append(vals, v)
			if v >= bound {
				if over++; over >= stop {
					ct.vals = vals
					return math.Inf(1)
				}
			}
		}
	}
	ct.vals = vals
	return percentile(vals, ct.tm.Percentile)
}

// robustGaps picks the counts of a group on the CueStepS grid (0 up to
// maxS each) that make its p90 residual smallest, starting from the exact
// times start (rounded): every pair of counts for three steps or fewer
// (up to 40 counts each), a coordinate search otherwise. It returns the
// counts (the gaps less the reaction delay).
func robustGaps(g group, start []float64, maxS float64, ws []modeSet, tm Timing, errs [][]float64) []float64 {
	n := len(g.share)
	counts := make([]float64, n)
	for k := 1; k < n; k++ {
		counts[k] = math.Max(0, math.Round((start[k]-start[k-1]-tm.ReactionDelayS)/CueStepS)*CueStepS)
	}
	steps := int(maxS / CueStepS)
	cost := func(c []float64, _ float64) float64 { return robustCost(g, c, ws, tm, errs) } // counted adds the delay
	onGrid := true
	for _, c := range counts {
		onGrid = onGrid && c <= float64(steps)*CueStepS
	}
	if n > 1 && onGrid {
		cost = newCostTable(g, steps, ws, tm, errs).cost
	}
	best := cost(counts, math.Inf(1))
	if n == 1 {
		return counts
	}
	try := func(c []float64) {
		if v := cost(c, best-1e-12); v < best-1e-12 {
			best = v
			copy(counts, c)
		}
	}
	c := append([]float64(nil), counts...)
	if n <= 3 && steps <= 40 { // every pair; a coordinate search beyond
		var rec func(k int)
		rec = func(k int) {
			if k == n {
				try(c)
				return
			}
			for i := 0; i <= steps; i++ {
				c[k] = float64(i) * CueStepS
				rec(k + 1)
			}
		}
		rec(1)
		return counts
	}
	for range 10 {
		before := best
		for k := 1; k < n; k++ {
			copy(c, counts)
			for i := 0; i <= steps; i++ {
				c[k] = float64(i) * CueStepS
				try(c)
			}
		}
		if best >= before-1e-12 {
			break
		}
	}
	return counts
}

// timingAssumption states the model for a pendant plan's assumptions.
func timingAssumption(tm Timing) string {
	return fmt.Sprintf("A person times the pendant: the first press starts the clock; each later press and release is off by a normal scatter of %.3g s (standard deviation) after a reaction delay of %.3g s, on a count (half seconds) from the previous press, the first release at a mark before the stop point. Options are checked over %d seeded draws at every rope length, by the %gth percentile. %s",
		tm.SigmaS, tm.ReactionDelayS, tm.Draws, tm.Percentile, tm.Source)
}
