package scenario

import (
	"crypto/sha256"
	"encoding/hex"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestCanonicalSortedCompact(t *testing.T) {
	in := `{
	  "version": 1, "format": "swaysheet-scenario", "name": "bay <crane> & co",
	  "load": {"rope_length_m": 8.50, "mass_kg": 2000},
	  "motions": [{"axis": "travel_x", "start_s": 0, "distance_m": 12, "speed_m_per_s": 0.5, "accel_m_per_s2": 2.5e-1}],
	  "sheet": {"project": "Hall 3", "checked_by": ""}
	}`
	s, err := Parse([]byte(in))
	if err != nil {
		t.Fatal(err)
	}
	got, err := Canonical(s)
	if err != nil {
		t.Fatal(err)
	}
	want := `{"format":"swaysheet-scenario","load":{"mass_kg":2000,"rope_length_m":8.5},` +
		`"motions":[{"accel_m_per_s2":0.25,"axis":"travel_x","distance_m":12,"speed_m_per_s":0.5}],` +
		`"name":"bay <crane> & co","sheet":{"project":"Hall 3"},"version":1}`
	if string(got) != want {
		t.Fatalf("canonical:\n got %s\nwant %s", got, want)
	}
	fp, err := Fingerprint(s)
	if err != nil {
		t.Fatal(err)
	}
	sum := sha256.Sum256([]byte(want))
	if fp != hex.EncodeToString(sum[:]) {
		t.Fatalf("fingerprint %s is not the SHA-256 of the canonical JSON", fp)
	}
}

// Reading the canonical JSON back gives the same canonical JSON, for every
// example file: the fingerprint survives a round trip through a QR code
// or a share link.
func TestCanonicalRoundTrip(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	if len(files) == 0 {
		t.Fatal("no example scenarios")
	}
	for _, f := range files {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		s, err := Parse(data)
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		c1, err := Canonical(s)
		if err != nil {
			t.Fatal(err)
		}
		s2, err := Parse(c1)
		if err != nil {
			t.Fatalf("%s: canonical JSON does not parse: %v", f, err)
		}
		c2, _ := Canonical(s2)
		if string(c1) != string(c2) {
			t.Fatalf("%s: canonical JSON changes on a round trip", f)
		}
		if strings.ContainsAny(string(c1), "\n\t") {
			t.Fatalf("%s: whitespace in canonical JSON", f)
		}
	}
}

// A different lift has a different fingerprint; a reformatted file the same.
func TestFingerprintSensitivity(t *testing.T) {
	a := `{"format":"swaysheet-scenario","version":1,"name":"a","load":{"mass_kg":100,"rope_length_m":5},"motions":[]}`
	b := "{\n  \"name\": \"a\", \"version\": 1, \"format\": \"swaysheet-scenario\",\n  \"motions\": [], \"load\": {\"rope_length_m\": 5.0, \"mass_kg\": 1e2}\n}\n"
	c := `{"format":"swaysheet-scenario","version":1,"name":"a","load":{"mass_kg":100,"rope_length_m":5.001},"motions":[]}`
	fp := func(x string) string {
		s, err := Parse([]byte(x))
		if err != nil {
			t.Fatal(err)
		}
		f, err := Fingerprint(s)
		if err != nil {
			t.Fatal(err)
		}
		return f
	}
	if fp(a) != fp(b) {
		t.Fatal("reformatting changed the fingerprint")
	}
	if fp(a) == fp(c) {
		t.Fatal("a changed rope length kept the fingerprint")
	}
}

// Files that mean the same lift have the same fingerprint: the canonical
// form leaves out explicit defaults, empty blocks and the sign of zero.
func TestFingerprintNormalised(t *testing.T) {
	const load = `"load":{"mass_kg":100,"rope_length_m":5}`
	base := `{"format":"swaysheet-scenario","version":1,"name":"a",` + load + `,"motions":[{"axis":"travel_x","distance_m":4,"speed_m_per_s":0.5,"accel_m_per_s2":0.3}]}`
	with := func(old, new string) string { return strings.Replace(base, old, new, 1) }
	fp := func(x string) string {
		s, err := Parse([]byte(x))
		if err != nil {
			t.Fatalf("%s: %v", x, err)
		}
		f, err := Fingerprint(s)
		if err != nil {
			t.Fatal(err)
		}
		return f
	}
	want := fp(base)
	for _, c := range []struct{ name, data string }{
		{"explicit trapezoid", with(`"axis":"travel_x"`, `"axis":"travel_x","profile":"trapezoid"`)},
		{"braking equal to acceleration", with(`"accel_m_per_s2":0.3`, `"accel_m_per_s2":0.3,"decel_m_per_s2":0.3`)},
		{"empty sheet", with(`"motions"`, `"sheet":{},"motions"`)},
		{"empty sheet fields", with(`"motions"`, `"sheet":{"project":"","date":""},"motions"`)},
		{"empty settings", with(`"motions"`, `"settings":{"accuracy":"default","settle_periods":3,"samples":601},"motions"`)},
		{"empty limits and initial", with(`"motions"`, `"limits":{},"initial":{"swing_deg":0},"motions"`)},
		{"negative zero", with(`"axis":"travel_x"`, `"axis":"travel_x","start_s":-0`)},
		{"negative zero radius", with(`"motions"`, `"crane":{"radius_m":-0.0},"motions"`)},
		{"shaper defaults", base},
	} {
		if got := fp(c.data); got != want {
			c1, _ := Parse([]byte(c.data))
			b, _ := Canonical(c1)
			t.Errorf("%s: fingerprint differs; canonical %s", c.name, b)
		}
	}
	// A shaper at its defaults: EI tolerance 5 %, the load's rope length.
	sh := with(`"accel_m_per_s2":0.3`, `"accel_m_per_s2":0.3,"shaper":{"kind":"ei"}`)
	shExplicit := with(`"accel_m_per_s2":0.3`, `"accel_m_per_s2":0.3,"shaper":{"kind":"ei","tolerance_pct":5,"rope_length_m":5,"damping_ratio":-0}`)
	if fp(sh) != fp(shExplicit) {
		t.Error("a shaper's explicit defaults change the fingerprint")
	}
	if fp(with(`"distance_m":4`, `"distance_m":0`)) != fp(with(`"distance_m":4`, `"distance_m":-0.0`)) {
		t.Error("-0 and 0 give different fingerprints")
	}
	// Differences that matter still change it.
	for _, c := range []string{
		with(`"accel_m_per_s2":0.3`, `"accel_m_per_s2":0.3,"decel_m_per_s2":0.2`),
		with(`"axis":"travel_x"`, `"axis":"travel_x","profile":"s_curve","rounding_s":0`),
		with(`"motions"`, `"sheet":{"project":"x"},"motions"`),
	} {
		if fp(c) == want {
			t.Errorf("a different lift kept the fingerprint: %s", c)
		}
	}
}
