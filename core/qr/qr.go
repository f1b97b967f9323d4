// Package qr encodes text as a QR code symbol (ISO/IEC 18004:2015), for
// the check sheet's link. It writes byte mode only (the sheet's text is a
// link with a base64url fragment, which numeric and alphanumeric modes do
// not cover), at error correction level L or M, versions 1 to 40, and
// draws nothing: the caller gets the modules and draws them (as SVG on the
// sheet). It uses neither image nor fmt, so the page's wasm stays small.
//
// The steps are the standard's: the bit stream (mode indicator 0100, the
// character count, the bytes, a terminator of up to four zeros, zero bits
// to a byte boundary, then the pad bytes 0xEC 0x11 in turn, section 7.4);
// the Reed-Solomon error correction codewords of each block over GF(256)
// with the field polynomial x^8+x^4+x^3+x^2+1 and a generator with roots
// alpha^0 .. alpha^(n-1) (section 7.5); the blocks' codewords interleaved
// (section 7.6); the function patterns and the codewords placed in the
// two-column zigzag from the bottom right (section 7.7); the data mask of
// the eight with the least penalty (section 7.8.3: runs of five or more,
// 2x2 blocks, finder-like 1:1:3:1:1 patterns with four light modules on a
// side, and the dark proportion's distance from half); then the format
// information, BCH(15,5) with generator 0x537 masked with 0x5412, and
// from version 7 the version information, BCH(18,6) with generator
// 0x1F25 (section 7.9 and annex C).
package qr

import "strconv"

// Level is an error correction level.
type Level int

// The levels this package writes: L restores about 7 % of the codewords,
// M about 15 %.
const (
	L Level = iota
	M
)

// formatBits are the levels' two bits in the format information (table 12).
var formatBits = [...]int{L: 1, M: 0}

// Error correction codewords per block, and blocks, by version (index 0
// unused), for L and M (table 9).
var (
	eccPerBlock = [2][41]int{
		L: {0, 7, 10, 15, 20, 26, 18, 20, 24, 30, 18, 20, 24, 26, 30, 22, 24, 28, 30, 28, 28, 28, 28, 30, 30, 26, 28, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30},
		M: {0, 10, 16, 26, 18, 24, 16, 18, 22, 22, 26, 30, 22, 22, 24, 24, 28, 28, 26, 26, 26, 26, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28, 28},
	}
	blocks = [2][41]int{
		L: {0, 1, 1, 1, 1, 1, 2, 2, 2, 2, 4, 4, 4, 4, 4, 6, 6, 6, 6, 7, 8, 8, 9, 9, 10, 12, 12, 12, 13, 14, 15, 16, 17, 18, 19, 19, 20, 21, 22, 24, 25},
		M: {0, 1, 1, 1, 2, 2, 4, 4, 4, 5, 5, 5, 8, 9, 9, 10, 10, 11, 13, 14, 16, 17, 17, 18, 20, 21, 23, 25, 26, 28, 29, 31, 33, 35, 37, 38, 40, 43, 45, 47, 49},
	}
)

// Code is an encoded symbol.
type Code struct {
	Version int
	Level   Level
	Mask    int
	// Size is the modules on a side, 17 + 4 * Version.
	Size int
	dark []bool
	fn   []bool // function pattern modules, not data
}

// Dark reports whether the module in column x, row y is dark.
func (c *Code) Dark(x, y int) bool { return c.dark[y*c.Size+x] }

// Bitmap is the modules row by row, dark true, with a light quiet zone
// of quiet modules around them (the standard asks for 4).
func (c *Code) Bitmap(quiet int) [][]bool {
	n := c.Size + 2*quiet
	out := make([][]bool, n)
	for y := range out {
		out[y] = make([]bool, n)
		if y < quiet || y >= quiet+c.Size {
			continue
		}
		for x := 0; x < c.Size; x++ {
			out[y][quiet+x] = c.Dark(x, y-quiet)
		}
	}
	return out
}

// TooLongError says the text does not fit in a version 40 symbol.
type TooLongError struct {
	Bytes, Max int
}

func (e *TooLongError) Error() string {
	return "the text is " + strconv.Itoa(e.Bytes) + " bytes; a QR code holds at most " + strconv.Itoa(e.Max) + " at this error correction level"
}

// Encode encodes text in the smallest version that holds it at level lv.
func Encode(text string, lv Level) (*Code, error) {
	data := []byte(text)
	for v := 1; v <= 40; v++ {
		if len(data) <= capacity(v, lv) {
			return build(data, v, lv), nil
		}
	}
	return nil, &TooLongError{Bytes: len(data), Max: capacity(40, lv)}
}

// countBits is the byte mode's character count field width (table 3).
func countBits(v int) int {
	if v <= 9 {
		return 8
	}
	return 16
}

// capacity is how many bytes version v holds at level lv in byte mode.
func capacity(v int, lv Level) int {
	return (dataCodewords(v, lv)*8 - 4 - countBits(v)) / 8
}

// rawCodewords is the codewords of version v: the modules left by the
// function patterns, in bytes (any remainder bits are unused).
func rawCodewords(v int) int {
	n := (16*v+128)*v + 64 // all modules less finders, separators, timing, format
	if v >= 2 {
		a := v/7 + 2
		n -= (25*a-10)*a - 55 // alignment patterns, less their overlap with timing
		if v >= 7 {
			n -= 36 // version information
		}
	}
	return n / 8
}

func dataCodewords(v int, lv Level) int {
	return rawCodewords(v) - eccPerBlock[lv][v]*blocks[lv][v]
}

// bitWriter appends bits, most significant first.
type bitWriter struct {
	b []byte
	n int // bits written
}

func (w *bitWriter) put(v, bits int) {
	for i := bits - 1; i >= 0; i-- {
		if w.n%8 == 0 {
			w.b = append(w.b, 0)
		}
		if v>>i&1 == 1 {
			w.b[w.n/8] |= 0x80 >> (w.n % 8)
		}
		w.n++
	}
}

// codewords is the data and error correction codewords of data in
// version v at level lv, interleaved in the order they are placed.
func codewords(data []byte, v int, lv Level) []byte {
	capBits := dataCodewords(v, lv) * 8
	var w bitWriter
	w.put(4, 4) // byte mode
	w.put(len(data), countBits(v))
	for _, c := range data {
		w.put(int(c), 8)
	}
	w.put(0, min(4, capBits-w.n))
	w.put(0, (8-w.n%8)%8)
	for pad := 0xEC; w.n < capBits; pad ^= 0xEC ^ 0x11 {
		w.put(pad, 8)
	}
	nb, ecc := blocks[lv][v], eccPerBlock[lv][v]
	raw := rawCodewords(v)
	short := nb - raw%nb // blocks one data codeword shorter than the rest
	shortData := raw/nb - ecc
	gen := generator(ecc)
	var dataBlocks, eccBlocks [][]byte
	for i, k := 0, 0; i < nb; i++ {
		n := shortData
		if i >= short {
			n++
		}
		blk := w.b[k : k+n]
		k += n
		dataBlocks = append(dataBlocks, blk)
		eccBlocks = append(eccBlocks, remainder(blk, gen))
	}
	out := make([]byte, 0, raw)
	for i := 0; i <= shortData; i++ {
		for _, blk := range dataBlocks {
			if i < len(blk) { // the short blocks have no codeword shortData
				out = append(out, blk[i])
			}
		}
	}
	for i := 0; i < ecc; i++ {
		for _, blk := range eccBlocks {
			out = append(out, blk[i])
		}
	}
	return out
}

// gfMul multiplies in GF(256) with the polynomial 0x11D.
func gfMul(a, b byte) byte {
	var p byte
	for ; b != 0; b >>= 1 {
		if b&1 == 1 {
			p ^= a
		}
		hi := a & 0x80
		a <<= 1
		if hi != 0 {
			a ^= 0x1D
		}
	}
	return p
}

// generator is the Reed-Solomon generator polynomial of degree n,
// (x - alpha^0)(x - alpha^1)...(x - alpha^(n-1)) with alpha = 2, as its
// coefficients after the leading 1, highest power first.
func generator(n int) []byte {
	g := make([]byte, n)
	g[n-1] = 1
	root := byte(1)
	for i := 0; i < n; i++ {
		for j := 0; j < n; j++ {
			g[j] = gfMul(g[j], root)
			if j+1 < n {
				g[j] ^= g[j+1]
			}
		}
		root = gfMul(root, 2)
	}
	return g
}

// remainder is data times x^n divided by the generator: the block's
// error correction codewords.
func remainder(data, gen []byte) []byte {
	r := make([]byte, len(gen))
	for _, d := range data {
		f := d ^ r[0]
		copy(r, r[1:])
		r[len(r)-1] = 0
		for i, g := range gen {
			r[i] ^= gfMul(g, f)
		}
	}
	return r
}
