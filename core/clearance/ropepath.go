package clearance

import "math"

// RopeLine is one straight line of the hoisting gear over a run: the hoist
// rope, the rigging below a hook block or a sling leg, from A[i] (upper
// end) to B[i] (lower end) at sample i, z up from the floor.
type RopeLine struct {
	Name  string
	TimeS []float64
	A, B  []Point3
	// What every obstacle needs of each stretch between samples, found
	// once (prepare): how far the ends move, and the largest half
	// movement between moments (ErrorBoundM).
	move []float64
	gap  []float64 // each stretch's boxGap from the obstacle being checked (blockGaps)
	errM float64
	// Each block of lineBlock stretches (see firstStretch).
	blocks []stretchBlock
	// The clearance at sample i from the obstacle being checked, val[i],
	// is known when seen[i] == gen (gen counts the obstacles).
	val  []float64
	seen []int
	gen  int
}

// reuse makes l the line name over the samples at timeS in its own
// memory: its ends (to be filled in) and what it prepares. gen goes on
// counting, so no sample is taken as checked against the obstacle.
// Not inlined: Go inlines it into linesInto's every line otherwise, a
// kilobyte and a half of the page's wasm for no time to speak of.
//
//go:noinline
func (l *RopeLine) reuse(name string, timeS []float64) {
	n := len(timeS)
	l.Name, l.TimeS, l.A, l.B = name, timeS, grow(l.A, n), grow(l.B, n)
	l.move, l.gap, l.errM = l.move[:0], l.gap[:0], 0
	l.blocks = l.blocks[:0]
}

// prepare finds each stretch's box and movement, once.
func (l *RopeLine) prepare(stepM float64) {
	n := len(l.TimeS) - 1
	if n < 1 || len(l.move) == n {
		return
	}
	l.move, l.gap = grow(l.move, n), grow(l.gap, n)
	if cap(l.seen) < n+1 {
		l.val, l.seen = make([]float64, n+1), make([]int, n+1)
	}
	l.val, l.seen = l.val[:n+1], l.seen[:n+1]
	// Each block's box (see firstStretch) holds the boxes of its
	// stretches' ends: its samples and the next block's first. A
	// stretch's own box is found only where its block is opened
	// (blockGaps).
	l.blocks = grow(l.blocks, (n+lineBlock-1)/lineBlock)
	var a0, b0, blo, bhi Point3
	for k := range n + 1 {
		a1, b1 := l.A[k], l.B[k]
		lo1 := Point3{lower(a1.X, b1.X), lower(a1.Y, b1.Y), lower(a1.Z, b1.Z)}
		hi1 := Point3{upper(a1.X, b1.X), upper(a1.Y, b1.Y), upper(a1.Z, b1.Z)}
		if k > 0 { // sample k is the last of the block before, or within it
			blo = Point3{lower(blo.X, lo1.X), lower(blo.Y, lo1.Y), lower(blo.Z, lo1.Z)}
			bhi = Point3{upper(bhi.X, hi1.X), upper(bhi.Y, hi1.Y), upper(bhi.Z, hi1.Z)}
		}
		if k == n || (k > 0 && k%lineBlock == 0) { // the block before is whole
			l.blocks[(k-1)/lineBlock].lo, l.blocks[(k-1)/lineBlock].hi = blo, bhi
		}
		if k%lineBlock == 0 && k < n { // a block starts at sample k
			blo, bhi = lo1, hi1
		}
		if k > 0 {
			i := k - 1
			// upper is max here: a distance is never a negative zero (a
			// square root of a sum of squares), and upper keeps a NaN as
			// max does (in wasm max is a call).
			m := upper(dist3(a0, a1), dist3(b0, b1))
			l.move[i] = m
			if m/2 > l.errM {
				// upper is max here: neither is NaN (m/2 is above
				// errM) and errM is never a negative zero (it starts
				// at +0; a distance over a count is at least +0).
				l.errM = upper(l.errM, m/float64(moments(m, stepM))/2)
			}
		}
		a0, b0 = a1, b1
	}
}

// AlongLines checks the lines of a run against the obstacle: each line's
// ends are taken as moving straight between samples, and the line is
// checked exactly (SegmentClearance) at moments where neither end has
// moved more than stepM since the last (stepM positive; 2^p moments a
// stretch between samples). Every point of
// the line moves no more than its ends, and the clearance changes by no
// more than the line moves, so the smallest clearance between the
// moments checked is within ErrorBoundM (half that movement) below the
// one found; a wall thinner than the movement can be missed between
// moments, as for a rigid load's box.
//
// It stays cheap by skipping the stretches that cannot matter: the line
// between samples i and i+1 lies inside the box that holds its four
// ends, so the distance from that box to the box that holds the
// obstacle (its outline's box, from below up to its top) bounds its
// clearance from below. A stretch is checked only when that bound is at
// most the smallest clearance found so far (or zero, so that every
// strike is found), and then only at the moments that the clearance at
// moments already checked and the ends' movement leave in question
// (lineWatch.stretch). The stretch with the least bound is checked first.
// The bounds are found a block of stretches at a time (ropeblocks.go).
// The answer (smallest clearance, the first moment with it, the first
// strike) is that of checking every stretch (TestAlongLinesSkipsNothing).
// Closest.Line names the line nearest, FirstStrikeLine the line of the
// first strike.
func (o *Obstacle) AlongLines(lines []RopeLine, stepM float64) Closest {
	if !(stepM > 0) {
		panic("clearance: AlongLines needs a positive step")
	}
	c := Closest{ClearanceM: math.Inf(1), FirstStrikeS: math.NaN(), GapM: math.Inf(1)}
	lo, hi := outlineBox(o.Outline)
	for li := range lines {
		o.alongLine(&lines[li], stepM, lo, hi, &c, false)
	}
	return c
}

// alongLine checks one line into c (see AlongLines); every checks every
// stretch and moment (the plain form, for the test).
func (o *Obstacle) alongLine(l *RopeLine, stepM float64, lo, hi Point2, c *Closest, every bool) {
	n := len(l.TimeS)
	if n == 0 {
		return
	}
	if n == 1 {
		o.offerLine(c, l.Name, l.TimeS[0], l.A[0], l.B[0], stepM, lo, hi)
		return
	}
	l.prepare(stepM)
	l.gen++ // a new obstacle: no sample checked against it yet
	w := lineWatch{o: o, l: l, c: c, stepM: stepM, lo: lo, hi: hi, every: every}
	c.ErrorBoundM = max(c.ErrorBoundM, l.errM)
	first := l.firstStretch(lo, hi, o.TopM, every)
	w.stretch(first)
	for k := range l.blocks {
		if !every && l.blocks[k].gap > atLeast0(c.ClearanceM) {
			// Every stretch of the block is at least as far (see
			// firstStretch), so none is at most the clearance.
			continue
		}
		s, e := l.blockGaps(k, lo, hi, o.TopM)
		for i := s; i < e; i++ {
			if i != first && (every || l.gap[i] <= atLeast0(c.ClearanceM)) {
				w.stretch(i)
			}
		}
	}
}

// lineWatch checks one line's stretches against one obstacle.
type lineWatch struct {
	o     *Obstacle
	l     *RopeLine
	c     *Closest
	stepM float64
	lo    Point2 // the outline's box (outlineBox)
	hi    Point2
	every bool
	// the stretch being checked (stretch): from sample i, its ends'
	// movement m, its grid of k moments
	i, k int
	m    float64
}

// sample is the clearance at sample i, checked once.
func (w *lineWatch) sample(i int) float64 {
	l := w.l
	if l.seen[i] != l.gen {
		l.val[i], l.seen[i] = w.o.offerLine(w.c, l.Name, l.TimeS[i], l.A[i], l.B[i], w.stepM, w.lo, w.hi), l.gen
	}
	return l.val[i]
}

// stretch checks the moments of the stretch from sample i to i+1: a
// grid of 2^p moments, the fewest that keep the ends' movement between
// moments within stepM. Between two moments checked, a fraction g of the
// stretch apart with clearances va and vb, the ends move at most g*m,
// so every moment between has a clearance of at least (va + vb - g*m)/2
// (each point of the line moves no more than its ends, and the
// clearance changes no faster than the line moves). The grid is halved
// only where that bound is at most the smallest clearance so far (or
// zero, for every strike), so the moments left out cannot change the
// answer: it is that of every moment of the grid.
func (w *lineWatch) stretch(i int) {
	w.i, w.m = i, w.l.move[i]
	w.k = moments(w.m, w.stepM)
	w.half(0, w.k, w.sample(i), w.sample(i+1))
}

// half checks the moments strictly between j0 and j1 of the grid of the
// stretch being checked (w.i, w.m, w.k), whose clearances are v0 and v1,
// the first half before the second (see stretch). A method, not a
// closure: in wasm a closure's call costs more.
func (w *lineWatch) half(j0, j1 int, v0, v1 float64) {
	l, i, m, k := w.l, w.i, w.m, w.k
	for j1-j0 >= 2 {
		if !w.every && (v0+v1-m*float64(j1-j0)/float64(k))/2 > atLeast0(w.c.ClearanceM) {
			return
		}
		j := (j0 + j1) / 2
		f := float64(j) / float64(k)
		t0, t1 := l.TimeS[i], l.TimeS[i+1]
		v := w.o.offerLine(w.c, l.Name, t0+f*(t1-t0), lerp3(l.A[i], l.A[i+1], f), lerp3(l.B[i], l.B[i+1], f), w.stepM, w.lo, w.hi)
		w.half(j0, j, v0, v)
		j0, v0 = j, v // then the second half
	}
}

// offerLine checks the line from a to b at the moment t, and returns its
// clearance (lo, hi: the outline's box).
func (o *Obstacle) offerLine(c *Closest, name string, t float64, a, b Point3, stepM float64, lo, hi Point2) float64 {
	v, at, strikes := o.segmentClearance(a, b, stepM, lo, hi)
	if v < c.ClearanceM || (v == c.ClearanceM && t < c.TimeS) {
		c.ClearanceM, c.TimeS, c.At, c.Line = v, t, at, name
	}
	if strikes && (!c.Strikes || t < c.FirstStrikeS) {
		c.Strikes, c.FirstStrikeS, c.FirstStrikeAt, c.FirstStrikeLine = true, t, at, name
	}
	return v
}

// atLeast0 is max(c, 0) for a clearance found so far (never NaN: a NaN
// clearance is never taken as smaller).
func atLeast0(c float64) float64 {
	if c > 0 {
		return c
	}
	return 0
}

// moments is the grid of a stretch whose ends move m: the least power
// of two k with m/k at most stepM.
func moments(m, stepM float64) int {
	k := 1
	for float64(k)*stepM < m {
		k *= 2
	}
	return k
}

// boxGap is the distance between the box from lo3 to hi3 and the box of
// the outline (lo, hi) from below up to topM.
func boxGap(lo, hi Point2, topM float64, lo3, hi3 Point3) float64 {
	dx := beyond(lo.X-hi3.X, lo3.X-hi.X)
	dy := beyond(lo.Y-hi3.Y, lo3.Y-hi.Y)
	dz := beyond(lo3.Z-topM, 0)
	return math.Sqrt(dx*dx + dy*dy + dz*dz)
}
