package main

// The per-package breakdown of a wasm file built without -s: the code
// section's function bodies (WebAssembly core specification 1.0, section
// 5.5.13) named by the "name" custom section (appendix 7.4.2), summed by
// the Go package each function's name begins with. The data section
// (Go's read-only data, type descriptors and the pcln table) cannot be
// told apart by package and is reported as one row.

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"sort"
	"strings"

	"swaysheet/web/dist"
)

// pkgSize is one package's share of a wasm file's code.
type pkgSize struct {
	Pkg   string
	Funcs int
	// Code is the bodies' bytes; Gzip their bytes gzipped together, an
	// estimate of what the package adds to the gzipped file.
	Code, Gzip int
}

// breakdown sums a wasm file's function bodies by package; data is the
// data section, other the size of the rest of the file.
func breakdown(wasm []byte) (pkgs []pkgSize, data []byte, other int, err error) {
	if len(wasm) < 8 || !bytes.Equal(wasm[:4], []byte("\x00asm")) {
		return nil, nil, 0, errors.New("not a wasm file")
	}
	// Imported functions come first in the index space.
	imported, err := dist.FuncImports(wasm)
	if err != nil {
		return nil, nil, 0, err
	}
	r := &dist.WasmReader{B: wasm[8:]}
	var bodies [][]byte
	names := map[int]string{}
	for len(r.B) > 0 && r.Err == nil {
		id := r.Bytes(1)
		if r.Err != nil {
			break
		}
		sec := &dist.WasmReader{B: r.Bytes(r.ULEB())}
		switch id[0] {
		case 10:
			for n := sec.ULEB(); n > 0 && sec.Err == nil; n-- {
				bodies = append(bodies, sec.Bytes(sec.ULEB()))
			}
		case 11:
			data = sec.B
		case 0:
			if name := string(sec.Bytes(sec.ULEB())); name != "name" {
				continue
			}
			for len(sec.B) > 0 && sec.Err == nil {
				sub := sec.Bytes(1)
				ss := &dist.WasmReader{B: sec.Bytes(sec.ULEB())}
				if sub == nil || sub[0] != 1 {
					continue
				}
				for n := ss.ULEB(); n > 0 && ss.Err == nil; n-- {
					idx := ss.ULEB()
					names[idx] = string(ss.Bytes(ss.ULEB()))
				}
			}
		}
		if sec.Err != nil {
			r.Err = sec.Err
		}
	}
	if r.Err != nil {
		return nil, nil, 0, r.Err
	}
	if len(names) == 0 {
		return nil, nil, 0, errors.New("wasm has no name section (built with -s?)")
	}
	byPkg := map[string]*pkgSize{}
	var code = map[string][]byte{}
	total := 0
	for i, body := range bodies {
		p := pkgOf(names[imported+i])
		s := byPkg[p]
		if s == nil {
			s = &pkgSize{Pkg: p}
			byPkg[p] = s
		}
		s.Funcs++
		s.Code += len(body)
		code[p] = append(code[p], body...)
		total += len(body)
	}
	for p, s := range byPkg {
		s.Gzip = gz(code[p])
		pkgs = append(pkgs, *s)
	}
	sort.Slice(pkgs, func(i, j int) bool { return pkgs[i].Code > pkgs[j].Code })
	return pkgs, data, len(wasm) - total - len(data), nil
}

// pkgOf is the package path a function's name in the name section begins
// with. Go's wasm linker writes "/" in names as "_" (and "*()" as "_"), so
// "net_http.__Transport_.roundTrip" is in net/http and
// "gonum.org_v1_gonum_mat.__Dense_.At" in gonum.org/v1/gonum/mat (a
// package with "_" in its own name is shown with "/"); "type:" helpers and
// unnamed functions are "(other)".
func pkgOf(sym string) string {
	if sym == "" || strings.HasPrefix(sym, "type_.") || strings.HasPrefix(sym, "go_") || strings.HasPrefix(sym, "go.") {
		return "(other)"
	}
	start := 0
	// A module path's first element is a domain: "gonum.org_",
	// "vendor_golang.org_".
	if d := strings.IndexByte(sym, '.'); d > 0 {
		for _, tld := range []string{"org_", "com_", "net_", "io_", "in_", "dev_"} {
			if strings.HasPrefix(sym[d+1:], tld) {
				start = d + len(tld)
				break
			}
		}
	}
	dot := strings.IndexByte(sym[start:], '.')
	if dot < 0 {
		return "(other)"
	}
	return strings.ReplaceAll(sym[:start+dot], "_", "/")
}

// group folds a package into the family the size budget is discussed in:
// crypto/..., net/..., the core, the wasm bridge; others stay as they are.
func group(pkg string) string {
	for _, g := range []string{"crypto", "net", "vendor/golang.org/x/crypto", "vendor/golang.org/x/net", "swaysheet/core", "swaysheet/wasm", "gonum.org", "github.com/syumai", "image", "compress", "encoding", "internal", "runtime"} {
		if pkg == g || strings.HasPrefix(pkg, g+"/") {
			return g + "/..."
		}
	}
	return pkg
}

// printBreakdown writes the breakdown as a table: the families, then every
// package of at least 10 kB of code.
func printBreakdown(w io.Writer, wasm []byte) error {
	pkgs, data, other, err := breakdown(wasm)
	if err != nil {
		return err
	}
	fams := map[string]*pkgSize{}
	var order []string
	for _, p := range pkgs {
		g := group(p.Pkg)
		f := fams[g]
		if f == nil {
			f = &pkgSize{Pkg: g}
			fams[g] = f
			order = append(order, g)
		}
		f.Funcs += p.Funcs
		f.Code += p.Code
		f.Gzip += p.Gzip
	}
	sort.SliceStable(order, func(i, j int) bool { return fams[order[i]].Code > fams[order[j]].Code })
	fmt.Fprintf(w, "file %d bytes, gzipped %d; data section %d (gzipped %d), other sections %d\n", len(wasm), gz(wasm), len(data), gz(data), other)
	fmt.Fprintf(w, "%-48s %6s %10s %10s\n", "family", "funcs", "code", "code gz")
	for _, g := range order {
		f := fams[g]
		fmt.Fprintf(w, "%-48s %6d %10d %10d\n", g, f.Funcs, f.Code, f.Gzip)
	}
	fmt.Fprintf(w, "\n%-48s %6s %10s %10s\n", "package (code >= 10 kB)", "funcs", "code", "code gz")
	for _, p := range pkgs {
		if p.Code >= 10000 {
			fmt.Fprintf(w, "%-48s %6d %10d %10d\n", p.Pkg, p.Funcs, p.Code, p.Gzip)
		}
	}
	return nil
}

// partRows are the largest package families of a wasm (code gzipped on
// its own, so they add up to a little more than the whole file gzipped)
// and its data section (packed, as make wasm ships it), as bench
// rows.
func partRows(wasm []byte) ([]row, error) {
	if packed, _, err := dist.Pack(wasm); err == nil {
		wasm = packed
	}
	pkgs, data, _, err := breakdown(wasm)
	if err != nil {
		return nil, err
	}
	fams := map[string]int{}
	code := map[string]int{}
	for _, p := range pkgs {
		fams[group(p.Pkg)] += p.Gzip
		code[group(p.Pkg)] += p.Code
	}
	var names []string
	for g := range fams {
		names = append(names, g)
	}
	sort.Slice(names, func(i, j int) bool { return fams[names[i]] > fams[names[j]] })
	net := fams["net/..."] + fams["crypto/..."] + fams["vendor/golang.org/x/net/..."] + fams["vendor/golang.org/x/crypto/..."]
	netNote := "target 0: none, the site library's fetch wasm holds net/http"
	if net > 0 {
		netNote = "target 0: MISSED, the main wasm links net/http or crypto"
	}
	var rows []row
	rows = append(rows, row{Group: "size", Name: "page main wasm part: net/http and crypto", Value: float64(net) / 1e6, Unit: "MB", Note: netNote})
	rows = append(rows, row{Group: "size", Name: "page main wasm part: data section", Value: float64(gz(data)) / 1e6, Unit: "MB",
		Note: "gzipped alone: Go's read-only data, type descriptors, the function table"})
	for i, g := range names {
		if i == 10 {
			break
		}
		rows = append(rows, row{Group: "size", Name: "page main wasm part: " + g, Value: float64(fams[g]) / 1e6, Unit: "MB",
			Note: fmt.Sprintf("code gzipped alone (%.3f MB raw)", float64(code[g])/1e6)})
	}
	return rows, nil
}
