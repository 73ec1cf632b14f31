// Package table reads the groups to compare from delimited text, as analysts
// paste it from a spreadsheet or save it as a file.
//
// Three layouts are understood:
//
//   - wide: the first record holds the group labels, one column per group, in
//     column order. A blank cell below the last value of a column is padding; a
//     blank cell above a value of the same column is a missing value.
//   - long: one record per value, a column of group labels or codes and a
//     column of values, chosen or found from a profile of the columns
//     (columns.go, choose.go); a column of counts may stand each record for
//     several values. Groups keep their order of first appearance.
//   - counts: one record per group, its label and the count of each level of
//     an ordered scale named in the first record (counts.go).
//
// Fields are separated by tab, semicolon or comma (RFC 4180 quoting), detected
// from the first lines. Numbers may have a decimal point or comma and a
// thousands separator, decided on every value read (format.go), and a unit
// (unit.go); title lines and a header on two lines are recognised
// (header.go). The missing markers are the empty cell, NA, N/A, NaN, "." and
// "-" in any letter case. Records whose cells are all empty are skipped.
package table

import (
	"bytes"
	"fmt"
	"strconv"

	"midrank/core/internal/cores"
)

// Layout names how groups and values are arranged in the text.
type Layout uint8

const (
	LayoutAuto   Layout = iota // decide from the text (see Detect)
	LayoutWide                 // one column per group, labels in the first record
	LayoutLong                 // one record per value: label, value
	LayoutCounts               // one record per group: label, then the count of each level
)

var layoutNames = [...]string{"auto", "wide", "long", "counts"}

func (l Layout) String() string { return layoutNames[l] }

// ParseLayout maps "auto", "wide", "long" and "counts" (or "") to a Layout.
func ParseLayout(s string) (Layout, bool) {
	if s == "" {
		return LayoutAuto, true
	}
	for i, n := range layoutNames {
		if s == n {
			return Layout(i), true
		}
	}
	return 0, false
}

// Options steer the reading; the zero value detects everything.
type Options struct {
	Layout    Layout
	Separator byte // '\t', ';' or ','; 0 to detect
	// Decimal and Thousands fix how the values write their numbers (see
	// numberReading.decide); NoMark detects them, and Thousands MarkNone
	// refuses every thousands separator.
	Decimal, Thousands Mark
	// Group and Measure choose the columns of a long reading, each by its
	// header or its 1-based number; "" leaves the choice to the reading.
	// Count names a column of counts: each row stands for that many values.
	// Any of them implies the long layout.
	Group, Measure, Count string
}

// Table is what was read: one entry per value in text order, and one entry
// per group in group order.
type Table struct {
	Labels  []string  // group labels, trimmed, as written (after Regroup: the names to show)
	Source  []string  // after Regroup: each group's label as written in the data (nil before)
	Missing []int     // missing values per group
	Values  []float64 // every value, in text order (-0 is stored as 0)
	Groups  []int32   // group index of each value
	Lines   []int32   // 1-based line on which each value stands

	Layout       Layout // the layout used (never LayoutAuto)
	Separator    byte   // the separator used
	DecimalComma bool   // some value was written with a decimal comma
	Thousands    Mark   // the thousands separator the values were written with; NoMark when none
	// OtherNumbers is the other reading of cells whose marks could be read
	// two ways ("52,300"), "" when there are none
	OtherNumbers string
	// Unit is the unit written beside the values ("min", "%", "€"), taken
	// off UnitCells of them; "" when none
	Unit      string
	UnitCells int
	Header    bool   // long layout: the first record was a header
	Measure   string // long layout: the measure column's header, naming what was measured

	// long layout: the columns read, 1-based (0 in the wide layout; 0 for
	// CountColumn when there is none)
	GroupColumn, MeasureColumn, CountColumn int
	// counts layout: the levels' names, in column order, and the value that
	// stands for each (the name when every name is a number, else 1, 2, 3…)
	Levels       []string
	LevelValues  []float64
	Reason       string        // why the text was read so, in one sentence
	Others       string        // other plausible readings, "" when there are none
	Alternatives []Alternative // the same, as the options that choose them
	Profile      Profile       // the text's columns

	Excluded []Excluded // groups left out by Regroup, in group order
}

// Parse reads text in the given layout. A UTF-8 byte-order mark is ignored.
// The text is not copied; the returned Table does not refer to it. When the
// columns chosen cannot be used, the error comes with a Table holding only
// how far the reading got: its separator and the profile of its columns.
func Parse(data []byte, opt Options) (*Table, error) { return parse(data, opt, nil) }

// Remeasure reads the same text as t again with other options, as for
// another measure column of a long table, without profiling its columns
// again (the costly part of a reading of many columns): t's profile is
// shared, and neither reading changes it.
func (t *Table) Remeasure(data []byte, opt Options) (*Table, error) {
	return parse(data, opt, &t.Profile)
}

// parse is Parse with the columns' profile already made, or nil.
func parse(data []byte, opt Options, profile *Profile) (*Table, error) {
	if err := checkSize(data); err != nil {
		return nil, err
	}
	data = bytes.TrimPrefix(data, []byte("\xEF\xBB\xBF"))
	t := &Table{Separator: opt.Separator, Layout: opt.Layout}
	if t.Separator == 0 {
		t.Separator = DetectSeparator(data)
	}
	switch t.Separator {
	case '\t', ';', ',':
	default:
		return nil, &Error{Reason: fmt.Sprintf("the separator %q is not one of tab, semicolon or comma", t.Separator),
			Fix: "choose tab, semicolon or comma"}
	}
	if opt.Decimal != NoMark && opt.Decimal == opt.Thousands {
		return nil, &Error{Reason: fmt.Sprintf("the %s is chosen both as the decimal mark and between thousands", opt.Decimal),
			Fix: "choose different marks"}
	}
	plan := planHeader(data, t.Separator)
	if profile != nil {
		t.Profile = *profile
	} else {
		t.Profile = profileOf(data, t.Separator, plan)
	}
	cols, err := t.chooseColumns(data, opt, plan)
	if note := plan.note(); note != "" {
		t.Reason += "; " + note
	}
	if err != nil {
		return t, err // the profile still shows the columns to choose from
	}
	// One value per line (long) or per line and column (wide) is the common
	// case; sizing the arrays once avoids regrowing them for large inputs.
	lines := estimateLines(data)
	p := parser{t: t, r: newReader(data, t.Separator), numbers: numberReading{decimal: opt.Decimal, thousands: opt.Thousands, presumed: MarkPoint}}
	if t.Separator == ';' {
		p.numbers.presumed = MarkComma
	}
	p.r.start(plan)
	switch t.Layout {
	case LayoutLong:
		if cores.Several && p.longInHalves(cols, lines) {
			return t, p.finish()
		}
		t.reserve(lines)
		return t, p.long(cols)
	case LayoutCounts:
		return t, p.counts()
	}
	return t, p.wide(lines)
}

// estimateLines guesses the number of lines from the first 64 KiB, a little
// generously, so that the value arrays rarely need to grow; counting them all
// would cost a pass over the text (a slow one in WebAssembly, which has no
// vectorised byte search).
func estimateLines(data []byte) int {
	const sample = 64 << 10
	if len(data) <= sample {
		return bytes.Count(data, []byte{'\n'}) + 1
	}
	n := bytes.Count(data[:sample], []byte{'\n'}) + 1
	return int(float64(float64(n)*float64(len(data))/sample*1.05)) + 16
}

func (t *Table) reserve(n int) {
	t.Values = make([]float64, 0, n)
	t.Groups = make([]int32, 0, n)
	t.Lines = make([]int32, 0, n)
}

func (t *Table) add(v float64, group int, line int) {
	t.Values = append(t.Values, v)
	t.Groups = append(t.Groups, int32(group))
	t.Lines = append(t.Lines, int32(line))
}

type parser struct {
	t        *Table
	r        *reader
	numbers  numberReading
	units    unitReading
	problems Problems
}

// problem notes a cell that cannot be read, so that reading goes on and
// every such cell can be shown at once; after MaxProblems it stops reading.
func (p *parser) problem(e *Error) error {
	p.problems = append(p.problems, e)
	if len(p.problems) == MaxProblems {
		return p.problems
	}
	return nil
}

// finish settles how the numbers were written and reports the problems
// noted, if any, with those of the numbers' marks.
func (p *parser) finish() error {
	err := p.numbers.decide(p.t)
	if ps, ok := err.(Problems); ok {
		p.problems = append(p.problems, ps[:min(len(ps), MaxProblems-len(p.problems))]...)
	}
	if e := p.units.decide(p.t); e != nil && len(p.problems) < MaxProblems {
		p.problems = append(p.problems, e)
	}
	if len(p.problems) > 0 {
		return p.problems
	}
	return nil
}

// cellError explains why a cell is neither a number nor a missing marker.
func (p *parser) cellError(f field, kind cellKind, column int, group string) *Error {
	switch {
	case kind == cellText && column <= len(p.t.Profile.Columns) && p.t.Profile.Columns[column-1].kind() == labelColumn:
		name := strconv.Quote(p.t.Profile.Columns[column-1].Name)
		return &Error{Line: p.r.line, Column: column, Group: group, Found: quoteFound(f.text),
			Reason: fmt.Sprintf("%q is not a number, and column %s holds text on most rows: it looks like a column of group labels", quoteFound(f.text), name),
			Fix:    fmt.Sprintf("choose it as the group column (\"Groups from the column\" on the page, --group %s on the command line) and a column of numbers as the measure", name)}
	case kind == cellText && isDate(f.text):
		return &Error{Line: p.r.line, Column: column, Group: group, Found: quoteFound(f.text),
			Reason: fmt.Sprintf("%q is a date, and a date is not a measurement", quoteFound(f.text)),
			Fix:    "compute what is to be compared (for example the days between two dates) in the spreadsheet first, or choose another column"}
	case kind == cellText:
		return &Error{Line: p.r.line, Column: column, Group: group, Found: quoteFound(f.text),
			Reason: fmt.Sprintf("%q is not a number", quoteFound(f.text)),
			Fix:    "correct the cell, or write NA there to mark the value as missing"}
	}
	return &Error{Line: p.r.line, Column: column, Group: group, Found: quoteFound(f.text),
		Reason: fmt.Sprintf("%q is infinite or too large to compute with (the limit is ±%.3g)", quoteFound(f.text), LargestValue),
		Fix:    "correct the cell, or write NA there to mark the value as missing"}
}

// isDate reports whether a cell holds an ISO 8601 date, as a spreadsheet's
// date cells are read ("2026-03-01", "2026-03-01 08:30:00").
func isDate(s []byte) bool {
	if len(s) != 10 && len(s) != 19 {
		return false
	}
	for i, c := range s {
		want := "dddd-dd-dd dd:dd:dd"[i]
		if want == 'd' && (c < '0' || c > '9') || want != 'd' && c != want && !(i == 10 && c == 'T') {
			return false
		}
	}
	return true
}

// header reads the table's first record; fix says what a text without
// one should hold.
func (p *parser) header(fix string) error {
	ok, err := p.r.read()
	if err != nil {
		return err
	}
	if !ok {
		return &Error{Reason: "there is no data", Fix: fix}
	}
	return nil
}
