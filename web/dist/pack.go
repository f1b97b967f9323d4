package dist

import (
	"bytes"
	"errors"
)

// PackGap is the gap make dist joins segments across: 32 bytes takes the
// page's wasm from about 80,000 segments to about 470 (larger gaps gain
// almost nothing more).
const PackGap = 32

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
	r := &wasmReader{b: wasm[8:]}
	for len(r.b) > 0 {
		id := r.bytes(1)
		size := r.uleb()
		body := r.bytes(size)
		if r.err != nil {
			return nil, r.err
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
	r := &wasmReader{b: body}
	n := r.uleb()
	segs := make([]segment, 0, n)
	for i := 0; i < n && r.err == nil; i++ {
		head := r.bytes(2)
		if r.err != nil || head[0] != 0 || head[1] != 0x41 {
			return nil, errors.New("pack: a data segment not in Go's form (active, memory 0, i32.const offset)")
		}
		off := r.sleb()
		if end := r.bytes(1); r.err != nil || end[0] != 0x0b {
			return nil, errors.New("pack: a data segment's offset is not a lone i32.const")
		}
		segs = append(segs, segment{off: off, data: r.bytes(r.uleb())})
	}
	if r.err != nil {
		return nil, r.err
	}
	return segs, nil
}

// wasmReader reads the binary format's LEB128 integers and byte runs.
type wasmReader struct {
	b   []byte
	err error
}

func (r *wasmReader) uleb() int {
	var v, shift uint64
	for {
		c := r.bytes(1)
		if r.err != nil {
			return 0
		}
		v |= uint64(c[0]&0x7f) << shift
		if c[0]&0x80 == 0 || shift > 56 {
			return int(v)
		}
		shift += 7
	}
}

func (r *wasmReader) sleb() int64 {
	var v int64
	var shift uint
	for {
		c := r.bytes(1)
		if r.err != nil {
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

func (r *wasmReader) bytes(n int) []byte {
	if r.err != nil || n < 0 || n > len(r.b) {
		r.err = errors.New("pack: wasm file cut short")
		r.b = nil
		return nil
	}
	out := r.b[:n]
	r.b = r.b[n:]
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
