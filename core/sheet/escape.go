package sheet

import (
	"strconv"
	"strings"
)

// escapeHTML is the standard library's html.EscapeString, the same five
// replacements (& ' < > " as &amp; &#39; &lt; &gt; &#34;), written here
// so that the html package is not linked into the page's wasm: its
// package initialisation keeps its table of the 2,231 named character
// references of HTML (for UnescapeString, which nothing here calls), about
// 22 kB of the gzipped wasm. TestEscapeHTMLAsStandard holds the two equal.
func escapeHTML(s string) string { return htmlEscaper.Replace(s) }

var htmlEscaper = strings.NewReplacer(
	`&`, "&amp;",
	`'`, "&#39;",
	`<`, "&lt;",
	`>`, "&gt;",
	`"`, "&#34;",
)

// classNumber reads the number k of a series class "s<k>" (a plain word:
// letters, digits, - and _, as PlotSeries.class gives) as
// fmt.Sscanf(class, "s%d", &k) did: the letter s, an optional sign, then
// decimal digits up to the first other character (what follows is not
// read); ok is false when there is no s, no digit or the number does not
// fit an int64. Written out so that fmt's scanner (about 26 kB of the
// gzipped wasm) is not linked. TestClassNumberAsSscanf holds the two
// equal.
func classNumber(class string) (k int, ok bool) {
	rest, found := strings.CutPrefix(class, "s")
	if !found {
		return 0, false
	}
	n := 0
	if n < len(rest) && (rest[n] == '+' || rest[n] == '-') {
		n++
	}
	for n < len(rest) && rest[n] >= '0' && rest[n] <= '9' {
		n++
	}
	v, err := strconv.ParseInt(rest[:n], 10, 64)
	if err != nil {
		return 0, false
	}
	return int(v), true
}
