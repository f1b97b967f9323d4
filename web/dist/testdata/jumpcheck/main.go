// Command jumpcheck prints what a Go program's control flow gives: loops,
// switches, goroutines and channels (the wasm stack unwinds and resumes),
// deep recursion (the stack grows), panics with their lines, defers,
// closures, maps, floats, timers, copies and clears of structs and
// arrays of several sizes (WriteOutCopies), and floats beyond the
// registers on both sides of a goroutine switch (LocalSpills). TestDirectJumpsRunTheSame runs it as
// go build writes it and packed (web/dist.Pack): the output must be the
// same.
package main

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"slices"
	"sort"
	"strconv"
	"strings"
	"sync"
	"time"
)

func collatz(n int) (steps int) {
	for n != 1 {
		if n%2 == 0 {
			n /= 2
		} else {
			n = 3*n + 1
		}
		steps++
	}
	return steps
}

func kind(i int) string {
	switch {
	case i%15 == 0:
		return "fizzbuzz"
	case i%5 == 0:
		return "buzz"
	case i%3 == 0:
		return "fizz"
	}
	switch i % 7 {
	case 0, 1:
		return "low"
	case 2:
		return "two"
	case 3, 4, 5:
		return "mid"
	default:
		return strconv.Itoa(i)
	}
}

func deep(n int) float64 {
	var pad [64]float64 // a large frame: the stack grows
	pad[n%64] = float64(n)
	if n == 0 {
		return 0
	}
	return pad[n%64] + deep(n-1)
}

func where() string {
	_, file, line, _ := runtime.Caller(1)
	return file[strings.LastIndex(file, "/")+1:] + ":" + strconv.Itoa(line)
}

// panicLines names the functions and lines of the stack from the panic
// up to main.
func panicLines() string {
	pc := make([]uintptr, 32)
	fr := runtime.CallersFrames(pc[:runtime.Callers(3, pc)])
	var out []string
	for {
		f, more := fr.Next()
		if strings.HasPrefix(f.Function, "main.") {
			out = append(out, f.Function+":"+strconv.Itoa(f.Line))
		}
		if !more || f.Function == "main.main" {
			return strings.Join(out, " ")
		}
	}
}

func risky(i int) (err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("recovered %v at %s, from %s", r, where(), panicLines())
		}
	}()
	a := []int{1, 2, 3}
	if i > 2 {
		return errors.New("no panic: " + strconv.Itoa(a[i%3]))
	}
	return errors.New(strconv.Itoa(a[i+5])) // index out of range
}

func primes(n int) []int {
	var out []int
outer:
	for i := 2; len(out) < n; i++ {
		for _, p := range out {
			if p*p > i {
				break
			}
			if i%p == 0 {
				continue outer
			}
		}
		out = append(out, i)
	}
	return out
}

func pipeline() []int {
	src := make(chan int)
	sq := make(chan int, 3)
	var wg sync.WaitGroup
	go func() {
		for i := range 20 {
			src <- i
		}
		close(src)
	}()
	for range 3 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for v := range src {
				time.Sleep(time.Microsecond) // unwinds to the event loop
				sq <- v * v
			}
		}()
	}
	go func() { wg.Wait(); close(sq) }()
	var got []int
	timeout := time.After(10 * time.Second)
	for {
		select {
		case v, ok := <-sq:
			if !ok {
				sort.Ints(got)
				return got
			}
			got = append(got, v)
		case <-timeout:
			return nil
		}
	}
}

type vec3 struct{ X, Y, Z float64 }

// part is 104 bytes: Go copies it with memory.copy and clears it with
// memory.fill.
type part struct {
	P, V, A, Arm vec3
	Kind         int
}

// table is 320 bytes, beyond CopyLimit: left as it is.
type table [40]float64

//go:noinline
func swapParts(a, b *part) { *a, *b = *b, *a }

//go:noinline
func clearPart(a *part) { *a = part{} }

//go:noinline
func moveVec(dst, src *[4]vec3, i, j int) { dst[i] = src[j] }

// copies moves parts, vectors and tables about and sums what they hold.
func copies() string {
	var ps [9]part
	for i := range ps {
		f := float64(i)
		ps[i] = part{P: vec3{f, 2 * f, 3 * f}, V: vec3{-f, f / 2, 1}, A: vec3{Z: f * f}, Arm: vec3{X: 1 / (f + 1)}, Kind: i}
	}
	for i := range 8 {
		swapParts(&ps[i], &ps[(i*5+3)%9])
	}
	clearPart(&ps[4])
	var a, b [4]vec3
	for i := range a {
		a[i] = vec3{float64(i), float64(i * i), -float64(i)}
	}
	for i := range 4 {
		moveVec(&b, &a, i, 3-i)
	}
	var t table
	for i := range t {
		t[i] = math.Sqrt(float64(i))
	}
	u := t
	u[7] = -1
	sum := 0.0
	kinds := 0
	for i, p := range ps {
		sum += float64(i+1) * (p.P.X + p.P.Y - p.P.Z + p.V.X*p.V.Y + p.A.Z + p.Arm.X)
		kinds = kinds*10 + p.Kind
	}
	for i, v := range b {
		sum += float64(i) * (v.X + 2*v.Y + 3*v.Z)
	}
	sum += u[7] + t[7] + u[39]
	return fmt.Sprintf("copies %d %s", kinds, strconv.FormatFloat(sum, 'g', -1, 64))
}

// tangle keeps more floats live than Go's 16 float registers hold, so
// some wait in the frame between uses, with no call in between
// (LocalSpills keeps those in locals).
func tangle(v *[24]float64) float64 {
	a0, a1, a2, a3, a4, a5 := v[0]*v[1], v[2]*v[3], v[4]*v[5], v[6]*v[7], v[8]*v[9], v[10]*v[11]
	b0, b1, b2, b3, b4, b5 := v[12]+v[13], v[14]+v[15], v[16]+v[17], v[18]+v[19], v[20]+v[21], v[22]+v[23]
	c0, c1, c2, c3, c4, c5 := a0-b5, a1-b4, a2-b3, a3-b2, a4-b1, a5-b0
	// All eighteen are live here, and used again in the other order.
	s := a0 + a1 + a2 + a3 + a4 + a5 + b0 + b1 + b2 + b3 + b4 + b5 + c0 + c1 + c2 + c3 + c4 + c5
	return s + c5*a0 + c4*a1 + c3*a2 + c2*a3 + c1*a4 + c0*a5 + b5*b0 + b4*b1 + b3*b2
}

// pressure keeps floats live across calls; with yield set a goroutine
// switch and a stack growth come between their uses, so they must stay
// in the frame.
func pressure(seed float64, yield bool) float64 {
	var v [24]float64
	for i := range v {
		v[i] = math.Sqrt(seed + float64(i))
	}
	t := tangle(&v)
	s0, s1, s2, s3, s4, s5, s6, s7 := v[0]*t, v[1]*t, v[2]*t, v[3]*t, v[4]-t, v[5]-t, v[6]-t, v[7]-t
	if yield {
		runtime.Gosched()
		s0 += deep(3000)
	}
	v[0] += s0
	return s0*s1 + s2*s3 + s4*s5 + s6*s7 + tangle(&v)
}

func main() {
	fmt.Println(copies())
	var press []string
	done := make(chan bool)
	for g := range 3 {
		go func() {
			for i := range 4 {
				press = append(press, strconv.FormatFloat(pressure(float64(g*10+i), i%2 == 1), 'g', -1, 64))
			}
			done <- true
		}()
		<-done
	}
	fmt.Println("pressure", press)
	sum := 0
	for i := 1; i < 3000; i++ {
		sum += collatz(i)
	}
	fmt.Println("collatz", sum)
	var kinds []string
	for i := range 40 {
		kinds = append(kinds, kind(i))
	}
	fmt.Println(strings.Join(kinds, " "))
	fmt.Println("deep", deep(20000))
	for i := range 5 {
		fmt.Println(risky(i))
	}
	fmt.Println("primes", primes(30))
	fmt.Println("pipeline", pipeline())
	m := map[string]float64{}
	x := 0.5
	for i := range 200 {
		x = 3.9 * x * (1 - x)
		m["k"+strconv.Itoa(i%17)] += math.Sqrt(x) * math.Sin(float64(i))
	}
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	for _, k := range keys {
		fmt.Print(k, "=", strconv.FormatFloat(m[k], 'g', -1, 64), " ")
	}
	fmt.Println()
	add := func(n int) func(int) int { return func(v int) int { return v + n } }
	f := add(3)
	i := 0
loop:
	if i < 5 {
		i = f(i)
		goto loop
	}
	fmt.Println("goto", i)
	defer fmt.Println("deferred last")
	fmt.Println("end")
}
