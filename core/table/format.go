package table

import (
	"fmt"
	"strconv"
)

var markNames = [...]string{NoMark: "none", MarkPoint: "point", MarkComma: "comma", MarkSpace: "space",
	MarkQuote: "apostrophe", MarkNone: "none"}

// String names a mark as the options and the JSON do: point, comma, space,
// apostrophe, or none.
func (m Mark) String() string { return markNames[m] }

// ParseDecimal maps "auto" (or ""), "point" and "comma" to a decimal mark,
// NoMark standing for auto.
func ParseDecimal(s string) (Mark, bool) {
	switch s {
	case "", "auto":
		return NoMark, true
	case "point":
		return MarkPoint, true
	case "comma":
		return MarkComma, true
	}
	return 0, false
}

// ParseThousands maps "auto" (or ""), "none", "comma", "point", "space" and
// "apostrophe" to a thousands separator, NoMark standing for auto and
// MarkNone for none.
func ParseThousands(s string) (Mark, bool) {
	switch s {
	case "", "auto":
		return NoMark, true
	case "none":
		return MarkNone, true
	}
	for m := MarkPoint; m <= MarkQuote; m++ {
		if s == markNames[m] {
			return m, true
		}
	}
	return 0, false
}

// describe names a mark in a sentence: "a comma", "a space".
func (m Mark) describe() string {
	if m == MarkQuote {
		return "an apostrophe"
	}
	return "a " + m.String()
}

// sighting is the first cell seen written in one form, and how many were.
type sighting struct {
	count        int
	line, column int
	group, text  string
}

// where names the sighting's cell: `"52,300" (line 3, column 2)`.
func (s sighting) where() string {
	return fmt.Sprintf("%s (line %d, column %d)", strconv.Quote(s.text), s.line, s.column)
}

// numberReading gathers how the values of one reading wrote their numbers
// and decides, on all of them together, the decimal mark and the thousands
// separator, and so what each ambiguous cell ("52,300") means. The values
// of ambiguous cells are held as whole numbers until then.
type numberReading struct {
	decimal, thousands Mark // chosen; NoMark to detect
	// presumed is the decimal mark an ambiguous cell is read with when the
	// other cells leave it open (see decide)
	presumed    Mark
	decimals    [MarkNone]sighting
	groups      [MarkNone]sighting
	ambiguous   [MarkNone]sighting
	ambiguousAt [MarkNone][]valueRun // where their values are in Table.Values
	ungrouped   sighting
}

// valueRun is a cell's value added n times (a row with a count) from index at.
type valueRun struct{ at, n int32 }

// note records the form of a value about to be added to t n times, at the
// given place; only a written mark or a long whole part costs anything.
func (nr *numberReading) note(t *Table, f form, n int, line, column int, group string, text []byte) {
	if f == (form{}) {
		return
	}
	see := func(s *sighting) {
		if s.count == 0 {
			*s = sighting{line: line, column: column, group: group, text: quoteFound(text)}
		}
		s.count++
	}
	if f.decimal != NoMark {
		see(&nr.decimals[f.decimal])
	}
	if f.thousands != NoMark {
		see(&nr.groups[f.thousands])
	}
	if f.ambiguous != NoMark {
		see(&nr.ambiguous[f.ambiguous])
		nr.ambiguousAt[f.ambiguous] = append(nr.ambiguousAt[f.ambiguous], valueRun{int32(len(t.Values)), int32(n)})
	}
	if f.ungrouped {
		see(&nr.ungrouped)
	}
}

// decide settles the decimal mark and the thousands separator of t's
// values, rereads the ambiguous cells accordingly, and says in t how the
// numbers were read. The rules, on every value read:
//
//   - a cell's own marks are definite: "3,5" has a decimal comma,
//     "1,234,567" and "1,234.5" a comma between thousands, "52 300" a space;
//   - two thousands separators, or one mark used both between thousands and
//     as a decimal mark, or a cell that contradicts a chosen mark, is an
//     error naming the cells;
//   - an ambiguous cell ("52,300", "1.250") follows the definite cells; when
//     they leave both readings open, its mark is read as the presumed decimal
//     mark (the comma in semicolon-separated text, whose separator is the one
//     spreadsheets use where the decimal mark is a comma; the point
//     otherwise), and the other mark as a thousands separator unless a whole
//     part of four digits or more is written without one (the text does not
//     group thousands). The other reading is then named in t.OtherNumbers.
func (nr *numberReading) decide(t *Table) error {
	var problems Problems
	conflict := func(s sighting, reason, fix string) {
		problems = append(problems, &Error{Line: s.line, Column: s.column, Group: s.group, Found: s.text, Reason: reason, Fix: fix})
	}
	// the thousands separator
	chosen, th := nr.thousands, nr.thousands
	for m := MarkPoint; m <= MarkQuote; m++ {
		s := nr.groups[m]
		switch {
		case s.count == 0 || chosen == m:
		case chosen == MarkNone:
			conflict(s, fmt.Sprintf("%q has %s between thousands, but no thousands separator is chosen", s.text, m.describe()),
				"choose the thousands separator "+m.String()+", or remove the separators from the cells")
		case chosen != NoMark:
			conflict(s, fmt.Sprintf("%q has %s between thousands, but the thousands separator chosen is %s", s.text, m.describe(), chosen.describe()),
				"choose the thousands separator "+m.String()+", or correct the cells")
		case th != NoMark:
			conflict(s, fmt.Sprintf("%q has %s between thousands, but %s has %s", s.text, m.describe(), nr.groups[th].where(), th.describe()),
				"write the numbers one way, or choose the thousands separator")
		default:
			th = m
		}
	}
	// the decimal mark
	dec := nr.decimal
	for _, m := range []Mark{MarkPoint, MarkComma} {
		s := nr.decimals[m]
		switch {
		case s.count == 0:
		case dec != NoMark && dec != m:
			conflict(s, fmt.Sprintf("%q is written with a decimal %s, but the decimal mark chosen is the %s", s.text, m, dec),
				"choose the decimal mark "+m.String()+", or correct the cells")
		case th == m:
			conflict(s, fmt.Sprintf("%q has a decimal %s, but %s has %s between thousands", s.text, m, nr.groups[m].where(), m.describe()),
				"write the numbers one way, or choose the decimal mark and the thousands separator")
		}
	}
	if len(problems) > 0 {
		return problems
	}
	if dec == NoMark {
		switch {
		case th == MarkComma:
			dec = MarkPoint
		case th == MarkPoint:
			dec = MarkComma
		case nr.decimals[MarkPoint].count > 0 && nr.decimals[MarkComma].count == 0:
			dec = MarkPoint
		case nr.decimals[MarkComma].count > 0 && nr.decimals[MarkPoint].count == 0:
			dec = MarkComma
		}
	}
	usedComma := nr.decimals[MarkComma].count > 0
	for _, m := range []Mark{MarkComma, MarkPoint} {
		s := nr.ambiguous[m]
		if s.count == 0 {
			continue
		}
		asDecimal := (dec == NoMark || dec == m) && th != m
		asThousands := (th == NoMark || th == m) && dec != m && nr.decimals[m].count == 0
		whole, _ := strconv.ParseFloat(string(digitsOf(s.text)), 64)
		switch {
		case asDecimal && asThousands:
			asThousands = m != nr.presumed && nr.ungrouped.count == 0
			asDecimal = !asThousands
			if asThousands {
				t.OtherNumbers = fmt.Sprintf("%s%s read with %s between thousands (%s), but the %s may be a decimal %s (%s): if so, choose the decimal mark %s",
					s.where(), more(s.count-1), m.describe(), strconv.FormatFloat(whole, 'f', -1, 64), m, m, strconv.FormatFloat(whole/1000, 'f', -1, 64), m)
			} else {
				t.OtherNumbers = fmt.Sprintf("%s%s read with a decimal %s (%s), but the %s may separate thousands (%s): if so, choose the thousands separator %s",
					s.where(), more(s.count-1), m, strconv.FormatFloat(whole/1000, 'f', -1, 64), m, strconv.FormatFloat(whole, 'f', -1, 64), m)
			}
		case !asDecimal && !asThousands:
			conflict(s, fmt.Sprintf("%q can be read neither with a decimal %s nor with %s between thousands, given how the other cells are written", s.text, m, m.describe()),
				"write the numbers one way, or choose the decimal mark and the thousands separator")
			continue
		}
		if asDecimal {
			dec = m
			usedComma = usedComma || m == MarkComma
			for _, run := range nr.ambiguousAt[m] {
				for i := run.at; i < run.at+run.n; i++ {
					t.Values[i] /= 1000 // exactly as the cell's digits over 10³ (see parseCell)
				}
			}
		} else {
			th = m
		}
	}
	if len(problems) > 0 {
		return problems
	}
	t.DecimalComma = usedComma
	if th != MarkNone && (nr.groups[th].count > 0 || nr.ambiguous[th].count > 0) {
		t.Thousands = th
	}
	return nil
}

// more counts the cells written like the one named, with the verb that
// follows: " and 3 more cells like it were", or " was" when there are none.
func more(n int) string {
	switch n {
	case 0:
		return " was"
	case 1:
		return " and 1 more cell like it were"
	}
	return fmt.Sprintf(" and %d more cells like it were", n)
}

// digitsOf is a cell's digits and sign without its marks: the whole
// number an ambiguous cell was first read as.
func digitsOf(text string) []byte {
	var b []byte
	for _, c := range []byte(text) {
		if c >= '0' && c <= '9' || c == '-' {
			b = append(b, c)
		}
	}
	return b
}
