package browsertest

import (
	"bytes"
	"encoding/json"
	"fmt"
	"maps"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"swaysheet/core/scenario"
)

// corpus is every example, every reference scenario and every file of the
// core's fuzz corpora (the fuzz targets' seeds and testdata/fuzz), by name.
func corpus(t *testing.T) map[string][]byte {
	t.Helper()
	out := map[string][]byte{}
	for _, g := range []string{"testdata/scenarios/*.json", "testdata/reference/scenarios/*.json"} {
		files, _ := filepath.Glob(filepath.Join(root, g))
		for _, f := range files {
			b, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			out[strings.TrimPrefix(f, root+"/")] = b
		}
	}
	files, _ := filepath.Glob(filepath.Join(root, "core", "*", "testdata", "fuzz", "*", "*"))
	for _, f := range files {
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		// "go test fuzz v1", then one value: []byte("...") or string("...").
		// Targets that take numbers (FuzzPlanValues) hold no file text.
		lines := strings.SplitN(string(b), "\n", 2)
		if len(lines) < 2 || lines[0] != "go test fuzz v1" {
			t.Fatalf("%s: not a fuzz corpus file", f)
		}
		v := strings.TrimSpace(lines[1])
		if !strings.HasPrefix(v, "[]byte(") && !strings.HasPrefix(v, "string(") {
			continue
		}
		i := strings.IndexByte(v, '(')
		if i < 0 || !strings.HasSuffix(v, ")") {
			t.Fatalf("%s: value %q", f, v)
		}
		text, err := strconv.Unquote(v[i+1 : len(v)-1])
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		out[strings.TrimPrefix(f, root+"/")] = []byte(text)
	}
	if len(out) < 40 {
		t.Fatalf("only %d corpus files", len(out))
	}
	return out
}

// openByLink opens text as a share link in the running page (no reload)
// and waits until the page has adopted or refused it and the core has
// answered; it gives "rejected", "result", "message" or "nothing", with
// "long " before it when the page was still computing (and offering
// Cancel) after 5 s, and
// how long the page took (from the link, once the page had settled on the
// one before, its check sheet included).
const openByLink = `(async function (frag) {
  var sw = window.swaysheet, w0 = performance.now();
  // The check sheet of the one before may still be in the making.
  while (!sw.settled() && performance.now() - w0 < 60000) await new Promise(function (r) { setTimeout(r, 20); });
  var n = sw.loads(), count = sw.resultCount(), t0 = performance.now();
  document.getElementById('notice').textContent = '';
  location.hash = frag;
  var rejected = function () { return document.getElementById('notice').textContent.indexOf('does not hold a readable scenario') >= 0; };
  while (performance.now() - t0 < 5000) {
    await new Promise(function (r) { setTimeout(r, 20); });
    if (location.hash !== '' && sw.loads() === n) continue;
    if (sw.loads() === n && rejected() && sw.answered()) return ['rejected', performance.now() - t0];
    if (sw.loads() > n && sw.answered()) break;
  }
  var took = performance.now() - t0, long = '';
  if (took >= 5000) {
    // Still computing: the page must say so and offer Cancel; the core's
    // work budget ends the computation with a message (or a result).
    if (document.getElementById('progress').hidden || document.getElementById('cancel-calc').hidden) return ['nothing', took];
    long = 'long ';
    while (!sw.answered() && performance.now() - t0 < 120000) await new Promise(function (r) { setTimeout(r, 50); });
    took = performance.now() - t0;
    if (!sw.answered()) return ['nothing', took];
  }
  if (sw.resultCount() > count && document.getElementById('stale').hidden) return [long + 'result', took];
  var msgs = Array.from(document.querySelectorAll('#general-error:not([hidden]), .field .msg')).map(function (e) { return e.textContent; }).join('');
  return [msgs.trim() ? long + 'message' : 'nothing', took];
})`

func (h *harness) open(text []byte) (string, float64) {
	h.t.Helper()
	frag := strconv.Quote(shareLink("", string(text)))
	v := eval2[[]any](h, openByLink+`(`+frag+`)`)
	return v[0].(string), v[1].(float64)
}

func eval2[T any](h *harness, expr string) T {
	h.t.Helper()
	v, err := chromedp.Run(h.ctx, chromedp.Evaluate[T](expr, chromedp.EvalAwaitPromise))
	if err != nil {
		h.t.Fatalf("%.200s: %v", expr, err)
	}
	return v
}

// pageErrors collects the page's uncaught exceptions and console errors.
func (h *harness) pageErrors() func() []string {
	var mu sync.Mutex
	var errs []string
	chromedp.Listen(h.ctx, func(ev any) {
		mu.Lock()
		defer mu.Unlock()
		switch e := ev.(type) {
		case *runtime.EventExceptionThrown:
			errs = append(errs, "exception: "+e.ExceptionDetails.Text+" "+fmt.Sprint(e.ExceptionDetails.Exception.Description))
		case *runtime.EventConsoleAPICalled:
			if e.Type == runtime.ConsoleAPICalledTypeError {
				var parts []string
				for _, a := range e.Args {
					parts = append(parts, string(a.Value)+a.Description)
				}
				errs = append(errs, "console.error: "+strings.Join(parts, " "))
			}
		}
	})
	return func() []string {
		mu.Lock()
		defer mu.Unlock()
		return append([]string{}, errs...)
	}
}

// TestPageReadsLikeTheCore opens every corpus file the core accepts as a
// share link and compares the fingerprint of the scenario the page then
// holds (computed by the core from the page's copy) with the fingerprint
// of the file as the core read it: the page and the core read every file
// alike.
func TestPageReadsLikeTheCore(t *testing.T) {
	h := setupFor(t, 8*time.Minute)
	files := corpus(t)
	names := slices.Sorted(maps.Keys(files))
	accepted := 0
	for _, name := range names {
		s, err := scenario.Parse(files[name])
		if err != nil {
			continue
		}
		accepted++
		want, err := scenario.Fingerprint(s)
		if err != nil {
			t.Fatal(err)
		}
		if got, _ := h.open(files[name]); got == "rejected" || got == "nothing" && eval[int](h, `window.swaysheet.loads()`) == 0 {
			t.Errorf("%s: the core reads it, the page did not take it (%s): %q", name, got, h.text("#notice"))
			continue
		}
		got := eval2[string](h, `window.swaysheet.call('validate', window.swaysheet.scenarioJSON()).then(function (r) { return r.error ? 'error: ' + r.error.message : r.result.fingerprint; })`)
		if got != want {
			t.Errorf("%s: the page holds a scenario with fingerprint %s, the core read %s", name, got, want)
		}
	}
	t.Logf("%d of %d corpus files accepted by the core, each read alike by the page", accepted, len(names))
}

// dup is an object member written twice: first, then second.
type dup struct{ first, second any }

// mutate changes one place of v (chosen by r) in one of seven ways: drop
// a field, null, a wrong type, a huge or a tiny number, a key in other
// case, a duplicate key.
func mutate(v any, r *rand.Rand, kind int) (any, string) {
	// Collect the places: (parent object or array, key or index).
	type place struct {
		obj  map[string]any
		arr  []any
		key  string
		idx  int
		path string
	}
	var places []place
	var walk func(x any, path string)
	walk = func(x any, path string) {
		switch y := x.(type) {
		case map[string]any:
			keys := slices.Sorted(maps.Keys(y))
			for _, k := range keys {
				places = append(places, place{obj: y, key: k, path: path + "." + k})
				walk(y[k], path+"."+k)
			}
		case []any:
			for i := range y {
				places = append(places, place{arr: y, idx: i, path: fmt.Sprintf("%s[%d]", path, i)})
				walk(y[i], fmt.Sprintf("%s[%d]", path, i))
			}
		}
	}
	walk(v, "")
	if len(places) == 0 {
		return v, "nothing to change"
	}
	p := places[r.IntN(len(places))]
	get := func() any {
		if p.obj != nil {
			return p.obj[p.key]
		}
		return p.arr[p.idx]
	}
	set := func(x any) {
		if p.obj != nil {
			p.obj[p.key] = x
		} else {
			p.arr[p.idx] = x
		}
	}
	huge := []any{json.Number("1e308"), json.Number("1e400"), json.Number("-1e308"), json.Number("123456789012345678901234567890")}
	tiny := []any{json.Number("1e-300"), json.Number("5e-324"), json.Number("-0"), json.Number("0")}
	switch kind {
	case 0:
		if p.obj != nil {
			delete(p.obj, p.key)
			return v, "drop " + p.path
		}
		set(nil)
		return v, "null " + p.path
	case 1:
		set(nil)
		return v, "null " + p.path
	case 2:
		switch get().(type) {
		case json.Number:
			set("12")
		case string:
			set(json.Number("3"))
		case map[string]any:
			set([]any{json.Number("1")})
		case []any:
			set(map[string]any{"a": json.Number("1")})
		default:
			set("true")
		}
		return v, "wrong type " + p.path
	case 3:
		set(huge[r.IntN(len(huge))])
		return v, "huge " + p.path
	case 4:
		set(tiny[r.IntN(len(tiny))])
		return v, "tiny " + p.path
	case 5:
		if p.obj != nil {
			x := p.obj[p.key]
			delete(p.obj, p.key)
			p.obj[strings.ToUpper(p.key[:1])+p.key[1:]] = x
			return v, "case " + p.path
		}
	}
	if p.obj != nil {
		x := p.obj[p.key]
		p.obj[p.key] = dup{first: json.Number("7"), second: x}
		return v, "duplicate " + p.path
	}
	set(dup{})
	return v, "empty " + p.path
}

// write is JSON with sorted keys, numbers as written and duplicates.
func write(b *bytes.Buffer, v any) {
	switch x := v.(type) {
	case map[string]any:
		keys := slices.Sorted(maps.Keys(x))
		b.WriteByte('{')
		for i, k := range keys {
			if i > 0 {
				b.WriteByte(',')
			}
			kq, _ := json.Marshal(k)
			if d, ok := x[k].(dup); ok {
				b.Write(kq)
				b.WriteByte(':')
				write(b, d.first)
				b.WriteByte(',')
				b.Write(kq)
				b.WriteByte(':')
				write(b, d.second)
				continue
			}
			b.Write(kq)
			b.WriteByte(':')
			write(b, x[k])
		}
		b.WriteByte('}')
	case []any:
		b.WriteByte('[')
		for i, y := range x {
			if i > 0 {
				b.WriteByte(',')
			}
			write(b, y)
		}
		b.WriteByte(']')
	case dup:
		b.WriteString("{}")
	case json.Number:
		b.WriteString(string(x))
	default:
		j, _ := json.Marshal(x)
		b.Write(j)
	}
}

// TestMutatedScenarios opens a few hundred scenarios mutated from the
// corpus (deterministically) as share links: each ends, within 5 s, with
// the page refusing it with a message, a result, or a message at the
// inputs; never with nothing, and never with a page error. A computation
// still running after 5 s must be shown as such with its Cancel, and end
// with a result or a message (the core's work budget).
func TestMutatedScenarios(t *testing.T) {
	h := setupFor(t, 12*time.Minute)
	errs := h.pageErrors()
	files := corpus(t)
	var bases []map[string]any
	names := slices.Sorted(maps.Keys(files))
	for _, n := range names {
		if _, err := scenario.Parse(files[n]); err != nil {
			continue
		}
		d := json.NewDecoder(bytes.NewReader(files[n]))
		d.UseNumber()
		var m map[string]any
		if err := d.Decode(&m); err != nil {
			t.Fatal(err)
		}
		// A plan block makes the page plan at once: seconds of work by
		// design, measured by the planner's own tests.
		delete(m, "plan")
		bases = append(bases, m)
	}
	const count = 280
	r := rand.New(rand.NewPCG(11, 13))
	tally := map[string]int{}
	slowest := 0.0
	for i := 0; i < count; i++ {
		raw, _ := json.Marshal(bases[i%len(bases)])
		d := json.NewDecoder(bytes.NewReader(raw))
		d.UseNumber()
		var v any
		_ = d.Decode(&v)
		v, what := mutate(v, r, i%7)
		var b bytes.Buffer
		write(&b, v)
		got, took := h.open(b.Bytes())
		tally[got]++
		slowest = max(slowest, took)
		if got == "nothing" {
			t.Errorf("%d (%s): no result and no message after %.0f ms\n%s", i, what, took, b.String())
			if took >= 5000 {
				// Let the page finish before the next one.
				h.settle()
			}
		}
	}
	for _, e := range errs() {
		t.Errorf("page error: %s", e)
	}
	t.Logf("%d mutated scenarios: %v; slowest %.0f ms", count, tally, slowest)
}
