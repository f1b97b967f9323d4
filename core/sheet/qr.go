package sheet

import (
	"strconv"
	"strings"
)

// qrSVG draws a QR code's modules (with their quiet zone) as one path,
// black on white: each row's runs of dark modules as rectangles.
func qrSVG(bits [][]bool, label string) string {
	n := strconv.Itoa(len(bits))
	var d strings.Builder
	for y, row := range bits {
		for x := 0; x < len(row); {
			if !row[x] {
				x++
				continue
			}
			run := 1
			for x+run < len(row) && row[x+run] {
				run++
			}
			r := strconv.Itoa(run)
			d.WriteString("M" + strconv.Itoa(x) + " " + strconv.Itoa(y) + "h" + r + "v1h-" + r + "z")
			x += run
		}
	}
	return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ` + n + " " + n + `" shape-rendering="crispEdges" role="img" aria-label="` +
		escapeHTML(label) + `"><rect width="` + n + `" height="` + n + `" fill="#fff"/><path d="` + d.String() + `" fill="#000"/></svg>`
}
