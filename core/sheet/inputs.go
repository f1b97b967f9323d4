package sheet

import (
	"encoding/json"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"swaysheet/core/crane"
	"swaysheet/core/internal/sorts"
	"swaysheet/core/scenario"
	"swaysheet/core/units"
)

// Row is one labelled figure of the sheet.
type Row struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Label string
	Value string
	Unit  string
}

// Group is a titled list of rows.
type Group struct {
	Title string
	Rows  []Row
}

// suffixUnit is the SI unit a field name ends in, for fields the Ranges
// table does not list.
var suffixUnit = []struct{ suffix, unit string }{
	{"_m_per_s2", "m/s²"}, {"_m_per_s3", "m/s³"}, {"_m_per_s", "m/s"},
	{"_deg_per_s2", "deg/s²"}, {"_deg_per_s3", "deg/s³"}, {"_deg_per_s", "deg/s"},
	{"_kg_per_m3", "kg/m³"}, {"_m2", "m²"}, {"_kg", "kg"}, {"_deg", "deg"},
	{"_m", "m"}, {"_s", "s"}, {"_n", "N"}, {"_pct", "%"},
}

// dropIndex writes "[n]" of a path as "[]" ("motions[2].x" -> "motions[].x").
func dropIndex(p string) string {
	var b strings.Builder
	for i := 0; i < len(p); i++ {
		b.WriteByte(p[i])
		if p[i] == '[' {
			j := i + 1
			for j < len(p) && p[j] >= '0' && p[j] <= '9' {
				j++
			}
			if j < len(p) && p[j] == ']' && j > i+1 {
				i = j - 1
			}
		}
	}
	return b.String()
}

// fieldUnit gives the SI unit and the display quantity of a scenario path.
func fieldUnit(path string) (si, q string) {
	key := dropIndex(path)
	if r, ok := scenario.Ranges[key]; ok {
		si = r.Unit
	} else {
		last := path[strings.LastIndex(path, ".")+1:]
		if k := strings.IndexByte(last, '['); k >= 0 {
			last = last[:k]
		}
		for _, s := range suffixUnit {
			if strings.HasSuffix(last, s.suffix) {
				si = s.unit
				break
			}
		}
	}
	q = units.QuantityOf(si)
	if path == "wind.speed_m_per_s" {
		q = units.WindSpeed
	}
	return si, q
}

// fieldWords are the plain names of field names, where the name alone reads badly.
var fieldWords = map[string]string{
	"mass_kg": "mass", "rope_length_m": "rope length", "area_m2": "area facing the wind",
	"drag_coefficient": "air drag coefficient", "rigging_length_m": "rigging length",
	"kind": "crane", "radius_m": "radius from the slew axis", "slew_deg": "slew angle at the start", "steps": "step", "hook": "hook block", "shaper": "sway control",
	"axis": "axis", "profile": "speed profile", "start_s": "starts at",
	"distance_m": "distance", "speed_m_per_s": "speed", "accel_m_per_s2": "acceleration",
	"decel_m_per_s2": "braking", "angle_deg": "slew angle", "rate_deg_per_s": "slew rate",
	"accel_deg_per_s2": "acceleration", "decel_deg_per_s2": "braking",
	"force_n": "force", "shape_factor": "shape factor", "air_density_kg_per_m3": "air density",
	"toward_deg": "toward (from +x to +y)", "duration_s": "lasts", "ramp_s": "rises over",
	"swing_deg": "swing", "velocity_x_m_per_s": "velocity x", "velocity_y_m_per_s": "velocity y",
	"peak_swing_deg": "peak swing allowed", "peak_excursion_m": "peak excursion allowed",
	"residual_swing_deg": "residual swing allowed", "tension_factor": "tension factor allowed", "peak_tilt_deg": "peak tilt of the load allowed",
	"residual_excursion_m": "swing-out left after stopping allowed",
	"accuracy":             "accuracy", "rel_tol": "relative tolerance", "settle_periods": "settle periods",
	"samples": "samples", "top_speed_m_per_s": "top speed", "max_accel_m_per_s2": "largest acceleration",
	"top_rate_deg_per_s": "top slew rate", "max_accel_deg_per_s2": "largest acceleration",
	"rope_length_min_m": "shortest rope", "rope_length_max_m": "longest rope",
	"damping_ratio": "damping ratio", "ei_tolerance_pct": "EI tolerance", "drive": "drive",
	"pendant_steps_pct": "pendant steps", "jerk_m_per_s3": "jerk", "jerk_deg_per_s3": "jerk",
	"rounding_s": "rounding", "brake_at_s": "brakes at", "csv": "recorded speeds (CSV)",
	"column": "CSV column", "at_s": "at", "period_s": "period", "tolerance_pct": "tolerance",
}

var groupTitle = map[string]string{
	"load": "Load and rope", "crane": "Crane", "wind": "Wind", "initial": "Swing at the start",
	"limits": "Limits from the lift plan", "settings": "Computation", "plan": "Move to plan",
}

// skipped are top-level fields shown elsewhere on the sheet.
var skipped = map[string]bool{"format": true, "version": true, "name": true, "description": true,
	"example": true, "sheet": true}

// inputGroups lists every input of the scenario with its unit, in the
// display units, grouped as on the page. It walks the scenario's JSON, so
// a field added to the format is listed without a change here.
func inputGroups(s *scenario.Scenario, u units.Choice) []Group {
	raw, err := json.Marshal(s)
	if err != nil {
		return nil
	}
	var top map[string]any
	if err := json.Unmarshal(raw, &top); err != nil {
		return nil
	}
	order := []string{"load", "crane", "motions", "wind", "initial", "limits", "plan", "settings"}
	seen := map[string]bool{}
	var out []Group
	add := func(k string) {
		seen[k] = true
		v, ok := top[k]
		if !ok || skipped[k] {
			return
		}
		if k == "site" && s.Site != nil {
			out = append(out, siteGroup(s.Site, u))
			return
		}
		if k == "motions" {
			ms, _ := v.([]any)
			for i, m := range ms {
				g := Group{Title: fmt.Sprintf("Move %d", i+1)}
				flatten(&g, fmt.Sprintf("motions[%d]", i), "", m, u, s.Crane.Kind)
				capitalise(&g)
				out = append(out, g)
			}
			return
		}
		t := groupTitle[k]
		if t == "" {
			t = strings.ReplaceAll(k, "_", " ")
		}
		g := Group{Title: t}
		flatten(&g, k, "", v, u, s.Crane.Kind)
		capitalise(&g)
		if len(g.Rows) > 0 {
			out = append(out, g)
		}
	}
	for _, k := range order {
		add(k)
	}
	rest := []string{}
	for k := range top {
		if !seen[k] {
			rest = append(rest, k)
		}
	}
	sorts.Strings(rest)
	for _, k := range rest {
		add(k)
	}
	return out
}

func flatten(g *Group, path, label string, v any, u units.Choice, kind string) {
	switch x := v.(type) {
	case map[string]any:
		keys := make([]string, 0, len(x))
		for k := range x {
			keys = append(keys, k)
		}
		sorts.Strings(keys)
		// Axis and profile first, then the rest by name.
		sort.SliceStable(keys, func(i, j int) bool { return rank(keys[i]) < rank(keys[j]) })
		for _, k := range keys {
			flatten(g, path+"."+k, join(label, word(k)), x[k], u, kind)
		}
	case []any:
		if len(x) == 0 {
			return
		}
		allNum := true
		for _, e := range x {
			if _, ok := e.(float64); !ok {
				allNum = false
			}
		}
		if allNum {
			si, q := fieldUnit(path + "[0]")
			parts := make([]string, len(x))
			sym := si
			for i, e := range x {
				val := e.(float64)
				parts[i], sym = shown(q, si, val, u)
			}
			g.Rows = append(g.Rows, Row{Label: label, Value: strings.Join(parts, ", "), Unit: sym})
			return
		}
		for i, e := range x {
			// "step 2:", not "steps 2"
			flatten(g, fmt.Sprintf("%s[%d]", path, i), join(label, strconv.Itoa(i+1)+":"), e, u, kind)
		}
	case float64:
		si, q := fieldUnit(path)
		text, sym := shown(q, si, x, u)
		g.Rows = append(g.Rows, Row{Label: label, Value: text, Unit: sym})
	case string:
		if strings.HasSuffix(path, ".csv") {
			n := strings.Count(strings.TrimSpace(x), "\n") + 1
			g.Rows = append(g.Rows, Row{Label: label, Value: fmt.Sprintf("%d lines (in the scenario file and the QR code)", n)})
			return
		}
		if _, ok := crane.Of(x); ok && strings.HasSuffix(path, ".axis") {
			x = crane.WordsFor(kind, x)
		}
		if w, ok := crane.KindWords[x]; ok && path == "crane.kind" {
			x = w
		}
		if r := []rune(x); len(r) > 80 {
			x = string(r[:79]) + "…"
		}
		g.Rows = append(g.Rows, Row{Label: label, Value: x})
	case bool:
		g.Rows = append(g.Rows, Row{Label: label, Value: map[bool]string{true: "yes", false: "no"}[x]})
	}
}

func rank(k string) int {
	switch k {
	case "axis":
		return 0
	case "profile":
		return 1
	case "kind":
		return 2
	}
	return 3
}

func word(k string) string {
	if w, ok := fieldWords[k]; ok {
		return w
	}
	return strings.ReplaceAll(k, "_", " ")
}

func join(a, b string) string {
	if a == "" {
		return b
	}
	return a + " " + b
}

// shown is an input value v (SI unit si, display quantity q) in the
// display units of u, rounded as the figures are (units.Round: the
// unit's step), and its unit symbol; a value of no quantity with four
// significant digits. Never in scientific notation.
func shown(q, si string, v float64, u units.Choice) (string, string) {
	if q == "" {
		return Num(v, 4), si
	}
	x, sym := u.Show(q, v)
	un := u.Unit(q)
	if q == "share" && sym == "" {
		sym = "%"
	}
	_, t := units.Round(x, un)
	if t == "0" || strings.Trim(t, "0.-") == "" && x != 0 {
		// a value finer than the unit's step: four significant digits
		t = Num(x, 4)
	}
	return t, sym
}

// Num formats v with at most sig significant digits, without an exponent
// for everyday sizes and without trailing zeros.
func Num(v float64, sig int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	if v == 0 {
		return "0"
	}
	r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', sig, 64), 64)
	return strconv.FormatFloat(r, 'f', -1, 64)
}

// capitalise starts each row's label with a capital letter.
func capitalise(g *Group) {
	for i, r := range g.Rows {
		if r.Label != "" {
			rs := []rune(r.Label)
			g.Rows[i].Label = strings.ToUpper(string(rs[0])) + string(rs[1:])
		}
	}
}
