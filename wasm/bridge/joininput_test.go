package bridge

import (
	"strings"
	"testing"
)

func TestJoinInputBadRequests(t *testing.T) {
	// The join's own reader answers every malformed request with a field
	// error at "(input)", never a panic or a loop without end.
	for _, in := range []string{
		``, `{`, `[]`, `{"scenario":`, `{"scenario":{}}`, `{"parts":[]}`,
		`{"scenario":{"a":"}"},"parts":[{"data":"AAAA"`, `{"scenario":{},"parts":[{"data":"@@@"}]}`,
		`{"scenario":{},"parts":[{"from":"x"}]}`, `{"scenario":{},"parts":[]} x`,
		`{"scenario":{},"parts":[{"data":"a\"b"}]}`, `{"scenario":"\\"}`,
	} {
		_, _, err := readJoinInput([]byte(in))
		if err == nil {
			t.Errorf("%q: read without an error", in)
		}
		out := string(Call(&Env{}, "clearance_join", []byte(in)))
		if !strings.Contains(out, `"error"`) {
			t.Errorf("%q: %s", in, out)
		}
	}
	// Keys in any order, spaces, other keys skipped.
	sc, parts, err := readJoinInput([]byte(` { "other" : [1, {"x": "]}"}], "parts" : [ {"to": 5, "data": "c3dwMQA=", "from": 0} ] , "scenario" : {"name": "a\"}"} } `))
	if err != nil || string(sc) != `{"name": "a\"}"}` || len(parts) != 1 || parts[0].To != 5 || string(parts[0].Data) != "swp1\x00" {
		t.Errorf("read %q, %+v, %v", sc, parts, err)
	}
}
