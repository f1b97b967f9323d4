package dist

import (
	"bytes"
	"encoding/binary"
	"encoding/hex"
	"math"
	"testing"
)

// goFormModule is a module shaped as Go writes one: global 0 the stack
// pointer (at 2048, above the memory sameMemoryAfterRun compares), each
// function of type (i32) -> i32, f exported with the memory. bodies are
// the functions' bodies (locals, then code), f first.
func goFormModule(bodies ...[]byte) []byte { return goFormModuleAt(2048, bodies...) }

// goFormModuleAt is goFormModule with the stack pointer at sp (below 1024:
// f's arguments lie in the memory sameMemoryAfterRun fills and compares).
func goFormModuleAt(sp uint64, bodies ...[]byte) []byte {
	sec := func(out []byte, id byte, body []byte) []byte {
		out = append(out, id)
		out = appendULEB(out, uint64(len(body)))
		return append(out, body...)
	}
	out := []byte("\x00asm\x01\x00\x00\x00")
	out = sec(out, 1, []byte{1, 0x60, 1, 0x7f, 1, 0x7f}) // type (i32) -> i32
	funcs := []byte{byte(len(bodies))}
	for range bodies {
		funcs = append(funcs, 0)
	}
	out = sec(out, 3, funcs)
	out = sec(out, 5, []byte{1, 0, 1})                                              // memory: min 1 page
	out = sec(out, 6, append(appendULEB([]byte{1, 0x7f, 1, opI32Const}, sp), 0x0b)) // global 0: mutable i32 sp
	out = sec(out, 7, []byte{2, 1, 'f', 0, 0, 3, 'm', 'e', 'm', 2, 0})              // export f, mem
	code := []byte{byte(len(bodies))}
	for _, b := range bodies {
		code = appendULEB(code, uint64(len(b)))
		code = append(code, b...)
	}
	return sec(out, 10, code)
}

// The pieces of a function in Go's form for the tests by hand, SP in
// local 1: the frame made and given back (frame bytes), a call to
// function 1 as Go writes one (the return address pushed, SP read back),
// and copyTo, which copies what load reads at SP+k to address 896+at.
const byHandSP = 1

func cat(parts ...[]byte) (out []byte) {
	for _, p := range parts {
		out = append(out, p...)
	}
	return out
}

func enterFrame(size byte) []byte {
	return []byte{0x23, 0, opLocalSet, byHandSP, opLocalGet, byHandSP, opI32Const, size, 0x6b, opLocalTee, byHandSP, 0x24, 0}
}

func leaveFrame(size byte) []byte {
	return []byte{opLocalGet, byHandSP, opI32Const, size, 0x6a, opLocalTee, byHandSP, 0x24, 0, opI32Const, 0, opReturn, opEnd}
}

var callOne = []byte{
	opLocalGet, byHandSP, opI32Const, 8, 0x6b, opLocalTee, byHandSP, 0x24, 0,
	opLocalGet, byHandSP, opI64Const, 7, opI64Store, 3, 0,
	opI32Const, 0, 0x10, 1, 0x1a,
	0x23, 0, opLocalSet, byHandSP,
}

func copyTo(at byte, load, store, k byte) []byte {
	return []byte{opI32Const, 0x80 | at, 0x07, opLocalGet, byHandSP, load, 3, k, store, 3, 0} // at + 896
}

// calleeOne is function 1 of the tests by hand: it returns at once.
var calleeOne = []byte{1, 1, 0x7f, 0x23, 0, opLocalSet, byHandSP, opLocalGet, byHandSP, opI32Const, 8, 0x6a, opLocalTee, byHandSP, 0x24, 0, opI32Const, 0, opReturn, opEnd}

func f64const(v float64) []byte {
	return binary.LittleEndian.AppendUint64([]byte{0x44}, math.Float64bits(v))
}

// Slots of a 48-byte frame by hand: 16 (an f64 stored and read back) and
// 8 (an i64 likewise) become locals; 24 (read after a call that returns),
// 32 (read before it is written: what the frame held when the function
// was entered) and 40 (written as an i64, read as an f64) stay in memory.
// The callee g reads no argument, so no slot is its. Both modules leave
// the same memory below the stack after a run.
func TestLocalSpillsByHand(t *testing.T) {
	const (
		sp                = byHandSP
		getSP, setSP      = opLocalGet, opLocalSet
		f64load, f64store = opF64Load, opF64Store
	)
	enter, leave, callG, result := enterFrame(48), leaveFrame(48), callOne, copyTo
	head := []byte{1, 1, 0x7f} // one i32 local: SP
	f := func(slot16, slot8 []byte) []byte {
		return cat(head, enter,
			result(0x04, f64load, f64store, 32), // 900: slot 32 before it is written
			[]byte{getSP, sp}, f64const(3.5), []byte{f64store, 3, 32},
			[]byte{getSP, sp}, f64const(2.5), []byte{f64store, 3, 24},
			callG,
			result(0x0c, f64load, f64store, 24), // 908: slot 24 after the call
			[]byte{getSP, sp, opI64Const, 0x80, 0x80, 0x80, 0x80, 0x80, 0x80, 0x80, 0x88, 0xc0, 0x00, opI64Store, 3, 40},
			result(0x14, f64load, f64store, 40), // 916: slot 40 written as an i64
			slot16,
			slot8,
			leave)
	}
	g := calleeOne
	const l16, l8 = 2, 3 // the new locals: the f64 ones, then the i64 ones
	in := goFormModule(
		f(cat([]byte{getSP, sp}, f64const(1.5), []byte{f64store, 3, 16},
			result(0x1c, f64load, f64store, 16)), // 924: slot 16
			cat([]byte{getSP, sp, opI64Const, 77, opI64Store, 3, 8},
				result(0x24, opI64Load, opI64Store, 8))), // 932: slot 8
		g)
	want := goFormModule(
		append([]byte{3, 1, 0x7f, 1, 0x7c, 1, 0x7e}, f(cat(f64const(1.5), []byte{setSP + 0, l16},
			[]byte{opI32Const, 0x9c, 0x07, getSP, l16, f64store, 3, 0}),
			[]byte{opI64Const, 77, setSP + 0, l8, opI32Const, 0xa4, 0x07, getSP, l8, opI64Store, 3, 0})[len(head):]...),
		g)
	got, st, err := LocalSpills(in)
	if err != nil {
		t.Fatal(err)
	}
	if st != (SpillStats{Functions: 1, Slots: 2, Accesses: 4}) {
		t.Errorf("stats %+v, want two slots of one function, four accesses", st)
	}
	if !bytes.Equal(got, want) {
		t.Fatalf("rewritten\n%s\nwant\n%s", hex.Dump(got), hex.Dump(want))
	}
	sameMemoryAfterRun(t, in, got)
}

// Go's own frames: the packed test program (TestDirectJumpsRunTheSame runs
// it) has slots made locals, and a second pass finds none left to make.
func TestLocalSpillsGo(t *testing.T) {
	wasm, _ := buildJumpcheck(t)
	packed, st, err := Pack(wasm)
	if err != nil {
		t.Fatal(err)
	}
	if st.Spills.Slots < 20 || st.Spills.Functions < 10 {
		t.Fatalf("only %+v: does Go still keep floats in its frame the same way?", st.Spills)
	}
	if _, again, err := LocalSpills(packed); err != nil || again != (SpillStats{}) {
		t.Errorf("a second pass made %+v (%v)", again, err)
	}
	t.Logf("%+v", st.Spills)
}
