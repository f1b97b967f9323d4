package main

import (
	"fmt"
	"time"
)

// Code shapes: four small loops timed natively and as wasm (-shapes), so
// that each bench shows what Go's wasm charges for each way of writing the
// same arithmetic, beside the examples' wasm/native ratios. They are
// measurements of the compiler and the engine, not of the core:
//
//   - locals: a 3-by-3 matrix times a 3-by-3 matrix and a 9-term dot
//     product, every number a local variable (Go keeps them in registers,
//     wasm in locals).
//   - arrays: the same sums, in the same order, on [9]float64 arrays (Go
//     keeps arrays of more than one element in memory, natively and in
//     wasm alike); its sum in the note is the locals shape's to the bit.
//   - call: a two-argument function Go does not inline, called each round
//     (in wasm its arguments and result pass through linear memory, and
//     its return checks for unwinding).
//   - vector by value: a cross product of two 3-vectors passed and
//     returned by value to a function Go does not inline.
//
// The rigid load's model is mostly the arrays and calls shapes (3-by-3
// matrices, 9-vectors, frames passed by pointer); the specialised
// single-rope path's stages and history samples the arrays shape
// (6-element states, the dense output's coefficients).

// shapeRounds is each shape's rounds per timing.
const shapeRounds = 2_000_000

type shape struct {
	name, note string
	run        func(n int) float64
}

var shapes = []shape{
	{"locals", "matrix product and dot product on local variables", shapeLocals},
	{"arrays", "the same sums on [9]float64 arrays", shapeArrays},
	{"call", "a call Go does not inline, two float arguments", shapeCall},
	{"vector by value", "a cross product of 3-vectors by value, not inlined", shapeVectors},
}

// shapeRows times each shape (the fastest of five timings after one
// tenth as warm-up) and reports nanoseconds per round.
func shapeRows(group string, n int) []Row {
	var rows []Row
	for _, s := range shapes {
		sink := s.run(n / 10)
		best := time.Duration(1 << 62)
		for range 5 {
			t0 := time.Now()
			sink += s.run(n)
			best = min(best, time.Since(t0))
		}
		rows = append(rows, Row{Group: group, Name: s.name, Value: float64(best.Nanoseconds()) / float64(n), Unit: "ns",
			Note: fmt.Sprintf("%s; per round, fastest of 5 timings of %d rounds (sum %.6g)", s.note, n, sink)})
	}
	return rows
}

// shapeRatios pairs the shapes' native and wasm rows: wasm over native.
func shapeRatios(rows []Row) []Row {
	names, each := wasmOverNative(rows, "shapes ")
	var out []Row
	for _, name := range names {
		out = append(out, Row{Group: "wasm / native, code shapes", Name: name, Value: fastest(each[name]), Unit: "x",
			Note: "the same loop as wasm under node over natively (no target: what Go's wasm charges for this shape)"})
	}
	return out
}

func shapeLocals(n int) float64 {
	m0, m1, m2, m3, m4, m5, m6, m7, m8 := 0.0, 0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08
	v0, v1, v2, v3, v4, v5, v6, v7, v8 := 1.0, 0.98, 0.96, 0.94, 0.92, 0.90, 0.88, 0.86, 0.84
	acc := 0.0
	for range n {
		w0, w1, w2 := m0*v0+m1*v3+m2*v6, m0*v1+m1*v4+m2*v7, m0*v2+m1*v5+m2*v8
		w3, w4, w5 := m3*v0+m4*v3+m5*v6, m3*v1+m4*v4+m5*v7, m3*v2+m4*v5+m5*v8
		w6, w7, w8 := m6*v0+m7*v3+m8*v6, m6*v1+m7*v4+m8*v7, m6*v2+m7*v5+m8*v8
		acc += w0*v0 + w1*v1 + w2*v2 + w3*v3 + w4*v4 + w5*v5 + w6*v6 + w7*v7 + w8*v8
		v0 += 1e-9
	}
	return acc
}

func shapeArrays(n int) float64 {
	m := [9]float64{0.0, 0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08}
	v := [9]float64{1.0, 0.98, 0.96, 0.94, 0.92, 0.90, 0.88, 0.86, 0.84}
	acc := 0.0
	for range n {
		var w [9]float64
		for i := range 3 {
			for j := range 3 {
				w[3*i+j] = m[3*i]*v[j] + m[3*i+1]*v[3+j] + m[3*i+2]*v[6+j]
			}
		}
		s := 0.0
		for i := range 9 {
			s += w[i] * v[i]
		}
		acc += s
		v[0] += 1e-9
	}
	return acc
}

//go:noinline
func shapeMulAdd(a, b float64) float64 { return a*b + 1e-9 }

func shapeCall(n int) float64 {
	acc := 0.0
	for range n {
		acc = shapeMulAdd(acc, 0.999999)
	}
	return acc
}

type shapeVec struct{ x, y, z float64 }

//go:noinline
func shapeCross(a, b shapeVec) shapeVec {
	return shapeVec{a.y*b.z - a.z*b.y, a.z*b.x - a.x*b.z, a.x*b.y - a.y*b.x}
}

func shapeVectors(n int) float64 {
	a, b := shapeVec{1, 2, 3}, shapeVec{0.3, -0.2, 0.1}
	acc := 0.0
	for range n {
		c := shapeCross(a, b)
		acc += c.x + c.y + c.z
		a.x += 1e-9
	}
	return acc
}
