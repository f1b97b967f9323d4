package dist

import (
	"cmp"
	"errors"
	"math"
	"slices"
)

// LocalSpills keeps the slots of a function's stack frame whose values
// never wait there across a call in WebAssembly locals instead of linear
// memory.
//
// Go's compiler gives a wasm function 16 integer and 16 float registers
// (its locals); a value beyond those, or one live across a call, goes to
// a slot of the function's frame on the goroutine's stack, in linear
// memory: SP; <value>; f64.store offset=K, later SP; f64.load offset=K,
// with SP a local holding the stack pointer. Across a call that is
// needed: a goroutine that stops inside the call unwinds the wasm stack
// (its locals are lost) and later calls the function again at the
// resume point after the call, where everything comes from the frame.
// Between calls it is not: under V8 a local is a register or a slot of
// its own frame, while a store and a load of linear memory stay two
// memory accesses the compiler cannot see through. The rigid loads'
// largest functions keep a score of floats in their frames this way (2.5
// to 4.5 % of their evaluations under node, README).
//
// A slot at offset K (from the frame's start) becomes a local when:
//   - the function is in Go's form and every use of SP is understood: a
//     load or a store at a constant offset, a move of SP by a constant,
//     a comparison (the stack check), or an address of the frame formed
//     from it; K lies below the lowest such address (an object whose
//     address is given away reaches only upwards from it);
//   - K is inside the frame and above every callee's arguments and
//     results (a callee reads and writes those in its caller's frame from
//     offset 0 up, as far as its own code reaches above its frame). For a
//     callee that does not say (called through a table, an import, one
//     that passes its arguments on to another function without a return
//     address of its own) every slot written since the last call that
//     returns is taken as its argument: Go writes a call's arguments
//     after the calls before it;
//   - every access to the slot's eight bytes is an f64 (or every one an
//     i64) load or store at K exactly;
//   - it is live (read later, on some way, before being written) neither
//     where the function starts nor right after a call that may return
//     (flow.go): a goroutine comes back into the function only through
//     its start (the dispatch to the resume point after the call), and
//     garbage collection and stack growth look at a frame only at calls,
//     where no such slot holds anything. A call to a function with no
//     return in Go's form (a panic) ends the way.
//
// The return addresses, the arguments and every other slot stay as Go
// wrote them.
func LocalSpills(wasm []byte) ([]byte, SpillStats, error) {
	var st SpillStats
	out, err := rewriteFrames(wasm, "spills", func(body []byte, params int, fr frameInfo, frameOf func(int64) *frameInfo) ([]byte, error) {
		return spillFunc(body, params, fr, frameOf, &st)
	})
	return out, st, err
}

// rewriteFrames is LocalSpills' and LocalArgs' way through a wasm file:
// a first reading of each defined function's frame (readFrame: how far
// above its frame it reads and writes, its arguments and results), then
// f on each body with its count of parameters, its frame and frameOf,
// the frame of a function by its index (nil for an import). pass names
// the pass in errors.
func rewriteFrames(wasm []byte, pass string, f func(body []byte, params int, fr frameInfo, frameOf func(int64) *frameInfo) ([]byte, error)) ([]byte, error) {
	if len(wasm) < 8 || string(wasm[:4]) != "\x00asm" {
		return nil, errors.New(pass + ": not a wasm file")
	}
	imports, err := FuncImports(wasm)
	if err != nil {
		return nil, err
	}
	params, err := funcParams(wasm)
	if err != nil {
		return nil, err
	}
	var frames []frameInfo
	if _, err := rewriteSection(wasm, 10, func(sec []byte) ([]byte, error) {
		return eachBody(sec, pass, func(_ int, body []byte) ([]byte, error) {
			fb, err := readBody(body)
			if err != nil {
				return nil, err
			}
			ins, err := decodeInstrs(fb.code)
			if err != nil {
				return nil, err
			}
			frames = append(frames, readFrame(fb.code, ins))
			return body, nil
		})
	}); err != nil {
		return nil, err
	}
	frameOf := func(fn int64) *frameInfo {
		if fn < int64(imports) || fn-int64(imports) >= int64(len(frames)) {
			return nil
		}
		return &frames[fn-int64(imports)]
	}
	return rewriteSection(wasm, 10, func(sec []byte) ([]byte, error) {
		return eachBody(sec, pass, func(i int, body []byte) ([]byte, error) {
			if i >= len(params) {
				return nil, errors.New("more bodies than functions")
			}
			return f(body, params[i], frames[i], frameOf)
		})
	})
}

// declareLocals is a body's local declarations with nf new f64 locals
// and ni new i64 ones added after the declared ones (fb's).
func declareLocals(fb funcBody, nf, ni int) []byte {
	groups := fb.groups
	for _, n := range []int{nf, ni} {
		if n > 0 {
			groups++
		}
	}
	out := appendULEB(nil, uint64(groups))
	out = append(out, fb.decls[fb.countLen:]...)
	if nf > 0 {
		out = appendULEB(out, uint64(nf))
		out = append(out, 0x7c)
	}
	if ni > 0 {
		out = appendULEB(out, uint64(ni))
		out = append(out, 0x7e)
	}
	return out
}

// SpillStats counts what LocalSpills did.
type SpillStats struct {
	Functions int // functions with slots made locals
	Slots     int // slots made locals
	Accesses  int // loads and stores made local.get and local.set
}

// frameInfo is what LocalSpills reads of a function's frame.
type frameInfo struct {
	sp       int64 // the local holding SP; -1: not in Go's form
	size     int64 // the frame's size (what the function takes off SP)
	args     int   // bytes of arguments and results it reaches above its frame; -1: unknown
	noReturn bool  // in Go's form with no return: it leaves only by unwinding (a panic's way)
	known    bool  // SP is only used for accesses, moves, comparisons and addresses of the frame
	lowest   int64 // the lowest offset of an address of the frame formed from SP (math.MaxInt64: none)
}

// spUse is one use of SP: the access that takes it as its address, or
// -1 for a move or a comparison; off is the access's place from the
// frame's start (its offset, and where SP stands: above the frame before
// it is made, 8 below while a return address is pushed).
type spUse struct {
	at, access int
	off        int64
}

// readFrame finds the SP local (Go's functions start with global.get 0;
// local.set SP), the frame's size (the constant taken off SP that is not
// the 8 bytes of a return address) and every use of SP.
func readFrame(code []byte, ins []instr) frameInfo {
	f := frameInfo{sp: -1, args: -1}
	// Go's functions end: the dispatch loop; unreachable; end; i32.const
	// 1 (the unwinding's way out); end.
	n := len(ins)
	f.noReturn = n >= 4 && ins[n-4].op == 0x00 && ins[n-3].op == opEnd && ins[n-2].op == opI32Const &&
		ins[n-2].imm == 1 && ins[n-1].op == opEnd && !slices.ContainsFunc(ins, func(in instr) bool { return in.op == opReturn })
	if len(ins) < 2 || ins[0].op != 0x23 || ins[0].imm != 0 || ins[1].op != opLocalSet {
		return f
	}
	f.sp = ins[1].imm
	for k := 0; k+4 < len(ins); k++ {
		if isMove(ins, k, f.sp, 0x6b) && ins[k+1].imm != 8 {
			if f.size != 0 && f.size != ins[k+1].imm {
				f.sp = -1 // two frame sizes: not the form this reads
				return f
			}
			f.size = ins[k+1].imm
		}
	}
	uses, escapes, ok := spUses(code, ins, f.sp, f.size)
	f.known, f.lowest = ok, math.MaxInt64
	for _, c := range escapes {
		f.lowest = min(f.lowest, c)
	}
	if !ok {
		return f
	}
	// A call without a return address of its own (Go's jump to another
	// function: SP as it is, the caller's arguments passed on) lets the
	// other function read this one's arguments: how far is not known.
	for k, in := range ins {
		if (in.op == 0x10 || in.op == 0x11) && !pushed(code, ins, k, f.sp) {
			return f
		}
	}
	// Arguments and results: at SP + size + 8 (after the return address)
	// and up, as the function sees SP once its frame is made. An address
	// of the frame given away (of a variable kept on the stack) is one of
	// the frame's own objects, below its size; one at or above it could
	// be an argument's, to be read at any distance.
	for _, c := range escapes {
		if c < 0 || c >= f.size {
			return f
		}
	}
	top := 0
	for _, u := range uses {
		if u.access < 0 {
			continue
		}
		k := u.off + int64(accessSize(ins[u.access].op))
		if base := f.size + 8; k > base && int(k-base) > top {
			top = int(k - base)
		}
	}
	f.args = top
	return f
}

// pushed tells whether the call at k has its return address stored just
// before it (local.get SP; i64.const; i64.store, within the few
// instructions Go writes between that and the call).
func pushed(code []byte, ins []instr, k int, sp int64) bool {
	for j := k - 1; j >= 2 && j >= k-12; j-- {
		switch op := ins[j].op; {
		case op == opI64Store:
			return ins[j-1].op == opI64Const && ins[j-2].op == opLocalGet && ins[j-2].imm == sp && memOffset(code, ins[j]) == 0
		case op == 0x10 || op == 0x11 || op == opBr || op == opBrIf || op == opBrTable || op == opEnd || op == opReturn:
			return false
		}
	}
	return false
}

// isMove tells whether ins[k:] is local.get SP; i32.const c; op (i32.sub
// 0x6b or i32.add 0x6a); local.tee SP or local.set SP.
func isMove(ins []instr, k int, sp int64, op byte) bool {
	return k+3 < len(ins) && ins[k].op == opLocalGet && ins[k].imm == sp && ins[k+1].op == opI32Const && ins[k+2].op == op &&
		(ins[k+3].op == opLocalTee || ins[k+3].op == opLocalSet) && ins[k+3].imm == sp
}

// spUses lists the uses of SP and the places (from the frame's start) of
// the frame's addresses formed from it (SP; i64.extend_i32_u; [i64.const
// c; i64.add]) and taken elsewhere; ok is false when SP is taken in any
// other way. Where SP stands is followed in the order of the code, as Go
// moves it: size above the frame from the function's start until the
// frame is made, 8 lower from a call's push of its return address until
// SP is read back after the call, size (and 8) higher again on the way
// out; after a branch, a return or unreachable the code that follows is
// entered with the frame made (a resume point, or a branch's target).
func spUses(code []byte, ins []instr, sp, size int64) (uses []spUse, escapes []int64, ok bool) {
	shift, pushedAt := size, size
	for k := 2; k < len(ins); k++ {
		switch in := ins[k]; {
		case in.op == opBr || in.op == opBrTable || in.op == opReturn || in.op == 0x00:
			shift = 0
			continue
		case in.op == opLocalSet && in.imm == sp && ins[k-1].op == 0x23 && ins[k-1].imm == 0:
			shift = pushedAt // SP read back after a call
			continue
		case in.op != opLocalGet || in.imm != sp:
			continue
		}
		switch {
		case isMove(ins, k, sp, 0x6b):
			if c := ins[k+1].imm; c == size && size != 8 {
				shift = 0
			} else {
				pushedAt, shift = shift, shift-c
			}
			uses = append(uses, spUse{k, -1, 0})
			continue
		case isMove(ins, k, sp, 0x6a):
			shift += ins[k+1].imm
			uses = append(uses, spUse{k, -1, 0})
			continue
		}
		if a := accessOf(code, ins, k); a >= 0 {
			uses = append(uses, spUse{k, a, int64(memOffset(code, ins[a])) + shift})
			continue
		}
		// global.set SP, or the stack check's comparison.
		if c, _ := consumer(code, ins, k); k+1 < len(ins) && ins[k+1].op == 0x24 || c >= 0 && ins[c].op >= 0x46 && ins[c].op <= 0x4f {
			uses = append(uses, spUse{k, -1, 0})
			continue
		}
		if k+1 < len(ins) && ins[k+1].op == opI64ExtendI32 {
			c := int64(0)
			if k+3 < len(ins) && ins[k+2].op == opI64Const && ins[k+3].op == opI64Add {
				c = ins[k+2].imm
			}
			escapes = append(escapes, c+shift)
			continue
		}
		return uses, escapes, false
	}
	return uses, escapes, true
}

// accessSize is the bytes a load or store reaches.
func accessSize(op byte) int {
	switch op {
	case 0x28, 0x2a, 0x34, 0x35, 0x36, 0x38, 0x3e: // i32, f32, i64 32-bit loads and stores
		return 4
	case 0x2c, 0x2d, 0x30, 0x31, 0x3a, 0x3c: // 8-bit
		return 1
	case 0x2e, 0x2f, 0x32, 0x33, 0x3b, 0x3d: // 16-bit
		return 2
	}
	return 8
}

const (
	opF64Load  = 0x2b
	opF64Store = 0x39
)

// spillFunc rewrites one function body (see LocalSpills).
func spillFunc(body []byte, params int, fr frameInfo, frameOf func(int64) *frameInfo, st *SpillStats) ([]byte, error) {
	if fr.sp < 0 || !fr.known || fr.size <= 8 {
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
	uses, _, _ := spUses(code, ins, fr.sp, fr.size)
	// The frame's slots and their accesses.
	type slot struct {
		typ           byte // 0x7c f64, 0x7e i64
		loads, stores []int
	}
	slots := map[int64]*slot{}
	bad := map[int64]bool{}
	stored := map[int]int64{} // store -> the slot it writes
	for _, u := range uses {
		if u.access < 0 {
			continue
		}
		in := ins[u.access]
		k, n := u.off, int64(accessSize(in.op))
		if k < 0 || k >= fr.size {
			continue // not the frame's: a return address, an argument
		}
		if in.op >= 0x36 {
			stored[u.access] = k - k%8
		}
		if typ := slotType(in.op); typ != 0 && k%8 == 0 {
			s := slots[k]
			if s == nil {
				s = &slot{typ: typ}
				slots[k] = s
			}
			if s.typ != typ {
				bad[k] = true
			}
			if in.op <= 0x35 {
				s.loads = append(s.loads, u.access)
			} else {
				s.stores = append(s.stores, u.access)
			}
			continue
		}
		for b := k - k%8; b < k+n; b += 8 {
			bad[b] = true
		}
	}
	// Callees' arguments: the frame's slots from 0 to low are theirs (a
	// callee in Go's form reads them above its own frame). A call before
	// the frame is made (runtime.morestack's, in the stack check) reaches
	// none of them. For a callee that does not say (through a table, an
	// import, one in the assembler's form) every slot written since the
	// last call that returns is taken as its argument: Go writes a call's
	// arguments after the calls before it.
	returns := mayReturn(code, frameOf)
	alloc := 0
	for k := 0; k+4 < len(ins); k++ {
		if isMove(ins, k, fr.sp, 0x6b) && ins[k+1].imm == fr.size {
			alloc = k
			break
		}
	}
	low, last := 0, alloc
	for k := alloc; k < len(ins); k++ {
		in := ins[k]
		if in.op != 0x10 && in.op != 0x11 {
			continue
		}
		var c *frameInfo
		if in.op == 0x10 {
			c = frameOf(callee(code, in))
		}
		if c != nil && c.args >= 0 {
			low = max(low, c.args)
		} else {
			for j := last; j < k; j++ {
				if b, ok := stored[j]; ok {
					bad[b] = true
				}
			}
		}
		if returns(in) {
			last = k
		}
	}
	// The candidates: inside the frame, above the callees' arguments,
	// every access a whole f64 (or every one a whole i64) at the slot's
	// start.
	var cands []int64
	for k := range slots {
		if !bad[k] && k >= int64(low) && k+8 <= min(fr.size, fr.lowest) {
			cands = append(cands, k)
		}
	}
	slices.Sort(cands)
	if len(cands) == 0 {
		return body, nil
	}
	// A call to a function that never returns ends the way: nothing after
	// it runs (a goroutine comes back into this function only at the
	// resume point of a call that returns, through the function's entry).
	g, err := readFlow(ins, returns)
	if err != nil {
		return nil, err
	}
	index := map[int]int{} // access -> candidate
	for j, k := range cands {
		for _, a := range slots[k].loads {
			index[a] = j
		}
		for _, a := range slots[k].stores {
			index[a] = -1 - j
		}
	}
	live := g.liveness(len(cands), func(k int) (gen, kill int) {
		j, ok := index[k]
		switch {
		case !ok:
			return -1, -1
		case j >= 0:
			return j, -1
		}
		return -1, -1 - j
	})
	var keep []int64
	for j, k := range cands {
		if !g.liveAtEntryOrCall(live, j) {
			keep = append(keep, k)
		}
	}
	if len(keep) == 0 {
		return body, nil
	}
	// The rewrite: the new locals after the parameters and the declared
	// ones, the f64 ones first.
	slices.SortFunc(keep, func(a, b int64) int {
		return cmp.Or(cmp.Compare(slots[a].typ, slots[b].typ), cmp.Compare(a, b))
	})
	local := map[int64]int{}
	nf := 0
	for j, k := range keep {
		local[k] = params + fb.locals + j
		if slots[k].typ == 0x7c {
			nf++
		}
	}
	drop := make([]bool, len(ins))
	repl := map[int]int{} // access -> the local it reads or writes
	for _, u := range uses {
		if u.access < 0 || slotType(ins[u.access].op) == 0 {
			continue
		}
		if l, ok := local[u.off]; ok {
			drop[u.at] = true
			repl[u.access] = l
			st.Accesses++
		}
	}
	st.Functions++
	st.Slots += len(keep)
	out := declareLocals(fb, nf, len(keep)-nf)
	for k, in := range ins {
		if drop[k] {
			continue
		}
		if l, ok := repl[k]; ok {
			op := byte(opLocalGet)
			if in.op >= 0x36 {
				op = opLocalSet
			}
			out = append(out, op)
			out = appendULEB(out, uint64(l))
			continue
		}
		out = append(out, code[in.start:in.end]...)
	}
	return out, nil
}

// slotType is the type of the local a load or store of a whole slot
// becomes: f64 (0x7c) for f64.load and f64.store, i64 (0x7e) for i64.load
// and i64.store; 0 for any other access.
func slotType(op byte) byte {
	switch op {
	case opF64Load, opF64Store:
		return 0x7c
	case opI64Load, opI64Store:
		return 0x7e
	}
	return 0
}

// mayReturn tells of a call in code whether it may return: always
// through a table (call_indirect), else unless the callee is in Go's form
// with no return (a panic's way; frameOf gives the callee's frame).
func mayReturn(code []byte, frameOf func(int64) *frameInfo) func(instr) bool {
	return func(in instr) bool {
		if in.op == 0x11 {
			return true
		}
		c := frameOf(callee(code, in))
		return c == nil || !c.noReturn
	}
}

// callee is the function a call instruction calls.
func callee(code []byte, in instr) int64 {
	r := &WasmReader{B: code[in.start+1 : in.end]}
	return int64(r.ULEB())
}

// FuncImports counts the functions a wasm file imports (the import
// section, 5.5.5): the defined functions' indices come after them.
func FuncImports(wasm []byte) (int, error) {
	n := 0
	r := &WasmReader{B: wasm[8:]}
	for len(r.B) > 0 {
		id := r.Bytes(1)
		body := r.Bytes(r.ULEB())
		if r.Err != nil {
			return 0, r.Err
		}
		if id[0] != 2 {
			continue
		}
		ir := &WasmReader{B: body}
		for range ir.ULEB() {
			ir.Bytes(ir.ULEB()) // module
			ir.Bytes(ir.ULEB()) // name
			kind := ir.Bytes(1)
			if ir.Err != nil {
				return 0, ir.Err
			}
			switch kind[0] {
			case 0: // function: type index
				ir.ULEB()
				n++
			case 1: // table: type, limits
				ir.Bytes(1)
				readLimits(ir)
			case 2: // memory: limits
				readLimits(ir)
			case 3: // global: type, mutability
				ir.Bytes(2)
			}
		}
		if ir.Err != nil {
			return 0, ir.Err
		}
	}
	return n, nil
}

func readLimits(r *WasmReader) {
	if flag := r.Bytes(1); len(flag) == 1 && flag[0]&1 == 1 { // a maximum follows
		r.ULEB()
	}
	r.ULEB()
}
