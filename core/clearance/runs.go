package clearance

import (
	"math"

	"swaysheet/core/sway"
)

// Run is one simulated run: the load's centre relative to the suspension
// point and the suspension point on the ground frame, sampled in time
// (sway.History's fields), with a rigid load's box corners.
type Run struct {
	TimeS                      []float64
	RelXM, RelYM, RelZM        []float64
	SuspensionXM, SuspensionYM []float64
	// RopeM and SwingDeg are the rope's length and its angle from the
	// vertical, for the height of its lower end (the hook).
	RopeM, SwingDeg []float64
	// CornerXM, CornerYM, CornerZM are a rigid load's box corners on the
	// ground frame, z from the suspension point, [corner][sample]
	// (sway.BodyHistory); nil for a point load.
	CornerXM, CornerYM, CornerZM [][]float64
	// HookRelXM, HookRelYM, HookRelZM are the hook relative to the
	// suspension point (a hook block, or a rigid load on a hook); nil when
	// the rope ends at the load. LegTop and LegEnd hold a rigid load's
	// sling legs' ends on the ground frame, z from the suspension point,
	// [leg][sample] (sway.BodyHistory).
	HookRelXM, HookRelYM, HookRelZM []float64
	LegTopXM, LegTopYM, LegTopZM    [][]float64
	LegEndXM, LegEndYM, LegEndZM    [][]float64
	// Suspension is how a rigid load hangs (sway.Body.Suspension: two
	// hook ropes, a spreader's legs, sling legs); empty for a point load.
	Suspension string
}

// RunOf takes a run from an evaluation's time histories.
func RunOf(r *sway.Result) Run {
	h := &r.History
	run := Run{TimeS: h.TimeS, RelXM: h.RelXM, RelYM: h.RelYM, RelZM: h.RelZM,
		SuspensionXM: h.SuspensionXM, SuspensionYM: h.SuspensionYM, RopeM: h.RopeM, SwingDeg: h.SwingDeg,
		HookRelXM: h.HookRelXM, HookRelYM: h.HookRelYM, HookRelZM: h.HookRelZM}
	if r.Body != nil && r.Body.History != nil && len(r.Body.History.CornerXM) == 8 {
		b := r.Body.History
		run.CornerXM, run.CornerYM, run.CornerZM = b.CornerXM, b.CornerYM, b.CornerZM
		run.LegTopXM, run.LegTopYM, run.LegTopZM = b.LegTopXM, b.LegTopYM, b.LegTopZM
		run.LegEndXM, run.LegEndYM, run.LegEndZM = b.LegEndXM, b.LegEndYM, b.LegEndZM
		run.Suspension = r.Body.Suspension
	}
	return run
}

// Rigid reports a run of a rigid load (with box corners).
func (r *Run) Rigid() bool { return len(r.CornerXM) == 8 }

// Path is the load's centre on the ground frame, z up from the floor.
func (r *Run) Path(suspensionHeightM float64) []Sample {
	return r.pathInto(suspensionHeightM, nil)
}

// pathInto is Path in buf's memory (see scratch).
func (r *Run) pathInto(suspensionHeightM float64, buf []Sample) []Sample {
	out := grow(buf, len(r.TimeS))
	for i, t := range r.TimeS {
		out[i] = Sample{TimeS: t, At: r.centre(i, suspensionHeightM)}
	}
	return out
}

func (r *Run) centre(i int, h float64) Point3 {
	return Point3{r.SuspensionXM[i] + r.RelXM[i], r.SuspensionYM[i] + r.RelYM[i], h + r.RelZM[i]}
}

// Boxes is a rigid load's box at each sample, z up from the floor.
func (r *Run) Boxes(suspensionHeightM float64) []BoxSample {
	out := make([]BoxSample, len(r.TimeS))
	for i, t := range r.TimeS {
		b := BoxSample{TimeS: t, Centre: r.centre(i, suspensionHeightM)}
		for k := range b.Corners {
			b.Corners[k] = Point3{r.CornerXM[k][i], r.CornerYM[k][i], suspensionHeightM + r.CornerZM[k][i]}
		}
		out[i] = b
	}
	return out
}

// LowM is the height of the load's lowest point at sample i: the lowest
// corner of a rigid load, the bottom of a point load's ball of radiusM.
func (r *Run) LowM(i int, suspensionHeightM, radiusM float64) float64 {
	if !r.Rigid() {
		return suspensionHeightM + r.RelZM[i] - radiusM
	}
	low := math.Inf(1)
	for k := range 8 {
		low = math.Min(low, r.CornerZM[k][i])
	}
	return suspensionHeightM + low
}

// HookM is the height of the rope's lower end at sample i (the centre's
// height when the run has no rope history).
func (r *Run) HookM(i int, suspensionHeightM float64) float64 {
	if len(r.RopeM) <= i || len(r.SwingDeg) <= i {
		return suspensionHeightM + r.RelZM[i]
	}
	return suspensionHeightM - r.RopeM[i]*math.Cos(r.SwingDeg[i]*math.Pi/180)
}

// planPath is the run seen from above for the envelopes: the centre's
// points and, for a rigid load, the box's outline at each sample.
func (r *Run) planPath(h, radiusM float64) PlanPath {
	return r.planPathInto(h, radiusM, nil)
}

// planPathInto is planPath with its points in buf's memory (see scratch).
func (r *Run) planPathInto(h, radiusM float64, buf []Point2) PlanPath {
	pts := grow(buf, len(r.TimeS))
	for i := range r.TimeS {
		pts[i] = r.centre(i, h).Plan()
	}
	p := PlanPath{Points: pts, RadiusM: radiusM}
	if r.Rigid() {
		p.RadiusM = 0
		p.Outlines = make([][]Point2, len(r.TimeS))
		for i := range r.TimeS {
			var c [8]Point2
			for k := range c {
				c[k] = Point2{r.CornerXM[k][i], r.CornerYM[k][i]}
			}
			p.Outlines[i] = Hull(c[:])
		}
	}
	return p
}

// Lines is the hoisting gear of the run as straight lines (RopeLine), z up
// from the floor: the hoist rope from the suspension point to the hook;
// below a hook block the rigging to the load; a rigid load's sling legs
// from the hook to their attach points ("sling leg N"), a spreader's two
// legs from the beam ("spreader leg N"), or two hook ropes
// (load.body.tandem) from their suspension points ("hook rope N"), each
// named as everywhere (sway.LegName). The rope
// of a point load ends at the load's ball of radiusM (the ball is
// checked as the load), and so does the rigging below a hook block.
// Parallel legs and two hook ropes have no hoist rope of their own
// (their tops are the suspension points).
func (r *Run) Lines(suspensionHeightM, radiusM float64) []RopeLine {
	return r.linesInto(suspensionHeightM, radiusM, nil)
}

// linesInto is Lines in the memory of the lines in buf (see scratch):
// each line's ends and what it prepares (RopeLine.reuse).
func (r *Run) linesInto(suspensionHeightM, radiusM float64, buf []RopeLine) []RopeLine {
	h, n := suspensionHeightM, len(r.TimeS)
	if n == 0 || len(r.SuspensionXM) < n {
		return nil
	}
	susp := func(i int) Point3 { return Point3{r.SuspensionXM[i], r.SuspensionYM[i], h} }
	out := buf[:0]
	line := func(name string) RopeLine {
		if k := len(out); k < cap(out) {
			l := out[:k+1][k]
			l.reuse(name, r.TimeS)
			return l
		}
		return RopeLine{Name: name, TimeS: r.TimeS, A: make([]Point3, n), B: make([]Point3, n)}
	}
	// toBall shortens the line from a to the centre c by the ball's radius.
	toBall := func(a, c Point3) Point3 {
		d := dist3(a, c)
		if d <= radiusM {
			return a
		}
		return lerp3(c, a, radiusM/d)
	}
	hooked := len(r.HookRelXM) == n
	// Two hook ropes have no hoist rope between them: the history's hook
	// is then the crane's suspension point itself.
	if (len(r.LegTopXM) == 0 || hooked) && r.Suspension != sway.TwoRopes {
		rope := line("hoist rope")
		for i := range n {
			rope.A[i] = susp(i)
			if hooked {
				rope.B[i] = Point3{r.SuspensionXM[i] + r.HookRelXM[i], r.SuspensionYM[i] + r.HookRelYM[i], h + r.HookRelZM[i]}
			} else {
				rope.B[i] = toBall(rope.A[i], r.centre(i, h))
			}
		}
		out = append(out, rope)
	}
	switch {
	case len(r.LegTopXM) > 0:
		for k := range r.LegTopXM {
			leg := line(sway.LegName(r.Suspension, k))
			for i := range n {
				leg.A[i] = Point3{r.LegTopXM[k][i], r.LegTopYM[k][i], h + r.LegTopZM[k][i]}
				leg.B[i] = Point3{r.LegEndXM[k][i], r.LegEndYM[k][i], h + r.LegEndZM[k][i]}
			}
			out = append(out, leg)
		}
	case hooked:
		rig := line("rigging")
		for i := range n {
			rig.A[i] = out[0].B[i]
			rig.B[i] = toBall(rig.A[i], r.centre(i, h))
		}
		out = append(out, rig)
	}
	return out
}
