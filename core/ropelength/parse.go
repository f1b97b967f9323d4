package ropelength

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"strings"

	"swaysheet/core/scenario"
)

// MaxInputBytes bounds the size of one question.
const MaxInputBytes = 64 << 10

// Parse decodes one question from JSON (the form of Input) and finds the
// answer. Unknown fields, values of the wrong type and malformed JSON give
// scenario.Errors naming the field, or "(input)" for the whole.
func Parse(data []byte) (*Result, error) {
	whole := func(format string, args ...any) error {
		return scenario.Errors{{Field: "(input)", Message: fmt.Sprintf(format, args...)}}
	}
	if len(data) > MaxInputBytes {
		return nil, whole("the input is larger than %d bytes", MaxInputBytes)
	}
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	var in Input
	if err := dec.Decode(&in); err != nil {
		var te *json.UnmarshalTypeError
		switch {
		case errors.As(err, &te) && te.Field != "":
			return nil, scenario.Errors{{Field: te.Field, Message: fmt.Sprintf("expected %s, found a JSON %s", kindWords(te.Type.String()), te.Value)}}
		case strings.Contains(err.Error(), "unknown field"):
			return nil, whole("%s; accepted: heights, timed, hook, load", strings.TrimPrefix(err.Error(), "json: "))
		}
		return nil, whole("not a readable question: %v", err)
	}
	if dec.More() {
		return nil, whole("there is more after the closing brace")
	}
	return Find(&in)
}

// kindWords names a Go type as a reader of the JSON knows it.
func kindWords(t string) string {
	switch strings.TrimPrefix(t, "*") {
	case "float64":
		return "a number"
	case "ropelength.Heights", "ropelength.Timed", "ropelength.Hook", "ropelength.Input", "ropelength.Load", "scenario.Body", "scenario.Spreader", "scenario.Tandem", "scenario.HookRope":
		return "an object in { }"
	}
	return t
}
