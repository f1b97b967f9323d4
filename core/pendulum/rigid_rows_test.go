package pendulum

import (
	"math"
	"sort"
	"strconv"
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

// Eval's hook and legs' ends (written out in evalForces) are kinInto's,
// bit for bit, for every arrangement, moving; with one hook on the body,
// so are the rope's rate and the rigging's pull that come from the hook's
// velocity and acceleration.
func TestEvalEndsAsKin(t *testing.T) {
	for name, r := range movingArrangements() {
		mustPrepare(t, r)
		y := offRest(r)
		for _, tm := range []float64{0.7, 2.3} {
			var p Point
			r.Eval(tm, y, &p)
			f := r.frameOf(tm, y)
			geo := r.geo
			var hook r3.Vec
			switch {
			case geo.twoTop:
				hook = f.s.Pos
			case geo.hookPoint:
				hook = f.P
			default:
				hook = r.kinOf(&f, end{kind: onBody, b: geo.hook}, 0).p
			}
			if p.HookPos != hook {
				t.Errorf("%s, t = %g s: hook %v, kinInto %v", name, tm, p.HookPos, hook)
			}
			for i := range p.Body.NLegs {
				top, foot := hook, r.kinOf(&f, end{kind: onBody, b: geo.attach[i]}, i).p
				if geo.twoTop {
					top = r.kinOf(&f, end{kind: onTop}, i).p
				}
				if p.Body.LegTop[i] != top || p.Body.LegEnd[i] != foot {
					t.Errorf("%s, t = %g s, leg %d: ends %v %v, kinInto %v %v", name, tm, i, p.Body.LegTop[i], p.Body.LegEnd[i], top, foot)
				}
			}
			if geo.twoTop || geo.hookPoint {
				continue
			}
			// One hook on the body: the rope's rate from the hook's
			// velocity, the rigging's pull from its acceleration.
			k := r.kinOf(&f, end{kind: onBody, b: geo.hook}, 0)
			d := r3.Sub(k.p, f.s.Pos)
			if r.Pivot {
				d = r3.Sub(p.LoadPos, f.s.Pos)
			}
			dir := r3.Scale(1/length(d), d)
			rel := r3.Sub(k.v, f.s.Vel)
			rate := r3.Scale(1/length(d), r3.Sub(rel, r3.Scale(r3.Dot(rel, dir), dir)))
			z, lam := r.accel(&f)
			rope := r3.Scale(lam[0], r3.Sub(k.p, f.s.Pos))
			if r.Pivot {
				rope = r3.Vec{X: lam[0], Y: lam[1], Z: lam[2]}
			}
			aH := r3.Add(r3.Add(r3.Vec{X: z[0], Y: z[1], Z: z[2]}, r3.Cross(r3.Vec{X: z[3], Y: z[4], Z: z[5]}, k.arm)), k.a0)
			pull := r3.Sub(r3.Scale(r.HookMass, r3.Add(aH, r3.Vec{Z: r.g()})), rope)
			if p.Rate != rate || p.RiggingTension != length(pull) {
				t.Errorf("%s, t = %g s: rate %v, rigging %v; from kinInto %v, %v", name, tm, p.Rate, p.RiggingTension, rate, length(pull))
			}
		}
	}
}

// Without a slew the parallel legs' top points come from the cosine and
// sine of the heading kept by Prepare: the bits of the sums with the
// functions asked at every frame, for headings of +0, -0 and 0.4 rad.
func TestFrameWithoutSlew(t *testing.T) {
	for _, heading := range []float64{0, math.Copysign(0, -1), 0.4} {
		for name, r := range movingArrangements() {
			r.Yaw, r.Heading = nil, heading
			mustPrepare(t, r)
			if !r.geo.twoTop {
				continue
			}
			f := r.frameOf(1.3, offRest(r))
			h := r.Heading + 0.0
			c, s := math.Cos(h), math.Sin(h)
			e, et := r3.Vec{X: c, Y: s}, r3.Vec{X: -s, Y: c}
			for i, a := range r.geo.top {
				top, topV, topA := r3.Scale(a, e), r3.Scale(a*0, et), r3.Add(r3.Scale(a*0, et), r3.Scale(-a*0*0, e))
				if !sameBits(f.top[i], top) || !sameBits(f.topV[i], topV) || !sameBits(f.topA[i], topA) {
					t.Errorf("%s, heading %g: top %d %v %v %v, from the functions %v %v %v", name, heading, i, f.top[i], f.topV[i], f.topA[i], top, topV, topA)
				}
			}
		}
	}
}

// sameBits: a and b are the same to the bit (signed zeros told apart).
func sameBits(a, b r3.Vec) bool {
	return math.Float64bits(a.X) == math.Float64bits(b.X) && math.Float64bits(a.Y) == math.Float64bits(b.Y) &&
		math.Float64bits(a.Z) == math.Float64bits(b.Z)
}

// LegCount is the number of leg tensions Eval reports, for every
// arrangement (the recorder sizes a rigid load's history by it before
// the first sample).
func TestLegCountAsEval(t *testing.T) {
	for name, r := range movingArrangements() {
		mustPrepare(t, r)
		var p Point
		r.Eval(0.7, offRest(r), &p)
		if got := r.LegCount(); got != p.Body.NLegs {
			t.Errorf("%s: LegCount %d, Eval reports %d legs", name, got, p.Body.NLegs)
		}
	}
}

// sortModes orders modes as sort.SliceStable did with the same
// comparison: slowest first, free modes last, equal ones in their order.
func TestSortModesAsStable(t *testing.T) {
	periods := []float64{3, 0, 5.5, 3, 1e-3, 0, 5.5, 12, 3}
	for n := range len(periods) + 1 {
		for shift := range n + 1 {
			ms := make([]RigidMode, n)
			for i := range ms {
				p := periods[(i+shift)%len(periods)]
				ms[i] = RigidMode{PeriodS: p, Free: p == 0, Kind: strconv.Itoa(i)}
			}
			want := append([]RigidMode(nil), ms...)
			sort.SliceStable(want, func(a, b int) bool {
				if want[a].Free != want[b].Free {
					return !want[a].Free
				}
				return want[a].PeriodS > want[b].PeriodS
			})
			sortModes(ms)
			for i := range ms {
				if ms[i].Kind != want[i].Kind {
					t.Fatalf("%d modes, shift %d: %v, want %v", n, shift, ms, want)
				}
			}
		}
	}
}
