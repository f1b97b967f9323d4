package sheet

import (
	"strings"

	"swaysheet/core/figures"
	"swaysheet/core/plan"
)

// markup is HTML the sheet made itself (the SVGs); everything else is
// escaped on the way out.
type markup string

// htmlWriter writes the sheet. raw takes only the sheet's own constant
// markup; t escapes text.
type htmlWriter struct{ strings.Builder }

func (h *htmlWriter) raw(s string) { h.WriteString(s) }
func (h *htmlWriter) t(s string)   { h.WriteString(escapeHTML(s)) }
func (h *htmlWriter) m(s markup)   { h.WriteString(string(s)) }
func (h *htmlWriter) el(tag, class, text string) {
	h.raw("<" + tag)
	if class != "" {
		h.raw(` class="` + class + `"`)
	}
	h.raw(">")
	h.t(text)
	h.raw("</" + tag + ">")
}

func (h *htmlWriter) doc(v *view) {
	h.raw("<!doctype html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
	h.raw("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
	h.raw("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\">\n")
	h.raw("<title>")
	h.t("Check sheet: " + v.Name)
	h.raw("</title>\n<style>")
	h.raw(strings.ReplaceAll(CSS, "</", `<\/`))
	h.raw("</style>\n</head>\n<body class=\"sw-alone\">\n")
	h.body(v)
	h.raw("\n</body>\n</html>\n")
}

func (h *htmlWriter) rows(rows []Row) {
	for _, r := range rows {
		h.raw("<tr><th>")
		h.t(r.Label)
		h.raw(`</th><td class="sw-n">`)
		h.t(r.Value)
		h.raw(`</td><td class="sw-u">`)
		h.t(r.Unit)
		h.raw("</td></tr>\n")
	}
}

func (h *htmlWriter) list(class string, items []string, prefix string) {
	h.raw("<ul")
	if class != "" {
		h.raw(` class="` + class + `"`)
	}
	h.raw(">")
	for _, s := range items {
		h.raw("<li>" + prefix)
		h.t(s)
		h.raw("</li>")
	}
	h.raw("</ul>\n")
}

func (h *htmlWriter) body(v *view) {
	cls := "sw-sheet"
	if v.Dense {
		cls += " sw-dense"
	}
	if v.Denser {
		cls += " sw-denser"
	}
	if v.Densest {
		cls += " sw-densest"
	}
	h.raw(`<article class="` + cls + `" data-fingerprint="`)
	h.t(v.Fingerprint)
	h.raw("\">\n<header class=\"sw-top\">\n<div class=\"sw-topl\">\n<div class=\"sw-head\"><div>")
	h.el("h1", "", v.Title)
	h.raw(`<p class="sw-name">`)
	h.t(v.Name)
	if v.Description != "" {
		h.raw(` <span class="sw-desc">&mdash; `)
		h.t(v.Description)
		h.raw("</span>")
	}
	h.raw("</p></div></div>\n")
	h.raw(`<div class="sw-fpl"><p><span class="sw-k">Scenario fingerprint (checks that nothing was changed)</span> `)
	h.el("span", "sw-fp", v.Fingerprint)
	h.raw(`</p><p class="sw-meta">`)
	h.t("swaysheet " + v.Version)
	if v.PrintedAt != "" {
		h.t(" · printed " + v.PrintedAt)
	}
	h.raw("</p></div>\n<section class=\"sw-refs\" aria-label=\"Reference\">\n")
	for _, r := range v.Refs {
		h.raw(`<div class="sw-ref">`)
		h.el("span", "sw-k", r.Label)
		h.raw(`<span class="sw-v">`)
		if strings.TrimSpace(r.Value) == "" {
			h.raw("&nbsp;")
		} else {
			h.t(r.Value)
		}
		h.raw("</span></div>\n")
	}
	h.raw("</section>\n</div>\n<div class=\"sw-qr\">")
	h.m(v.QR)
	h.el("p", "sw-small", v.QRNote)
	h.raw("</div>\n</header>\n")
	h.verdict(v)
	if v.Example {
		h.raw(`<p class="sw-banner"><b>EXAMPLE:</b> invented data to show how the tool works, not a real lift.</p>` + "\n")
	}

	h.raw("<div class=\"sw-main\">\n<section class=\"sw-results\">\n<h2>Results</h2>\n")
	if v.ResultsFor != "" {
		h.el("p", "sw-small", "For "+v.ResultsFor+".")
	}
	if v.WorstNote != "" {
		h.el("p", "sw-small", v.WorstNote)
	}
	if len(v.Figures) > 0 {
		h.figures(v)
	} else {
		h.raw("<p>No results: the scenario could not be computed.</p>\n")
	}
	h.raw("</section>\n<section class=\"sw-inputs\">\n<h2>Inputs</h2>\n<div class=\"sw-groups\">\n")
	for _, g := range v.Inputs {
		h.raw(`<table class="sw-t sw-group"><caption>`)
		h.t(g.Title)
		h.raw("</caption>\n")
		h.rows(g.Rows)
		h.raw("</table>\n")
	}
	h.raw("</div>\n</section>\n</div>\n")

	if p := v.Plan; p != nil {
		h.plan(p)
	}

	h.raw("<section class=\"sw-plots\" aria-label=\"Plots\">\n<figure>")
	h.m(v.AnglePlot)
	h.raw("</figure>\n<figure>")
	h.m(v.PathPlot)
	h.el("figcaption", "", v.PathCaption)
	h.raw("</figure>\n</section>\n")
	if v.Site != nil {
		h.site(v.Site)
	}

	h.raw("<section class=\"sw-warn\">\n<h2>Warnings</h2>\n")
	if len(v.Warnings) > 0 {
		h.list("", v.Warnings, "&#x26A0; ")
	} else {
		h.raw("<p>&#x2714; No warnings for these inputs.</p>\n")
	}
	h.raw("</section>\n<div class=\"sw-notes\">\n<section>\n<h2>What the model assumes</h2>\n")
	h.list("sw-small", v.Assumptions, "")
	h.raw("</section>\n<section>\n<h2>Safety cautions</h2>\n")
	h.list("sw-small", v.Cautions, "")
	h.raw("</section>\n</div>\n")
	h.detail(v)
	h.raw("<footer class=\"sw-foot\">\n")
	for _, s := range []string{"Prepared by: name, signature, date", "Checked by: name, signature, date",
		"Approved by the person in charge of the lift: name, signature, date"} {
		h.raw(`<p><span class="sw-line"></span>`)
		h.t(s)
		h.raw("</p>\n")
	}
	h.raw("</footer>\n</article>")
}

// verdict writes the band at the top: all within the lift plan's limits,
// or which figure is outside and by how much, over every rope length.
func (h *htmlWriter) verdict(v *view) {
	if v.EvalErr != "" {
		h.raw(`<p class="sw-verdict-band sw-bad"><b>NOT COMPUTED:</b> `)
		h.t(v.EvalErr)
		h.raw("</p>\n")
		return
	}
	switch v.VerdictState {
	case figures.AllWithin:
		h.raw(`<p class="sw-verdict-band"><b>&#x2714; WITHIN THE LIFT PLAN'S LIMITS.</b> `)
	case figures.Outside:
		h.raw(`<p class="sw-verdict-band sw-bad"><b>&#x2716; OUTSIDE THE LIFT PLAN'S LIMITS:</b> `)
		h.t(strings.TrimPrefix(v.Verdict, "OUTSIDE the lift plan's limits: "))
		h.raw("</p>\n")
		return
	case figures.NotSimulated:
		h.raw(`<p class="sw-verdict-band"><b>NOTHING SIMULATED.</b> `)
	default:
		h.raw(`<p class="sw-verdict-band"><b>NO LIMITS SET.</b> `)
	}
	h.t(v.Verdict)
	h.raw("</p>\n")
}

// figures writes every figure in one table: the crew's words, the value
// and its unit in columns of their own (the values line up), and for
// the figures the plan can limit, the limit and the verdict.
func (h *htmlWriter) figures(v *view) {
	h.raw(`<table class="sw-t sw-figs">` + "\n")
	h.raw(`<tr><th scope="col">Figure</th><th scope="col" class="sw-n">Value</th><th scope="col"></th><th scope="col" class="sw-n">Limit</th><th scope="col">Verdict</th></tr>` + "\n")
	for i, f := range v.Figures {
		switch {
		case f.Outside:
			h.raw(`<tr class="sw-out"><th>`)
		case i > 0 && !f.Limited && v.Figures[i-1].Limited:
			h.raw(`<tr class="sw-first"><th>`)
		default:
			h.raw("<tr><th>")
		}
		h.t(f.Label)
		h.raw(`</th><td class="sw-n">`)
		h.t(f.Value)
		h.raw(`</td><td class="sw-u">`)
		h.t(f.Unit)
		h.raw(`</td><td class="sw-n">`)
		if f.Limit != "" {
			h.t(f.Limit)
		} else if f.Limited {
			h.raw("&ndash;")
		}
		h.raw(`</td><td class="sw-vd">`)
		if f.Outside {
			h.raw("<b>")
			h.t(f.Verdict)
			h.raw("</b>")
		} else {
			h.t(f.Verdict)
		}
		h.raw("</td></tr>\n")
	}
	h.raw("</table>\n")
}

// plan writes the planner's recommended drive settings: the steps in
// order, in one column.
func (h *htmlWriter) plan(p *planView) {
	h.raw("<section class=\"sw-plan\">\n<h2>Recommended drive settings</h2>\n")
	switch {
	case p.Err != "":
		h.raw("<p><b>The planner could not run:</b> ")
		h.t(p.Err)
		h.raw("</p>\n")
	case p.Recommended != nil:
		o := p.Recommended
		h.raw("<p><b>")
		h.t(crewTitle(o))
		h.raw("</b>")
		if o.Within {
			h.raw(" &#x2714; within every limit at every rope length checked (")
			h.t(p.Ropes)
			h.raw(")")
		} else {
			h.raw(" <b>&#x2716; OUTSIDE: ")
			h.t(strings.Join(p.Outside, ", "))
			h.raw("</b>")
		}
		h.t(". " + p.Summary)
		h.raw("</p>\n<ol class=\"sw-set\">")
		for _, s := range p.Settings {
			h.raw("<li>")
			h.t(strings.TrimSpace(s))
			h.raw("</li>")
		}
		h.raw("</ol>\n")
	default:
		h.raw("<p><b>&#x2716; No drive setting keeps the load inside the limits.</b></p>\n")
		h.list("", p.Infeasible, "")
		if p.Reason != "" {
			h.el("p", "sw-small", p.Reason)
		}
	}
	if p.Unmarked {
		h.el("p", "sw-small", "The planner's sentences are given in SI units.")
	}
	h.raw("</section>\n")
}

// crewTitle names a planner's option by what the crew does with it; the
// method's name (ZV, ZVD, EI) is in the engineering detail.
func crewTitle(o *plan.Option) string {
	if o.Drive == "pendant" || len(o.Presses) > 0 {
		return "Press and release times for the pendant"
	}
	return "Settings of the variable-speed drive"
}

// detail writes the engineering detail: technical names, methods and
// their sources, the planner's notes, in small type at the end.
func (h *htmlWriter) detail(v *view) {
	h.raw("<section class=\"sw-detail sw-small\">\n<h2>Engineering detail</h2>\n<p>")
	var names []string
	for _, f := range v.Figures {
		if f.Limited {
			names = append(names, f.Label+": "+f.Technical)
		}
	}
	h.t("Technical names: " + strings.Join(names, "; ") + ".")
	h.raw("</p>\n")
	if len(v.DetailFigures) > 0 {
		h.el("p", "", "Also computed: "+strings.Join(v.DetailFigures, "; ")+".")
	}
	for _, d := range v.Methods {
		h.el("p", "", d)
	}
	if p := v.Plan; p != nil {
		if o := p.Recommended; o != nil {
			why := " " + p.Reason
			if v.Densest {
				why = ""
			}
			h.el("p", "", "Recommended drive setting: "+o.Label+" ("+strings.ReplaceAll(o.Drive, "_", " ")+")."+why)
		}
		if v.Densest && (len(p.Others) > 0 || len(p.Notes) > 0) {
			// No room on one page: the page and "swaysheet -plan" give them.
			h.el("p", "", "The planner's other options and notes are on the page's plan section and in \"swaysheet -plan\".")
		} else {
			if len(p.Others) > 0 {
				parts := make([]string, len(p.Others))
				for i, o := range p.Others {
					if o.Within {
						parts[i] = o.Label + " (within)"
					} else {
						parts[i] = o.Label + " (outside)"
					}
				}
				h.el("p", "", "Other options the planner checked: "+strings.Join(parts, "; ")+".")
			}
			for _, n := range p.Notes {
				h.el("p", "", n)
			}
		}
	}
	h.raw("</section>\n")
}
