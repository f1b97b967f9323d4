package bridge

import (
	"encoding/json"
	"fmt"
	"io"
	"net/http"
	"net/http/httptest"
	"os"
	"strings"
	"testing"
)

// httpFetch reads from a test server on the loopback interface, as the
// page's fetch reads from its own origin.
func httpFetch(base string) func(string) ([]byte, error) {
	return func(u string) ([]byte, error) {
		resp, err := http.Get(base + u)
		if err != nil {
			return nil, err
		}
		defer resp.Body.Close()
		if resp.StatusCode != http.StatusOK {
			return nil, fmt.Errorf("%s: %s", u, resp.Status)
		}
		return io.ReadAll(io.LimitReader(resp.Body, 1<<20))
	}
}

func TestSiteLibrary(t *testing.T) {
	good, err := os.ReadFile("../../testdata/scenarios/bay-travel.json")
	if err != nil {
		t.Fatal(err)
	}
	files := map[string]string{
		"/library/index.json":     `["bay-3.json", "broken.json", "missing.json", "../secret.json"]`,
		"/library/bay-3.json":     string(good),
		"/library/broken.json":    `{"format": "swaysheet-scenario", "version": 1, "load": {}}`,
		"/elsewhere/index.json":   `{"not": "a list"}`,
		"/named/index.json":       `[{"file": "bay-3.json", "name": "Bay 3: girder to the welding line", "description": "Lift plan LP-12, typed by the site office."}, "other.json"]`,
		"/named/bay-3.json":       string(good),
		"/named/other.json":       string(good),
		"/badentry/index.json":    `[{"file": "bay-3.json", "colour": "red"}]`,
		"/library/../secret.json": `{}`,
	}
	srv := httptest.NewServer(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		body, ok := files[r.URL.Path]
		if !ok {
			http.NotFound(w, r)
			return
		}
		w.Write([]byte(body))
	}))
	defer srv.Close()
	if !strings.HasPrefix(srv.URL, "http://127.0.0.1:") {
		t.Fatalf("the test server is not on the loopback interface: %s", srv.URL)
	}
	env := &Env{LibraryFetch: httpFetch(srv.URL + "/")}
	var r struct {
		Result *Library
		Error  *Error
	}
	if err := json.Unmarshal(Call(env, "library", nil), &r); err != nil || r.Error != nil {
		t.Fatalf("library: %v %+v", err, r.Error)
	}
	if len(r.Result.Files) != 1 || r.Result.Files[0].File != "bay-3.json" || r.Result.Files[0].Name == "" {
		t.Errorf("files %+v", r.Result.Files)
	}
	if len(r.Result.Problems) != 3 || !strings.Contains(strings.Join(r.Result.Problems, "\n"), "../secret.json") {
		t.Errorf("problems %q", r.Result.Problems)
	}
	var one struct {
		Result *Example
		Error  *Error
	}
	json.Unmarshal(Call(env, "library_file", []byte(`{"file": "bay-3.json"}`)), &one)
	if one.Error != nil || one.Result == nil || len(one.Result.Scenario) == 0 {
		t.Fatalf("library_file: %+v", one.Error)
	}
	for in, want := range map[string]string{
		`{"file": "../secret.json"}`: "not a .json file name",
		`{"file": "missing.json"}`:   "could not be read",
		`{"file": "broken.json"}`:    "load.mass_kg",
		`{"base": "elsewhere/"}`:     "not a list of files",
		`{"base": "badentry/"}`:      "entry 1",
		`{"base": "nowhere/"}`:       "no site library here",
		`not json`:                   "expected",
	} {
		name := "library_file"
		if strings.Contains(in, "base") || in == "not json" {
			name = "library"
		}
		var e struct{ Error *Error }
		json.Unmarshal(Call(env, name, []byte(in)), &e)
		if e.Error == nil || !strings.Contains(e.Error.Message, want) {
			t.Errorf("%s %s: %+v, want %q", name, in, e.Error, want)
		}
	}
	// An index of objects names and describes the files it lists; a
	// file name alone lists the file by its own name.
	r.Result = nil
	if json.Unmarshal(Call(env, "library", []byte(`{"base": "named/"}`)), &r); r.Error != nil || len(r.Result.Files) != 2 {
		t.Fatalf("named index: %+v %+v", r.Error, r.Result)
	}
	if f := r.Result.Files; f[0].Name != "Bay 3: girder to the welding line" || f[0].Description != "Lift plan LP-12, typed by the site office." || f[1].Name == f[0].Name || f[1].Name == "" {
		t.Errorf("named index: %+v", f)
	}
	// A page opened from a file has no server: said, not a crash.
	var e struct{ Error *Error }
	json.Unmarshal(Call(&Env{}, "library", nil), &e)
	if e.Error == nil || !strings.Contains(e.Error.Message, "opened from a file") {
		t.Errorf("no server: %+v", e.Error)
	}
}

// The "say" call formats marked sentences in the units shown.
func TestSay(t *testing.T) {
	var r struct {
		Result struct{ Texts []string }
		Error  *Error
	}
	in := `{"sentences": [{"text": "rope {0}, pull {1}", "quantities": [{"value": 8.5, "quantity": "length"}, {"value": 70000, "quantity": "force"}]}], "system": "us"}`
	json.Unmarshal(Call(nil, "say", []byte(in)), &r)
	// 8.5 m = 27.887 ft (to 0.05 ft); 70 kN = 15737 lbf (to 10 lbf); NIST SP 811 factors.
	if r.Error != nil || len(r.Result.Texts) != 1 || r.Result.Texts[0] != "rope 27.90 ft, pull 15740 lbf" {
		t.Errorf("say: %+v %q", r.Error, r.Result.Texts)
	}
	var e struct{ Error *Error }
	if json.Unmarshal(Call(nil, "say", []byte("nope")), &e); e.Error == nil {
		t.Error("bad input accepted")
	}
}

// After the plan call, the figures of a planning request without moves
// are those of the recommended drive setting, over the plan's rope
// lengths; before it, nothing was simulated.
func TestFiguresOfThePlannedMove(t *testing.T) {
	data, err := os.ReadFile("../../testdata/scenarios/plan-bay-travel.json")
	if err != nil {
		t.Fatal(err)
	}
	in, _ := json.Marshal(map[string]any{"scenario": json.RawMessage(data), "system": "us"})
	var r struct {
		Result struct {
			Verdict struct {
				State        string    `json:"state"`
				RopeLengthsM []float64 `json:"rope_lengths_m"`
			} `json:"verdict"`
			ResultFor string `json:"result_for"`
		}
		Error *Error
	}
	last = memo{}
	json.Unmarshal(Call(nil, "figures", in), &r)
	if r.Error != nil || r.Result.Verdict.State != "not_simulated" {
		t.Fatalf("before the plan: %+v %+v", r.Error, r.Result)
	}
	Call(nil, "plan", data)
	json.Unmarshal(Call(nil, "figures", in), &r)
	if r.Error != nil || r.Result.Verdict.State == "not_simulated" || r.Result.ResultFor == "" || len(r.Result.Verdict.RopeLengthsM) != 3 {
		t.Errorf("after the plan: %+v %+v", r.Error, r.Result)
	}
}
