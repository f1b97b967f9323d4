package scenario

import (
	"crypto/sha256"
	"encoding/hex"
	"strings"
	"testing"
)

// Source: FIPS 180-4's examples (NIST, SHA256.pdf: "abc" and the 448-bit
// message), and crypto/sha256 on every length from 0 to 300 bytes (all
// the padding cases) and on a 100 kB text.
func TestSum256(t *testing.T) {
	for msg, want := range map[string]string{
		"abc": "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
		"abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq": "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
	} {
		if got := sum256([]byte(msg)); hex.EncodeToString(got[:]) != want {
			t.Errorf("%q: %x, want %s", msg, got, want)
		}
	}
	long := []byte(strings.Repeat("swaysheet \u00b0 ", 8000))
	for n := 0; n <= 300; n++ {
		if got, want := sum256(long[:n]), sha256.Sum256(long[:n]); got != want {
			t.Fatalf("%d bytes: %x, crypto/sha256 %x", n, got, want)
		}
	}
	if got, want := sum256(long), sha256.Sum256(long); got != want {
		t.Fatalf("%d bytes: %x, crypto/sha256 %x", len(long), got, want)
	}
}
