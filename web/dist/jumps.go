package dist

import "errors"

// DirectJumps rewrites the jumps between basic blocks of a wasm file's
// functions, in the form Go's compiler writes them, as direct branches,
// and Go's for loops as wasm loops. Every other section is copied as it
// is.
//
// Go's form (cmd/internal/obj/wasm, wasmobj.go, as of Go 1.26): a
// function whose basic blocks jump to each other holds one loop, the
// dispatch loop, and in it one block per resume point (each basic block's
// start, each return from a call); the innermost of them reads PC_B (a
// local) and br_table leaves by the block whose end the resume point's
// code follows. A jump is
//
//	i32.const pc; local.set PC_B; br <dispatch loop>
//
// so every jump, forward or back, goes round the loop and through the
// br_table. V8 then sees every function as one loop with a switch: the
// values of the whole function meet at its head, and its registers spill.
//
// Forward jumps. The code of resume point e lies inside the blocks of the
// resume points after it. So a jump to a later resume point (most of a
// function's jumps: ifs, switches, the way into a loop) can leave
// directly by e's block, which still encloses the jump: `br <e's block>`.
// This is what the loop would do: enter every block again, then leave by
// e's.
//
// Loops (layout.go). Go writes a for loop as its body, then its test,
// and enters it at the test, which jumps back to the body. Such a run of
// resume points (or one entered at its first) is written as a wasm loop
// inside the dispatch block of its entry, when nothing outside reaches it
// but at the entry and no other resume point of it is a call's return
// (where a goroutine's stack resumes). The jump back is then a branch
// inside that loop. br_table sends the pcs of its other resume points to
// a trap: nothing dispatches to them.
//
// The one state that differs is PC_B. Its set is left out of a direct
// branch only where the function reads PC_B nowhere but at the br_table
// and right after its own sets (Go's indirect jump uses it as a scratch
// register) and only jumps branch to the dispatch loop; the br_table
// reads it only after a set, since every jump that still goes round the
// loop sets it first. Elsewhere the set stays.
//
// Under node, evaluations run about 15 to 25 % faster and the page's wasm
// is about 70 kB (4.5 %) smaller gzipped (README, "The jumps of Go's wasm
// made direct"). A function not in this form (one already rewritten, say) is
// left as it is; an instruction the decoder does not know (one Go does
// not write today) is an error, so that a new Go's wasm is not rewritten
// unread.
func DirectJumps(wasm []byte) ([]byte, JumpStats, error) {
	var st JumpStats
	if len(wasm) < 8 || string(wasm[:4]) != "\x00asm" {
		return nil, st, errors.New("jumps: not a wasm file")
	}
	out, err := rewriteSection(wasm, 10, func(sec []byte) ([]byte, error) { return directCode(sec, &st) })
	return out, st, err
}

// JumpStats counts what DirectJumps did.
type JumpStats struct {
	Functions int // functions in Go's form, with a dispatch loop
	Direct    int // jumps made direct branches
	Round     int // jumps left going round the dispatch loop
	Looped    int // jumps made branches to a wasm loop or its body
	Loops     int // wasm loops made
	KeptSets  int // functions whose sets of PC_B stay (PC_B read elsewhere)
}

// directCode rewrites the code section (WebAssembly core specification,
// section 5.5.13): each function body is its locals, then its
// instructions.
func directCode(sec []byte, st *JumpStats) ([]byte, error) {
	return eachBody(sec, "jumps", func(_ int, body []byte) ([]byte, error) {
		fb, err := readBody(body)
		if err != nil {
			return nil, err
		}
		code, err := directFunc(fb.code, st)
		if err != nil {
			return nil, err
		}
		return append(fb.decls[:len(fb.decls):len(fb.decls)], code...), nil
	})
}

// directFunc rewrites one function's instructions.
func directFunc(code []byte, st *JumpStats) ([]byte, error) {
	ins, err := decodeInstrs(code)
	if err != nil {
		return nil, err
	}
	l, ok, err := readLayout(code, ins)
	if err != nil || !ok {
		return code, err
	}
	// The sets of PC_B may go where it is read only at the br_table and
	// right after sets, and where only jumps branch to the dispatch loop.
	dropSet := readsOnlyAfterSet(ins, l.bt-1, l.pcLocal) && l.onlyJumpsToLoop()
	regs := l.regions()
	fs := JumpStats{Functions: 1, Loops: len(regs)}
	if !dropSet {
		fs.KeptSets++
	}
	out, err := l.rewrite(regs, dropSet, &fs)
	if err == errNotGoForm {
		return code, nil // left as it is (a function already rewritten, say)
	}
	st.Functions += fs.Functions
	st.Direct += fs.Direct
	st.Round += fs.Round
	st.Looped += fs.Looped
	st.Loops += fs.Loops
	st.KeptSets += fs.KeptSets
	return out, err
}

// errNotGoForm stops the rewrite of a function not in Go's form.
var errNotGoForm = errors.New("not in Go's form")

// readsOnlyAfterSet tells whether every local.get of pc but the one at
// skip follows a local.set or local.tee of pc with no control instruction
// between.
func readsOnlyAfterSet(ins []instr, skip int, pc int64) bool {
	for k, in := range ins {
		if in.op != opLocalGet || in.imm != pc || k == skip {
			continue
		}
		ok := false
	back:
		for j := k - 1; j >= 0; j-- {
			switch p := ins[j]; {
			case (p.op == opLocalSet || p.op == opLocalTee) && p.imm == pc:
				ok = true
				break back
			case p.op <= opReturn: // unreachable, nop, block ... return
				break back
			}
		}
		if !ok {
			return false
		}
	}
	return true
}
