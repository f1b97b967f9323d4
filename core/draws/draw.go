package draws

import (
	"math"
	"math/rand/v2"

	"swaysheet/core/scenario"
)

// Draw returns draw i of s under spread sp and seed: a copy of s with the
// drawn values (s itself is not changed; unchanged parts are shared).
func Draw(s *scenario.Scenario, sp Spread, seed uint64, i int) *scenario.Scenario {
	rng := rand.New(rand.NewPCG(seed, uint64(i)))
	// normal is a standard normal value cut off at three standard
	// deviations. Every draw takes its values in the same order whether
	// or not a spread is zero, so that adding one spread leaves the
	// others' values as they were.
	normal := func() float64 {
		for {
			if z := rng.NormFloat64(); z >= -3 && z <= 3 {
				return z
			}
		}
	}
	d := *s
	load := &d.Load
	rope := *s.Load.RopeLengthM + sp.RopeLengthM*normal()
	depth := sp.CentreDepthM * normal()
	if h := s.Load.Hook; h != nil {
		hook := *h
		rig := *h.RiggingLengthM + depth
		hook.RiggingLengthM = &rig
		load.Hook = &hook
	} else {
		rope += depth
	}
	load.RopeLengthM = &rope

	d.Motions = make([]scenario.Motion, len(s.Motions))
	for k, m := range s.Motions {
		m.StartS = max(0, m.StartS+sp.PressS*normal())
		if len(m.Steps) > 0 {
			steps := make([]scenario.SpeedStep, len(m.Steps))
			for j, st := range m.Steps {
				st.AtS = max(0, st.AtS+sp.PressS*normal())
				if j > 0 {
					st.AtS = max(st.AtS, steps[j-1].AtS)
				}
				steps[j] = st
			}
			m.Steps = steps
		}
		d.Motions[k] = m
	}

	gust := 1 + sp.GustPct/100*normal()
	at := sp.GustS * normal()
	if w := s.Wind; w != nil {
		wind := *w
		wind.StartS = max(0, w.StartS+at)
		if w.ForceN != nil {
			f := max(0, *w.ForceN*gust)
			wind.ForceN = &f
		} else if w.SpeedMPerS != nil {
			// The force goes as the speed squared.
			v := *w.SpeedMPerS * math.Sqrt(max(0, gust))
			wind.SpeedMPerS = &v
		}
		d.Wind = &wind
	}
	// The stop's moment is drawn last and always, so that it leaves the
	// other values as they were.
	if u := rng.Float64(); sp.EmergencyStop != nil && sp.EmergencyStop.ReactionS != nil {
		stopAll(&d, sp.EmergencyStop, u)
	}
	return &d
}
