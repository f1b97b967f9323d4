module swaysheet

go 1.26.8

require (
	github.com/syumai/tinyutil v0.3.2
	gonum.org/v1/gonum v0.17.0
)
