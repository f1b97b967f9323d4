// Package sheettest checks the printed check sheet and the offline page in
// headless Chromium: print to PDF at A4 and US Letter (pdfinfo, pdftotext),
// reference fields that hold markup, the QR code read back from the
// printed page, the page reloaded and used with the network off, and the
// single-file build opened from a file. It runs with SWAYSHEET_BROWSER=1
// (make test-browser).
package sheettest

import (
	"context"
	"net/http"
	"net/http/httptest"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"swaysheet/core/figures"
	"swaysheet/web/dist"
)

const root = "../.."

type browser struct {
	t       *testing.T
	ctx     context.Context
	mu      sync.Mutex
	dialogs []string
	logs    []string
}

func need(t *testing.T) {
	if os.Getenv("SWAYSHEET_BROWSER") != "1" {
		t.Skip("browser tests run with SWAYSHEET_BROWSER=1 (make test-browser)")
	}
	for _, tool := range []string{"chromium", "pdfinfo", "pdftotext", "pdftoppm"} {
		if _, err := exec.LookPath(tool); err != nil {
			t.Fatalf("%s is not installed (make deps installs it)", tool)
		}
	}
}

// buildWasm builds the wasm (with extra go build arguments) into dir with
// Go's wasm_exec.js beside it, and with no extra arguments also the site
// library's small fetch wasm (swayfetch.wasm) as make wasm does, each
// packed (dist.Pack).
func buildWasm(t *testing.T, dir string, args ...string) {
	t.Helper()
	builds := [][2]string{{"swaysheet.wasm", "./wasm"}}
	if len(args) == 0 {
		builds = append(builds, [2]string{"swayfetch.wasm", "./wasm/fetch"})
	}
	for _, b := range builds {
		build := append([]string{"build", "-trimpath"}, args...)
		if b[1] == "./wasm" {
			build = append(build, dist.WasmGcflags()...)
		}
		cmd := exec.Command("go", append(build, "-o", filepath.Join(dir, b[0]), b[1])...)
		cmd.Dir = root
		cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
		if out, err := cmd.CombinedOutput(); err != nil {
			t.Fatalf("building %s: %v\n%s", b[0], err, out)
		}
		// Packed as make wasm ships it (direct jumps, data joined).
		if _, _, _, err := dist.PackFile(filepath.Join(dir, b[0])); err != nil {
			t.Fatal(err)
		}
	}
	wexec, err := os.ReadFile(filepath.Join(goruntime(), "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "wasm_exec.js"), wexec, 0o644); err != nil {
		t.Fatal(err)
	}
}

func goruntime() string { return goroot }

var goroot = func() string {
	out, err := exec.Command("go", "env", "GOROOT").Output()
	if err != nil {
		return ""
	}
	return strings.TrimSpace(string(out))
}()

// served counts the requests a test server answers.
type served struct {
	mu    sync.Mutex
	n     int
	paths []string
	down  bool // answer nothing: the connection is cut, as with no network
}

func serve(t *testing.T, h http.Handler) (*httptest.Server, *served) {
	c := &served{}
	srv := httptest.NewServer(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		c.mu.Lock()
		c.n++
		c.paths = append(c.paths, r.URL.Path)
		down := c.down
		c.mu.Unlock()
		if down {
			if hj, ok := w.(http.Hijacker); ok {
				if conn, _, err := hj.Hijack(); err == nil {
					conn.Close()
					return
				}
			}
			http.Error(w, "down", http.StatusServiceUnavailable)
			return
		}
		h.ServeHTTP(w, r)
	}))
	t.Cleanup(srv.Close)
	return srv, c
}

func (c *served) count() int {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.n
}

func open(t *testing.T) *browser {
	t.Helper()
	opts := append(chromedp.DefaultExecAllocatorOptions[:], chromedp.ExecPath("chromium"), chromedp.NoSandbox,
		chromedp.DisableGPU, chromedp.NoFirstRun, chromedp.UserDataDir(t.TempDir()),
		chromedp.Flag("disable-background-networking", true), chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true), chromedp.Flag("disable-quic", true))
	actx, cancelA := chromedp.NewExecAllocator(context.Background(), opts...)
	ctx, cancelC := chromedp.NewContext(actx)
	ctx, cancelT := context.WithTimeout(ctx, 4*time.Minute)
	t.Cleanup(func() { cancelT(); cancelC(); cancelA() })
	b := &browser{t: t, ctx: ctx}
	if err := chromedp.Do(ctx); err != nil {
		t.Fatal(err)
	}
	if err := chromedp.Listen(ctx, func(ev any) {
		switch e := ev.(type) {
		case *page.EventJavascriptDialogOpening:
			b.mu.Lock()
			b.dialogs = append(b.dialogs, e.Message)
			b.mu.Unlock()
			go chromedp.Call(ctx, page.HandleJavaScriptDialog, page.HandleJavaScriptDialogParams{Accept: false})
		case *runtime.EventConsoleAPICalled:
			var parts []string
			for _, a := range e.Args {
				parts = append(parts, string(a.Value))
			}
			b.mu.Lock()
			b.logs = append(b.logs, strings.Join(parts, " "))
			b.mu.Unlock()
		case *runtime.EventExceptionThrown:
			b.mu.Lock()
			desc := e.ExceptionDetails.Text
			if e.ExceptionDetails.Exception != nil {
				desc += " " + e.ExceptionDetails.Exception.Description
			}
			b.logs = append(b.logs, "exception: "+desc)
			b.mu.Unlock()
		}
	}); err != nil {
		t.Fatal(err)
	}
	b.do(chromedp.EmulateViewport(820, 1180))
	return b
}

func (b *browser) do(a ...chromedp.Action[chromedp.Void]) {
	b.t.Helper()
	if err := chromedp.Do(b.ctx, a...); err != nil {
		b.t.Fatalf("%v (console: %s)", err, b.console())
	}
}

func (b *browser) console() string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return strings.Join(b.logs, " | ")
}

func eval[T any](b *browser, expr string) T {
	b.t.Helper()
	v, err := chromedp.Run(b.ctx, chromedp.Evaluate[T](expr))
	if err != nil {
		b.t.Fatalf("%s: %v (console: %s)", expr, err, b.console())
	}
	return v
}

func (b *browser) poll(expr string, what string) {
	b.t.Helper()
	if _, err := chromedp.Run(b.ctx, chromedp.Poll[bool](expr,
		chromedp.WithPollingTimeout(60*time.Second), chromedp.WithPollingInterval(50*time.Millisecond))); err != nil {
		b.t.Fatalf("%s: %v (console: %s)", what, err, b.console())
	}
}

// settle waits until the core has answered for the inputs as they are.
func (b *browser) settle() {
	b.t.Helper()
	b.poll(`!!(window.swaysheet && document.body.dataset.state === 'ready' && window.swaysheet.settled() && document.querySelector('#headline .fig'))`, "the page did not settle")
}

func (b *browser) text(sel string) string {
	b.t.Helper()
	return strings.TrimSpace(eval[string](b, `(function(){var e=document.querySelector(`+strconv.Quote(sel)+`);return e?e.textContent:'(missing)';})()`))
}

// typeInto replaces a field's text by typing, as a person does.
func (b *browser) typeInto(sel, text string) {
	b.t.Helper()
	b.do(chromedp.Click(chromedp.CSS(sel)),
		chromedp.KeyEvent("a", chromedp.KeyModifiers(chromedp.ModifierCtrl)),
		chromedp.KeyEvent("\b"),
		chromedp.SendKeys(chromedp.CSS(sel), text))
}

// figSel is the selector of the number of the page's figure row key (its
// JSON path in the result).
func figSel(key string) string { return `#figures [data-key=` + strconv.Quote(key) + `] .num` }

// shownText is the core's rounded text of the figure key in rep.
func shownText(rep figures.Report, key string) string {
	for _, row := range rep.Rows {
		if row.Key == key {
			return row.Text
		}
	}
	return ""
}

var _ = runtime.Enable // the console events need nothing enabled beyond chromedp's defaults

// waitSheet waits for the check sheet of the inputs as they are and
// returns its fingerprint.
func (b *browser) waitSheet() string {
	b.t.Helper()
	for i := 0; i < 600; i++ {
		fp := eval[string](b, `(function(){var h=document.getElementById('sheet-host');return (h.dataset.ready==='error'?'error: '+h.textContent:'')||(h.querySelector('article.sw-sheet')&&h.dataset.fingerprint)||'';})()`)
		if strings.HasPrefix(fp, "error: ") {
			b.t.Fatalf("the check sheet failed: %s", fp)
		}
		if fp != "" {
			return fp
		}
		time.Sleep(50 * time.Millisecond)
	}
	b.t.Fatalf("no check sheet (console: %s)", b.console())
	return ""
}

func (b *browser) sleep() { time.Sleep(50 * time.Millisecond) }

// pollThrough is poll across a navigation: an evaluation cut off by the
// page reloading is tried again.
func (b *browser) pollThrough(expr, what string) {
	b.t.Helper()
	for i := 0; i < 1200; i++ {
		v, err := chromedp.Run(b.ctx, chromedp.Evaluate[bool](expr))
		if err == nil && v {
			return
		}
		time.Sleep(50 * time.Millisecond)
	}
	b.t.Fatalf("%s (console: %s)", what, b.console())
}

func (c *served) since(n int) []string {
	c.mu.Lock()
	defer c.mu.Unlock()
	return append([]string{}, c.paths[n:]...)
}

func (c *served) setDown(d bool) {
	c.mu.Lock()
	c.down = d
	c.mu.Unlock()
}
