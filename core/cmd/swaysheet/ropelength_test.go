package main

import (
	"bytes"
	"strings"
	"testing"
)

func TestRopeLengthCommand(t *testing.T) {
	var out, errs bytes.Buffer
	if code := run([]string{"-ropelength", `{"timed": {"swings": 10, "time_s": 86, "amplitude_deg": 5}}`}, &out, &errs); code != 0 {
		t.Fatalf("exit %d: %s", code, errs.String())
	}
	if !strings.Contains(out.String(), `"rope_length_m": 18.35`) {
		t.Errorf("output: %s", out.String())
	}
	out.Reset()
	if code := run([]string{"-ropelength", `{"timed": {"swings": 0, "time_s": 86}}`}, &out, &errs); code != 1 ||
		!strings.Contains(errs.String(), "timed.swings: 0 is out of range") {
		t.Errorf("bad input: exit %d, %s", code, errs.String())
	}
}
