package scenario

import (
	"bytes"
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
)

// tokenKeys is checkKeys as it was written first, on encoding/json's
// Decoder.Token: the plain form that checkKeys' own reader (keyScan) is
// held to.
func tokenKeys(data []byte) *FieldError {
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	var fe *FieldError
	tokenWalk(dec, reflect.TypeFor[Scenario](), "", &fe)
	return fe
}

func tokenWalk(dec *json.Decoder, t reflect.Type, at string, fe **FieldError) bool {
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
			if !tokenWalk(dec, elem, fmt.Sprintf("%s[%d]", at, i), fe) {
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
				path = `""`
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
			if !tokenWalk(dec, ft, path, fe) {
				return false
			}
		}
	default:
		return true
	}
	_, err = dec.Token()
	return err == nil
}

// oldUnknownFieldPath (with oldFindUnknown, oldFieldByTag) and oldPathAtOffset are
// the places of the decoder's errors found as they were first written, on
// encoding/json's Decoder.Token and a decoded map: the plain forms keyScan
// is held to (TestPlacesAsTokens, FuzzKeyScan).
//
// unknownFieldPath finds where in the file the unknown key name sits, as a
// path like "load.colour" or "motions[1].colour". encoding/json reports the
// key without its place; this walks the file against the Scenario type.
// It returns name itself if the key cannot be placed.
func oldUnknownFieldPath(data []byte, name string) string {
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	var v any
	if dec.Decode(&v) != nil {
		return name
	}
	if p, ok := oldFindUnknown(v, reflect.TypeFor[Scenario](), "", name); ok {
		return p
	}
	return name
}

func oldFindUnknown(v any, t reflect.Type, at, name string) (string, bool) {
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	switch x := v.(type) {
	case map[string]any:
		if t.Kind() != reflect.Struct {
			return "", false
		}
		for key, val := range x {
			path := key
			if at != "" {
				path = at + "." + key
			}
			f, ok := oldFieldByTag(t, key)
			if !ok {
				if key == name {
					return path, true
				}
				continue
			}
			if p, ok := oldFindUnknown(val, f.Type, path, name); ok {
				return p, true
			}
		}
	case []any:
		if t.Kind() != reflect.Slice {
			return "", false
		}
		for i, val := range x {
			if p, ok := oldFindUnknown(val, t.Elem(), fmt.Sprintf("%s[%d]", at, i), name); ok {
				return p, true
			}
		}
	}
	return "", false
}

// fieldByTag finds the struct field whose JSON name is key, matched as
// encoding/json does (exactly, else ignoring case).
func oldFieldByTag(t reflect.Type, key string) (reflect.StructField, bool) {
	var fold reflect.StructField
	found := false
	for i := range t.NumField() {
		f := t.Field(i)
		tag, _, _ := strings.Cut(f.Tag.Get("json"), ",")
		if tag == "" {
			tag = f.Name
		}
		if tag == key {
			return f, true
		}
		if !found && strings.EqualFold(tag, key) {
			fold, found = f, true
		}
	}
	return fold, found
}

// pathAtOffset returns the path (like "motions[1].distance_m") of the JSON
// value that ends at byte offset off of data, where encoding/json reports a
// value of the wrong type (its own field name leaves out list indices). It
// returns "" if no value ends there.
func oldPathAtOffset(data []byte, off int64) string {
	type frame struct {
		array   bool
		index   int
		key     string
		wantKey bool
	}
	var stack []frame
	path := func() string {
		var b strings.Builder
		for i, f := range stack {
			if f.array {
				fmt.Fprintf(&b, "[%d]", f.index)
				continue
			}
			if i > 0 {
				b.WriteByte('.')
			}
			b.WriteString(f.key)
		}
		return b.String()
	}
	// valueDone moves the innermost frame past the value just read.
	valueDone := func() {
		if n := len(stack); n > 0 {
			if stack[n-1].array {
				stack[n-1].index++
			} else {
				stack[n-1].wantKey = true
			}
		}
	}
	dec := json.NewDecoder(bytes.NewReader(data))
	// Numbers as read, not as float64: a number beyond float64's range
	// (1e1000) is still a value that ends somewhere, and keyScan places it.
	dec.UseNumber()
	for {
		tok, err := dec.Token()
		if err != nil {
			return ""
		}
		if d, ok := tok.(json.Delim); ok {
			switch d {
			case '{', '[':
				if dec.InputOffset() == off {
					return path()
				}
				stack = append(stack, frame{array: d == '[', wantKey: d == '{'})
			default:
				stack = stack[:len(stack)-1]
				valueDone()
			}
			continue
		}
		if n := len(stack); n > 0 && !stack[n-1].array && stack[n-1].wantKey {
			stack[n-1].key, _ = tok.(string)
			stack[n-1].wantKey = false
			continue
		}
		if dec.InputOffset() == off {
			return path()
		}
		valueDone()
	}
}

// placesAgree checks pathAtOffset and unknownFieldPath against the plain
// forms on data: every offset, and every key of it as the unknown one
// of valid JSON, as the decoder reports those errors only once it has read
// the whole value (inputs with an empty key or text are left out: the
// plain form writes an empty key as nothing, keyScan as "").
func placesAgree(t *testing.T, data []byte) {
	if bytes.Contains(data, []byte(`""`)) || !json.Valid(data) || checkKeys(data) != nil {
		return
	}
	for off := 0; off <= len(data); off++ {
		if got, want := pathAtOffset(data, int64(off)), oldPathAtOffset(data, int64(off)); got != want {
			t.Fatalf("%.80q at %d: %q, the token walk %q", data, off, got, want)
		}
	}
	for _, name := range []string{"colour", "mass_kg", "x", "speed_m_per_s", "kind"} {
		if bytes.Count(data, []byte(`"`+name+`"`)) > 1 {
			continue // the decoded walk takes the places in a map's random order
		}
		if got, want := unknownFieldPath(data, name), oldUnknownFieldPath(data, name); got != want {
			t.Fatalf("%.80q, unknown %s: %q, the decoded walk %q", data, name, got, want)
		}
	}
}

// TestPlacesAsTokens: the places of the decoder's errors are those the
// plain forms find, on the examples and broken files.
func TestPlacesAsTokens(t *testing.T) {
	for _, data := range keyCases(t) {
		placesAgree(t, data)
	}
	placesAgree(t, []byte(`{"load": {"mass_kg": 1, "colour": 2}, "motions": [{"axis": "x", "colour": 1}]}`))
	placesAgree(t, []byte(`{"motions": [{"axis": "x"}, {"axis": "y", "colour": [1, {"colour": 2}]}], "colours": 3}`))
}

// keyCases are the examples and files that break in the ways checkKeys
// reports or leaves to the decoder.
func keyCases(t testing.TB) [][]byte {
	files, _ := filepath.Glob(filepath.Join("..", "..", "testdata", "scenarios", "*.json"))
	var out [][]byte
	for _, f := range files {
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, b)
	}
	for _, s := range []string{
		`{"load": {"mass_kg": 1, "Mass_Kg": 2}}`, `{"load": {"mass_kg": 1, "mass_kg": 2}}`,
		`{"load": {"mass_kg": 1, "mass\u005fkg": 2}}`, `{"a": 1, "a": 2}`, `{"": 1, "": 2}`,
		`{"motions": [{"axis": "x"}, {"Axis": "y"}]}`, `{"motions": [[], [{"a": 1, "a": 2}]]}`,
		`[{"a": 1}, {"a": 2, "a": 3}]`, `{"sheet": {"Project": 1}}`, `{"load": {"mass_kg": 1 "rope_length_m": 2}}`,
		`{"load": {"mass_kg": 1,}, "a": 1, "a": 2}`, `{"a": tru, "a": 1}`, `{"a": -01, "a": 2}`, `{"a": 1.e5, "a": 2}`,
		`{"a": "x\q", "a": 2}`, `{"a": "x\u12g4", "a": 2}`, "{\"a\": \"x\ty\", \"a\": 2}", `{"a": [1, 2,], "a": 2}`,
		`{"a": [1 2], "a": 2}`, `{"a": "\ud800", "a": 2}`, `{"a\"b": 1, "a\"b": 2}`, `{"\u00e9": 1, "é": 2}`,
		`{"a": 1e+5, "b": -0.5E-3, "c": null, "d": false, "d": true}`, `  {"a" : 1 , "a" : 2 }  `, `{"a": 1`, `{"a"`, `{`, ``,
		`"just a string"`, `12`, `{"a": {"b": {"c": [1, {"d": 1, "D": 2}]}}}`, `{"wind": {"Force_N": 3}}`,
		`{"a1": 1, "a2": 2, "a3": 3, "a4": 4, "a5": 5, "a6": 6, "a7": 7, "a8": 8, "a9": 9, "a10": 10, "a11": 11, "a12": 12,
		  "a13": 13, "a14": 14, "a15": 15, "a16": 16, "a17": 17, "a18": 18, "a3": 3}`,
	} {
		out = append(out, []byte(s))
	}
	return out
}

// TestKeyScanAsTokens: checkKeys reports what the walk on Decoder.Token
// reports, on the examples and on broken files.
func TestKeyScanAsTokens(t *testing.T) {
	for _, data := range keyCases(t) {
		if got, want := checkKeys(data), tokenKeys(data); !sameReport(got, want) {
			t.Errorf("%.80s: got %v, the token walk %v", data, got, want)
		}
	}
}

func sameReport(a, b *FieldError) bool {
	return (a == nil) == (b == nil) && (a == nil || *a == *b)
}

// FuzzKeyScan holds checkKeys and the places of the decoder's errors to
// the plain forms on any input.
func FuzzKeyScan(f *testing.F) {
	for _, data := range keyCases(f) {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		if checkDepth(data) != nil {
			return // Parse stops there first
		}
		if got, want := checkKeys(data), tokenKeys(data); !sameReport(got, want) {
			t.Errorf("%q: got %v, the token walk %v", data, got, want)
		}
		if len(data) < 400 {
			placesAgree(t, data)
		}
	})
}
