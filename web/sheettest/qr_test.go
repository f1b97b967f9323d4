package sheettest

import (
	"bytes"
	"image/png"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
	"github.com/makiuchi-d/gozxing"
	gzqr "github.com/makiuchi-d/gozxing/qrcode"

	"swaysheet/core/scenario"
	"swaysheet/core/sheet"
)

// The QR code on the printed page, read from the PDF's pixels with the
// gozxing decoder, is a link that holds the same scenario; following it
// reopens that scenario in the page.
func TestQRCodeFromPrint(t *testing.T) {
	need(t)
	url, _ := pageServer(t, filepath.Join(root, "web", "static"))
	b := open(t)
	b.do(chromedp.Navigate(url))
	b.settle()
	b.typeInto("#f-sheet-prepared_by", "Ünal Öz <planner>")
	b.typeInto("#f-load-rope_length_m", "9.25")
	b.settle()
	s, err := scenario.Parse([]byte(eval[string](b, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	fp, _ := scenario.Fingerprint(s)
	for i := 0; b.waitSheet() != fp; i++ {
		if i > 600 {
			t.Fatal("the sheet does not follow the inputs")
		}
		b.sleep()
	}
	dir := t.TempDir()
	pdf := filepath.Join(dir, "sheet.pdf")
	if err := os.WriteFile(pdf, b.pdf(8.27, 11.69), 0o644); err != nil {
		t.Fatal(err)
	}
	if out, err := exec.Command("pdftoppm", "-r", "300", "-gray", "-png", "-singlefile", pdf, filepath.Join(dir, "page")).CombinedOutput(); err != nil {
		t.Fatalf("pdftoppm: %v %s", err, out)
	}
	f, err := os.ReadFile(filepath.Join(dir, "page.png"))
	if err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(bytes.NewReader(f))
	if err != nil {
		t.Fatal(err)
	}
	bmp, err := gozxing.NewBinaryBitmapFromImage(img)
	if err != nil {
		t.Fatal(err)
	}
	res, err := gzqr.NewQRCodeReader().Decode(bmp, map[gozxing.DecodeHintType]interface{}{gozxing.DecodeHintType_TRY_HARDER: true})
	if err != nil {
		t.Fatalf("no QR code read from the printed page: %v", err)
	}
	link := res.GetText()
	base, frag, ok := strings.Cut(link, "#")
	if !ok || base != url {
		t.Fatalf("the QR code holds %q, not a link to the page %s", link, url)
	}
	raw, err := sheet.ReadShareFragment(frag)
	if err != nil {
		t.Fatal(err)
	}
	want, _ := scenario.Canonical(s)
	if !bytes.Equal(raw, want) {
		t.Fatalf("the QR code's scenario differs:\n got %s\nwant %s", raw, want)
	}
	// Follow the link in a fresh browser: the same scenario opens.
	b2 := open(t)
	b2.do(chromedp.Navigate(link))
	b2.settle()
	s2, err := scenario.Parse([]byte(eval[string](b2, `window.swaysheet.scenarioJSON()`)))
	if err != nil {
		t.Fatal(err)
	}
	if fp2, _ := scenario.Fingerprint(s2); fp2 != fp {
		t.Fatalf("the link opened another scenario (fingerprint %s, want %s)", fp2, fp)
	}
}
