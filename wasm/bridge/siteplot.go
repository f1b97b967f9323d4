package bridge

import (
	"encoding/json"

	"swaysheet/core/clearance"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
)

func init() { Calls["site_plot"] = sitePlot }

// SitePlotInput is the input of "site_plot": the scenario whose site is
// drawn (as edited, a dragged obstacle included) in its units, the
// clearance report to draw, and the screen.
type SitePlotInput struct {
	ShownInput
	// ReportFor is the scenario whose clearance check the bridge keeps
	// (by its fingerprint, as the check sheet finds it): the envelopes
	// drawn. Omitted: the scenario's own.
	ReportFor json.RawMessage `json:"report_for,omitempty"`
	// Report, given, is drawn instead: the partial report while the
	// runs arrive, or the page's own when the bridge keeps another.
	Report *clearance.Report `json:"report,omitempty"`
	// WidthPx is the width shown (CSS px), MaxHeightPx the plan's
	// tallest; Selected the obstacle drawn selected (-1 or omitted:
	// none); Frame the plan's transform to keep (while dragging).
	WidthPx     float64          `json:"width_px"`
	MaxHeightPx float64          `json:"max_height_px"`
	Selected    *int             `json:"selected,omitempty"`
	Frame       *sheet.SiteFrame `json:"frame,omitempty"`
}

// SitePlotReply is the "site_plot" call's result: the plan and the
// section (empty without a report) as SVG, the plan's transform (the page
// maps a pointer to metres with it, and nothing more), each obstacle's
// outline in metres (the corners its handles sit on, in the order of the
// site's obstacles), and whether a report's envelopes are drawn.
type SitePlotReply struct {
	SVG        string               `json:"svg"`
	SectionSVG string               `json:"section_svg"`
	Frame      sheet.SiteFrame      `json:"frame"`
	Outlines   [][]clearance.Point2 `json:"outlines"`
	Envelopes  bool                 `json:"envelopes"`
}

// sitePlot draws the page's site plan and section with the check sheet's
// plotter (core/sheet). It runs no check and no evaluation: the report is
// the one kept or given, the crane's path the memo's evaluation of the
// report's scenario (or of the scenario), when it holds one.
func sitePlot(_ *Env, input []byte) (any, error) {
	var in SitePlotInput
	s, err := in.read(input, &in)
	if err != nil {
		return nil, err
	}
	if s.Site == nil {
		return nil, noSite
	}
	of := s
	if len(in.ReportFor) > 0 {
		if of, err = scenario.Parse(in.ReportFor); err != nil {
			return nil, scenario.Errors{{Field: "report_for", Message: "the scenario checked: " + err.Error()}}
		}
	}
	rep := in.Report
	if rep == nil && of.Site != nil {
		rep = keptClearance(of)
	}
	p := sheet.SitePlanInput{Site: clearance.SiteOf(s.Site), Report: rep, Units: in.choice(),
		WidthPx: in.WidthPx, MaxHeightPx: in.MaxHeightPx, Selected: -1, Frame: in.Frame}
	if in.Selected != nil {
		p.Selected = *in.Selected
	}
	if r := keptResultOf(of); r != nil {
		h := &r.History
		for i := range h.SuspensionXM {
			if i < len(h.SuspensionYM) {
				p.Crane = append(p.Crane, clearance.Point2{X: h.SuspensionXM[i], Y: h.SuspensionYM[i]})
			}
			if i < len(h.LoadXM) && i < len(h.LoadYM) {
				p.Load = append(p.Load, clearance.Point2{X: h.LoadXM[i], Y: h.LoadYM[i]})
			}
		}
	}
	out := SitePlotReply{Envelopes: rep != nil, Outlines: [][]clearance.Point2{}}
	out.SVG, out.Frame = sheet.SitePlanScreen(p)
	for _, o := range p.Site.Obstacles {
		out.Outlines = append(out.Outlines, o.Outline)
	}
	if rep != nil {
		out.SectionSVG = sheet.SiteSectionScreen(&rep.Section, in.choice(), in.WidthPx)
	}
	return out, nil
}
