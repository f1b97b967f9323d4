package clearance

import (
	"encoding/json"
	"errors"
	"testing"

	"swaysheet/core/internal/testscenario"
)

// TestJoinerHoldsEachPartOnce: the parts added one at a time as they
// arrive, each decoded once, give after each the report CheckJoin gives
// of the parts so far, and with every run the single call's, exactly.
func TestJoinerHoldsEachPartOnce(t *testing.T) {
	s := testscenario.Example(t, "site-bay-columns")
	s.Site.Spread.Runs = 30
	one, err := Check(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	j, err := NewJoiner(s, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var parts []Part
	var ranges []Range
	for _, r := range [][2]int{{20, 30}, {0, 8}, {8, 20}} {
		p, err := CheckPart(s, r[0], r[1], Options{})
		if err != nil {
			t.Fatal(err)
		}
		if err := j.Add(*p); err != nil {
			t.Fatal(err)
		}
		parts, ranges = append(parts, *p), append(ranges, Range{r[0], r[1]})
		got, err := j.Report(ranges)
		if err != nil {
			t.Fatal(err)
		}
		want, err := CheckJoin(s, parts, Options{})
		if err != nil {
			t.Fatal(err)
		}
		a, _ := json.Marshal(want)
		b, _ := json.Marshal(got)
		if string(a) != string(b) {
			t.Errorf("%d parts held: the report differs from CheckJoin's", len(parts))
		}
	}
	a, _ := json.Marshal(one)
	b, _ := json.Marshal(mustReport(t, j, ranges))
	if string(a) != string(b) {
		t.Error("every part held: the report differs from the single call")
	}
	// A range not held is named; bad parts are refused and change nothing.
	var nh *NotHeldError
	if _, err := j.Report([]Range{{0, 8}, {8, 21}}); !errors.As(err, &nh) || nh.Index != 1 || nh.Range != (Range{8, 21}) {
		t.Errorf("a range not held: %v", err)
	}
	bad := parts[1]
	bad.Data = bad.Data[:len(bad.Data)-1]
	if err := j.Add(bad); err == nil {
		t.Error("a cut part held")
	}
	if err := j.Add(Part{From: 5, To: 5, Data: encodeRuns(nil)}); err == nil {
		t.Error("an empty part held")
	}
	if _, err := j.Report([]Range{{0, 8}, {0, 8}}); err == nil {
		t.Error("a part joined twice")
	}
	// Another split of the same runs takes the place of the parts it
	// overlaps: what is held stays within the check's runs.
	p, err := CheckPart(s, 4, 12, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := j.Add(*p); err != nil {
		t.Fatal(err)
	}
	if j.Holds(0, 8) || j.Holds(8, 20) || !j.Holds(4, 12) || !j.Holds(20, 30) || len(j.held) != 2 {
		t.Errorf("held after another split: %d parts", len(j.held))
	}
}

func mustReport(t *testing.T, j *Joiner, ranges []Range) *Report {
	t.Helper()
	r, err := j.Report(ranges)
	if err != nil {
		t.Fatal(err)
	}
	return r
}
