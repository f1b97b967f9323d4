//go:build js && wasm && !nofetch

package main

import (
	"errors"
	"syscall/js"
)

// fetch reads a file of the page's origin (the example files) through the
// worker's swaysheetFetch hook (web/static/worker.js: the Fetch API). It
// leaves net/http out of this wasm.
func fetch(url string) ([]byte, error) { return hook("example", url) }

// libraryFetch reads a file of the site library through the same hook,
// which passes it to the small fetch wasm (wasm/fetch, tinyutil's
// httputil) in a worker of its own, started the first time the library
// is opened.
func libraryFetch(url string) ([]byte, error) { return hook("library", url) }

// hook calls swaysheetFetch(kind, url, done) and waits for done(text,
// errorMessage). The worker answers every call, with an error after its
// deadline when nothing came back.
func hook(kind, url string) ([]byte, error) {
	f := js.Global().Get("swaysheetFetch")
	if f.Type() != js.TypeFunction {
		return nil, errors.New("this page cannot read files from its server (no swaysheetFetch in the worker)")
	}
	type reply struct {
		text string
		err  string
	}
	ch := make(chan reply, 1)
	done := js.FuncOf(func(this js.Value, args []js.Value) any {
		var r reply
		if len(args) > 0 && args[0].Type() == js.TypeString {
			r.text = args[0].String()
		}
		if len(args) > 1 && args[1].Type() == js.TypeString {
			r.err = args[1].String()
		}
		ch <- r
		return nil
	})
	defer done.Release()
	f.Invoke(kind, url, done)
	r := <-ch
	if r.err != "" {
		return nil, errors.New(r.err)
	}
	return []byte(r.text), nil
}
