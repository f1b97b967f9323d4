package qr

// penalty scores the symbol as masked (ISO/IEC 18004:2015 section
// 7.8.3.1): N1 = 3 for a run of five modules of one colour in a row or
// column, plus 1 for each module beyond five; N2 = 3 for each 2x2 block of
// one colour; N3 = 40 for each 1:1:3:1:1 dark-light-dark-dark-dark-light-
// dark pattern with four light modules (or the quiet zone) before or
// after it; N4 = 10 for each whole 5 % the dark proportion is away from
// 50 %.
func (c *Code) penalty() int {
	n := c.Size
	score := 0
	line := make([]bool, n)
	for dir := 0; dir < 2; dir++ {
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				if dir == 0 {
					line[j] = c.dark[i*n+j] // row i
				} else {
					line[j] = c.dark[j*n+i] // column i
				}
			}
			score += runPenalty(line) + finderPenalty(line)
		}
	}
	dark := 0
	for y := 0; y < n; y++ {
		for x := 0; x < n; x++ {
			d := c.dark[y*n+x]
			if d {
				dark++
			}
			if x+1 < n && y+1 < n && d == c.dark[y*n+x+1] && d == c.dark[(y+1)*n+x] && d == c.dark[(y+1)*n+x+1] {
				score += 3
			}
		}
	}
	// k whole steps of 5 % away from 50 %: |20 dark - 10 total| / total.
	total := n * n
	k := abs(dark*20-total*10) / total
	return score + 10*k
}

// runPenalty is N1 for one row or column.
func runPenalty(line []bool) int {
	p, run := 0, 1
	for i := 1; i <= len(line); i++ {
		if i < len(line) && line[i] == line[i-1] {
			run++
			continue
		}
		if run >= 5 {
			p += 3 + run - 5
		}
		run = 1
	}
	return p
}

// finderPenalty is N3 for one row or column: each dark 1:1:3:1:1
// pattern with four light modules, or the symbol's edge (the quiet zone
// is light), on at least one side.
func finderPenalty(line []bool) int {
	n := len(line)
	at := func(i int) bool { return i >= 0 && i < n && line[i] }
	p := 0
	for i := 0; i+7 <= n; i++ {
		if !(at(i) && !at(i+1) && at(i+2) && at(i+3) && at(i+4) && !at(i+5) && at(i+6)) {
			continue
		}
		before, after := true, true
		for k := 1; k <= 4; k++ {
			before = before && !at(i-k)
			after = after && !at(i+6+k)
		}
		if before || after {
			p += 40
		}
	}
	return p
}
