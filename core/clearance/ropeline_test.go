package clearance

import (
	"math"
	"strings"
	"testing"

	"swaysheet/core/internal/testscenario"
	"swaysheet/core/sway"
)

// TestRunLines: the hoisting gear's lines of a run are the model's own:
// the hoist rope as long as the rope (to the hook, or to the ball of a
// point load), a sling leg as long as the leg, a spreader's legs as long
// as the rope (named spreader legs, not sling legs), the rigging from the
// hook towards the load.
func TestRunLines(t *testing.T) {
	cases := []struct {
		example string
		names   []string
		// lengths of the lines (0: not checked), from the scenario
		lengths func(r *Run, i int) []float64
	}{
		{"site-bay-columns", []string{"hoist rope"}, func(r *Run, i int) []float64 { return []float64{r.RopeM[i] - 1.2} }},
		// bay-girder-rigid: rope 5 m to the hook, legs 5.831 m.
		{"bay-girder-rigid", []string{"hoist rope", "sling leg 1", "sling leg 2"}, func(r *Run, i int) []float64 { return []float64{r.RopeM[i], 5.831, 5.831} }},
		// precast-panel-spreader: two parallel legs as long as the rope.
		{"precast-panel-spreader", []string{sway.LegName(sway.Spreader, 0), "spreader leg 2"}, func(r *Run, i int) []float64 { return []float64{r.RopeM[i], r.RopeM[i]} }},
		{"heavy-hook-long-slings", []string{"hoist rope", "rigging"}, func(r *Run, i int) []float64 { return []float64{r.RopeM[i], 0} }},
		// precast-beam-tandem: two hook ropes, named as the figures name
		// them, 6 m (the rope length) and 6.2 m long.
		{"precast-beam-tandem", []string{sway.HookRope(0), sway.HookRope(1)}, func(r *Run, i int) []float64 { return []float64{r.RopeM[i], r.RopeM[i] + 0.2} }},
	}
	for _, c := range cases {
		s := testscenario.Example(t, c.example)
		res, err := sway.EvaluateWith(s, sway.Options{LegEnds: true})
		if err != nil {
			t.Fatal(err)
		}
		run := RunOf(res)
		lines := run.Lines(20, 1.2)
		var names []string
		for _, l := range lines {
			names = append(names, l.Name)
		}
		if strings.Join(names, ",") != strings.Join(c.names, ",") {
			t.Errorf("%s: lines %v, want %v", c.example, names, c.names)
			continue
		}
		for i := 0; i < len(run.TimeS); i += 37 {
			want := c.lengths(&run, i)
			for k, l := range lines {
				if want[k] > 0 && math.Abs(dist3(l.A[i], l.B[i])-want[k]) > 1e-3 {
					t.Errorf("%s %s at %.2f s: length %.5f, want %.5f", c.example, l.Name, l.TimeS[i], dist3(l.A[i], l.B[i]), want[k])
				}
			}
			if l := lines[0]; l.Name == "hoist rope" && (l.A[i].Z != 20 || l.A[i].X != run.SuspensionXM[i]) {
				t.Errorf("%s: the rope starts at %+v", c.example, l.A[i])
			}
		}
	}
}

// TestRopeStrikesWhereTheLoadClears: a load hanging out to the side of
// its suspension point passes beside a post while its rope passes through
// the post's top: the load keeps the margin, the rope strikes, and the
// obstacle is not cleared.
func TestRopeStrikesWhereTheLoadClears(t *testing.T) {
	// The suspension point at 12 m moves along x from -4 to 4 m in 8 s;
	// the load's centre hangs 1.4 m to the side (+y) and 7.9 m below it
	// (a wind's lean). The post stands at x in [-0.2, 0.2], y in
	// [0.4, 0.8], 9 m high.
	var r Run
	for i := 0; i <= 80; i++ {
		ts := float64(i) * 0.1
		r.TimeS = append(r.TimeS, ts)
		r.SuspensionXM, r.SuspensionYM = append(r.SuspensionXM, -4+ts), append(r.SuspensionYM, 0)
		r.RelXM, r.RelYM, r.RelZM = append(r.RelXM, 0), append(r.RelYM, 1.4), append(r.RelZM, -7.9)
	}
	post := Obstacle{Name: "post", Outline: Rectangle(0, 0.6, 0.4, 0.4, 0), TopM: 9}
	site := &Site{SuspensionHeightM: 12, Obstacles: []Obstacle{post}, MarginM: 0.2, LoadRadiusM: 0.3}
	reps, err := site.Check([]Run{r}, 0.02)
	if err != nil {
		t.Fatal(err)
	}
	o := reps[0]
	// Hand computation: the load's ball (radius 0.3 m about y = 1.4 m)
	// comes to 1.4 - 0.3 - 0.8 = 0.3 m of the post's face y = 0.8 m.
	if math.Abs(o.SmallestM-0.3) > 1e-9 || o.LoadStrikes != 0 {
		t.Errorf("load: smallest %g, strikes %d; want 0.3 m (hand computation), none", o.SmallestM, o.LoadStrikes)
	}
	// Hand computation: in the plane x = 0 the rope runs from (y, z) =
	// (0, 12) to the ball's top, at (1.4, 4.1) + 0.3*(-1.4, 7.9)/8.023;
	// it is at y = 0.4 at z = 12 - 7.9*0.4/1.4 = 9.743 m and at y = 0.8
	// at 7.486 m: it passes through the post below its 9 m top, first at
	// the moment its plane reaches the post's near face, x = -0.2 (3.8 s).
	rp := o.Rope
	if rp == nil || rp.Strikes != 1 || rp.KeepMargin != 0 || math.Abs(rp.FirstStrikeS-3.8) > 0.021 || rp.Part != "hoist rope" {
		t.Fatalf("rope: %+v", rp)
	}
	if z := rp.FirstStrikeAtHeightM; z < 7.486 || z > 9 {
		t.Errorf("rope's first strike at %g m up, want between 7.486 and 9 m (hand computation)", z)
	}
	if o.KeepMargin != 0 || o.ShareKeepMargin != 0 {
		t.Errorf("the obstacle is kept in %d runs", o.KeepMargin)
	}
	// The rope's strike is the obstacle's: struck in the one run, first
	// by the rope, at the rope's moment.
	if o.Strikes != 1 || o.ShareStrike != 1 || o.FirstStrikeBy != StruckByRope || o.FirstStrikeLine != "hoist rope" || o.FirstStrikeS != rp.FirstStrikeS {
		t.Errorf("strikes %d (share %g), first by %q at %g s; want 1 (1), the rope at %g s", o.Strikes, o.ShareStrike, o.FirstStrikeBy, o.FirstStrikeS, rp.FirstStrikeS)
	}
	ok, texts := Verdict(reps, site.MarginM)
	if ok || !strings.Contains(texts[0], "the load and its rope keep 0.20 m from it in 0 of 1 runs") ||
		!strings.Contains(texts[0], "it is struck in 1 of 1 runs, by its rope (the hoist rope deepest); first by the hoist rope, 3.8 s into the move") {
		t.Errorf("verdict %v %q", ok, texts)
	}
}
