package dist

import (
	"bytes"
	"math/rand/v2"
	"strings"
	"testing"

	"swaysheet/core/sheet"
)

func TestBase85RoundTrip(t *testing.T) {
	if len(Alphabet85) != 85 || strings.ContainsAny(Alphabet85, "\"&'<>\\`") {
		t.Fatalf("alphabet %q", Alphabet85)
	}
	r := rand.New(rand.NewPCG(1, 2))
	for n := 0; n < 40; n++ {
		b := make([]byte, n)
		for i := range b {
			b[i] = byte(r.UintN(256))
		}
		if n == 5 {
			b = []byte{255, 255, 255, 255, 255}
		}
		s := Encode85(b)
		if len(s) != n/4*5+map[bool]int{true: n%4 + 1, false: 0}[n%4 != 0] {
			t.Fatalf("%d bytes gave %d characters", n, len(s))
		}
		if got := Decode85(s); !bytes.Equal(got, b) {
			t.Fatalf("%d bytes: round trip gave %v, want %v", n, got, b)
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
	for _, no := range []string{`<script src=`, `<script type="module" src=`, `<link rel="stylesheet"`, `rel="manifest"`} {
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
