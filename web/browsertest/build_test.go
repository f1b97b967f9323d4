package browsertest

import (
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"sync"
	"testing"

	"swaysheet/web/dist"
)

var (
	wasmOnce sync.Once
	wasmDir  string
	wasmErr  error
)

// wasmBuild builds the wasm and puts Go's wasm_exec.js beside it, once for
// all the package's tests (TestMain removes the folder).
func wasmBuild(t *testing.T) string {
	t.Helper()
	wasmOnce.Do(func() {
		if wasmDir, wasmErr = os.MkdirTemp("", "swaysheet-browsertest-"); wasmErr != nil {
			return
		}
		// Built as make wasm builds them: stripped, NoInline uninlined, data segments joined;
		// the core and the site library's small fetch wasm.
		for _, b := range [][2]string{{"swaysheet.wasm", "./wasm"}, {"swayfetch.wasm", "./wasm/fetch"}} {
			wasmFile := filepath.Join(wasmDir, b[0])
			args := []string{"build", "-trimpath", "-ldflags=-s -w", "-o", wasmFile}
			if b[1] == "./wasm" {
				args = append(args, dist.WasmGcflags()...)
			}
			cmd := exec.Command("go", append(args, b[1])...)
			cmd.Dir = root
			cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
			if out, err := cmd.CombinedOutput(); err != nil {
				wasmErr = fmt.Errorf("building %s: %v\n%s", b[0], err, out)
				return
			}
			if _, _, _, err := dist.PackFile(wasmFile); err != nil {
				wasmErr = err
				return
			}
		}
		wexec, err := os.ReadFile(filepath.Join(runtime.GOROOT(), "lib", "wasm", "wasm_exec.js"))
		if err == nil {
			err = os.WriteFile(filepath.Join(wasmDir, "wasm_exec.js"), wexec, 0o644)
		}
		wasmErr = err
	})
	if wasmErr != nil {
		t.Fatal(wasmErr)
	}
	return wasmDir
}

func TestMain(m *testing.M) {
	code := m.Run()
	if wasmDir != "" {
		os.RemoveAll(wasmDir)
	}
	os.Exit(code)
}
