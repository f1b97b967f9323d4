package dist

import (
	"bytes"
	"encoding/hex"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// copiesModule is a wasm file with one function of type (i32) -> (), the
// given locals (their groups' count first) and instructions (with their
// final end), one page of memory, and the function and the memory
// exported as "f" and "mem".
func copiesModule(locals []byte, code ...byte) []byte {
	sec := func(out []byte, id byte, body []byte) []byte {
		out = append(out, id)
		out = appendULEB(out, uint64(len(body)))
		return append(out, body...)
	}
	out := []byte("\x00asm\x01\x00\x00\x00")
	out = sec(out, 1, []byte{1, 0x60, 1, 0x7f, 0})                     // type (i32) -> ()
	out = sec(out, 3, []byte{1, 0})                                    // one function of type 0
	out = sec(out, 5, []byte{1, 0, 1})                                 // memory: min 1 page
	out = sec(out, 7, []byte{2, 1, 'f', 0, 0, 3, 'm', 'e', 'm', 2, 0}) // export f, mem
	body := append(append([]byte(nil), locals...), code...)
	return sec(out, 10, append(appendULEB([]byte{1}, uint64(len(body))), body...)) // code
}

// A copy and a clear written out by hand, and a copy of 20 bytes (not a
// whole number of words) left as it is. The function's parameter is
// local 0 and its i64 local 1, so d and s are 2 and 3.
func TestWriteOutCopiesByHand(t *testing.T) {
	oneI64 := []byte{1, 1, 0x7e}
	in := copiesModule(oneI64,
		opI32Const, 0x80, 0x01, opI32Const, 0xc8, 0x01, opI32Const, 24, 0xfc, 10, 0, 0, // copy 24 bytes from 200 to 128
		opI32Const, 0xac, 0x02, opI32Const, 0, opI32Const, 16, 0xfc, 11, 0, // clear 16 bytes at 300
		opI32Const, 0x90, 0x03, opI32Const, 0xf4, 0x03, opI32Const, 20, 0xfc, 10, 0, 0, // copy 20 bytes from 500 to 400
		opEnd,
	)
	want := copiesModule([]byte{2, 1, 0x7e, 2, 0x7f}, // the i64, then two i32
		opI32Const, 0x80, 0x01, opI32Const, 0xc8, 0x01,
		opLocalSet, 3, opLocalSet, 2,
		opLocalGet, 2, opLocalGet, 3, opI64Load, 3, 0, opI64Store, 3, 0,
		opLocalGet, 2, opLocalGet, 3, opI64Load, 3, 8, opI64Store, 3, 8,
		opLocalGet, 2, opLocalGet, 3, opI64Load, 3, 16, opI64Store, 3, 16,
		opI32Const, 0xac, 0x02,
		opLocalSet, 2,
		opLocalGet, 2, opI64Const, 0, opI64Store, 3, 0,
		opLocalGet, 2, opI64Const, 0, opI64Store, 3, 8,
		opI32Const, 0x90, 0x03, opI32Const, 0xf4, 0x03, opI32Const, 20, 0xfc, 10, 0, 0,
		opEnd,
	)
	got, st, err := WriteOutCopies(in, CopyLimit)
	if err != nil {
		t.Fatal(err)
	}
	if st != (CopyStats{Copies: 1, Clears: 1, Left: 1}) {
		t.Errorf("stats %+v, want one copy and one clear written out, one left", st)
	}
	if !bytes.Equal(got, want) {
		t.Fatalf("rewritten\n%s\nwant\n%s", hex.Dump(got), hex.Dump(want))
	}
	again, st2, err := WriteOutCopies(got, CopyLimit)
	if err != nil || !bytes.Equal(again, got) || st2.Copies+st2.Clears != 0 {
		t.Errorf("a second pass changed the file (%+v, %v)", st2, err)
	}
	sameMemoryAfterRun(t, in, got)
}

// sameMemoryAfterRun runs the function "f" of two modules (copiesModule)
// under node from the same memory and fails unless both leave the same.
func sameMemoryAfterRun(t *testing.T, in, got []byte) {
	t.Helper()
	if _, err := exec.LookPath("node"); err != nil {
		t.Fatal("node is not installed (the wasm tests need it too)")
	}
	// Both modules leave the same memory after a run from the same bytes.
	dir := t.TempDir()
	for name, w := range map[string][]byte{"in.wasm": in, "out.wasm": got} {
		if err := os.WriteFile(filepath.Join(dir, name), w, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	script := `const fs = require("fs");
const run = (f) => {
	const m = new WebAssembly.Instance(new WebAssembly.Module(fs.readFileSync(f)));
	const b = new Uint8Array(m.exports.mem.buffer);
	for (let i = 0; i < 1024; i++) b[i] = (i * 37 + 11) & 255;
	m.exports.f(0);
	return Buffer.from(b.slice(0, 1024)).toString("hex");
};
const a = run(process.argv[1]), b = run(process.argv[2]);
console.log(a === b ? "same" : "differ\n" + a + "\n" + b);`
	out, err := exec.Command("node", "-e", script, filepath.Join(dir, "in.wasm"), filepath.Join(dir, "out.wasm")).CombinedOutput()
	if err != nil || strings.TrimSpace(string(out)) != "same" {
		t.Fatalf("the memories after a run: %v\n%s", err, out)
	}
}

// A Go program's copies are written out when packed, and it runs as it
// did (TestDirectJumpsRunTheSame runs the packed program: jumpcheck
// copies and clears structs of 104 bytes and arrays of 320).
func TestWriteOutCopiesGo(t *testing.T) {
	wasm, _ := buildJumpcheck(t)
	out, st, err := WriteOutCopies(wasm, CopyLimit)
	if err != nil {
		t.Fatal(err)
	}
	if st.Copies < 50 || st.Clears < 50 || st.Left == 0 {
		t.Fatalf("only %+v: does Go still write copies as memory.copy?", st)
	}
	if bytes.Count(out, []byte{0xfc, 10, 0, 0}) >= bytes.Count(wasm, []byte{0xfc, 10, 0, 0}) {
		t.Error("no memory.copy fewer")
	}
	t.Logf("%+v", st)
}

// A function that is not a function type, or a code section that does not
// match the function section, is an error, not a guess.
func TestWriteOutCopiesBad(t *testing.T) {
	in := copiesModule([]byte{0}, opEnd)
	bad := bytes.Replace(in, []byte{1, 0x60, 1, 0x7f, 0}, []byte{1, 0x5f, 1, 0x7f, 0}, 1)
	if _, _, err := WriteOutCopies(bad, CopyLimit); err == nil {
		t.Error("a type that is not a function type was read")
	}
	noFuncs := bytes.Replace(in, []byte{3, 2, 1, 0}, []byte{3, 1, 0}, 1)
	if _, _, err := WriteOutCopies(noFuncs, CopyLimit); err == nil {
		t.Error("a code section with more bodies than functions was read")
	}
}
