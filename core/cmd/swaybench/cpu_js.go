//go:build js

package main

import "errors"

// processCPU is not known under js/wasm.
func processCPU() float64 { return 0 }

// startProfile is not available under js/wasm: node --cpu-prof profiles
// the wasm instead.
func startProfile(string) (func(), error) {
	return nil, errors.New("-cpuprofile: not under js/wasm; run node with --cpu-prof")
}
