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
	if len(k.pts) < 2 {
		return 0
	}
	_, s := k.near.closest(p)
	a, b := k.pts[s], k.pts[s+1]
	l := k.cum[s+1] - k.cum[s]
	u := ((p.X-a.X)*(b.X-a.X) + (p.Y-a.Y)*(b.Y-a.Y)) / l
	if s > 0 {
		u = math.Max(u, 0)
	}
	if s+2 < len(k.pts) {
		u = math.Min(u, l)
	}
	return k.cum[s] + u
}

// sectionOf builds the vertical section: the nominal run, the bands of
// the runs inside each envelope, the obstacles the 95 % runs can reach,
// and each report's distances along the path.
func sectionOf(site *Site, nominal *Run, runs []Run, e50, e95 *Envelope, reps []ObstacleReport, where []Closest) Section {
	h, r := site.SuspensionHeightM, site.LoadRadiusM
	trk := newTrack(nominal)
	ds, lows := make(map[int][]float64, len(e95.Members)), make(map[int][]float64, len(e95.Members))
	for _, m := range e95.Members {
		ds[m], lows[m] = trk.runSection(&runs[m], h, r)
	}
	return sectionFrom(site, nominal, trk, ds, lows, e50, e95, reps, where)
}

// runSection is a run's distance along the track and its lowest point's
// height at each sample.
func (k *track) runSection(run *Run, h, r float64) (d, low []float64) {
	d, low = make([]float64, len(run.TimeS)), make([]float64, len(run.TimeS))
	for i := range run.TimeS {
		d[i], low[i] = k.distance(run.centre(i, h).Plan()), run.LowM(i, h, r)
	}
	return d, low
}

// sectionFrom is sectionOf with the distances and lowest points of the
// 95 % envelope's runs given (ds, lows by run index).
func sectionFrom(site *Site, nominal *Run, trk *track, ds, lows map[int][]float64, e50, e95 *Envelope, reps []ObstacleReport, where []Closest) Section {
	h, r := site.SuspensionHeightM, site.LoadRadiusM
	sec := Section{PathLengthM: trk.length(), SuspensionHeightM: h, Obstacles: []SectionObstacle{}}
	dist := func(run *Run) []float64 {
		out := make([]float64, len(run.TimeS))
		for i := range run.TimeS {
			out[i] = trk.distance(run.centre(i, h).Plan())
		}
		return out
	}
	nd := dist(nominal)
	for i, t := range nominal.TimeS {
		sec.Nominal = append(sec.Nominal, SectionPoint{TimeS: t, DistanceM: nd[i],
			LowM: nominal.LowM(i, h, r), HookM: nominal.HookM(i, h)})
	}
	// The 50 % runs are the first of the 95 % runs (least straying first).
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, m := range e95.Members {
		for _, d := range ds[m] {
			lo, hi = math.Min(lo, d), math.Max(hi, d)
		}
	}
	bin := math.Max(sec.PathLengthM/200, 0.05)
	bin = math.Max(bin, (hi-lo)/2000)
	sec.Envelope50 = band(e50, ds, lows, lo, bin)
	sec.Envelope95 = band(e95, ds, lows, lo, bin)

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
	}
	return sec
}

// band is the lowest point's band over the envelope's runs: between two
// samples a run's lowest point is taken as anywhere between its two
// heights over the bins between their distances.
func band(e *Envelope, ds, lows map[int][]float64, d0, bin float64) SectionBand {
	out := SectionBand{Level: e.Level, Inside: e.Inside, BinM: bin, DistM: []float64{}, LowM: []float64{}, HighM: []float64{}}
	low, high := map[int]float64{}, map[int]float64{}
	first, last := math.MaxInt, math.MinInt
	for _, m := range e.Members {
		d, lm := ds[m], lows[m]
		prev := lm[0]
		for i := range d {
			z := lm[i]
			j0, j1 := int(math.Floor((d[max(i-1, 0)]-d0)/bin)), int(math.Floor((d[i]-d0)/bin))
			if j0 > j1 {
				j0, j1 = j1, j0
			}
			zl, zh := math.Min(prev, z), math.Max(prev, z)
			for j := j0; j <= j1; j++ {
				if v, ok := low[j]; !ok || zl < v {
					low[j] = zl
				}
				if v, ok := high[j]; !ok || zh > v {
					high[j] = zh
				}
			}
			first, last, prev = min(first, j0), max(last, j1), z
		}
	}
	for j := first; j <= last; j++ {
		if v, ok := low[j]; ok {
			out.DistM = append(out.DistM, d0+float64(j)*bin)
			out.LowM = append(out.LowM, v)
			out.HighM = append(out.HighM, high[j])
		}
	}
	return out
}
