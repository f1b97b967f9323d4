package clearance

import (
	"math"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// restingGirder is the rigid girder of bay-girder-rigid (13 m x 0.5 m x
// 1 m, level on two legs) hanging still: no moves, suspension 12 m up.
func restingGirder(t *testing.T) *scenario.Scenario {
	t.Helper()
	s := testscenario.Example(t, "bay-girder-rigid")
	s.Motions = nil
	h, r := 12.0, 0.0
	s.Site = &scenario.Site{SuspensionHeightM: &h, LoadRadiusM: &r}
	return s
}

func TestRigidLoadAtRestCornersAreTheBox(t *testing.T) {
	s := restingGirder(t)
	res, err := sway.EvaluateWith(s, sway.Options{LegEnds: true})
	if err != nil {
		t.Fatal(err)
	}
	run := RunOf(res)
	if !run.Rigid() {
		t.Fatal("a rigid load's run has no corners")
	}
	// Hanging still and level, the corners are the centre of mass plus
	// (+/-6.5, +/-0.25, +/-0.5) m, the box's half sides (the scenario's
	// length, width and height): exactly (to rounding) at the start, and
	// to 1e-6 m over the run (the integrator's rest drifts by 1e-8 m).
	for i, b := range run.Boxes(12) {
		for k, c := range b.Corners {
			want := Point3{b.Centre.X + sign(k, 0)*6.5, b.Centre.Y + sign(k, 1)*0.25, b.Centre.Z + sign(k, 2)*0.5}
			if tol := map[bool]float64{true: 1e-12, false: 1e-6}[i == 0]; dist3(c, want) > tol {
				t.Fatalf("sample %d corner %d at %+v, want %+v", i, k, c, want)
			}
		}
	}
	// Its outline from above is the 13 m x 0.5 m rectangle under the
	// suspension point, and its lowest point is the centre less 0.5 m.
	b := run.Boxes(12)[0]
	hull, low := footprint(&b.Corners)
	if len(hull) != 4 || math.Abs(area(hull)-6.5) > 1e-9 || math.Abs(low-(b.Centre.Z-0.5)) > 1e-12 {
		t.Errorf("outline %v (area %g), lowest %g", hull, area(hull), low)
	}
	// A column 1 m off its long side, below it: 1 m (hand: the gap
	// between y = 0.25 and y = 1.25); under its end 0.3 m below its
	// bottom face: over it, gap 0.3 m.
	col := Obstacle{Name: "column", Outline: Rectangle(0, 1.5, 0.5, 0.5, 0), TopM: 11}
	if v, over, _ := col.BoxClearance(&b.Corners); over || math.Abs(v-1) > 1e-9 {
		t.Errorf("beside: %g (over %v), want 1", v, over)
	}
	under := Obstacle{Name: "stack", Outline: Rectangle(6, 0, 1, 1, 0), TopM: low - 0.3}
	if v, over, gap := under.BoxClearance(&b.Corners); !over || math.Abs(v-0.3) > 1e-9 || math.Abs(gap-0.3) > 1e-9 {
		t.Errorf("under: %g, over %v, gap %g; want 0.3, true, 0.3", v, over, gap)
	}
	// The envelope is that rectangle, to a cell: with 0.1 m cells on a
	// grid that starts a cell outside it, 131 x 5 or 6 cells per row.
	rep, err := Evaluate(s, 3, 0, nil, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Outline != OutlineBox {
		t.Fatalf("outline %q", rep.Outline)
	}
	if a := rep.Envelope95.AreaM2; a < 6.5 || a > 13.2*0.7+1e-9 {
		t.Errorf("envelope area %g m², the box's outline is 6.5 m²", a)
	}
}

// sign is the sign of corner k's offset along axis bit (sway.BodyHistory:
// minus where the bit is set).
func sign(k, bit int) float64 {
	if k>>bit&1 == 1 {
		return -1
	}
	return 1
}

func TestHullAndPolygonDistanceHandCases(t *testing.T) {
	// The hull of a square's corners and its centre is the square.
	h := Hull([]Point2{{0, 0}, {2, 0}, {1, 1}, {2, 2}, {0, 2}})
	if len(h) != 4 || area(h) != 4 {
		t.Errorf("hull %v", h)
	}
	// Two unit squares 3 m apart along x: 3 m; offset by (3, 4) corner to
	// corner: 5 m (Pythagoras); overlapping: 0.
	a := Rectangle(0.5, 0.5, 1, 1, 0)
	if d := PolygonDistance(a, Rectangle(4.5, 0.5, 1, 1, 0)); math.Abs(d-3) > 1e-12 {
		t.Errorf("side by side %g, want 3", d)
	}
	if d := PolygonDistance(a, Rectangle(4.5, 5.5, 1, 1, 0)); math.Abs(d-5) > 1e-12 {
		t.Errorf("corner to corner %g, want 5", d)
	}
	if d := PolygonDistance(a, Rectangle(1, 1, 1, 1, 0)); d != 0 {
		t.Errorf("overlapping %g", d)
	}
}

func TestBoxPathSkipsOnlyWhatCannotMatter(t *testing.T) {
	// A 4 m x 1 m x 1 m box carried 20 m along x, swaying and tilting a
	// little, past a column, over a low stack and into a wall: the pieces
	// passed over without points between their ends change nothing
	// (every moment checked one by one gives the same answer).
	var path []BoxSample
	for i := 0; i <= 200; i++ {
		t := float64(i) * 0.1
		c := Point3{t, 0.3 * math.Sin(t), 3 + 0.1*math.Cos(2*t)}
		b := BoxSample{TimeS: t, Centre: c}
		tilt := 0.05 * math.Sin(1.3*t)
		for k := range b.Corners {
			x, y, z := sign(k, 0)*2, sign(k, 1)*0.5, sign(k, 2)*0.5
			b.Corners[k] = Point3{c.X + x, c.Y + y, c.Z + z + tilt*x}
		}
		path = append(path, b)
	}
	obstacles := []Obstacle{
		{Name: "column", Outline: Rectangle(8, 2.5, 0.5, 0.5, 0), TopM: 8},
		{Name: "stack", Outline: Rectangle(12, 0, 1, 1, 0), TopM: 2.2},
		{Name: "wall", Outline: Rectangle(19, 0, 0.2, 6, 0), TopM: 5},
	}
	for _, o := range obstacles {
		got := o.AlongBoxPath(path, 0.02)
		want := Closest{ClearanceM: math.Inf(1), GapM: math.Inf(1), FirstStrikeS: math.NaN()}
		for i := 0; i+1 < len(path); i++ {
			a, b := &path[i], &path[i+1]
			move := 0.0
			for k := range a.Corners {
				move = math.Max(move, dist3(a.Corners[k], b.Corners[k]))
			}
			n := max(int(math.Ceil(move/0.02)), 1)
			for s := 0; s <= n; s++ {
				f := float64(s) / float64(n)
				var cs [8]Point3
				for k := range cs {
					cs[k] = lerp3(a.Corners[k], b.Corners[k], f)
				}
				v, over, gap := o.BoxClearance(&cs)
				want.ClearanceM = math.Min(want.ClearanceM, v)
				if over {
					want.GapM = math.Min(want.GapM, gap)
				}
				if v < 0 && !want.Strikes {
					want.Strikes, want.FirstStrikeS = true, a.TimeS+f*(b.TimeS-a.TimeS)
				}
			}
		}
		if (o.Name == "wall") != got.Strikes || (o.Name == "column") != math.IsInf(got.GapM, 1) {
			t.Errorf("%s: strikes %v, gap %g: the case does not test what it says", o.Name, got.Strikes, got.GapM)
		}
		if got.ClearanceM != want.ClearanceM || got.GapM != want.GapM || got.Strikes != want.Strikes ||
			(want.Strikes && got.FirstStrikeS != want.FirstStrikeS) {
			t.Errorf("%s: got %g, gap %g, strike %v at %g; every moment: %g, %g, %v at %g", o.Name,
				got.ClearanceM, got.GapM, got.Strikes, got.FirstStrikeS, want.ClearanceM, want.GapM, want.Strikes, want.FirstStrikeS)
		}
	}
}
