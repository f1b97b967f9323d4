package motion

import (
	"math"
	"slices"

	"swaysheet/core/internal/sorts"
)

// An index evaluates a sum of terms a_i * p_i(t - s_i) (the moves of a Sum,
// or the impulses of a Shaped) in time that does not grow with the number
// of terms: each term is active only between its start and its end; before
// its start it is at rest (for the profiles that say so) and after its end
// it holds its final position. The time axis is cut at every term's start
// and end into cells; each cell keeps the sum of its resting terms and the
// list of its active ones, so an evaluation is a binary search for the cell
// and the active terms of that cell alone.
//
// The resting terms are summed in the terms' own order and the active ones
// added after them in order, so the result is bit for bit the plain sum
// whenever the resting terms of a cell come before its active ones or are
// zero: moves listed in time order, a shaper's impulses (ascending times).
// Otherwise it differs from the plain sum by rounding only.
type index struct {
	terms []term
	// bounds are the cell edges, ascending; cell k covers
	// [bounds[k-1], bounds[k]), cell 0 everything before bounds[0].
	bounds []float64
	cells  []cell
}

type term struct {
	p        Profile
	a, shift float64
}

type cell struct {
	rest   State   // the resting terms, summed
	active []int32 // the active terms, ascending
}

// windowed is a profile that knows where it starts and whether it is at
// rest (at a constant position) before that. Profiles that do not say are
// taken to move at every time before their end.
type windowed interface {
	window() (start float64, restBefore bool)
}

func windowOf(p Profile) (float64, bool) {
	if w, ok := p.(windowed); ok {
		return w.window()
	}
	return math.Inf(-1), false
}

// margin keeps cell edges a little outside each term's window, far above
// the rounding of t - shift, so that a term counted as resting in a cell
// gives exactly its resting value at every time of the cell.
func margin(t float64) float64 { return 1e-9 * (1 + math.Abs(t)) }

func newIndex(terms []term) *index {
	x := &index{terms: terms}
	type edge struct{ lo, hi float64 } // the active span of a term
	spans := make([]edge, len(terms))
	for i, tm := range terms {
		start, rest := windowOf(tm.p)
		end := tm.p.End() + tm.shift
		lo := math.Inf(-1)
		if rest && !math.IsInf(start, 0) {
			lo = start + tm.shift
			lo -= margin(lo)
			x.bounds = append(x.bounds, lo)
		}
		hi := end + margin(end)
		if !math.IsInf(hi, 0) && !math.IsNaN(hi) {
			x.bounds = append(x.bounds, hi)
		} else {
			hi = math.Inf(1)
		}
		spans[i] = edge{lo, math.Max(hi, lo)}
	}
	sorts.Floats(x.bounds)
	x.bounds = slices.Compact(x.bounds)
	x.cells = make([]cell, len(x.bounds)+1)
	for k := range x.cells {
		cl, ch := math.Inf(-1), math.Inf(1)
		if k > 0 {
			cl = x.bounds[k-1]
		}
		if k < len(x.bounds) {
			ch = x.bounds[k]
		}
		c := &x.cells[k]
		for i, tm := range terms {
			var t float64
			switch {
			case cl >= spans[i].hi: // ended: evaluated at the cell's start
				t = cl
			case ch <= spans[i].lo: // not started: at the cell's end
				t = ch
			default:
				c.active = append(c.active, int32(i))
				continue
			}
			q := tm.p.At(t - tm.shift)
			c.rest.Pos += tm.a * q.Pos
			c.rest.Vel += tm.a * q.Vel
			c.rest.Acc += tm.a * q.Acc
		}
	}
	return x
}

// at evaluates the sum at t.
func (x *index) at(t float64) State {
	// Cell: the number of bounds at or before t.
	lo, hi := 0, len(x.bounds)
	for lo < hi {
		m := int(uint(lo+hi) >> 1)
		if x.bounds[m] <= t {
			lo = m + 1
		} else {
			hi = m
		}
	}
	c := &x.cells[lo]
	s := c.rest
	for _, i := range c.active {
		tm := &x.terms[i]
		q := tm.p.At(t - tm.shift)
		s.Pos += tm.a * q.Pos
		s.Vel += tm.a * q.Vel
		s.Acc += tm.a * q.Acc
	}
	return s
}

// Work is the number of profile pieces an evaluation at t looks at: a
// measure of its cost for a work budget (at least 1).
func Work(p Profile, t float64) int {
	switch q := p.(type) {
	case *Combined:
		return q.idx.work(t)
	case *Shaped:
		return q.index().work(t)
	case *Stopped:
		if t < q.AtS {
			return Work(q.Base, t)
		}
		return 2
	case interface{ spans() int }:
		return 2 // a binary search among the spans
	}
	return 1
}

func (x *index) work(t float64) int {
	k, _ := slices.BinarySearchFunc(x.bounds, t, func(b, t float64) int {
		if b <= t {
			return -1
		}
		return 1
	})
	n := 1
	for _, i := range x.cells[k].active {
		tm := &x.terms[i]
		n += Work(tm.p, t-tm.shift)
	}
	return n
}

// Combined is several profiles on one axis added together, like Sum, with
// an evaluation whose cost does not grow with the number of profiles (see
// index). Build it with Combine; it must not change afterwards.
type Combined struct {
	parts []Profile
	idx   *index
}

// Combine adds profiles on one axis.
func Combine(ps ...Profile) *Combined {
	terms := make([]term, len(ps))
	for i, p := range ps {
		terms[i] = term{p: p, a: 1}
	}
	return &Combined{parts: append([]Profile(nil), ps...), idx: newIndex(terms)}
}

// At implements Profile: the same values as Sum.At, term by term.
func (c *Combined) At(t float64) State { return c.idx.at(t) }

// Breakpoints implements Profile.
func (c *Combined) Breakpoints() []float64 { return Sum(c.parts).Breakpoints() }

// End implements Profile.
func (c *Combined) End() float64 { return Sum(c.parts).End() }

// Len is the number of profiles combined.
func (c *Combined) Len() int { return len(c.parts) }

func (c *Combined) window() (float64, bool) { return sumWindow(c.parts) }

func sumWindow(ps []Profile) (float64, bool) {
	start, rest := math.Inf(1), true
	for _, p := range ps {
		s, r := windowOf(p)
		start, rest = math.Min(start, s), rest && r
	}
	if len(ps) == 0 {
		return 0, true
	}
	return start, rest
}

// spans is how many spans p has. Work's type switch asks for it: it marks
// a Piecewise and the profiles built on one (Steps, SCurve), whose value
// takes a binary search among the spans. Nothing calls it, so a dead-code
// finder lists it; it is not dead.
func (p *Piecewise) spans() int { return len(p.pieces) }

func (p *Piecewise) window() (float64, bool) {
	return p.pieces[0].T, p.pieces[0].V == 0
}

func (s *Shaped) window() (float64, bool) {
	start, rest := windowOf(s.Base)
	first := math.Inf(1)
	for _, im := range s.Impulses {
		first = math.Min(first, im.T)
	}
	if len(s.Impulses) == 0 {
		first = 0
	}
	return start + first, rest
}
