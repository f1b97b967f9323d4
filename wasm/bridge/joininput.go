package bridge

import (
	"bytes"
	"encoding/base64"
	"errors"
	"strconv"

	"swaysheet/core/clearance"
)

// readJoinInput reads the input of "clearance_join",
// {"scenario": {...}, "parts": [{"from": n, "to": n, "data": "base64"}, ...]},
// without encoding/json: its scanner looks at every byte of the parts'
// data (a few MB for 1,000 runs) one state at a time, which in wasm took
// longer than the join itself. The scenario's text is returned as it is
// (scenario.Parse reads it); other keys are skipped. Any fault is an
// error, never a panic or a loop without end.
func readJoinInput(in []byte) (scenarioJSON []byte, parts []clearance.Part, err error) {
	r := &jsonReader{b: in}
	var sawParts bool
	err = r.object(func(key []byte) error {
		switch string(key) {
		case "scenario":
			r.ws()
			start := r.i
			if err := r.skipValue(); err != nil {
				return err
			}
			scenarioJSON = in[start:r.i]
			return nil
		case "parts":
			sawParts = true
			if r.ws(); r.peek() == 'n' {
				return r.skipValue() // null: no parts
			}
			return r.array(func() error {
				var p clearance.Part
				err := r.object(func(k []byte) error {
					switch string(k) {
					case "from", "to":
						v, err := r.int()
						if string(k) == "from" {
							p.From = v
						} else {
							p.To = v
						}
						return err
					case "data":
						s, err := r.plainString()
						if err != nil {
							return err
						}
						p.Data = make([]byte, base64.StdEncoding.DecodedLen(len(s)))
						n, err := base64.StdEncoding.Decode(p.Data, s)
						if err != nil {
							return errors.New("a part's data is not base64")
						}
						p.Data = p.Data[:n]
						return nil
					}
					return r.skipValue()
				})
				parts = append(parts, p)
				return err
			})
		}
		return r.skipValue()
	})
	if err == nil {
		if r.ws(); r.i != len(r.b) {
			err = errors.New("text after the request")
		}
	}
	if err == nil && (scenarioJSON == nil || !sawParts) {
		err = errors.New(`the request needs "scenario" and "parts"`)
	}
	return scenarioJSON, parts, err
}

// jsonReader walks JSON text for readJoinInput.
type jsonReader struct {
	b []byte
	i int
}

var errJSONEnd = errors.New("the request is cut short or not JSON")

func (r *jsonReader) ws() {
	for r.i < len(r.b) && (r.b[r.i] == ' ' || r.b[r.i] == '\n' || r.b[r.i] == '\r' || r.b[r.i] == '\t') {
		r.i++
	}
}

func (r *jsonReader) peek() byte {
	if r.i < len(r.b) {
		return r.b[r.i]
	}
	return 0
}

func (r *jsonReader) expect(c byte) error {
	if r.ws(); r.peek() != c {
		return errJSONEnd
	}
	r.i++
	return nil
}

// object reads {"key": value, ...}, calling each(key) with the reader at
// the value (each must read it).
func (r *jsonReader) object(each func(key []byte) error) error {
	if err := r.expect('{'); err != nil {
		return err
	}
	if r.ws(); r.peek() == '}' {
		r.i++
		return nil
	}
	for {
		r.ws()
		key, err := r.plainString()
		if err != nil {
			return err
		}
		if err := r.expect(':'); err != nil {
			return err
		}
		if err := each(key); err != nil {
			return err
		}
		if r.ws(); r.peek() == ',' {
			r.i++
			continue
		}
		return r.expect('}')
	}
}

// array reads [value, ...], calling each with the reader at each value.
func (r *jsonReader) array(each func() error) error {
	if err := r.expect('['); err != nil {
		return err
	}
	if r.ws(); r.peek() == ']' {
		r.i++
		return nil
	}
	for {
		if err := each(); err != nil {
			return err
		}
		if r.ws(); r.peek() == ',' {
			r.i++
			continue
		}
		return r.expect(']')
	}
}

// plainString reads a string without escapes (keys and base64 have none).
func (r *jsonReader) plainString() ([]byte, error) {
	if err := r.expect('"'); err != nil {
		return nil, err
	}
	n := bytes.IndexByte(r.b[r.i:], '"')
	if n < 0 {
		return nil, errJSONEnd
	}
	s := r.b[r.i : r.i+n]
	if bytes.IndexByte(s, '\\') >= 0 {
		return nil, errors.New("a key or a part's data holds an escape")
	}
	r.i += n + 1
	return s, nil
}

func (r *jsonReader) int() (int, error) {
	r.ws()
	start := r.i
	for r.i < len(r.b) && (r.b[r.i] == '-' || r.b[r.i] >= '0' && r.b[r.i] <= '9') {
		r.i++
	}
	v, err := strconv.Atoi(string(r.b[start:r.i]))
	if err != nil {
		return 0, errors.New("a part's from or to is not a whole number")
	}
	return v, nil
}

// skipValue steps over one JSON value of any kind (checked only for its
// brackets and strings; the scenario's own text is checked by its parser).
func (r *jsonReader) skipValue() error {
	r.ws()
	depth := 0
	for r.i < len(r.b) {
		switch c := r.b[r.i]; c {
		case '"':
			r.i++
			for r.i < len(r.b) && r.b[r.i] != '"' {
				if r.b[r.i] == '\\' {
					r.i++
				}
				r.i++
			}
			if r.i >= len(r.b) {
				return errJSONEnd
			}
			r.i++
		case '{', '[':
			depth++
			r.i++
		case '}', ']':
			if depth == 0 {
				return nil
			}
			depth--
			r.i++
		case ',':
			if depth == 0 {
				return nil
			}
			r.i++
		default:
			r.i++
		}
		if depth == 0 && (r.i >= len(r.b) || r.b[r.i-1] == '"' || r.b[r.i-1] == '}' || r.b[r.i-1] == ']') {
			return nil
		}
	}
	if depth != 0 {
		return errJSONEnd
	}
	return nil
}
