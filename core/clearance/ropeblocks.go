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

// stretchBlock is a block of stretches: the box that holds them
// (prepare), its boxGap from the obstacle being checked, and whether its
// stretches' gaps are found for that obstacle (seen == RopeLine.gen).
type stretchBlock struct {
	_      [0]func() // not comparable: no equality function (page wasm size)
	lo, hi Point3
	gap    float64
	seen   int
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
	for k := range l.blocks {
		b := &l.blocks[k]
		g := boxGap(lo, hi, topM, b.lo, b.hi)
		b.gap = g
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
	for k := range l.blocks {
		if !every && l.blocks[k].gap > u {
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
	if l.blocks[k].seen != l.gen {
		l.blocks[k].seen = l.gen
		for i := s; i < e; i++ {
			slo, shi := l.stretchBox(i)
			l.gap[i] = boxGap(lo, hi, topM, slo, shi)
		}
	}
	return s, e
}

// stretchBox is the box that holds the four ends of stretch i.
// lower and upper give the least and greatest of the four, NaN when
// one is; the order leaves only a zero's sign to choose, which boxGap
// does not see (a difference of zeros is no gap).
func (l *RopeLine) stretchBox(i int) (lo, hi Point3) {
	lo, hi = l.A[i], l.A[i]
	for _, p := range [3]Point3{l.B[i], l.A[i+1], l.B[i+1]} {
		lo = Point3{lower(lo.X, p.X), lower(lo.Y, p.Y), lower(lo.Z, p.Z)}
		hi = Point3{upper(hi.X, p.X), upper(hi.Y, p.Y), upper(hi.Z, p.Z)}
	}
	return lo, hi
}
