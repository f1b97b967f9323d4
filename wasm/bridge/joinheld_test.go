package bridge

import (
	"encoding/json"
	"fmt"
	"os"
	"strings"
	"testing"
)

// TestJoinHeldParts: a join names parts held by their runs; what is held
// is the latest check's alone, and a part named but not held (another
// scenario or seed since, the engine restarted, the check done) is an
// error at its data with "resend", never another check's runs joined.
func TestJoinHeldParts(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/site-bay-columns.json")
	if err != nil {
		t.Fatal(err)
	}
	sc := strings.Replace(string(data), `"runs": 200`, `"runs": 12`, 1)
	other := strings.Replace(sc, `"seed": 1`, `"seed": 2`, 1)
	if other == sc {
		t.Fatal("the example has no seed 1 to change")
	}
	part := func(sc string, from, to int) string {
		out, err := Calls["clearance_part"](nil, []byte(fmt.Sprintf(`{"scenario":%s,"from":%d,"to":%d}`, sc, from, to)))
		if err != nil {
			t.Fatal(err)
		}
		b, _ := json.Marshal(out)
		return string(b)
	}
	a, b := part(sc, 0, 5), part(sc, 5, 12)
	call := func(name, sc string, parts ...string) map[string]any {
		var r map[string]any
		out := Call(&Env{}, name, []byte(`{"scenario":`+sc+`,"parts":[`+strings.Join(parts, ",")+`]}`))
		if err := json.Unmarshal(out, &r); err != nil {
			t.Fatal(err)
		}
		return r
	}
	resend := func(what string, r map[string]any, field string) {
		t.Helper()
		e, _ := r["error"].(map[string]any)
		fs, _ := e["fields"].([]any)
		if e == nil || e["resend"] != true || len(fs) != 1 || fs[0].(map[string]any)["field"] != field {
			t.Errorf("%s: %v", what, r)
		}
	}
	if r := call("clearance_hold", sc, a); r["result"].(map[string]any)["runs"] != 5.0 {
		t.Errorf("hold: %v", r)
	}
	if r := call("clearance_join", sc, `{"from":0,"to":5}`); r["result"].(map[string]any)["runs"] != 5.0 {
		t.Errorf("join of the part held: %v", r)
	}
	resend("a part never sent", call("clearance_join", sc, `{"from":0,"to":5}`, `{"from":5,"to":12}`), "parts[1].data")
	// Another seed: what was held is dropped, never joined with its runs.
	call("clearance_hold", other, part(other, 5, 12))
	resend("another seed's check held", call("clearance_join", sc, `{"from":0,"to":5}`, b), "parts[0].data")
	// Every run joined: the report is kept and the parts dropped.
	if r := call("clearance_join", sc, a, `{"from":5,"to":12}`); r["error"] != nil || r["result"].(map[string]any)["runs"] != 12.0 {
		t.Errorf("join of every run: %v", r)
	}
	resend("the check done", call("clearance_join", sc, `{"from":0,"to":5}`), "parts[0].data")
	// Bad parts: a clear message, nothing held.
	for _, bad := range []string{`{"from":0,"to":6,"data":` + a[strings.Index(a, `"data":`)+7:], `{"from":0,"to":5,"data":""}`, `{"from":0,"to":5,"data":"c3dwMgA="}`} {
		r := call("clearance_hold", sc, bad)
		if e, _ := r["error"].(map[string]any); e == nil || e["resend"] != nil || !strings.Contains(e["message"].(string), "parts[0]") {
			t.Errorf("%.40s: %v", bad, r)
		}
	}
}
