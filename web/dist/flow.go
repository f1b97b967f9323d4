package dist

import "errors"

// flow is a function's control flow, instruction by instruction: where
// each one may go next (WebAssembly core specification 1.0, 4.4.5: a
// branch to a block or an if goes to its end, one to a loop to its
// start; br_if and if go on or branch; else, met at the end of an if's
// first part, goes to the if's end; return, unreachable and a call that
// never returns go nowhere).
type flow struct {
	succ  [][]int
	calls []int // the calls that may return
}

// readFlow reads the control flow of ins; returns tells whether a call
// may return (call_indirect always may).
func readFlow(ins []instr, returns func(instr) bool) (*flow, error) {
	n := len(ins)
	g := &flow{succ: make([][]int, n)}
	// Each opener's end and else.
	end, els := make([]int, n), make([]int, n)
	var stack []int
	for k, in := range ins {
		switch in.op {
		case opBlock, opLoop, opIf:
			stack = append(stack, k)
			els[k] = -1
		case opElse:
			if len(stack) == 0 {
				return nil, errors.New("flow: else outside an if")
			}
			els[stack[len(stack)-1]] = k
		case opEnd:
			if len(stack) > 0 {
				end[stack[len(stack)-1]] = k
				stack = stack[:len(stack)-1]
			}
		}
	}
	if len(stack) != 0 {
		return nil, errors.New("flow: a block is not closed")
	}
	target := func(l int64) (int, bool) {
		if l >= int64(len(stack)) {
			return 0, false // the function's own block: it returns
		}
		c := stack[len(stack)-1-int(l)]
		if ins[c].op == opLoop {
			return c + 1, true
		}
		return end[c], true
	}
	add := func(k, t int) {
		if t < n {
			g.succ[k] = append(g.succ[k], t)
		}
	}
	for k, in := range ins {
		switch in.op {
		case opBlock, opLoop:
			stack = append(stack, k)
			add(k, k+1)
		case opIf:
			stack = append(stack, k)
			add(k, k+1)
			if e := els[k]; e >= 0 {
				add(k, e+1)
			} else {
				add(k, end[k])
			}
		case opElse:
			add(k, end[stack[len(stack)-1]])
		case opEnd:
			if len(stack) > 0 {
				stack = stack[:len(stack)-1]
			}
			add(k, k+1)
		case opBr:
			if t, ok := target(in.imm); ok {
				add(k, t)
			}
		case opBrIf:
			add(k, k+1)
			if t, ok := target(in.imm); ok {
				add(k, t)
			}
		case opBrTable:
			for _, l := range in.table {
				if t, ok := target(l); ok {
					add(k, t)
				}
			}
		case opReturn, 0x00: // return, unreachable
		case 0x10, 0x11: // call, call_indirect
			if in.op == 0x11 || returns(in) {
				g.calls = append(g.calls, k)
				add(k, k+1)
			}
		default:
			add(k, k+1)
		}
	}
	return g, nil
}

// liveness gives, for each instruction, the slots live where it starts
// (a bit set of n slots): read later on some way before being written.
// access tells which slot an instruction reads (gen) and which it writes
// (kill), -1 for none.
func (g *flow) liveness(n int, access func(k int) (gen, kill int)) [][]uint64 {
	words := (n + 63) / 64
	live := make([][]uint64, len(g.succ))
	buf := make([]uint64, len(g.succ)*words)
	for k := range live {
		live[k] = buf[k*words : (k+1)*words]
	}
	gen, kill := make([]int, len(g.succ)), make([]int, len(g.succ))
	for k := range g.succ {
		gen[k], kill[k] = access(k)
	}
	out := make([]uint64, words)
	for changed := true; changed; {
		changed = false
		for k := len(g.succ) - 1; k >= 0; k-- {
			clear(out)
			for _, s := range g.succ[k] {
				for w := range out {
					out[w] |= live[s][w]
				}
			}
			if j := kill[k]; j >= 0 {
				out[j/64] &^= 1 << (j % 64)
			}
			if j := gen[k]; j >= 0 {
				out[j/64] |= 1 << (j % 64)
			}
			for w := range out {
				if out[w] != live[k][w] {
					live[k][w] = out[w]
					changed = true
				}
			}
		}
	}
	return live
}

// liveAtEntryOrCall tells whether slot j is live where the function
// starts or right after a call that may return: where a goroutine that
// unwound comes back with only what is in memory.
func (g *flow) liveAtEntryOrCall(live [][]uint64, j int) bool {
	bit := uint64(1) << (j % 64)
	if len(live) > 0 && live[0][j/64]&bit != 0 {
		return true
	}
	for _, c := range g.calls {
		if c+1 < len(live) && live[c+1][j/64]&bit != 0 {
			return true
		}
	}
	return false
}

// setOnEveryWay gives, for each instruction, the slots (a bit set of n)
// set on every way from the function's entry to where it starts: a
// forward "must" analysis, each instruction's set the meet of its
// predecessors' on their way out, from all set but at the entry, to a
// fixed point. def tells which slot an instruction sets (-1 for none).
// An instruction no way reaches has none set. ok is false when the
// entry is itself a branch's target (not Go's form).
func (g *flow) setOnEveryWay(n int, def func(k int) int) (set [][]uint64, ok bool) {
	m := len(g.succ)
	words := (n + 63) / 64
	preds := make([][]int, m)
	for k, ss := range g.succ {
		for _, s := range ss {
			preds[s] = append(preds[s], k)
		}
	}
	if m == 0 || len(preds[0]) > 0 {
		return nil, false
	}
	defs := make([]int, m)
	for k := range defs {
		defs[k] = def(k)
	}
	set = make([][]uint64, m)
	buf := make([]uint64, m*words)
	for k := range set {
		set[k] = buf[k*words : (k+1)*words]
		if k > 0 {
			for w := range set[k] {
				set[k][w] = ^uint64(0)
			}
		}
	}
	acc := make([]uint64, words)
	for changed := true; changed; {
		changed = false
		for k := 1; k < m; k++ {
			for w := range acc {
				acc[w] = ^uint64(0)
			}
			if len(preds[k]) == 0 {
				clear(acc)
			}
			for _, p := range preds[k] {
				d := defs[p]
				for w := range acc {
					out := set[p][w]
					if d >= 0 && d/64 == w {
						out |= 1 << (d % 64)
					}
					acc[w] &= out
				}
			}
			for w := range acc {
				if acc[w] != set[k][w] {
					set[k][w] = acc[w]
					changed = true
				}
			}
		}
	}
	return set, true
}
