package bridge

import (
	"bytes"
	_ "embed"
	"encoding/json"
	"fmt"
	"path"
	"strings"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/version"
)

// versionCall gives the tool's version (core/version), shown on the page.
func versionCall(*Env, []byte) (any, error) {
	return map[string]string{"version": version.Version, "format": scenario.FormatName,
		"format_version": fmt.Sprint(scenario.Version)}, nil
}

// UnitTable is the reply of the "units" call: the core/units table, the
// standard gravity, and the two unit systems.
type UnitTable struct {
	Quantities      map[string]units.Quantity `json:"quantities"`
	StandardGravity float64                   `json:"standard_gravity_m_per_s2"`
	Systems         []string                  `json:"systems"`
}

func unitTable(*Env, []byte) (any, error) {
	return UnitTable{Quantities: units.Table, StandardGravity: units.StandardGravity,
		Systems: []string{"si", "us"}}, nil
}

// FieldRange is one accepted range from scenario.Ranges, with the quantity
// of core/units whose SI unit it is given in ("" when none).
type FieldRange struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Min     float64 `json:"min"`
	Max     float64 `json:"max"`
	Unit    string  `json:"unit"`
	OpenMin bool    `json:"open_min"`
	// MinAbs, when above 0, is the smallest size of a value other than 0.
	MinAbs   float64 `json:"min_abs,omitempty"`
	Text     string  `json:"text"`
	Quantity string  `json:"quantity"`
}

func ranges(*Env, []byte) (any, error) {
	return fieldRanges(scenario.Ranges), nil
}

// fieldRanges gives accepted ranges by key with their quantities.
func fieldRanges(rs map[string]scenario.Range) map[string]FieldRange {
	out := make(map[string]FieldRange, len(rs))
	for k, r := range rs {
		out[k] = FieldRange{Min: r.Min, Max: r.Max, Unit: r.Unit, OpenMin: r.OpenMin, MinAbs: r.MinAbs,
			Text: r.Text(), Quantity: units.QuantityOf(r.Unit)}
	}
	return out
}

// embeddedJSON holds the example scenarios for pages without an origin
// (make examples writes it from testdata/scenarios): a list of
// {"file": name, "scenario": the file's text}. One file rather than an
// embed.FS of the copies: the FS hands out its files through fs
// interfaces, and through them the linker keeps fs's and time's
// formatting, about 45 KB gzipped of the wasm.
//
//go:embed examples.json
var embeddedJSON []byte

// embeddedFile is one entry of embeddedJSON.
type embeddedFile struct {
	File     string          `json:"file"`
	Scenario json.RawMessage `json:"scenario"`
}

// Example is one scenario of the example library.
type Example struct {
	File        string          `json:"file"`
	Name        string          `json:"name"`
	Description string          `json:"description"`
	Scenario    json.RawMessage `json:"scenario"`
}

// Examples is the reply of the "examples" call.
type Examples struct {
	// Source is "origin" when the files came from the page's own origin,
	// "embedded" when the copies built into the wasm were used.
	Source string `json:"source"`
	// Note says why the embedded copies were used.
	Note     string    `json:"note,omitempty"`
	Demo     string    `json:"demo"`
	Examples []Example `json:"examples"`
}

// DemoFile is the example loaded when the page opens for the first time.
const DemoFile = "bay-travel.json"

// ExamplesBase is where the page's origin serves the example files,
// relative to the page; index.json lists the file names.
const ExamplesBase = "examples/"

type examplesInput struct {
	// Base overrides ExamplesBase (a URL ending in "/").
	Base string `json:"base"`
}

func examples(env *Env, input []byte) (any, error) {
	var in examplesInput
	if len(input) > 0 {
		if err := json.Unmarshal(input, &in); err != nil {
			return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"base\": URL}: " + err.Error()}}
		}
	}
	base := in.Base
	if base == "" {
		base = ExamplesBase
	}
	if env.Fetch != nil {
		list, err := fetchExamples(env.Fetch, base)
		if err == nil {
			return &Examples{Source: "origin", Demo: DemoFile, Examples: list}, nil
		}
		ex, _ := embeddedExamples()
		ex.Note = "the example files could not be read from the page's origin (" + err.Error() + "); the copies built into the tool are shown"
		return ex, nil
	}
	return embeddedExamples()
}

func fetchExamples(fetch func(string) ([]byte, error), base string) ([]Example, error) {
	idx, err := fetch(base + "index.json")
	if err != nil {
		return nil, err
	}
	var files []string
	if err := json.Unmarshal(idx, &files); err != nil {
		return nil, fmt.Errorf("%sindex.json is not a list of file names: %v", base, err)
	}
	// The files are read all at once (one read waits for the server, not
	// for the reads before it: the page's first result waits for this
	// list), then taken in the index's order, so the list and the first
	// problem reported are those of reading them one by one.
	named := len(files)
	for i, f := range files {
		if f != path.Base(f) || !strings.HasSuffix(f, ".json") {
			named = i
			break
		}
	}
	type read struct {
		data []byte
		err  error
	}
	reads := make([]chan read, named)
	for i := range reads {
		reads[i] = make(chan read, 1)
		go func(url string, ch chan<- read) {
			data, err := fetch(url)
			ch <- read{data, err}
		}(base+files[i], reads[i])
	}
	var out []Example
	for i, f := range files {
		if i == named {
			return nil, fmt.Errorf("%sindex.json names %q, not a .json file beside it", base, f)
		}
		r := <-reads[i]
		if r.err != nil {
			return nil, r.err
		}
		ex, err := example(f, r.data)
		if err != nil {
			return nil, err
		}
		out = append(out, ex)
	}
	if len(out) == 0 {
		return nil, fmt.Errorf("%sindex.json lists no examples", base)
	}
	return out, nil
}

func embeddedExamples() (*Examples, error) {
	var files []embeddedFile
	if err := json.Unmarshal(embeddedJSON, &files); err != nil {
		return nil, err
	}
	out := &Examples{Source: "embedded", Demo: DemoFile}
	for _, f := range files {
		ex, err := example(f.File, f.Scenario)
		if err != nil {
			return nil, err
		}
		out.Examples = append(out.Examples, ex)
	}
	return out, nil
}

func example(file string, data []byte) (Example, error) {
	s, err := scenario.Parse(data)
	if err != nil {
		return Example{}, fmt.Errorf("example %s: %v", file, err)
	}
	var compact bytes.Buffer
	if err := json.Compact(&compact, data); err != nil {
		return Example{}, err
	}
	return Example{File: file, Name: s.Name, Description: s.Description, Scenario: json.RawMessage(compact.Bytes())}, nil
}
