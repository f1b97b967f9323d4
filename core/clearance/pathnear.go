package clearance

import "math"

// alongPathNear is alongPathEvery looking only at the points checked that
// can change its answer. The answer is the smallest clearance over the
// points checked and the first point with it, the smallest gap over the
// points over the outline and the first with it, and the first point of
// overlap; none of these changes when a point whose clearance is above
// both the smallest and zero, and which is not over the outline, is left
// out. The clearance is a signed distance less the radius, so it changes
// by at most the distance moved (it is 1-Lipschitz; see the package
// comment), and the plan distance to the outline by at most the distance
// moved seen from above. So:
//
//  1. the clearance and plan distance are found at samples about
//     coarseM apart along the path (the coarse samples); the least of
//     those clearances, U, is at least the smallest of all;
//  2. a point between two coarse samples A and B, s along the path from A
//     and t before B, has a clearance of at least
//     max(v(A) - s, v(B) - t) and a plan distance of at least
//     max(d(A) - s', d(B) - t') (s', t' along the path seen from above);
//     a point whose bounds exceed max(U, 0) and the radius (by more than
//     the rounding, tolM) is left out, and the whole stretch from A to B
//     when even the least of its bounds, (v(A) + v(B) - |AB|)/2, does;
//  3. the points left are checked in order as alongPathEvery does.
//
// A piece between samples whose plan box stays clear of the outline's
// box, or which stays above the top, passes through nothing, so the exact
// SegmentStrikes test is made only on the others; nor does a piece of a
// stretch left out whole (its clearance is above zero all along), so
// such a stretch is passed over at once. The bound on what the points
// checked miss (Closest.ErrorBoundM) is the path's, whatever the obstacle
// (pathLengths.errM). The answer is that of alongPathEvery
// (TestAlongPathNearMatchesEvery).
func (o *Obstacle) alongPathNear(path []Sample, radiusM, stepM float64) Closest {
	return o.alongPathWith(path, measurePath(path, stepM), radiusM, stepM)
}

// pathLengths is a path's length up to each point, in space (cum) and
// seen from above (cumPlan), its coarse samples, and the largest half
// distance between the points checked at steps of stepM (errM: the
// Closest's ErrorBoundM): what alongPathNear needs of the path whatever
// the obstacle, found once for all of them.
type pathLengths struct {
	cum, cumPlan []float64
	coarse       []int
	errM         float64
	// vs, ds: memory for an obstacle's clearance and plan distance at
	// the coarse samples (alongPathWith), one each a coarse sample.
	vs, ds []float64
}

const coarseM = 0.25 // m between coarse samples

func measurePath(path []Sample, stepM float64) *pathLengths {
	return measurePathInto(path, stepM, new(scratch))
}

// measurePathInto is measurePath in sc's memory.
func measurePathInto(path []Sample, stepM float64, sc *scratch) *pathLengths {
	n := len(path)
	sc.cum, sc.plan = grow(sc.cum, n), grow(sc.plan, n)
	pl := &pathLengths{cum: sc.cum, cumPlan: sc.plan, coarse: append(sc.coarse[:0], 0)}
	cum, cumPlan := pl.cum, pl.cumPlan
	if n > 0 {
		cum[0], cumPlan[0] = 0, 0
	}
	for i := 1; i < n; i++ {
		a, b := path[i-1].At, path[i].At
		length := dist3(a, b)
		cum[i] = cum[i-1] + length
		// As alongPathEvery finds it, piece by piece.
		if half := length / float64(max(int(math.Ceil(length/stepM)), 1)) / 2; half > pl.errM {
			pl.errM = half
		}
		cumPlan[i] = cumPlan[i-1] + math.Hypot(b.X-a.X, b.Y-a.Y)
		if i == n-1 || cum[i]-cum[pl.coarse[len(pl.coarse)-1]] >= coarseM {
			pl.coarse = append(pl.coarse, i)
		}
	}
	sc.coarse = pl.coarse
	nc := len(pl.coarse)
	sc.vsds = grow(sc.vsds, 2*nc)
	pl.vs, pl.ds = sc.vsds[:nc], sc.vsds[nc:]
	return pl
}

// alongPathWith is alongPathNear with the path's lengths given.
func (o *Obstacle) alongPathWith(path []Sample, pl *pathLengths, radiusM, stepM float64) Closest {
	w := newBallWatch(o, radiusM)
	c := &w.c
	if len(path) == 0 {
		return *c
	}
	const tolM = 1e-9
	n := len(path)
	cum, cumPlan, coarse := pl.cum, pl.cumPlan, pl.coarse
	vs, ds := pl.vs, pl.ds
	least := math.Inf(1)
	for m, i := range coarse {
		vs[m], _, ds[m] = o.ballClearancePlan(path[i].At, radiusM)
		least = lower(least, vs[m])
	}
	keepV, keepD := math.Max(least, 0)+tolM, radiusM+tolM
	lo, hi := outlineBox(o.Outline)

	c.ErrorBoundM = pl.errM
	w.offer(path[0].TimeS, path[0].At)
	m := 0 // coarse[m] <= i < coarse[m+1]
	for i := 0; i+1 < n; i++ {
		for coarse[m+1] <= i {
			m++
		}
		A, B := coarse[m], coarse[m+1]
		span, spanPlan := cum[B]-cum[A], cumPlan[B]-cumPlan[A]
		if (vs[m]+vs[m+1]-span)/2 > keepV && (ds[m]+ds[m+1]-spanPlan)/2 > keepD {
			// The clearance is above keepV, so above zero, all along
			// the stretch: no point of it matters and no piece of it
			// strikes. On to the next stretch.
			i = B - 1
			continue
		}
		a, b := path[i], path[i+1]
		dx, dy, dz := b.At.X-a.At.X, b.At.Y-a.At.Y, b.At.Z-a.At.Z
		length := math.Sqrt(dx*dx + dy*dy + dz*dz)
		steps := max(int(math.Ceil(length/stepM)), 1)
		if !c.Strikes && o.mayStrike(a.At, b.At, lo, hi, tolM) && o.SegmentStrikes(a.At, b.At) {
			c.Strikes, c.FirstStrikeS, c.FirstStrikeAt = true, a.TimeS, a.At
		}
		lengthPlan := math.Hypot(dx, dy)
		for k := 1; k <= steps; k++ {
			f := float64(k) / float64(steps)
			s, sp := cum[i]-cum[A]+f*length, cumPlan[i]-cumPlan[A]+f*lengthPlan
			if upper(vs[m]-s, vs[m+1]-(span-s)) > keepV && upper(ds[m]-sp, ds[m+1]-(spanPlan-sp)) > keepD {
				continue
			}
			w.offer(a.TimeS+f*(b.TimeS-a.TimeS), Point3{a.At.X + f*dx, a.At.Y + f*dy, a.At.Z + f*dz})
		}
	}
	return w.result()
}

// outlineBox is the corners of the box that holds the outline.
func outlineBox(poly []Point2) (lo, hi Point2) {
	lo, hi = Point2{math.Inf(1), math.Inf(1)}, Point2{math.Inf(-1), math.Inf(-1)}
	for _, p := range poly {
		lo.X, lo.Y, hi.X, hi.Y = lower(lo.X, p.X), lower(lo.Y, p.Y), upper(hi.X, p.X), upper(hi.Y, p.Y)
	}
	return lo, hi
}

// mayStrike is false when the segment ab surely passes through nothing of
// the obstacle: its plan box is clear of the outline's box (lo, hi), or
// it stays above the top, by more than tolM.
func (o *Obstacle) mayStrike(a, b Point3, lo, hi Point2, tolM float64) bool {
	// Comparisons of each end rather than math.Min and Max (calls in wasm).
	if a.Z > o.TopM+tolM && b.Z > o.TopM+tolM {
		return false
	}
	return (a.X >= lo.X-tolM || b.X >= lo.X-tolM) && (a.X <= hi.X+tolM || b.X <= hi.X+tolM) &&
		(a.Y >= lo.Y-tolM || b.Y >= lo.Y-tolM) && (a.Y <= hi.Y+tolM || b.Y <= hi.Y+tolM)
}
