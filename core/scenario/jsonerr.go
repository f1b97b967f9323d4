package scenario

import (
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
// path like "load.colour" or "motions[1].colour": the first such key in
// the file, as encoding/json reports the first (without its place). It
// returns name itself if the key cannot be placed.
func unknownFieldPath(data []byte, name string) string {
	k := keyScan{data: data, endAt: -1, unknown: &name}
	k.value(reflect.TypeFor[Scenario]())
	if k.place != "" {
		return k.place
	}
	return name
}

// pathAtOffset returns the path (like "motions[1].distance_m") of the JSON
// value that ends at byte offset off of data, where encoding/json reports a
// value of the wrong type (its own field name leaves out list indices). It
// returns "" if no value ends there.
func pathAtOffset(data []byte, off int64) string {
	k := keyScan{data: data, endAt: int(off)}
	k.value(reflect.TypeFor[Scenario]())
	return k.place
}
