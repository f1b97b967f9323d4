package sheet

import (
	"fmt"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// siteGroup lists the site block of the clearance check in short rows:
// the heights and sizes, each obstacle's top, and the spread of runs (the
// obstacles' outlines are in the scenario file and its QR code).
func siteGroup(st *scenario.Site, u units.Choice) Group {
	length := func(label string, m float64) Row {
		v, sym := u.Show("length", m)
		return Row{Label: label, Value: Num(v, 4), Unit: sym}
	}
	g := Group{Title: "Site and clearances"}
	g.Rows = append(g.Rows,
		length("Rope top above floor", *st.SuspensionHeightM),
		length("Load size (radius)", *st.LoadRadiusM),
		length("Margin to keep", st.MarginM))
	for i, o := range st.Obstacles {
		name := o.Name
		if name == "" {
			name = fmt.Sprintf("obstacle %d", i+1)
		}
		g.Rows = append(g.Rows, length(capital(name)+", top", *o.TopM))
	}
	if sp := st.Spread; sp != nil {
		runs := sp.Runs
		if runs == 0 {
			runs = scenario.DefaultSiteRuns
		}
		g.Rows = append(g.Rows, Row{Label: "Runs (seed)", Value: fmt.Sprintf("%d (%d)", runs, sp.Seed)})
		if sp.RopeLengthM > 0 {
			g.Rows = append(g.Rows, length("Rope length ± (1 sd)", sp.RopeLengthM))
		}
		if sp.CentreDepthM > 0 {
			g.Rows = append(g.Rows, length("Centre of mass ± (1 sd)", sp.CentreDepthM))
		}
		for _, r := range []struct {
			label, unit string
			v           float64
		}{{"Press timing ± (1 sd)", "s", sp.PressS}, {"Gust strength ± (1 sd)", "%", sp.GustPct}, {"Gust moment ± (1 sd)", "s", sp.GustS}} {
			if r.v > 0 {
				g.Rows = append(g.Rows, Row{Label: r.label, Value: Num(r.v, 3), Unit: r.unit})
			}
		}
	}
	return g
}
