package scenario

import (
	"bytes"
	"encoding/hex"
	"encoding/json"

	"swaysheet/core/units"
)

// Canonical is the scenario's canonical JSON, the bytes its fingerprint is
// taken of and the bytes a check sheet's QR code carries. It is defined as:
//
//  1. the scenario as this tool reads it, normalised so that two files that
//     mean the same lift give the same bytes (Normalise): explicit defaults
//     are dropped (profile "trapezoid"; decel_* equal to accel_* where the
//     braking defaults to the acceleration; an EI shaper's tolerance_pct 5
//     and a shaper's rope_length_m equal to the load's; settings.accuracy
//     "default", settle_periods 3, samples 601;
//     wind.air_density_kg_per_m3 equal to the standard 1.225), blocks that
//     say nothing (sheet, settings, limits, initial with every field
//     empty or zero) are dropped, and -0 is written 0; then written by
//     Encode's field rules: a field that is absent, or an optional field at
//     its zero value, is left out;
//  2. every object's keys sorted by their bytes (UTF-8), at every depth;
//  3. no whitespace between tokens;
//  4. numbers in the shortest form that reads back to the same float64
//     (Go's encoding/json: 0.25, 1e-7, 120; no trailing zeros, no "+");
//  5. strings with only the escapes JSON requires plus \u2028 and \u2029;
//     '<', '>' and '&' are written as themselves, invalid UTF-8 as U+FFFD.
//
// Anyone can check a fingerprint: parse the file, apply 2 to 5 (for
// example `jq -cS .` does, for files without zero-valued optional fields)
// and take SHA-256.
func Canonical(s *Scenario) ([]byte, error) {
	n, err := Normalise(s)
	if err != nil {
		return nil, err
	}
	raw, err := json.Marshal(n)
	if err != nil {
		return nil, err
	}
	dec := json.NewDecoder(bytes.NewReader(raw))
	dec.UseNumber() // keep each number's text from step 1 exactly
	var v any
	if err := dec.Decode(&v); err != nil {
		return nil, err
	}
	v = positiveZero(v)
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetEscapeHTML(false)
	if err := enc.Encode(v); err != nil { // maps are written with sorted keys
		return nil, err
	}
	return bytes.TrimSuffix(buf.Bytes(), []byte("\n")), nil
}

// Fingerprint is the SHA-256 of Canonical(s) in lower-case hex.
func Fingerprint(s *Scenario) (string, error) {
	c, err := Canonical(s)
	if err != nil {
		return "", err
	}
	sum := sum256(c)
	return hex.EncodeToString(sum[:]), nil
}

// Normalise returns a copy of s with the explicit defaults and empty blocks
// that Canonical's step 1 lists removed; s itself is not changed.
func Normalise(s *Scenario) (*Scenario, error) {
	raw, err := json.Marshal(s)
	if err != nil {
		return nil, err
	}
	var n Scenario
	if err := json.Unmarshal(raw, &n); err != nil {
		return nil, err
	}
	for i := range n.Motions {
		m := &n.Motions[i]
		if m.Profile == ProfileTrapezoid {
			m.Profile = ""
		}
		switch m.Profile {
		case "", ProfileSCurve, ProfileSteps, ProfileSineRamp: // decel_* defaults to accel_*
			if sameValue(m.DecelMPerS2, m.AccelMPerS2) {
				m.DecelMPerS2 = nil
			}
			if sameValue(m.DecelDegPerS2, m.AccelDegPerS2) {
				m.DecelDegPerS2 = nil
			}
		}
		if sh := m.Shaper; sh != nil {
			if sh.Kind == "ei" && sh.TolerancePct == 5 {
				sh.TolerancePct = 0
			}
			if sameValue(sh.RopeLengthM, n.Load.RopeLengthM) {
				sh.RopeLengthM = nil
			}
		}
	}
	if w := n.Wind; w != nil && w.AirDensityKgPerM3 == units.AirDensity {
		w.AirDensityKgPerM3 = 0
	}
	if st := n.Settings; st != nil {
		if st.Accuracy == "default" {
			st.Accuracy = ""
		}
		if st.SettlePeriods == 3 {
			st.SettlePeriods = 0
		}
		if st.Samples == 601 {
			st.Samples = 0
		}
		if *st == (Settings{}) {
			n.Settings = nil
		}
	}
	if n.Sheet != nil && *n.Sheet == (Sheet{}) {
		n.Sheet = nil
	}
	if n.Limits != nil && *n.Limits == (Limits{}) {
		n.Limits = nil
	}
	if n.Initial != nil && *n.Initial == (Initial{}) {
		n.Initial = nil
	}
	return &n, nil
}

func sameValue(a, b *float64) bool { return a != nil && b != nil && *a == *b }

// positiveZero writes every -0 of a decoded JSON tree as 0.
func positiveZero(v any) any {
	switch x := v.(type) {
	case map[string]any:
		for k, e := range x {
			x[k] = positiveZero(e)
		}
	case []any:
		for i, e := range x {
			x[i] = positiveZero(e)
		}
	case json.Number:
		if f, err := x.Float64(); err == nil && f == 0 {
			return json.Number("0")
		}
	}
	return v
}
