package bridge

import (
	"encoding/json"

	"swaysheet/core/scenario"
	"swaysheet/core/units"
	"swaysheet/core/words"
)

func init() { Calls["say"] = say }

type sayInput struct {
	Sentences []words.Sentence  `json:"sentences"`
	Units     map[string]string `json:"units"`
	System    string            `json:"system"`
}

// say formats marked sentences (core/words: warning_sentences, the
// planner's sentences) in the units shown, rounded as the figures are:
// input {"sentences": [...], "units": {...}, "system": "us"}, result
// {"texts": [...]}.
func say(_ *Env, input []byte) (any, error) {
	var in sayInput
	if err := json.Unmarshal(input, &in); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"sentences\": [{\"text\", \"quantities\"}], \"units\": {...}, \"system\": \"si\"}: " + err.Error()}}
	}
	return map[string][]string{"texts": words.FormatAll(in.Sentences, units.Choice{Chosen: in.Units, System: in.System})}, nil
}
