package sheet

import (
	"fmt"
	"html"
	"testing"
)

func TestEscapeHTMLAsStandard(t *testing.T) {
	for _, s := range []string{"", "plain", `<a href="x">Tom & Jerry's</a>`, "&amp;&lt;", "ünïcode → ≤ 3°", "\x00'\"<>&"} {
		if got, want := escapeHTML(s), html.EscapeString(s); got != want {
			t.Errorf("escapeHTML(%q) = %q, html.EscapeString gives %q", s, got, want)
		}
	}
}

func TestClassNumberAsSscanf(t *testing.T) {
	for _, c := range []string{"s1", "s6", "s7", "s0", "s-3", "s+4", "s", "s-", "sx", "s12ab", "s007", "S1", "x1", "",
		"s99999999999999999999", "s9223372036854775807", "s-9223372036854775808", "speed", "s_1", "s1-2", "line"} {
		var want int
		_, err := fmt.Sscanf(c, "s%d", &want)
		got, ok := classNumber(c)
		if ok != (err == nil) || ok && got != want {
			t.Errorf("classNumber(%q) = %d, %v; fmt.Sscanf gives %d, %v", c, got, ok, want, err)
		}
	}
}
