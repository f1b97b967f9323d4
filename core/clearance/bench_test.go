package clearance

import (
	"swaysheet/core/internal/testscenario"
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
	for b.Loop() {
		if _, err := CheckPart(s, 0, runs, Options{Workers: 1}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*runs)/1e6, "ms/run")
}
