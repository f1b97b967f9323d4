package sheettest

import (
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

// siAfterNumber finds an SI unit symbol used as a unit: after a number,
// across spaces, and not the start of a longer word ("3 m", "0.5 m/s",
// "12 kN"; not "3 minutes"). As core/sheet's test of the US sheet.
var siAfterNumber = regexp.MustCompile(`\d\s*(m/s²|m/s2|m/s|m/min|m²|m³|kg/m³|kN|kg|N|m|t)(?:[^\p{L}\p{N}/²³]|$)`)

// usAfterNumber finds a US unit symbol after a number ("27.90 ft",
// "15740 lbf"). The inch is left out: "9 in 10 times" is words.
var usAfterNumber = regexp.MustCompile(`\d\s*(ft/s²|ft/s|ft/min|ft²|ft|lbf|lb|kip|sh tn)(?:[^\p{L}\p{N}/²³]|$)`)

// openExample opens the example whose name holds part and waits for its
// results, plan (when it has a plan block) and sheet.
func (b *browser) openExample(part string) {
	b.t.Helper()
	b.do(chromedp.Click(chromedp.ID("open-examples")))
	ok := eval[bool](b, `(function () {
	  var li = Array.from(document.querySelectorAll('#examples-list li')).filter(function (l) { return l.textContent.indexOf(`+strconv.Quote(part)+`) >= 0; })[0];
	  if (!li) return false;
	  li.querySelector('button').click();
	  return true; })()`)
	if !ok {
		b.t.Fatalf("no example %q", part)
	}
	b.poll(`!window.swaysheetPlan.running() && (!JSON.parse(window.swaysheet.scenarioJSON()).plan || window.swaysheetPlan.resultJSON() !== '')`, "the plan was not made")
	b.settle()
	b.waitSheet()
}

// around is the text about a match, for the message.
func around(s string, m []int) string {
	lo, hi := max(0, m[0]-50), min(len(s), m[1]+20)
	return strings.Join(strings.Fields(s[lo:hi]), " ")
}

// One unit system everywhere: in the US view no SI unit follows a number
// anywhere on the page's results, warnings and plan, nor on the printed
// sheet (its PDF's text); in the SI view no US unit does. The examples
// have warnings with lengths in them (hard stop, rigid girder), the
// planner's sentences (pendant, hook block, slew) and a recommended move
// presented without moves of its own, and a wind speed.
func TestOneUnitSystem(t *testing.T) {
	need(t)
	url, _ := pageServer(t, filepath.Join(root, "web", "static"))
	b := open(t)
	b.do(chromedp.Navigate(url))
	b.settle()
	out := filepath.Join(root, "out", "browser")
	os.MkdirAll(out, 0o755)
	for _, ex := range []struct{ part, file string }{{"trolley brakes hard", "hard-stop"}, {"rigid load", "bay-girder-rigid"},
		{"three-step pendant", "plan-gantry-pendant"}, {"light panel's travel", "plan-precast-hook"},
		{"plan the tower crane's slew", "plan-tower-slew"}, {"gust on a hanging wall panel", "wind-gust"}} {
		b.openExample(ex.part)
		for _, sys := range []string{"us", "si"} {
			bad, other := siAfterNumber, "si"
			if sys == "si" {
				bad, other = usAfterNumber, "us"
			}
			b.do(chromedp.Click(chromedp.ID("sys-" + sys)))
			b.poll(`window.swaysheet.system() === '`+sys+`' && window.swaysheet.settled()`, "no switch to "+sys)
			b.waitSheet()
			time.Sleep(100 * time.Millisecond)
			for _, sel := range []string{"#results", "#plan-out", "#example-banner"} {
				txt := b.text(sel)
				for _, m := range bad.FindAllStringIndex(txt, -1) {
					t.Errorf("%s, %s view: %s shows a %s unit: %q", ex.file, sys, sel, other, around(txt, m))
				}
				if strings.Contains(txt, "e-0") || strings.Contains(txt, "e+0") {
					t.Errorf("%s, %s view: scientific notation in %s", ex.file, sys, sel)
				}
			}
			if !strings.Contains(b.text("#warnings"), "No warnings") && !strings.Contains(b.text("#warnings"), "Warnings") {
				t.Errorf("%s: no warnings shown", ex.file)
			}
			file := filepath.Join(out, "units-"+ex.file+"-"+sys+".pdf")
			if err := os.WriteFile(file, b.pdf(8.5, 11), 0o644); err != nil {
				t.Fatal(err)
			}
			txt := pdfText(t, file, "pdftotext", "-layout")
			for _, m := range bad.FindAllStringIndex(txt, -1) {
				t.Errorf("%s, %s sheet: a %s unit: %q", ex.file, sys, other, around(txt, m))
			}
			if strings.Contains(txt, "e-0") || strings.Contains(txt, "e+0") {
				t.Errorf("%s, %s sheet: scientific notation", ex.file, sys)
			}
		}
	}
}
