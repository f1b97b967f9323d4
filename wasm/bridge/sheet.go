package bridge

import (
	"encoding/json"
	"errors"

	"swaysheet/core/clearance"
	"swaysheet/core/plan"
	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
	"swaysheet/core/sway"
	"swaysheet/core/version"
)

func init() {
	Calls["sheet"] = sheetCall
	Calls["unshare"] = unshare
}

// SheetInput is the input of the "sheet" call: the scenario and its
// display units (as for "figures"), the page's address and the time.
type SheetInput struct {
	ShownInput
	// LinkBase is the page's address without its fragment; the QR code
	// links to it with the scenario in the fragment.
	LinkBase  string `json:"link_base"`
	PrintedAt string `json:"printed_at"`
}

// SheetReply is the result of the "sheet" call: the sheet as one
// <article> element (the user's text in it escaped), the scenario's
// fingerprint and the text of the QR code.
type SheetReply struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	HTML        string `json:"html"`
	Fingerprint string `json:"fingerprint"`
	QRText      string `json:"qr_text"`
	// ResultFingerprint is the fingerprint of the scenario whose results
	// the sheet prints (the figures call's result_fingerprint): the
	// scenario's own, or its recommended move's.
	ResultFingerprint string `json:"result_fingerprint"`
}

// sheetCall renders the check sheet with core/sheet, the renderer the
// command line uses, so the page's print and swaysheet -sheet agree.
func sheetCall(_ *Env, input []byte) (any, error) {
	var in SheetInput
	s, err := in.read(input, &in)
	if err != nil {
		return nil, err
	}
	// Through the memo of the last results and plan: after the page's
	// evaluate and plan calls of the same scenario the sheet computes
	// nothing. Only the parsed scenario is known to be valid.
	memo := sheet.Computer{Plan: func(x *scenario.Scenario) (*plan.Result, error) {
		return planned(x, x == s)
	}, Evaluate: func(x *scenario.Scenario) (*sway.Result, error) {
		return evaluated(x, x == s)
	}, Clearance: func(x *scenario.Scenario) (*clearance.Report, error) {
		// The page's last check of these inputs: printing never runs it.
		if rep := keptClearance(x); rep != nil {
			return rep, nil
		}
		return nil, errors.New("the clearance check of these inputs is still running or was stopped; print again when the page shows its result")
	}}
	si := memo.Compute(s)
	si.Units, si.Version, si.LinkBase, si.PrintedAt = in.choice(), version.Version, in.LinkBase, in.PrintedAt
	sh, err := sheet.Build(si)
	if err != nil {
		return nil, err
	}
	html, err := sh.Fragment()
	if err != nil {
		return nil, err
	}
	rfp, err := scenario.Fingerprint(si.Evaluated)
	if err != nil {
		return nil, err
	}
	return SheetReply{HTML: html, Fingerprint: sh.Fingerprint, QRText: sh.QRText, ResultFingerprint: rfp}, nil
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
