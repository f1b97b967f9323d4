package sway

import (
	"sort"

	"swaysheet/core/motion"
)

// stoppedPieces lists the components of a move cut by an emergency stop
// (motion.Stopped) for the specialised path: the base's components, each
// frozen where it is at the stop, and the first of them carrying on with
// the stop's own pieces (the speed at the stop held for the reaction time,
// then braking), moved to start from its own position. The components add
// up to the stopped move: before the stop they are the base's, after it
// their frozen positions add to the base's position at the stop, to which
// the stop's pieces add the distance covered since.
func stoppedPieces(q *motion.Stopped, shift, scale float64, out [][]motion.Piece) ([][]motion.Piece, bool) {
	comps, ok := flatPieces(q.Base, shift, scale, nil)
	if !ok || len(comps) == 0 {
		return nil, false
	}
	at := q.AtS + shift
	tail := q.Tail()
	p0 := tail[0].P
	for k, c := range comps {
		pos, _ := pieceAt(c, at)
		i := sort.Search(len(c), func(i int) bool { return c[i].T >= at })
		cut := append([]motion.Piece(nil), c[:i]...)
		if i == 0 && c[0].V != 0 {
			// Steady before its first piece: keep it so up to the stop.
			before, _ := pieceAt(c, at-1)
			cut = append(cut, motion.Piece{T: at - 1, P: before, V: c[0].V})
		}
		if k > 0 {
			cut = append(cut, motion.Piece{T: at, P: pos})
		} else {
			for _, t := range tail {
				cut = append(cut, motion.Piece{T: t.T + shift, P: pos + (t.P-p0)*scale,
					V: t.V * scale, A: t.A * scale, J: t.J * scale})
			}
		}
		out = append(out, cut)
	}
	return out, true
}

// pieceAt is the position and speed of one component at t.
func pieceAt(c []motion.Piece, t float64) (pos, vel float64) {
	i := sort.Search(len(c), func(i int) bool { return c[i].T > t }) - 1
	if i < 0 {
		return c[0].P + c[0].V*(t-c[0].T), c[0].V
	}
	q := &c[i]
	u := t - q.T
	return q.P + u*(q.V+u*(q.A/2+u*q.J/6)), q.V + u*(q.A+u*q.J/2)
}
