//go:build js && wasm

// Command wasm is the swaysheet core for the page, built as
// GOOS=js GOARCH=wasm and run inside a Web Worker (web/static/worker.js).
//
// It defines one JavaScript function,
//
//	swaysheetCall(name, inputJSON, done)
//
// that runs the call of bridge.Calls named name on a goroutine and calls
// done(replyJSON) with the reply, so a call that waits (reading the
// example files or the site library, fetch.go) never blocks the worker's
// event loop. It then sets
// swaysheetReady = true and blocks forever: the program never exits while
// the page is open.
package main

import (
	"syscall/js"

	"swaysheet/wasm/bridge"
)

func main() {
	register()
	select {}
}

func register() {
	env := &bridge.Env{Fetch: fetch, LibraryFetch: libraryFetch}
	js.Global().Set("swaysheetCall", js.FuncOf(func(this js.Value, args []js.Value) any {
		if len(args) < 3 || args[0].Type() != js.TypeString || args[1].Type() != js.TypeString || args[2].Type() != js.TypeFunction {
			return js.ValueOf(`{"error":{"message":"swaysheetCall(name, inputJSON, done) needs two strings and a function","fields":[]}}`)
		}
		name, input, done := args[0].String(), args[1].String(), args[2]
		go func() {
			done.Invoke(string(bridge.Call(env, name, []byte(input))))
		}()
		return js.Undefined()
	}))
	js.Global().Set("swaysheetReady", true)
}
