package clearance

import (
	"swaysheet/core/internal/cputime"
	"swaysheet/core/internal/testscenario"
	"swaysheet/core/sway"
	"testing"
)

func BenchmarkCheckBayColumns(b *testing.B) {
	s := testscenario.Example(b, "site-bay-columns")
	for b.Loop() {
		if _, err := Check(s, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkCheckPartPerRun is the cost of one run of a part on one
// worker (simulation, obstacle check, sweep and section data), the
// figure the page's workers pay per run.
func BenchmarkCheckPartPerRun(b *testing.B) {
	s := testscenario.Example(b, "site-bay-columns")
	const runs = 20
	cpu := cputime.Seconds()
	for b.Loop() {
		if _, err := CheckPart(s, 0, runs, Options{Workers: 1}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*runs)/1e6, "ms/run")
	b.ReportMetric((cputime.Seconds()-cpu)*1e3/float64(b.N*runs), "cpu-ms/run")
}

// BenchmarkObstaclesPerRun is the cost of checking one run's path against
// every obstacle (the simulation left out: the runs are made once), the
// part of a run's cost that the obstacle geometry adds.
func BenchmarkObstaclesPerRun(b *testing.B) {
	for _, name := range []string{"site-bay-columns", "site-tower-hoarding"} {
		b.Run(name, func(b *testing.B) {
			s := testscenario.Example(b, name)
			sp, err := SpecOf(s)
			if err != nil {
				b.Fatal(err)
			}
			site := SiteOf(s.Site)
			const n = 20
			runs := make([]Run, n)
			for i := range runs {
				r, err := sway.EvaluateWith(sp.Variant(i), sway.Options{LegEnds: true})
				if err != nil {
					b.Fatal(err)
				}
				runs[i] = RunOf(r)
			}
			cpu := cputime.Seconds()
			for b.Loop() {
				for i := range runs {
					site.checkRun(&runs[i], 0.02)
				}
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*n)/1e6, "ms/run")
			b.ReportMetric((cputime.Seconds()-cpu)*1e3/float64(b.N*n), "cpu-ms/run")
		})
	}
}
