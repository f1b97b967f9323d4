package clearance

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"swaysheet/core/internal/sorts"
	"swaysheet/core/words"
)

// Site is what stands along the load's path.
type Site struct {
	// SuspensionHeightM is the height of the rope's upper point of rotation
	// (trolley sheave, jib or boom tip) above the floor. It does not
	// change in a run: hoisting changes the rope, not the crane.
	SuspensionHeightM float64
	Obstacles         []Obstacle
	// MarginM is the clearance the lift plan asks to keep from every
	// obstacle.
	MarginM float64
	// LoadRadiusM is the size of a load given as a point: the load is a
	// ball of this radius about its centre of mass.
	LoadRadiusM float64
}

// ObstacleReport is how a set of runs passes one obstacle.
type ObstacleReport struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Name string `json:"name"`
	Runs int    `json:"runs"`
	// KeepMargin is how many runs keep at least the margin from it.
	KeepMargin int `json:"keep_margin"`
	// ShareKeepMargin is KeepMargin/Runs and ShareKeepMarginLow its
	// one-sided 95 % lower confidence bound (Clopper-Pearson).
	ShareKeepMargin    float64 `json:"share_keep_margin"`
	ShareKeepMarginLow float64 `json:"share_keep_margin_low"`
	// Strikes is how many runs strike it, by the load or its hoisting
	// gear (Rope: hoist rope, rigging, sling or spreader legs, hook ropes), a run
	// counted once; LoadStrikes how many of them by the load (the gear's
	// own count is Rope.Strikes). FirstStrikeS is the earliest moment of a
	// strike over all runs (zero when none strikes), and FirstStrikeBy
	// what struck then: StruckByLoad or StruckByRope, and with the rope
	// FirstStrikeLine the line that struck ("hoist rope", "sling leg 2",
	// "hook rope 1"; Rope.Part names the line that passes deepest).
	Strikes         int     `json:"strikes"`
	LoadStrikes     int     `json:"load_strikes,omitempty"`
	FirstStrikeS    float64 `json:"first_strike_s"`
	FirstStrikeBy   string  `json:"first_strike_by,omitempty"`
	FirstStrikeLine string  `json:"first_strike_line,omitempty"`
	// ShareStrike is Strikes/Runs: how often it is hit.
	ShareStrike float64 `json:"share_strike"`
	// ClearanceP5M is the clearance that 95 % of the runs keep (the 5th
	// percentile of each run's smallest clearance, nearest rank);
	// SmallestM the smallest over every run, at SmallestAtS and SmallestAt.
	ClearanceP5M float64 `json:"clearance_p5_m"`
	SmallestM    float64 `json:"smallest_m"`
	SmallestAtS  float64 `json:"smallest_at_s"`
	SmallestAt   Point3  `json:"smallest_at"`
	// SmallestAtDistanceM is where that is along the crane's path, and
	// FirstStrikeAtDistanceM where the earliest strike is: the distance
	// of the load's centre (see Section; a long load's end reaches an
	// obstacle well before its centre does), or of the rope's point in
	// the obstacle when the rope struck first.
	SmallestAtDistanceM    float64 `json:"smallest_at_distance_m"`
	FirstStrikeAtDistanceM float64 `json:"first_strike_at_distance_m"`
	// Vertical is the gap below the load while it passes over the
	// obstacle; nil when no run passes over it.
	Vertical *Vertical `json:"vertical,omitempty"`
	// ErrorBoundM bounds what the points checked can miss between samples.
	ErrorBoundM float64 `json:"error_bound_m"`
	// Rope is how the hoisting gear (hoist rope, rigging, legs, hook ropes)
	// passes the obstacle; nil when no run's lines were checked.
	// KeepMargin and ShareKeepMargin above count a run only when both the
	// load and its rope keep the margin (and neither strikes).
	Rope *RopeReport `json:"rope,omitempty"`
}

// RopeReport is how the hoisting gear's straight lines (see Run.Lines)
// pass one obstacle over the runs; its fields read as the load's in
// ObstacleReport. SmallestAt is the point of the line nearest the
// obstacle (its height is SmallestAt.Z), on the line named Part.
type RopeReport struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Runs                   int     `json:"runs"`
	KeepMargin             int     `json:"keep_margin"`
	ShareKeepMargin        float64 `json:"share_keep_margin"`
	Strikes                int     `json:"strikes"`
	FirstStrikeS           float64 `json:"first_strike_s"`
	FirstStrikeAtDistanceM float64 `json:"first_strike_at_distance_m"`
	FirstStrikeAtHeightM   float64 `json:"first_strike_at_height_m"`
	ClearanceP5M           float64 `json:"clearance_p5_m"`
	SmallestM              float64 `json:"smallest_m"`
	SmallestAtS            float64 `json:"smallest_at_s"`
	SmallestAt             Point3  `json:"smallest_at"`
	SmallestAtDistanceM    float64 `json:"smallest_at_distance_m"`
	SmallestAtHeightM      float64 `json:"smallest_at_height_m"`
	Part                   string  `json:"part"`
	ErrorBoundM            float64 `json:"error_bound_m"`
}

// What struck an obstacle first (ObstacleReport.FirstStrikeBy).
const (
	StruckByLoad = "load"
	StruckByRope = "rope"
)

// Required is the share of runs that must keep the margin from every
// obstacle for the lift to clear.
const Required = 0.95

// Check passes every run by every obstacle. The points checked along each
// path are at most stepM apart. It is an error to give no runs or a
// site whose obstacles are not valid (each error names the obstacle).
// Distances along the crane's path are left at zero (Evaluate fills them
// in).
func (s *Site) Check(runs []Run, stepM float64) ([]ObstacleReport, error) {
	reps, _, err := s.check(runs, stepM)
	return reps, err
}

// check is Check, with where each obstacle's report found its smallest
// clearance, first strike and smallest gap (for their distances along
// the path).
func (s *Site) check(runs []Run, stepM float64) ([]ObstacleReport, []Closest, error) {
	if len(runs) == 0 {
		return nil, nil, errors.New("clearance: no runs to check")
	}
	for i := range s.Obstacles {
		if err := s.Obstacles[i].Validate(); err != nil {
			return nil, nil, fmt.Errorf("obstacle %d (%s): %w", i+1, s.Obstacles[i].Name, err)
		}
	}
	near := make([][]Closest, len(runs))
	for i := range runs {
		near[i] = s.checkRun(&runs[i], stepM)
	}
	reps, where := s.summarise(near)
	return reps, where, nil
}

// checkRun is one run's Closest to each obstacle: a rigid load's box, or
// the ball about the load's centre, and the hoisting gear's lines (Rope).
func (s *Site) checkRun(r *Run, stepM float64) []Closest {
	return s.checkRunWith(r, stepM, new(scratch))
}

// checkRunWith is checkRun in sc's memory.
func (s *Site) checkRunWith(r *Run, stepM float64, sc *scratch) []Closest {
	out := make([]Closest, len(s.Obstacles))
	var path []Sample
	var boxes []BoxSample
	if r.Rigid() {
		boxes = r.Boxes(s.SuspensionHeightM)
	} else {
		path = r.pathInto(s.SuspensionHeightM, sc.path)
		sc.path = path
	}
	lines := r.linesInto(s.SuspensionHeightM, s.LoadRadiusM, sc.lines)
	if len(lines) > 0 {
		sc.lines = lines
	}
	var pl *pathLengths
	for k := range s.Obstacles {
		switch {
		case boxes != nil:
			out[k] = s.Obstacles[k].AlongBoxPath(boxes, stepM)
		case stepM <= 0 || len(path) < 2:
			out[k] = s.Obstacles[k].AlongPath(path, s.LoadRadiusM, stepM)
		default:
			if pl == nil {
				pl = measurePathInto(path, stepM, sc)
			}
			out[k] = s.Obstacles[k].alongPathWith(path, pl, s.LoadRadiusM, stepM)
		}
		if len(lines) > 0 {
			rope := s.Obstacles[k].AlongLines(lines, stepM)
			out[k].Rope = &rope
		}
	}
	return out
}

// summarise gives each obstacle's figures over the runs from each run's
// Closest (near[run][obstacle]), the runs taken in order, with where each
// obstacle's smallest clearance, first strike and smallest gap are. A run
// keeps the margin from an obstacle when its load and its hoisting gear
// both do.
func (s *Site) summarise(near [][]Closest) ([]ObstacleReport, []Closest) {
	out := make([]ObstacleReport, len(s.Obstacles))
	where := make([]Closest, len(s.Obstacles))
	for k := range s.Obstacles {
		load, rope := newTally(len(near)), newTally(0)
		w := Closest{GapM: math.Inf(1)}
		var gaps []float64
		var hit struck
		for i := range near {
			c := &near[i][k]
			ropeKeeps := true
			if c.Rope != nil {
				ropeKeeps = c.Rope.keeps(s.MarginM)
				rope.add(c.Rope, ropeKeeps)
			}
			load.add(c, c.keeps(s.MarginM) && ropeKeeps)
			hit.add(c)
			if !math.IsInf(c.GapM, 1) {
				gaps = append(gaps, c.GapM)
				if c.GapM < w.GapM {
					w.GapM, w.GapAtS, w.GapAt = c.GapM, c.GapAtS, c.GapAt
				}
			}
		}
		rep := ObstacleReport{Name: s.Obstacles[k].Name, Runs: len(near), KeepMargin: load.keep,
			Strikes: hit.runs, LoadStrikes: load.strikes, FirstStrikeS: hit.firstS, FirstStrikeBy: hit.by, FirstStrikeLine: hit.line, ClearanceP5M: load.p5(),
			SmallestM: load.smallestM, SmallestAtS: load.smallestAtS, SmallestAt: load.smallestAt, ErrorBoundM: load.boundM}
		rep.Rope, w.Rope = rope.rope()
		rep.ShareKeepMargin = float64(rep.KeepMargin) / float64(len(near))
		rep.ShareKeepMarginLow = ShareLowerBound(rep.KeepMargin, len(near), 0.95)
		rep.ShareStrike = float64(rep.Strikes) / float64(len(near))
		if len(gaps) > 0 {
			sorts.Floats(gaps)
			rep.Vertical = &Vertical{Runs: len(gaps), SmallestM: w.GapM, AtS: w.GapAtS,
				P5M: gaps[nearestRank(0.05, len(gaps))]}
		}
		w.FirstStrikeAt, w.At = hit.firstAt, rep.SmallestAt
		out[k], where[k] = rep, w
	}
	return out, where
}

// nearestRank is the index of the p-th quantile of n sorted values by the
// nearest-rank method: ceil(p*n), counted from 1.
func nearestRank(p float64, n int) int {
	i := int(math.Ceil(p*float64(n)-1e-9)) - 1
	return min(max(i, 0), n-1)
}

// Verdict says in words whether the runs clear every obstacle with the
// margin in at least Required of the runs, or which do not, how often and
// from what moment. ok is true when all clear. The words are the plain SI
// text of VerdictSentences.
func Verdict(reports []ObstacleReport, marginM float64) (ok bool, texts []string) {
	ok, ss := VerdictSentences(reports, marginM)
	return ok, words.Strings(ss)
}

// VerdictSentences is Verdict with the quantities marked (core/words), for
// the page and the sheet to give in the units shown.
func VerdictSentences(reports []ObstacleReport, marginM float64) (ok bool, ss []words.Sentence) {
	ok = true
	var few []words.Sentence // obstacles kept, but struck in a few runs
	for _, r := range reports {
		if r.ShareKeepMargin >= Required {
			// Kept, but struck in a few runs: said all the same.
			if r.Strikes > 0 {
				text := fmt.Sprintf("%s: kept clear by the margin {0} in %d of %d runs", braces(r.Name), r.KeepMargin, r.Runs) + strikeWords(&r)
				few = append(few, strikeSentence(text, &r, marginM))
			}
			continue
		}
		ok = false
		who := "the load"
		if r.Rope != nil && r.Rope.KeepMargin < r.Rope.Runs {
			who = "the load and its rope"
		}
		text := fmt.Sprintf("%s: %s keep{0} from it in %d of %d runs (%.0f %%; %.0f %% needed)",
			braces(r.Name), who, r.KeepMargin, r.Runs, 100*r.ShareKeepMargin, 100*Required)
		if who == "the load" {
			text = strings.Replace(text, "keep{0}", "keeps {0}", 1)
		} else {
			text = strings.Replace(text, "keep{0}", "keep {0}", 1)
		}
		if r.Strikes > 0 {
			text += strikeWords(&r)
		}
		ss = append(ss, strikeSentence(text, &r, marginM))
	}
	if ok {
		who := "The load keeps"
		for _, r := range reports {
			if r.Rope != nil {
				who = "The load and its rope keep"
			}
		}
		ss = append(ss, words.Say(fmt.Sprintf("%s {0} from every obstacle in at least %.0f %% of the runs.", who, 100*Required), words.Length(marginM)))
	}
	return ok, append(ss, few...)
}

// braces makes a name safe inside a sentence's text: its braces become
// parentheses, so that none reads as a placeholder.
func braces(name string) string { return strings.NewReplacer("{", "(", "}", ")").Replace(name) }

// strikeSentence is an obstacle's sentence with its quantities: the
// margin, and with a strike those of strikeWords.
func strikeSentence(text string, r *ObstacleReport, marginM float64) words.Sentence {
	qs := []words.Quantity{words.Length(marginM)}
	if r.Strikes > 0 {
		qs = append(qs, words.Time(r.FirstStrikeS), words.Length(r.FirstStrikeAtDistanceM))
		if r.FirstStrikeBy == StruckByRope {
			qs = append(qs, words.Length(r.Rope.FirstStrikeAtHeightM))
		}
	}
	return words.Say(text+".", qs...)
}

// strikeWords say how often the obstacle is struck and by what, and the
// first strike: its moment {1}, where along the path {2} and, when the
// rope struck first, how high up {3} (the margin is {0}).
func strikeWords(r *ObstacleReport) string {
	text := fmt.Sprintf("; it is struck in %d of %d runs", r.Strikes, r.Runs)
	ropeN := 0
	if r.Rope != nil {
		ropeN = r.Rope.Strikes
	}
	switch {
	case ropeN == 0:
		text += ", by the load"
	case r.LoadStrikes == 0:
		text += fmt.Sprintf(", by its rope (%s deepest)", LineWords(r.Rope.Part))
	default:
		text += fmt.Sprintf(": by the load in %d, by its rope in %d (%s deepest)", r.LoadStrikes, ropeN, LineWords(r.Rope.Part))
	}
	if r.FirstStrikeBy == StruckByRope {
		return text + "; first by " + StruckBy(r.FirstStrikeBy, r.FirstStrikeLine) + ", {1} into the move, {2} along the path, {3} up"
	}
	if ropeN > 0 {
		return text + "; first by the load, {1} into the move, {2} along the path"
	}
	return text + "; first {1} into the move, {2} along the path"
}

// StruckBy names what struck first as a sentence does (by and line as
// ObstacleReport.FirstStrikeBy and FirstStrikeLine): "the load", the line
// of the hoisting gear ("the hoist rope", "hook rope 2"), or "its rope"
// when the line is not known.
//
//go:noinline
func StruckBy(by, line string) string {
	switch {
	case by != StruckByRope:
		return "the load"
	case line == "":
		return "its rope"
	}
	return LineWords(line)
}

// LineWords is a line of the hoisting gear as a sentence names it: "the
// hoist rope", "the rigging", "sling leg 2", "spreader leg 1", "hook rope
// 1".
func LineWords(name string) string {
	if name == "" || (name[len(name)-1] >= '0' && name[len(name)-1] <= '9') {
		return name
	}
	return "the " + name
}
