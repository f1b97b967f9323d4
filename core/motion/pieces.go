package motion

// Pieces returns a copy of the spans, for evaluators that flatten summed
// profiles into one table of spans (core/sway/fastaxis.go).
func (p *Piecewise) Pieces() []Piece { return append([]Piece(nil), p.pieces...) }
