package figures

import (
	"encoding/json"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"swaysheet/core/internal/testscenario"
	"testing"

	"swaysheet/core/scenario"
	"swaysheet/core/sway"
	"swaysheet/core/units"
)

// at reads a JSON path such as "rigging.mode_periods_s[1]" from v.
func at(v any, path string) (any, bool) {
	for _, part := range strings.Split(path, ".") {
		name, idx, indexed := strings.Cut(part, "[")
		m, ok := v.(map[string]any)
		if !ok {
			return nil, false
		}
		if v, ok = m[name]; !ok {
			return nil, false
		}
		if indexed {
			i, _ := strconv.Atoi(strings.TrimSuffix(idx, "]"))
			a, ok := v.([]any)
			if !ok || i >= len(a) {
				return nil, false
			}
			v = a[i]
		}
	}
	return v, true
}

// Every figure of the table is the result's own field (its key is the
// JSON path), every limit a scenario.Limits field, and the verdict of
// each limit agrees with sway's own checks.
func TestTableMatchesResultsAndChecks(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/scenarios/*.json")
	// limits: the figure's key of each limit (the key is the limit's
	// name, or a path in the result: body.peak_tilt_deg).
	limits := map[string]string{}
	for _, f := range Table {
		if f.Limit != "" {
			limits[f.Limit] = f.Key
			if limitOf(&scenario.Limits{}, f.Limit) != nil {
				t.Fatalf("%s: an unset limit reads as set", f.Key)
			}
		}
		if q := f.Quantity; q != "" {
			if _, ok := units.Table[q]; !ok {
				t.Errorf("%s: quantity %q not in units.Table", f.Key, q)
			}
		} else if units.QuantityOf(f.Unit) == "" {
			t.Errorf("%s: unit %q has no quantity", f.Key, f.Unit)
		}
	}
	seen := map[string]bool{}
	for _, file := range files {
		s := testscenario.Example(t, filepath.Base(file))
		r, err := sway.EvaluateWith(s, sway.Options{NoHistory: true})
		if err != nil {
			t.Fatal(err)
		}
		raw, _ := json.Marshal(r)
		var m map[string]any
		json.Unmarshal(raw, &m)
		rep := Present(s, r, units.Choice{})
		rows := map[string]Row{}
		for _, row := range rep.Rows {
			rows[row.Key] = row
			seen[row.Key] = true
			got, ok := at(m, row.Key)
			if !ok || got.(float64) != row.ValueSI {
				t.Errorf("%s: %s is %v in the result JSON, %v in the row", file, row.Key, got, row.ValueSI)
			}
			if strings.ContainsAny(row.Text, "e+") {
				t.Errorf("%s: %s shown as %q", file, row.Key, row.Text)
			}
		}
		for _, c := range r.Checks {
			key, ok := limits[c.Name]
			if !ok {
				t.Errorf("sway checks %s, the table has no limit for it", c.Name)
				continue
			}
			row := rows[key]
			if rep.Verdict.State == NotSimulated {
				// sway says "within" of a scenario with no move; the
				// table says nothing was simulated.
				if row.Check != nil {
					t.Errorf("%s: %s checked with nothing simulated", file, c.Name)
				}
				continue
			}
			if row.Check == nil || row.Check.Within != c.Within || row.Check.LimitSI != c.Limit {
				t.Errorf("%s: %s: row %+v, sway's check %+v", file, c.Name, row.Check, c)
			}
			if !c.Within && rep.Verdict.State != Outside {
				t.Errorf("%s: %s outside, verdict %q", file, c.Name, rep.Verdict.State)
			}
		}
		if len(r.Checks) > 0 && rep.Verdict.State == NoLimits {
			t.Errorf("%s: limits set, verdict says none", file)
		}
	}
	for _, f := range Table {
		if !seen[f.Key] && f.Key != "period_amplitude_s" {
			t.Errorf("no example shows %s", f.Key)
		}
	}
}

// Rounding as people read it: swing to 0.1 deg, lengths to 1 cm or
// 0.05 ft, times to 0.1 s, tensions to 0.1 kN; never an exponent.
func TestRowsRoundForPeople(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	r := &sway.Result{PeakSwingDeg: 2.04, PeakExcursionM: 0.4712, ResidualSwingDeg: 1.26, PeriodS: 5.8512,
		TensionMaxN: 72345, TensionMinN: 1e-7, StaticTensionN: 70607.88, TensionFactor: 1.0246, RunS: 31.27}
	want := map[string]string{"peak_swing_deg": "2.0 deg", "peak_excursion_m": "0.47 m", "period_s": "5.9 s",
		"tension_max_n": "72.3 kN", "tension_min_n": "0.0 kN", "tension_factor": "1.02 ×", "run_s": "31.3 s"}
	us := map[string]string{"peak_excursion_m": "1.55 ft", "tension_max_n": "16260 lbf"}
	for sys, w := range map[string]map[string]string{"si": want, "us": us} {
		rep := Present(s, r, units.Choice{System: sys})
		for _, row := range rep.Rows {
			if x, ok := w[row.Key]; ok && row.Text+" "+row.Unit != x {
				t.Errorf("%s %s: %q %q, want %q", sys, row.Key, row.Text, row.Unit, x)
			}
		}
	}
	// bay-travel: peak swing 3, excursion 0.5, residual 1.
	rep := Present(s, r, units.Choice{})
	if rep.Verdict.State != Outside || len(rep.Verdict.Outside) != 1 || rep.Verdict.Outside[0] != "residual_swing_deg" {
		t.Fatalf("verdict %+v", rep.Verdict)
	}
	for _, w := range []string{"swing left after stopping 1.3 deg is OUTSIDE the limit of 1.0 deg by 0.3 deg", "Do not lift as planned"} {
		if !strings.Contains(rep.Verdict.Text, w) {
			t.Errorf("verdict %q lacks %q", rep.Verdict.Text, w)
		}
	}
	for _, row := range rep.Rows {
		if row.Key == "peak_swing_deg" && row.Check.Words != "within the limit of 3.0 deg, 1.0 deg to spare" {
			t.Errorf("peak swing: %q", row.Check.Words)
		}
	}
	// Over by less than the rounding: said so, never "by 0.0".
	r.ResidualSwingDeg = 1.0001
	rep = Present(s, r, units.Choice{})
	if !strings.Contains(rep.Verdict.Text, "by less than 0.1 deg") {
		t.Errorf("verdict %q", rep.Verdict.Text)
	}
	if regexp.MustCompile(`\de[+-]\d`).MatchString(rep.Verdict.Text) {
		t.Errorf("exponent in %q", rep.Verdict.Text)
	}
}

// A scenario with no move, no wind and no swing at the start says
// nothing was simulated, never "within"; without a result, not computed.
func TestNothingSimulated(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	s.Motions = nil
	r, err := sway.Evaluate(s)
	if err != nil {
		t.Fatal(err)
	}
	rep := Present(s, r, units.Choice{})
	if rep.Verdict.State != NotSimulated || strings.Contains(rep.Verdict.Text, "within") {
		t.Fatalf("verdict %+v", rep.Verdict)
	}
	for _, row := range rep.Rows {
		if row.Check != nil {
			t.Errorf("%s checked with nothing simulated", row.Key)
		}
	}
	if rep := Present(s, nil, units.Choice{}); rep.Verdict.State != NotComputed {
		t.Fatalf("no result: %+v", rep.Verdict)
	}
	s.Limits = nil
	s.Initial = &scenario.Initial{SwingDeg: 2}
	r, _ = sway.Evaluate(s)
	if rep := Present(s, r, units.Choice{}); rep.Verdict.State != NoLimits || !strings.Contains(rep.Verdict.Text, "No crane move") {
		t.Fatalf("free swing without limits: %+v", rep.Verdict)
	}
}

// The verdict over several rope lengths is the worst of each figure, and
// says where it is: the same as holding each evaluation alone against the
// limits.
func TestPresentRopes(t *testing.T) {
	s := testscenario.Example(t, "bay-travel")
	lo, hi := 6.0, 12.0
	s.Plan = &scenario.Plan{RopeLengthMinM: &lo, RopeLengthMaxM: &hi}
	if got := RopeLengths(s); len(got) != 3 || got[0] != 8.5 || got[1] != 6 || got[2] != 12 {
		t.Fatalf("rope lengths %v", got)
	}
	// The made-up plan block is not a whole one: evaluated unvalidated.
	evals, err := EvaluateRopes(s, func(x *scenario.Scenario) (*sway.Result, error) {
		return sway.EvaluateWith(x, sway.Options{Validated: true, NoHistory: true})
	})
	if err != nil {
		t.Fatal(err)
	}
	u := units.Choice{System: "us"}
	rep := PresentRopes(s, evals, u)
	if len(rep.Verdict.RopeLengthsM) != 3 || !strings.Contains(rep.Verdict.Text, " at rope ") {
		t.Errorf("verdict %+v", rep.Verdict)
	}
	outside := map[string]bool{}
	for _, e := range evals {
		for _, k := range Present(AtRope(s, e.RopeLengthM), e.Result, u).Verdict.Outside {
			outside[k] = true
		}
	}
	if len(outside) != len(rep.Verdict.Outside) {
		t.Errorf("outside %v, any alone %v", rep.Verdict.Outside, outside)
	}
	for _, row := range rep.Rows {
		if row.Check == nil {
			continue
		}
		worst := 0.0
		for _, e := range evals {
			v, _ := mustFigure(t, row.Key).Value(e.Result)
			worst = max(worst, v)
		}
		if row.Check.WorstSI != worst || row.Check.Within != (worst <= row.Check.LimitSI) || row.Check.WorstRope == "" {
			t.Errorf("%s: %+v, worst %v", row.Key, row.Check, worst)
		}
		if strings.Contains(row.Check.Words+row.Check.WorstRope, " m") {
			t.Errorf("US words in metres: %q", row.Check.Words)
		}
	}
	// A rope length that cannot be evaluated is said, not hidden.
	bad := append([]Evaluation{}, evals...)
	bad[2] = Evaluation{RopeLengthM: 12, Err: "too long"}
	if r := PresentRopes(s, bad, u); !strings.Contains(r.Verdict.Text, "Not checked at rope 39.35 ft: too long") {
		t.Errorf("failed rope: %s", r.Verdict.Text)
	}
}

func mustFigure(t *testing.T, key string) Figure {
	f, ok := ByKey(key)
	if !ok {
		t.Fatalf("no figure %s", key)
	}
	return f
}

// The period figure names the model that gives it: for a rigid load or a
// hook block the first mode, never 2π√(L/g), which holds for a point on
// one rope only; the swing angles are of the line to the load's centre of
// mass.
func TestPeriodNamesItsModel(t *testing.T) {
	cases := map[string]string{
		"bay-girder-rigid.json":       "first mode of the rigid load",
		"precast-panel-spreader.json": "first mode of the rigid load",
		"heavy-hook-long-slings.json": "first mode of hook block and rigging",
		"bay-travel.json":             "2π√(L/g)",
	}
	for file, want := range cases {
		s := testscenario.Example(t, file)
		r, err := sway.Evaluate(s)
		if err != nil {
			t.Fatal(err)
		}
		rows := map[string]Row{}
		for _, row := range Present(s, r, units.Choice{}).Rows {
			rows[row.Key] = row
		}
		p := rows["period_s"].Technical
		if !strings.Contains(p, want) || (want != "2π√(L/g)" && strings.Contains(p, "√(L/g)")) {
			t.Errorf("%s: period_s named %q, want it to say %q", file, p, want)
		}
		sw := rows["peak_swing_deg"].Technical
		if line := strings.Contains(sw, "centre of mass"); line != (r.Body != nil || r.Rigging != nil) {
			t.Errorf("%s: peak_swing_deg named %q", file, sw)
		}
	}
}

// The legs' pull is named by what holds the load (sway.LegName): sling
// legs from the hook, a spreader's legs, two hook ropes' own rows; each
// key once in a result's rows.
func TestLegRowsNameTheLegs(t *testing.T) {
	cases := map[string]string{
		"bay-girder-rigid.json":       "largest pull in a sling leg",
		"precast-panel-spreader.json": "largest pull in a spreader leg",
		"precast-beam-tandem.json":    "largest pull in hook rope 1",
	}
	for file, want := range cases {
		s := testscenario.Example(t, file)
		r, err := sway.EvaluateWith(s, sway.Options{NoHistory: true})
		if err != nil {
			t.Fatal(err)
		}
		var crew []string
		seen := map[string]bool{}
		for _, row := range Present(s, r, units.Choice{}).Rows {
			if seen[row.Key] {
				t.Errorf("%s: %s twice", file, row.Key)
			}
			seen[row.Key] = true
			crew = append(crew, row.Crew)
		}
		all := strings.Join(crew, "; ")
		if !strings.Contains(all, want) || (r.Body.Suspension != "four legs" && r.Body.Suspension != "two legs") == strings.Contains(all, "sling leg") {
			t.Errorf("%s: rows %q, want %q", file, all, want)
		}
	}
}
