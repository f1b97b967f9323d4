//go:build !js

package main

import (
	"os"
	"runtime/pprof"
)

// startProfile starts a CPU profile into the named file; the returned
// function ends it.
func startProfile(name string) (func(), error) {
	f, err := os.Create(name)
	if err != nil {
		return nil, err
	}
	if err := pprof.StartCPUProfile(f); err != nil {
		f.Close()
		return nil, err
	}
	return func() { pprof.StopCPUProfile(); f.Close() }, nil
}
