// Package dist builds the page for use anywhere (make dist):
//
//   - Static writes a folder to host on any web server: every file of the
//     page, the example library and a filled-in service worker;
//   - Single writes one self-contained HTML file that opens from a file
//     (file://) with no server: style sheets and scripts inline, the wasm
//     gzipped and written as 7-bit text inside (Encode7), decompressed
//     in the browser with DecompressionStream, and run in a Web Worker
//     made from a blob.
package dist

import (
	"bytes"
	"compress/gzip"
	"crypto/sha256"
	"encoding/base64"
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strings"

	"swaysheet/web/offline"
)

// Static writes the hostable folder into out.
func Static(d offline.Dirs, toolVersion, out string) ([]offline.File, error) {
	files, err := offline.Collect(d)
	if err != nil {
		return nil, err
	}
	tmpl, err := os.ReadFile(filepath.Join(d.Static, "sw.js"))
	if err != nil {
		return nil, err
	}
	all := append(append([]offline.File{}, files...),
		offline.File{Name: "sw.js", Data: offline.ServiceWorker(tmpl, offline.Version(toolVersion, files), files)})
	for _, f := range all {
		p := filepath.Join(out, filepath.FromSlash(f.Name))
		if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
			return nil, err
		}
		if err := os.WriteFile(p, f.Data, 0o644); err != nil {
			return nil, err
		}
	}
	return all, nil
}

var (
	styleLink = regexp.MustCompile(`<link rel="stylesheet" href="([a-z0-9._-]+)">`)
	scriptTag = regexp.MustCompile(`<script src="([a-z0-9._-]+)"></script>`)
	moduleTag = regexp.MustCompile(`<script type="module" src="([a-z0-9._-]+)"></script>`)
	otherLink = regexp.MustCompile(`<link rel="(manifest|icon)"[^>]*>\n?`)
	cspMeta   = regexp.MustCompile(`<meta http-equiv="Content-Security-Policy" content="[^"]*">`)
	// servedOnly marks a part of index.html that the single file leaves
	// out, scripts and styles included: what its core cannot run (the
	// spread over likely runs: the draws calls are not in its wasm).
	servedOnly = regexp.MustCompile(`(?s)[ \t]*<!-- served page only -->.*?<!-- end served page only -->\n?`)
)

// Single builds the one-file page from the static folder, Go's
// wasm_exec.js and a wasm built for it (GOOS=js GOARCH=wasm, -tags
// nofetch: a page opened from a file has no origin to fetch from, and the
// examples come from the copies built into the wasm). A wasm in Go's form
// is packed first (Pack: direct jumps, data segments joined); anything
// else is taken as it is.
func Single(static string, wasmExec, wasm []byte) ([]byte, error) {
	if packed, _, err := Pack(wasm); err == nil {
		wasm = packed
	}
	var gz bytes.Buffer
	zw, _ := gzip.NewWriterLevel(&gz, gzip.BestCompression)
	zw.Write(wasm)
	zw.Close()
	return SingleGz(static, wasmExec, gz.Bytes())
}

// SingleGz is Single with the wasm already gzipped (make dist uses
// zopfli, about 5 % smaller than gzip -9).
func SingleGz(static string, wasmExec, wasmGz []byte) ([]byte, error) {
	read := func(n string) (string, error) {
		b, err := offline.ReadStatic(static, n)
		return string(b), err
	}
	page, err := read("index.html")
	if err != nil {
		return nil, err
	}
	worker, err := read("worker.js")
	if err != nil {
		return nil, err
	}
	text := Encode7(wasmGz)
	page = servedOnly.ReplaceAllString(page, "")

	var styleHashes, scriptHashes []string
	hash := func(s string) string {
		sum := sha256.Sum256([]byte(s))
		return "'sha256-" + base64.StdEncoding.EncodeToString(sum[:]) + "'"
	}
	var ferr error
	page = styleLink.ReplaceAllStringFunc(page, func(m string) string {
		css, err := read(styleLink.FindStringSubmatch(m)[1])
		if err != nil {
			ferr = err
		}
		css = strings.ReplaceAll(css, "</", `<\/`)
		styleHashes = append(styleHashes, hash(css))
		return "<style>" + css + "</style>"
	})
	first := true
	inline := func(m string) string {
		var js string
		var err error
		if sm := moduleTag.FindStringSubmatch(m); sm != nil {
			// The page's modules, joined into one (see Bundle).
			js, err = Bundle(static, sm[1])
		} else {
			js, err = read(scriptTag.FindStringSubmatch(m)[1])
		}
		if err != nil {
			ferr = err
		}
		out := ""
		if first {
			// Before the page's own scripts: the worker, made from a blob
			// that holds wasm_exec.js, the wasm and worker.js.
			first = false
			pre := "window.swaysheetSingleFile = true;\nwindow.swaysheetWorkerURL = URL.createObjectURL(new Blob([" +
				jsString(string(wasmExec)) + ", '\\nself.swaysheetWasmText = ', JSON.stringify(document.getElementById('swaysheet-wasm').textContent.trim()), ';\\n', " +
				jsString(worker) + "], { type: 'text/javascript' }));\n"
			scriptHashes = append(scriptHashes, hash(pre))
			out = "<script>" + pre + "</script>\n"
		}
		js = strings.ReplaceAll(js, "</script", `<\/script`)
		scriptHashes = append(scriptHashes, hash(js))
		if moduleTag.MatchString(m) {
			return out + `<script type="module">` + js + "</script>"
		}
		return out + "<script>" + js + "</script>"
	}
	page = scriptTag.ReplaceAllStringFunc(page, inline)
	page = moduleTag.ReplaceAllStringFunc(page, inline)
	if ferr != nil {
		return nil, ferr
	}
	icon, err := os.ReadFile(filepath.Join(static, "icon-192.png"))
	if err != nil {
		return nil, err
	}
	page = otherLink.ReplaceAllString(page, "")
	page = strings.Replace(page, "</title>", "</title>\n<link rel=\"icon\" href=\"data:image/png;base64,"+base64.StdEncoding.EncodeToString(icon)+"\">", 1)
	// Only the page's own inline scripts and styles run; the wasm runs in a
	// blob worker; nothing is fetched from anywhere.
	csp := "default-src 'none'; script-src " + strings.Join(scriptHashes, " ") + " 'wasm-unsafe-eval'; worker-src blob:; style-src " +
		strings.Join(styleHashes, " ") + "; img-src data: blob:; connect-src 'none'; object-src 'none'; base-uri 'none'; form-action 'none'"
	if !cspMeta.MatchString(page) {
		return nil, fmt.Errorf("index.html has no Content-Security-Policy meta to replace")
	}
	page = cspMeta.ReplaceAllLiteralString(page, `<meta http-equiv="Content-Security-Policy" content="`+csp+`">`)
	// One line: in 7-bit text a line break is data.
	data := "<script type=\"application/octet-stream\" id=\"swaysheet-wasm\">\n" + text + "\n</script>\n"
	i := strings.Index(page, "<script>")
	if i < 0 {
		return nil, fmt.Errorf("no script in index.html")
	}
	page = page[:i] + data + page[i:]
	return []byte(page), nil
}

// jsString is s as a JavaScript string literal that is safe inside a
// <script> element.
func jsString(s string) string {
	b, _ := json.Marshal(s)
	return strings.ReplaceAll(string(b), "</", `<\/`)
}
