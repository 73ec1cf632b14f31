package table

import (
	"bytes"
	"fmt"
	"strconv"
	"unicode"
	"unicode/utf8"
)

// maxUnit is the longest unit read, in bytes ("minutes", "€/h", "kg/m²").
const maxUnit = 16

// splitUnit reads a cell written as a number with a unit after it ("12 min",
// "35 %", "40€") or a currency sign before it ("€ 40", "$1,200"): the
// number's value and form, and the unit, trimmed. The unit is the part after
// the last digit or before the first digit, sign or point; it holds no
// digit, is at most maxUnit bytes, and stands on one side only; a unit
// before the number holds no letter, so that labels such as "Ward 3" stay
// labels.
func splitUnit(s []byte) (v float64, f form, unit string, ok bool) {
	end := len(s)
	for end > 0 && !isDigit(s[end-1]) {
		end--
	}
	start := 0
	for start < end && !isDigit(s[start]) && s[start] != '+' && s[start] != '-' && s[start] != '.' {
		start++
	}
	prefix, suffix := bytes.TrimSpace(s[:start]), bytes.TrimSpace(s[end:])
	if (len(prefix) > 0) == (len(suffix) > 0) || end == 0 {
		return 0, form{}, "", false
	}
	u := prefix
	if len(suffix) > 0 {
		u = suffix
	}
	if len(u) > maxUnit || !utf8.Valid(u) || !bytes.ContainsFunc(u, unitLike) || len(prefix) > 0 && bytes.ContainsFunc(prefix, isLetter) {
		return 0, form{}, "", false
	}
	v, kind, f := parseCell(bytes.TrimSpace(s[start:end]))
	if kind != cellNumber {
		return 0, form{}, "", false
	}
	return v, f, string(u), true
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func isLetter(r rune) bool { return r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' }

// unitLike reports whether a unit may hold r: a unit holds a letter, a
// currency sign or a percent, per mille or degree sign, so that "75+" or
// "12*" stay text.
func unitLike(r rune) bool {
	return unicode.IsLetter(r) || unicode.Is(unicode.Sc, r) || r == '%' || r == '‰' || r == '°'
}

// unitReading gathers the units written beside the values of one reading.
// One unit shared by at least half of the values is taken off them and
// named; two units, or a unit on fewer than half of the values (a typo
// rather than the column's unit), are errors naming the cells.
type unitReading struct {
	unit   string
	first  sighting // the first cell with the unit
	other  sighting // the first cell with another unit
	count  int      // values written with the unit
	values int      // values read
}

// parseValue reads a value cell: a number (see parseCell), or a number
// with a unit, whose unit it returns.
func parseValue(s []byte) (v float64, kind cellKind, f form, unit string) {
	v, kind, f = parseCell(s)
	if kind == cellText {
		if uv, uf, u, ok := splitUnit(s); ok {
			return uv, cellNumber, uf, u
		}
	}
	return v, kind, f, ""
}

// note records a value read n times (a row with a count) with unit u ("" for none).
func (ur *unitReading) note(u string, n int, line, column int, group string, text []byte) {
	ur.values += n
	if u == "" {
		return
	}
	s := sighting{count: 1, line: line, column: column, group: group, text: quoteFound(text)}
	switch {
	case ur.unit == "":
		ur.unit, ur.first, ur.count = u, s, n
	case u == ur.unit:
		ur.count += n
	case ur.other.count == 0:
		ur.other = s
	}
}

// decide names the unit in t, or gives the error.
func (ur *unitReading) decide(t *Table) *Error {
	switch {
	case ur.unit == "":
		return nil
	case ur.other.count > 0:
		o := ur.other
		return &Error{Line: o.line, Column: o.column, Group: o.group, Found: o.text,
			Reason: fmt.Sprintf("%q is in %s, but %s is in %s", o.text, strconv.Quote(unitOf(o.text)), ur.first.where(), strconv.Quote(ur.unit)),
			Fix:    "write every value in one unit (convert the others), or leave the units out"}
	case 2*ur.count < ur.values:
		f := ur.first
		return &Error{Line: f.line, Column: f.column, Group: f.group, Found: f.text,
			Reason: fmt.Sprintf("%q has the unit %s, which %d of the %d values lack", f.text, strconv.Quote(ur.unit), ur.values-ur.count, ur.values),
			Fix:    "correct the cell: write the number alone"}
	}
	t.Unit, t.UnitCells = ur.unit, ur.count
	if t.Measure == "" {
		t.Measure = ur.unit
	} else {
		t.Measure += " (" + ur.unit + ")"
	}
	return nil
}

// unitOf is the unit of a cell already read with one.
func unitOf(text string) string {
	_, _, u, _ := splitUnit([]byte(text))
	return u
}
