package plan

import (
	"fmt"
	"strconv"
	"strings"

	"swaysheet/core/units"
)

// Sentence is one sentence the planner writes, with its quantities marked
// so that a page or sheet can show them in the units it shows. Text holds
// the placeholders {0}, {1}, ... where Quantities[0], [1], ... go; String
// fills them in SI (with m/min beside m/s and rpm beside deg/s), which is
// the plain text the plan's string fields (settings, reason, notes,
// infeasible) carry.
type Sentence struct {
	Text       string     `json:"text"`
	Quantities []Quantity `json:"quantities"`
}

// Quantity is one marked number: Value in the SI unit of its Quantity (the
// first unit of core/units.Table[Quantity]: m, s, m/s, m/s², and deg,
// deg/s, deg/s² for angles, as scenarios carry them), shown with Digits
// significant digits.
type Quantity struct {
	_ [0]func() // not comparable, so Go writes no equality function for it (page wasm size)

	Value    float64 `json:"value"`
	Quantity string  `json:"quantity"`
	Digits   int     `json:"digits"`
	short    bool    // plain text without the second unit in brackets
}

// say builds a sentence whose placeholders {i} stand for qs[i].
//
// say, the quantity constructors below, digits, speedQ and Option's add
// and found are not inlined: they build words once a plan, at some 250
// call sites, and every inlined copy costs the page's wasm (7.5 kB
// gzipped in all); the planner's arithmetic keeps
// inlining (web/dist NoInline says why the rest of the package does).
//
//go:noinline
func say(text string, qs ...Quantity) Sentence {
	if qs == nil {
		qs = []Quantity{}
	}
	return Sentence{Text: text, Quantities: qs}
}

// Quantity constructors, SI in (angles in degrees).

//go:noinline
func qLen(v float64) Quantity { return Quantity{Value: v, Quantity: "length", Digits: 3} }

//go:noinline
func qTime(v float64) Quantity { return Quantity{Value: v, Quantity: "time", Digits: 3} }

//go:noinline
func qAngle(v float64) Quantity { return Quantity{Value: v, Quantity: "angle", Digits: 2} }

//go:noinline
func qSpeed(v float64) Quantity { return Quantity{Value: v, Quantity: "speed", Digits: 3} }

//go:noinline
func qRate(v float64) Quantity { return Quantity{Value: v, Quantity: "angular_speed", Digits: 3} }

// digits returns q with d significant digits.
//
//go:noinline
func (q Quantity) digits(d int) Quantity { q.Digits = d; return q }

// String is the quantity in SI with its unit symbol.
func (q Quantity) String() string {
	num := func(v float64) string { return strconv.FormatFloat(v, 'g', q.Digits, 64) }
	si := units.Table[q.Quantity].Units[0].Symbol
	s := num(q.Value) + " " + si
	if q.short {
		return s
	}
	switch q.Quantity {
	case "speed":
		mpm, _ := units.FromSI("speed", "m/min", q.Value)
		s += " (" + num(mpm) + " m/min)"
	case "angular_speed":
		rpm, _ := units.FromSI("angular_speed", "rpm", q.Value)
		s += " (" + num(rpm) + " rpm)"
	case "ratio":
		s = num(q.Value)
	}
	return s
}

// String fills the placeholders in SI: each {i} with i below the number
// of quantities is replaced by Quantities[i] (a placeholder past them is
// kept as it is), in one pass over the text (a plan writes some hundred
// sentences; a replacement pass per quantity costs several times more).
func (s Sentence) String() string {
	text := s.Text
	if len(s.Quantities) == 0 || !strings.Contains(text, "{") {
		return text
	}
	var b strings.Builder
	b.Grow(len(text) + 16*len(s.Quantities))
	for {
		open := strings.IndexByte(text, '{')
		if open < 0 {
			break
		}
		end := open + 1
		for end < len(text) && text[end] >= '0' && text[end] <= '9' {
			end++
		}
		i, err := strconv.Atoi(text[open+1 : end])
		lead0 := end > open+2 && text[open+1] == '0' // "{01}" is no placeholder
		if end == open+1 || lead0 || end >= len(text) || text[end] != '}' || err != nil || i >= len(s.Quantities) {
			b.WriteString(text[:open+1])
			text = text[open+1:]
			continue
		}
		b.WriteString(text[:open])
		b.WriteString(s.Quantities[i].String())
		text = text[end+1:]
	}
	b.WriteString(text)
	return b.String()
}

// join appends t to s, a space between, renumbering t's placeholders.
func (s Sentence) join(t Sentence) Sentence {
	return Sentence{Text: s.Text + " {join}", Quantities: s.Quantities}.with("{join}", t)
}

// with puts t in the place of mark in s, renumbering t's placeholders
// after s's.
func (s Sentence) with(mark string, t Sentence) Sentence {
	text := t.Text
	for i := len(t.Quantities) - 1; i >= 0; i-- {
		text = strings.ReplaceAll(text, fmt.Sprintf("{%d}", i), fmt.Sprintf("{%d}", i+len(s.Quantities)))
	}
	return Sentence{Text: strings.Replace(s.Text, mark, text, 1), Quantities: append(append([]Quantity{}, s.Quantities...), t.Quantities...)}
}

// list is the sentences one after the other, sep between.
func list(ss []Sentence, sep string) Sentence {
	out := say("")
	for i, t := range ss {
		if i > 0 {
			out.Text += sep
		}
		out = Sentence{Text: out.Text + "{next}", Quantities: out.Quantities}.with("{next}", t)
	}
	return out
}

// texts is the plain text of sentences.
func texts(ss []Sentence) []string {
	out := make([]string, len(ss))
	for i, s := range ss {
		out[i] = s.String()
	}
	return out
}

// plain wraps text without quantities (sentences carrying no numbers, or
// numbers that are not measures: percentages, counts).
// Braces become parentheses, so that nothing reads as a placeholder.
func plain(text string) Sentence {
	return say(strings.NewReplacer("{", "(", "}", ")").Replace(text))
}

// outside says which limit o breaks: Outside's plain SI text and its
// marked sentence.
func (o *Option) outside(s Sentence) {
	o.Outside = append(o.Outside, s.String())
	o.OutsideSentences = append(o.OutsideSentences, s)
}
