package scenario_test

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
)

// addSeeds adds every scenario file of the repository to the corpus, beside
// the hand-made bad files in testdata/fuzz/FuzzParse.
func addSeeds(f *testing.F) {
	for _, g := range []string{"../../testdata/scenarios/*.json", "../../testdata/reference/scenarios/*.json"} {
		files, _ := filepath.Glob(g)
		for _, name := range files {
			data, err := os.ReadFile(name)
			if err != nil {
				f.Fatal(err)
			}
			f.Add(data)
		}
	}
}

// FuzzParse feeds arbitrary bytes to the scenario decoder. It must never
// panic; it returns either a valid scenario, which encodes and decodes
// again to the same scenario, or an error that names a field and says what
// is wrong.
func FuzzParse(f *testing.F) {
	addSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		s, err := scenario.Parse(data)
		if err != nil {
			if s != nil {
				t.Fatalf("Parse returned a scenario and an error: %v", err)
			}
			var es scenario.Errors
			if !errors.As(err, &es) || len(es) == 0 {
				t.Fatalf("error is not a list of field errors: %T %v", err, err)
			}
			for _, e := range es {
				if e.Field == "" || e.Message == "" {
					t.Fatalf("field error without field or message: %+v", e)
				}
			}
			return
		}
		if err := s.Validate(); err != nil {
			t.Fatalf("Parse accepted a scenario that Validate rejects: %v", err)
		}
		var buf bytes.Buffer
		if err := scenario.Encode(&buf, s); err != nil {
			t.Fatalf("Encode: %v", err)
		}
		s2, err := scenario.Parse(buf.Bytes())
		if err != nil {
			t.Fatalf("a parsed scenario does not parse again after encoding: %v\n%s", err, buf.Bytes())
		}
		var buf2 bytes.Buffer
		if err := scenario.Encode(&buf2, s2); err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(buf.Bytes(), buf2.Bytes()) {
			t.Fatalf("encoding is not stable:\n%s\n%s", buf.Bytes(), buf2.Bytes())
		}
	})
}
