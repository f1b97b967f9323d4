// Package sheet writes the one-page check sheet of a scenario as HTML: the
// user's reference fields, every input with its unit, the results held
// against the plan's limits, the planner's recommended drive settings, the
// rope-angle and load-path plots as inline SVG, the warnings, the model's
// assumptions, the safety cautions, the tool's version, the scenario's
// fingerprint, a QR code that carries the scenario, and signature lines.
//
// The command line (swaysheet -sheet) and the page (through the wasm
// bridge) both call Build, so a sheet printed from the page and one
// written by the command line agree. Build only renders: it is given the
// result and the plan (Compute gathers them with the caller's own
// evaluation and planner) and never computes physics. The results are
// presented from the figures table (core/figures). The HTML is written by
// hand (render.go), every text through escapeHTML (html.EscapeString): text the user
// typed is always text, never markup. Nothing on the sheet is told by
// colour alone; it prints in black and white.
package sheet

import (
	"bytes"
	"compress/flate"
	_ "embed"
	"encoding/base64"
	"fmt"
	"io"
	"strings"

	"swaysheet/core/clearance"
	"swaysheet/core/figures"
	"swaysheet/core/plan"
	"swaysheet/core/qr"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// CSS is the sheet's style sheet: written into a stand-alone sheet, and
// the page's sheet.css (web/offline FromCore serves and builds it from
// here; there is no copy).
//
//go:embed sheet.css
var CSS string

// Cautions are printed on every sheet.
var Cautions = []string{
	"These figures are an estimate from a simplified model, not a guarantee of how the load will move.",
	"The crane manufacturer's instructions, load charts and wind limits, the approved lift plan, local lifting codes and regulations and the person in charge of the lift take precedence over this sheet.",
	"Nobody under a suspended load: nobody stands or works under it. Use tag lines where the lift plan calls for them.",
	"Stop the lift when sway or wind exceeds the plan's limits. A qualified person approves the lift.",
}

// Methods name the methods behind the figures of s and their sources, for
// the sheet's engineering detail (crew lines use plain words); the model
// is named by sway.ModelName, the one place its words are kept.
func Methods(s *scenario.Scenario) []string {
	return append([]string{"Model: " + sway.ModelName(s) + ", Dormand-Prince 5(4) integration with error control (Dormand & Prince 1980)."},
		otherMethods...)
}

// otherMethods are the methods lines that do not depend on the scenario.
var otherMethods = []string{
	"Drive settings: ZV, ZVD and EI input shapers (Singer & Seering 1990; Singhose, Seering & Singer 1994), each checked by simulation at every rope length.",
	"Fingerprint: SHA-256 (FIPS 180-4) of the scenario's canonical JSON; the QR code holds that JSON, DEFLATE-compressed (RFC 1951), base64url (RFC 4648).",
}

// Input is what a sheet is made of: the scenario and what was computed
// of it. Build renders it and computes nothing; Compute fills it.
type Input struct {
	Scenario *scenario.Scenario
	// Result is the evaluation the sheet shows: of Scenario, or, for a
	// planning request without moves of its own, of Evaluated (the
	// scenario with the recommended move). Nil: ResultErr says why.
	Result *sway.Result
	// Evaluated is the scenario Result is of; nil: Scenario.
	Evaluated *scenario.Scenario
	// ResultFor says what the results are of when that is not the
	// scenario's own moves ("the recommended move (...)").
	ResultFor string
	ResultErr string
	// Ropes are the evaluations at every rope length the scenario names
	// (figures.EvaluateRopes: Ropes[0] is Result, at the nominal); the
	// verdict is the worst over them. Empty: Result alone.
	Ropes []figures.Evaluation
	// Plan is the planner's result for a scenario with a plan block;
	// nil: PlanErr says why.
	Plan    *plan.Result
	PlanErr string
	// Clearance is the clearance check of the scenario's site block (nil:
	// ClearanceErr says why, or it was not run); the sheet prints it.
	Clearance    *clearance.Report
	ClearanceErr string
	// Units are the display units (the page's unit choice, or a system).
	Units units.Choice
	// Version is the tool's version printed on the sheet.
	Version string
	// LinkBase is the page's address; the QR code holds LinkBase +
	// "#z=" + the scenario (see ShareFragment).
	LinkBase string
	// PrintedAt is the time the sheet is made, as text; it also fills
	// the date of the lift when the reference fields leave it empty.
	PrintedAt string
}

// Sheet is a built sheet.
type Sheet struct {
	_           [0]func() // never compared: no equality code in the wasm
	Fingerprint string
	// QRText is the text the QR code carries.
	QRText string
	data   *view
}

// ShareFragment is the URL fragment "z=..." that carries a scenario: its
// canonical JSON (scenario.Canonical), compressed with DEFLATE (RFC 1951,
// no zlib or gzip header) and written in unpadded base64url (RFC 4648
// section 5).
func ShareFragment(canonical []byte) string {
	var buf bytes.Buffer
	zw, _ := flate.NewWriter(&buf, flate.BestCompression)
	zw.Write(canonical)
	zw.Close()
	return "z=" + base64.RawURLEncoding.EncodeToString(buf.Bytes())
}

// ReadShareFragment is the inverse of ShareFragment (with or without the
// leading "#"). It reads at most scenario.MaxFileBytes.
func ReadShareFragment(frag string) ([]byte, error) {
	frag = strings.TrimPrefix(frag, "#")
	b64, ok := strings.CutPrefix(frag, "z=")
	if !ok {
		return nil, fmt.Errorf("the link holds no scenario (no #z= part)")
	}
	raw, err := base64.RawURLEncoding.DecodeString(b64)
	if err != nil {
		return nil, fmt.Errorf("the link's scenario is damaged: %v", err)
	}
	out, err := io.ReadAll(io.LimitReader(flate.NewReader(bytes.NewReader(raw)), scenario.MaxFileBytes+1))
	if err != nil {
		return nil, fmt.Errorf("the link's scenario is damaged: %v", err)
	}
	if len(out) > scenario.MaxFileBytes {
		return nil, fmt.Errorf("the link's scenario is larger than %d bytes", scenario.MaxFileBytes)
	}
	return out, nil
}

type planView struct {
	Err         string
	Axis        string
	Recommended *plan.Option
	// Settings, Summary, Reason, Infeasible, Notes and the recommended
	// option's Outside in the units shown.
	Settings   []string
	Outside    []string
	Summary    string
	Reason     string
	Infeasible []string
	Notes      []string
	// Unmarked: some of the planner's sentences came without their
	// quantities marked and are printed in SI.
	Unmarked bool
	Others   []plan.Option
	Ropes    string
}

type view struct {
	Title       string
	Name        string
	Description string
	Example     bool
	Refs        []Row
	Inputs      []Group
	Figures     []figureRow
	// Verdict is the figures table's verdict of the whole, over every
	// rope length; VerdictState its state (figures.AllWithin, ...);
	// Simulated is false when the scenario moves nothing.
	Verdict      string
	VerdictState string
	// WorstNote says which figures are the worst over the rope lengths.
	WorstNote string
	// DetailFigures are the figures for engineers, as text.
	DetailFigures []string
	Simulated     bool
	Plan          *planView
	Site          *siteView
	AnglePlot     markup
	PathPlot      markup
	PathCaption   string
	Warnings      []string
	Assumptions   []string
	Cautions      []string
	// Methods are the engineering detail's methods lines (Methods).
	Methods     []string
	Version     string
	PrintedAt   string
	Fingerprint string
	QR          markup
	QRNote      string
	EvalErr     string
	ResultsFor  string
	// Dense and Denser set smaller type for a sheet with much to say.
	Dense, Denser, Densest bool
}

// Build renders the sheet of what it is given; it computes nothing.
func Build(in Input) (*Sheet, error) {
	s := in.Scenario
	if s == nil {
		return nil, fmt.Errorf("sheet: no scenario")
	}
	canon, err := scenario.Canonical(s)
	if err != nil {
		return nil, err
	}
	fp, err := scenario.Fingerprint(s)
	if err != nil {
		return nil, err
	}
	u := in.Units
	v := &view{
		Title: "Hook-load sway check sheet", Name: s.Name, Description: s.Description, Example: s.Example,
		Inputs: inputGroups(s, u), Version: in.Version, PrintedAt: in.PrintedAt, Fingerprint: fp,
		Cautions: Cautions, Assumptions: sway.Assumptions, Methods: Methods(s), ResultsFor: in.ResultFor, EvalErr: in.ResultErr,
		Simulated: true,
	}
	if v.Version == "" {
		v.Version = "unknown"
	}
	sh := s.Sheet
	if sh == nil {
		sh = &scenario.Sheet{}
	}
	v.Refs = []Row{
		{Label: "Project", Value: sh.Project}, {Label: "Lift reference", Value: sh.LiftReference},
		{Label: "Crane", Value: sh.Crane}, {Label: "Load", Value: sh.LoadDescription},
		{Label: "Prepared by", Value: sh.PreparedBy}, {Label: "Checked by", Value: sh.CheckedBy},
		{Label: "Date and time of the lift", Value: sh.Date},
	}
	if strings.TrimSpace(sh.Date) == "" && in.PrintedAt != "" {
		v.Refs[len(v.Refs)-1].Value = in.PrintedAt + " (printed)"
	}
	if s.Plan != nil {
		v.Plan = planSection(in.Plan, in.PlanErr, u)
		if v.Plan.Err == "" {
			v.Assumptions = append(append([]string{}, v.Assumptions...), planAssumptions(in.Plan)...)
			v.Cautions = mergeCautions(v.Cautions, plan.Cautions)
		}
	}
	if res := in.Result; res != nil {
		ev := in.Evaluated
		if ev == nil {
			ev = s
		}
		fillResults(v, ev, res, in.Ropes, u)
		if len(res.Assumptions) > 0 {
			// The evaluation's own list (it may say more for a hook block).
			v.Assumptions = append([]string{}, res.Assumptions...)
			if v.Plan != nil && v.Plan.Err == "" {
				v.Assumptions = append(v.Assumptions, planAssumptions(in.Plan)...)
			}
		}
	} else if v.EvalErr == "" {
		v.EvalErr = "no result was given to the sheet"
	}
	v.Site = siteSection(s, in.Clearance, in.ClearanceErr, u)
	switch d := density(v); {
	case d > 72:
		v.Dense, v.Denser, v.Densest = true, true, true
	case d > 62:
		v.Dense, v.Denser = true, true
	case d > 52:
		v.Dense = true
	}
	qrText := in.LinkBase + "#" + ShareFragment(canon)
	code, err := qr.Encode(qrText, qr.M)
	if err != nil {
		code, err = qr.Encode(qrText, qr.L)
	}
	if err != nil {
		v.QRNote = "The scenario is too large for a QR code (" + err.Error() + "); reopen it from the scenario file with the fingerprint below."
		qrText = ""
	} else {
		v.QR = markup(qrSVG(code.Bitmap(4), "QR code holding the scenario"))
		v.QRNote = "Scan to reopen this exact scenario."
	}
	return &Sheet{Fingerprint: fp, QRText: qrText, data: v}, nil
}

// WriteFragment writes the sheet as one <article> element, for a page
// that has sheet.css.
func (sh *Sheet) WriteFragment(w io.Writer) error {
	var h htmlWriter
	h.body(sh.data)
	_, err := io.WriteString(w, h.String())
	return err
}

// WriteDocument writes the sheet as a stand-alone HTML file with its
// style sheet inside; it has no script.
func (sh *Sheet) WriteDocument(w io.Writer) error {
	var h htmlWriter
	h.doc(sh.data)
	_, err := io.WriteString(w, h.String())
	return err
}

// Fragment is WriteFragment into a string.
func (sh *Sheet) Fragment() (string, error) {
	var b strings.Builder
	err := sh.WriteFragment(&b)
	return b.String(), err
}

// mergeCautions adds the planner's cautions that say more than the
// sheet's own (the first of the planner's repeats the sheet's first two).
func mergeCautions(own, more []string) []string {
	out := append([]string{}, own...)
	for _, c := range more {
		if strings.HasPrefix(c, "These settings are an estimate") || strings.HasPrefix(c, "Nobody stands") || strings.HasPrefix(c, "Stop when") {
			continue
		}
		out = append(out, c)
	}
	return out
}

// density is a rough count of the sheet's lines of text beyond the fixed
// parts; above 52 the sheet is set in smaller type, above 62 and 72
// smaller still, to stay on one page.
func density(v *view) int {
	// 4: the verdict band; then the engineering detail.
	n := len(v.Figures) + len(v.Assumptions)*2 + len(v.Cautions)*2 + 4 + len(v.Methods) + 2
	in := 0
	for _, g := range v.Inputs {
		in += len(g.Rows) + 1
	}
	n += in / 2
	for _, w := range v.Warnings {
		n += 1 + len(w)/150
	}
	n += len(v.Description) / 120
	if st := v.Site; st != nil {
		// The plan view sits beside its table: about a dozen lines.
		n += 14 + len(st.Rows) + 2*len(st.Words)
		if st.Section != "" {
			n += 6 // the vertical section under the table
		}
	}
	if p := v.Plan; p != nil {
		n += 9 + len(p.Notes)*2
		n += len(p.Settings)
	}
	return n
}

// planAssumptions are the plan's own assumptions (with a hook block or a
// rigid load they name the mode the planner tuned to), or the planner's
// general ones when no plan was given.
func planAssumptions(p *plan.Result) []string {
	if p != nil && len(p.Assumptions) > 0 {
		return p.Assumptions
	}
	return plan.Assumptions
}
