//go:build js && wasm

// Command fetch is the page's second, small wasm (out/web/swayfetch.wasm):
// it reads files of the site library from the page's own server with
// tinyutil's httputil and returns their text. It only fetches: the
// swaysheet core (the main wasm, which links no net/http) parses the
// library's index and checks every file before the page adopts it.
// web/static/fetchworker.js runs it in a worker of its own, started only
// when the site library is opened.
//
// It defines one JavaScript function,
//
//	swayfetchGet(url, done)
//
// that reads url (relative to the worker's location) on a goroutine and
// calls done(text, "") with the file's text, or done("", message) when it
// could not be read; then it sets swayfetchReady = true and blocks.
package main

import (
	"errors"
	"io"
	"net/http"
	"strconv"
	"syscall/js"

	"github.com/syumai/tinyutil/httputil"
)

// maxBytes is the most read of one file; a library file is a few KB.
const maxBytes = 1 << 20

func main() {
	register()
	select {}
}

func register() {
	js.Global().Set("swayfetchGet", js.FuncOf(func(this js.Value, args []js.Value) any {
		if len(args) < 2 || args[0].Type() != js.TypeString || args[1].Type() != js.TypeFunction {
			return js.ValueOf("swayfetchGet(url, done) needs a string and a function")
		}
		url, done := args[0].String(), args[1]
		go func() {
			b, err := get(url)
			if err != nil {
				done.Invoke("", err.Error())
				return
			}
			done.Invoke(string(b), "")
		}()
		return js.Undefined()
	}))
	js.Global().Set("swayfetchReady", true)
}

// get reads url, relative to the worker's own location, from the page's
// origin with the Fetch API through tinyutil's httputil.
func get(url string) ([]byte, error) {
	if loc := js.Global().Get("location"); loc.Truthy() {
		url = js.Global().Get("URL").New(url, loc.Get("href")).Call("toString").String()
	}
	resp, err := httputil.Get(url)
	if err != nil {
		return nil, err
	}
	defer resp.Body.Close()
	if resp.StatusCode != http.StatusOK {
		return nil, errors.New(url + ": " + resp.Status)
	}
	b, err := io.ReadAll(io.LimitReader(resp.Body, maxBytes+1))
	if err != nil {
		return nil, err
	}
	if len(b) > maxBytes {
		return nil, errors.New(url + ": larger than " + strconv.Itoa(maxBytes) + " bytes")
	}
	return b, nil
}
