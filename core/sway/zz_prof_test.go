package sway

import (
	"os"
	"testing"

	"swaysheet/core/scenario"
)

func TestZZProf(t *testing.T) {
	data, _ := os.ReadFile(os.Getenv("HOSTILE"))
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	r, err := EvaluateWith(s, Options{NoHistory: true})
	if err != nil {
		t.Log(err)
		return
	}
	t.Logf("%+v", r.Solver)
}
