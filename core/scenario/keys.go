package scenario

import (
	"encoding/json"
	"fmt"
	"reflect"
	"strings"
	"sync"
)

// checkKeys walks the file's keys against the Scenario type before it is
// decoded and reports the first key that encoding/json would take in
// silently: a key given twice in one object (encoding/json keeps the last)
// and a key that differs from a field's name only by case (encoding/json
// matches names regardless of case). Both are errors naming the key's path.
// Keys nowhere near a field's name are left to the decoder's own unknown
// field error. A file that is not valid JSON passes here unreported from
// where it breaks on; the decoder says where.
//
// It reads the bytes itself (keyScan), the JSON grammar checked as it
// goes, rather than through encoding/json's Decoder.Token, which decodes
// every token through reflection and cost about a tenth of each page call
// that reads a scenario; keyscan_test.go keeps a walk on Decoder.Token and
// holds the two to the same reports.
func checkKeys(data []byte) *FieldError {
	k := keyScan{data: data, endAt: -1}
	k.value(reflect.TypeFor[Scenario]())
	return k.fe
}

// keyScan is checkKeys' reader: data from offset i, the path to the
// value being read (written out only for a report) and the first problem.
// It also finds places for the decoder's errors (jsonerr.go): with endAt
// at least 0, the path of the value that ends at that offset; with
// unknown set, the path of the first key of that name a struct does not
// have; either in place, the scan stopping there.
type keyScan struct {
	data    []byte
	i       int
	path    []pathStep
	fe      *FieldError
	bad     bool // the JSON broke: stop, unreported
	endAt   int
	unknown *string
	place   string
}

// ends reports whether the value just read ends at endAt, the place then
// found.
func (k *keyScan) ends() bool {
	if k.i != k.endAt {
		return false
	}
	k.place = k.at()
	return true
}

// pathStep is one step of a path: an object's key, or an array's index.
type pathStep struct {
	key   string
	index int // -1 for a key
}

// at is the path read so far, as the field of a report ("motions[1].axis").
func (k *keyScan) at() string {
	var b strings.Builder
	for _, p := range k.path {
		if p.index >= 0 {
			fmt.Fprintf(&b, "[%d]", p.index)
			continue
		}
		if b.Len() > 0 {
			b.WriteByte('.')
		}
		if p.key == "" {
			b.WriteString(`""`) // a key that is the empty string
		} else {
			b.WriteString(p.key)
		}
	}
	return b.String()
}

func (k *keyScan) space() {
	for k.i < len(k.data) {
		switch k.data[k.i] {
		case ' ', '\t', '\n', '\r':
			k.i++
		default:
			return
		}
	}
}

// next is the next byte after white space, 0 at the end.
func (k *keyScan) next() byte {
	k.space()
	if k.i >= len(k.data) {
		return 0
	}
	return k.data[k.i]
}

// value reads one value; t is the Go type it decodes into, or nil when
// unknown. It reports false once a problem is found or the JSON breaks.
func (k *keyScan) value(t reflect.Type) bool {
	for t != nil && t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	switch c := k.next(); {
	case c == '{':
		k.i++
		return !k.ends() && k.object(t)
	case c == '[':
		k.i++
		if k.ends() {
			return false
		}
		var elem reflect.Type
		if t != nil && (t.Kind() == reflect.Slice || t.Kind() == reflect.Array) {
			elem = t.Elem()
		}
		if k.next() == ']' {
			k.i++
			return true
		}
		for n := 0; ; n++ {
			k.path = append(k.path, pathStep{index: n})
			ok := k.value(elem)
			k.path = k.path[:len(k.path)-1]
			if !ok {
				return false
			}
			if more, ok := k.more(']'); !more {
				return ok
			}
		}
	case c == '"':
		_, ok := k.str()
		return ok && !k.ends()
	default:
		return k.scalar() && !k.ends()
	}
}

// object reads an object's members after its '{'.
func (k *keyScan) object(t reflect.Type) bool {
	var fields map[string]reflect.Type
	if t != nil && t.Kind() == reflect.Struct {
		fields = fieldsOf(t)
	}
	if k.next() == '}' {
		k.i++
		return true
	}
	seen := map[string]bool{}
	for {
		if k.next() != '"' {
			return k.broke()
		}
		key, ok := k.str()
		if !ok {
			return false
		}
		k.path = append(k.path, pathStep{key: key, index: -1})
		twice := seen[key]
		seen[key] = true
		if twice {
			k.fe = &FieldError{Field: k.at(), Message: "appears twice; give each field once"}
			return false
		}
		var ft reflect.Type
		if fields != nil {
			var known bool
			ft, known = fields[key]
			if !known && k.unknown != nil && key == *k.unknown {
				k.place = k.at()
				return false
			}
			if !known {
				for name := range fields {
					if strings.EqualFold(name, key) {
						k.fe = &FieldError{Field: k.at(), Message: fmt.Sprintf(
							"unknown field; field names are case-sensitive (did you mean %s?)", name)}
						return false
					}
				}
			}
		}
		if k.next() != ':' { // after the key's checks, as the decoder's tokens come
			return k.broke()
		}
		k.i++
		ok = k.value(ft)
		k.path = k.path[:len(k.path)-1]
		if !ok {
			return false
		}
		if more, ok := k.more('}'); !more {
			return ok
		}
	}
}

// more reads what follows an element or member: a ',' (more follows) or
// the closing delimiter (done); anything else breaks the JSON.
func (k *keyScan) more(closing byte) (more, ok bool) {
	switch k.next() {
	case ',':
		k.i++
		return true, true
	case closing:
		k.i++
		return false, true
	}
	return false, k.broke()
}

// str reads a string at its opening quote and returns its text: the bytes
// as they are, or, with escapes or bytes past ASCII, as encoding/json
// reads it (which also checks the escapes; invalid UTF-8 reads as
// U+FFFD).
func (k *keyScan) str() (string, bool) {
	start := k.i
	k.i++
	plain := true
	for k.i < len(k.data) {
		c := k.data[k.i]
		switch {
		case c == '"':
			k.i++
			raw := k.data[start:k.i]
			if plain {
				return string(raw[1 : len(raw)-1]), true
			}
			var s string
			if json.Unmarshal(raw, &s) != nil {
				return "", k.broke()
			}
			return s, true
		case c < 0x20:
			return "", k.broke()
		case c == '\\':
			plain = false
			k.i += 2
		default:
			plain = plain && c < 0x80
			k.i++
		}
	}
	return "", k.broke()
}

// scalar reads a number, true, false or null: up to the next delimiter,
// checked by encoding/json.
func (k *keyScan) scalar() bool {
	start := k.i
scan:
	for ; k.i < len(k.data); k.i++ {
		switch k.data[k.i] {
		case ',', '}', ']', ' ', '\t', '\n', '\r':
			break scan
		}
	}
	return (k.i > start && json.Valid(k.data[start:k.i])) || k.broke()
}

// broke marks the JSON broken (unreported: the decoder says where).
func (k *keyScan) broke() bool {
	k.bad = true
	return false
}

// knownFields holds jsonFields of each struct type met, built once: the
// struct tags are read through reflection, which cost about half of
// checkKeys (and a tenth of reading a site scenario) in the page's wasm.
// The maps are never changed once stored.
var knownFields sync.Map // reflect.Type -> map[string]reflect.Type

// fieldsOf is jsonFields(t), from knownFields when it holds t's.
func fieldsOf(t reflect.Type) map[string]reflect.Type {
	if m, ok := knownFields.Load(t); ok {
		return m.(map[string]reflect.Type)
	}
	m := jsonFields(t)
	knownFields.Store(t, m)
	return m
}

// jsonFields maps the JSON names of a struct's fields, those of embedded
// structs without a tag included (as encoding/json promotes them), to
// their types.
func jsonFields(t reflect.Type) map[string]reflect.Type {
	out := map[string]reflect.Type{}
	for i := range t.NumField() {
		f := t.Field(i)
		tag, _, _ := strings.Cut(f.Tag.Get("json"), ",")
		if tag == "-" || !f.IsExported() && !f.Anonymous {
			continue
		}
		if f.Anonymous && tag == "" && f.Type.Kind() == reflect.Struct {
			for k, v := range jsonFields(f.Type) {
				out[k] = v
			}
			continue
		}
		if tag == "" {
			tag = f.Name
		}
		out[tag] = f.Type
	}
	return out
}

// MaxDepth bounds how deeply a scenario file's objects and lists nest (a
// scenario needs 4 levels). Deeper files are rejected before decoding:
// the decoders' work and memory grow with the depth.
const MaxDepth = 64

// checkDepth reports a file nested more than MaxDepth levels deep, in one
// pass over its bytes (brackets inside strings do not count).
func checkDepth(data []byte) *FieldError {
	depth, inString, escaped := 0, false, false
	for _, c := range data {
		switch {
		case inString:
			switch {
			case escaped:
				escaped = false
			case c == '\\':
				escaped = true
			case c == '"':
				inString = false
			}
		case c == '"':
			inString = true
		case c == '{' || c == '[':
			depth++
			if depth > MaxDepth {
				return &FieldError{Field: "(file)", Message: fmt.Sprintf(
					"the file is nested %d levels deep: a scenario has at most %d levels", depth, MaxDepth)}
			}
		case c == '}' || c == ']':
			depth--
		}
	}
	return nil
}
