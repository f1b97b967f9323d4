package scenario

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
)

// Canonical is the scenario's canonical JSON, the bytes its fingerprint is
// taken of and the bytes a check sheet's QR code carries. It is defined as:
//
//  1. the scenario as this tool reads it, written by Encode's field rules:
//     a field that is absent, or an optional field at its zero value, is
//     left out, so two files that mean the same lift give the same bytes;
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
	raw, err := json.Marshal(s)
	if err != nil {
		return nil, err
	}
	dec := json.NewDecoder(bytes.NewReader(raw))
	dec.UseNumber() // keep each number's text from step 1 exactly
	var v any
	if err := dec.Decode(&v); err != nil {
		return nil, err
	}
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
	sum := sha256.Sum256(c)
	return hex.EncodeToString(sum[:]), nil
}
