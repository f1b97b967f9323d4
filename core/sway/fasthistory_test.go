package sway

import (
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"

	"swaysheet/core/pendulum"
	"swaysheet/core/scenario"
)

// TestSamplesAsPlain: on travel (and hoist) moves without a slew the
// specialised path writes the history samples of each step in one loop
// (fastScan.emit), with the dense output and the projection written out
// and the suspension point read from the segment's spans, and without air
// the measures at each step's end have rel and relDot written out; taken
// the plain way instead (Options.kinSamples: fastSolver.dense, project,
// and kinOf and rel for every sample, rel and relDot at the step ends),
// the result is the same bits, every figure and every sample of every
// series, of the full evaluation and of the path alone (Options.PathOnly),
// on every example and reference scenario the specialised path takes with
// travel moves alone, in still air and in wind, and with a hoist or a slew
// in still air, at the default and the tight accuracy (TestAirTravelAsKin
// takes the wind further: set in at other times, ramped, blowing every
// way).
func TestSamplesAsPlain(t *testing.T) {
	still, windy, stillOther := 0, 0, 0
	for _, file := range scenarioFiles(t) {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		s, err := scenario.Parse(data)
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		su, err := build(s, false)
		if err != nil {
			t.Fatalf("%s: %v", file, err)
		}
		switch {
		case su.fast == nil:
			continue
		case su.fast.travel:
			still++
		case su.fast.airTravel:
			windy++
		case su.fast.air == nil:
			stillOther++ // hoists and slews: the step ends' measures written out
		default:
			continue
		}
		sameAsPlain(t, s, file, "default", "tight")
	}
	if still < 3 || windy < 1 || stillOther < 3 {
		t.Errorf("%d scenarios with travel moves alone in still air, %d in wind and %d with a hoist or a slew: the test checks too little", still, windy, stillOther)
	}
}

// sameAsPlain fails the test unless s evaluates to the same bits, every
// figure and every sample, with its history samples (and on travel moves
// with air the right-hand side) taken the plain way (Options.kinSamples),
// in full and the path alone, at each accuracy setting given.
func sameAsPlain(t *testing.T, s *scenario.Scenario, what string, accs ...string) {
	t.Helper()
	sameWith(t, s, what, func(o *Options) { o.kinSamples = true }, accs...)
}

// sameWith fails the test unless s evaluates to the same bits, every
// figure and every sample, with the options set changes as without, in
// full and the path alone, at each accuracy setting given.
func sameWith(t *testing.T, s *scenario.Scenario, what string, set func(*Options), accs ...string) {
	t.Helper()
	for _, acc := range accs {
		s.Settings = &scenario.Settings{Accuracy: acc}
		for _, pathOnly := range []bool{false, true} {
			direct, err := EvaluateWith(s, Options{PathOnly: pathOnly})
			if err != nil {
				t.Fatalf("%s: %v", what, err)
			}
			o := Options{PathOnly: pathOnly}
			set(&o)
			other, err := EvaluateWith(s, o)
			if err != nil {
				t.Fatalf("%s: %v", what, err)
			}
			sameResultBits(t, fmt.Sprintf("%s (%s, path only %v)", what, acc, pathOnly), direct, other)
		}
	}
}

// TestProjectedIsProject: projected, the projection written out on plain
// numbers (the specialised path's), gives pendulum.Project's bits, and
// project its constraint error, on states off the constraint by up to a
// few per cent, near it and exactly on it.
func TestProjectedIsProject(t *testing.T) {
	r := rand.New(rand.NewPCG(5, 6))
	for k := range 20000 {
		var y [6]float64
		for i := range y {
			y[i] = r.NormFloat64()
		}
		if k%3 == 0 {
			pendulum.Project(y[:]) // on the constraint
		}
		if k%3 == 1 {
			pendulum.Project(y[:]) // near it
			for i := range 3 {
				y[i] *= 1 + 1e-9*r.NormFloat64()
			}
		}
		want := y
		errWant := pendulum.Project(want[:])
		got := y
		errGot := project(&got)
		for i := range y {
			if math.Float64bits(got[i]) != math.Float64bits(want[i]) {
				t.Fatalf("state %v: component %d projected is %v, pendulum.Project %v", y, i, got[i], want[i])
			}
		}
		if math.Float64bits(errGot) != math.Float64bits(errWant) {
			t.Fatalf("state %v: constraint error %v, pendulum.Project %v", y, errGot, errWant)
		}
	}
}

// scenarioFiles are the paths of every example and reference scenario.
func scenarioFiles(t *testing.T) []string {
	var files []string
	for _, dir := range []string{"testdata/scenarios", "testdata/reference/scenarios"} {
		fs, err := filepath.Glob(filepath.Join("..", "..", dir, "*.json"))
		if err != nil {
			t.Fatal(err)
		}
		files = append(files, fs...)
	}
	return files
}

// sameSeriesBits fails the test unless every series of a and b (b taken
// the other way: the plain way through kinOf, or the stages as loops) has
// the same samples, bit for bit.
func sameSeriesBits(t *testing.T, what string, a, b *History) {
	t.Helper()
	sa, sb := a.series(), b.series()
	for k := range sa {
		if len(*sa[k]) != len(*sb[k]) || len(*sa[k]) == 0 {
			t.Fatalf("%s: series %d has %d samples, the other way %d", what, k, len(*sa[k]), len(*sb[k]))
		}
		for i, v := range *sa[k] {
			if w := (*sb[k])[i]; math.Float64bits(v) != math.Float64bits(w) {
				t.Errorf("%s: series %d sample %d is %v, the other way %v", what, k, i, v, w)
				break
			}
		}
	}
}

// TestDenseBothKeepsTheState: the dense output's state from denseBoth (the
// peak search's rates) is dense's, bit for bit, at points across every
// step of a run: the peak search reads the swing and the excursion from
// either (measureDense).
func TestDenseBothKeepsTheState(t *testing.T) {
	steps := eachStep(t, "diagonal-travel.json", func(s *fastScan) {
		v := &s.v
		for k := range 9 {
			at := v.told + float64(k)/8*(v.t-v.told)
			var a, b, bd [6]float64
			v.dense(at, &a)
			v.denseBoth(at, &b, &bd)
			for i := range a {
				if math.Float64bits(a[i]) != math.Float64bits(b[i]) {
					t.Fatalf("at %v: component %d is %v from dense, %v from denseBoth", at, i, a[i], b[i])
				}
			}
		}
	})
	if steps < 100 {
		t.Errorf("only %d steps checked", steps)
	}
}

// TestMeasureDenseAsMeasureAt: measureDense, which works out only the
// quantity the peak search refines (the swing and the excursion from the
// state alone), gives each quantity and its rate as measureAt gives them
// on the projected dense output and its rate, bit for bit, at points
// across every step of runs on travel moves alone, a slew, a hoist during
// travel and a load hanging still in a gust, with drag.
func TestMeasureDenseAsMeasureAt(t *testing.T) {
	for _, file := range []string{"diagonal-travel.json", "tower-slew.json", "hoist-during-travel.json", "wind-gust.json"} {
		steps := eachStep(t, file, func(s *fastScan) {
			v := &s.v
			for k := range 5 {
				at := v.told + float64(k)/4*(v.t-v.told)
				var y, yd [6]float64
				v.denseBoth(at, &y, &yd)
				project(&y)
				var want measure
				s.measureAt(at, &y, &yd, &want)
				for q := range qRigAngle {
					val, rate := s.measureDense(at, q)
					if math.Float64bits(val) != math.Float64bits(want.v[q]) || math.Float64bits(rate) != math.Float64bits(want.g[q]) {
						t.Fatalf("%s at %v: quantity %d is %v with rate %v, measureAt %v and %v", file, at, q, val, rate, want.v[q], want.g[q])
					}
				}
			}
		})
		if steps < 50 {
			t.Errorf("%s: only %d steps checked", file, steps)
		}
	}
}

// eachStep integrates the example scenario file on the specialised path
// (its first 60 s, without the peak search or the histories) and calls
// check after every step, with the scanner's solver at the step's end;
// it returns the number of steps.
func eachStep(t *testing.T, file string, check func(s *fastScan)) int {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "scenarios", file))
	if err != nil {
		t.Fatal(err)
	}
	sc, err := scenario.Parse(data)
	if err != nil {
		t.Fatal(err)
	}
	su, err := build(sc, false)
	if err != nil || su.fast == nil {
		t.Fatalf("%s: no specialised model: %v", file, err)
	}
	s := &fastScan{m: su.fast}
	s.v = fastSolver{m: su.fast, relTol: DefaultRelTol, absTol: DefaultRelTol * 1e-2, maxSteps: 10000}
	var y [6]float64
	copy(y[:], su.y0)
	t0, steps := 0.0, 0
	for _, cut := range restartCuts(su.breaks, 60) {
		su.fast.segment(t0, cut)
		s.v.reset(t0, &y)
		for {
			done, err := s.v.step(cut)
			if err != nil {
				t.Fatal(err)
			}
			steps++
			check(s)
			if done {
				break
			}
		}
		y, t0 = s.v.y, cut
	}
	return steps
}
