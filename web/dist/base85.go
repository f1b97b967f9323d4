package dist

import "strings"

// Alphabet85 is the 85 characters of the single file's wasm text: '!' to
// '~' without the seven that HTML or a JavaScript string would treat
// specially (" & ' < > \ and the backtick). Base85 takes 5 characters for
// 4 bytes (base64: 5.33), which keeps the single file inside its budget.
var Alphabet85 = func() string {
	var b strings.Builder
	for c := byte('!'); c <= '~' && b.Len() < 85; c++ {
		if !strings.ContainsRune("\"&'<>\\`", rune(c)) {
			b.WriteByte(c)
		}
	}
	return b.String()
}()

// Encode85 writes data as base85 in Alphabet85: each 4 bytes, big-endian,
// as 5 digits, most significant first; a last group of n < 4 bytes is
// padded with zeros and written as its first n+1 digits.
func Encode85(data []byte) string {
	var b strings.Builder
	b.Grow(len(data)*5/4 + 5)
	var d [5]byte
	for i := 0; i < len(data); i += 4 {
		var v uint32
		n := 0
		for k := 0; k < 4; k++ {
			v <<= 8
			if i+k < len(data) {
				v |= uint32(data[i+k])
				n++
			}
		}
		for k := 4; k >= 0; k-- {
			d[k] = Alphabet85[v%85]
			v /= 85
		}
		b.Write(d[:n+1])
	}
	return b.String()
}

// Decode85 is the inverse of Encode85 (the page's worker.js does the same
// in JavaScript); characters outside the alphabet are skipped.
func Decode85(s string) []byte {
	var idx [256]int
	for i := range idx {
		idx[i] = -1
	}
	for i := 0; i < len(Alphabet85); i++ {
		idx[Alphabet85[i]] = i
	}
	digits := make([]int, 0, len(s))
	for i := 0; i < len(s); i++ {
		if v := idx[s[i]]; v >= 0 {
			digits = append(digits, v)
		}
	}
	out := make([]byte, 0, len(digits)*4/5+4)
	for i := 0; i < len(digits); i += 5 {
		n := min(5, len(digits)-i)
		var v uint64
		for k := 0; k < 5; k++ {
			d := 84
			if k < n {
				d = digits[i+k]
			}
			v = v*85 + uint64(d)
		}
		for k := 0; k < n-1; k++ {
			out = append(out, byte(v>>(24-8*k)))
		}
	}
	return out
}
