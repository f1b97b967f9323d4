// Package qrdecode is test support: it reads a QR code's modules back
// with an independent decoder (gozxing, which shares no code with
// core/qr), so that the tests of core/qr and core/sheet check what they
// draw against a reader of their own. One helper instead of a copy in
// each package's tests.
package qrdecode

import (
	"image"
	"image/color"
	"testing"

	"github.com/makiuchi-d/gozxing"
	gzqr "github.com/makiuchi-d/gozxing/qrcode"
)

// Modules draws bits (true: a dark module; rows from the top) dark on
// white at px pixels a module, with no quiet zone, decodes the image as
// a pure barcode and returns its text; it fails the test when the image
// does not decode.
func Modules(t testing.TB, bits [][]bool, px int) string {
	t.Helper()
	n := len(bits)
	img := image.NewGray(image.Rect(0, 0, n*px, n*px))
	for y := 0; y < n*px; y++ {
		for x := 0; x < n*px; x++ {
			c := color.Gray{Y: 255}
			if bits[y/px][x/px] {
				c.Y = 0
			}
			img.SetGray(x, y, c)
		}
	}
	bmp, err := gozxing.NewBinaryBitmapFromImage(img)
	if err != nil {
		t.Fatal(err)
	}
	res, err := gzqr.NewQRCodeReader().Decode(bmp, map[gozxing.DecodeHintType]interface{}{gozxing.DecodeHintType_PURE_BARCODE: true})
	if err != nil {
		t.Fatal(err)
	}
	return res.GetText()
}
