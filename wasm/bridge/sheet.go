package bridge

import (
	"encoding/json"

	"swaysheet/core/scenario"
	"swaysheet/web/sheet"
)

func init() {
	Calls["sheet"] = sheetCall
	Calls["unshare"] = unshare
}

// SheetInput is the input of the "sheet" call.
type SheetInput struct {
	Scenario json.RawMessage `json:"scenario"`
	// Units are the page's display units by quantity; System the unit
	// system for quantities not listed ("si" or "us").
	Units  map[string]string `json:"units"`
	System string            `json:"system"`
	// LinkBase is the page's address without its fragment; the QR code
	// links to it with the scenario in the fragment.
	LinkBase  string `json:"link_base"`
	PrintedAt string `json:"printed_at"`
}

// SheetReply is the result of the "sheet" call: the sheet as one
// <article> element (html/template output: the user's text in it is
// escaped), the scenario's fingerprint and the text of the QR code.
type SheetReply struct {
	HTML        string `json:"html"`
	Fingerprint string `json:"fingerprint"`
	QRText      string `json:"qr_text"`
}

// sheetCall builds the check sheet with web/sheet, the renderer the
// command line uses, so the page's print and swaysheet -sheet agree.
func sheetCall(_ *Env, input []byte) (any, error) {
	var in SheetInput
	if err := json.Unmarshal(input, &in); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"scenario\": {...}, \"units\": {...}}: " + err.Error()}}
	}
	s, err := scenario.Parse(in.Scenario)
	if err != nil {
		return nil, err
	}
	sh, err := sheet.Build(sheet.Input{Scenario: s, Units: in.Units, System: in.System,
		Version: Version, LinkBase: in.LinkBase, PrintedAt: in.PrintedAt})
	if err != nil {
		return nil, err
	}
	html, err := sh.Fragment()
	if err != nil {
		return nil, err
	}
	return SheetReply{HTML: html, Fingerprint: sh.Fingerprint, QRText: sh.QRText}, nil
}

// unshare reads the scenario of a link's "#z=" fragment (the QR code's
// and the compact share link's) and returns it as scenario JSON.
func unshare(_ *Env, input []byte) (any, error) {
	raw, err := sheet.ReadShareFragment(string(input))
	if err != nil {
		return nil, scenario.Errors{{Field: "(link)", Message: err.Error()}}
	}
	if _, err := scenario.Parse(raw); err != nil {
		return nil, err
	}
	return json.RawMessage(raw), nil
}
