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
// 0.3 m: 80 % of the runs do (95 % needed); struck in 4 %".
func obstacleVerdict(o *clearance.ObstacleReport, marginM float64, u units.Choice) (bool, string) {
	margin := Figure{Unit: "m"}.row(marginM, u)
	share := func(v float64) string {
		r := Figure{Quantity: "share"}.row(v, u)
		return r.Text + unitText(r.Unit)
	}
	need := share(clearance.Required)
	m := margin.Text + unitText(margin.Unit)
	if o.ShareKeepMargin >= clearance.Required {
		return true, "keeps " + m + " in " + share(o.ShareKeepMargin) + " of the runs (" + need + " needed)"
	}
	w := "does NOT keep " + m + ": " + share(o.ShareKeepMargin) + " of the runs do (" + need + " needed)"
	if o.Strikes > 0 {
		w += "; the load strikes it in " + share(o.ShareStrike) + " of the runs"
	}
	return false, w
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
