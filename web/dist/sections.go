package dist

import (
	"errors"
	"fmt"
)

// rewriteSection copies a wasm file section by section (WebAssembly core
// specification 1.0, section 5.5), each section of the given id replaced
// by what f makes of its contents. The passes that rewrite code
// (DirectJumps, WriteOutCopies) go through it.
func rewriteSection(wasm []byte, id byte, f func(body []byte) ([]byte, error)) ([]byte, error) {
	out := append([]byte(nil), wasm[:8]...)
	r := &WasmReader{B: wasm[8:]}
	for len(r.B) > 0 {
		sid := r.Bytes(1)
		body := r.Bytes(r.ULEB())
		if r.Err != nil {
			return nil, r.Err
		}
		if sid[0] == id {
			var err error
			if body, err = f(body); err != nil {
				return nil, err
			}
		}
		out = append(out, sid[0])
		out = appendULEB(out, uint64(len(body)))
		out = append(out, body...)
	}
	return out, nil
}

// eachBody rewrites the function bodies of a code section (section
// 5.5.13): f gets the index of each body and the body, its locals first,
// and gives the body to write; an error is wrapped with the function's
// index and pass's name.
func eachBody(sec []byte, pass string, f func(i int, body []byte) ([]byte, error)) ([]byte, error) {
	r := &WasmReader{B: sec}
	n := r.ULEB()
	out := appendULEB(nil, uint64(n))
	for i := 0; i < n; i++ {
		body := r.Bytes(r.ULEB())
		if r.Err != nil {
			return nil, r.Err
		}
		fn, err := f(i, body)
		if err != nil {
			return nil, fmt.Errorf("%s: function %d: %v", pass, i, err)
		}
		out = appendULEB(out, uint64(len(fn)))
		out = append(out, fn...)
	}
	if len(r.B) != 0 {
		return nil, errors.New(pass + ": bytes after the last function")
	}
	return out, nil
}

// funcBody is a function body of the code section cut in two: its local
// declarations (the groups' count, then each group's count and type) and
// its instructions.
type funcBody struct {
	decls, code []byte
	groups      int // local groups declared
	countLen    int // bytes of the groups' count at the start of decls
	locals      int // locals declared
}

// readBody cuts a function body (section 5.5.13) in its declarations and
// its instructions.
func readBody(body []byte) (funcBody, error) {
	br := &WasmReader{B: body}
	var fb funcBody
	fb.groups = br.ULEB()
	fb.countLen = len(body) - len(br.B)
	for range fb.groups {
		fb.locals += br.ULEB()
		br.Bytes(1) // type
	}
	if br.Err != nil {
		return fb, br.Err
	}
	fb.decls, fb.code = body[:len(body)-len(br.B)], br.B
	return fb, nil
}
