package crane

import (
	"math"
	"testing"

	"swaysheet/core/motion"
)

// A jib slewing at a steady rate w carries the suspension point round a
// circle of radius r: speed r*w along the tangent, acceleration r*w^2
// toward the axis (uniform circular motion; any mechanics text, e.g.
// Meriam & Kraige, Engineering Mechanics: Dynamics, section 2/5).
func TestSteadySlewIsCircularMotion(t *testing.T) {
	const r, w = 20.0, 0.1 // m, rad/s
	var d Drives
	slew, _ := Of("slew")
	// A long trapezoid: at t = 50 s it cruises at w.
	*d.Of(slew) = motion.Sum{motion.NewTrapezoid(0, 100, w, 0.05, 0.05)}
	k := d.Suspension(Start{RadiusM: r})(50)
	if v := math.Hypot(k.Vel.X, k.Vel.Y); math.Abs(v-r*w) > 1e-12 {
		t.Errorf("speed %v, want r*w = %v", v, r*w)
	}
	a := math.Hypot(k.Acc.X, k.Acc.Y)
	if math.Abs(a-r*w*w) > 1e-12 {
		t.Errorf("acceleration %v, want r*w^2 = %v", a, r*w*w)
	}
	// Toward the axis: opposite to the position.
	if dot := k.Acc.X*k.Pos.X + k.Acc.Y*k.Pos.Y; dot >= 0 {
		t.Errorf("acceleration not toward the slew axis")
	}
}

// Without slewing or radius the point moves with the travel axes alone.
func TestTravelOnly(t *testing.T) {
	var d Drives
	x, _ := Of("travel_x")
	*d.Of(x) = motion.Sum{motion.NewTrapezoid(0, 10, 1, 0.5, 0.5)}
	k := d.Suspension(Start{})(1)
	if k.Pos.X != 0.25 || k.Vel.X != 0.5 || k.Acc.X != 0.5 || k.Pos.Y != 0 {
		t.Errorf("travel: %+v", k)
	}
	l, rate, _ := d.RopeLength(8)(1)
	if l != 8 || rate != 0 {
		t.Errorf("rope %v %v without hoisting", l, rate)
	}
}

func TestTable(t *testing.T) {
	seen := map[Role]bool{}
	for _, a := range Axes {
		if a.Kind == nil || a.Words == "" || seen[a.Role] {
			t.Errorf("axis %+v", a)
		}
		seen[a.Role] = true
	}
	if got := Names(true); len(got) != 3 || got[2] != "slew" {
		t.Errorf("plannable axes %v", got)
	}
	if _, ok := Of("luff"); ok {
		t.Error("unknown axis found")
	}
}

func TestWordsFor(t *testing.T) {
	for _, c := range []struct{ kind, axis, want string }{
		{"overhead", "travel_x", "bridge travel (x)"}, {"overhead", "travel_y", "trolley travel (y)"},
		{"gantry", "travel_x", "gantry travel (x)"}, {"tower", "slew", "slew"}, {"", "travel_x", "travel x"},
		{"overhead", "nope", "nope"},
	} {
		if got := WordsFor(c.kind, c.axis); got != c.want {
			t.Errorf("%s %s: %q, want %q", c.kind, c.axis, got, c.want)
		}
	}
}

// The planner's linear theory of each axis: the hook moves r·dphi along
// the arc of a slew at radius r and leans out by atan(r·w²/g) at rate w
// (circular motion; any dynamics text); a travel moves it one for one and
// does not lean it; the hoist does not move it sideways.
func TestPlannerGeometry(t *testing.T) {
	at := Start{RadiusM: 35}
	for _, c := range []struct {
		axis        string
		hook, outer float64
	}{{"travel_x", 1, 0}, {"travel_y", 1, 0}, {"radius", 1, 0}, {"hoist", 0, 0}, {"slew", 35, 35 * 0.07 * 0.07}} {
		a, _ := Of(c.axis)
		if got := a.HookPerUnit(at); got != c.hook {
			t.Errorf("%s: hook per unit %g, want %g", c.axis, got, c.hook)
		}
		if got := a.OutwardAccel(at, 0.07); math.Abs(got-c.outer) > 1e-15 {
			t.Errorf("%s: outward acceleration %g, want %g", c.axis, got, c.outer)
		}
	}
	// The hook's first direction: the jib at 30 deg turning forward moves
	// it along the tangent (-sin 30°, cos 30°); the trolley along the jib.
	at.SlewRad = math.Pi / 6
	for axis, want := range map[string][2]float64{"travel_x": {1, 0}, "travel_y": {0, 1}, "slew": {-0.5, math.Sqrt(3) / 2},
		"radius": {math.Sqrt(3) / 2, 0.5}, "hoist": {0, 0}} {
		a, _ := Of(axis)
		if d := a.HookDirection(at); math.Abs(d.X-want[0]) > 1e-15 || math.Abs(d.Y-want[1]) > 1e-15 || d.Z != 0 {
			t.Errorf("%s: hook direction %v, want %v", axis, d, want)
		}
	}
}

// An axis without moves is not asked (Suspension, RopeLength): the
// closures give the general sum's bits, signed zeros included, with the
// travel on x alone, on y alone, on both, and without hoisting.
func TestIdleAxesAsGeneral(t *testing.T) {
	bits := func(v float64) uint64 { return math.Float64bits(v) }
	move := motion.Sum{motion.NewTrapezoid(0.5, 10, 1, 0.5, 0.3)}
	for _, axes := range [][]string{{"travel_x"}, {"travel_y"}, {"travel_x", "travel_y"}, {}} {
		var d Drives
		for _, name := range axes {
			a, _ := Of(name)
			*d.Of(a) = move
		}
		susp, rope := d.Suspension(Start{}), d.RopeLength(8)
		x, y, h := motion.Combine(d[AlongX]...), motion.Combine(d[AlongY]...), motion.Combine(d[Rope]...)
		for _, tm := range []float64{0, 0.7, 3, 9.9, 12} {
			k := susp(tm)
			a, b, hh := x.At(tm), y.At(tm), h.At(tm)
			got := [9]float64{k.Pos.X, k.Pos.Y, k.Pos.Z, k.Vel.X, k.Vel.Y, k.Vel.Z, k.Acc.X, k.Acc.Y, k.Acc.Z}
			want := [9]float64{a.Pos, b.Pos, 0, a.Vel, b.Vel, 0, a.Acc, b.Acc, 0}
			for i := range got {
				if bits(got[i]) != bits(want[i]) {
					t.Errorf("axes %v, t = %g s: suspension %v, general %v", axes, tm, got, want)
					break
				}
			}
			l, dl, ddl := rope(tm)
			if bits(l) != bits(8-hh.Pos) || bits(dl) != bits(-hh.Vel) || bits(ddl) != bits(-hh.Acc) {
				t.Errorf("axes %v, t = %g s: rope %v %v %v, general %v %v %v", axes, tm, l, dl, ddl, 8-hh.Pos, -hh.Vel, -hh.Acc)
			}
		}
	}
}
