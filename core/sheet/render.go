package sheet

import (
	"html"
	"strings"
)

// markup is HTML the sheet made itself (the SVGs); everything else is
// escaped on the way out.
type markup string

// htmlWriter writes the sheet. raw takes only the sheet's own constant
// markup; t escapes text.
type htmlWriter struct{ strings.Builder }

func (h *htmlWriter) raw(s string) { h.WriteString(s) }
func (h *htmlWriter) t(s string)   { h.WriteString(html.EscapeString(s)) }
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
	h.raw(`<div class="sw-fpl"><p><span class="sw-k">Fingerprint (SHA-256 of the canonical JSON)</span> `)
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
	if v.Example {
		h.raw(`<p class="sw-banner"><b>EXAMPLE:</b> invented data to show how the tool works, not a real lift.</p>` + "\n")
	}
	if v.AnyOutside {
		h.raw(`<p class="sw-banner"><b>&#x2716; OUTSIDE THE PLAN'S LIMITS:</b> at least one result below is outside its limit. Do not lift as planned.</p>` + "\n")
	}
	if !v.Simulated {
		h.raw(`<p class="sw-banner"><b>NOTHING SIMULATED:</b> `)
		h.t(v.Verdict)
		h.raw("</p>\n")
	}
	if v.EvalErr != "" {
		h.raw(`<p class="sw-banner"><b>NOT COMPUTED:</b> `)
		h.t(v.EvalErr)
		h.raw("</p>\n")
	}

	h.raw("<div class=\"sw-main\">\n<section class=\"sw-inputs\">\n<h2>Inputs</h2>\n<div class=\"sw-groups\">\n")
	for _, g := range v.Inputs {
		h.raw(`<table class="sw-t sw-group"><caption>`)
		h.t(g.Title)
		h.raw("</caption>\n")
		h.rows(g.Rows)
		h.raw("</table>\n")
	}
	// The checks and the verdict first; the other figures follow and may
	// run on into the next column (sw-split).
	h.raw("</div>\n</section>\n<section class=\"sw-results\">\n<h2>Results</h2>\n")
	if v.ResultsFor != "" {
		h.el("p", "sw-small", "For "+v.ResultsFor+".")
	}
	if len(v.Results) > 0 {
		h.checks(v)
		h.raw(`<table class="sw-t sw-split"><caption>Other figures</caption>` + "\n")
		h.rows(v.Results)
		h.raw("</table>\n")
	} else {
		h.raw("<p>No results: the scenario could not be computed.</p>\n")
	}
	h.raw("</section>\n</div>\n")

	if p := v.Plan; p != nil {
		h.raw("<section class=\"sw-plan\">\n<h2>Recommended drive settings (planner)</h2>\n")
		switch {
		case p.Err != "":
			h.raw("<p><b>The planner could not run:</b> ")
			h.t(p.Err)
			h.raw("</p>\n")
		case p.Recommended != nil:
			o := p.Recommended
			h.raw("<p><b>")
			h.t(o.Label)
			h.raw("</b> (")
			h.t(o.Drive)
			h.raw(")")
			if o.Within {
				h.raw(" &#x2714; within every limit at every rope length simulated (")
				h.t(p.Ropes)
				h.raw(")")
			} else {
				h.raw(" <b>&#x2716; OUTSIDE: ")
				h.t(strings.Join(o.Outside, ", "))
				h.raw("</b>")
			}
			h.t(". Move time " + Num(o.MoveTimeS, 4) + " s (" + Num(o.PenaltyS, 4) + " s more than at the drive limits); worst peak swing " +
				Num(o.WorstPeakSwingDeg, 4) + " deg, worst residual swing " + Num(o.WorstResidualSwingDeg, 4) + " deg.")
			h.raw("</p>\n")
			h.list("sw-set", o.Settings, "")
		default:
			h.raw("<p><b>&#x2716; No drive setting keeps the load inside the limits.</b></p>\n")
			h.list("", p.Infeasible, "")
			if p.Reason != "" {
				h.el("p", "sw-small", p.Reason)
			}
		}
		if len(p.Others) > 0 {
			parts := make([]string, len(p.Others))
			for i, o := range p.Others {
				if o.Within {
					parts[i] = o.Label + " (✔ within, " + Num(o.MoveTimeS, 4) + " s)"
				} else {
					parts[i] = o.Label + " (✖ outside)"
				}
			}
			h.el("p", "sw-small", "Other options: "+strings.Join(parts, "; ")+".")
		}
		for _, n := range p.Notes {
			h.el("p", "sw-small", n)
		}
		h.raw("</section>\n")
	}

	h.raw("<section class=\"sw-plots\" aria-label=\"Plots\">\n<figure>")
	h.m(v.AnglePlot)
	h.raw("</figure>\n<figure>")
	h.m(v.PathPlot)
	h.raw("<figcaption>Solid: the load. Dashed: the point the rope hangs from. Axes need not share a scale.</figcaption></figure>\n</section>\n")

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
	h.raw("<footer class=\"sw-foot\">\n")
	for _, s := range []string{"Prepared by: name, signature, date", "Checked by: name, signature, date",
		"Approved by the person in charge of the lift: name, signature, date"} {
		h.raw(`<p><span class="sw-line"></span>`)
		h.t(s)
		h.raw("</p>\n")
	}
	h.raw("</footer>\n</article>")
}

// checks writes the figures the plan can limit, each with its verdict,
// and the verdict of the whole.
func (h *htmlWriter) checks(v *view) {
	h.raw(`<table class="sw-t sw-checks"><caption>Against the plan's limits</caption>` + "\n")
	h.raw(`<tr><th scope="col">Figure</th><th scope="col" class="sw-n">Result</th><th scope="col" class="sw-n">Limit</th><th scope="col">Verdict</th></tr>` + "\n")
	for _, c := range v.Checks {
		if c.HasLimit && !c.Within {
			h.raw(`<tr class="sw-out"><th>`)
		} else {
			h.raw("<tr><th>")
		}
		h.t(c.Label)
		h.raw(`</th><td class="sw-n">`)
		h.t(c.Value + " " + c.Unit)
		switch {
		case !c.HasLimit && !v.Simulated:
			h.raw(`</td><td class="sw-n">&ndash;</td><td>nothing simulated</td>`)
		case !c.HasLimit:
			h.raw(`</td><td class="sw-n">&ndash;</td><td>no limit set</td>`)
		case c.Within:
			h.raw(`</td><td class="sw-n">`)
			h.t(c.Limit + " " + c.Unit)
			h.raw("</td><td>&#x2714; within, ")
			h.t(c.Margin + " " + c.Unit + " to spare")
			h.raw("</td>")
		default:
			h.raw(`</td><td class="sw-n">`)
			h.t(c.Limit + " " + c.Unit)
			h.raw("</td><td><b>&#x2716; OUTSIDE</b> by ")
			h.t(c.Margin + " " + c.Unit)
			h.raw("</td>")
		}
		h.raw("</tr>\n")
	}
	h.raw("</table>\n")
	if v.Simulated && v.Verdict != "" {
		h.el("p", "sw-verdict", v.Verdict)
	}
}
