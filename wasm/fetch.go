//go:build js && wasm && !nofetch

package main

import (
	"fmt"
	"io"
	"net/http"
	"syscall/js"

	"github.com/syumai/tinyutil/httputil"
)

// fetch reads url, relative to the worker's own location, from the page's
// origin with the Fetch API through tinyutil's httputil.
func fetch(url string) ([]byte, error) {
	if loc := js.Global().Get("location"); loc.Truthy() {
		url = js.Global().Get("URL").New(url, loc.Get("href")).Call("toString").String()
	}
	resp, err := httputil.Get(url)
	if err != nil {
		return nil, err
	}
	defer resp.Body.Close()
	if resp.StatusCode != http.StatusOK {
		return nil, fmt.Errorf("%s: %s", url, resp.Status)
	}
	return io.ReadAll(io.LimitReader(resp.Body, 1<<20))
}
