package sheet

import (
	"io"
	"testing"

	"swaysheet/core/sway"
)

// BenchmarkBuild: one check sheet of the demo scenario from its result
// (the evaluation itself is core/sway's benchmark).
func BenchmarkBuild(b *testing.B) {
	s := demoB(b, "bay-travel.json")
	r, err := sway.Evaluate(s)
	if err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		sh, err := Build(Input{Scenario: s, Result: r, Evaluated: s})
		if err != nil {
			b.Fatal(err)
		}
		if err := sh.WriteDocument(io.Discard); err != nil {
			b.Fatal(err)
		}
	}
}
