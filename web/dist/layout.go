package dist

import (
	"cmp"
	"errors"
	"slices"
)

// layout is one function in Go's form, cut into its parts: the
// instructions before the dispatch loop, the dispatch loop's blocks and
// br_table, each resume point's code, and the instructions after the loop.
type layout struct {
	ins      []instr
	code     []byte
	loop, bt int      // the dispatch loop's instruction, the br_table's
	pcLocal  int64    // PC_B
	table    []int64  // br_table's labels, default last: pc -> resume point
	entries  [][2]int // each resume point's code: its first instruction and the end after its last
	loopEnd  int      // the dispatch loop's end
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
			local += in.nesting()
			switch in.op {
			case opBr, opBrIf, opBrTable:
				for _, d := range in.labels() {
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
			depth += l.ins[k].nesting()
			if label, pc, ok := l.jumpAt(k); ok && int(label) == depth+(len(l.entries)-1-j) {
				out[j] = append(out[j], l.entryOf(pc))
			}
		}
	}
	return out
}

// loopRegion is a loop of resume points first to last, written as a wasm
// loop, entered at entry: Go writes a for loop as its body first, then
// its test, and enters it at the test. The test part (entry to last) is
// written first, inside a block whose end leads to the body part (first
// to entry-1); the body part runs on into the loop's head:
//
//	block exit; loop; block body
//	  the test part, each resume point after the first in its block; br exit
//	end
//	the body part, each resume point after the first in its block; br loop
//	end; end
//
// A jump to first is a branch to the body's block, a jump to entry one to
// the loop. A loop entered at its first (entry = first) has an empty body
// part.
type loopRegion struct {
	first, entry, last int
}

// regions picks the loops to write as wasm loops. A jump back from j to
// e makes the candidate e to the last resume point jumping back to e. It
// is kept when the code outside reaches it at one resume point only (the
// entry: by jumps, or by running on from e-1 into e), none inside but the
// entry is a call's return (where a goroutine's stack resumes), and its
// own jumps go where the layout above can branch: from the test part to
// first, to entry, forward in the test part, or out; from the body part
// forward in the body part, to entry, or out. Of loops that overlap, the
// shortest is kept.
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
	for e, k := range last {
		if g, ok := l.region(jumps, e, k); ok {
			cands = append(cands, g)
		}
	}
	// Shortest first (then the earliest: one order whatever the map's);
	// keep those that do not overlap a kept one.
	slices.SortFunc(cands, func(a, b loopRegion) int {
		return cmp.Or(cmp.Compare(a.last-a.first, b.last-b.first), cmp.Compare(a.first, b.first))
	})
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

// region checks the candidate loop e to k (see regions).
func (l *layout) region(jumps [][]int, e, k int) (loopRegion, bool) {
	g := loopRegion{first: e, entry: -1, last: k}
	enter := func(x int) bool {
		if g.entry >= 0 && g.entry != x {
			return false
		}
		g.entry = x
		return true
	}
	if e == 0 || !l.endsInBranch(e-1) {
		enter(e)
	}
	for j, ts := range jumps {
		for _, t := range ts {
			if (j < e || j > k) && t >= e && t <= k && !enter(t) {
				return g, false
			}
		}
	}
	if g.entry < 0 {
		g.entry = e
	}
	p := g.entry
	for x := e; x <= k; x++ {
		if x != p && l.afterCall(x) {
			return g, false
		}
	}
	for j := e; j <= k; j++ {
		for _, t := range jumps[j] {
			switch {
			case t < e || t > k, t == p:
			case j >= p && (t == e || t > j): // the test part: to first, or forward in it
			case j < p && t > j && t < p: // the body part: forward in it
			default:
				return g, false
			}
		}
	}
	return g, true
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

// rewrite writes the function again: the loops of regs as wasm loops
// inside their entry's dispatch block, every jump that the new blocks
// allow as a direct branch, the others round the dispatch loop; the pcs of
// a loop's resume points but its entry lead br_table to a trap (none is
// resumed at or jumped to from outside, regions checks, so none is
// taken). dropSet leaves out the set of PC_B before a direct branch.
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
	// A slot is a resume point with a dispatch block of its own: outside
	// the loops, or a loop's entry.
	isSlot := func(x int) bool { return region[x] < 0 || regs[region[x]].entry == x }
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
			slotOf[x] = slotOf[regs[r].entry]
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
	// point j's code and its slot's block.
	inner := func(j int) int {
		r := region[j]
		if r < 0 {
			return 0
		}
		if g := regs[r]; j >= g.entry {
			return g.last - j + 3 // the test part's later blocks, the body's block, the loop, exit
		}
		return regs[r].entry - 1 - j + 2 // the body part's later blocks, the loop, exit
	}
	// direct is the depth of a direct branch from j's code (at local
	// depth 0) to resume point t, or -1.
	direct := func(j, t int) int {
		if r := region[j]; r >= 0 && region[t] == r {
			g := regs[r]
			switch {
			case j >= g.entry && t == g.first && t != g.entry:
				st.Looped++
				return g.last - j // the body's block
			case t == g.entry:
				st.Looped++
				return inner(j) - 2 // the loop
			case t > j && (j >= g.entry || t < g.entry):
				st.Direct++
				return t - j - 1
			}
			return -1
		}
		if isSlot(t) && slotOf[t] > slotOf[j] {
			st.Direct++
			return inner(j) + slotOf[t] - slotOf[j] - 1
		}
		return -1
	}
	emit := func(j int) error {
		local := 0
		toLoop := func() int { return local + inner(j) + len(slots) - 1 - slotOf[j] }
		e := l.entries[j]
		for k := e[0]; k < e[1]; k++ {
			in := ins[k]
			if label, pc, ok := l.jumpAt(k); ok && int(label) == local+n-1-j {
				if d := direct(j, l.entryOf(pc)); d >= 0 {
					if !dropSet {
						out = append(out, code[in.start:ins[k+1].end]...)
					}
					out = append(out, opBr)
					out = appendULEB(out, uint64(local+d))
				} else {
					st.Round++
					out = append(out, code[in.start:ins[k+1].end]...)
					out = append(out, opBr)
					out = appendULEB(out, uint64(toLoop()))
				}
				k += 2
				continue
			}
			local += in.nesting()
			switch in.op {
			case opBr, opBrIf, opBrTable:
				labels := in.labels()
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
	// part writes resume points from to to, each after the first in its
	// own block.
	part := func(from, to int) error {
		for range to - from {
			out = append(out, opBlock, 0x40)
		}
		for j := from; j <= to; j++ {
			if err := emit(j); err != nil {
				return err
			}
			if j < to {
				out = append(out, opEnd)
			}
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
		out = append(out, opBlock, 0x40, opLoop, 0x40, opBlock, 0x40)
		if err := part(g.entry, g.last); err != nil {
			return nil, err
		}
		out = append(out, opBr, 2, opEnd)
		if g.entry > g.first {
			if err := part(g.first, g.entry-1); err != nil {
				return nil, err
			}
		}
		out = append(out, opBr, 0, opEnd, opEnd)
	}
	return append(out, code[ins[l.loopEnd].start:]...), nil
}
