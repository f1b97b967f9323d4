package sheet

import (
	"fmt"
	"html"
	"strings"
)

// qrSVG draws a QR code's modules as one path, black on white.
func qrSVG(bits [][]bool, label string) string {
	n := len(bits)
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
			fmt.Fprintf(&d, "M%d %dh%dv1h-%dz", x, y, run, run)
			x += run
		}
	}
	return fmt.Sprintf(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 %d %d" shape-rendering="crispEdges" role="img" aria-label="%s"><rect width="%d" height="%d" fill="#fff"/><path d="%s" fill="#000"/></svg>`,
		n, n, html.EscapeString(label), n, n, d.String())
}
