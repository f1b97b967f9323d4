package motion

import (
	"math"
	"strings"
	"testing"
)

// FuzzParseCSV: any text either gives a CSVError or a record whose every
// column builds a profile (or says why not) with finite values at its
// samples. Never a panic, never a NaN.
func FuzzParseCSV(f *testing.F) {
	for _, seed := range []string{
		"time_s,travel_x_m_per_s\n0,0\n0.5,0.2\n1,0.2\n1.5,0\n",
		"time_s,slew_deg,hoist_m\n0,0,0\n1,2,0.1\n2,4,0.3\n3,5,0.3\n",
		"# comment\ntime_s,x_m\n0,0\n1,1e300\n2,-1e300\n",
		"time_s,x_m\n0,0\n1,\n",
		"time_s,x_m\n0,0\n0,0\n",
		"time_s,\"x\"\"m\"\n0,0\n1,1\n",
		"time_s,x_m\n0,0\n1e-300,1\n2e-300,0\n",
	} {
		f.Add(seed)
	}
	f.Fuzz(func(t *testing.T, text string) {
		s, err := ParseCSV(strings.NewReader(text))
		if err != nil {
			if _, ok := err.(*CSVError); !ok {
				t.Fatalf("error of type %T: %v", err, err)
			}
			return
		}
		for _, name := range s.Names {
			p, err := s.Profile(name, 1)
			if err != nil {
				continue
			}
			for _, x := range s.TimeS {
				st := p.At(x)
				if v := st.Pos + st.Vel + st.Acc; math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("column %s at %g: %+v", name, x, st)
				}
			}
		}
	})
}
