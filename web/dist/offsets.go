package dist

import (
	"errors"
	"math"
)

// FoldOffsets moves the constant part of a load's or a store's address
// into the instruction's offset. Go's compiler writes an access at a
// constant distance k from a pointer p (a field, an element at a
// constant index, a slot of the goroutine's stack) as
//
//	p; i64.const k; i64.add; i32.wrap_i64; [value;] <load or store> offset=o
//
// (the address an i64 sum, wrapped to the 32 bits of linear memory's
// index; for a store the value's code comes between), and this becomes
//
//	p; i32.wrap_i64; [value;] <load or store> offset=o+k
//
// The two reach the same place whenever wrap(p + k) = wrap(p) + k, that
// is when p's low 32 bits plus k do not pass 2^32: Go's pointers are
// addresses inside linear memory (at most 4 GiB; Go's js/wasm heap far
// less) and k the distance to a part of the same object or frame, so the
// sum stays in memory (nil, 0, plus k too). An access whose sum would pass
// 2^32 traps where the original reached a wrapped address; Go never forms
// such a sum. Only k from 0 to 2^31 - 1 is moved, and o+k must fit the
// offset's 32 bits (WebAssembly core specification 1.0, 4.4.7: the
// effective address is the operand plus the offset, without wrapping).
// Then an i64.extend_i32_u right before the i32.wrap_i64 that undoes it
// (Go writes it where p is the stack pointer, an i32) is left out too.
//
// The access that uses the address is found by following the operand
// stack from the i32.wrap_i64 (the store's value: locals, constants,
// loads and arithmetic); on anything else (a call, a block, a branch)
// the address is left as it is. Under V8 the add and the zero-extension
// become the load's or store's addressing mode: 2 to 6 % off most
// examples' evaluations as wasm, the rigid loads about 4 % (README).
func FoldOffsets(wasm []byte) ([]byte, FoldStats, error) {
	var st FoldStats
	if len(wasm) < 8 || string(wasm[:4]) != "\x00asm" {
		return nil, st, errors.New("offsets: not a wasm file")
	}
	out, err := rewriteSection(wasm, 10, func(sec []byte) ([]byte, error) {
		return eachBody(sec, "offsets", func(_ int, body []byte) ([]byte, error) {
			return foldFunc(body, &st)
		})
	})
	return out, st, err
}

// FoldStats counts what FoldOffsets did.
type FoldStats struct {
	Loads, Stores int // addresses folded into the offset
	Extends       int // i64.extend_i32_u and i32.wrap_i64 pairs left out
}

const (
	opI64Add       = 0x7c
	opI32WrapI64   = 0xa7
	opI64ExtendI32 = 0xad // i64.extend_i32_u
)

// foldFunc rewrites one function body, its locals declared first.
func foldFunc(body []byte, st *FoldStats) ([]byte, error) {
	fb, err := readBody(body)
	if err != nil {
		return nil, err
	}
	decls, code := fb.decls, fb.code
	ins, err := decodeInstrs(code)
	if err != nil {
		return nil, err
	}
	// drop[k]: instruction k is left out; off[k]: added to access k's offset.
	drop := make([]bool, len(ins))
	off := make(map[int]uint64)
	changed := false
	for k := 3; k < len(ins); k++ {
		if ins[k].op != opI32WrapI64 || ins[k-1].op != opI64Add || ins[k-2].op != opI64Const {
			continue
		}
		c := ins[k-2].imm
		if c < 0 || c > math.MaxInt32 {
			continue
		}
		a := accessOf(code, ins, k)
		if a < 0 || uint64(memOffset(code, ins[a]))+uint64(c)+off[a] > math.MaxUint32 {
			continue
		}
		off[a] += uint64(c)
		drop[k-2], drop[k-1], changed = true, true, true
		if ins[a].op <= 0x35 {
			st.Loads++
		} else {
			st.Stores++
		}
		if ins[k-3].op == opI64ExtendI32 {
			drop[k-3], drop[k] = true, true
			st.Extends++
		}
	}
	if !changed {
		return body, nil
	}
	nc := append([]byte(nil), decls...)
	for k, in := range ins {
		switch {
		case drop[k]:
		case off[k] != 0:
			mr := &WasmReader{B: code[in.start+1 : in.end]}
			align, o := mr.ULEB(), mr.ULEB()
			nc = append(nc, in.op)
			nc = appendULEB(nc, uint64(align))
			nc = appendULEB(nc, uint64(o)+off[k])
		default:
			nc = append(nc, code[in.start:in.end]...)
		}
	}
	return nc, nil
}

// memOffset is the offset immediate of load or store in.
func memOffset(code []byte, in instr) int {
	mr := &WasmReader{B: code[in.start+1 : in.end]}
	mr.ULEB()
	return mr.ULEB()
}

// accessOf follows the operand stack from instruction k, whose result is
// an address on top of it, to the load (at once) or store (after its
// value) that takes the address, and returns its index; -1 when another
// instruction takes it or one it does not follow comes first.
func accessOf(code []byte, ins []instr, k int) int {
	a, depth := consumer(code, ins, k)
	switch {
	case a < 0:
		return -1
	case ins[a].op >= 0x28 && ins[a].op <= 0x35 && depth == 1, // a load of the address
		ins[a].op >= 0x36 && ins[a].op <= 0x3e && depth == 2: // a store to it (its value above)
		return a
	}
	return -1
}

// consumer follows the operand stack from instruction k, whose result is
// on top of it, to the instruction that takes that value, and returns its
// index and the value's depth there (1: on top); -1 when an instruction
// stackEffect does not know (a store but the one taking it) comes first.
func consumer(code []byte, ins []instr, k int) (a, depth int) {
	depth = 1 // values on the stack from k's up
	for a = k + 1; a < len(ins); a++ {
		if op := ins[a].op; op >= 0x36 && op <= 0x3e { // a store takes two
			if depth <= 2 {
				return a, depth
			}
			return -1, 0
		}
		pop, push, ok := stackEffect(code, ins[a])
		if !ok {
			return -1, 0
		}
		if pop >= depth {
			return a, depth
		}
		depth += push - pop
	}
	return -1, 0
}

// stackEffect is how many values instruction in takes from the operand
// stack and puts on it, for the instructions with no control flow and no
// calls that Go writes between an address and its store; ok is false for
// any other.
func stackEffect(code []byte, in instr) (pop, push int, ok bool) {
	op := in.op
	switch {
	case op == opLocalGet || op == 0x23 || (op >= opI32Const && op <= 0x44): // local.get, global.get, consts
		return 0, 1, true
	case op == opLocalTee:
		return 1, 1, true
	case op >= 0x28 && op <= 0x35: // loads
		return 1, 1, true
	case op == 0x45 || op == 0x50 || (op >= 0x67 && op <= 0x69) || (op >= 0x79 && op <= 0x7b) ||
		(op >= 0x8b && op <= 0x91) || (op >= 0x99 && op <= 0x9f) || (op >= 0xa7 && op <= 0xc4):
		// eqz, clz, ctz, popcnt, float unary, conversions, sign extensions
		return 1, 1, true
	case (op >= 0x46 && op <= 0x4f) || (op >= 0x51 && op <= 0x66) || (op >= 0x6a && op <= 0x78) ||
		(op >= 0x7c && op <= 0x8a) || (op >= 0x92 && op <= 0x98) || (op >= 0xa0 && op <= 0xa6):
		// comparisons and binary arithmetic
		return 2, 1, true
	case op == 0xfc && code[in.start+1] <= 7: // trunc_sat
		return 1, 1, true
	}
	return 0, 0, false
}
