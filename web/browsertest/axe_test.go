package browsertest

import (
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"testing"

	"github.com/chromedp/chromedp"
)

// axeVersion is the axe-core release the accessibility checks run. It is
// installed from the npm registry into out/axe (make deps does it; a test
// does it too when it is missing), never committed.
const axeVersion = "4.10.3"

var (
	axeOnce   sync.Once
	axeSource string
	axeErr    error
)

// axeScript reads axe-core's browser build, installing it first when it
// is missing.
func axeScript(t *testing.T) string {
	t.Helper()
	axeOnce.Do(func() {
		dir, err := filepath.Abs(filepath.Join(root, "out", "axe"))
		if err != nil {
			axeErr = err
			return
		}
		file := filepath.Join(dir, "node_modules", "axe-core", "axe.min.js")
		if _, err := os.Stat(file); err != nil {
			if err := os.MkdirAll(dir, 0o755); err != nil {
				axeErr = err
				return
			}
			cmd := exec.Command("npm", "install", "--prefix", dir, "--no-audit", "--no-fund", "--no-save", "axe-core@"+axeVersion)
			if out, err := cmd.CombinedOutput(); err != nil {
				axeErr = err
				t.Logf("npm install axe-core: %s", out)
				return
			}
		}
		b, err := os.ReadFile(file)
		axeSource, axeErr = string(b), err
	})
	if axeErr != nil {
		t.Fatalf("axe-core %s is needed (make deps installs it into out/axe): %v", axeVersion, axeErr)
	}
	return axeSource
}

type axeViolation struct {
	ID     string `json:"id"`
	Impact string `json:"impact"`
	Help   string `json:"help"`
	Nodes  []struct {
		Target  []any  `json:"target"`
		Summary string `json:"failureSummary"`
	} `json:"nodes"`
}

// axe runs axe-core on the page as it is (WCAG 2.x A and AA rules and
// axe's best practices) and returns the serious and critical violations,
// one line each; the others are logged.
func (h *harness) axe() []string {
	h.t.Helper()
	if !eval[bool](h, `typeof window.axe === 'object'`) {
		// DevTools evaluation is not held to the page's script-src.
		if _, err := chromedp.Run(h.ctx, chromedp.Evaluate[any](axeScript(h.t)+";true")); err != nil {
			h.t.Fatalf("loading axe-core: %v", err)
		}
	}
	raw, err := chromedp.Run(h.ctx, chromedp.Evaluate[string](`axe.run(document, {resultTypes: ['violations'],
		runOnly: {type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice']}})
		.then(function (r) { return JSON.stringify(r.violations); })`, chromedp.EvalAwaitPromise))
	if err != nil {
		h.t.Fatalf("axe: %v", err)
	}
	var vs []axeViolation
	if err := json.Unmarshal([]byte(raw), &vs); err != nil {
		h.t.Fatal(err)
	}
	var bad []string
	for _, v := range vs {
		var where []string
		for i, n := range v.Nodes {
			if i == 3 {
				where = append(where, "...")
				break
			}
			b, _ := json.Marshal(n.Target)
			where = append(where, string(b))
		}
		line := v.Impact + " " + v.ID + ": " + v.Help + " at " + strings.Join(where, " ")
		if v.Impact == "serious" || v.Impact == "critical" {
			bad = append(bad, line)
		} else {
			h.t.Log("axe (" + line + ")")
		}
	}
	return bad
}
