package clearance

import "math"

// The stretches of a line are taken lineBlock at a time: a block's box
// holds its stretches' boxes, so its boxGap from an obstacle is at most
// each of theirs (boxGap only grows as the box shrinks: each difference,
// square, sum and root is rounded monotonically). A block farther than
// what is looked for needs none of its stretches' gaps. A NaN gap (a NaN
// end) compares as nothing does, so such a block is always opened.
// Against a few columns, most of a run's stretches are far from each:
// finding every stretch's gap from every obstacle was, in wasm, a fifth
// of the lines' check (node --cpu-prof of clearance_part).

// lineBlock is the number of stretches in a block (the last may hold
// fewer).
const lineBlock = 16

// growBlocks makes room for the blocks of n stretches (prepare finds
// their boxes).
func (l *RopeLine) growBlocks(n int) {
	nb := (n + lineBlock - 1) / lineBlock
	l.blo, l.bhi, l.bgap = grow(l.blo, nb), grow(l.bhi, nb), grow(l.bgap, nb)
	if cap(l.bseen) < nb {
		l.bseen = make([]int, nb)
	}
	l.bseen = l.bseen[:nb]
}

// firstStretch is the first stretch with the least boxGap from the
// outline's box (lo, hi) up to topM, each block's gap found on the way
// (bgap). The block with the least gap is opened first; the least of
// its stretches' gaps, u, is at least the least of all, so a block whose
// gap is above u holds no stretch with the least, and the others are
// opened in order (a tie goes to the first). every opens them all (the
// plain form, for the test).
func (l *RopeLine) firstStretch(lo, hi Point2, topM float64, every bool) int {
	kb, lb := -1, math.Inf(1)
	for k := range l.bgap {
		g := boxGap(lo, hi, topM, l.blo[k], l.bhi[k])
		l.bgap[k] = g
		if g < lb {
			kb, lb = k, g
		}
	}
	u := math.Inf(1)
	if kb >= 0 {
		s, e := l.blockGaps(kb, lo, hi, topM)
		for _, g := range l.gap[s:e] {
			if g < u { // a NaN gap is passed over here, and its block opened below
				u = g
			}
		}
	}
	first, least := 0, math.Inf(1)
	for k, g := range l.bgap {
		if !every && g > u {
			continue
		}
		s, e := l.blockGaps(k, lo, hi, topM)
		for i := s; i < e; i++ {
			if l.gap[i] < least {
				first, least = i, l.gap[i]
			}
		}
	}
	return first
}

// blockGaps finds the boxGap of each stretch of block k (gap), once per
// obstacle, and gives the block's stretches, s to e-1.
func (l *RopeLine) blockGaps(k int, lo, hi Point2, topM float64) (s, e int) {
	s, e = k*lineBlock, min((k+1)*lineBlock, len(l.move))
	if l.bseen[k] != l.gen {
		l.bseen[k] = l.gen
		for i := s; i < e; i++ {
			slo, shi := l.stretchBox(i)
			l.gap[i] = boxGap(lo, hi, topM, slo, shi)
		}
	}
	return s, e
}

// stretchBox is the box that holds the four ends of stretch i.
func (l *RopeLine) stretchBox(i int) (lo, hi Point3) {
	a0, b0, a1, b1 := l.A[i], l.B[i], l.A[i+1], l.B[i+1]
	lo = Point3{lower(lower(a0.X, b0.X), lower(a1.X, b1.X)), lower(lower(a0.Y, b0.Y), lower(a1.Y, b1.Y)), lower(lower(a0.Z, b0.Z), lower(a1.Z, b1.Z))}
	hi = Point3{upper(upper(a0.X, b0.X), upper(a1.X, b1.X)), upper(upper(a0.Y, b0.Y), upper(a1.Y, b1.Y)), upper(upper(a0.Z, b0.Z), upper(a1.Z, b1.Z))}
	return lo, hi
}
