//go:build js && wasm && !nofetch

package main

import (
	"errors"
	"fmt"
	"syscall/js"
)

// maxFetch bounds one file read from the origin (a scenario is at most
// 1 MiB).
const maxFetch = 1 << 20

// fetch reads url, relative to the worker's own location, from the page's
// origin with the browser's Fetch API, called through syscall/js. (Not
// net/http: it brought crypto/tls and the rest of the HTTP stack into the
// wasm, 2.2 MB of its 7.8 MB.) It is called on a goroutine of its own and
// waits there while the JavaScript event loop runs.
func fetch(url string) ([]byte, error) {
	if loc := js.Global().Get("location"); loc.Truthy() {
		url = js.Global().Get("URL").New(url, loc.Get("href")).Call("toString").String()
	}
	type result struct {
		data []byte
		err  error
	}
	done := make(chan result, 1)
	// send never blocks: the first answer counts (a callback must not wait
	// on the JavaScript event loop it runs on).
	send := func(r result) {
		select {
		case done <- r:
		default:
		}
	}
	var onResp, onBody, onErr js.Func
	onErr = js.FuncOf(func(_ js.Value, args []js.Value) any {
		msg := "the request failed"
		if len(args) > 0 && args[0].Truthy() {
			msg = args[0].Call("toString").String()
		}
		send(result{err: errors.New(url + ": " + msg)})
		return nil
	})
	onBody = js.FuncOf(func(_ js.Value, args []js.Value) any {
		buf := js.Global().Get("Uint8Array").New(args[0])
		n := buf.Get("length").Int()
		if n > maxFetch {
			send(result{err: fmt.Errorf("%s: larger than %d bytes", url, maxFetch)})
			return nil
		}
		b := make([]byte, n)
		js.CopyBytesToGo(b, buf)
		send(result{data: b})
		return nil
	})
	onResp = js.FuncOf(func(_ js.Value, args []js.Value) any {
		resp := args[0]
		if !resp.Get("ok").Bool() {
			send(result{err: fmt.Errorf("%s: %d %s", url, resp.Get("status").Int(), resp.Get("statusText").String())})
			return nil
		}
		resp.Call("arrayBuffer").Call("then", onBody).Call("catch", onErr)
		return nil
	})
	defer func() { onResp.Release(); onBody.Release(); onErr.Release() }()
	js.Global().Call("fetch", url).Call("then", onResp).Call("catch", onErr)
	r := <-done
	return r.data, r.err
}
