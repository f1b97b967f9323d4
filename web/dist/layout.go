package dist

import (
	"errors"
	"slices"
)

// layout is one function in Go's form, cut into its parts: the
// instructions before the dispatch loop, the dispatch loop's blocks and
// br_table, each resume point's code, and the instructions after the loop.
type layout struct {
	ins      []instr
	code     []byte
	loop, bt int     // the dispatch loop's instruction, the br_table's
	pcLocal  int64   // PC_B
	table    []int64 // br_table's labels, default last: pc -> resume point
	entries  [][2]int
	loopEnd  int // the loop's end instruction
}

// readLayout cuts a function's instructions as Go writes them; ok is false
// when it has no dispatch loop or is not in that form.
func readLayout(code []byte, ins []instr) (l layout, ok bool, err error) {
	l.ins, l.code = ins, code
	l.bt = -1
	for k := 1; k < len(ins); k++ {
		if ins[k].op == opBrTable && ins[k-1].op == opLocalGet {
			l.bt = k
			break
		}
	}
	if l.bt < 0 {
		return l, false, nil
	}
	l.loop = l.bt - 2
	for l.loop >= 0 && ins[l.loop].op == opBlock {
		l.loop--
	}
	blocks := l.bt - 2 - l.loop
	if l.loop < 0 || ins[l.loop].op != opLoop || blocks == 0 {
		return l, false, nil
	}
	for k := l.loop; k < l.bt-1; k++ {
		if code[ins[k].start+1] != 0x40 {
			return l, false, nil // a block with a result: not Go's form
		}
	}
	l.pcLocal, l.table = ins[l.bt-1].imm, ins[l.bt].table
	for _, t := range l.table {
		if t >= int64(blocks) {
			return l, false, nil
		}
	}
	// The resume points' code: between the ends at the loop's level.
	depth, from := 0, -1
	for k := l.bt + 1; k < len(ins); k++ {
		switch ins[k].op {
		case opBlock, opLoop, opIf:
			depth++
		case opEnd:
			if depth > 0 {
				depth--
				continue
			}
			if from >= 0 {
				l.entries = append(l.entries, [2]int{from, k})
			}
			from = k + 1
			if len(l.entries) == blocks {
				l.loopEnd = k
				return l, true, nil
			}
		}
	}
	return l, false, errors.New("the dispatch loop is not closed")
}

// entryOf is the resume point br_table sends pc to.
func (l *layout) entryOf(pc int64) int {
	if pc >= 0 && pc < int64(len(l.table)-1) {
		return int(l.table[pc])
	}
	return int(l.table[len(l.table)-1])
}

// jumpAt tells whether ins[k] starts a jump (i32.const pc; local.set
// PC_B; br) and, if so, gives the br's label and pc.
func (l *layout) jumpAt(k int) (label, pc int64, ok bool) {
	ins := l.ins
	if k < 0 || k+2 >= len(ins) || ins[k].op != opI32Const || ins[k+1].op != opLocalSet || ins[k+1].imm != l.pcLocal || ins[k+2].op != opBr {
		return 0, 0, false
	}
	return ins[k+2].imm, ins[k].imm, true
}

// afterCall tells whether resume point j may be resumed at: the code
// before it ends with a call and the unwinding check after it, so that
// its start is a return address.
func (l *layout) afterCall(j int) bool {
	if j == 0 {
		return true // the function's entry
	}
	prev := l.entries[j-1]
	for k := prev[1] - 1; k >= prev[0]; k-- {
		switch op := l.ins[k].op; {
		case op == 0x10 || op == 0x11: // call, call_indirect
			return true
		case op == opBrIf || op == 0x23 || op == opLocalSet || op == opLocalGet || op == opI32Const || op == 0x42 || op == 0x1a:
			// the unwinding check, the stack pointer read again
		default:
			return false
		}
	}
	return false
}

// onlyJumpsToLoop tells whether every branch to the dispatch loop is a
// jump (i32.const pc; local.set PC_B; br).
func (l *layout) onlyJumpsToLoop() bool {
	n := len(l.entries)
	for j, e := range l.entries {
		local := 0
		for k := e[0]; k < e[1]; k++ {
			in := l.ins[k]
			switch in.op {
			case opBlock, opLoop, opIf:
				local++
			case opEnd:
				local--
			case opBr, opBrIf, opBrTable:
				labels := in.table
				if in.op != opBrTable {
					labels = []int64{in.imm}
				}
				for _, d := range labels {
					if int(d) == local+n-1-j {
						if _, _, ok := l.jumpAt(k - 2); !ok || in.op != opBr {
							return false
						}
					}
				}
			}
		}
	}
	return true
}

// jumpsOf lists, for each resume point, the resume points its code jumps
// to (local branches and the unwinding ones left out).
func (l *layout) jumpsOf() [][]int {
	out := make([][]int, len(l.entries))
	for j, e := range l.entries {
		depth := 0
		for k := e[0]; k < e[1]; k++ {
			switch l.ins[k].op {
			case opBlock, opLoop, opIf:
				depth++
			case opEnd:
				depth--
			}
			if label, pc, ok := l.jumpAt(k); ok && int(label) == depth+(len(l.entries)-1-j) {
				out[j] = append(out[j], l.entryOf(pc))
			}
		}
	}
	return out
}

// loopRegion is a loop of resume points first to last written as a wasm
// loop: entered at first, or (rotated) a loop of two, the body first and
// the test after it, entered at the test (Go writes a for loop so).
type loopRegion struct {
	first, last int
	rotated     bool
}

// regions picks the loops of resume points to write as wasm loops: for a
// jump back from j to e, the resume points e to j and any other jump back
// to e, when none after e is resumed at (a call's return) or jumped to from
// outside. Loops that overlap keep the shortest.
func (l *layout) regions() []loopRegion {
	jumps := l.jumpsOf()
	last := map[int]int{} // head -> the last resume point jumping back to it
	for j, ts := range jumps {
		for _, t := range ts {
			if k, seen := last[t]; t <= j && (!seen || j > k) {
				last[t] = j
			}
		}
	}
	var cands []loopRegion
	// Rotated: the body e is entered only from the test e+1, which jumps
	// back to it; the code before e does not run on into it.
	for e := 1; e+1 < len(jumps); e++ {
		c := e + 1
		if !slices.Contains(jumps[c], e) || slices.Contains(jumps[e], e) || l.afterCall(e) || !l.endsInBranch(e-1) {
			continue
		}
		ok := true
		for j, ts := range jumps {
			if j != c && slices.Contains(ts, e) {
				ok = false
			}
		}
		if ok {
			cands = append(cands, loopRegion{e, c, true})
		}
	}
	for e, k := range last {
		ok := true
		for x := e + 1; x <= k && ok; x++ {
			ok = !l.afterCall(x)
		}
		for j, ts := range jumps {
			if j >= e && j <= k {
				for _, t := range ts {
					if t <= j && t != e {
						ok = false // a jump back inside, not to the head
					}
				}
				continue
			}
			for _, t := range ts {
				if t > e && t <= k {
					ok = false
				}
			}
		}
		if ok {
			cands = append(cands, loopRegion{e, k, false})
		}
	}
	// Shortest first; keep those that do not overlap a kept one.
	for i := 1; i < len(cands); i++ {
		for j := i; j > 0 && less(cands[j], cands[j-1]); j-- {
			cands[j], cands[j-1] = cands[j-1], cands[j]
		}
	}
	var kept []loopRegion
	for _, c := range cands {
		free := true
		for _, r := range kept {
			if c.first <= r.last && r.first <= c.last {
				free = false
			}
		}
		if free {
			kept = append(kept, c)
		}
	}
	return kept
}

func less(a, b loopRegion) bool {
	if a.last-a.first != b.last-b.first {
		return a.last-a.first < b.last-b.first
	}
	if a.first != b.first {
		return a.first < b.first
	}
	return a.rotated && !b.rotated
}

// endsInBranch tells whether resume point j's code ends in a branch, a
// return or unreachable, so that it never runs on into the next.
func (l *layout) endsInBranch(j int) bool {
	e := l.entries[j]
	if e[1] == e[0] {
		return false
	}
	switch l.ins[e[1]-1].op {
	case opBr, opReturn, 0x00:
		return true
	}
	return false
}

// rewrite writes the function again: the loops of regions as wasm loops
// inside their head's dispatch block, every jump that the new blocks allow
// as a direct branch, the others round the dispatch loop; pcs of a
// resume point inside a loop lead br_table to a trap (none is resumed at,
// regions checks, so none is taken). dropSet leaves out the set of PC_B
// before a direct branch.
func (l *layout) rewrite(regs []loopRegion, dropSet bool, st *JumpStats) ([]byte, error) {
	n := len(l.entries)
	region := make([]int, n)
	for x := range region {
		region[x] = -1
	}
	for r, g := range regs {
		for x := g.first; x <= g.last; x++ {
			region[x] = r
		}
	}
	// isSlot: a resume point with a dispatch block of its own: outside the
	// loops, a loop's first, a rotated loop's test.
	isSlot := func(x int) bool {
		r := region[x]
		return r < 0 || (!regs[r].rotated && regs[r].first == x) || (regs[r].rotated && regs[r].last == x)
	}
	var slots []int
	slotOf := make([]int, n)
	for x := range n {
		if isSlot(x) {
			slots = append(slots, x)
			slotOf[x] = len(slots) - 1
		}
	}
	for x := range n {
		if r := region[x]; r >= 0 {
			slotOf[x] = slotOf[regs[r].first]
			if regs[r].rotated {
				slotOf[x] = slotOf[regs[r].last]
			}
		}
	}
	trap := 0
	if len(regs) > 0 {
		trap = 1
	}
	ins, code := l.ins, l.code
	out := append([]byte(nil), code[:ins[l.loop].start]...)
	out = append(out, opLoop, 0x40)
	for range len(slots) + trap {
		out = append(out, opBlock, 0x40)
	}
	out = append(out, opLocalGet)
	out = appendULEB(out, uint64(l.pcLocal))
	out = append(out, opBrTable)
	out = appendULEB(out, uint64(len(l.table)-1))
	for _, t := range l.table {
		label := 0 // the trap
		if isSlot(int(t)) {
			label = slotOf[t] + trap
		}
		out = appendULEB(out, uint64(label))
	}
	if trap == 1 {
		out = append(out, opEnd, 0x00) // unreachable
	}
	// inner is the number of blocks the rewrite opens between resume
	// point j's code and its slot's block: a loop's and the blocks of its
	// later resume points.
	inner := func(j int) int {
		r := region[j]
		switch {
		case r < 0:
			return 0
		case regs[r].rotated && j == regs[r].last:
			return 3 // body block, loop, exit block
		case regs[r].rotated:
			return 2 // loop, exit block
		}
		return regs[r].last - j + 1
	}
	emit := func(j int) error {
		local := 0
		toLoop := func() int { return local + inner(j) + len(slots) - 1 - slotOf[j] }
		e := l.entries[j]
		for k := e[0]; k < e[1]; k++ {
			in := ins[k]
			if label, pc, ok := l.jumpAt(k); ok && int(label) == local+n-1-j {
				t := l.entryOf(pc)
				r := region[j]
				depth := -1
				switch {
				case r >= 0 && regs[r].rotated && j == regs[r].last && t == regs[r].first:
					depth = local // the body's block
					st.Looped++
				case r >= 0 && regs[r].rotated && j == regs[r].first && t == regs[r].last:
					depth = local // the loop
					st.Direct++
				case r >= 0 && regs[r].rotated:
				case r >= 0 && t == regs[r].first:
					depth = local + regs[r].last - j // the loop
					st.Looped++
				case r >= 0 && region[t] == r && t > j:
					depth = local + t - j - 1
					st.Direct++
				}
				switch {
				case depth >= 0:
				case isSlot(t) && slotOf[t] > slotOf[j]:
					depth = local + inner(j) + slotOf[t] - slotOf[j] - 1
					st.Direct++
				}
				if depth < 0 {
					st.Round++
					out = append(out, code[in.start:ins[k+1].end]...)
					out = append(out, opBr)
					out = appendULEB(out, uint64(toLoop()))
				} else {
					if !dropSet {
						out = append(out, code[in.start:ins[k+1].end]...)
					}
					out = append(out, opBr)
					out = appendULEB(out, uint64(depth))
				}
				k += 2
				continue
			}
			switch in.op {
			case opBlock, opLoop, opIf:
				local++
			case opEnd:
				local--
			case opBr, opBrIf, opBrTable:
				labels := in.table
				if in.op != opBrTable {
					labels = []int64{in.imm}
				}
				out = append(out, in.op)
				if in.op == opBrTable {
					out = appendULEB(out, uint64(len(labels)-1))
				}
				for _, d := range labels {
					if int(d) >= local {
						o := int(d) - local - (n - 1 - j) // 0: the dispatch loop, then the blocks outside it
						if o < 0 {
							return errNotGoForm // a branch to a dispatch block

						}
						d = int64(toLoop() + o)
					}
					out = appendULEB(out, uint64(d))
				}
				continue
			}
			out = append(out, code[in.start:in.end]...)
		}
		return nil
	}
	for _, x := range slots {
		out = append(out, opEnd)
		r := region[x]
		if r < 0 {
			if err := emit(x); err != nil {
				return nil, err
			}
			continue
		}
		g := regs[r]
		if g.rotated {
			// block exit; loop; block body; test; br exit; end; body; br loop; end; end
			out = append(out, opBlock, 0x40, opLoop, 0x40, opBlock, 0x40)
			if err := emit(g.last); err != nil {
				return nil, err
			}
			out = append(out, opBr, 2, opEnd)
			if err := emit(g.first); err != nil {
				return nil, err
			}
			out = append(out, opBr, 0, opEnd, opEnd)
			continue
		}
		out = append(out, opLoop, 0x40)
		for range g.last - g.first {
			out = append(out, opBlock, 0x40)
		}
		for j := g.first; j <= g.last; j++ {
			if err := emit(j); err != nil {
				return nil, err
			}
			out = append(out, opEnd)
		}
	}
	return append(out, code[ins[l.loopEnd].start:]...), nil
}
