package sway

import (
	"testing"
	"time"
)

func TestZZAllocs(t *testing.T) {
	ex := loadExamples(t)
	for _, name := range []string{"bay-girder-rigid", "precast-beam-tandem", "precast-panel-spreader", "diagonal-travel", "heavy-hook-long-slings"} {
		s := ex[name]
		for _, nh := range []bool{false, true} {
			res := testing.Benchmark(func(b *testing.B) {
				b.ReportAllocs()
				for range b.N {
					if _, err := EvaluateWith(s, Options{Validated: true, NoHistory: nh}); err != nil {
						b.Fatal(err)
					}
				}
			})
			t.Logf("%s nohist=%v: %d allocs, %d bytes per run, %v", name, nh, res.AllocsPerOp(), res.AllocedBytesPerOp(), res.T/time.Duration(res.N))
		}
	}
}
