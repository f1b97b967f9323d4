package dist

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestMakefileNoInline: the Makefile builds the page's wasm with the same
// packages uninlined as the browser tests do (NoInline).
func TestMakefileNoInline(t *testing.T) {
	mk, err := os.ReadFile(filepath.Join("..", "..", "Makefile"))
	if err != nil {
		t.Fatal(err)
	}
	var line string
	for _, l := range strings.Split(string(mk), "\n") {
		if strings.HasPrefix(l, "NOINLINE :=") {
			line = l
		}
	}
	if got, want := strings.Fields(strings.TrimPrefix(line, "NOINLINE :=")), NoInline; strings.Join(got, " ") != strings.Join(want, " ") {
		t.Errorf("Makefile NOINLINE is %q, web/dist.NoInline %q", got, want)
	}
	for _, target := range []string{"$(OUT)/web/swaysheet.wasm ./wasm", "$(OUT)/single/swaysheet.wasm ./wasm", "$(BENCH)/parts.wasm ./wasm"} {
		ok := false
		for _, l := range strings.Split(string(mk), "\n") {
			if strings.Contains(l, target) && strings.Contains(l, "$(WASM_GCFLAGS)") {
				ok = true
			}
		}
		if !ok {
			t.Errorf("the Makefile's build of %s does not pass $(WASM_GCFLAGS)", target)
		}
	}
}
