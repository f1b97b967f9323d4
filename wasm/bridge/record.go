package bridge

import (
	"encoding/json"
	"fmt"
	"strings"

	"swaysheet/core/crane"
	"swaysheet/core/motion"
	"swaysheet/core/scenario"
)

func init() { Calls["record"] = record }

// RecordInput is the input of the "record" call: a drive record as CSV
// text (core/motion.ParseCSV: header time_s and one column per axis,
// <axis>_m or <axis>_deg for positions, <axis>_m_per_s or
// <axis>_deg_per_s for speeds) and the axis it is for. Axis may be empty
// when the record has a column for one axis only.
type RecordInput struct {
	_      [0]func() // never compared: no equality code in the wasm
	CSV    string    `json:"csv"`
	Axis   string    `json:"axis"`
	StartS float64   `json:"start_s"`
}

// RecordReply is the scenario's recorded motion made of the record (a
// "series" move of the axis, the CSV text in it), the column it reads,
// the axes the record has columns for, and its size.
type RecordReply struct {
	Motion    scenario.Motion `json:"motion"`
	Column    string          `json:"column"`
	Axes      []string        `json:"axes"`
	Samples   int             `json:"samples"`
	DurationS float64         `json:"duration_s"`
}

// record converts a drive record into the scenario's recorded motion. A
// problem in the CSV is a field error at "csv" whose message names the
// record's line and column ("line 3, column travel_x_m_per_s: ..."); a
// missing or unknown axis one at "axis". The motion is checked as the
// scenario checks a series move (the axis' speed and acceleration limits
// included); the page adopts the scenario with it through "validate".
func record(_ *Env, input []byte) (any, error) {
	var in RecordInput
	if err := json.Unmarshal(input, &in); err != nil {
		return nil, scenario.Errors{{Field: "(input)", Message: "expected {\"csv\": TEXT, \"axis\": \"travel_x\"}: " + err.Error()}}
	}
	if strings.TrimSpace(in.CSV) == "" {
		return nil, scenario.Errors{{Field: "csv", Message: "the record is empty: a header line time_s,<axis column> and one line per sample"}}
	}
	s, err := motion.ParseCSV(strings.NewReader(in.CSV))
	if err != nil {
		return nil, scenario.Errors{{Field: "csv", Message: err.Error()}}
	}
	axes := recordAxes(s)
	if in.Axis == "" {
		switch len(axes) {
		case 1:
			in.Axis = axes[0]
		case 0:
			return nil, scenario.Errors{{Field: "csv", Message: "line 1: no column names an axis: name them <axis>_m or <axis>_deg (positions), <axis>_m_per_s or <axis>_deg_per_s (speeds), the axis one of " + strings.Join(crane.Names(false), ", ")}}
		default:
			return nil, scenario.Errors{{Field: "axis", Message: "the record has columns for " + strings.Join(axes, ", ") + ": choose the axis"}}
		}
	}
	if _, ok := crane.Of(in.Axis); !ok {
		return nil, scenario.Errors{{Field: "axis", Message: fmt.Sprintf("%q is not an axis: one of %s", in.Axis, strings.Join(crane.Names(false), ", "))}}
	}
	m := scenario.Motion{Axis: in.Axis, Profile: scenario.ProfileSeries, StartS: in.StartS}
	m.CSV = in.CSV
	p, err := m.SeriesProfile()
	if err != nil {
		return nil, scenario.Errors{{Field: "csv", Message: err.Error()}}
	}
	return RecordReply{Motion: m, Column: scenario.DefaultColumn(in.Axis, s), Axes: axes,
		Samples: len(s.TimeS), DurationS: p.End() - s.TimeS[0]}, nil
}

// recordAxes lists the axes a record has a column for, in display order.
func recordAxes(s *motion.Series) []string {
	out := []string{}
	for _, a := range crane.Axes {
		col := a.Name + a.Kind.CSVSuffix
		_, pos := s.Column(col)
		_, speed := s.Column(col + "_per_s")
		if pos || speed {
			out = append(out, a.Name)
		}
	}
	return out
}
