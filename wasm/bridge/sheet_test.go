package bridge

import (
	"encoding/json"
	"os"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

func TestSheetCallAndUnshare(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/bay-travel.json")
	if err != nil {
		t.Fatal(err)
	}
	in, _ := json.Marshal(map[string]any{"scenario": json.RawMessage(data), "system": "us",
		"link_base": "http://127.0.0.1/", "units": map[string]string{"length": "ft"}})
	var r struct {
		Result SheetReply `json:"result"`
		Error  *Error     `json:"error"`
	}
	if err := json.Unmarshal(Call(nil, "sheet", in), &r); err != nil || r.Error != nil {
		t.Fatalf("sheet: %v %+v", err, r.Error)
	}
	if !strings.HasPrefix(r.Result.HTML, "<article") || !strings.Contains(r.Result.HTML, r.Result.Fingerprint) {
		t.Fatal("the reply is not the sheet")
	}
	frag := r.Result.QRText[strings.Index(r.Result.QRText, "#"):]
	var u struct {
		Result json.RawMessage `json:"result"`
		Error  *Error          `json:"error"`
	}
	if err := json.Unmarshal(Call(nil, "unshare", []byte(frag)), &u); err != nil || u.Error != nil {
		t.Fatalf("unshare: %v %+v", err, u.Error)
	}
	s, err := scenario.Parse(u.Result)
	if err != nil {
		t.Fatal(err)
	}
	if fp, _ := scenario.Fingerprint(s); fp != r.Result.Fingerprint {
		t.Fatal("the link reopens another scenario")
	}
	// Bad input is an error reply, never a crash.
	for _, bad := range []string{"", "{", `{"scenario": 3}`, `{"scenario": {"format": "x"}}`} {
		var e struct{ Error *Error }
		json.Unmarshal(Call(nil, "sheet", []byte(bad)), &e)
		if e.Error == nil {
			t.Errorf("sheet(%q): no error", bad)
		}
	}
	var e struct{ Error *Error }
	json.Unmarshal(Call(nil, "unshare", []byte("#z=garbage!")), &e)
	if e.Error == nil {
		t.Error("unshare of garbage: no error")
	}
}
