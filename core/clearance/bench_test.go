package clearance

import (
	"os"
	"testing"

	"swaysheet/core/scenario"
)

func BenchmarkCheckBayColumns(b *testing.B) {
	data, err := os.ReadFile("../../testdata/scenarios/site-bay-columns.json")
	if err != nil {
		b.Fatal(err)
	}
	s, err := scenario.Parse(data)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		if _, err := Check(s, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}
