package dist

import (
	"cmp"
	"slices"
)

// LocalArgs keeps a function's arguments in WebAssembly locals once read:
// every read of an argument's slot where a read of it has been met on
// every way there from the function's entry reads a new local instead,
// and the reads that stay loads from linear memory set that local too
// (local.tee) where such a read follows.
//
// Go's compiler reads an argument from its slot above the function's
// frame (SP + frame size + 8 and up: the caller wrote it there) at every
// use once its few registers are taken: the rigid load's evaluation reads
// its receiver 49 times and its point 27 times, each SP; i64.load
// offset=K, loads V8 cannot see through (the function's stores between
// them might reach the slot).
//
// An argument's slot is taken when every access to it in the function is
// a load of all its eight bytes of one type (i64 or f64): the function
// never writes it (its results, which it writes, are left as they are).
// A function is left as it is unless every use of SP is understood
// (spUses), every address of its frame given away lies below the frame's
// size (one at or above it could be an argument's: Go makes one when an
// argument's address is taken) and every call pushes a return address
// (no call passes this function's arguments on to another; readFrame
// says so with args >= 0).
//
// Why the slot cannot change while the local holds it: a callee writes
// only its own arguments and results, in this function's frame below its
// size, and the slots above it only through an address given away, which
// the rule above excludes. The stack moves (and a pointer argument into
// it is adjusted) only while the goroutine is not running: in Go's wasm
// every switch of goroutines, the stack's growth among them, unwinds the
// wasm stack, and the goroutine comes back into each function through its
// entry (the dispatch to the resume point after the call), where no local
// is set yet. The flow (flow.go) starts at the entry; a call that returns
// goes on with its locals as they were.
func LocalArgs(wasm []byte) ([]byte, ArgStats, error) {
	var st ArgStats
	out, err := rewriteFrames(wasm, "args", func(body []byte, params int, fr frameInfo, frameOf func(int64) *frameInfo) ([]byte, error) {
		return argsFunc(body, params, fr, frameOf, &st)
	})
	return out, st, err
}

// ArgStats counts what LocalArgs did.
type ArgStats struct {
	Functions int // functions with arguments kept in locals
	Slots     int // argument slots kept
	Reads     int // loads from a slot made local.get
	Tees      int // loads from a slot that also set its local
}

// spMovesKnown tells whether SP's local is set only as Go's functions set
// it: from global 0 (at the start and after each call) or moved by a
// constant (isMove). An assembler function that sets it from elsewhere
// (runtime.gogo and its kind) would move the slots spUses places.
func spMovesKnown(ins []instr, sp int64) bool {
	for k, in := range ins {
		if (in.op != opLocalSet && in.op != opLocalTee) || in.imm != sp {
			continue
		}
		if k >= 1 && ins[k-1].op == 0x23 && ins[k-1].imm == 0 {
			continue
		}
		if k >= 3 && (isMove(ins, k-3, sp, 0x6b) || isMove(ins, k-3, sp, 0x6a)) {
			continue
		}
		return false
	}
	return true
}

// argsFunc rewrites one function body (see LocalArgs).
func argsFunc(body []byte, params int, fr frameInfo, frameOf func(int64) *frameInfo, st *ArgStats) ([]byte, error) {
	if fr.sp < 0 || !fr.known || fr.args < 0 {
		return body, nil
	}
	fb, err := readBody(body)
	if err != nil {
		return nil, err
	}
	code := fb.code
	ins, err := decodeInstrs(code)
	if err != nil {
		return nil, err
	}
	if !spMovesKnown(ins, fr.sp) {
		return body, nil
	}
	uses, _, _ := spUses(code, ins, fr.sp, fr.size)
	base := fr.size + 8 // the first argument's place from the frame's start
	type slot struct {
		typ   byte
		loads []int // the loads (instruction indices)
		gets  []int // the local.get SP each takes
	}
	slots := map[int64]*slot{}
	bad := map[int64]bool{}
	for _, u := range uses {
		if u.access < 0 {
			continue
		}
		in := ins[u.access]
		k, n := u.off, int64(accessSize(in.op))
		if k+n <= base {
			continue // the frame's, or the return address
		}
		typ := slotType(in.op)
		if in.op >= 0x36 || typ == 0 || k%8 != 0 || k < base {
			for b := k - k%8; b < k+n; b += 8 {
				bad[b] = true
			}
			continue
		}
		s := slots[k]
		if s == nil {
			s = &slot{typ: typ}
			slots[k] = s
		}
		if s.typ != typ {
			bad[k] = true
		}
		s.loads = append(s.loads, u.access)
		s.gets = append(s.gets, u.at)
	}
	var keep []int64
	for k, s := range slots {
		if !bad[k] && len(s.loads) >= 2 {
			keep = append(keep, k)
		}
	}
	if len(keep) == 0 {
		return body, nil
	}
	slices.SortFunc(keep, func(a, b int64) int {
		return cmp.Or(cmp.Compare(slots[a].typ, slots[b].typ), cmp.Compare(a, b))
	})
	g, err := readFlow(ins, mayReturn(code, frameOf))
	if err != nil {
		return nil, err
	}
	// Where a load of each slot has been met on every way from the entry:
	// each load sets its slot's local on the way out (as a read of the
	// local, or as a load that sets it).
	n := len(ins)
	loadOf := map[int]int{} // load -> index in keep
	for j, k := range keep {
		for _, a := range slots[k].loads {
			loadOf[a] = j
		}
	}
	set, ok := g.setOnEveryWay(len(keep), func(k int) int {
		if j, ok := loadOf[k]; ok {
			return j
		}
		return -1
	})
	if !ok {
		return body, nil // the entry a loop's head: not Go's form
	}
	// The loads that become reads of the local, and of the others those
	// that must set it: the ones from which a read is reached before
	// another of them (liveness backwards, the reads using the local and
	// the other loads setting it afresh).
	isSet := func(a, j int) bool { return set[a][j/64]&(1<<(j%64)) != 0 }
	access := map[int][2]int{} // load -> (slot read, slot set)
	for j, k := range keep {
		for _, a := range slots[k].loads {
			if isSet(a, j) {
				access[a] = [2]int{j, -1}
			} else {
				access[a] = [2]int{-1, j}
			}
		}
	}
	live := g.liveness(len(keep), func(k int) (gen, kill int) {
		if a, ok := access[k]; ok {
			return a[0], a[1]
		}
		return -1, -1
	})
	drop := make([]bool, n)
	read := map[int]int{} // load -> the local it becomes
	tee := map[int]int{}  // load -> the local it sets as well
	used := make([]bool, len(keep))
	for j, k := range keep {
		s := slots[k]
		for i, a := range s.loads {
			if isSet(a, j) {
				drop[s.gets[i]] = true
				read[a] = j
				used[j] = true
				st.Reads++
				continue
			}
			for _, b := range g.succ[a] {
				if live[b][j/64]&(1<<(j%64)) != 0 {
					tee[a] = j
					st.Tees++
					break
				}
			}
		}
	}
	if len(read) == 0 {
		return body, nil
	}
	// A local for each slot read from one, after the parameters and the
	// declared locals, the f64 ones first (keep's order).
	local := make([]int, len(keep))
	nf, nl := 0, 0
	for j, k := range keep {
		if !used[j] {
			continue
		}
		local[j] = params + fb.locals + nl
		nl++
		if slots[k].typ == 0x7c {
			nf++
		}
	}
	st.Functions++
	st.Slots += nl
	out := declareLocals(fb, nf, nl-nf)
	for k, in := range ins {
		switch j, ok := read[k]; {
		case drop[k]:
		case ok:
			out = append(out, opLocalGet)
			out = appendULEB(out, uint64(local[j]))
		default:
			out = append(out, code[in.start:in.end]...)
			if j, ok := tee[k]; ok {
				out = append(out, opLocalTee)
				out = appendULEB(out, uint64(local[j]))
			}
		}
	}
	return out, nil
}
