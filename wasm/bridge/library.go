package bridge

import (
	"encoding/json"
	"fmt"
	"path"
	"strings"

	"swaysheet/core/scenario"
)

func init() {
	Calls["library"] = library
	Calls["library_file"] = libraryFile
}

// LibraryBase is where a site office puts its scenario files, relative to
// the page: library/index.json lists them (a JSON list of file names, each
// a .json file in the same folder, as examples/index.json does; or of
// objects {"file", "name", "description"} to list them by).
const LibraryBase = "library/"

// Library is the reply of the "library" call: the scenarios the site
// office published beside the page. A file that cannot be read or is not
// a valid scenario is left out and said in Problems; the others are
// listed.
type Library struct {
	Files    []Example `json:"files"`
	Problems []string  `json:"problems"`
}

type libraryInput struct {
	_ [0]func() // never compared: no equality code in the wasm
	// Base overrides LibraryBase (a URL ending in "/").
	Base string `json:"base"`
	// File names one file of the library ("library_file").
	File string `json:"file"`
}

func readLibraryInput(input []byte) (libraryInput, error) {
	var in libraryInput
	if len(input) > 0 {
		if err := json.Unmarshal(input, &in); err != nil {
			return in, scenario.Errors{{Field: "(input)", Message: "expected {\"base\": URL, \"file\": NAME}: " + err.Error()}}
		}
	}
	if in.Base == "" {
		in.Base = LibraryBase
	}
	return in, nil
}

// errNoServer: the page was opened from a file, with no server to read
// the library from.
var errNoServer = scenario.Errors{{Field: "(library)", Message: "the site library is read from the server the page came from; this page was opened from a file and has none"}}

// library lists the site library: library/index.json and every scenario
// it names, each with its name and description.
func library(env *Env, input []byte) (any, error) {
	in, err := readLibraryInput(input)
	if err != nil {
		return nil, err
	}
	if env.LibraryFetch == nil {
		return nil, errNoServer
	}
	idx, err := env.LibraryFetch(in.Base + "index.json")
	if err != nil {
		return nil, scenario.Errors{{Field: "(library)", Message: "no site library here: " + in.Base + "index.json could not be read (" + err.Error() + ")"}}
	}
	entries, err := readIndex(idx)
	if err != nil {
		return nil, scenario.Errors{{Field: "(library)", Message: in.Base + "index.json is not a list of files, such as [\"bay-3-girder.json\"] or [{\"file\": \"bay-3-girder.json\", \"name\": \"Bay 3 girder\", \"description\": \"...\"}]: " + err.Error()}}
	}
	out := &Library{Files: []Example{}, Problems: []string{}}
	for _, e := range entries {
		ex, err := libraryRead(env, in.Base, e.File)
		if err != nil {
			out.Problems = append(out.Problems, err.Error())
			continue
		}
		if e.Name != "" {
			ex.Name = e.Name
		}
		if e.Description != "" {
			ex.Description = e.Description
		}
		out.Files = append(out.Files, ex)
	}
	return out, nil
}

// indexEntry is one file of library/index.json: a file name alone, or an
// object with the file and the name and description to list it by (the
// file's own when left out).
type indexEntry struct {
	_           [0]func() // never compared: no equality code in the wasm
	File        string    `json:"file"`
	Name        string    `json:"name"`
	Description string    `json:"description"`
}

// readIndex reads library/index.json: a JSON list whose entries are file
// names or indexEntry objects.
func readIndex(data []byte) ([]indexEntry, error) {
	var raw []json.RawMessage
	if err := json.Unmarshal(data, &raw); err != nil {
		return nil, err
	}
	out := make([]indexEntry, len(raw))
	for i, r := range raw {
		if json.Unmarshal(r, &out[i].File) == nil {
			continue
		}
		d := json.NewDecoder(strings.NewReader(string(r)))
		d.DisallowUnknownFields()
		if err := d.Decode(&out[i]); err != nil {
			return nil, fmt.Errorf("entry %d: a file name or {\"file\", \"name\", \"description\"}: %v", i+1, err)
		}
	}
	return out, nil
}

// libraryFile reads one scenario of the site library: input {"file":
// NAME}, result as one entry of the list (file, name, description,
// scenario).
func libraryFile(env *Env, input []byte) (any, error) {
	in, err := readLibraryInput(input)
	if err != nil {
		return nil, err
	}
	if env.LibraryFetch == nil {
		return nil, errNoServer
	}
	ex, err := libraryRead(env, in.Base, in.File)
	if err != nil {
		return nil, scenario.Errors{{Field: "(library)", Message: err.Error()}}
	}
	return ex, nil
}

// libraryRead fetches and checks one library file: a name of a .json file
// in the library's own folder (no path), holding a valid scenario.
func libraryRead(env *Env, base, f string) (Example, error) {
	if f == "" || f != path.Base(f) || !strings.HasSuffix(f, ".json") || f == "index.json" || strings.ContainsAny(f, "?#%\\") {
		return Example{}, fmt.Errorf("%q: not a .json file name in the library's folder", f)
	}
	data, err := env.LibraryFetch(base + f)
	if err != nil {
		return Example{}, fmt.Errorf("%s: could not be read (%v)", f, err)
	}
	return example(f, data)
}
