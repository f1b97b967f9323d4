package clearance

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"swaysheet/core/draws"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/words"
)

// A clearance check in parts: the runs of a check can be split into ranges
// [From, To) of the run index, each evaluated on its own (on its own
// worker: EvaluatePart), and the parts joined (Join) into the report. The
// report of the joined parts is the report of one call over the same runs,
// exactly: each run is drawn from the seed and its own index alone
// (package draws), what a run contributes (its stray from the path with no
// spread, its closest approach to each obstacle, the lattice cells it
// sweeps) does not depend on the other runs, and the join ranks and counts
// the runs in index order as one call does (Evaluate is itself one part
// joined). Joining the parts received so far gives the report of those
// runs: an envelope refined as the parts arrive.

// Part is what the runs From to To-1 of a check contribute: each run's
// RunPart, as one block of bytes (Data; see partcode.go).
type Part struct {
	From int    `json:"from"`
	To   int    `json:"to"`
	Data []byte `json:"data"`
}

// RunPart is what one run contributes: its stray from the nominal path,
// its closest approach to each obstacle in the site's order, the lattice
// cells its load sweeps (see PlanPath.sweepLattice) as row spans, each
// three numbers: the row less the previous span's row, the first cell less
// the previous span's first cell, the number of cells (the first span's
// from row 0, cell 0), and for the vertical section its lowest point's
// band in the section's bins along the crane's path (see runBins).
type RunPart struct {
	StrayM float64
	Near   []Closest
	Cells  []int
	bins   runBins
}

// Spec is what a scenario's site block asks for: how many runs, the seed,
// the spreads and how run i is drawn (nil: every run is the scenario
// itself).
type Spec struct {
	Runs    int
	Seed    int
	Spread  *draws.Spread
	Variant Variant
}

// SpecOf reads the spec of s's site block: its spread's runs
// (scenario.DefaultSiteRuns when it gives none) drawn by package draws
// with its seed; with no spread, one run.
func SpecOf(s *scenario.Scenario) (Spec, error) {
	if s.Site == nil {
		return Spec{}, ErrNoSite
	}
	sp := s.Site.Spread
	if sp == nil {
		return Spec{Runs: 1}, nil
	}
	runs := sp.Runs
	if runs == 0 {
		runs = scenario.DefaultSiteRuns
	}
	spread := draws.Spread{RopeLengthM: sp.RopeLengthM, CentreDepthM: sp.CentreDepthM,
		PressS: sp.PressS, GustPct: sp.GustPct, GustS: sp.GustS, EmergencyStop: sp.EmergencyStop}
	seed := uint64(sp.Seed)
	return Spec{Runs: runs, Seed: sp.Seed, Spread: &spread, Variant: func(i int) *scenario.Scenario {
		return draws.Draw(s, spread, seed, i)
	}}, nil
}

// CheckPart evaluates the runs from to to-1 of the check s's site block
// asks for (0 <= from < to <= its runs); they share opt.Budget, or one of
// CheckWork.
func CheckPart(s *scenario.Scenario, from, to int, opt Options) (*Part, error) {
	sp, err := SpecOf(s)
	if err != nil {
		return nil, err
	}
	if from < 0 || to <= from || to > sp.Runs {
		return nil, fmt.Errorf("clearance: runs from %d to %d: the check has runs 0 to %d", from, to, sp.Runs)
	}
	if opt.Budget == nil {
		opt.Budget = sway.NewBudget(CheckWork, checkBudgetMessage)
	}
	c, err := prepare(s, opt.defaults())
	if err != nil {
		return nil, err
	}
	return c.part(s, from, to, sp.Variant)
}

// CheckJoin joins parts of the check s's site block asks for into its
// report over the runs they hold (in any order, none twice): a Joiner
// used once.
func CheckJoin(s *scenario.Scenario, parts []Part, opt Options) (*Report, error) {
	j, err := NewJoiner(s, opt)
	if err != nil {
		return nil, err
	}
	ranges := make([]Range, len(parts))
	for i, p := range parts {
		for _, r := range ranges[:i] {
			if p.From < r.To && r.From < p.To {
				return nil, errPartRange(p.From, p.To, j.total)
			}
		}
		if err := j.Add(p); err != nil {
			return nil, err
		}
		ranges[i] = Range{p.From, p.To}
	}
	return j.Report(ranges)
}

func (o Options) defaults() Options {
	if o.StepM == 0 {
		o.StepM = 0.02
	}
	if o.CellM == 0 {
		o.CellM = 0.1
	}
	return o
}

// checker holds what every part and the join of one check share: the
// site, the nominal run (every spread at zero) and its path, from which
// the runs' strays and distances along the path are measured.
type checker struct {
	opt     Options
	site    *Site
	nominal Run
	radiusM float64 // the load's ball; zero for a rigid load's box
	plan    PlanPath
	near    *nearest
	track   *track
}

func prepare(s *scenario.Scenario, opt Options) (*checker, error) {
	if s.Site == nil {
		return nil, ErrNoSite
	}
	c := &checker{opt: opt, site: SiteOf(s.Site)}
	for i := range c.site.Obstacles {
		if err := c.site.Obstacles[i].Validate(); err != nil {
			return nil, fmt.Errorf("obstacle %d (%s): %w", i+1, c.site.Obstacles[i].Name, err)
		}
	}
	res, err := sway.EvaluateWith(s, sway.Options{Validated: true, Budget: opt.Budget, PathOnly: true, LegEnds: true})
	if err != nil {
		return nil, err
	}
	c.nominal = RunOf(res)
	c.radiusM = c.site.LoadRadiusM
	if c.nominal.Rigid() {
		c.radiusM = 0
	}
	c.plan = c.nominal.planPath(c.site.SuspensionHeightM, c.radiusM)
	c.near = newNearest(c.plan.Points)
	c.track = newTrack(&c.nominal)
	return c, nil
}

// part evaluates runs from to to-1, in parallel, each checked against
// every obstacle, swept onto the lattice and placed along the path.
func (c *checker) part(s *scenario.Scenario, from, to int, variant Variant) (*Part, error) {
	h := c.site.SuspensionHeightM
	runs := make([]RunPart, to-from)
	err := draws.Each(to-from, c.opt.Workers, func(k int) error {
		i := from + k
		v := *s
		if variant != nil {
			if d := variant(i); d != nil {
				v = *d
			}
		}
		// The run needs no site: its check (validated with the scenario
		// in prepare) is not made again for each run (in wasm it was a
		// tenth of a run's time, mostly the field names' formatting).
		v.Site = nil
		// Nor its plan block: a drawn rope length may lie outside the
		// plan's rope range (that range is what the planner tries, not a
		// limit of the crane), and the run plans nothing.
		v.Plan = nil
		sc := scratches.Get().(*scratch)
		defer scratches.Put(sc)
		r, err := sway.EvaluateWith(&v, sway.Options{Budget: c.opt.Budget, PathOnly: true, HistoryBuffer: &sc.hist, LegEnds: true})
		if err != nil {
			return fmt.Errorf("run %d: %w", i, err)
		}
		run := RunOf(r)
		near := c.site.checkRunWith(&run, c.opt.StepM, sc)
		rp := RunPart{Near: near}
		for n := range near {
			if !finite(near[n].ClearanceM) || (near[n].Rope != nil && !finite(near[n].Rope.ClearanceM)) {
				return fmt.Errorf("run %d: the path has no points", i)
			}
		}
		plan := run.planPathInto(h, c.radiusM, sc.points)
		sc.points = plan.Points
		rp.StrayM = c.near.strayInto(plan.Points, sc)
		rp.Cells = runCellsInto(&plan, c.opt.CellM, sc)
		d, low := c.track.runSectionInto(&run, h, c.site.LoadRadiusM, sc)
		rp.bins = binSection(d, low, sectionBin(c.track.length()))
		runs[k] = rp
		return nil
	})
	if err != nil {
		return nil, err
	}
	return &Part{From: from, To: to, Data: encodeRuns(runs)}, nil
}

// decodePart reads a part's runs and checks that they are runs From to
// To-1 of a check of total runs, each with the site's obstacles.
func (c *checker) decodePart(total int, p Part) ([]RunPart, error) {
	pr, err := decodeRuns(p.Data)
	if err != nil {
		return nil, err
	}
	if p.From < 0 || p.To > total || p.To <= p.From || p.To-p.From != len(pr) {
		return nil, errPartRange(p.From, p.To, total)
	}
	for i := range pr {
		if len(pr[i].Near) != len(c.site.Obstacles) {
			return nil, errors.New("clearance: a run's obstacles are not the site's")
		}
	}
	return pr, nil
}

func errPartRange(from, to, total int) error {
	return fmt.Errorf("clearance: a part's runs from %d to %d are not runs of this check (0 to %d), or overlap another part", from, to, total)
}

// joinRuns makes the report of runs, in run order: every obstacle's
// figures over them, the verdict, the envelopes and the vertical section.
func (c *checker) joinRuns(seed int, runs []RunPart) (*Report, error) {
	if len(runs) == 0 {
		return nil, errors.New("clearance: no runs to join")
	}
	near := make([][]Closest, len(runs))
	strays := make([]float64, len(runs))
	for i, r := range runs {
		near[i] = r.Near
		strays[i] = r.StrayM
	}
	site := c.site
	reps, where := site.summarise(near)
	rep := &Report{Runs: len(runs), Seed: seed, MarginM: site.MarginM, Obstacles: reps,
		Outline: OutlineBall, LoadRadiusM: c.radiusM, Nominal: c.plan.Points}
	if c.nominal.Rigid() {
		rep.Outline = OutlineBox
	}
	var envs [2]*Envelope
	for k, e := range []struct {
		level, conf float64
		out         *EnvelopeOut
	}{{0.5, 0, &rep.Envelope50}, {Required, ExclusionConfidence, &rep.Envelope95}} {
		order, n := keep(strays, e.level, e.conf)
		count := 0
		for _, i := range order[:n] {
			count += len(runs[i].Cells) / 3
		}
		spans := make([]cellSpan, 0, count)
		for _, i := range order[:n] {
			var err error
			if spans, err = appendCells(spans, runs[i].Cells); err != nil {
				return nil, err
			}
		}
		out, err := unionSpans(spans, c.opt.CellM)
		if err != nil {
			return nil, err
		}
		out.Level, out.Inside, out.StrayM = e.level, n, strays[order[n-1]]
		out.Confidence = CoverageConfidence(n, len(runs), e.level)
		*e.out = out
		envs[k] = &Envelope{Level: e.level, Runs: len(runs), Inside: n, StrayM: out.StrayM, Members: order[:n]}
	}
	bins := make(map[int]runBins, len(envs[1].Members))
	for _, m := range envs[1].Members {
		bins[m] = runs[m].bins
	}
	rep.Section = sectionFrom(site, &c.nominal, c.track, bins, envs[0], envs[1], rep.Obstacles, where)
	rep.Clears, rep.WordSentences = VerdictSentences(rep.Obstacles, site.MarginM)
	rep.Words = words.Strings(rep.WordSentences)
	rep.Assumptions = assumptions(rep.Outline, c.opt)
	return rep, nil
}

// keep ranks the runs by stray, least first (ties in run order), and says
// how many the envelope at level holds: ceil(level*N), or with conf above
// zero the fewest for which the confidence that its coverage is at least
// level reaches conf (all N when none does).
func keep(strays []float64, level, conf float64) ([]int, int) {
	order := make([]int, len(strays))
	for i := range order {
		order[i] = i
	}
	sort.SliceStable(order, func(a, b int) bool { return strays[order[a]] < strays[order[b]] })
	n := len(strays)
	k := max(int(math.Ceil(level*float64(n)-1e-9)), 1)
	for conf > 0 && k < n && CoverageConfidence(k, n, level) < conf {
		k++
	}
	return order, k
}
