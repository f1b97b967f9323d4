package dist

import (
	"errors"
	"fmt"
)

// CopyLimit is the largest copy or clear Pack writes out, in bytes: under
// node the examples ran as fast with 128 as with 256 (and 1,024), and the
// rigid loads and the hook block 4 to 10 % slower with 64 (the 72-byte
// rotation matrices and the 104-byte constraint ends of the rigid load
// stay bulk copies); the page's wasm grows about 11, 21 and 33 kB gzipped
// with 64, 128 and 256 (README, "Copies written out").
const CopyLimit = 128

// WriteOutCopies writes Go's copies and clears of a known size, up to
// maxBytes, as loads and stores of 8-byte words.
//
// Go's compiler writes a copy of more than 16 bytes (a struct of three
// floats and more) as `dst; src; i32.const n; memory.copy`, and a clear
// of more than 32 bytes as `dst; i32.const 0; i32.const n; memory.fill`
// (cmd/compile/internal/ssa/_gen/Wasm.rules, LoweredMove and
// LoweredZero; cmd/compile/internal/wasm/ssa.go). V8 compiles both bulk
// memory instructions to a call out of the wasm code into its runtime
// (from memory: wasm-external-refs.cc), which costs much more than the
// few words moved: under node the examples ran 3 to 10 % faster with them
// written out, the rigid loads most (README). Natively the same copies
// are a few moves.
//
// A copy becomes, with two new i32 locals d and s,
//
//	local.set s; local.set d; (local.get d; local.get s; i64.load k; i64.store k) for k = 0, 8, ...
//
// and a clear, the two constants left out, `local.set d; (local.get d;
// i64.const 0; i64.store k)` over its words. Word by word from the start
// is what memory.copy does when the two do not overlap or are the same
// place, and Go's copies are one or the other: a copy whose ends may overlap in part (an array
// through a slice converted to an array pointer) Go makes a call of
// runtime.memmove on wasm (cmd/compile/internal/ssagen/ssa.go,
// moveWhichMayOverlap, with ssa.IsInlinableMemmove false on wasm).
// Bounds: a word out of linear memory traps, as memory.copy would (it
// traps before it writes; a Go program has failed either way). Sizes not
// a whole number of words, larger than maxBytes or not a constant are
// left as they are.
func WriteOutCopies(wasm []byte, maxBytes int) ([]byte, CopyStats, error) {
	var st CopyStats
	if len(wasm) < 8 || string(wasm[:4]) != "\x00asm" {
		return nil, st, errors.New("copies: not a wasm file")
	}
	params, err := funcParams(wasm)
	if err != nil {
		return nil, st, err
	}
	out, err := rewriteSection(wasm, 10, func(sec []byte) ([]byte, error) { return copiesCode(sec, params, maxBytes, &st) })
	return out, st, err
}

// CopyStats counts what WriteOutCopies did.
type CopyStats struct {
	Copies, Clears int // written out
	Left           int // memory.copy and memory.fill left as they are
}

// funcParams is the number of parameters of each function the code
// section defines, in its order (the type and function sections:
// specification 1.0, sections 5.5.4 and 5.5.6; an imported function has
// no body). A new local's index comes after the parameters and the
// declared locals.
func funcParams(wasm []byte) ([]int, error) {
	var types, params []int
	r := &WasmReader{B: wasm[8:]}
	for len(r.B) > 0 && r.Err == nil {
		id := r.Bytes(1)
		br := &WasmReader{B: r.Bytes(r.ULEB())}
		switch id[0] {
		case 1:
			for range br.ULEB() {
				if form := br.Bytes(1); br.Err == nil && form[0] != 0x60 {
					return nil, errors.New("copies: a type that is not a function type")
				}
				n := br.ULEB()
				br.Bytes(n)
				br.Bytes(br.ULEB())
				types = append(types, n)
			}
		case 3:
			for range br.ULEB() {
				t := br.ULEB()
				if t >= len(types) {
					return nil, fmt.Errorf("copies: function type %d not defined", t)
				}
				params = append(params, types[t])
			}
		}
		if br.Err != nil {
			return nil, br.Err
		}
	}
	return params, r.Err
}

// copiesCode rewrites the code section: each function body is its
// locals, then its instructions.
func copiesCode(sec []byte, params []int, maxBytes int, st *CopyStats) ([]byte, error) {
	if n := (&WasmReader{B: sec}).ULEB(); n != len(params) {
		return nil, fmt.Errorf("copies: %d function bodies for %d functions", n, len(params))
	}
	return eachBody(sec, "copies", func(i int, body []byte) ([]byte, error) {
		return copiesFunc(body, params[i], maxBytes, st)
	})
}

// copiesFunc rewrites one function body, its locals declared first.
func copiesFunc(body []byte, nParams, maxBytes int, st *CopyStats) ([]byte, error) {
	fb, err := readBody(body)
	if err != nil {
		return nil, err
	}
	groups, count, locals, decls, code := fb.groups, fb.countLen, fb.locals, fb.decls, fb.code
	ins, err := decodeInstrs(code)
	if err != nil {
		return nil, err
	}
	d, s := uint64(nParams+locals), uint64(nParams+locals+1)
	var nc []byte
	last := 0
	for k, in := range ins {
		op, size, from := bulkAt(code, ins, k, maxBytes)
		if op == 0 {
			if in.op == 0xfc && (code[in.start+1] == 10 || code[in.start+1] == 11) {
				st.Left++
			}
			continue
		}
		nc = append(nc, code[last:ins[from].start]...)
		last = in.end
		if op == copyOp {
			st.Copies++
			nc = append(nc, opLocalSet)
			nc = appendULEB(nc, s)
			nc = append(nc, opLocalSet)
			nc = appendULEB(nc, d)
			for off := 0; off < size; off += 8 {
				nc = append(nc, opLocalGet)
				nc = appendULEB(nc, d)
				nc = append(nc, opLocalGet)
				nc = appendULEB(nc, s)
				nc = append(nc, opI64Load, 3) // alignment 2^3
				nc = appendULEB(nc, uint64(off))
				nc = append(nc, opI64Store, 3)
				nc = appendULEB(nc, uint64(off))
			}
			continue
		}
		st.Clears++
		nc = append(nc, opLocalSet)
		nc = appendULEB(nc, d)
		for off := 0; off < size; off += 8 {
			nc = append(nc, opLocalGet)
			nc = appendULEB(nc, d)
			nc = append(nc, opI64Const, 0)
			nc = append(nc, opI64Store, 3)
			nc = appendULEB(nc, uint64(off))
		}
	}
	if last == 0 {
		return body, nil
	}
	nc = append(nc, code[last:]...)
	// The locals: Go's groups, then one of two i32 (d and s).
	fn := appendULEB(nil, uint64(groups+1))
	fn = append(fn, decls[count:]...)
	fn = append(fn, 2, 0x7f)
	return append(fn, nc...), nil
}

const (
	copyOp  = 10 // memory.copy: 0xfc 10
	clearOp = 11 // memory.fill: 0xfc 11
)

// bulkAt tells whether instruction k is a memory.copy or memory.fill in
// the form Go writes for a copy or a clear of a known size, a whole
// number of words up to maxBytes: `i32.const n; memory.copy`, or
// `i32.const 0; i32.const n; memory.fill`. It gives the operation, the
// size and the first instruction the rewrite replaces (op 0: none).
func bulkAt(code []byte, ins []instr, k, maxBytes int) (op byte, size, from int) {
	in := ins[k]
	if in.op != 0xfc || k < 1 || ins[k-1].op != opI32Const {
		return 0, 0, 0
	}
	size = int(ins[k-1].imm)
	if size <= 0 || size > maxBytes || size%8 != 0 {
		return 0, 0, 0
	}
	switch code[in.start+1] {
	case copyOp:
		return copyOp, size, k - 1
	case clearOp:
		if k >= 2 && ins[k-2].op == opI32Const && ins[k-2].imm == 0 {
			return clearOp, size, k - 2
		}
	}
	return 0, 0, 0
}
