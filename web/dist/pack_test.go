package dist

import (
	"bytes"
	"math/rand/v2"
	"testing"
)

// memory is the memory a wasm file's data segments make, from offset 0
// to the end of the last segment.
func memory(t *testing.T, wasm []byte) (mem []byte, segments int) {
	t.Helper()
	r := &WasmReader{B: wasm[8:]}
	for len(r.B) > 0 {
		id := r.Bytes(1)
		body := r.Bytes(r.ULEB())
		if r.Err != nil {
			t.Fatal(r.Err)
		}
		if id[0] != 11 {
			continue
		}
		segs, err := readSegments(body)
		if err != nil {
			t.Fatal(err)
		}
		for _, s := range segs {
			if end := int(s.off) + len(s.data); end > len(mem) {
				mem = append(mem, make([]byte, end-len(mem))...)
			}
			copy(mem[s.off:], s.data)
		}
		segments += len(segs)
	}
	return mem, segments
}

// A wasm file like Go's: a code section and a data section of many
// segments with runs of zeros left out between them.
func fakeWasm(r *rand.Rand) []byte {
	w := []byte("\x00asm\x01\x00\x00\x00")
	code := []byte{1, 4, 0, 0x41, 0, 0x0b} // one body
	w = append(w, 10)
	w = appendULEB(w, uint64(len(code)))
	w = append(w, code...)
	var sec []byte
	n, off := 500, int64(4096)
	sec = appendULEB(sec, uint64(n))
	for i := 0; i < n; i++ {
		data := make([]byte, 1+r.IntN(40))
		for k := range data {
			data[k] = byte(1 + r.IntN(255))
		}
		sec = append(sec, 0, 0x41)
		sec = appendSLEB(sec, off)
		sec = append(sec, 0x0b)
		sec = appendULEB(sec, uint64(len(data)))
		sec = append(sec, data...)
		off += int64(len(data) + 1 + r.IntN(30))
		if i == 250 {
			off += 1 << 20 // a large gap stays a gap
		}
	}
	w = append(w, 11)
	w = appendULEB(w, uint64(len(sec)))
	return append(w, sec...)
}

// The packed file starts its memory with the same bytes, in fewer
// segments, and keeps every other section as it was.
func TestPackDataSameMemory(t *testing.T) {
	in := fakeWasm(rand.New(rand.NewPCG(5, 6)))
	out, err := PackData(in, 32)
	if err != nil {
		t.Fatal(err)
	}
	a, na := memory(t, in)
	b, nb := memory(t, out)
	if !bytes.Equal(a, b) {
		t.Fatal("the packed wasm's memory differs")
	}
	if nb != 2 {
		t.Errorf("%d segments became %d", na, nb)
	}
	if !bytes.Equal(in[:8+2+6], out[:8+2+6]) {
		t.Error("the code section changed")
	}
	if _, err := PackData([]byte("not wasm"), 32); err == nil {
		t.Error("no error for a file that is not wasm")
	}
	if _, err := PackData(in[:len(in)-3], 32); err == nil {
		t.Error("no error for a cut file")
	}
}
