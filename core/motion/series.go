package motion

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"

	"swaysheet/core/internal/sorts"
)

// A time series of one or more axes, as recorded from a drive or planned in
// a spreadsheet, is read from CSV:
//
//	time_s,travel_x_m_per_s,slew_deg
//	0,0,0
//	0.5,0.1,0.2
//	...
//
// The first row names the columns; the first column is time_s, in seconds,
// strictly increasing. Every other column is one axis, in the axis' file
// unit: a name ending in "_per_s" holds speeds, any other name positions.
// Lines starting with # are comments; blank lines are skipped.
//
// Interpolation (stated here and in DEVELOPERS.md):
//
//   - speed columns: the speed is linear in time between samples, so the
//     acceleration is constant on each interval and the position is its
//     exact integral, zero at the first sample. Before the first sample the
//     axis moves steadily at the first speed (a record may start in motion:
//     the load hangs still relative to the crane there); the last speed
//     must be zero, so the record ends at rest.
//   - position columns: a clamped cubic spline through the samples with
//     zero speed at the first and last sample (the record starts and ends
//     at rest), so position, speed and acceleration are continuous inside
//     the record. Positions are taken relative to the first sample.
//
// A step between samples longer than MaxGapS, or longer than GapFactor
// times the median step, is a gap and an error: the record is missing data
// there and no interpolation can stand in for it.
const (
	MaxGapS   = 5.0
	GapFactor = 20.0
	// MaxSeriesRows bounds the size of one record.
	MaxSeriesRows = 200_000
	// MaxSeriesValue bounds every value (time, position or speed) in size.
	MaxSeriesValue = 1e6
	// MinStepS is the shortest accepted time step between samples.
	MinStepS = 1e-6
)

// CSVError is a problem with one place in a CSV record. Line counts from 1
// as an editor shows it; Column is the column's name (or its number when
// the header itself is at fault).
type CSVError struct {
	Line    int
	Column  string
	Message string
}

func (e *CSVError) Error() string {
	if e.Column == "" {
		return fmt.Sprintf("line %d: %s", e.Line, e.Message)
	}
	return fmt.Sprintf("line %d, column %s: %s", e.Line, e.Column, e.Message)
}

// Series is a parsed record: sample times and the named columns.
type Series struct {
	TimeS   []float64
	Names   []string    // column names after time_s, in file order
	Columns [][]float64 // one per name, same length as TimeS
	lines   []int       // file line of each sample
}

// IsSpeed reports whether a column name holds speeds.
func IsSpeed(name string) bool { return strings.HasSuffix(name, "_per_s") }

// ParseCSV reads a record. It reports the first problem found, naming its
// line and column.
func ParseCSV(r io.Reader) (*Series, error) {
	cr := csv.NewReader(r)
	cr.Comment = '#'
	cr.FieldsPerRecord = -1
	cr.TrimLeadingSpace = true
	s := &Series{}
	header := true
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			var pe *csv.ParseError
			if errors.As(err, &pe) {
				return nil, &CSVError{Line: pe.Line, Message: pe.Err.Error()}
			}
			return nil, err
		}
		line, _ := cr.FieldPos(0)
		if header {
			header = false
			if err := s.readHeader(rec, line); err != nil {
				return nil, err
			}
			continue
		}
		if len(rec) != len(s.Names)+1 {
			return nil, &CSVError{Line: line, Message: fmt.Sprintf("has %d values: the header names %d columns", len(rec), len(s.Names)+1)}
		}
		if len(s.TimeS) >= MaxSeriesRows {
			return nil, &CSVError{Line: line, Message: fmt.Sprintf("the record has more than %d samples", MaxSeriesRows)}
		}
		for j, cell := range rec {
			name := "time_s"
			if j > 0 {
				name = s.Names[j-1]
			}
			cell = strings.TrimSpace(cell)
			if cell == "" {
				return nil, &CSVError{Line: line, Column: name, Message: "the value is missing: every sample needs every column"}
			}
			v, err := strconv.ParseFloat(cell, 64)
			if !decimal(cell) || err != nil && !errors.Is(err, strconv.ErrRange) || math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, &CSVError{Line: line, Column: name, Message: fmt.Sprintf(
					"%q is not a number: write it in decimal, like 0.25 or 2.5e-1", cell)}
			}
			if math.Abs(v) > MaxSeriesValue {
				return nil, &CSVError{Line: line, Column: name, Message: fmt.Sprintf("%s is too large: accepted from %g to %g", cell, -MaxSeriesValue, MaxSeriesValue)}
			}
			if j == 0 {
				if n := len(s.TimeS); n > 0 && v <= s.TimeS[n-1] {
					return nil, &CSVError{Line: line, Column: name, Message: fmt.Sprintf(
						"time %g s does not come after %g s on line %d: times must increase", v, s.TimeS[n-1], s.lines[n-1])}
				}
				if n := len(s.TimeS); n > 0 && v-s.TimeS[n-1] < MinStepS {
					return nil, &CSVError{Line: line, Column: name, Message: fmt.Sprintf(
						"time %g s is only %.3g s after line %d: samples closer than %g s are not accepted", v, v-s.TimeS[n-1], s.lines[n-1], MinStepS)}
				}
				s.TimeS = append(s.TimeS, v)
				s.lines = append(s.lines, line)
			} else {
				s.Columns[j-1] = append(s.Columns[j-1], v)
			}
		}
	}
	if header {
		return nil, &CSVError{Line: 1, Message: "the record is empty: it needs a header row and at least two samples"}
	}
	if len(s.TimeS) < 2 {
		return nil, &CSVError{Line: 1, Message: fmt.Sprintf("the record has %d samples: at least 2 are needed", len(s.TimeS))}
	}
	if err := s.checkGaps(); err != nil {
		return nil, err
	}
	return s, nil
}

// decimal reports whether text is a plain decimal number: an optional
// sign, digits with an optional decimal point (at least one digit), and an
// optional exponent e or E with an optional sign and digits. Go's
// strconv.ParseFloat also reads hexadecimal (0x1p-2), underscores between
// digits (1_0) and inf or nan, which no spreadsheet or drive log writes;
// they are errors here.
func decimal(text string) bool {
	i, n := 0, len(text)
	if i < n && (text[i] == '+' || text[i] == '-') {
		i++
	}
	digits := 0
	for ; i < n && text[i] >= '0' && text[i] <= '9'; i++ {
		digits++
	}
	if i < n && text[i] == '.' {
		for i++; i < n && text[i] >= '0' && text[i] <= '9'; i++ {
			digits++
		}
	}
	if digits == 0 {
		return false
	}
	if i < n && (text[i] == 'e' || text[i] == 'E') {
		i++
		if i < n && (text[i] == '+' || text[i] == '-') {
			i++
		}
		exp := 0
		for ; i < n && text[i] >= '0' && text[i] <= '9'; i++ {
			exp++
		}
		if exp == 0 {
			return false
		}
	}
	return i == n
}

// LineAt is the file line of the last sample at or before time t (the
// first sample's line for earlier times).
func (s *Series) LineAt(t float64) int {
	i := sort.SearchFloat64s(s.TimeS, t)
	if i < len(s.TimeS) && s.TimeS[i] == t {
		return s.lines[i]
	}
	return s.lines[max(i-1, 0)]
}

func (s *Series) readHeader(rec []string, line int) error {
	if len(rec) < 2 {
		return &CSVError{Line: line, Message: "the header needs time_s and at least one axis column"}
	}
	if strings.TrimSpace(rec[0]) != "time_s" {
		return &CSVError{Line: line, Column: "1", Message: fmt.Sprintf("is %q: the first column must be time_s", rec[0])}
	}
	seen := map[string]bool{}
	for j, n := range rec[1:] {
		n = strings.TrimSpace(n)
		if n == "" {
			return &CSVError{Line: line, Column: strconv.Itoa(j + 2), Message: "the column has no name"}
		}
		if seen[n] {
			return &CSVError{Line: line, Column: n, Message: "the column is named twice"}
		}
		seen[n] = true
		s.Names = append(s.Names, n)
	}
	s.Columns = make([][]float64, len(s.Names))
	return nil
}

func (s *Series) checkGaps() error {
	n := len(s.TimeS)
	steps := make([]float64, n-1)
	for i := range steps {
		steps[i] = s.TimeS[i+1] - s.TimeS[i]
	}
	sorted := append([]float64(nil), steps...)
	sorts.Floats(sorted)
	median := sorted[len(sorted)/2]
	limit := math.Min(MaxGapS, GapFactor*median)
	for i, d := range steps {
		if d > limit {
			return &CSVError{Line: s.lines[i+1], Column: "time_s", Message: fmt.Sprintf(
				"a gap of %.4g s after %g s (line %d): steps longer than %.4g s (%g s, or %g times the median step of %.4g s) are missing data",
				d, s.TimeS[i], s.lines[i], limit, MaxGapS, GapFactor, median)}
		}
	}
	return nil
}

// Column returns the values of the named column, or false.
func (s *Series) Column(name string) ([]float64, bool) {
	for i, n := range s.Names {
		if n == name {
			return s.Columns[i], true
		}
	}
	return nil, false
}

// Profile builds the profile of one column, with values multiplied by
// scale (the file unit in the axis' SI unit: 1 for metres, pi/180 for
// degrees). The interpolation is the one stated above.
func (s *Series) Profile(name string, scale float64) (*Piecewise, error) {
	col, ok := s.Column(name)
	if !ok {
		return nil, &CSVError{Line: 1, Column: name, Message: fmt.Sprintf("no such column: the record has %q", s.Names)}
	}
	vals := make([]float64, len(col))
	for i, v := range col {
		vals[i] = v * scale
	}
	if IsSpeed(name) {
		if last := len(vals) - 1; vals[last] != 0 {
			return nil, &CSVError{Line: s.lines[last], Column: name, Message: fmt.Sprintf(
				"the last speed is %g: the record must end at rest (speed 0)", col[last])}
		}
		return speedProfile(s.TimeS, vals), nil
	}
	return splineProfile(s.TimeS, vals), nil
}

// speedProfile integrates a piecewise linear speed exactly.
func speedProfile(t, v []float64) *Piecewise {
	b := newBuilder(t[0], 0, v[0])
	for i := 0; i+1 < len(t); i++ {
		d := t[i+1] - t[i]
		b.span(d, (v[i+1]-v[i])/d, 0)
		b.v = v[i+1] // exact at the samples
	}
	return b.rest()
}

// splineProfile is the clamped cubic spline through (t, x - x0) with zero
// end slopes. The second derivatives M solve the tridiagonal system
//
//	h[i-1] M[i-1] + 2 (h[i-1]+h[i]) M[i] + h[i] M[i+1] = 6 (d[i] - d[i-1])
//
// with d[i] the slope of interval i and end rows 2 h0 M0 + h0 M1 = 6 d0,
// h M[n-1] + 2 h M[n] = -6 d[n-1] (any numerical analysis text, e.g.
// Burden & Faires, Numerical Analysis, clamped cubic spline).
func splineProfile(t, x []float64) *Piecewise {
	n := len(t) - 1
	h := make([]float64, n)
	d := make([]float64, n)
	for i := 0; i < n; i++ {
		h[i] = t[i+1] - t[i]
		d[i] = (x[i+1] - x[i]) / h[i]
	}
	// Thomas algorithm on rows 0..n.
	diag := make([]float64, n+1)
	upper := make([]float64, n+1)
	lower := make([]float64, n+1)
	rhs := make([]float64, n+1)
	diag[0], upper[0], rhs[0] = 2*h[0], h[0], 6*d[0]
	for i := 1; i < n; i++ {
		lower[i], diag[i], upper[i] = h[i-1], 2*(h[i-1]+h[i]), h[i]
		rhs[i] = 6 * (d[i] - d[i-1])
	}
	lower[n], diag[n], rhs[n] = h[n-1], 2*h[n-1], -6*d[n-1]
	for i := 1; i <= n; i++ {
		w := lower[i] / diag[i-1]
		diag[i] -= w * upper[i-1]
		rhs[i] -= w * rhs[i-1]
	}
	m := make([]float64, n+1)
	m[n] = rhs[n] / diag[n]
	for i := n - 1; i >= 0; i-- {
		m[i] = (rhs[i] - upper[i]*m[i+1]) / diag[i]
	}
	b := newBuilder(t[0], 0, 0)
	for i := 0; i < n; i++ {
		b.p = x[i] - x[0] // exact at the samples
		b.v = d[i] - h[i]*(2*m[i]+m[i+1])/6
		b.span(h[i], m[i], (m[i+1]-m[i])/h[i])
	}
	b.p = x[n] - x[0]
	b.v = 0
	return b.rest()
}

// WriteCSV writes a record in the format ParseCSV reads, with values in
// full precision.
func WriteCSV(w io.Writer, s *Series) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(append([]string{"time_s"}, s.Names...)); err != nil {
		return err
	}
	row := make([]string, len(s.Names)+1)
	for i, t := range s.TimeS {
		row[0] = strconv.FormatFloat(t, 'g', -1, 64)
		for j := range s.Names {
			row[j+1] = strconv.FormatFloat(s.Columns[j][i], 'g', -1, 64)
		}
		if err := cw.Write(row); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// Sample records profiles at the given times into a Series, each column
// divided by its scale (the inverse of Profile). speed selects the speed
// rather than the position for a column whose name says so.
func Sample(times []float64, names []string, profiles []Profile, scales []float64) *Series {
	s := &Series{TimeS: append([]float64(nil), times...), Names: append([]string(nil), names...)}
	s.Columns = make([][]float64, len(names))
	for j, p := range profiles {
		col := make([]float64, len(times))
		for i, t := range times {
			st := p.At(t)
			v := st.Pos
			if IsSpeed(names[j]) {
				v = st.Vel
			}
			col[i] = v / scales[j]
		}
		s.Columns[j] = col
	}
	s.lines = make([]int, len(times))
	for i := range s.lines {
		s.lines[i] = i + 2
	}
	return s
}
