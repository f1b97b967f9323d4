//go:build js && wasm

package main

import (
	"encoding/json"
	"os"
	"syscall/js"
	"testing"
	"time"
)

// call runs swaysheetCall through JavaScript, as the worker does.
func call(t *testing.T, name, input string) string {
	t.Helper()
	ch := make(chan string, 1)
	done := js.FuncOf(func(this js.Value, args []js.Value) any {
		ch <- args[0].String()
		return nil
	})
	defer done.Release()
	js.Global().Call("swaysheetCall", name, input, done)
	select {
	case s := <-ch:
		return s
	case <-time.After(60 * time.Second):
		t.Fatal("no reply")
	}
	return ""
}

func TestJSCalls(t *testing.T) {
	register()
	if !js.Global().Get("swaysheetReady").Bool() {
		t.Fatal("not ready")
	}
	data, err := os.ReadFile("../testdata/scenarios/bay-travel.json")
	if err != nil {
		t.Fatal(err)
	}
	var r struct {
		Result *struct {
			PeriodS float64 `json:"period_s"`
		} `json:"result"`
		Error *struct {
			Message string `json:"message"`
		} `json:"error"`
	}
	if err := json.Unmarshal([]byte(call(t, "evaluate", string(data))), &r); err != nil || r.Result == nil || r.Result.PeriodS <= 0 {
		t.Fatalf("evaluate: %v %+v", err, r.Error)
	}
	r.Result = nil
	if err := json.Unmarshal([]byte(call(t, "evaluate", "{not json")), &r); err != nil || r.Error == nil {
		t.Fatalf("bad input: %v %+v", err, r)
	}
	// Wrong arguments give an error reply, not a panic.
	bad := js.Global().Call("swaysheetCall", 1)
	if bad.Type() != js.TypeString {
		t.Fatalf("wrong arguments: %v", bad)
	}
	// Under node there is no page origin: the fetch fails and the embedded
	// copies are used.
	var ex struct {
		Result struct {
			Source   string `json:"source"`
			Examples []any  `json:"examples"`
		} `json:"result"`
	}
	if err := json.Unmarshal([]byte(call(t, "examples", "")), &ex); err != nil || ex.Result.Source != "embedded" || len(ex.Result.Examples) == 0 {
		t.Fatalf("examples: %v %+v", err, ex.Result.Source)
	}
}

func TestJSPlan(t *testing.T) {
	register()
	data, err := os.ReadFile("../testdata/scenarios/plan-tower-slew.json")
	if err != nil {
		t.Fatal(err)
	}
	var r struct {
		Result *struct {
			Axis        string `json:"axis"`
			Options     []any  `json:"options"`
			Recommended int    `json:"recommended"`
		} `json:"result"`
		Error *struct {
			Message string `json:"message"`
		} `json:"error"`
	}
	start := time.Now()
	if err := json.Unmarshal([]byte(call(t, "plan", string(data))), &r); err != nil || r.Result == nil || r.Result.Axis != "slew" || len(r.Result.Options) == 0 {
		t.Fatalf("plan: %v %+v", err, r.Error)
	}
	t.Logf("slew plan under node: %d options, recommended %d, %v", len(r.Result.Options), r.Result.Recommended, time.Since(start))
	r.Result = nil
	if err := json.Unmarshal([]byte(call(t, "plan", `{"format":"swaysheet-scenario","version":1}`)), &r); err != nil || r.Error == nil {
		t.Fatalf("bad input: %v %+v", err, r)
	}
	// The site library under node: no page origin to read it from, so
	// an error reply that says so, never a crash.
	var lib struct {
		Error *struct {
			Message string `json:"message"`
		} `json:"error"`
	}
	if err := json.Unmarshal([]byte(call(t, "library", "")), &lib); err != nil || lib.Error == nil || lib.Error.Message == "" {
		t.Fatalf("library: %v %+v", err, lib.Error)
	}
}
