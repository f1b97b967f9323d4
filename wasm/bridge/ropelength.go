package bridge

import "swaysheet/core/ropelength"

// The rope-length helper is registered here, beside its code, so that the
// table in bridge.go stays as it is.
func init() {
	Calls["ropelength"] = ropeLength
	Calls["ropelength_ranges"] = ropeLengthRanges
}

// ropeLength finds the rope length from what a crew can see or time:
// input is the ropelength.Input JSON (heights, a timed swing, or both; an
// optional hook block), the result the ropelength.Result JSON.
func ropeLength(_ *Env, input []byte) (any, error) {
	return ropelength.Parse(input)
}

// ropeLengthRanges gives the accepted ranges of the ropelength call's
// fields (ropelength.Ranges) by JSON path ("timed.time_s"), as the
// "ranges" call gives the scenario's: the page's rope-length form shows
// them in the units shown.
func ropeLengthRanges(*Env, []byte) (any, error) {
	return fieldRanges(ropelength.Ranges), nil
}
