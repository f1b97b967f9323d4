package clearance

import (
	"math"

	"swaysheet/core/internal/sorts"
)

// tally gathers one thing's closest approaches to one obstacle over the
// runs (the load's, or its hoisting gear's): how many runs keep the
// margin, the strikes and the first of them, the smallest clearance and
// where, the largest error bound, and every run's smallest clearance for
// the percentile.
type tally struct {
	runs, keep, strikes int
	firstS              float64
	firstAt             Point3
	smallestM           float64
	smallestAtS         float64
	smallestAt          Point3
	line                string
	boundM              float64
	all                 []float64
}

func newTally(n int) tally { return tally{smallestM: math.Inf(1), all: make([]float64, 0, n)} }

// keeps: the closest approach keeps the margin and strikes nothing.
func (c *Closest) keeps(marginM float64) bool { return c.ClearanceM >= marginM && !c.Strikes }

// add counts one run's closest approach c; keeps says whether the run
// counts as keeping the margin.
func (t *tally) add(c *Closest, keeps bool) {
	t.runs++
	t.all = append(t.all, c.ClearanceM)
	if keeps {
		t.keep++
	}
	if c.Strikes {
		if t.strikes == 0 || c.FirstStrikeS < t.firstS {
			t.firstS, t.firstAt = c.FirstStrikeS, c.FirstStrikeAt
		}
		t.strikes++
	}
	if c.ClearanceM < t.smallestM {
		t.smallestM, t.smallestAtS, t.smallestAt, t.line = c.ClearanceM, c.TimeS, c.At, c.Line
	}
	t.boundM = math.Max(t.boundM, c.ErrorBoundM)
}

// p5 is the clearance kept by 95 % of the runs counted (nearest rank).
func (t *tally) p5() float64 {
	sorts.Floats(t.all)
	return t.all[nearestRank(0.05, len(t.all))]
}

// rope is the hoisting gear's report from its tally (nil when no run
// checked it), with where its smallest clearance and first strike are.
func (t *tally) rope() (*RopeReport, *Closest) {
	if t.runs == 0 {
		return nil, nil
	}
	rep := &RopeReport{Runs: t.runs, KeepMargin: t.keep, ShareKeepMargin: float64(t.keep) / float64(t.runs),
		Strikes: t.strikes, FirstStrikeS: t.firstS, ClearanceP5M: t.p5(),
		SmallestM: t.smallestM, SmallestAtS: t.smallestAtS, SmallestAt: t.smallestAt, SmallestAtHeightM: t.smallestAt.Z,
		Part: t.line, ErrorBoundM: t.boundM}
	if t.strikes > 0 {
		rep.FirstStrikeAtHeightM = t.firstAt.Z
	}
	return rep, &Closest{FirstStrikeAt: t.firstAt, At: t.smallestAt}
}

// struck counts the runs in which the load or its hoisting gear strikes
// one obstacle (a run once), with the earliest strike over them and what
// made it (the load when both strike at the same moment): by, and the
// line of the hoisting gear when that was it.
type struck struct {
	runs     int
	firstS   float64
	firstAt  Point3
	by, line string
}

// add counts one run's closest approach c of the load (c.Rope the gear's).
func (h *struck) add(c *Closest) {
	r := c.Rope
	if !c.Strikes && (r == nil || !r.Strikes) {
		return
	}
	first := h.runs == 0
	h.runs++
	if c.Strikes && (first || c.FirstStrikeS < h.firstS) {
		h.firstS, h.firstAt, h.by, h.line, first = c.FirstStrikeS, c.FirstStrikeAt, StruckByLoad, "", false
	}
	if r != nil && r.Strikes && (first || r.FirstStrikeS < h.firstS) {
		h.firstS, h.firstAt, h.by, h.line = r.FirstStrikeS, r.FirstStrikeAt, StruckByRope, r.FirstStrikeLine
	}
}
