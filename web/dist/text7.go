package dist

import (
	"errors"
	"strconv"
	"strings"
	"unicode/utf8"
)

// The single file's wasm as text, 7 bits a character. The gzipped wasm's
// bits, most significant first, are cut into groups of 7 (the last padded
// with zeros), and each group is written as the ASCII character of that
// value: one byte of the UTF-8 file for 7 bits, 8/7 = 1.14 bytes a byte
// (base64 takes 1.33, base85 1.25). Three values cannot stand for
// themselves inside the page's <script type="application/octet-stream">
// element: NUL (the HTML parser replaces it), CR (it becomes LF) and '<'
// (it could end the element). A group of one of these is written with
// the group after it as one character, U+0100 + 128 * (its place in
// Unsafe7) + the next group: two bytes in UTF-8 for 14 bits. The text
// starts with the byte count and a colon, and ends with a full stop, so
// that trimming the element's white space never touches the data.
//
// The page's worker.js decodes it (decode7); Decode7 here is the same in Go.

// Unsafe7 are the 7-bit values never written as themselves.
const Unsafe7 = "\x00\r<"

// Encode7 writes data as 7-bit text.
func Encode7(data []byte) string {
	var b strings.Builder
	b.Grow(len(data)*8/7 + len(data)/64 + 16)
	b.WriteString(strconv.Itoa(len(data)) + ":")
	groups := (len(data)*8 + 6) / 7
	group := func(g int) byte { // the 7 bits from bit 7g on
		var v byte
		for k := 0; k < 7; k++ {
			bit := 7*g + k
			v <<= 1
			if bit/8 < len(data) {
				v |= data[bit/8] >> (7 - bit%8) & 1
			}
		}
		return v
	}
	for g := 0; g < groups; g++ {
		v := group(g)
		if i := strings.IndexByte(Unsafe7, v); i >= 0 {
			next := byte(0)
			if g+1 < groups {
				g++
				next = group(g)
			}
			b.WriteRune(rune(0x100 + 128*i + int(next)))
			continue
		}
		b.WriteByte(v)
	}
	b.WriteByte('.')
	return b.String()
}

// Decode7 is the inverse of Encode7.
func Decode7(s string) ([]byte, error) {
	head, body, ok := strings.Cut(s, ":")
	n, err := strconv.Atoi(head)
	if !ok || err != nil || n < 0 {
		return nil, errors.New("7-bit text: no byte count")
	}
	out := make([]byte, 0, n)
	var acc, bits uint
	put := func(v uint) {
		acc = acc<<7 | v
		bits += 7
		if bits >= 8 {
			bits -= 8
			if len(out) < n {
				out = append(out, byte(acc>>bits))
			}
			acc &= 1<<bits - 1
		}
	}
	for len(out) < n && len(body) > 0 {
		r, size := utf8.DecodeRuneInString(body)
		body = body[size:]
		switch {
		case r < 0x80:
			put(uint(r))
		case r >= 0x100 && r < rune(0x100+128*len(Unsafe7)):
			x := uint(r - 0x100)
			put(uint(Unsafe7[x>>7]))
			put(x & 127)
		default:
			return nil, errors.New("7-bit text: a character outside the code")
		}
	}
	if len(out) < n {
		return nil, errors.New("7-bit text: shorter than its byte count")
	}
	return out, nil
}
