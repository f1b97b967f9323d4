package dist

import "fmt"

// The WebAssembly instructions DirectJumps reads: the core specification
// 1.0 (section 5.4) with the sign-extension operators, the non-trapping
// float-to-int conversions and bulk memory (0xFC 0 to 11), which Go's
// compiler writes.

const (
	opBlock    = 0x02
	opLoop     = 0x03
	opIf       = 0x04
	opElse     = 0x05
	opEnd      = 0x0b
	opBr       = 0x0c
	opBrIf     = 0x0d
	opBrTable  = 0x0e
	opReturn   = 0x0f
	opLocalGet = 0x20
	opLocalSet = 0x21
	opLocalTee = 0x22
	opI32Const = 0x41
	opI64Const = 0x42
	opI64Load  = 0x29
	opI64Store = 0x37
)

// instr is one decoded instruction: its opcode, where it starts and ends
// in the function's code, and the immediate DirectJumps needs (a label, a
// local's index, an i32.const) or br_table's labels, the default last.
type instr struct {
	op         byte
	start, end int
	imm        int64
	table      []int64
}

// nesting is how the instruction changes the depth of open blocks: +1 for
// block, loop and if, -1 for end.
func (in instr) nesting() int {
	switch in.op {
	case opBlock, opLoop, opIf:
		return 1
	case opEnd:
		return -1
	}
	return 0
}

// labels are a branch's labels: br's and br_if's one, br_table's all.
func (in instr) labels() []int64 {
	if in.op == opBrTable {
		return in.table
	}
	return []int64{in.imm}
}

// decodeInstrs decodes a function's instructions, its locals already read.
func decodeInstrs(code []byte) ([]instr, error) {
	r := &WasmReader{B: code}
	var out []instr
	for len(r.B) > 0 && r.Err == nil {
		in := instr{start: len(code) - len(r.B)}
		in.op = r.B[0]
		r.Bytes(1)
		switch op := in.op; {
		case op == opBlock || op == opLoop || op == opIf:
			if len(r.B) > 0 && (r.B[0] == 0x40 || (r.B[0] >= 0x6f && r.B[0] <= 0x7f)) {
				r.Bytes(1) // empty, or one value type
			} else {
				r.SLEB() // a type index
			}
		case op == opBr || op == opBrIf:
			in.imm = int64(r.ULEB())
		case op == opBrTable:
			n := r.ULEB()
			for i := 0; i <= n && r.Err == nil; i++ {
				in.table = append(in.table, int64(r.ULEB()))
			}
		case op == 0x10: // call
			r.ULEB()
		case op == 0x11: // call_indirect: type, table
			r.ULEB()
			r.ULEB()
		case op >= opLocalGet && op <= 0x24: // local and global get, set, tee
			in.imm = int64(r.ULEB())
		case op >= 0x28 && op <= 0x3e: // loads and stores: align, offset
			r.ULEB()
			r.ULEB()
		case op == 0x3f || op == 0x40: // memory.size, memory.grow
			r.Bytes(1)
		case op == opI32Const || op == 0x42:
			in.imm = r.SLEB()
		case op == 0x43:
			r.Bytes(4)
		case op == 0x44:
			r.Bytes(8)
		case op == 0xfc:
			switch sub := r.ULEB(); {
			case sub <= 7: // trunc_sat
			case sub == 8: // memory.init: data, memory
				r.ULEB()
				r.Bytes(1)
			case sub == 9: // data.drop
				r.ULEB()
			case sub == 10: // memory.copy: two memories
				r.Bytes(2)
			case sub == 11: // memory.fill
				r.Bytes(1)
			default:
				return nil, fmt.Errorf("instruction 0xfc %d at byte %d not known", sub, in.start)
			}
		case op <= 0x01 || op == opElse || op == opEnd || op == opReturn ||
			op == 0x1a || op == 0x1b || (op >= 0x45 && op <= 0xc4):
			// no immediate: unreachable, nop, else, end, return, drop,
			// select, the numeric and sign-extension operators
		default:
			return nil, fmt.Errorf("instruction %#x at byte %d not known", op, in.start)
		}
		in.end = len(code) - len(r.B)
		out = append(out, in)
	}
	if r.Err != nil {
		return nil, r.Err
	}
	return out, nil
}
