// Package bridge is the table of calls the page makes into the core: each
// takes JSON and gives JSON, the same JSON as the scenario file and the
// command line. It converts between JSON and the core's types and does
// nothing else; the js/wasm main in the parent directory exposes it to
// JavaScript.
//
// Every reply is one JSON object: {"result": ...} on success, or
// {"error": {"message": ..., "fields": [{"field": ..., "message": ...}]}}
// when the input is bad or anything inside failed, a panic included.
package bridge

import (
	"encoding/json"
	"errors"
	"fmt"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
)

// Func is one call: it reads its JSON input and returns a value to encode
// as the reply's result.
type Func func(env *Env, input []byte) (any, error)

// Env is what the calls may use from their surroundings.
type Env struct {
	// Fetch reads a file from the page's own origin by a URL relative to
	// the page (nil: no network; embedded copies are used). It may be
	// called from several goroutines at once (the examples are read
	// together).
	Fetch func(url string) ([]byte, error)
	// LibraryFetch reads a file of the site library from the page's own
	// origin by a URL relative to the page (nil: no site library). In the
	// page it is the small fetch wasm (wasm/fetch); the calls check what
	// it returns as they check any file.
	LibraryFetch func(url string) ([]byte, error)
}

// Calls is the table of calls by name.
var Calls = map[string]Func{
	"evaluate": evaluate,
	"validate": validate,
	"units":    unitTable,
	"ranges":   ranges,
	"examples": examples,
	"version":  versionCall,
	"plan":     makePlan,
}

// Error is the reply's error object.
type Error struct {
	Message string                `json:"message"`
	Fields  []scenario.FieldError `json:"fields"`
	// Resend: the call named data the engine no longer holds (a part of
	// clearance_join); the same call with the data answers.
	Resend bool `json:"resend,omitempty"`
}

type reply struct {
	Result any    `json:"result,omitempty"`
	Error  *Error `json:"error,omitempty"`
}

// Call runs the named call on input and returns the reply JSON. It never
// panics: a panic inside a call becomes an error reply.
func Call(env *Env, name string, input []byte) (out []byte) {
	defer func() {
		if p := recover(); p != nil {
			out = encode(reply{Error: &Error{
				Message: fmt.Sprintf("internal error in %s: %v (please report this with the scenario file)", name, p),
				Fields:  []scenario.FieldError{},
			}})
		}
	}()
	f, ok := Calls[name]
	if !ok {
		return encode(reply{Error: &Error{Message: fmt.Sprintf("unknown call %q", name), Fields: []scenario.FieldError{}}})
	}
	if env == nil {
		env = &Env{}
	}
	res, err := f(env, input)
	if err != nil {
		return encode(reply{Error: toError(err)})
	}
	return encode(reply{Result: res})
}

func encode(r reply) []byte {
	b, err := marshalReply(r)
	if err != nil {
		// A result that cannot be encoded (NaN, Inf) is reported, never sent.
		b, _ = json.Marshal(reply{Error: &Error{Message: "the result could not be encoded: " + err.Error(), Fields: []scenario.FieldError{}}})
	}
	return b
}

func toError(err error) *Error {
	var fe scenario.Errors
	if errors.As(err, &fe) {
		e := &Error{Fields: []scenario.FieldError(fe), Resend: errors.As(err, new(heldMissing))}
		if len(fe) == 1 {
			e.Message = fe[0].Error()
		} else {
			e.Message = fmt.Sprintf("%d fields need attention: %s", len(fe), fe.Error())
		}
		return e
	}
	return &Error{Message: err.Error(), Fields: []scenario.FieldError{}}
}

// evaluate runs one scenario: input is the scenario JSON, the result is
// an evaluation.
func evaluate(_ *Env, input []byte) (any, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	r, fp, err := evaluatedKeyed(s, true)
	return &evaluation{r, fp}, err
}

// evaluation is the evaluate call's result: the sway.Result JSON with,
// in it, key: the memo's name for the evaluation, by which the plot call
// draws its histories (plotInput).
type evaluation struct {
	*sway.Result
	Key string `json:"key"`
}

// Validation is the result of the "validate" call.
type Validation struct {
	Valid bool `json:"valid"`
	// Fingerprint is scenario.Fingerprint of the scenario as the core read
	// it: the page compares it with its own copy's to show that both read
	// a file alike.
	Fingerprint string `json:"fingerprint"`
}

// validate checks a scenario without running it; the result is a
// Validation.
func validate(_ *Env, input []byte) (any, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	fp, err := scenario.Fingerprint(s)
	if err != nil {
		return nil, err
	}
	return Validation{Valid: true, Fingerprint: fp}, nil
}

// makePlan plans the move of a scenario's plan block: input is the
// scenario JSON, the result is the plan.Result JSON (ranked options, each
// verified by simulation, the recommended one, the curves).
func makePlan(_ *Env, input []byte) (any, error) {
	s, err := scenario.Parse(input)
	if err != nil {
		return nil, err
	}
	return planned(s, true)
}
