package sheet

import (
	"bytes"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"swaysheet/core/internal/qrdecode"
	"swaysheet/core/plan"
	"swaysheet/core/qr"
	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// direct computes as the command line does, with no memo.
var direct = Computer{Evaluate: sway.Evaluate, Plan: plan.Make}

const hostile = `<img src=x onerror=alert(1)>`

func demo(t *testing.T, name string) *scenario.Scenario { return demoB(t, name) }

func demoB(t testing.TB, name string) *scenario.Scenario {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("../../testdata/scenarios", name))
	if err != nil {
		t.Fatal(err)
	}
	s, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

func build(t *testing.T, s *scenario.Scenario, in Input) (*Sheet, string) {
	t.Helper()
	c := direct.Compute(s)
	c.Units, c.Version, c.LinkBase, c.PrintedAt = in.Units, in.Version, in.LinkBase, in.PrintedAt
	sh, err := Build(c)
	if err != nil {
		t.Fatal(err)
	}
	var b bytes.Buffer
	if err := sh.WriteDocument(&b); err != nil {
		t.Fatal(err)
	}
	return sh, b.String()
}

// Text typed into the reference fields is escaped: no element of it
// reaches the HTML.
func TestReferenceFieldsAreText(t *testing.T) {
	s := demo(t, "bay-travel.json")
	s.Name = hostile
	s.Sheet = &scenario.Sheet{Project: hostile, LiftReference: `"><script>alert(2)</script>`,
		Crane: "Bay 3 & 4", PreparedBy: "O'Neil", CheckedBy: "</article>", Date: "2026-12-02 07:30"}
	_, doc := build(t, s, Input{})
	for _, bad := range []string{"<img", "<script", "onerror=alert(1)>", "</article></article>"} {
		if strings.Contains(doc, bad) {
			t.Errorf("the sheet holds %q as markup", bad)
		}
	}
	for _, want := range []string{"&lt;img src=x onerror=alert(1)&gt;", "Bay 3 &amp; 4", "2026-12-02 07:30"} {
		if !strings.Contains(doc, want) {
			t.Errorf("the sheet lacks %q", want)
		}
	}
	if strings.Count(doc, "<article") != 1 || strings.Count(doc, "</article>") != 1 {
		t.Error("a reference field closed the sheet's element")
	}
}

// The fingerprint printed is the SHA-256 of the canonical JSON.
func TestFingerprintPrinted(t *testing.T) {
	s := demo(t, "bay-travel.json")
	sh, doc := build(t, s, Input{})
	fp, _ := scenario.Fingerprint(s)
	if sh.Fingerprint != fp || !strings.Contains(doc, fp) {
		t.Fatalf("fingerprint %s not on the sheet", fp)
	}
	s.Sheet = &scenario.Sheet{CheckedBy: "A. Checker"}
	sh2, _ := build(t, s, Input{})
	if sh2.Fingerprint == fp {
		t.Fatal("a changed reference field kept the fingerprint")
	}
}

// The sheet holds every input, with its unit, in the chosen unit system.
func TestInputsAndUnits(t *testing.T) {
	s := demo(t, "bay-travel.json")
	_, si := build(t, s, Input{Units: units.Choice{System: "si"}})
	for _, want := range []string{">7200<", ">8.50<", "m/min", "m/s²", "peak swing", "within", "OUTSIDE", "Safety cautions", "What the model assumes"} {
		if !strings.Contains(si, want) {
			t.Errorf("SI sheet lacks %q", want)
		}
	}
	_, us := build(t, s, Input{Units: units.Choice{System: "us"}})
	// 8.5 m = 27.887 ft; 7200 kg = 15873.3 lb (NIST SP 811 factors),
	// rounded as the figures are: feet to 0.05, pounds to 1.
	for _, want := range []string{">27.90<", ">15873<", "ft/min", ">lb<"} {
		if !strings.Contains(us, want) {
			t.Errorf("US sheet lacks %q", want)
		}
	}
	_, own := build(t, s, Input{Units: units.Choice{Chosen: map[string]string{"length": "in", "mass": "t"}}})
	if !strings.Contains(own, ">7.20<") || !strings.Contains(own, ">334.5<") {
		t.Error("the page's own unit choice is not used")
	}
}

// Every example renders, and a plan example shows the recommended settings.
func TestEveryExample(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	for _, f := range files {
		s := demo(t, filepath.Base(f))
		_, doc := build(t, s, Input{Version: "test"})
		if s.Plan != nil && !strings.Contains(doc, "Recommended drive settings") {
			t.Errorf("%s: no planner section", f)
		}
		if strings.Count(doc, "<svg") != 3 {
			t.Errorf("%s: want 3 SVGs (QR and two plots), got %d", f, strings.Count(doc, "<svg"))
		}
	}
}

// The QR code decodes (with an independent decoder, gozxing) to a link
// whose fragment gives back the canonical JSON of the same scenario.
func TestQRCodeCarriesScenario(t *testing.T) {
	for _, name := range []string{"bay-travel.json", "plan-tower-slew.json"} {
		s := demo(t, name)
		s.Sheet = &scenario.Sheet{Project: hostile, PreparedBy: "Ünal Öz"}
		sh, doc := build(t, s, Input{LinkBase: "https://example.org/swaysheet/"})
		code, err := qr.Encode(sh.QRText, qr.M)
		if err != nil {
			t.Fatal(err)
		}
		// The SVG on the sheet draws the code's modules, and what it
		// draws decodes to the link.
		bits := code.Bitmap(4)
		drawn := svgModules(t, doc, len(bits))
		for y := range bits {
			for x := range bits[y] {
				if bits[y][x] != drawn[y][x] {
					t.Fatalf("%s: the SVG's module (%d, %d) is not the code's", name, x, y)
				}
			}
		}
		text := qrdecode.Modules(t, drawn, 4)
		if text != sh.QRText {
			t.Fatalf("%s: QR decodes to %q, want %q", name, text, sh.QRText)
		}
		base, frag, ok := strings.Cut(text, "#")
		if !ok || base != "https://example.org/swaysheet/" {
			t.Fatalf("%s: QR text %q is not a link to the page", name, text)
		}
		got, err := ReadShareFragment(frag)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := scenario.Canonical(s)
		if !bytes.Equal(got, want) {
			t.Fatalf("%s: QR scenario differs:\n got %s\nwant %s", name, got, want)
		}
		back, err := scenario.Parse(got)
		if err != nil {
			t.Fatal(err)
		}
		if fp, _ := scenario.Fingerprint(back); fp != sh.Fingerprint {
			t.Fatalf("%s: reopened scenario has another fingerprint", name)
		}
	}
}

// svgModules reads the QR code's modules back from the sheet's SVG path
// ("Mx yhNv1h-Nz" for each run of dark modules in a row).
func svgModules(t *testing.T, doc string, n int) [][]bool {
	t.Helper()
	if !strings.Contains(doc, `viewBox="0 0 `+strconv.Itoa(n)+" "+strconv.Itoa(n)+`"`) {
		t.Fatalf("no %d-module QR code on the sheet", n)
	}
	bits := make([][]bool, n)
	for y := range bits {
		bits[y] = make([]bool, n)
	}
	for _, m := range regexp.MustCompile(`M(\d+) (\d+)h(\d+)v1h-(\d+)z`).FindAllStringSubmatch(doc, -1) {
		x, _ := strconv.Atoi(m[1])
		y, _ := strconv.Atoi(m[2])
		run, _ := strconv.Atoi(m[3])
		if m[3] != m[4] || y >= n || x+run > n {
			t.Fatalf("odd QR path piece %q", m[0])
		}
		for i := 0; i < run; i++ {
			bits[y][x+i] = true
		}
	}
	return bits
}

func TestShareFragmentBadInput(t *testing.T) {
	for _, bad := range []string{"", "#s=abc", "#z=!!!", "#z=AAAA", "z=" + strings.Repeat("A", 100)} {
		if _, err := ReadShareFragment(bad); err == nil {
			t.Errorf("%q: no error", bad)
		}
	}
}

func TestNum(t *testing.T) {
	for v, want := range map[float64]string{0: "0", 8.5: "8.5", 0.25: "0.25", 12345.678: "12350", 1e-7: "0.0000001", 0.00595: "0.00595", -2.5: "-2.5"} {
		if got := Num(v, 4); got != want {
			t.Errorf("Num(%g) = %q, want %q", v, got, want)
		}
	}
}

// Build renders what it is given and computes nothing: without a result
// the sheet says so; Compute asks its functions once each.
func TestBuildOnlyRenders(t *testing.T) {
	s := demo(t, "plan-tower-slew.json")
	sh, err := Build(Input{Scenario: s})
	if err != nil {
		t.Fatal(err)
	}
	doc, _ := sh.Fragment()
	for _, want := range []string{"NOT COMPUTED", "no result was given", "no plan was given"} {
		if !strings.Contains(doc, want) {
			t.Errorf("a sheet without result lacks %q", want)
		}
	}
	evals, plans := 0, 0
	c := Computer{
		Evaluate: func(x *scenario.Scenario) (*sway.Result, error) { evals++; return sway.Evaluate(x) },
		Plan:     func(x *scenario.Scenario) (*plan.Result, error) { plans++; return plan.Make(x) },
	}
	in := c.Compute(s)
	// The recommended move at the nominal rope length and both ends of
	// the plan's range.
	if evals != 3 || plans != 1 || in.Result == nil || in.Plan == nil || len(in.Ropes) != 3 {
		t.Fatalf("%d evaluations, %d plans", evals, plans)
	}
	if len(in.Evaluated.Motions) != 1 || !strings.Contains(in.ResultFor, "recommended drive setting") {
		t.Errorf("a plan without moves shows %q", in.ResultFor)
	}
	sh, _ = Build(in)
	doc, _ = sh.Fragment()
	for _, want := range []string{"Largest swing", "peak swing", "Swing left after stopping", "to spare", "Time for one full swing"} {
		if !strings.Contains(doc, want) {
			t.Errorf("sheet lacks %q", want)
		}
	}
}

// A scenario with no move, no wind and no swing at the start says nothing
// was simulated, and marks nothing within.
func TestNothingSimulatedOnTheSheet(t *testing.T) {
	s := demo(t, "bay-travel.json")
	s.Motions = nil
	_, doc := build(t, s, Input{})
	if !strings.Contains(doc, "NOTHING SIMULATED") || strings.Contains(doc, "within") {
		t.Error("a sheet of no move does not say nothing was simulated")
	}
}

// The engineering detail's methods line names the model the figures come
// from (sway.ModelName): a point load, a hook block and load as two
// masses, a rigid load on its sling set, its spreader legs or its two
// hook ropes; never the two masses for a load that has none.
func TestMethodsNameTheModel(t *testing.T) {
	for file, want := range map[string]string{
		"bay-travel.json":             "Model: point load on one rope (full nonlinear 3D pendulum)",
		"heavy-hook-long-slings.json": "Model: hook block and load as two masses (full nonlinear 3D double pendulum)",
		"bay-girder-rigid.json":       "Model: rigid load on a two-leg sling set from the hook block",
		"precast-panel-spreader.json": "Model: rigid load on two parallel spreader legs from a spreader beam held by the crane",
		// Two hook ropes were named a four-leg sling set before.
		"precast-beam-tandem.json": "Model: rigid load on two hook ropes, each to its own lifting point",
	} {
		s := demo(t, file)
		_, doc := build(t, s, Input{Version: "test"})
		detail := doc[strings.Index(doc, "Engineering detail"):]
		if !strings.Contains(detail, want) {
			t.Errorf("%s: the methods line does not say %q", file, want)
		}
		if s.Load.Hook == nil && strings.Contains(detail, "two masses") {
			t.Errorf("%s: the methods line speaks of two masses", file)
		}
		if m := Methods(s)[0]; !strings.HasPrefix(m, "Model: "+sway.ModelName(s)+",") {
			t.Errorf("%s: Methods gives %q", file, m)
		}
	}
}
