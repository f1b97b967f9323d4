package clearance

import (
	"fmt"

	"swaysheet/core/draws"
	"swaysheet/core/scenario"
)

// A Joiner joins the parts of one check as they arrive: each part is
// decoded once, when it is added, and held; Report joins the held parts
// asked for. Joining the parts received so far, again and again as more
// arrive, then costs only what must be done over all of their runs (the
// ranking by stray, the envelopes' unions, the section and the verdict),
// never reading a part twice. The report is CheckJoin's of the same parts,
// exactly (CheckJoin is a Joiner used once).
//
// What a Joiner holds is bounded by one check's runs: a part that
// overlaps parts held (another split of the same runs) takes their place.
// A Joiner is not safe for use by several goroutines at once.
type Joiner struct {
	c      *checker
	total  int
	seed   int
	spread *draws.Spread
	held   []heldPart // none overlapping
}

type heldPart struct {
	from, to int
	runs     []RunPart
}

// NewJoiner prepares the join of the check s's site block asks for (its
// run with no spread and that run's path, from which every run's stray is
// measured, are made here once).
func NewJoiner(s *scenario.Scenario, opt Options) (*Joiner, error) {
	sp, err := SpecOf(s)
	if err != nil {
		return nil, err
	}
	c, err := prepare(s, opt.defaults())
	if err != nil {
		return nil, err
	}
	return &Joiner{c: c, total: sp.Runs, seed: sp.Seed, spread: sp.Spread}, nil
}

// Runs is how many runs the check has.
func (j *Joiner) Runs() int { return j.total }

// Add decodes part p and holds it, in place of the parts held that
// overlap its runs. A part that is not whole, not of runs of this check
// or not of this site's obstacles is refused (nothing held changes).
func (j *Joiner) Add(p Part) error {
	runs, err := j.c.decodePart(j.total, p)
	if err != nil {
		return err
	}
	kept := j.held[:0]
	for _, h := range j.held {
		if h.to <= p.From || h.from >= p.To {
			kept = append(kept, h)
		}
	}
	for i := len(kept); i < len(j.held); i++ {
		j.held[i] = heldPart{}
	}
	j.held = append(kept, heldPart{from: p.From, to: p.To, runs: runs})
	return nil
}

// HeldRuns is how many runs the parts held have.
func (j *Joiner) HeldRuns() int {
	n := 0
	for _, h := range j.held {
		n += h.to - h.from
	}
	return n
}

// Holds reports whether runs from to to-1 are held, as one part.
func (j *Joiner) Holds(from, to int) bool { return j.find(from, to) != nil }

func (j *Joiner) find(from, to int) *heldPart {
	for i := range j.held {
		if j.held[i].from == from && j.held[i].to == to {
			return &j.held[i]
		}
	}
	return nil
}

// Range is a part's runs: From to To-1.
type Range struct{ From, To int }

// NotHeldError is Report's error when a part asked for is not held.
type NotHeldError struct {
	Index int // in the ranges asked for
	Range Range
}

func (e *NotHeldError) Error() string {
	return fmt.Sprintf("clearance: the runs from %d to %d of this check are not held: send their part's data", e.Range.From, e.Range.To)
}

// Report joins the held parts of the given ranges (in any order, none
// overlapping another) into the report over their runs: with every run of
// the check, the report of Check, exactly. A range not held is a
// *NotHeldError.
func (j *Joiner) Report(ranges []Range) (*Report, error) {
	order := make([]int, len(ranges))
	for i := range order { // a few parts: insertion sort by first run
		k := i
		for ; k > 0 && ranges[order[k-1]].From > ranges[i].From; k-- {
			order[k] = order[k-1]
		}
		order[k] = i
	}
	count := 0
	for _, r := range ranges {
		count += max(r.To-r.From, 0)
	}
	runs := make([]RunPart, 0, min(count, j.total))
	next := -1
	for _, i := range order {
		r := ranges[i]
		h := j.find(r.From, r.To)
		if h == nil {
			return nil, &NotHeldError{Index: i, Range: r}
		}
		if r.From < next {
			return nil, errPartRange(r.From, r.To, j.total)
		}
		next = r.To
		runs = append(runs, h.runs...)
	}
	rep, err := j.c.joinRuns(j.seed, runs)
	if rep != nil {
		rep.Spread = j.spread
	}
	return rep, err
}
