package figures

import (
	"sort"

	"swaysheet/core/clearance"
	"swaysheet/core/units"
)

// obstacleVerdict holds one obstacle against the clearance check's rule
// (the margin kept in at least clearance.Required of the runs, as
// clearance.VerdictSentences): keeps, and the words in the units of u,
// e.g. "keeps 0.3 m in 97 % of the runs (95 % needed)" or "does NOT keep
// 0.3 m: 80 % of the runs do (95 % needed); struck in 4 % of the runs,
// by the load"; when the rope strikes too, the line that struck first
// ("first by hook rope 2"; when is the obstacle's first_strike_s row).
func obstacleVerdict(o *clearance.ObstacleReport, marginM float64, u units.Choice) (bool, string) {
	margin := Figure{Unit: "m"}.row(marginM, u)
	share := func(v float64) string {
		r := Figure{Quantity: "share"}.row(v, u)
		return r.Text + unitText(r.Unit)
	}
	need := share(clearance.Required)
	m := margin.Text + unitText(margin.Unit)
	keeps := o.ShareKeepMargin >= clearance.Required
	w := "does NOT keep " + m + ": " + share(o.ShareKeepMargin) + " of the runs do (" + need + " needed)"
	if keeps {
		w = "keeps " + m + " in " + share(o.ShareKeepMargin) + " of the runs (" + need + " needed)"
	}
	if o.Strikes > 0 {
		w += "; struck in " + share(o.ShareStrike) + " of the runs"
		ropeN := 0
		if o.Rope != nil {
			ropeN = o.Rope.Strikes
		}
		runs := float64(o.Runs)
		switch {
		case ropeN == 0:
			w += ", by the load"
		case o.LoadStrikes == 0:
			w += ", by its rope (" + clearance.LineWords(o.Rope.Part) + " deepest)"
		default:
			w += " (by the load in " + share(float64(o.LoadStrikes)/runs) + ", by its rope in " + share(float64(ropeN)/runs) + ")"
		}
		if ropeN > 0 {
			w += ", first by " + clearance.StruckBy(o.FirstStrikeBy, o.FirstStrikeLine)
		}
	}
	return keeps, w
}

// worstFirst orders the obstacles as the planner's worst one is found
// (clearance's siteplan.go): the fewest runs keeping the margin first,
// then the smallest clearance; ties keep the site's order.
func worstFirst(obs []clearance.ObstacleReport) []int {
	idx := make([]int, len(obs))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool {
		oa, ob := &obs[idx[a]], &obs[idx[b]]
		if oa.ShareKeepMargin != ob.ShareKeepMargin {
			return oa.ShareKeepMargin < ob.ShareKeepMargin
		}
		return oa.SmallestM < ob.SmallestM
	})
	return idx
}
