package dist

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func writeModules(t *testing.T, files map[string]string) string {
	t.Helper()
	dir := t.TempDir()
	for n, s := range files {
		if err := os.WriteFile(filepath.Join(dir, n), []byte(s), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return dir
}

// Bundle writes each module after the modules it imports, depth first in
// the order of the imports (the order a browser runs them), once each,
// with the imports and the word export taken out.
func TestBundleOrder(t *testing.T) {
	dir := writeModules(t, map[string]string{
		"main.js": "import { b } from './b.js';\nimport './c.js';\nb();\n",
		"b.js":    "import { a } from './a.js';\nexport function b() { return a; }\n",
		"a.js":    "import { b } from './b.js';\nexport const a = 1;\n", // a cycle back to b
		"c.js":    "import { a } from './a.js';\nexport let c = a;\n",
	})
	got, err := Bundle(dir, "main.js")
	if err != nil {
		t.Fatal(err)
	}
	want := "// a.js\nconst a = 1;\n// b.js\nfunction b() { return a; }\n// c.js\nlet c = a;\n// main.js\nb();\n"
	if got != want {
		t.Errorf("bundle:\n%s\nwant:\n%s", got, want)
	}
}

// What Bundle cannot join exactly is an error naming the file and line.
func TestBundleRefuses(t *testing.T) {
	for name, src := range map[string]string{
		"renaming":       "import { a as z } from './a.js';\n",
		"default export": "export default 1;\n",
		"export list":    "const q = 1;\nexport { q };\n",
		"namespace":      "import * as m from './a.js';\n",
		"dynamic":        "const m = import('./a.js');\n",
		"same name":      "import { a } from './a.js';\nconst a2 = 1;\nfunction a() {}\n",
	} {
		dir := writeModules(t, map[string]string{"main.js": src, "a.js": "export const a = 1;\n"})
		if _, err := Bundle(dir, "main.js"); err == nil || !strings.Contains(err.Error(), "main.js:") {
			t.Errorf("%s: error %v", name, err)
		}
	}
}

// The page's own modules join, and the single file holds them as one
// inline module with no import left.
func TestBundleThePage(t *testing.T) {
	js, err := Bundle(filepath.Join("..", "static"), "main.js")
	if err != nil {
		t.Fatal(err)
	}
	for _, m := range []string{"// engine.js", "// plan-view.js", "// coach.js", "// sheet.js", "// offline.js", "// site-figures.js", "// main.js"} {
		if !strings.Contains(js, m+"\n") {
			t.Errorf("the bundle lacks %s", m)
		}
	}
	if strings.Contains(js, "\nimport ") || strings.Contains(js, "\nexport ") {
		t.Error("an import or export is left")
	}
	if !strings.HasSuffix(strings.TrimSpace(js), "start();") {
		t.Error("main.js is not last")
	}
}

// Every name of a declaration list counts (two modules that both declared
// `waiting` second in a `let` list joined into a page that did not start).
func TestTopNamesOfALetList(t *testing.T) {
	for line, want := range map[string]string{
		"let worker = null, nextId = 1, waiting = {}, restarts = [];": "worker nextId waiting restarts",
		"let waiting = null, asking = false;":                         "waiting asking",
		"const A = { a: 1, b: [2, 3] }, B = f(1, 2);":                 "A B",
		"var s = 'a,b', t;":                                           "s t",
		"function f(a, b) {":                                          "f",
		"if (x) { y = 1, z = 2; }":                                    "",
	} {
		if got := strings.Join(topNames(line), " "); got != want {
			t.Errorf("%q: %q, want %q", line, got, want)
		}
	}
}
