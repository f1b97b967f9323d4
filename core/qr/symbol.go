package qr

// The symbol: function patterns, codeword placement, masking and the
// format and version information (ISO/IEC 18004:2015 sections 6.3, 7.7
// to 7.10). Coordinates are (x, y): column, row, from the top left.

// build lays out data in version v at level lv with the best mask.
func build(data []byte, v int, lv Level) *Code {
	size := 17 + 4*v
	c := &Code{Version: v, Level: lv, Size: size, dark: make([]bool, size*size), fn: make([]bool, size*size)}
	c.functionPatterns()
	c.place(codewords(data, v, lv))
	best, bestScore := 0, -1
	for m := 0; m < 8; m++ {
		c.applyMask(m)
		c.formatInfo(m)
		if s := c.penalty(); bestScore < 0 || s < bestScore {
			best, bestScore = m, s
		}
		c.applyMask(m) // masking twice undoes it
	}
	c.applyMask(best)
	c.formatInfo(best)
	c.Mask = best
	return c
}

func (c *Code) set(x, y int, dark bool) {
	c.dark[y*c.Size+x] = dark
	c.fn[y*c.Size+x] = true
}

// functionPatterns draws the finders with their separators, the timing
// patterns, the alignment patterns and the version information, and
// reserves the format information's modules (drawn per mask).
func (c *Code) functionPatterns() {
	n := c.Size
	for i := 0; i < n; i++ {
		c.set(6, i, i%2 == 0)
		c.set(i, 6, i%2 == 0)
	}
	c.finder(3, 3)
	c.finder(n-4, 3)
	c.finder(3, n-4)
	pos := alignment(c.Version)
	for i, ax := range pos {
		for j, ay := range pos {
			last := len(pos) - 1
			if i == 0 && j == 0 || i == 0 && j == last || i == last && j == 0 {
				continue // the finders' corners
			}
			for dy := -2; dy <= 2; dy++ {
				for dx := -2; dx <= 2; dx++ {
					c.set(ax+dx, ay+dy, max(abs(dx), abs(dy)) != 1)
				}
			}
		}
	}
	c.formatInfo(0) // reserves the modules; redrawn for the chosen mask
	if c.Version >= 7 {
		bits := bch(c.Version, 0x1F25, 12)
		for i := 0; i < 18; i++ {
			d := bits>>i&1 == 1
			a, b := n-11+i%3, i/3
			c.set(a, b, d)
			c.set(b, a, d)
		}
	}
}

// finder draws a finder pattern centred on (cx, cy) with its light
// separator, clipped to the symbol.
func (c *Code) finder(cx, cy int) {
	for dy := -4; dy <= 4; dy++ {
		for dx := -4; dx <= 4; dx++ {
			x, y := cx+dx, cy+dy
			if x < 0 || y < 0 || x >= c.Size || y >= c.Size {
				continue
			}
			d := max(abs(dx), abs(dy))
			c.set(x, y, d != 2 && d != 4)
		}
	}
}

func abs(v int) int {
	if v < 0 {
		return -v
	}
	return v
}

// alignment is the alignment patterns' centre coordinates of version v
// (annex E): 6, then evenly spaced (by an even step) up to Size-7.
func alignment(v int) []int {
	if v == 1 {
		return nil
	}
	a := v/7 + 2
	step := 26
	if v != 32 {
		step = (v*4 + a*2 + 1) / (a*2 - 2) * 2
	}
	pos := make([]int, a)
	pos[0] = 6
	for i, p := a-1, 17+4*v-7; i >= 1; i, p = i-1, p-step {
		pos[i] = p
	}
	return pos
}

// bch appends to value the remainder of value * x^deg divided by poly.
func bch(value, poly, deg int) int {
	r := value
	for i := 0; i < deg; i++ {
		r = r<<1 ^ (r>>(deg-1))*poly
	}
	return value<<deg | r
}

// formatInfo draws the format information (level and mask) in both
// places, and the dark module beside the bottom-left finder.
func (c *Code) formatInfo(mask int) {
	bits := bch(formatBits[c.Level]<<3|mask, 0x537, 10) ^ 0x5412
	bit := func(i int) bool { return bits>>i&1 == 1 }
	n := c.Size
	for i := 0; i <= 5; i++ {
		c.set(8, i, bit(i))
	}
	c.set(8, 7, bit(6))
	c.set(8, 8, bit(7))
	c.set(7, 8, bit(8))
	for i := 9; i < 15; i++ {
		c.set(14-i, 8, bit(i))
	}
	for i := 0; i < 8; i++ {
		c.set(n-1-i, 8, bit(i))
	}
	for i := 8; i < 15; i++ {
		c.set(8, n-15+i, bit(i))
	}
	c.set(8, n-8, true)
}

// place writes the codewords' bits, most significant first, in the
// zigzag of two-module columns from the bottom right, upwards first,
// stepping over the vertical timing pattern and every function module.
// Modules left over (the remainder bits) stay light.
func (c *Code) place(cw []byte) {
	n, i := c.Size, 0
	for right := n - 1; right >= 1; right -= 2 {
		if right == 6 {
			right = 5
		}
		up := (right+1)&2 == 0
		for k := 0; k < n; k++ {
			y := k
			if up {
				y = n - 1 - k
			}
			for j := 0; j < 2; j++ {
				x := right - j
				if c.fn[y*n+x] || i >= len(cw)*8 {
					continue
				}
				c.dark[y*n+x] = cw[i/8]>>(7-i%8)&1 == 1
				i++
			}
		}
	}
}

// applyMask inverts the data modules where mask pattern m is true
// (table 10).
func (c *Code) applyMask(m int) {
	n := c.Size
	for y := 0; y < n; y++ {
		for x := 0; x < n; x++ {
			var inv bool
			switch m {
			case 0:
				inv = (x+y)%2 == 0
			case 1:
				inv = y%2 == 0
			case 2:
				inv = x%3 == 0
			case 3:
				inv = (x+y)%3 == 0
			case 4:
				inv = (x/3+y/2)%2 == 0
			case 5:
				inv = x*y%2+x*y%3 == 0
			case 6:
				inv = (x*y%2+x*y%3)%2 == 0
			default:
				inv = ((x+y)%2+x*y%3)%2 == 0
			}
			if inv && !c.fn[y*n+x] {
				c.dark[y*n+x] = !c.dark[y*n+x]
			}
		}
	}
}
