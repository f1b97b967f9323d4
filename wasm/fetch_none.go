//go:build js && wasm && nofetch

package main

// With the nofetch tag (the single-file build of make dist, which opens
// from a file and has no origin to read from) the wasm leaves out net/http
// and the example library uses the copies built into it.
var fetch func(string) ([]byte, error)
