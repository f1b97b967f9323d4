package sheet

import (
	"html"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"swaysheet/core/units"
)

// siAfterNumber finds an SI unit symbol used as a unit: after a number,
// across spaces or table cells, and not the start of a longer word ("3 m"
// and "0.5 m/s" and "12 kN" match; "3 minutes", "2 to" do not).
var siAfterNumber = regexp.MustCompile(`\d\s*(m/s²|m/s2|m/s|m/min|m²|m³|kg/m³|kN|kg|N|m|t)(?:[^\p{L}\p{N}/²³]|$)`)

var tagRE = regexp.MustCompile(`(?s)<svg.*?</svg>|<[^>]+>`)

// text is what a reader of the sheet sees: the markup gone (a cell
// boundary becomes a tab), the plots' own text kept.
func text(doc string) string {
	// The plots' texts (axis labels, the limit) are read too; the QR
	// code has none.
	plots := regexp.MustCompile(`(?s)<text[^>]*>(.*?)</text>`).FindAllStringSubmatch(doc, -1)
	out := tagRE.ReplaceAllString(doc, "\t")
	for _, p := range plots {
		out += "\t" + p[1]
	}
	return html.UnescapeString(out)
}

func TestSIUnitMatcher(t *testing.T) {
	for s, want := range map[string]bool{"3 m": true, "0.5\tm/s.": true, "12 kN": true, "7 t,": true, "1.2 m/s²": true,
		"3 minutes": false, "2 to": false, "3 ft": false, "4 ft/min": false, "5 lbf": false, "the m": false, "6 s": false, "9 in": false} {
		if got := siAfterNumber.MatchString(s); got != want {
			t.Errorf("%q: %v, want %v", s, got, want)
		}
	}
}

// The US sheet of every example shows every value and every sentence in
// US units: no SI unit symbol follows a number anywhere on it.
func TestUSSheetHasNoSIUnits(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	for _, f := range files {
		s := demo(t, filepath.Base(f))
		c := direct.Compute(s)
		c.Units = units.Choice{System: "us"}
		sh, err := Build(c)
		if err != nil {
			t.Fatal(err)
		}
		doc, _ := sh.Fragment()
		// The scenario's name and description are printed as typed: the
		// examples' say their numbers in words, so that they never
		// contradict the US figures beside them.
		if sh.data.Plan != nil && sh.data.Plan.Unmarked {
			// The planner's sentences without marked quantities are
			// printed in SI and say so; they are left out of this check
			// until the planner marks them.
			t.Logf("%s: the planner's sentences are not marked yet", filepath.Base(f))
			doc = regexp.MustCompile(`(?s)<section class="sw-plan">.*?</section>|<section class="sw-detail.*?</section>`).ReplaceAllString(doc, "")
		}
		for _, m := range siAfterNumber.FindAllStringIndex(text(doc), -1) {
			tx := text(doc)
			lo, hi := max(0, m[0]-60), min(len(tx), m[1]+20)
			t.Errorf("%s: SI unit in the US sheet: %q", filepath.Base(f), strings.ReplaceAll(tx[lo:hi], "\t", " "))
		}
		if strings.Contains(doc, "e-0") || strings.Contains(doc, "e+0") {
			t.Errorf("%s: scientific notation on the sheet", filepath.Base(f))
		}
	}
}
