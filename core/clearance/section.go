package clearance

import (
	"math"
)

// track is the crane's path seen from above (the suspension point's
// track with no spread), for distances along it (see Section).
type track struct {
	pts  []Point2
	cum  []float64 // arc length up to each point
	near *nearest
}

func newTrack(run *Run) *track {
	k := &track{}
	for i := range run.TimeS {
		p := Point2{run.SuspensionXM[i], run.SuspensionYM[i]}
		if n := len(k.pts); n > 0 {
			q := k.pts[n-1]
			d := math.Hypot(p.X-q.X, p.Y-q.Y)
			if d < 1e-9 {
				continue
			}
			k.cum = append(k.cum, k.cum[n-1]+d)
		} else {
			k.cum = append(k.cum, 0)
		}
		k.pts = append(k.pts, p)
	}
	if len(k.pts) > 0 {
		k.near = newNearest(k.pts)
	}
	return k
}

func (k *track) length() float64 {
	if len(k.cum) == 0 {
		return 0
	}
	return k.cum[len(k.cum)-1]
}

// distance is how far along the track p is: the arc length to the track's
// point nearest to p, carried on straight beyond the ends.
func (k *track) distance(p Point2) float64 {
	d, _ := k.along(p, -1)
	return d
}

// along is distance with the search for the nearest segment begun at
// segment s (see nearest.closestFrom; s < 0: none), and that segment.
func (k *track) along(p Point2, s int) (float64, int) {
	if len(k.pts) < 2 {
		return 0, 0
	}
	_, s = k.near.closestFrom(p, s)
	a, b := k.pts[s], k.pts[s+1]
	l := k.cum[s+1] - k.cum[s]
	u := ((p.X-a.X)*(b.X-a.X) + (p.Y-a.Y)*(b.Y-a.Y)) / l
	// Comparisons rather than math.Max and Min (calls in wasm): the
	// same distance (a zero's sign aside, which the sum drops).
	if s > 0 && u < 0 {
		u = 0
	}
	if s+2 < len(k.pts) && u > l {
		u = l
	}
	return k.cum[s] + u, s
}

// sectionOf builds the vertical section: the nominal run, the bands of
// the runs inside each envelope, the obstacles the 95 % runs can reach,
// and each report's distances along the path.
func sectionOf(site *Site, nominal *Run, runs []Run, e50, e95 *Envelope, reps []ObstacleReport, where []Closest) Section {
	h, r := site.SuspensionHeightM, site.LoadRadiusM
	trk := newTrack(nominal)
	bin := sectionBin(trk.length())
	bins := make(map[int]runBins, len(e95.Members))
	for _, m := range e95.Members {
		d, low := trk.runSection(&runs[m], h, r)
		bins[m] = binSection(d, low, bin)
	}
	return sectionFrom(site, nominal, trk, bins, e50, e95, reps, where)
}

// sectionBin is the width of the section's bins along a path of lengthM:
// a two hundredth of it, at least 5 cm. The bins are [j*bin, (j+1)*bin)
// for whole j, the same for every run, so that each run's bins can be
// found on its own (runBins) and joined (band).
func sectionBin(lengthM float64) float64 { return math.Max(lengthM/200, 0.05) }

// runSection is a run's distance along the track and its lowest point's
// height at each sample.
func (k *track) runSection(run *Run, h, r float64) (d, low []float64) {
	return k.runSectionInto(run, h, r, new(scratch))
}

// runSectionInto is runSection in sc's memory.
func (k *track) runSectionInto(run *Run, h, r float64, sc *scratch) (d, low []float64) {
	sc.d, sc.low = grow(sc.d, len(run.TimeS)), grow(sc.low, len(run.TimeS))
	d, low = sc.d, sc.low
	s := -1 // the segment nearest the sample before: the next search's start
	for i := range run.TimeS {
		d[i], s = k.along(run.centre(i, h).Plan(), s)
		low[i] = run.LowM(i, h, r)
	}
	return d, low
}

// sectionFrom is sectionOf with the bins of the 95 % envelope's runs
// given (by run index).
func sectionFrom(site *Site, nominal *Run, trk *track, bins map[int]runBins, e50, e95 *Envelope, reps []ObstacleReport, where []Closest) Section {
	h, r := site.SuspensionHeightM, site.LoadRadiusM
	sec := Section{PathLengthM: trk.length(), SuspensionHeightM: h, Obstacles: []SectionObstacle{}}
	nd, lows := trk.runSection(nominal, h, r)
	for i, t := range nominal.TimeS {
		sec.Nominal = append(sec.Nominal, SectionPoint{TimeS: t, DistanceM: nd[i],
			LowM: lows[i], HookM: nominal.HookM(i, h)})
	}
	bin := sectionBin(sec.PathLengthM)
	sec.Envelope50 = band(e50, bins, bin)
	sec.Envelope95 = band(e95, bins, bin)

	reach := r + e95.StrayM + site.MarginM
	if nominal.Rigid() {
		c := nominal.centre(0, h)
		reach = e95.StrayM + site.MarginM
		for k := range 8 {
			reach = math.Max(reach, e95.StrayM+site.MarginM+math.Hypot(nominal.CornerXM[k][0]-c.X, nominal.CornerYM[k][0]-c.Y))
		}
	}
	for k := range site.Obstacles {
		o := &site.Obstacles[k]
		// The nominal centre's track, taken straight between samples and
		// looked at every quarter bin.
		from, to := math.Inf(1), math.Inf(-1)
		for i := range nominal.TimeS {
			a, b := nominal.centre(max(i-1, 0), h).Plan(), nominal.centre(i, h).Plan()
			n := max(int(math.Ceil(math.Abs(nd[i]-nd[max(i-1, 0)])/(bin/4))), 1)
			for s := 1; s <= n; s++ {
				f := float64(s) / float64(n)
				p := Point2{a.X + f*(b.X-a.X), a.Y + f*(b.Y-a.Y)}
				if PlanDistance(p, o.Outline) <= reach {
					d := nd[max(i-1, 0)] + f*(nd[i]-nd[max(i-1, 0)])
					from, to = math.Min(from, d), math.Max(to, d)
				}
			}
		}
		if from <= to {
			sec.Obstacles = append(sec.Obstacles, SectionObstacle{Name: o.Name, FromM: from, ToM: to, TopM: o.TopM})
		}
		reps[k].SmallestAtDistanceM = trk.distance(where[k].At.Plan())
		if reps[k].Strikes > 0 {
			reps[k].FirstStrikeAtDistanceM = trk.distance(where[k].FirstStrikeAt.Plan())
		}
		if v := reps[k].Vertical; v != nil {
			v.AtDistanceM = trk.distance(where[k].GapAt.Plan())
		}
		if r, w := reps[k].Rope, where[k].Rope; r != nil && w != nil {
			r.SmallestAtDistanceM = trk.distance(w.At.Plan())
			if r.Strikes > 0 {
				r.FirstStrikeAtDistanceM = trk.distance(w.FirstStrikeAt.Plan())
			}
		}
	}
	return sec
}

// runBins is one run's lowest point over the section's bins: in bin J0+i
// it is between Low[i] and High[i]. Between two samples the lowest point
// is taken as anywhere between its two heights over the bins between
// their distances, so the bins from the first to the last are all held.
type runBins struct {
	J0        int
	Low, High []float64
}

// binSection bins a run's distances along the path and lowest points at
// each sample (see runBins) on bins of a width given.
func binSection(d, low []float64, bin float64) runBins {
	var out runBins
	if len(d) == 0 {
		return out
	}
	first, last := math.MaxInt, math.MinInt
	for i := range d {
		j0, j1 := binRange(d[max(i-1, 0)], d[i], bin)
		first, last = min(first, j0), max(last, j1)
	}
	out.J0 = first
	out.Low, out.High = make([]float64, last-first+1), make([]float64, last-first+1)
	for i := range out.Low {
		out.Low[i], out.High[i] = math.Inf(1), math.Inf(-1)
	}
	prev := low[0]
	for i := range d {
		j0, j1 := binRange(d[max(i-1, 0)], d[i], bin)
		zl, zh := prev, low[i]
		if zh < zl {
			zl, zh = zh, zl
		}
		for j := j0; j <= j1; j++ {
			if zl < out.Low[j-first] {
				out.Low[j-first] = zl
			}
			if zh > out.High[j-first] {
				out.High[j-first] = zh
			}
		}
		prev = low[i]
	}
	return out
}

// binRange is the bins from distance a to distance b (either way).
func binRange(a, b, bin float64) (int, int) {
	j0, j1 := int(math.Floor(a/bin)), int(math.Floor(b/bin))
	return min(j0, j1), max(j0, j1)
}

// band is the lowest point's band over the envelope's runs: each bin's
// lowest and highest over the runs' bins.
func band(e *Envelope, bins map[int]runBins, bin float64) SectionBand {
	out := SectionBand{Level: e.Level, Inside: e.Inside, BinM: bin, DistM: []float64{}, LowM: []float64{}, HighM: []float64{}}
	first, last := math.MaxInt, math.MinInt
	for _, m := range e.Members {
		if b := bins[m]; len(b.Low) > 0 {
			first, last = min(first, b.J0), max(last, b.J0+len(b.Low)-1)
		}
	}
	if first > last {
		return out
	}
	low, high := make([]float64, last-first+1), make([]float64, last-first+1)
	for j := range low {
		low[j], high[j] = math.Inf(1), math.Inf(-1)
	}
	for _, m := range e.Members {
		b := bins[m]
		lo, hi := low[b.J0-first:], high[b.J0-first:]
		// Comparisons rather than math.Min and Max (calls in wasm; the
		// heights are never NaN): over 1,000 runs the join's largest part.
		for i, v := range b.Low {
			if v < lo[i] {
				lo[i] = v
			}
		}
		for i, v := range b.High {
			if v > hi[i] {
				hi[i] = v
			}
		}
	}
	for j := range low {
		if low[j] <= high[j] {
			out.DistM = append(out.DistM, float64(first+j)*bin)
			out.LowM = append(out.LowM, low[j])
			out.HighM = append(out.HighM, high[j])
		}
	}
	return out
}
