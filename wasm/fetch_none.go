//go:build js && wasm && nofetch

package main

// With the nofetch tag (the single-file build of make dist, which opens
// from a file and has no origin to read from) there is no site library
// and the examples are the copies built into the wasm.
var fetch, libraryFetch func(string) ([]byte, error)
