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
	// A rigid load: the rope to the hook (the panel on a spreader, legs 4 m: heights 12 m and 8 m).
	if code := run([]string{"-ropelength", `{"heights": {"sheave_height_m": 12, "hook_height_m": 8}, "load": {"mass_kg": 9000, "body": {"length_m": 8, "width_m": 0.2, "height_m": 3, "spreader": {"spacing_m": 6}}}}`}, &out, &errs); code != 0 ||
		!strings.Contains(out.String(), `"rope_to_hook_m": 4,`) || !strings.Contains(out.String(), "rigid load") {
		t.Errorf("rigid load: exit %d, %s %s", code, out.String(), errs.String())
	}
	out.Reset()
	if code := run([]string{"-ropelength", `{"timed": {"swings": 0, "time_s": 86}}`}, &out, &errs); code != 1 ||
		!strings.Contains(errs.String(), "timed.swings: 0 is out of range") {
		t.Errorf("bad input: exit %d, %s", code, errs.String())
	}
}
