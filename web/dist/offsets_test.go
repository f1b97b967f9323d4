package dist

import (
	"bytes"
	"encoding/hex"
	"testing"
)

// Addresses folded by hand: a store whose value is a load, both at a
// pointer plus a constant; a store at a 32-bit pointer widened and wrapped
// again (the extension left out too). Left as they are: a negative
// distance, an address with an instruction FoldOffsets does not follow
// (drop) between it and its store, and an address taken by another
// instruction (i32.eqz). Both modules leave the same memory after a run.
func TestFoldOffsetsByHand(t *testing.T) {
	const (
		add, wrap, extend, eqz, drop = opI64Add, opI32WrapI64, opI64ExtendI32, 0x45, 0x1a
		load, store                  = opI64Load, opI64Store
	)
	left := []byte{
		opI64Const, 0xac, 0x02, opI64Const, 0x78, add, wrap, opI64Const, 1, store, 3, 0, // at 300 - 8
		opI64Const, 0x90, 0x03, opI64Const, 8, add, wrap, opI64Const, 5, drop, opI64Const, 9, store, 3, 0, // at 400 + 8, a drop before the store
		opI64Const, 0xf4, 0x03, opI64Const, 8, add, wrap, eqz, drop, // 500 + 8 tested for zero
		opEnd,
	}
	in := copiesModule([]byte{0}, append([]byte{
		opI64Const, 0xc8, 0x01, opI64Const, 16, add, wrap, // 200 + 16
		opI64Const, 0xe4, 0x00, opI64Const, 8, add, wrap, load, 3, 4, // the word at 100 + 8 + 4
		store, 3, 0,
		opLocalGet, 0, extend, opI64Const, 24, add, wrap, opI64Const, 7, store, 3, 0, // 7 at p + 24
	}, left...)...)
	want := copiesModule([]byte{0}, append([]byte{
		opI64Const, 0xc8, 0x01, wrap,
		opI64Const, 0xe4, 0x00, wrap, load, 3, 12,
		store, 3, 16,
		opLocalGet, 0, opI64Const, 7, store, 3, 24,
	}, left...)...)
	got, st, err := FoldOffsets(in)
	if err != nil {
		t.Fatal(err)
	}
	if st != (FoldStats{Loads: 1, Stores: 2, Extends: 1}) {
		t.Errorf("stats %+v, want a load and two stores folded, one extension left out", st)
	}
	if !bytes.Equal(got, want) {
		t.Fatalf("rewritten\n%s\nwant\n%s", hex.Dump(got), hex.Dump(want))
	}
	again, st2, err := FoldOffsets(got)
	if err != nil || !bytes.Equal(again, got) || st2 != (FoldStats{}) {
		t.Errorf("a second pass changed the file (%+v, %v)", st2, err)
	}
	sameMemoryAfterRun(t, in, got)
}

// Go's loads and stores at a constant distance are folded when packed,
// and the program runs as it did (TestDirectJumpsRunTheSame runs the
// packed program; the wasm tests run every package's tests packed).
func TestFoldOffsetsGo(t *testing.T) {
	wasm, _ := buildJumpcheck(t)
	out, st, err := FoldOffsets(wasm)
	if err != nil {
		t.Fatal(err)
	}
	if st.Loads < 1000 || st.Stores < 1000 || st.Extends < 1000 {
		t.Fatalf("only %+v: does Go still write the distance as an i64.add?", st)
	}
	if len(out) >= len(wasm) {
		t.Errorf("%d bytes became %d", len(wasm), len(out))
	}
	t.Logf("%+v", st)
}
