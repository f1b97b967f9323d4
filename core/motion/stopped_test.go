package motion

import (
	"math"
	"testing"
)

func TestEmergencyStopHandCalculation(t *testing.T) {
	// Bay travel at 0.67 m/s, stopped in the cruise with 1 s of reaction
	// and braking at 1.18 m/s²: 0.67 m in the reaction (v*t_r) and
	// 0.67²/(2*1.18) = 0.1902 m braking (v²/(2a)), at rest 0.67/1.18 =
	// 0.5678 s after the reaction (constant speed, then uniform
	// deceleration: any mechanics text).
	base := NewTrapezoid(1, 24, 0.67, 0.25, 0.25)
	s := NewStopped(base, 10, 1, 1.18).(*Stopped)
	at := base.At(10)
	if math.Abs(at.Vel-0.67) > 1e-12 {
		t.Fatalf("speed at the stop %g, want the cruise speed", at.Vel)
	}
	want := 0.67 + 0.67*0.67/(2*1.18)
	if got := s.StopDistance(); math.Abs(got-want) > 1e-12 {
		t.Errorf("distance from the stop command %.6f m, want %.6f", got, want)
	}
	if got := s.At(11).Pos - at.Pos; math.Abs(got-0.67) > 1e-12 {
		t.Errorf("in the reaction %.6f m, want 0.67", got)
	}
	if end := s.End(); math.Abs(end-(11+0.67/1.18)) > 1e-12 {
		t.Errorf("at rest at %g s, want %g", end, 11+0.67/1.18)
	}
	if st := s.At(20); st.Vel != 0 || st.Acc != 0 || math.Abs(st.Pos-(at.Pos+want)) > 1e-12 {
		t.Errorf("after the stop %+v", st)
	}
	if st := s.At(10.5); st.Acc != 0 || st.Vel != 0.67 {
		t.Errorf("in the reaction the speed is held: %+v", st)
	}
	if st := s.At(11.2); math.Abs(st.Acc+1.18) > 1e-12 {
		t.Errorf("braking at %g, want -1.18", st.Acc)
	}
	// Before the stop it is the move itself.
	if s.At(5) != base.At(5) {
		t.Error("before the stop the move is unchanged")
	}
	// In the ramp up the speed at the stop is held: 0.25*2 = 0.5 m/s.
	r := NewStopped(base, 3, 1, 1.18).(*Stopped)
	if got, want := r.StopDistance(), 0.5+0.25/2.36; math.Abs(got-want) > 1e-12 {
		t.Errorf("stop in the ramp: %g, want %g", got, want)
	}
	// Before the move starts it never starts; after its end nothing changes.
	if n := NewStopped(base, 0.5, 1, 1.18); n.At(30).Pos != 0 || n.End() != 0.5 {
		t.Errorf("stopped before the start: %+v, end %g", n.At(30), n.End())
	}
	if n := NewStopped(base, 200, 1, 1.18); n != Profile(base) {
		t.Error("a stop after the end leaves the move as it is")
	}
	// A reverse move brakes the other way.
	back := NewStopped(NewTrapezoid(0, -24, 0.67, 0.25, 0.25), 10, 1, 1.18).(*Stopped)
	if got := back.StopDistance(); math.Abs(got+want) > 1e-12 {
		t.Errorf("reverse: %g", got)
	}
}
