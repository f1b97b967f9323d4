package plan

import (
	"swaysheet/core/internal/cputime"
	"testing"
)

// BenchmarkPlanExamples is one full plan of each planning example. Besides
// the wall time it reports the CPU time per plan (cpu-ms/op, all threads),
// the steadier figure on a shared machine; speed targets live in make
// bench (core/cmd/swaybench), never in tests.
func BenchmarkPlanExamples(b *testing.B) {
	for _, name := range []string{"plan-bay-travel.json", "plan-tower-slew.json", "plan-precast-hook.json", "plan-gantry-pendant.json"} {
		s := load(b, name)
		b.Run(name, func(b *testing.B) {
			c0 := cputime.Seconds()
			sims := 0
			for b.Loop() {
				r, err := Make(s)
				if err != nil {
					b.Fatal(err)
				}
				sims = r.Simulations
			}
			if c := cputime.Seconds(); c > 0 {
				b.ReportMetric((c-c0)*1e3/float64(b.N), "cpu-ms/op")
			}
			b.ReportMetric(float64(sims), "sims/op")
		})
	}
}
