package motion

import "testing"

// TestWork checks the work counted for an evaluation: one for each
// combined or shaped lookup, one for a move of constant acceleration, two
// for a move of spans (a binary search among them), only while moving.
func TestWork(t *testing.T) {
	tr := NewTrapezoid(0, 4, 0.5, 0.3, 0.3)
	st, err := NewSteps([]Step{{AtS: 0, Speed: 0.5}, {AtS: 5, Speed: 0}}, 0.3, 0.3)
	if err != nil {
		t.Fatal(err)
	}
	sh := &Shaped{Base: tr, Impulses: []Impulse{{A: 0.5, T: 0}, {A: 0.5, T: 2}}}
	c := Combine(tr, st, sh)
	for _, w := range []struct {
		at   float64
		want int
	}{{-1, 1}, {1, 1 + 1 + 2 + (1 + 1)}, {3, 1 + 1 + 2 + (1 + 2)}, {100, 1}} {
		if got := Work(c, w.at); got != w.want {
			t.Errorf("Work at %g s: %d, want %d", w.at, got, w.want)
		}
	}
	// Combined gives Sum's values.
	for x := -1.0; x < 20; x += 0.01 {
		if a, b := c.At(x), (Sum{tr, st, sh}).At(x); a != b {
			t.Fatalf("at %g: Combined %+v, Sum %+v", x, a, b)
		}
	}
}
