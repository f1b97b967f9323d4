package dist

import (
	"bytes"
	"testing"
)

// An argument's slot by hand, in a 48-byte frame entered with SP at 512:
// slot 56 (SP + 48 + 8, the first argument) read three times, before a
// call that returns, after it and inside an if, becomes a local set by the
// first read (a load and a local.tee) and read by the other two; slot 64
// (written: a result) and slot 72 (read as an i64 and as an f64) stay in
// memory. Both modules leave the same memory after a run.
func TestLocalArgsByHand(t *testing.T) {
	const (
		sp                = byHandSP
		getSP, teeSP      = opLocalGet, opLocalTee
		i64load, i64store = opI64Load, 0x37
	)
	enter, leave, callG, result := enterFrame(48), leaveFrame(48), callOne, copyTo
	// read is result's copy with the slot's local read instead.
	read := func(at byte, l byte) []byte {
		return []byte{opI32Const, 0x80 | at, 0x07, getSP, l, i64store, 3, 0}
	}
	f := func(first, second, third []byte) []byte {
		return cat(enter,
			first, // 900
			callG,
			second,                                                   // 908
			[]byte{getSP, 0, 0x45, opIf, 0x40}, third, []byte{opEnd}, // 916, when the argument is 0 (sameMemoryAfterRun's call)
			[]byte{getSP, sp, opI64Const, 5, i64store, 3, 64}, // slot 64: a result
			result(0x1c, i64load, i64store, 64),               // 924
			result(0x24, i64load, i64store, 72),               // 932
			result(0x2c, opF64Load, opF64Store, 72),           // 940
			leave)
	}
	g := calleeOne
	const l56 = 2 // the new local, after the parameter and SP
	in := goFormModuleAt(512, cat([]byte{1, 1, 0x7f}, f(
		result(0x04, i64load, i64store, 56),
		result(0x0c, i64load, i64store, 56),
		result(0x14, i64load, i64store, 56))), g)
	tee := cat(result(0x04, i64load, i64store, 56)[:8], []byte{teeSP, l56}, result(0, i64load, i64store, 0)[8:])
	want := goFormModuleAt(512, cat([]byte{2, 1, 0x7f, 1, 0x7e}, f(tee, read(0x0c, l56), read(0x14, l56))), g)
	got, st, err := LocalArgs(in)
	if err != nil {
		t.Fatal(err)
	}
	if st != (ArgStats{Functions: 1, Slots: 1, Reads: 2, Tees: 1}) {
		t.Errorf("stats %+v, want one slot of one function, read twice from its local, set once", st)
	}
	if !bytes.Equal(got, want) {
		t.Fatalf("rewritten\n%x\nwant\n%x", got, want)
	}
	sameMemoryAfterRun(t, in, got)
}

// Go's own functions: the packed test program (TestDirectJumpsRunTheSame
// runs it) reads arguments from locals, and a second pass finds nothing
// more to read so.
func TestLocalArgsGo(t *testing.T) {
	wasm, _ := buildJumpcheck(t)
	packed, st, err := Pack(wasm)
	if err != nil {
		t.Fatal(err)
	}
	if st.Args.Reads < 100 || st.Args.Functions < 20 {
		t.Fatalf("only %+v: does Go still read its arguments from the stack at each use?", st.Args)
	}
	if _, again, err := LocalArgs(packed); err != nil || again.Reads != 0 {
		t.Errorf("a second pass made %+v (%v)", again, err)
	}
	t.Logf("%+v", st.Args)
}
