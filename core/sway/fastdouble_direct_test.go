package sway

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestDirectFuncIsFunc: the hook block's right-hand side as a function
// value that calls eval directly (DirectFunc, which its scan and the mode
// period's run give the solver) writes Func's bits, on states of every
// direction and rate, along the moves of every example with a hook block.
func TestDirectFuncIsFunc(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	checked := 0
	for name, s := range loadExamples(t) {
		su, err := build(s, false)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		d, ok := su.model.(*fastDouble)
		if !ok {
			continue
		}
		checked++
		f := d.DirectFunc()
		end := su.motionEnd + 1
		for i := range 200 {
			a := end * float64(i) / 200
			d.segment(a, a+end/200)
			tt := a + rng.Float64()*end/200
			var y, want, got [12]float64
			for k := range y {
				y[k] = rng.NormFloat64()
			}
			for _, n := range []int{0, 6} { // unit directions
				l := math.Sqrt(y[n]*y[n] + y[n+1]*y[n+1] + y[n+2]*y[n+2])
				y[n], y[n+1], y[n+2] = y[n]/l, y[n+1]/l, y[n+2]/l
			}
			d.Func(tt, y[:], want[:])
			f(tt, y[:], got[:])
			for k := range got {
				if math.Float64bits(got[k]) != math.Float64bits(want[k]) {
					t.Fatalf("%s at t = %g: component %d is %v, Func gives %v", name, tt, k, got[k], want[k])
				}
			}
		}
	}
	if checked == 0 {
		t.Fatal("no example with a hook block")
	}
}
