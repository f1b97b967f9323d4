package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestRatiosOverRounds: the wasm/native row is the fastest wasm round
// over the fastest native round, with each round's own ratio in the note;
// a later round's rows are not printed.
func TestRatiosOverRounds(t *testing.T) {
	rows := []Row{
		{Group: "core linux/amd64", Name: "a", Value: 100},
		{Group: "core js/wasm", Name: "a", Value: 250},
		{Group: "core linux/amd64", Name: "a", Value: 150, Round: 2}, // a burst natively
		{Group: "core js/wasm", Name: "a", Value: 200, Round: 2},
		{Group: "core linux/amd64", Name: "a", Value: 100, Round: 3},
		{Group: "core js/wasm", Name: "a", Value: 210, Round: 3},
		{Group: "core linux/amd64", Name: "b", Value: 10},
		{Group: "core js/wasm", Name: "b", Value: 15},
	}
	got := ratios(rows)
	if len(got) != 2 {
		t.Fatalf("%d ratio rows, want 2: %+v", len(got), got)
	}
	// The fastest wasm round (200) over the fastest native one (100).
	if a := got[0]; a.Name != "a" || a.Value != 2 || !strings.Contains(a.Note, "fastest of 3 rounds") ||
		!strings.Contains(a.Note, "2.50, 1.33, 2.10") || !strings.Contains(a.Note, "met") {
		t.Errorf("a: %+v", a)
	}
	if b := got[1]; b.Name != "b" || b.Value != 1.5 || strings.Contains(b.Note, "rounds") || !strings.Contains(b.Note, "met") {
		t.Errorf("b: %+v", b)
	}

	dir := t.TempDir()
	f := filepath.Join(dir, "rows.json")
	data := `{"group":"core linux/amd64","name":"a","value":100,"unit":"us"}
{"group":"core linux/amd64","name":"a","value":150,"unit":"us","round":2}
{"group":"core js/wasm","name":"a","value":250,"unit":"us"}
{"group":"core js/wasm","name":"a","value":200,"unit":"us","round":2}
`
	if err := os.WriteFile(f, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	var out strings.Builder
	if err := printTable(&out, []string{f}); err != nil {
		t.Fatal(err)
	}
	if strings.Contains(out.String(), "150") || strings.Contains(out.String(), "200 ") || !strings.Contains(out.String(), "fastest of 2 rounds") {
		t.Errorf("table:\n%s", out.String())
	}
}

// TestShapes: the locals and arrays shapes do the same sums in the same
// order (the same bits), and the ratio rows pair a shape's native and
// wasm rows by name.
func TestShapes(t *testing.T) {
	if a, b := shapeLocals(1000), shapeArrays(1000); a != b {
		t.Errorf("locals %v, arrays %v: not the same sums", a, b)
	}
	rows := shapeRows("shapes linux/amd64", 1000)
	if len(rows) != len(shapes) {
		t.Fatalf("%d rows, want %d", len(rows), len(shapes))
	}
	for _, r := range rows {
		if !(r.Value > 0) || r.Unit != "ns" {
			t.Errorf("%+v", r)
		}
	}
	got := shapeRatios([]Row{
		{Group: "shapes linux/amd64", Name: "call", Value: 1.5},
		{Group: "shapes js/wasm", Name: "call", Value: 6},
		{Group: "shapes js/wasm", Name: "arrays", Value: 20}, // no native row: no ratio
		{Group: "core linux/amd64", Name: "arrays", Value: 10},
	})
	if len(got) != 1 || got[0].Name != "call" || got[0].Value != 4 || got[0].Group != "wasm / native, code shapes" {
		t.Errorf("ratios: %+v", got)
	}
}
