package bridge

import (
	"encoding/json"
	"strings"
	"testing"

	"swaysheet/core/scenario"
)

// The record call makes a drive record into the scenario's recorded
// motion, and names the CSV line and column of a problem.
func TestRecordCall(t *testing.T) {
	speeds := "time_s,travel_x_m_per_s\n0,0\n0.5,0.1\n1,0.2\n4,0.2\n5,0\n"
	var r struct {
		Result RecordReply `json:"result"`
		Error  *Error      `json:"error"`
	}
	in, _ := json.Marshal(RecordInput{CSV: speeds})
	if json.Unmarshal(Call(nil, "record", in), &r); r.Error != nil {
		t.Fatal(r.Error.Message)
	}
	m := r.Result.Motion
	if m.Axis != "travel_x" || m.Profile != scenario.ProfileSeries || m.CSV != speeds || r.Result.Column != "travel_x_m_per_s" ||
		r.Result.Samples != 5 || r.Result.DurationS != 5 {
		t.Errorf("reply %+v", r.Result)
	}
	// The motion goes into a scenario the core reads.
	sc := map[string]any{"format": scenario.FormatName, "version": scenario.Version, "name": "record",
		"load": map[string]any{"mass_kg": 1000, "rope_length_m": 6}, "motions": []any{m}}
	data, _ := json.Marshal(sc)
	if _, err := scenario.Parse(data); err != nil {
		t.Errorf("the scenario with the recorded motion: %v", err)
	}

	for _, c := range []struct {
		in          RecordInput
		field, says string
	}{
		{RecordInput{CSV: "time_s,travel_x_m_per_s\n0,0\n1,zero\n2,0\n"}, "csv", "line 3, column travel_x_m_per_s:"},
		{RecordInput{CSV: "time_s,travel_x_m_per_s\n0,0\n1,0.2\n0.5,0\n"}, "csv", "line 4, column time_s:"},
		{RecordInput{CSV: "time_s,travel_x_m_per_s\n0,0\n1,50\n2,0\n"}, "csv", "line 3, column travel_x_m_per_s: the speed reaches 50"},
		{RecordInput{CSV: "time_s,speed\n0,0\n1,0\n"}, "csv", "no column names an axis"},
		{RecordInput{CSV: "time_s,travel_x_m,slew_deg\n0,0,0\n1,1,2\n"}, "axis", "travel_x, slew: choose"},
		{RecordInput{CSV: speeds, Axis: "slew"}, "csv", "no column for the slew axis"},
		{RecordInput{CSV: speeds, Axis: "sideways"}, "axis", "not an axis"},
		{RecordInput{CSV: " "}, "csv", "empty"},
	} {
		in, _ := json.Marshal(c.in)
		var e struct{ Error *Error }
		json.Unmarshal(Call(nil, "record", in), &e)
		if e.Error == nil || len(e.Error.Fields) != 1 || e.Error.Fields[0].Field != c.field || !strings.Contains(e.Error.Fields[0].Message, c.says) {
			t.Errorf("%q: %+v, want %s: ...%s...", c.in.CSV, e.Error, c.field, c.says)
		}
	}
	// Two axes, one chosen: the column of that axis.
	in, _ = json.Marshal(RecordInput{CSV: "time_s,travel_x_m,slew_deg\n0,0,0\n1,0.5,1\n2,1,2\n", Axis: "slew"})
	r.Result = RecordReply{}
	if json.Unmarshal(Call(nil, "record", in), &r); r.Error != nil || r.Result.Column != "slew_deg" || len(r.Result.Axes) != 2 {
		t.Errorf("chosen axis: %+v %+v", r.Error, r.Result)
	}
}
