// Package testscenario reads the project's scenario files for tests: one
// helper instead of a copy in every package's tests.
package testscenario

import (
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/scenario"
)

// Example reads testdata/scenarios/NAME (".json" added when missing).
func Example(t testing.TB, name string) *scenario.Scenario {
	t.Helper()
	if filepath.Ext(name) != ".json" {
		name += ".json"
	}
	return Load(t, filepath.Join("testdata", "scenarios", name))
}

// Load reads and validates the scenario at rel, a path from the module's
// root (the first folder up from the test's own that holds go.mod); a
// file that does not read or validate fails the test.
func Load(t testing.TB, rel string) *scenario.Scenario {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(root(t), rel))
	if err != nil {
		t.Fatal(err)
	}
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatalf("%s: %v", rel, err)
	}
	return s
}

func root(t testing.TB) string {
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for d := dir; ; d = filepath.Dir(d) {
		if _, err := os.Stat(filepath.Join(d, "go.mod")); err == nil {
			return d
		}
		if filepath.Dir(d) == d {
			t.Fatalf("no go.mod above %s", dir)
		}
	}
}
