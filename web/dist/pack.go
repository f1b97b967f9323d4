package dist

import (
	"bytes"
	"errors"
	"fmt"
	"os"
)

// PackGap is the gap make dist joins segments across: 32 bytes takes the
// page's wasm from about 80,000 segments to about 470 (larger gaps gain
// almost nothing more).
const PackGap = 32

// Pack is what make wasm does to a wasm file after go build: its forward
// jumps made direct (DirectJumps), its copies and clears of a known size
// up to CopyLimit bytes written out (WriteOutCopies), the constant parts
// of addresses moved into the loads' and stores' offsets (FoldOffsets),
// the frame's slots that never wait across a call kept in locals
// (LocalSpills), its arguments read into locals once on each way through
// (LocalArgs), then its data segments joined (PackData).
func Pack(wasm []byte) ([]byte, PackStats, error) {
	var st PackStats
	out, js, err := DirectJumps(wasm)
	st.JumpStats = js
	if err != nil {
		return nil, st, err
	}
	if out, st.Copies, err = WriteOutCopies(out, CopyLimit); err != nil {
		return nil, st, err
	}
	if out, st.Offsets, err = FoldOffsets(out); err != nil {
		return nil, st, err
	}
	if out, st.Spills, err = LocalSpills(out); err != nil {
		return nil, st, err
	}
	if out, st.Args, err = LocalArgs(out); err != nil {
		return nil, st, err
	}
	out, err = PackData(out, PackGap)
	return out, st, err
}

// PackStats counts what Pack did.
type PackStats struct {
	JumpStats
	Copies  CopyStats
	Offsets FoldStats
	Spills  SpillStats
	Args    ArgStats
}

// PackFile packs the wasm file name in place (Pack) and returns what
// it did and the file's sizes before and after.
func PackFile(name string) (st PackStats, before, after int, err error) {
	in, err := os.ReadFile(name)
	if err != nil {
		return st, 0, 0, err
	}
	out, st, err := Pack(in)
	if err != nil {
		return st, 0, 0, fmt.Errorf("%s: %v", name, err)
	}
	return st, len(in), len(out), os.WriteFile(name, out, 0o755)
}

// PackData rewrites a wasm file's data section (WebAssembly core
// specification 1.0, section 5.5.14) with fewer segments: Go's linker
// starts a new active segment after every run of zero bytes, about 80,000
// of them in the page's wasm, each with its own offset and length. Two
// segments less than gap bytes apart are joined, the zeros between them
// written out. Memory starts as zeros, so the memory the module starts
// with is the same byte for byte (TestPackDataSameMemory); the file grows
// by the zeros but gzips about 6 % smaller. Every other section is copied
// as it is. Only the form Go writes is accepted: active segments of
// memory 0 at an i32.const offset.
func PackData(wasm []byte, gap int) ([]byte, error) {
	if len(wasm) < 8 || !bytes.Equal(wasm[:4], []byte("\x00asm")) {
		return nil, errors.New("pack: not a wasm file")
	}
	out := append([]byte(nil), wasm[:8]...)
	r := &WasmReader{B: wasm[8:]}
	for len(r.B) > 0 {
		id := r.Bytes(1)
		size := r.ULEB()
		body := r.Bytes(size)
		if r.Err != nil {
			return nil, r.Err
		}
		if id[0] != 11 {
			out = append(out, id[0])
			out = appendULEB(out, uint64(len(body)))
			out = append(out, body...)
			continue
		}
		segs, err := readSegments(body)
		if err != nil {
			return nil, err
		}
		var merged []segment
		for _, s := range segs {
			if n := len(merged); n > 0 {
				last := &merged[n-1]
				end := last.off + int64(len(last.data))
				if s.off >= end && s.off-end < int64(gap) {
					last.data = append(last.data, make([]byte, s.off-end)...)
					last.data = append(last.data, s.data...)
					continue
				}
			}
			merged = append(merged, segment{off: s.off, data: append([]byte(nil), s.data...)})
		}
		var sec []byte
		sec = appendULEB(sec, uint64(len(merged)))
		for _, s := range merged {
			sec = append(sec, 0, 0x41) // active, memory 0; i32.const
			sec = appendSLEB(sec, s.off)
			sec = append(sec, 0x0b) // end
			sec = appendULEB(sec, uint64(len(s.data)))
			sec = append(sec, s.data...)
		}
		out = append(out, 11)
		out = appendULEB(out, uint64(len(sec)))
		out = append(out, sec...)
	}
	return out, nil
}

// segment is an active data segment: its bytes go to memory at off.
type segment struct {
	off  int64
	data []byte
}

func readSegments(body []byte) ([]segment, error) {
	r := &WasmReader{B: body}
	n := r.ULEB()
	segs := make([]segment, 0, n)
	for i := 0; i < n && r.Err == nil; i++ {
		head := r.Bytes(2)
		if r.Err != nil || head[0] != 0 || head[1] != 0x41 {
			return nil, errors.New("pack: a data segment not in Go's form (active, memory 0, i32.const offset)")
		}
		off := r.SLEB()
		if end := r.Bytes(1); r.Err != nil || end[0] != 0x0b {
			return nil, errors.New("pack: a data segment's offset is not a lone i32.const")
		}
		segs = append(segs, segment{off: off, data: r.Bytes(r.ULEB())})
	}
	if r.Err != nil {
		return nil, r.Err
	}
	return segs, nil
}

// WasmReader reads the wasm binary format's LEB128 integers and byte runs
// from B; the first failure is kept in Err (and later reads give zeros).
// web/cmd/swaysize reads wasm files with it too.
type WasmReader struct {
	B   []byte
	Err error
}

// ULEB reads an unsigned LEB128 integer.
func (r *WasmReader) ULEB() int {
	var v, shift uint64
	for {
		c := r.Bytes(1)
		if r.Err != nil {
			return 0
		}
		v |= uint64(c[0]&0x7f) << shift
		if c[0]&0x80 == 0 || shift > 56 {
			return int(v)
		}
		shift += 7
	}
}

// SLEB reads a signed LEB128 integer.
func (r *WasmReader) SLEB() int64 {
	var v int64
	var shift uint
	for {
		c := r.Bytes(1)
		if r.Err != nil {
			return 0
		}
		v |= int64(c[0]&0x7f) << shift
		shift += 7
		if c[0]&0x80 == 0 {
			if shift < 64 && c[0]&0x40 != 0 {
				v |= -1 << shift
			}
			return v
		}
	}
}

// Bytes reads n bytes.
func (r *WasmReader) Bytes(n int) []byte {
	if r.Err != nil || n < 0 || n > len(r.B) {
		r.Err = errors.New("pack: wasm file cut short")
		r.B = nil
		return nil
	}
	out := r.B[:n]
	r.B = r.B[n:]
	return out
}

func appendULEB(b []byte, v uint64) []byte {
	for {
		c := byte(v & 0x7f)
		v >>= 7
		if v == 0 {
			return append(b, c)
		}
		b = append(b, c|0x80)
	}
}

func appendSLEB(b []byte, v int64) []byte {
	for {
		c := byte(v & 0x7f)
		v >>= 7
		if v == 0 && c&0x40 == 0 || v == -1 && c&0x40 != 0 {
			return append(b, c)
		}
		b = append(b, c|0x80)
	}
}
