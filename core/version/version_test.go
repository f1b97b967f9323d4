package version

import (
	"os"
	"strings"
	"testing"
)

// The version is a release, and the README names it.
func TestReleaseInReadme(t *testing.T) {
	if strings.Contains(Version, "dev") || Version == "" {
		t.Errorf("version %q is not a release", Version)
	}
	b, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(b), "Release "+Version) {
		t.Errorf("README does not say \"Release %s\"", Version)
	}
}
