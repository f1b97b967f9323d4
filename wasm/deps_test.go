//go:build !js

package main

import (
	"os"
	"os/exec"
	"strings"
	"testing"
)

// deps lists the packages the js/wasm build of pkg links.
func deps(t *testing.T, pkg string) map[string]bool {
	t.Helper()
	cmd := exec.Command("go", "list", "-deps", pkg)
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("go list -deps %s: %v", pkg, err)
	}
	m := map[string]bool{}
	for _, p := range strings.Fields(string(out)) {
		m[p] = true
	}
	return m
}

// TestMainWasmHasNoNetHTTP: the page's main wasm leaves net/http (and
// with it crypto/tls and x509, about 0.7 MB gzipped) to the site library's
// small fetch wasm, which reads the library with tinyutil's httputil.
func TestMainWasmHasNoNetHTTP(t *testing.T) {
	main := deps(t, ".")
	for _, p := range []string{"net/http", "crypto/tls", "crypto/x509", "github.com/syumai/tinyutil/httputil"} {
		if main[p] {
			t.Errorf("the main wasm links %s", p)
		}
	}
	if !main["swaysheet/wasm/bridge"] {
		t.Errorf("the main wasm does not link the bridge: the dependency list is wrong")
	}
	if fetch := deps(t, "./fetch"); !fetch["github.com/syumai/tinyutil/httputil"] {
		t.Errorf("the fetch wasm does not read the library with tinyutil's httputil")
	}
}
