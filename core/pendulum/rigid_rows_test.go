package pendulum

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// movingArrangements are the girder in every arrangement, moving: the
// suspension point accelerating, the rope paying out, the crane slewing.
func movingArrangements() map[string]*Rigid {
	moving := func(r *Rigid) *Rigid {
		r.HookMass = 300
		r.Suspension = func(t float64) Kinematics {
			return Kinematics{Pos: r3.Vec{X: 0.3 * t * t, Y: -0.1 * t, Z: 0.02}, Vel: r3.Vec{X: 0.6 * t, Y: -0.1}, Acc: r3.Vec{X: 0.6, Z: -0.05}}
		}
		r.Rope = func(t float64) (float64, float64, float64) { return 5 + 0.2*t, 0.2, 0.01 }
		r.Yaw = func(t float64) (float64, float64, float64) { return 0.05 * t * t, 0.1 * t, 0.1 }
		return r
	}
	cases := map[string]*Rigid{}
	four := girder()
	four.Legs = fourLegs(8, 0.5, 1, 5)
	cases["four legs"] = moving(four)
	pivot := girder()
	pivot.Legs, pivot.Pivot = fourLegs(8, 0.5, 1, 5), true
	cases["pivot"] = moving(pivot)
	two := girder()
	two.Legs = []Leg{{Attach: r3.Vec{X: 4, Z: 0.5}, Length: 5}, {Attach: r3.Vec{X: -4, Z: 0.5}, Length: 5}}
	cases["two legs"] = moving(two)
	spread := girder()
	spread.Spreader, spread.SpreaderZ = 4, 0.5
	cases["spreader"] = moving(spread)
	tandem := tandemGirder(5, [2]float64{0.3, -0.2})
	cases["tandem"] = moving(tandem)
	return cases
}

// offRest is r's rest state moved off the rest and off the constraints:
// every term of the rows in play, none of them zero by symmetry.
func offRest(r *Rigid) []float64 {
	y := r.Rest(0)
	for i := 1; i < len(y); i++ {
		y[i] += 0.01 * math.Sin(float64(3*i+1))
	}
	return y
}

// rows (the ends written out) and rowOf (kinInto and addPart) give the
// same bits, for every arrangement, off the constraints and moving.
func TestRowsAsRowOf(t *testing.T) {
	for name, r := range movingArrangements() {
		mustPrepare(t, r)
		y := offRest(r)
		for _, tm := range []float64{0.7, 2.3} {
			f := r.frameOf(tm, y)
			var buf [3]row
			got := r.rows(&f, buf[:0])
			if len(got) != len(r.geo.cons) {
				t.Fatalf("%s: %d rows for %d constraints", name, len(got), len(r.geo.cons))
			}
			for i := range got {
				var want row
				r.rowOf(&f, &r.geo.cons[i], i, &want)
				if got[i] != want {
					t.Errorf("%s, t = %g s, constraint %d: rows %+v, rowOf %+v", name, tm, i, got[i], want)
				}
			}
		}
	}
}
