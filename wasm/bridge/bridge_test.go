package bridge

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"

	"swaysheet/core/units"
)

type errReply struct {
	Error *struct {
		Message string `json:"message"`
		Fields  []struct {
			Field   string `json:"field"`
			Message string `json:"message"`
		} `json:"fields"`
	} `json:"error"`
}

func readExample(t *testing.T, name string) []byte {
	t.Helper()
	b, err := os.ReadFile(filepath.Join("..", "..", "testdata", "scenarios", name))
	if err != nil {
		t.Fatal(err)
	}
	return b
}

func TestEvaluateDemoPeriod(t *testing.T) {
	out := Call(nil, "evaluate", readExample(t, DemoFile))
	var r struct {
		Result struct {
			PeriodS      float64 `json:"period_s"`
			PeakSwingDeg float64 `json:"peak_swing_deg"`
			History      struct {
				TimeS []float64 `json:"time_s"`
			} `json:"history"`
		} `json:"result"`
	}
	if err := json.Unmarshal(out, &r); err != nil {
		t.Fatal(err, string(out[:min(len(out), 300)]))
	}
	// Small-amplitude period T = 2*pi*sqrt(L/g) (any mechanics text),
	// for the demo's rope of 8.5 m.
	want := 2 * math.Pi * math.Sqrt(8.5/units.StandardGravity)
	if math.Abs(r.Result.PeriodS-want) > 1e-12 {
		t.Errorf("period %v, want %v", r.Result.PeriodS, want)
	}
	if r.Result.PeakSwingDeg <= 0 || len(r.Result.History.TimeS) == 0 {
		t.Errorf("no swing or no history: %+v", r.Result.PeakSwingDeg)
	}
}

func TestFieldErrors(t *testing.T) {
	in := bytes.Replace(readExample(t, DemoFile), []byte(`"rope_length_m": 8.5`), []byte(`"rope_length_m": -2`), 1)
	var r errReply
	if err := json.Unmarshal(Call(nil, "evaluate", in), &r); err != nil {
		t.Fatal(err)
	}
	if r.Error == nil || len(r.Error.Fields) != 1 || r.Error.Fields[0].Field != "load.rope_length_m" {
		t.Fatalf("want one error at load.rope_length_m, got %+v", r.Error)
	}
	if !strings.Contains(r.Error.Fields[0].Message, "accepted") {
		t.Errorf("message does not give the accepted range: %q", r.Error.Fields[0].Message)
	}
	for _, bad := range []string{"", "{", "[]", "null", `{"format":"x"}`} {
		if err := json.Unmarshal(Call(nil, "evaluate", []byte(bad)), &r); err != nil || r.Error == nil || r.Error.Message == "" {
			t.Errorf("input %q: want an error reply, got %+v (%v)", bad, r.Error, err)
		}
	}
}

func TestPanicBecomesError(t *testing.T) {
	Calls["boom"] = func(*Env, []byte) (any, error) { panic("test panic") }
	defer delete(Calls, "boom")
	var r errReply
	if err := json.Unmarshal(Call(nil, "boom", nil), &r); err != nil {
		t.Fatal(err)
	}
	if r.Error == nil || !strings.Contains(r.Error.Message, "test panic") || r.Error.Fields == nil {
		t.Fatalf("got %+v", r.Error)
	}
	if err := json.Unmarshal(Call(nil, "no-such-call", nil), &r); err != nil || r.Error == nil {
		t.Fatalf("unknown call: %+v", r.Error)
	}
	Calls["nan"] = func(*Env, []byte) (any, error) { return math.NaN(), nil }
	defer delete(Calls, "nan")
	if err := json.Unmarshal(Call(nil, "nan", nil), &r); err != nil || r.Error == nil {
		t.Fatalf("NaN result: %+v", r.Error)
	}
}

func TestUnitsAndRanges(t *testing.T) {
	var u struct {
		Result UnitTable `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "units", nil), &u); err != nil {
		t.Fatal(err)
	}
	// ft = 0.3048 m exactly (NIST SP 811, appendix B).
	if ft := u.Result.Quantities["length"].Units[1]; ft.Symbol != "ft" || ft.ToSI != 0.3048 {
		t.Errorf("foot: %+v", ft)
	}
	var r struct {
		Result map[string]FieldRange `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "ranges", nil), &r); err != nil {
		t.Fatal(err)
	}
	want := map[string]string{
		"load.rope_length_m": "length", "load.mass_kg": "mass", "motions[].speed_m_per_s": "speed",
		"motions[].accel_m_per_s2": "acceleration", "motions[].rate_deg_per_s": "angular_speed",
		"wind.force_n": "force", "limits.peak_swing_deg": "angle", "limits.tension_factor": "ratio",
		"settings.samples": "",
	}
	for k, q := range want {
		if got := r.Result[k].Quantity; got != q {
			t.Errorf("%s: quantity %q, want %q", k, got, q)
		}
	}
	if r.Result["load.rope_length_m"].Text == "" {
		t.Error("no range text")
	}
}

func TestEmbeddedExamplesMatchTestdata(t *testing.T) {
	files, _ := filepath.Glob(filepath.Join("..", "..", "testdata", "scenarios", "*.json"))
	var got []embeddedFile
	if err := json.Unmarshal(embeddedJSON, &got); err != nil {
		t.Fatalf("examples.json: %v: run make examples", err)
	}
	if len(files) == 0 || len(files) != len(got) {
		t.Fatalf("testdata has %d scenarios, examples.json %d: run make examples", len(files), len(got))
	}
	for i, f := range files {
		want, _ := os.ReadFile(f)
		if got[i].File != filepath.Base(f) || !bytes.Equal(got[i].Scenario, bytes.TrimSpace(want)) {
			t.Errorf("%s: examples.json's copy (%s) differs from testdata/scenarios: run make examples", filepath.Base(f), got[i].File)
		}
	}
}

func TestExamplesFetchAndFallback(t *testing.T) {
	dir := filepath.Join("..", "..", "testdata", "scenarios")
	var asked []string
	var mu sync.Mutex // the examples are read at once, from several goroutines
	fromDisk := func(url string) ([]byte, error) {
		mu.Lock()
		asked = append(asked, url)
		mu.Unlock()
		name, ok := strings.CutPrefix(url, ExamplesBase)
		if !ok {
			return nil, errors.New("outside the examples folder")
		}
		if name == "index.json" {
			files, _ := filepath.Glob(filepath.Join(dir, "*.json"))
			var names []string
			for _, f := range files {
				names = append(names, filepath.Base(f))
			}
			return json.Marshal(names)
		}
		return os.ReadFile(filepath.Join(dir, name))
	}
	var r struct {
		Result Examples `json:"result"`
	}
	if err := json.Unmarshal(Call(&Env{Fetch: fromDisk}, "examples", nil), &r); err != nil {
		t.Fatal(err)
	}
	if r.Result.Source != "origin" || len(r.Result.Examples) < 2 || asked[0] != "examples/index.json" {
		t.Fatalf("fetch: source %q, %d examples, asked %v", r.Result.Source, len(r.Result.Examples), asked)
	}
	found := false
	for _, e := range r.Result.Examples {
		found = found || e.File == r.Result.Demo
		if e.Name == "" || len(e.Scenario) == 0 {
			t.Errorf("%s: no name or scenario", e.File)
		}
	}
	if !found {
		t.Errorf("demo %s not in the list", r.Result.Demo)
	}
	failing := func(string) ([]byte, error) { return nil, errors.New("offline") }
	r.Result = Examples{}
	if err := json.Unmarshal(Call(&Env{Fetch: failing}, "examples", nil), &r); err != nil {
		t.Fatal(err)
	}
	if r.Result.Source != "embedded" || !strings.Contains(r.Result.Note, "offline") || len(r.Result.Examples) < 2 {
		t.Fatalf("fallback: %+v", r.Result.Source)
	}
}

func TestPlanCall(t *testing.T) {
	in := readExample(t, "plan-bay-travel.json")
	var r struct {
		Result *struct {
			Options []struct {
				Key      string `json:"key"`
				Within   bool   `json:"within"`
				Verified []struct {
					RopeLengthM float64 `json:"rope_length_m"`
				} `json:"verified"`
				Motion map[string]any `json:"motion"`
			} `json:"options"`
			Recommended int    `json:"recommended"`
			Reason      string `json:"reason"`
			Curves      struct {
				AccelTime struct {
					RampS []float64 `json:"ramp_s"`
				} `json:"accel_time"`
			} `json:"curves"`
		} `json:"result"`
	}
	if err := json.Unmarshal(Call(nil, "plan", in), &r); err != nil || r.Result == nil {
		t.Fatalf("plan: %v", err)
	}
	p := r.Result
	if p.Recommended < 0 || p.Recommended >= len(p.Options) || !p.Options[p.Recommended].Within || p.Reason == "" {
		t.Fatalf("recommended %d of %d options, reason %q", p.Recommended, len(p.Options), p.Reason)
	}
	// The plan simulates the nominal rope, both ends of the range (8.5, 8, 9 m in the file)
	// and two lengths between them.
	if n := len(p.Options[0].Verified); n != 5 || p.Options[0].Motion["axis"] != "travel_x" || len(p.Curves.AccelTime.RampS) == 0 {
		t.Errorf("first option: %d verified lengths, motion %v", n, p.Options[0].Motion)
	}
	// A bad plan field is named.
	bad := bytes.Replace(in, []byte(`"distance_m": 18`), []byte(`"distance_m": 5000`), 1)
	var e errReply
	if err := json.Unmarshal(Call(nil, "plan", bad), &e); err != nil || e.Error == nil || len(e.Error.Fields) == 0 || e.Error.Fields[0].Field != "plan.distance_m" {
		t.Fatalf("bad distance: %+v", e.Error)
	}
	// A scenario without a plan block gets a message, not a panic.
	if err := json.Unmarshal(Call(nil, "plan", readExample(t, DemoFile)), &e); err != nil || e.Error == nil || e.Error.Fields[0].Field != "plan" {
		t.Fatalf("no plan block: %+v", e.Error)
	}
}
