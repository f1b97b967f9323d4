package scenario

import (
	"bytes"
	"encoding/json"
	"flag"
	"os"
	"reflect"
	"strings"
	"testing"

	"swaysheet/core/crane"
)

var update = flag.Bool("update", false, "rewrite schema.json from the Go types and the Ranges table")

// enums lists the accepted words of string fields, by path.
var enums = map[string][]string{
	"motions[].axis":        Axes,
	"motions[].profile":     Profiles,
	"motions[].shaper.kind": ShaperKinds,
	"plan.axis":             crane.Names(true),
	"plan.drive":            {DriveVariableSpeed, DrivePendant},
	"settings.accuracy":     {"default", "tight"},
}

// schemaOf builds the JSON Schema of type t found at path, with the
// numeric bounds of the Ranges table: one source of truth for both.
func schemaOf(t reflect.Type, path string) map[string]any {
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	switch t.Kind() {
	case reflect.Struct:
		props := map[string]any{}
		var required []string
		var walk func(reflect.Type)
		walk = func(t reflect.Type) {
			for i := range t.NumField() {
				f := t.Field(i)
				if f.Anonymous {
					walk(f.Type)
					continue
				}
				tag := f.Tag.Get("json")
				name, opts, _ := strings.Cut(tag, ",")
				if name == "" || name == "-" {
					continue
				}
				p := name
				if path != "" {
					p = path + "." + name
				}
				if f.Type.Kind() == reflect.Slice {
					props[name] = map[string]any{"type": "array", "items": schemaOf(f.Type.Elem(), p+"[]")}
				} else {
					props[name] = schemaOf(f.Type, p)
				}
				if !strings.Contains(opts, "omit") {
					required = append(required, name)
				}
			}
		}
		walk(t)
		out := map[string]any{"type": "object", "additionalProperties": false, "properties": props}
		if len(required) > 0 {
			out["required"] = required
		}
		return out
	case reflect.Float64, reflect.Int:
		typ := "number"
		if t.Kind() == reflect.Int {
			typ = "integer"
		}
		out := map[string]any{"type": typ}
		if r, ok := Ranges[path]; ok {
			if r.OpenMin {
				out["exclusiveMinimum"] = r.Min
			} else {
				out["minimum"] = r.Min
			}
			out["maximum"] = r.Max
			if r.MinAbs > 0 { // 0, or at least MinAbs in size
				out["not"] = map[string]any{"exclusiveMinimum": -r.MinAbs, "exclusiveMaximum": r.MinAbs,
					"not": map[string]any{"const": 0}}
			}
			if r.Unit != "" {
				out["description"] = "unit: " + r.Unit
			}
		}
		return out
	case reflect.String:
		if e, ok := enums[path]; ok {
			return map[string]any{"enum": e}
		}
		return map[string]any{"type": "string"}
	case reflect.Bool:
		return map[string]any{"type": "boolean"}
	}
	panic("schema: no mapping for " + t.String() + " at " + path)
}

func generatedSchema(t *testing.T) []byte {
	root := schemaOf(reflect.TypeFor[Scenario](), "")
	root["$schema"] = "https://json-schema.org/draft/2020-12/schema"
	root["$id"] = "swaysheet-scenario-v1"
	root["title"] = "swaysheet scenario, version 1"
	root["description"] = "One lift: load, rope, crane motions, wind, initial swing, limits, settings and planning request. " +
		"SI units; each field carries its unit in its name; angles in degrees. Generated from core/scenario by " +
		"`go test ./core/scenario -run Schema -update`."
	props := root["properties"].(map[string]any)
	props["format"] = map[string]any{"const": FormatName}
	props["version"] = map[string]any{"const": Version}
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetIndent("", "  ")
	if err := enc.Encode(root); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// schema.json is what the Go types and the Ranges table say; rerun with
// -update after changing either.
func TestSchemaIsGenerated(t *testing.T) {
	want := generatedSchema(t)
	if *update {
		if err := os.WriteFile("schema.json", want, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	got, err := os.ReadFile("schema.json")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("schema.json is out of date: run go test ./core/scenario -run Schema -update")
	}
}
