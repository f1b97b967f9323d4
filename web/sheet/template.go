package sheet

// sheetHTML is the sheet's template. "body" is the <article>; "doc" wraps
// it in a stand-alone document.
const sheetHTML = `
{{- define "doc" -}}
<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>Check sheet: {{.Name}}</title>
<style>{{.CSS}}</style>
</head>
<body class="sw-alone">
{{template "body" .}}
</body>
</html>
{{end -}}

{{- define "body" -}}
<article class="sw-sheet{{if .Dense}} sw-dense{{end}}" data-fingerprint="{{.Fingerprint}}">
<header class="sw-top">
<div class="sw-topl">
<div class="sw-head">
  <div>
    <h1>{{.Title}}</h1>
    <p class="sw-name">{{.Name}}{{if .Description}} <span class="sw-desc">&mdash; {{.Description}}</span>{{end}}</p>
  </div>
</div>
<div class="sw-fpl"><p><span class="sw-k">Fingerprint (SHA-256 of the canonical JSON)</span> <span class="sw-fp">{{.Fingerprint}}</span></p><p class="sw-meta">swaysheet {{.Version}}{{if .PrintedAt}} &middot; printed {{.PrintedAt}}{{end}}</p></div>
<section class="sw-refs" aria-label="Reference">
{{range .Refs}}<div class="sw-ref"><span class="sw-k">{{.Label}}</span><span class="sw-v">{{if blank .Value}}&nbsp;{{else}}{{.Value}}{{end}}</span></div>
{{end}}</section>
</div>
<div class="sw-qr">{{.QR}}<p class="sw-small">{{.QRNote}}</p></div>
</header>
{{if .Example}}<p class="sw-banner"><b>EXAMPLE:</b> invented data to show how the tool works, not a real lift.</p>{{end}}
{{if .AnyOutside}}<p class="sw-banner"><b>&#x2716; OUTSIDE THE PLAN'S LIMITS:</b> at least one result below is outside its limit. Do not lift as planned.</p>{{end}}
{{if .EvalErr}}<p class="sw-banner"><b>NOT COMPUTED:</b> {{.EvalErr}}</p>{{end}}

<div class="sw-main">
<section class="sw-inputs">
  <h2>Inputs</h2>
  <div class="sw-groups">
  {{range .Inputs}}<table class="sw-t sw-group"><caption>{{.Title}}</caption>
  {{range .Rows}}<tr><th>{{.Label}}</th><td class="sw-n">{{.Value}}</td><td class="sw-u">{{.Unit}}</td></tr>
  {{end}}</table>
  {{end}}</div>
</section>
<section class="sw-results">
  <h2>Results</h2>
  {{if .ResultsFor}}<p class="sw-small">For {{.ResultsFor}}.</p>{{end}}
  {{if .Results}}<table class="sw-t">
  {{range .Results}}<tr><th>{{.Label}}</th><td class="sw-n">{{.Value}}</td><td class="sw-u">{{.Unit}}</td></tr>
  {{end}}</table>
  <table class="sw-t sw-checks"><caption>Against the plan's limits</caption>
  <tr><th scope="col">Figure</th><th scope="col" class="sw-n">Result</th><th scope="col" class="sw-n">Limit</th><th scope="col">Verdict</th></tr>
  {{range .Checks}}<tr{{if and .HasLimit (not .Within)}} class="sw-out"{{end}}><th>{{.Label}}</th>
  {{if .HasLimit}}<td class="sw-n">{{.Value}} {{.Unit}}</td><td class="sw-n">{{.Limit}} {{.Unit}}</td><td>{{if .Within}}&#x2714; within{{else}}<b>&#x2716; OUTSIDE</b>{{end}}</td>
  {{else}}<td class="sw-n">&ndash;</td><td class="sw-n">&ndash;</td><td>no limit set</td>{{end}}</tr>
  {{end}}</table>
  {{else}}<p>No results: the scenario could not be computed.</p>{{end}}
</section>
</div>

{{with .Plan}}<section class="sw-plan">
  <h2>Recommended drive settings (planner)</h2>
  {{if .Err}}<p><b>The planner could not run:</b> {{.Err}}</p>
  {{else}}{{with .Recommended}}
  <p><b>{{.Label}}</b> ({{.Drive}}){{if .Within}} &#x2714; within every limit at every rope length simulated ({{$.Plan.Ropes}}){{else}} <b>&#x2716; OUTSIDE: {{range $i, $e := .Outside}}{{if $i}}, {{end}}{{$e}}{{end}}</b>{{end}}.
  Move time {{num .MoveTimeS}} s ({{num .PenaltyS}} s more than at the drive limits); worst peak swing {{num .WorstPeakSwingDeg}} deg, worst residual swing {{num .WorstResidualSwingDeg}} deg.</p>
  <ul class="sw-set">{{range .Settings}}<li>{{.}}</li>{{end}}</ul>
  {{else}}<p><b>&#x2716; No drive setting keeps the load inside the limits.</b></p>
  <ul>{{range .Infeasible}}<li>{{.}}</li>{{end}}</ul>{{end}}
  {{if and .Reason (not .Recommended)}}<p class="sw-small">{{.Reason}}</p>{{end}}
  {{if .Others}}<p class="sw-small">Other options: {{range $i, $o := .Others}}{{if $i}}; {{end}}{{$o.Label}} {{if $o.Within}}(&#x2714; within, {{num $o.MoveTimeS}} s){{else}}(&#x2716; outside){{end}}{{end}}.</p>{{end}}
  {{range .Notes}}<p class="sw-small">{{.}}</p>{{end}}
  {{end}}
</section>{{end}}

<section class="sw-plots" aria-label="Plots">
  <figure>{{.AnglePlot}}</figure>
  <figure>{{.PathPlot}}<figcaption>Solid: the load. Dashed: the point the rope hangs from. Axes need not share a scale.</figcaption></figure>
</section>

<section class="sw-warn">
  <h2>Warnings</h2>
  {{if .Warnings}}<ul>{{range .Warnings}}<li>&#x26A0; {{.}}</li>{{end}}</ul>{{else}}<p>&#x2714; No warnings for these inputs.</p>{{end}}
</section>

<div class="sw-notes">
<section>
  <h2>What the model assumes</h2>
  <ul class="sw-small">{{range .Assumptions}}<li>{{.}}</li>{{end}}</ul>
</section>
<section>
  <h2>Safety cautions</h2>
  <ul class="sw-small">{{range .Cautions}}<li>{{.}}</li>{{end}}</ul>
</section>
</div>

<footer class="sw-foot">
  <p><span class="sw-line"></span>Prepared by: name, signature, date</p>
  <p><span class="sw-line"></span>Checked by: name, signature, date</p>
  <p><span class="sw-line"></span>Approved by the person in charge of the lift: name, signature, date</p>
</footer>
</article>
{{- end}}`
