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
