package scenario

import (
	"bytes"
	"encoding/json"
	"fmt"
	"reflect"
	"strings"
)

// typeWords names a Go type the way a scenario file's reader knows it.
func typeWords(t reflect.Type) string {
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	switch t.Kind() {
	case reflect.Float32, reflect.Float64, reflect.Int, reflect.Int64, reflect.Int32:
		return "a number"
	case reflect.String:
		return "text in quotes"
	case reflect.Bool:
		return "true or false"
	case reflect.Slice, reflect.Array:
		return "a list in [ ]"
	case reflect.Struct, reflect.Map:
		return "an object in { }"
	}
	return t.String()
}

// typeMessage explains a JSON value of the wrong type for a field.
func typeMessage(t reflect.Type, found string) string {
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	if num, ok := strings.CutPrefix(found, "number "); ok {
		switch t.Kind() {
		case reflect.Int, reflect.Int64, reflect.Int32:
			return fmt.Sprintf("expected a whole number, found %s", num)
		case reflect.Float32, reflect.Float64:
			return fmt.Sprintf("the number %s is too large to compute with", num)
		}
	}
	return fmt.Sprintf("expected %s, found a JSON %s", typeWords(t), found)
}

// unknownFieldPath finds where in the file the unknown key name sits, as a
// path like "load.colour" or "motions[1].colour". encoding/json reports the
// key without its place; this walks the file against the Scenario type.
// It returns name itself if the key cannot be placed.
func unknownFieldPath(data []byte, name string) string {
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	var v any
	if dec.Decode(&v) != nil {
		return name
	}
	if p, ok := findUnknown(v, reflect.TypeFor[Scenario](), "", name); ok {
		return p
	}
	return name
}

func findUnknown(v any, t reflect.Type, at, name string) (string, bool) {
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
			f, ok := fieldByTag(t, key)
			if !ok {
				if key == name {
					return path, true
				}
				continue
			}
			if p, ok := findUnknown(val, f.Type, path, name); ok {
				return p, true
			}
		}
	case []any:
		if t.Kind() != reflect.Slice {
			return "", false
		}
		for i, val := range x {
			if p, ok := findUnknown(val, t.Elem(), fmt.Sprintf("%s[%d]", at, i), name); ok {
				return p, true
			}
		}
	}
	return "", false
}

// fieldByTag finds the struct field whose JSON name is key, matched as
// encoding/json does (exactly, else ignoring case).
func fieldByTag(t reflect.Type, key string) (reflect.StructField, bool) {
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
func pathAtOffset(data []byte, off int64) string {
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
