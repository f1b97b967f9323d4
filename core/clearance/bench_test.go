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
