package shaper

import (
	"math"
	"testing"

	"swaysheet/core/ode"
)

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

// Impulse amplitudes and times against the published formulas:
// ZV and ZVD from Singer & Seering, ASME J. Dyn. Sys. Meas. Control 112
// (1990); EI from Singhose, Seering & Singer (1994), undamped form
// (amplitudes (1+V)/4, (1-V)/2, (1+V)/4 at 0, T/2, T; from memory).
func TestImpulsesPublished(t *testing.T) {
	const T = 6.0
	for _, zeta := range []float64{0, 0.05, 0.2} {
		k := math.Exp(-zeta * math.Pi / math.Sqrt(1-zeta*zeta))
		td := T / math.Sqrt(1-zeta*zeta)
		zv, err := New(ZV, T, zeta, 0)
		if err != nil {
			t.Fatal(err)
		}
		want := [][2]float64{{1 / (1 + k), 0}, {k / (1 + k), td / 2}}
		for i, im := range zv.Impulses {
			if !near(im.A, want[i][0], 1e-15) || !near(im.T, want[i][1], 1e-12) {
				t.Errorf("ZV zeta %g impulse %d = %+v, want A %g at %g", zeta, i, im, want[i][0], want[i][1])
			}
		}
		zvd, _ := New(ZVD, T, zeta, 0)
		d := (1 + k) * (1 + k)
		want = [][2]float64{{1 / d, 0}, {2 * k / d, td / 2}, {k * k / d, td}}
		for i, im := range zvd.Impulses {
			if !near(im.A, want[i][0], 1e-15) || !near(im.T, want[i][1], 1e-12) {
				t.Errorf("ZVD zeta %g impulse %d = %+v, want A %g at %g", zeta, i, im, want[i][0], want[i][1])
			}
		}
	}
	// Undamped ZV is 1/2, 1/2 at 0 and T/2 (Singer & Seering 1990).
	zv, _ := New(ZV, 4, 0, 0)
	if zv.Impulses[0].A != 0.5 || zv.Impulses[1].A != 0.5 || zv.Impulses[1].T != 2 {
		t.Errorf("undamped ZV = %+v", zv.Impulses)
	}
	for _, v := range []float64{0.02, 0.05, 0.1} {
		ei, err := New(EI, T, 0, v)
		if err != nil {
			t.Fatal(err)
		}
		want := [][2]float64{{(1 + v) / 4, 0}, {(1 - v) / 2, T / 2}, {(1 + v) / 4, T}}
		for i, im := range ei.Impulses {
			if !near(im.A, want[i][0], 1e-15) || !near(im.T, want[i][1], 1e-12) {
				t.Errorf("EI V %g impulse %d = %+v, want %v", v, i, im, want[i])
			}
		}
	}
	for _, kind := range Kinds {
		s, _ := New(kind, T, 0, 0)
		sum := 0.0
		for _, im := range s.Impulses {
			sum += im.A
		}
		if !near(sum, 1, 1e-15) {
			t.Errorf("%s amplitudes add to %g, want 1 (unity gain)", kind, sum)
		}
	}
}

// The residual vibration function against its closed forms for undamped
// shapers: ZV |cos(pi*r/2)|, ZVD cos^2(pi*r/2), with r = w/w0 (these follow
// from Singer & Seering 1990's V(w, zeta) with the impulses above); EI
// |(1+V)/2*cos(pi*r) + (1-V)/2|, exactly V at r = 1 (Singhose, Seering &
// Singer 1994).
func TestResidualClosedForm(t *testing.T) {
	const T = 5.0
	w0 := 2 * math.Pi / T
	zv, _ := New(ZV, T, 0, 0)
	zvd, _ := New(ZVD, T, 0, 0)
	ei, _ := New(EI, T, 0, 0.05)
	for r := 0.2; r <= 2.0; r += 0.01 {
		w := r * w0
		c := math.Cos(math.Pi * r / 2)
		if got := zv.Residual(w, 0); !near(got, math.Abs(c), 1e-12) {
			t.Fatalf("ZV V(%g w0) = %g, want %g", r, got, math.Abs(c))
		}
		if got := zvd.Residual(w, 0); !near(got, c*c, 1e-12) {
			t.Fatalf("ZVD V(%g w0) = %g, want %g", r, got, c*c)
		}
		want := math.Abs(1.05/2*math.Cos(math.Pi*r) + 0.95/2)
		if got := ei.Residual(w, 0); !near(got, want, 1e-12) {
			t.Fatalf("EI V(%g w0) = %g, want %g", r, got, want)
		}
	}
	if got := ei.Residual(w0, 0); !near(got, 0.05, 1e-12) {
		t.Errorf("EI at design = %g, want its tolerance 0.05", got)
	}
	// Zero at the design frequency, with damping (Singer & Seering 1990).
	for _, zeta := range []float64{0, 0.03, 0.1} {
		for _, kind := range []string{ZV, ZVD} {
			s, _ := New(kind, T, zeta, 0)
			if got := s.Residual(w0, zeta); got > 1e-14 {
				t.Errorf("%s zeta %g: V at design = %g, want 0", kind, zeta, got)
			}
		}
	}
}

// In the linear model x¨ + 2 zeta w x' + w^2 x = w^2 u(t), a shaped unit
// step u = sum A_i H(t - t_i) leaves no vibration after the last impulse at
// the design frequency, and V(w, zeta) of the unshaped step's vibration
// elsewhere (the definition of V in Singer & Seering 1990). The model is
// integrated numerically here, independently of the formula.
func TestLinearModelResidual(t *testing.T) {
	const T = 4.0
	w0 := 2 * math.Pi / T
	amp := func(imps []float64, times []float64, w, zeta float64) float64 {
		f := func(tt float64, y, dy []float64) {
			u := 0.0
			for i, ti := range times {
				if tt >= ti {
					u += imps[i]
				}
			}
			dy[0] = y[1]
			dy[1] = w*w*(u-y[0]) - 2*zeta*w*y[1]
		}
		s := ode.New(f, 2, ode.Settings{RelTol: 1e-11, AbsTol: 1e-13})
		y := []float64{0, 0}
		s.Reset(0, y)
		t0 := 0.0
		cuts := append(append([]float64{}, times[1:]...), times[len(times)-1]+1e-9)
		for _, c := range cuts {
			if c > t0 {
				for {
					done, err := s.Step(c)
					if err != nil {
						panic(err)
					}
					if done {
						break
					}
				}
				s.Reset(c, s.State())
				t0 = c
			}
		}
		// Amplitude of the free vibration about x = 1 right after the last
		// impulse: sqrt(e^2 + ((e' + zeta w e)/wd)^2), e = x - 1.
		y = s.State()
		e, de := y[0]-1, y[1]
		wd := w * math.Sqrt(1-zeta*zeta)
		return math.Hypot(e, (de+zeta*w*e)/wd)
	}
	for _, zeta := range []float64{0, 0.05} {
		for _, kind := range Kinds {
			if kind == EI && zeta != 0 {
				continue
			}
			s, _ := New(kind, T, zeta, 0)
			var a, ts []float64
			for _, im := range s.Impulses {
				a = append(a, im.A)
				ts = append(ts, im.T)
			}
			for _, r := range []float64{1, 0.8, 1.25} {
				w := r * w0
				got := amp(a, ts, w, zeta)
				// The unshaped unit step leaves e = -exp(-zeta w t)(cos wd t +
				// zeta w/wd sin wd t), amplitude exp(-zeta w t)/sqrt(1-zeta^2);
				// V compares with it at the last impulse time.
				want := s.Residual(w, zeta) / math.Sqrt(1-zeta*zeta)
				if !near(got, want, 1e-7) {
					t.Errorf("%s zeta %g w/w0 %g: linear model residual %g, V = %g", kind, zeta, r, got, want)
				}
				if r == 1 && kind != EI && got > 1e-7 {
					t.Errorf("%s zeta %g: residual %g at the design frequency, want 0", kind, zeta, got)
				}
			}
		}
	}
}

func TestBadDesign(t *testing.T) {
	for _, c := range []struct {
		kind         string
		T, zeta, tol float64
	}{{ZV, 0, 0, 0}, {ZV, math.NaN(), 0, 0}, {ZVD, 3, 1, 0}, {EI, 3, 0.1, 0}, {EI, 3, 0, 1.5}, {"pi", 3, 0, 0}} {
		if _, err := New(c.kind, c.T, c.zeta, c.tol); err == nil {
			t.Errorf("New(%q, %g, %g, %g) gave no error", c.kind, c.T, c.zeta, c.tol)
		}
	}
}
