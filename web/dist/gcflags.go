package dist

// NoInline are the packages the page's main wasm (./wasm) is compiled
// without inlining in: go build -gcflags=PKG=-l for each (WasmGcflags).
// Go's wasm code pays for every inlined copy (each function body is a
// resumable state machine), and these packages run once a call, not in
// the simulation's loops: reading and checking the scenario, the figures'
// table and words, units, the check sheet and its plotter, the QR code,
// the bridge; and the standard library's fmt, encoding/json and reflect
// (their work per call is in calls through function values and strconv,
// which keep their speed). Without inlining there the wasm is about 85 kB
// smaller gzipped and 20 kB smaller raw, with the same output (inlining
// changes no result). The physics (sway, ode, pendulum, motion, crane,
// plan, clearance, draws, shaper) keeps it. make wasm and
// make single-wasm pass the same list (NOINLINE in the Makefile;
// TestMakefileNoInline), and the browser tests build with WasmGcflags.
var NoInline = []string{
	"swaysheet/core/sheet",
	"swaysheet/core/scenario",
	"swaysheet/core/figures",
	"swaysheet/core/words",
	"swaysheet/core/units",
	"swaysheet/core/ropelength",
	"swaysheet/core/qr",
	"swaysheet/wasm/bridge",
	"fmt",
	"encoding/json",
	"reflect",
}

// WasmGcflags are the go build arguments of NoInline.
func WasmGcflags() []string {
	var args []string
	for _, p := range NoInline {
		args = append(args, "-gcflags="+p+"=-l")
	}
	return args
}
