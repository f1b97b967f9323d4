package clearance

import (
	"encoding/binary"
	"errors"
	"math"
)

// A part's runs travel between the page's workers as one block of bytes
// (Part.Data, base64 in the JSON): numbers as they are held (float64
// little-endian, so nothing is rounded on the way) and whole numbers as
// varints. Decoding it is a loop over bytes, where the JSON of the same
// runs (about 5.5 kB a run, most of it the section's floats in base64
// inside the JSON) cost the join some 0.4 s in wasm for 1,000 runs.
//
// The block: "swp2", the run count, then each run: its stray, the number
// of obstacles and each one's near (flags, then eight numbers, the first
// strike's four and the name of the line that made it (its length first,
// one byte; empty but for the rope's) when it strikes, the gap's five when
// over, the nearest line's name (the same way), and with the
// rope checked the rope's near the same way), the cells
// (count, then each zigzag varint), the section (the first bin's index,
// the bin count, the lows, the highs).

var partMagic = [4]byte{'s', 'w', 'p', '2'}

const (
	nearStrikes = 1 << iota
	nearOver
	nearRope
)

// encodeRuns writes the runs as one block.
func encodeRuns(runs []RunPart) []byte {
	var b []byte
	b = append(b, partMagic[:]...)
	b = binary.AppendUvarint(b, uint64(len(runs)))
	f := func(x float64) { b = binary.LittleEndian.AppendUint64(b, math.Float64bits(x)) }
	for i := range runs {
		r := &runs[i]
		f(r.StrayM)
		b = binary.AppendUvarint(b, uint64(len(r.Near)))
		for k := range r.Near {
			b = appendNear(b, &r.Near[k])
		}
		b = binary.AppendUvarint(b, uint64(len(r.Cells)))
		for _, c := range r.Cells {
			b = binary.AppendVarint(b, int64(c))
		}
		b = binary.AppendVarint(b, int64(r.bins.J0))
		b = binary.AppendUvarint(b, uint64(len(r.bins.Low)))
		for _, x := range r.bins.Low {
			f(x)
		}
		for _, x := range r.bins.High {
			f(x)
		}
	}
	return b
}

// appendNear writes one near (and its rope's, after the line's name).
func appendNear(b []byte, n *Closest) []byte {
	f := func(x float64) { b = binary.LittleEndian.AppendUint64(b, math.Float64bits(x)) }
	p3 := func(p Point3) { f(p.X); f(p.Y); f(p.Z) }
	var flags byte
	if n.Strikes {
		flags |= nearStrikes
	}
	over := !math.IsInf(n.GapM, 1)
	if over {
		flags |= nearOver
	}
	if n.Rope != nil {
		flags |= nearRope
	}
	b = append(b, flags)
	f(n.ClearanceM)
	f(n.TimeS)
	p3(n.At)
	f(n.ErrorBoundM)
	if n.Strikes {
		f(n.FirstStrikeS)
		p3(n.FirstStrikeAt)
		b = appendName(b, n.FirstStrikeLine)
	}
	if over {
		f(n.GapM)
		f(n.GapAtS)
		p3(n.GapAt)
	}
	b = appendName(b, n.Line)
	if n.Rope != nil {
		b = appendNear(b, n.Rope)
	}
	return b
}

// appendName writes a line's name, its length first in one byte (the
// names are the core's own: "hoist rope", "sling leg 2"; one longer than
// 255 bytes is cut).
//
//go:noinline
func appendName(b []byte, name string) []byte {
	name = name[:min(len(name), 255)]
	return append(append(b, byte(len(name))), name...)
}

var errPartData = errors.New("clearance: a part's data is not whole (not made by clearance_part of this version)")

// partReader reads a block; the first fault sticks and reads give zeros.
type partReader struct {
	b   []byte
	err error
}

func (r *partReader) fail() { r.err, r.b = errPartData, nil }

func (r *partReader) float() float64 {
	if len(r.b) < 8 {
		r.fail()
		return 0
	}
	x := math.Float64frombits(binary.LittleEndian.Uint64(r.b))
	r.b = r.b[8:]
	return x
}

func (r *partReader) point() Point3 { return Point3{r.float(), r.float(), r.float()} }

// count reads a count of items, each at least minBytes long, that must
// fit in what is left.
func (r *partReader) count(minBytes int) int {
	v, n := binary.Uvarint(r.b)
	if n <= 0 || v > uint64(len(r.b)/minBytes) {
		r.fail()
		return 0
	}
	r.b = r.b[n:]
	return int(v)
}

func (r *partReader) int() int {
	v, n := binary.Varint(r.b)
	if n <= 0 || v > 1<<40 || v < -(1<<40) {
		r.fail()
		return 0
	}
	r.b = r.b[n:]
	return int(v)
}

// name reads a name written by appendName.
func (r *partReader) name() string {
	if len(r.b) < 1 || len(r.b) <= int(r.b[0]) {
		r.fail()
		return ""
	}
	l := 1 + int(r.b[0])
	s := string(r.b[1:l])
	r.b = r.b[l:]
	return s
}

// decodeRuns reads a block written by encodeRuns.
func decodeRuns(data []byte) ([]RunPart, error) {
	if len(data) < 4 || [4]byte(data[:4]) != partMagic {
		return nil, errPartData
	}
	r := &partReader{b: data[4:]}
	runs := make([]RunPart, r.count(8))
	for i := range runs {
		if r.err != nil {
			break
		}
		rp := &runs[i]
		rp.StrayM = r.float()
		rp.Near = make([]Closest, r.count(1))
		for k := range rp.Near {
			rp.Near[k] = r.near(0)
		}
		rp.Cells = make([]int, r.count(1))
		for k := range rp.Cells {
			rp.Cells[k] = r.int()
		}
		rp.bins.J0 = r.int()
		nb := r.count(16)
		rp.bins.Low, rp.bins.High = make([]float64, nb), make([]float64, nb)
		for k := range rp.bins.Low {
			rp.bins.Low[k] = r.float()
		}
		for k := range rp.bins.High {
			rp.bins.High[k] = r.float()
		}
	}
	if r.err == nil && len(r.b) != 0 {
		r.fail()
	}
	if r.err != nil {
		return nil, r.err
	}
	return runs, nil
}

// near reads one near written by appendNear; a rope's near has no rope of
// its own (depth 1).
func (r *partReader) near(depth int) Closest {
	if len(r.b) < 1 {
		r.fail()
		return Closest{}
	}
	flags := r.b[0]
	r.b = r.b[1:]
	// What the block leaves out reads as the checker gives it: no strike
	// (FirstStrikeS NaN), never over the outline (GapM +Inf).
	n := Closest{Strikes: flags&nearStrikes != 0, FirstStrikeS: math.NaN(), GapM: math.Inf(1)}
	n.ClearanceM, n.TimeS, n.At, n.ErrorBoundM = r.float(), r.float(), r.point(), r.float()
	if n.Strikes {
		n.FirstStrikeS, n.FirstStrikeAt, n.FirstStrikeLine = r.float(), r.point(), r.name()
	}
	if flags&nearOver != 0 {
		n.GapM, n.GapAtS, n.GapAt = r.float(), r.float(), r.point()
	}
	n.Line = r.name()
	if r.err != nil {
		return Closest{}
	}
	if flags&nearRope != 0 {
		if depth > 0 {
			r.fail()
			return Closest{}
		}
		rope := r.near(depth + 1)
		n.Rope = &rope
	}
	return n
}
