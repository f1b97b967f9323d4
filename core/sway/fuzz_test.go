package sway_test

import (
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// FuzzEvaluate decodes arbitrary bytes as a scenario and evaluates every
// one that decodes. Evaluation must never panic and always end (the core
// bounds the run length and the number of integration steps); it returns
// either an error with a message or a result with no NaN or infinity in
// any field, which encodes as JSON (the page's wasm bridge sends it so).
//
// The seed corpus is every scenario file of the repository plus the odd
// cases in testdata/fuzz/FuzzEvaluate. Runs are bounded to 200,000 steps
// and a tenth of the default work budget so that each input takes under a
// second; both limits' paths are then exercised too. An accepted run keeps
// the rope within its accepted range.
func FuzzEvaluate(f *testing.F) {
	for _, g := range []string{"../../testdata/scenarios/*.json", "../../testdata/reference/scenarios/*.json"} {
		files, _ := filepath.Glob(g)
		for _, name := range files {
			data, err := os.ReadFile(name)
			if err != nil {
				f.Fatal(err)
			}
			f.Add(data)
		}
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		s, err := scenario.Parse(data)
		if err != nil {
			return // FuzzParse checks the messages
		}
		// A lower step bound than the default keeps each run short; the
		// step limit path is then exercised too.
		res, err := sway.EvaluateWith(s, sway.Options{MaxSteps: 200_000, Budget: sway.NewBudget(sway.DefaultWork/10, "")})
		if err != nil {
			if err.Error() == "" {
				t.Fatalf("error without a message: %T", err)
			}
			var es scenario.Errors
			if errors.As(err, &es) {
				for _, e := range es {
					if e.Field == "" || e.Message == "" {
						t.Fatalf("field error without field or message: %+v", e)
					}
				}
			}
			return
		}
		if path, v, ok := nonFinite(reflect.ValueOf(res).Elem(), "result"); ok {
			t.Fatalf("%s is %v", path, v)
		}
		if _, err := json.Marshal(res); err != nil {
			t.Fatalf("the result does not encode as JSON: %v", err)
		}
		if res.PeakSwingDeg < res.ResidualSwingDeg-1e-9 || res.PeakExcursionM < res.ResidualExcursionM-1e-9 {
			t.Fatalf("residual above peak: swing %g > %g, excursion %g > %g",
				res.ResidualSwingDeg, res.PeakSwingDeg, res.ResidualExcursionM, res.PeakExcursionM)
		}
		for _, l := range append([]float64{res.RopeLengthStartM, res.RopeLengthEndM}, res.History.RopeM...) {
			if l < scenario.MinRopeM-1e-9 || l > 500+1e-9 {
				t.Fatalf("rope length %g m outside its accepted range", l)
			}
		}
		if res.TensionMaxN < res.TensionMinN {
			t.Fatalf("tension max %g below min %g", res.TensionMaxN, res.TensionMinN)
		}
	})
}

// nonFinite finds the first NaN or infinite float in v, walking structs,
// slices and pointers, and returns its path.
func nonFinite(v reflect.Value, path string) (string, float64, bool) {
	switch v.Kind() {
	case reflect.Float32, reflect.Float64:
		if x := v.Float(); math.IsNaN(x) || math.IsInf(x, 0) {
			return path, x, true
		}
	case reflect.Pointer, reflect.Interface:
		if !v.IsNil() {
			return nonFinite(v.Elem(), path)
		}
	case reflect.Struct:
		for i := range v.NumField() {
			if p, x, ok := nonFinite(v.Field(i), path+"."+v.Type().Field(i).Name); ok {
				return p, x, true
			}
		}
	case reflect.Slice, reflect.Array:
		for i := range v.Len() {
			if p, x, ok := nonFinite(v.Index(i), path+"[]"); ok {
				return p, x, true
			}
		}
	}
	return "", 0, false
}
