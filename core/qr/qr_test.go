package qr

import (
	"errors"
	"strings"
	"testing"

	"swaysheet/core/internal/qrdecode"
)

// text is n bytes of a link with a base64url fragment.
func text(n int) string {
	const chars = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_"
	var b strings.Builder
	b.WriteString("https://example.org/swaysheet/#z=")
	for i := 0; b.Len() < n; i++ {
		b.WriteByte(chars[(i*37+i*i*11)%len(chars)])
	}
	return b.String()[:n]
}

// Every version at both levels, each filled to its capacity (the
// largest block structure of each), decodes to the text put in.
func TestEveryVersionDecodes(t *testing.T) {
	for _, lv := range []Level{L, M} {
		for v := 1; v <= 40; v++ {
			s := text(capacity(v, lv))
			if v == 1 {
				s = "ab" // shorter than the link prefix
			}
			c, err := Encode(s, lv)
			if err != nil {
				t.Fatal(err)
			}
			if c.Version != v || c.Size != 17+4*v {
				t.Fatalf("level %d, %d bytes: version %d size %d, want version %d", lv, len(s), c.Version, c.Size, v)
			}
			if got := qrdecode.Modules(t, c.Bitmap(4), 2); got != s {
				t.Fatalf("level %d version %d: decodes to %q, want %q", lv, v, got, s)
			}
		}
	}
}

// The capacities are the standard's byte-mode capacities (ISO/IEC
// 18004:2015 table 7), at five versions for each level.
func TestCapacity(t *testing.T) {
	for _, c := range []struct {
		v     int
		lv    Level
		bytes int
	}{{1, L, 17}, {1, M, 14}, {2, L, 32}, {2, M, 26}, {5, L, 106}, {5, M, 84},
		{10, L, 271}, {10, M, 213}, {40, L, 2953}, {40, M, 2331}} {
		if got := capacity(c.v, c.lv); got != c.bytes {
			t.Errorf("version %d level %d: %d bytes, want %d", c.v, c.lv, got, c.bytes)
		}
	}
	var tl *TooLongError
	if _, err := Encode(text(2332), M); !errors.As(err, &tl) || tl.Max != 2331 {
		t.Errorf("2332 bytes at M: %v", err)
	}
	if _, err := Encode(text(2953), L); err != nil {
		t.Errorf("2953 bytes at L: %v", err)
	}
}

// The penalty rules on hand-made lines (ISO/IEC 18004:2015 7.8.3.1).
func TestPenaltyRules(t *testing.T) {
	line := func(s string) []bool {
		b := make([]bool, len(s))
		for i, c := range s {
			b[i] = c == '#'
		}
		return b
	}
	for _, c := range []struct {
		s         string
		run, find int
	}{
		{"#.#.#.#.#.", 0, 0},
		{"#####.#.#.", 3, 0},
		{"#######...", 3 + 2, 0}, // seven dark: 3, and 1 for each beyond five
		{"....#.###.#.", 0, 40},  // four light before
		{".#.###.#....", 0, 40},  // four light after
		{"#.###.#", 0, 40},       // the edges (the quiet zone) are light
		{"#..#.###.#..#", 0, 0},  // two light either side
		{"#####.....", 3 + 3, 0},
	} {
		if r, f := runPenalty(line(c.s)), finderPenalty(line(c.s)); r != c.run || f != c.find {
			t.Errorf("%s: N1 %d N3 %d, want %d %d", c.s, r, f, c.run, c.find)
		}
	}
}
