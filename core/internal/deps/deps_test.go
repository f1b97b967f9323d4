// Package deps holds the test that core/ stands alone: no package under
// core/ depends, directly or through another, on web/ or wasm/ (the
// same as `go list -deps ./core/... | grep -E 'swaysheet/(web|wasm)'`
// printing nothing), nor on syscall/js.
package deps

import (
	"go/build"
	"io/fs"
	"path/filepath"
	"strings"
	"testing"
)

func TestCoreStandsAlone(t *testing.T) {
	ctx := build.Default
	seen := map[string]bool{}
	var walk func(path, from string)
	walk = func(path, from string) {
		if seen[path] {
			return
		}
		seen[path] = true
		if path == "syscall/js" || strings.HasPrefix(path, "swaysheet/web") || strings.HasPrefix(path, "swaysheet/wasm") {
			t.Errorf("%s imports %s", from, path)
			return
		}
		if !strings.HasPrefix(path, "swaysheet/") {
			return // the standard library and modules: not ours to check
		}
		p, err := ctx.ImportDir(filepath.Join("../../..", filepath.FromSlash(strings.TrimPrefix(path, "swaysheet/"))), 0)
		if err != nil {
			if _, ok := err.(*build.NoGoError); ok {
				return
			}
			t.Fatalf("%s: %v", path, err)
		}
		for _, imp := range p.Imports {
			walk(imp, path)
		}
	}
	n := 0
	err := filepath.WalkDir("../..", func(p string, d fs.DirEntry, err error) error {
		if err != nil || !d.IsDir() || d.Name() == "testdata" {
			if d != nil && d.IsDir() && d.Name() == "testdata" {
				return filepath.SkipDir
			}
			return err
		}
		rel, _ := filepath.Rel("../..", p)
		walk("swaysheet/core"+strings.TrimPrefix("/"+filepath.ToSlash(rel), "/."), "(root)")
		n++
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if n < 10 {
		t.Fatalf("only %d folders under core/ looked at", n)
	}
}
