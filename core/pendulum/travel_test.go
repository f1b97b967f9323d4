package pendulum

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// Rigid.frameInto writes Travel.At out (no call on the hot path): the
// frame's suspension point and rope are At's, bit for bit, at times
// forward, back and on the spans' starts; with no spans the suspension
// point is at +0 and the rope's rates -0, as the closures give for axes
// without moves.
func TestTravelAtAsFrame(t *testing.T) {
	bits := math.Float64bits
	x := []Span{{Start: math.Inf(-1), Origin: 1}, {Start: 1, Origin: 1, A: 0.5}, {Start: 3, Origin: 3, P: 1, V: 1}, {Start: 5, Origin: 5, P: 3, V: 1, A: -0.5, J: 0.1}}
	h := []Span{{Start: math.Inf(-1), Origin: 2}, {Start: 2, Origin: 2, J: 0.2}}
	for name, tr := range map[string]*Travel{"x and hoist": NewTravel(x, nil, h, 6), "no spans": NewTravel(nil, nil, nil, 6)} {
		r := girder()
		r.Legs = fourLegs(8, 0.5, 1, 5)
		mustPrepare(t, fixedRigid(r, 6))
		r.Travel = tr
		y := r.Rest(0)
		for _, tm := range []float64{0, 0.5, 1, 2.5, 3, 4.9, 5, 9, 2, 0.2, 6} {
			f := r.frameOf(tm, y)
			s, l, dl, ddl := tr.At(tm)
			got := [12]float64{f.s.Pos.X, f.s.Pos.Y, f.s.Pos.Z, f.s.Vel.X, f.s.Vel.Y, f.s.Vel.Z, f.s.Acc.X, f.s.Acc.Y, f.s.Acc.Z, f.l, f.dl, f.ddl}
			want := [12]float64{s.Pos.X, s.Pos.Y, s.Pos.Z, s.Vel.X, s.Vel.Y, s.Vel.Z, s.Acc.X, s.Acc.Y, s.Acc.Z, l, dl, ddl}
			for i := range got {
				if bits(got[i]) != bits(want[i]) {
					t.Errorf("%s, t = %g s: frame %v, At %v", name, tm, got, want)
					break
				}
			}
		}
		if name == "no spans" {
			s, l, dl, ddl := tr.At(4)
			if s.Pos != (r3.Vec{}) || s.Vel != (r3.Vec{}) || s.Acc != (r3.Vec{}) || math.Signbit(s.Pos.X) || l != 6 || !math.Signbit(dl) || !math.Signbit(ddl) {
				t.Errorf("no spans: %v %v %v %v, want +0 everywhere, the rope 6 m, its rates -0", s, l, dl, ddl)
			}
		}
	}
	// The spans' own values: on x at t = 4, the third span.
	s, _, _, _ := NewTravel(x, nil, h, 6).At(4)
	if s.Pos != (r3.Vec{X: 2}) || s.Vel.X != 1 {
		t.Errorf("x at 4 s: %v, want 2 m at 1 m/s", s)
	}
}
