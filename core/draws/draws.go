// Package draws evaluates one scenario over many random draws of what a
// lift plan knows only roughly: the rope length, the depth of the load's
// centre of mass, when the operator presses the buttons, and how strong
// the wind gust is and when it comes. It reports percentiles of the
// headline figures (peak and residual swing, peak excursion, tension
// factor) over the draws.
//
// Each quantity is drawn from a normal distribution with the given
// standard deviation about the scenario's own value, cut off at three
// standard deviations (so that a rope never draws a negative length).
// Draw i uses its own random stream, seeded by the request's seed and i
// (math/rand/v2's PCG), so a result does not depend on how the runs are
// split over goroutines or web workers: runs [first, first+count) of a
// request are the same wherever they are computed.
//
// The draws are independent; they say how the figures spread when the
// inputs spread as stated, not how likely any input is. The spread values
// are the user's (none are built in).
package draws

import (
	"fmt"
	"math"
	"runtime"
	"slices"
	"sync"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

// Spread gives the standard deviation of each drawn quantity; zero keeps
// the scenario's value.
type Spread struct {
	// RopeLengthM scatters the rope length (load.rope_length_m), m.
	RopeLengthM float64 `json:"rope_length_m,omitempty"`
	// CentreDepthM scatters the depth of the load's centre of mass below
	// where the scenario puts it, m: it adds to the rope length, or with a
	// hook block to the rigging length.
	CentreDepthM float64 `json:"centre_depth_m,omitempty"`
	// PressS scatters, each on its own, every move's start and every
	// speed step's time (the operator's press), s. Step times keep their
	// order; a start does not go below zero.
	PressS float64 `json:"press_s,omitempty"`
	// GustPct scatters the wind force, % of the scenario's.
	GustPct float64 `json:"gust_pct,omitempty"`
	// GustS scatters when the wind sets in (wind.start_s), s.
	GustS float64 `json:"gust_s,omitempty"`
	// EmergencyStop, given, stops each draw at a moment drawn uniformly
	// over the move (see scenario.EmergencyStop and stop.go).
	EmergencyStop *scenario.EmergencyStop `json:"emergency_stop,omitempty"`
}

// Request is a set of draws of one scenario.
type Request struct {
	Spread Spread `json:"spread"`
	// Runs is the number of draws, at least 1 and at most MaxRuns.
	Runs int `json:"runs"`
	// Seed selects the draws; the same seed gives the same draws.
	Seed uint64 `json:"seed"`
	// First and Count select the draws [First, First+Count) to evaluate
	// (for splitting a request over workers); Count zero means all Runs.
	First int `json:"first,omitempty"`
	Count int `json:"count,omitempty"`
}

// MaxRuns bounds the draws of one request.
const MaxRuns = 100_000

// Percentiles of one figure over the draws (linear interpolation between
// order statistics, R. J. Hyndman and Y. Fan, "Sample quantiles in
// statistical packages", Am. Stat. 50 (1996) 361-365, definition 7).
type Percentiles struct {
	P50 float64 `json:"p50"`
	P90 float64 `json:"p90"`
	P95 float64 `json:"p95"`
	Max float64 `json:"max"`
}

// Figures holds one value per draw of each headline figure, in draw
// order.
type Figures struct {
	PeakSwingDeg     []float64 `json:"peak_swing_deg"`
	PeakExcursionM   []float64 `json:"peak_excursion_m"`
	ResidualSwingDeg []float64 `json:"residual_swing_deg"`
	TensionFactor    []float64 `json:"tension_factor"`
}

// Summary is the percentiles of each figure.
type Summary struct {
	_                [0]func()   // never compared: no equality code in the wasm
	PeakSwingDeg     Percentiles `json:"peak_swing_deg"`
	PeakExcursionM   Percentiles `json:"peak_excursion_m"`
	ResidualSwingDeg Percentiles `json:"residual_swing_deg"`
	TensionFactor    Percentiles `json:"tension_factor"`
}

// Result is the outcome of the draws [First, First+len) of a request.
type Result struct {
	First   int     `json:"first"`
	Runs    int     `json:"runs"` // draws evaluated here
	Summary Summary `json:"summary"`
	Figures Figures `json:"figures"`
}

// Run evaluates the draws of req on s, on workers goroutines (zero: one
// per processor). A draw that the core rejects (a rope drawn too short,
// say) ends the request with that draw's error, naming the draw.
func Run(s *scenario.Scenario, req Request, workers int) (*Result, error) {
	if err := Check(s, req, units.Choice{System: "si"}); err != nil {
		return nil, err
	}
	count := req.Count
	if count == 0 {
		count = req.Runs - req.First
	}
	res := &Result{First: req.First, Runs: count}
	f := &res.Figures
	f.PeakSwingDeg = make([]float64, count)
	f.PeakExcursionM = make([]float64, count)
	f.ResidualSwingDeg = make([]float64, count)
	f.TensionFactor = make([]float64, count)
	err := Each(count, workers, func(i int) error {
		r, err := sway.EvaluateWith(Draw(s, req.Spread, req.Seed, req.First+i), sway.Options{NoHistory: true, NoModePeriods: true})
		if err != nil {
			return fmt.Errorf("draw %d of seed %d: %w", req.First+i, req.Seed, err)
		}
		f.PeakSwingDeg[i] = r.PeakSwingDeg
		f.PeakExcursionM[i] = r.PeakExcursionM
		f.ResidualSwingDeg[i] = r.ResidualSwingDeg
		f.TensionFactor[i] = r.TensionFactor
		return nil
	})
	if err != nil {
		return nil, err
	}
	res.Summary = Summarise(f)
	return res, nil
}

// Each calls f(i) for i in [0, n) on workers goroutines (zero: one per
// processor). When calls fail it returns the error of the lowest i, so
// the answer does not depend on the order the goroutines run in.
func Each(n, workers int, f func(i int) error) error {
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	errs := make([]error, n)
	var wg sync.WaitGroup
	next := make(chan int, workers)
	for range min(workers, n) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				errs[i] = f(i)
			}
		}()
	}
	for i := range n {
		next <- i
	}
	close(next)
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	return nil
}

// Check is Run's check of the request and the scenario: a field out of
// range gets a message naming its accepted range, the quantities in the
// units of u (core/words) and the bounds rounded inward (see inside).
func Check(s *scenario.Scenario, req Request, u units.Choice) error {
	var errs scenario.Errors
	add := func(field, format string, a ...any) {
		errs = append(errs, scenario.FieldError{Field: field, Message: fmt.Sprintf(format, a...)})
	}
	if req.Runs < 1 || req.Runs > MaxRuns {
		add("draws.runs", "is %d: accepted from 1 to %d", req.Runs, MaxRuns)
	}
	if req.First < 0 || req.Count < 0 || req.First+req.Count > req.Runs || (req.Count == 0 && req.First >= req.Runs && req.Runs > 0) {
		add("draws.first", "draws %d to %d are not among the %d runs", req.First, req.First+req.Count, req.Runs)
	}
	sp := req.Spread
	for _, v := range []struct {
		field, q   string
		value, max float64
	}{
		{"draws.spread.rope_length_m", "length", sp.RopeLengthM, 50},
		{"draws.spread.centre_depth_m", "length", sp.CentreDepthM, 10},
		{"draws.spread.press_s", "time", sp.PressS, 10},
		{"draws.spread.gust_pct", "share", sp.GustPct / 100, 1},
		{"draws.spread.gust_s", "time", sp.GustS, 60},
	} {
		if !(v.value >= 0 && v.value <= v.max) {
			add(v.field, "%s", outside(&v.value, 0, v.max, v.q, u))
		}
	}
	if e := sp.EmergencyStop; e != nil {
		for _, v := range []struct {
			field, q string
			value    *float64
			need     bool
			min, max float64
		}{
			{"draws.spread.emergency_stop.reaction_s", "time", e.ReactionS, true, 0, 10},
			{"draws.spread.emergency_stop.decel_m_per_s2", "acceleration", e.DecelMPerS2, false, 0.01, 20},
			{"draws.spread.emergency_stop.decel_deg_per_s2", "angular_acceleration", e.DecelDegPerS2, false, 0.01, 100},
		} {
			if (v.value == nil && v.need) || (v.value != nil && !(*v.value >= v.min && *v.value <= v.max)) {
				add(v.field, "%s", outside(v.value, v.min, v.max, v.q, u))
			}
		}
	}
	if len(errs) > 0 {
		return errs
	}
	return s.Validate()
}

// outside is the message of a value v (nil: not given) of quantity q (a
// core/units.Table name) outside [min, max], said in the units of u as
// the core says a quantity (words), the bounds rounded to the unit's step
// (core/units) toward the accepted side (up for the lower, down for the
// upper), so that a value typed as said is accepted.
func outside(v *float64, min, max float64, q string, u units.Choice) string {
	is := "is required"
	if v != nil {
		is = "is " + words.Quantity{Value: *v, Quantity: q}.Show(u)
	}
	if un := u.Unit(q); un.Step > 0 && un.ToSI > 0 {
		step := un.Step * un.ToSI
		min, max = math.Ceil(min/step-1e-9)*step, math.Floor(max/step+1e-9)*step
	}
	return is + ": accepted from " + words.Quantity{Value: min, Quantity: q}.Show(u) + " up to " + words.Quantity{Value: max, Quantity: q}.Show(u)
}

// Summarise gives the percentiles of each figure (of draws merged from
// several results, for instance).
func Summarise(f *Figures) Summary {
	return Summary{
		PeakSwingDeg:     percentiles(f.PeakSwingDeg),
		PeakExcursionM:   percentiles(f.PeakExcursionM),
		ResidualSwingDeg: percentiles(f.ResidualSwingDeg),
		TensionFactor:    percentiles(f.TensionFactor),
	}
}

func percentiles(xs []float64) Percentiles {
	if len(xs) == 0 {
		return Percentiles{}
	}
	v := slices.Clone(xs)
	sorts.Floats(v)
	q := func(p float64) float64 {
		h := p * float64(len(v)-1)
		i := int(math.Floor(h))
		if i+1 >= len(v) {
			return v[len(v)-1]
		}
		return v[i] + (h-float64(i))*(v[i+1]-v[i])
	}
	return Percentiles{P50: q(0.5), P90: q(0.9), P95: q(0.95), Max: v[len(v)-1]}
}
