package dist

// NoInline are the packages the page's main wasm (./wasm) is compiled
// without inlining in: go build -gcflags=PKG=-l for each (WasmGcflags).
// Go's wasm code pays for every inlined copy (each function body is a
// resumable state machine), and these packages run once a call, not in
// the simulation's loops: reading and checking the scenario, the figures'
// table and words, units, the check sheet and its plotter, the QR code,
// the bridge; and the standard library's fmt, encoding/json, reflect and
// the text packages strings, strconv, unicode/utf8 and bytes (their work
// is words and JSON once a call; the simulation's loops call none of
// them); errors.Is and sort.Slice's swapper (internal/reflectlite), the
// sorting of maps fmt prints (internal/fmtsort), the QR code's DEFLATE
// (compress/flate), reading a recorded run (encoding/csv, bufio) and the
// calls between the page and the wasm (syscall/js), each once a call.
// Without inlining there the wasm is about 95 kB smaller gzipped (the
// text packages 6 kB of it, the last six 5.5 kB) and 20 kB smaller raw,
// with the same output (inlining changes no result). The crane's geometry and the motion profiles
// (crane, motion) are flattened into the fast paths' own span tables
// before a run, so only the general path (rigid loads, wind) calls them
// per step and pays a little (4 kB less). The physics (sway, ode,
// pendulum, plan, clearance, draws, shaper) keeps inlining. make wasm and
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
	"swaysheet/core/crane",
	"swaysheet/core/motion",
	"swaysheet/core/version",
	"swaysheet/core/internal/sorts",
	"fmt",
	"encoding/json",
	"reflect",
	"strings",
	"strconv",
	"unicode/utf8",
	"bytes",
	"internal/reflectlite",
	"internal/fmtsort",
	"compress/flate",
	"encoding/csv",
	"bufio",
	"syscall/js",
}

// WasmGcflags are the go build arguments of NoInline.
func WasmGcflags() []string {
	var args []string
	for _, p := range NoInline {
		args = append(args, "-gcflags="+p+"=-l")
	}
	return args
}
