//go:build wasm

package sway

// powLog and powExp under wasm: see fastpow.go.
func powLog(x float64) float64 { return stepLog(x) }

func powExp(x float64) float64 { return stepExp(x) }
