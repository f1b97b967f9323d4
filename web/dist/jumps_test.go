package dist

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
)

// buildJumpcheck builds testdata/jumpcheck for js/wasm as go build writes it.
func buildJumpcheck(t *testing.T) (wasm []byte, dir string) {
	t.Helper()
	dir = t.TempDir()
	f := filepath.Join(dir, "jumpcheck.wasm")
	cmd := exec.Command("go", "build", "-o", f, ".")
	cmd.Dir = filepath.Join("testdata", "jumpcheck")
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("building testdata/jumpcheck: %v\n%s", err, out)
	}
	wasm, err := os.ReadFile(f)
	if err != nil {
		t.Fatal(err)
	}
	return wasm, dir
}

// A Go program packed runs as it did: the same output, its panics' lines
// included. The wasm tests (make test-wasm) and the browser tests run
// packed code too.
func TestDirectJumpsRunTheSame(t *testing.T) {
	if _, err := exec.LookPath("node"); err != nil {
		t.Fatal("node is not installed (the wasm tests need it too)")
	}
	wasm, dir := buildJumpcheck(t)
	packed, st, err := Pack(wasm)
	if err != nil {
		t.Fatal(err)
	}
	if st.Direct < 1000 || st.Functions < 100 {
		t.Fatalf("only %+v: is the wasm still in Go's form?", st)
	}
	run := func(name string, w []byte) string {
		f := filepath.Join(dir, name)
		if err := os.WriteFile(f, w, 0o755); err != nil {
			t.Fatal(err)
		}
		out, err := exec.Command(filepath.Join(runtime.GOROOT(), "lib", "wasm", "go_js_wasm_exec"), f).CombinedOutput()
		if err != nil {
			t.Fatalf("%s: %v\n%s", name, err, out)
		}
		return string(out)
	}
	want, got := run("plain.wasm", wasm), run("packed.wasm", packed)
	if got != want {
		t.Fatalf("packed, the program printed\n%s\nwhere go build's wasm printed\n%s", got, want)
	}
	for _, s := range []string{"collatz 215015", "from main.risky:", "pipeline [0 1 4 9", "deferred last"} {
		if !strings.Contains(want, s) {
			t.Errorf("the output lacks %q:\n%s", s, want)
		}
	}
	t.Logf("%+v; %d -> %d bytes", st, len(wasm), len(packed))
}

// A second pass changes nothing: the functions rewritten branch to
// dispatch blocks, which Go's form never does, and are left as they are;
// the others have nothing to rewrite.
func TestDirectJumpsOnce(t *testing.T) {
	wasm, _ := buildJumpcheck(t)
	once, st1, err := DirectJumps(wasm)
	if err != nil {
		t.Fatal(err)
	}
	twice, st2, err := DirectJumps(once)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(once, twice) || st2.Direct != 0 || st2.Looped != 0 || st2.Loops != 0 {
		t.Fatalf("a second pass changed the file: %+v then %+v", st1, st2)
	}
	if st1.KeptSets != 0 {
		t.Errorf("%d functions read PC_B elsewhere: Go's form has changed (%+v)", st1.KeptSets, st1)
	}
}

// module is a wasm file with one function of no locals and the given
// instructions (with its final end).
func module(code ...byte) []byte {
	body := append([]byte{0}, code...) // no locals
	sec := appendULEB([]byte{1}, uint64(len(body)))
	sec = append(sec, body...)
	out := []byte("\x00asm\x01\x00\x00\x00")
	out = append(out, 10)
	out = appendULEB(out, uint64(len(sec)))
	return append(out, sec...)
}

// The rewrite on a function in Go's form, by hand: a dispatch loop with
// three resume points, a for loop as Go writes it: 0 jumps to the test 2,
// which jumps back to the body 1 while it holds. The jump to 2 leaves by
// 2's block; 1 and 2 become a wasm loop (block exit, loop, block body,
// the test branching to the body, else out; the body, then round), and
// br_table sends 1's pc to a trap (it is never resumed at).
func TestDirectJumpsByHand(t *testing.T) {
	in := module(
		opLoop, 0x40,
		opBlock, 0x40, // resume point 2 after its end
		opBlock, 0x40, // 1
		opBlock, 0x40, // 0
		opLocalGet, 0,
		opBrTable, 2, 0, 1, 2, // pc 0, 1 -> 0, 1; default 2
		opEnd,
		// resume point 0
		opI32Const, 2, opLocalSet, 0, opBr, 2, // the loop is at depth 2 here
		opEnd,
		// 1
		opNopForTest,
		opEnd,
		// 2
		opI32Const, 1, opLocalSet, 0, opBr, 0,
		opEnd, // the loop
		opEnd, // the function
	)
	want := module(
		opLoop, 0x40,
		opBlock, 0x40, // 2 (the loop's test)
		opBlock, 0x40, // 0
		opBlock, 0x40, // the trap
		opLocalGet, 0,
		opBrTable, 2, 1, 0, 2,
		opEnd, 0x00, // unreachable
		opEnd,
		opBr, 0, // 0: to 2
		opEnd,
		opBlock, 0x40, opLoop, 0x40, opBlock, 0x40,
		opBr, 0, // 2: the jump to the body
		opBr, 2, // else out
		opEnd,
		opNopForTest, // 1: the body
		opBr, 0,      // round the loop
		opEnd, opEnd,
		opEnd,
		opEnd,
	)
	got, st, err := DirectJumps(in)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) || st != (JumpStats{Functions: 1, Direct: 1, Looped: 1, Loops: 1}) {
		t.Fatalf("got %x (%+v), want %x", got, st, want)
	}
}

const opNopForTest = 0x01

// An instruction the decoder does not know (here a SIMD one, which Go
// does not write) stops the rewrite with an error naming it.
func TestDirectJumpsUnknown(t *testing.T) {
	_, _, err := DirectJumps(module(0xfd, 0x0c, opEnd))
	if err == nil || !strings.Contains(err.Error(), "0xfd") {
		t.Fatalf("got %v, want an error naming 0xfd", err)
	}
	if _, _, err := DirectJumps([]byte("not wasm")); err == nil {
		t.Fatal("no error for a file that is not wasm")
	}
}

// A loop is not made where a jump would have no branch in its layout:
// here the test part (2 to 4, entered at 2) jumps back from 4 to 3,
// neither the body's first (1) nor the entry. The inner loop 3 to 4 is
// not made either: it is reached at 3 (2 runs on into it) and at 4 (2
// jumps there). So both jumps back go round the dispatch loop.
func TestDirectJumpsNoLoop(t *testing.T) {
	in := module(
		opLoop, 0x40,
		opBlock, 0x40, opBlock, 0x40, opBlock, 0x40, opBlock, 0x40, opBlock, 0x40,
		opLocalGet, 0,
		opBrTable, 4, 0, 1, 2, 3, 4,
		opEnd,
		// 0: to 2
		opI32Const, 2, opLocalSet, 0, opBr, 4,
		opEnd,
		// 1: the body
		opNopForTest,
		opEnd,
		// 2: if so, to 4; else on into 3
		opI32Const, 1, opIf, 0x40, opI32Const, 4, opLocalSet, 0, opBr, 3, opEnd,
		opEnd,
		// 3
		opNopForTest,
		opEnd,
		// 4: if so, back to 3; else back to 1
		opI32Const, 1, opIf, 0x40, opI32Const, 3, opLocalSet, 0, opBr, 1, opEnd,
		opI32Const, 1, opLocalSet, 0, opBr, 0,
		opEnd, // the loop
		opEnd, // the function
	)
	_, st, err := DirectJumps(in)
	if err != nil {
		t.Fatal(err)
	}
	if st != (JumpStats{Functions: 1, Direct: 2, Round: 2}) {
		t.Fatalf("got %+v, want two jumps direct, two round the loop and no loop made", st)
	}
}
