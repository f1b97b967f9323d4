package dist

import (
	"bytes"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"swaysheet/core/sheet"
	"swaysheet/web/offline"
)

func TestText7RoundTrip(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for n := 0; n < 200; n++ {
		b := make([]byte, n)
		for i := range b {
			b[i] = byte(r.UintN(256))
		}
		switch n {
		case 7: // every group 0 (NUL): each pair of groups is one character
			b = make([]byte, 7)
		case 8: // the last group '<' with no group after it
			b = []byte{0, 0, 0, 0, 0, 0, 0, '<' << 1}
		}
		s := Encode7(b)
		if !utf8.ValidString(s) || strings.ContainsAny(s, Unsafe7) || !strings.HasSuffix(s, ".") {
			t.Fatalf("%d bytes: text %q holds a character it must not", n, s)
		}
		if max := len(strconv.Itoa(n)) + 2 + (8*n+6)/7 + (8*n+6)/7/2; len(s) > max {
			t.Fatalf("%d bytes gave %d bytes of text", n, len(s))
		}
		got, err := Decode7(s)
		if err != nil || !bytes.Equal(got, b) {
			t.Fatalf("%d bytes: round trip gave %v %v, want %v", n, got, err, b)
		}
	}
	// Random data takes about 8/7 bytes of text a byte.
	b := make([]byte, 100000)
	for i := range b {
		b[i] = byte(r.UintN(256))
	}
	if ratio := float64(len(Encode7(b))) / float64(len(b)); ratio > 1.155 {
		t.Errorf("%.4f bytes of text a byte", ratio)
	}
	for _, bad := range []string{"", "x:abc", "5:ab", "2:\u0300\u0300"} {
		if _, err := Decode7(bad); err == nil {
			t.Errorf("%q: no error", bad)
		}
	}
}

// The single file holds every script and style inline, the wasm as text,
// and a policy that allows only those scripts.
func TestSingle(t *testing.T) {
	page, err := Single("../static", []byte("/* wasm_exec */ var Go = function () {};"), []byte("\x00asm fake wasm bytes"))
	if err != nil {
		t.Fatal(err)
	}
	s := string(page)
	// The spread over likely runs is the served page's only (servedOnly).
	for _, no := range []string{`<script src=`, `<script type="module" src=`, `<link rel="stylesheet"`, `rel="manifest"`, `id="spread"`, "swaysheetSpread", "served page only"} {
		if strings.Contains(s, no) {
			t.Errorf("the single file still has %q", no)
		}
	}
	for _, want := range []string{`id="swaysheet-wasm"`, "script-src 'sha256-", "worker-src blob:", "connect-src 'none'", "swaysheetWorkerURL",
		strings.ReplaceAll(sheet.CSS, "</", `<\/`)} {
		if !strings.Contains(s, want) {
			t.Errorf("the single file lacks %q", want)
		}
	}
}

// TestStatic: the hostable folder holds both wasm files (the core and the
// site library's fetch wasm with its worker), and its service worker
// caches them.
func TestStatic(t *testing.T) {
	build, out := t.TempDir(), t.TempDir()
	for _, n := range offline.Built {
		if err := os.WriteFile(filepath.Join(build, n), []byte("x"+n), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	if _, err := Static(offline.Dirs{Static: "../static", Build: build, Examples: "../../testdata/scenarios"}, "test", out); err != nil {
		t.Fatal(err)
	}
	sw, err := os.ReadFile(filepath.Join(out, "sw.js"))
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range []string{"swaysheet.wasm", "swayfetch.wasm", "fetchworker.js", "worker.js", "wasm_exec.js"} {
		if _, err := os.Stat(filepath.Join(out, f)); err != nil {
			t.Errorf("dist/web lacks %s", f)
		}
		if !strings.Contains(string(sw), `"`+f+`"`) {
			t.Errorf("the service worker does not cache %s", f)
		}
	}
}
