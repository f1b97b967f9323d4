package clearance

import (
	"math"
	"math/rand/v2"
	"reflect"
	"testing"
)

func TestSectionHandCase(t *testing.T) {
	// Ten runs along x from 0 to 20 m at 1 m/s, the suspension 10 m up,
	// the load (a ball of 0.5 m) 6 m below it and 0 to 0.9 m to the side:
	// its lowest point is 10 - 6 - 0.5 = 3.5 m up all along, and its
	// distance along the path is its x (the crane's path is the x axis).
	site := &Site{SuspensionHeightM: 10, MarginM: 0.5, LoadRadiusM: 0.5, Obstacles: []Obstacle{
		// A column whose face is 1.8 m off the path, 6 m high.
		{Name: "column", Outline: Rectangle(10, 2, 0.4, 0.4, 0), TopM: 6},
		// A stack under the path, x from 14 to 16, 2 m high.
		{Name: "stack", Outline: Rectangle(15, 0, 2, 2, 0), TopM: 2},
	}}
	var runs []Run
	for i := 0; i < 10; i++ {
		runs = append(runs, straightRun(0.1*float64(i)))
	}
	nominal := straightRun(0)
	reps, where, err := site.check(runs, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	plans := make([]PlanPath, len(runs))
	for i := range runs {
		plans[i] = runs[i].planPath(10, 0.5)
	}
	strays, _ := Strays(plans, nominal.planPath(10, 0.5).Points)
	e50, _ := newEnvelope(plans, strays, 0.5, 0, 0.1)
	e95, _ := newEnvelope(plans, strays, Required, ExclusionConfidence, 0.1)
	sec := sectionOf(site, &nominal, runs, e50, e95, reps, where)
	if sec.PathLengthM != 20 {
		t.Errorf("path length %g, want 20", sec.PathLengthM)
	}
	for _, p := range sec.Nominal {
		if math.Abs(p.DistanceM-p.TimeS) > 1e-12 || p.LowM != 3.5 || p.HookM != 4 {
			t.Fatalf("nominal %+v: want distance = time, low 3.5 m, hook 4 m", p)
		}
	}
	for _, b := range []SectionBand{sec.Envelope50, sec.Envelope95} {
		// The bins cover 0 to 20 m: the last one holds 20 m.
		if len(b.DistM) == 0 {
			t.Fatalf("level %g: empty band", b.Level)
		}
		if last := b.DistM[len(b.DistM)-1]; b.DistM[0] != 0 || last > 20 || last+b.BinM <= 20 {
			t.Errorf("level %g: band from %g to %g m", b.Level, b.DistM[0], b.DistM[len(b.DistM)-1])
		}
		for i := range b.LowM {
			if b.LowM[i] != 3.5 || b.HighM[i] != 3.5 {
				t.Fatalf("level %g bin %d: %g to %g, want 3.5", b.Level, i, b.LowM[i], b.HighM[i])
			}
		}
	}
	// The column is within reach of the 95 % runs (0.5 radius + 0.9 m
	// stray + 0.5 margin = 1.9 m of the path) where the path comes within
	// 1.9 m of its face 1.8 m off: 0.608 m before and after its sides
	// (x = 9.8 and 10.2; sqrt(1.9² - 1.8²), Pythagoras), to a quarter bin.
	if len(sec.Obstacles) != 2 {
		t.Fatalf("obstacles in the section: %+v", sec.Obstacles)
	}
	c, q := sec.Obstacles[0], math.Sqrt(1.9*1.9-1.8*1.8)
	if math.Abs(c.FromM-(9.8-q)) > 0.1/4 || math.Abs(c.ToM-(10.2+q)) > 0.1/4 || c.TopM != 6 {
		t.Errorf("column in the section %+v, want from %g to %g", c, 9.8-q, 10.2+q)
	}
	// Every run passes over the stack (each within 0.5 m of y = 0..1):
	// its lowest point is 3.5 - 2 = 1.5 m above the top, first over it
	// when the ball's edge reaches x = 14, at x = 13.5 (13.5 s).
	v := reps[1].Vertical
	if v == nil || v.Runs != 10 || math.Abs(v.SmallestM-1.5) > 1e-12 || math.Abs(v.AtS-13.5) > 0.05 || math.Abs(v.AtDistanceM-13.5) > 0.05 {
		t.Errorf("over the stack: %+v", v)
	}
	// The column's smallest clearance (1.8 - 0.9 - 0.5 = 0.4 m) is where
	// the run at 0.9 m comes level with its face, from x = 9.8 m.
	if r := reps[0]; math.Abs(r.SmallestM-0.4) > 1e-9 || r.SmallestAtDistanceM < 9.8-0.05 || r.SmallestAtDistanceM > 10.2 || r.Vertical != nil {
		t.Errorf("column: %+v", r)
	}
}

// bandEvery is band found from every sample of the runs at once: each
// bin's lowest and highest over the heights of every piece between two
// samples whose distances span it (the plain form of band).
func bandEvery(e *Envelope, ds, lows map[int][]float64, bin float64) SectionBand {
	out := SectionBand{Level: e.Level, Inside: e.Inside, BinM: bin, DistM: []float64{}, LowM: []float64{}, HighM: []float64{}}
	low, high := map[int]float64{}, map[int]float64{}
	first, last := math.MaxInt, math.MinInt
	for _, m := range e.Members {
		d, lm := ds[m], lows[m]
		for i := range d {
			j0, j1 := binRange(d[max(i-1, 0)], d[i], bin)
			zl, zh := math.Min(lm[max(i-1, 0)], lm[i]), math.Max(lm[max(i-1, 0)], lm[i])
			for j := j0; j <= j1; j++ {
				if v, ok := low[j]; !ok || zl < v {
					low[j] = zl
				}
				if v, ok := high[j]; !ok || zh > v {
					high[j] = zh
				}
			}
			first, last = min(first, j0), max(last, j1)
		}
	}
	for j := first; j <= last; j++ {
		if v, ok := low[j]; ok {
			out.DistM = append(out.DistM, float64(j)*bin)
			out.LowM = append(out.LowM, v)
			out.HighM = append(out.HighM, high[j])
		}
	}
	return out
}

func TestBandFromRunBinsMatchesEvery(t *testing.T) {
	// The band joined from each run's own bins is the band found from
	// every run's samples at once: runs going forward and back, some far
	// apart so the bins between them hold none.
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := range 100 {
		ds, lows := map[int][]float64{}, map[int][]float64{}
		bins := map[int]runBins{}
		var members []int
		bin := 0.05 + rng.Float64()
		for m := range 1 + rng.IntN(12) {
			n := 1 + rng.IntN(60)
			d, z := make([]float64, n), make([]float64, n)
			x := rng.Float64()*40 - 20
			for i := range d {
				d[i], z[i] = x, rng.Float64()*5
				x += (rng.Float64() - 0.3) * 0.8
			}
			ds[m], lows[m], bins[m] = d, z, binSection(d, z, bin)
			if rng.IntN(3) > 0 {
				members = append(members, m)
			}
		}
		e := &Envelope{Level: 0.5, Inside: len(members), Members: members}
		if got, want := band(e, bins, bin), bandEvery(e, ds, lows, bin); !reflect.DeepEqual(got, want) {
			t.Fatalf("trial %d: band %+v, from every sample %+v", trial, got, want)
		}
	}
}
