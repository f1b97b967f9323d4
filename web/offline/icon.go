package offline

import (
	"image"
	"image/color"
	"math"
)

// DrawIcon draws the page's icon (web/static/icon.svg: a dark tile, a
// yellow crane girder, a white rope and a yellow load) at n by n pixels.
// With maskable set, the drawing keeps inside the middle 80 %, the safe
// zone of a maskable icon, on a full dark square.
func DrawIcon(n int, maskable bool) *image.RGBA {
	img := image.NewRGBA(image.Rect(0, 0, n, n))
	dark := color.RGBA{0x0b, 0x0b, 0x0b, 0xff}
	yellow := color.RGBA{0xff, 0xd2, 0x1f, 0xff}
	white := color.RGBA{0xff, 0xff, 0xff, 0xff}
	s := float64(n) / 64
	off := 0.0
	if maskable {
		s *= 0.8
		off = float64(n) * 0.1
	}
	// p maps the SVG's 64x64 units to pixels.
	in := func(px, py int) (float64, float64) {
		return (float64(px) + 0.5 - off) / s, (float64(py) + 0.5 - off) / s
	}
	for py := 0; py < n; py++ {
		for px := 0; px < n; px++ {
			x, y := in(px, py)
			if !maskable && !roundRect(x, y, 64, 64, 10) {
				continue
			}
			c := dark
			switch {
			case x >= 36 && x <= 54 && y >= 44 && y <= 56:
				c = yellow
			case x >= 8 && x <= 56 && y >= 9 && y <= 15:
				c = yellow
			case segDist(x, y, 32, 12, 44, 46) <= 1.5:
				c = white
			}
			img.SetRGBA(px, py, c)
		}
	}
	return img
}

func roundRect(x, y, w, h, r float64) bool {
	if x < 0 || y < 0 || x > w || y > h {
		return false
	}
	cx := math.Max(r, math.Min(w-r, x))
	cy := math.Max(r, math.Min(h-r, y))
	return math.Hypot(x-cx, y-cy) <= r
}

func segDist(x, y, x1, y1, x2, y2 float64) float64 {
	dx, dy := x2-x1, y2-y1
	t := ((x-x1)*dx + (y-y1)*dy) / (dx*dx + dy*dy)
	t = math.Max(0, math.Min(1, t))
	return math.Hypot(x-(x1+t*dx), y-(y1+t*dy))
}
