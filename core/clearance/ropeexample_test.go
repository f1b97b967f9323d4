package clearance

import (
	"math"
	"strings"
	"testing"

	"swaysheet/core/internal/testscenario"
)

// TestRopeStrikesTheTowerExample: the example site-tower-rope-mast, where
// the wind leans a light panel outward past a lower crane's tower: the
// panel keeps the margin, its hoist rope passes through the tower, and
// the rope's strike is the obstacle's (counted, first, named).
func TestRopeStrikesTheTowerExample(t *testing.T) {
	s := testscenario.Example(t, "site-tower-rope-mast")
	// Hand computation: the wind's push F = 0.5*rho*v^2*c*A
	// = 0.5 * 1.25 * 13^2 * 1.5 * 7.5 = 1188.3 N on m*g = 800 * 9.80665
	// = 7845.3 N: the steady lean atan(F/(m g)) = 8.613 deg, which the
	// example gives as its swing at the start (it hangs still, leaning).
	lean := math.Atan(0.5*1.25*13*13*1.5*7.5/(800*9.80665)) * 180 / math.Pi
	if math.Abs(lean-8.613) > 0.001 || math.Abs(s.Initial.SwingDeg-lean) > 0.005 {
		t.Fatalf("lean %.4f deg, the example's swing at the start %.2f deg (hand computation 8.613)", lean, s.Initial.SwingDeg)
	}
	// Hand computation, the lean alone at the tower's line (45 deg, the
	// wind's direction there is straight out along the jib): the load's
	// centre is 33 sin(8.613 deg) = 4.942 m beyond the trolley's 30 m, at
	// 34.94 m from the crane; the tower's faces are 31.0 -/+ 0.8 m from it
	// (its centre at 21.92*sqrt(2) = 31.0 m). The ball of 1.6 m then keeps
	// 34.94 - 1.6 - 31.8 = 1.54 m from the tower (margin 0.5 m); the rope,
	// 8 m below the jib at the tower's 32 m top, is out 4.942*8/(33
	// cos(8.613 deg)) = 1.21 m, at 31.21 m: inside the tower's 30.2 to
	// 31.8 m, below its top: it passes through.
	d := 33 * math.Sin(lean*math.Pi/180)
	if load, rope := 30+d-1.6-31.8, 30+d*8/(33*math.Cos(lean*math.Pi/180)); math.Abs(load-1.54) > 0.005 || math.Abs(rope-31.21) > 0.005 {
		t.Fatalf("hand figures: the load keeps %.3f m, the rope at %.3f m", load, rope)
	}
	// The run with no spread agrees: the load keeps the margin, the rope
	// strikes, so the tower is struck, first by the rope. The first
	// strike comes after the trolley passes 45 - atan(4.942/30) = 35.65
	// deg, at 1 + 8.4 + (35.65 - 17.64)/4.2 = 13.69 s (the slew starts at
	// 1 s; its 8.4 s ramp to 4.2 deg/s covers 17.64 deg), since the rope reaches no farther
	// than the load's lean from the trolley, and before it reaches the
	// tower's middle line, 45 deg at 1 + 8.4 + (45 - 17.64)/4.2 = 15.91 s
	// (hand computation).
	one := *s
	site := *s.Site
	site.Spread = nil
	one.Site = &site
	rep, err := Check(&one, Options{})
	if err != nil {
		t.Fatal(err)
	}
	o := rep.Obstacles[0]
	if o.SmallestM < 0.5 || o.LoadStrikes != 0 || o.Rope == nil || o.Rope.Strikes != 1 || o.Strikes != 1 || o.FirstStrikeBy != StruckByRope {
		t.Fatalf("no spread: load smallest %.3f m (strikes %d), rope %+v, strikes %d, first by %q", o.SmallestM, o.LoadStrikes, o.Rope, o.Strikes, o.FirstStrikeBy)
	}
	if o.FirstStrikeS < 13.69 || o.FirstStrikeS > 15.91 || o.FirstStrikeS != o.Rope.FirstStrikeS {
		t.Errorf("first strike at %.2f s, want between 13.69 and 15.91 s (hand computation)", o.FirstStrikeS)
	}
	// The rope is inside the tower from 30.2 m out, 40 - 32.63*0.2/4.942
	// = 38.68 m up, to 31.8 m out, 28.12 m up (hand computation, the lean
	// alone): below the 32 m top the first strike is between 28.12 and 32
	// m up; the swing of the slew moves it, so 1 m is allowed below.
	if z := o.Rope.FirstStrikeAtHeightM; z < 27.1 || z > 32 {
		t.Errorf("the rope's first strike %.2f m up, want 27.1 to 32 m (hand computation)", z)
	}
	// Over the spread's runs the tower is struck in nearly every run, by
	// the rope, the load striking in one or two (a strong gust's swing);
	// the verdict says so (regression of the example).
	s.Site.Spread.Runs = 40
	rep, err = Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	o = rep.Obstacles[0]
	if rep.Clears || o.Strikes < 36 || o.LoadStrikes > 2 || o.Rope.Strikes < 36 || o.ShareStrike != float64(o.Strikes)/40 || o.FirstStrikeBy != StruckByRope || o.FirstStrikeLine != "hoist rope" {
		t.Errorf("40 runs: clears %v, strikes %d (load %d), first by %q %q", rep.Clears, o.Strikes, o.LoadStrikes, o.FirstStrikeBy, o.FirstStrikeLine)
	}
	if !strings.Contains(rep.Words[0], "(the hoist rope deepest); first by the hoist rope, 15.0 s into the move") {
		t.Errorf("verdict %q", rep.Words)
	}
}
