package scenario

import (
	"bytes"
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
// field error. A file that is not valid JSON passes here unreported; the
// decoder says where it breaks.
func checkKeys(data []byte) *FieldError {
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	var fe *FieldError
	walkValue(dec, reflect.TypeFor[Scenario](), "", &fe)
	return fe
}

// walkValue reads one value from dec; t is the Go type it decodes into, or
// nil when unknown. It stops at the first problem (stored in *fe) or at a
// token error.
func walkValue(dec *json.Decoder, t reflect.Type, at string, fe **FieldError) bool {
	for t != nil && t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	tok, err := dec.Token()
	if err != nil {
		return false
	}
	d, ok := tok.(json.Delim)
	if !ok {
		return true
	}
	switch d {
	case '[':
		var elem reflect.Type
		if t != nil && (t.Kind() == reflect.Slice || t.Kind() == reflect.Array) {
			elem = t.Elem()
		}
		for i := 0; dec.More(); i++ {
			if !walkValue(dec, elem, fmt.Sprintf("%s[%d]", at, i), fe) {
				return false
			}
		}
	case '{':
		var fields map[string]reflect.Type
		if t != nil && t.Kind() == reflect.Struct {
			fields = fieldsOf(t)
		}
		seen := map[string]bool{}
		for dec.More() {
			tok, err := dec.Token()
			if err != nil {
				return false
			}
			key, _ := tok.(string)
			path := key
			if key == "" {
				path = `""` // a key that is the empty string
			}
			if at != "" {
				path = at + "." + path
			}
			if seen[key] {
				*fe = &FieldError{Field: path, Message: "appears twice; give each field once"}
				return false
			}
			seen[key] = true
			var ft reflect.Type
			if fields != nil {
				var known bool
				ft, known = fields[key]
				if !known {
					for name := range fields {
						if strings.EqualFold(name, key) {
							*fe = &FieldError{Field: path, Message: fmt.Sprintf(
								"unknown field; field names are case-sensitive (did you mean %s?)", name)}
							return false
						}
					}
				}
			}
			if !walkValue(dec, ft, path, fe) {
				return false
			}
		}
	default:
		return true
	}
	_, err = dec.Token() // the closing delimiter
	return err == nil
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
