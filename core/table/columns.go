package table

import (
	"fmt"
	"math"
	"strconv"
)

// ProfileRecords is how many records below the first a column profile looks
// at: enough to tell a column of codes from a column of measurements, few
// enough that a profile costs nothing next to the reading itself.
const ProfileRecords = 1000

// MaxCodes is the most different whole numbers a column of group codes
// holds (department, site or grade codes): a column with more is read as
// measurements.
const MaxCodes = 20

// ColumnProfile describes a column from the first ProfileRecords records
// below the first record.
type ColumnProfile struct {
	Name     string `json:"name"`     // the header cell, or "column N" when the first record is not a header
	Numbers  int    `json:"numbers"`  // cells that are numbers
	Text     int    `json:"text"`     // cells that are neither numbers nor missing markers
	Blanks   int    `json:"blanks"`   // empty cells and missing markers, in records that reach the column
	Distinct int    `json:"distinct"` // different cells that are not blank
	Whole    bool   `json:"-"`        // some cell is a number and every number is a whole number
	Counting bool   `json:"-"`        // the numbers count up by one from the first (1, 2, 3…): a row number
	Negative bool   `json:"-"`        // some number is below 0
	// Unit is the unit written beside numbers in the column ("min", "%"),
	// "" when none; numbers with units are counted as numbers only when
	// they all share one and are not a few values each repeated, as codes
	// are (12 min, 15 min, 9 min…), else as text (4cyl, 6cyl; 1st floor,
	// 2nd floor)
	Unit      string `json:"unit"`
	unitCells int
	units     int // different units seen, up to 2
}

// kind is what a column looks like to the automatic reading. A cell that
// cannot be read in a column of numbers (a typo) does not change it.
func (c ColumnProfile) kind() columnKind {
	switch {
	case c.Text > c.Numbers && c.Text >= 2:
		return labelColumn // text on two rows or more: group labels
	case c.Numbers == 0:
		return otherColumn
	case c.Text == 0 && c.Counting && c.Numbers >= 3:
		return rowNumberColumn // 1, 2, 3…: in the first column, an identifier
	case c.Text == 0 && c.Whole && c.Distinct <= MaxCodes && 2*c.Distinct <= c.Numbers:
		return codeColumn // a few whole numbers, each on two rows or more on average: group codes
	case c.Numbers >= c.Text:
		return measureColumn
	}
	return otherColumn
}

type columnKind uint8

const (
	otherColumn columnKind = iota
	labelColumn
	codeColumn
	measureColumn
	rowNumberColumn
)

// Profile describes the columns of a text: whether its first record is a
// header (it holds text and no number), and each column's cells among the
// first ProfileRecords records below it.
type Profile struct {
	Header  bool            `json:"header"`
	Records int             `json:"records"` // records looked at below the first
	Whole   bool            `json:"whole"`   // the profile covers every record of the text
	Columns []ColumnProfile `json:"list"`
	first   []string        // the first record's cells
}

// profileOf profiles data read with the given separator from where the
// plan says the table starts; a cell is counted as a number when it is one
// in any of the forms parseCell accepts.
func profileOf(data []byte, sep byte, plan headerPlan) Profile {
	r := newReader(data, sep)
	r.start(plan)
	var p Profile
	ok, _ := r.read()
	if !ok {
		return Profile{Whole: true, Columns: []ColumnProfile{}}
	}
	numbers := 0
	first := make([]string, len(r.fields))
	for i, f := range r.fields {
		first[i] = f.String()
		if _, kind, _ := parseCell(f.text); kind == cellNumber {
			numbers++
		}
	}
	p.Header, p.first = numbers == 0, first
	var seen []map[string]bool
	var last []float64
	grow := func(n int) {
		for len(p.Columns) < n {
			p.Columns = append(p.Columns, ColumnProfile{Whole: true, Counting: true, Blanks: p.Records})
			seen = append(seen, map[string]bool{})
			last = append(last, math.NaN())
		}
	}
	grow(len(first))
	if !p.Header {
		p.count(first, seen, last)
	}
	for p.Records < ProfileRecords {
		if ok, err := r.read(); err != nil || !ok {
			p.Whole = true
			break
		}
		p.Records++
		cells := make([]string, len(r.fields))
		for i, f := range r.fields {
			cells[i] = f.String()
		}
		grow(len(cells))
		p.count(cells, seen, last)
	}
	if !p.Whole {
		ok, _ := r.read()
		p.Whole = !ok
	}
	for c := range p.Columns {
		col := &p.Columns[c]
		col.Name = fmt.Sprintf("column %d", c+1)
		if p.Header && c < len(first) && first[c] != "" {
			col.Name = first[c]
		}
		if codeLike := col.Distinct <= MaxCodes && 2*col.Distinct <= col.unitCells; col.units == 1 && !codeLike {
			col.Numbers += col.unitCells // one unit: measurements written with it
			col.Counting = false
		} else { // labels such as 4cyl, 6cyl, 8cyl, or 1st floor, 2nd floor

			col.Text += col.unitCells
			col.Unit = ""
		}
		col.Whole = col.Whole && col.Numbers > 0
		col.Counting = col.Counting && col.Numbers > 0
	}
	return p
}

// count adds one record's cells to the profile.
func (p *Profile) count(cells []string, seen []map[string]bool, last []float64) {
	for c := range p.Columns {
		col := &p.Columns[c]
		if c >= len(cells) {
			col.Blanks++
			continue
		}
		v, kind, _, unit := parseValue([]byte(cells[c]))
		switch {
		case kind == cellMissing:
			col.Blanks++
			continue
		case unit != "":
			col.unitCells++
			if col.units == 0 || unit != col.Unit && col.units == 1 {
				col.Unit = unit
				col.units++
			}
		case kind == cellNumber || kind == cellInfinite:
			col.Numbers++
			col.Whole = col.Whole && kind == cellNumber && v == math.Trunc(v)
			col.Negative = col.Negative || v < 0
			col.Counting = col.Counting && (math.IsNaN(last[c]) || v == last[c]+1)
			last[c] = v
		default:
			col.Text++
		}
		if !seen[c][cells[c]] {
			seen[c][cells[c]] = true
			col.Distinct++
		}
	}
}

// Reading is an automatic choice of the layout and, for a long reading,
// of the group and measure columns, with its reason and the other readings
// that are plausible too.
type Reading struct {
	Layout         Layout
	Group, Measure int           // 0-based columns of a long reading
	Reason         string        // why this reading, in one sentence
	Alternatives   []Alternative // the other plausible readings
}

// Alternative is another plausible reading of a text: the options that
// choose it, how the reading names it, and how many groups and values it
// would give in the rows profiled.
type Alternative struct {
	Layout         Layout
	Group, Measure int    // 1-based columns of a long reading, 0 otherwise
	Words          string // e.g. `groups from "Diet" (4 different)`
	Groups, Values int
}

// others names the alternatives in one phrase, "" when there are none.
func others(alts []Alternative) string {
	words := make([]string, len(alts))
	for i, a := range alts {
		words[i] = a.Words
	}
	if len(words) == 0 {
		return ""
	}
	return joinOr(words)
}

// chooseReading picks the reading of a text whose first record is a
// header, from its profile:
//
//   - a column of repeated text labels holds the groups (the first such
//     column), or else a column of a few repeated whole numbers, codes of
//     groups (the first such column), when another column holds the values:
//     the measurement column with the most different values (the rightmost on
//     a tie), or else the last other code column;
//   - otherwise each column is a group.
//
// A first column of row numbers (1, 2, 3…) is never chosen. ok is false
// when the first record is not a header.
func chooseReading(p Profile) (read Reading, ok bool) {
	if !p.Header || len(p.Columns) == 0 {
		return Reading{}, false
	}
	var labels, codes, measures []int
	for c, col := range p.Columns {
		switch col.kind() {
		case labelColumn:
			labels = append(labels, c)
		case codeColumn:
			codes = append(codes, c)
		case rowNumberColumn:
			if c > 0 { // counting values are row numbers only in the first column
				measures = append(measures, c)
			}
		case measureColumn:
			measures = append(measures, c)
		}
	}
	// a column whose labels repeat before one whose labels are all different
	// (names, identifiers), each kind in column order
	ordered := make([]int, 0, len(labels))
	for _, different := range []bool{false, true} {
		for _, c := range labels {
			if (p.Columns[c].Distinct == p.Columns[c].Text) == different {
				ordered = append(ordered, c)
			}
		}
	}
	labels = ordered
	name := func(c int) string { return strconv.Quote(p.Columns[c].Name) }
	wide := Reading{Layout: LayoutWide, Reason: "one column per group: no column holds repeated labels or codes of groups beside a column of values"}
	switch {
	case len(labels) == 0 && len(measures) > 0 && len(codes) == 0:
		return wide, true
	case len(labels) == 0 && len(measures) == 0:
		// every column a few whole numbers: ratings of one group a column, or codes beside ratings
		wide.Reason = "one column per group: every column holds a few whole numbers, as ratings do"
		if len(codes) == 2 {
			wide.Alternatives = []Alternative{{Layout: LayoutLong, Group: codes[0] + 1, Measure: codes[1] + 1,
				Words:  fmt.Sprintf("groups from %s (%d codes) and values from %s", name(codes[0]), p.Columns[codes[0]].Distinct, name(codes[1])),
				Groups: p.Columns[codes[0]].Distinct, Values: p.Columns[codes[1]].Numbers}}
		}
		return wide, true
	}
	groups := append(labels, codes...)
	group := groups[0]
	values := measures
	if len(values) == 0 { // values from the last other code column
		for _, c := range codes {
			if c != group {
				values = []int{c}
			}
		}
	}
	if len(values) == 0 {
		return wide, true
	}
	measure := values[0]
	for _, m := range values[1:] {
		if p.Columns[m].Distinct >= p.Columns[measure].Distinct {
			measure = m
		}
	}
	read = Reading{Layout: LayoutLong, Group: group, Measure: measure}
	if p.Columns[group].kind() == labelColumn {
		read.Reason = fmt.Sprintf("groups from column %s, which holds %d different labels; values from column %s",
			name(group), p.Columns[group].Distinct, name(measure))
	} else {
		read.Reason = fmt.Sprintf("groups from column %s, which holds %d different whole numbers, each on several rows: codes of groups, not measurements; values from column %s",
			name(group), p.Columns[group].Distinct, name(measure))
	}
	long := func(g, m int, words string) Alternative {
		return Alternative{Layout: LayoutLong, Group: g + 1, Measure: m + 1, Words: words, Groups: p.Columns[g].Distinct, Values: p.Columns[m].Numbers}
	}
	for _, g := range groups[1:] {
		if g != measure && (len(labels) == 0 || p.Columns[g].kind() == labelColumn) {
			read.Alternatives = append(read.Alternatives, long(g, measure, fmt.Sprintf("groups from %s (%d different)", name(g), p.Columns[g].Distinct)))
		}
	}
	for _, m := range measures {
		if m != measure {
			read.Alternatives = append(read.Alternatives, long(group, m, "values from "+name(m)))
		}
	}
	if len(labels) == 0 && len(p.Columns) == 2 {
		read.Alternatives = append(read.Alternatives, Alternative{Layout: LayoutWide, Words: "one column per group (2 groups)",
			Groups: 2, Values: p.Columns[0].Numbers + p.Columns[1].Numbers})
	}
	return read, true
}

// countsReading is the reading of a table of counts, when the text looks
// like one: a first column of labels each on one row, two or more other
// columns each of whole numbers of 0 or more, and a first record that names
// the levels: with a header of text, or, when the levels are numbers, with
// the codes of a rating scale (0, 1, 2… or 1, 2, 3…), which no row of
// counts is likely to be.
func countsReading(p Profile, first []string) (Reading, bool) {
	if len(p.Columns) < 3 || !isCounts(p) {
		return Reading{}, false
	}
	if !p.Header {
		if len(first) != len(p.Columns) {
			return Reading{}, false
		}
		start := first[1]
		if start != "0" && start != "1" {
			return Reading{}, false
		}
		for c, name := range first[1:] {
			if name != strconv.Itoa(c+int(start[0]-'0')) {
				return Reading{}, false
			}
		}
	}
	labels, values := p.Columns[0].Text, 0
	if !p.Header {
		labels-- // the first record's label names the column
	}
	for _, c := range p.Columns[1:] {
		values += c.Numbers
	}
	return Reading{Layout: LayoutCounts,
		Reason: fmt.Sprintf("one row per group: column %s holds %d labels, each on one row, and the %d other columns whole numbers of 0 or more, counts of the levels named in the first row",
			strconv.Quote(first[0]), labels, len(p.Columns)-1),
		Alternatives: []Alternative{{Layout: LayoutWide, Words: "one column per group, the first column naming the rows",
			Groups: len(p.Columns) - 1, Values: values}}}, true
}

// isCounts reports whether a profile's columns look like counts: a first
// column of labels each on one row, and two or more other columns, each of
// whole numbers of 0 or more.
func isCounts(p Profile) bool {
	first := p.Columns[0]
	if first.kind() != labelColumn || first.Distinct != first.Text || first.Numbers > 0 {
		return false
	}
	for _, c := range p.Columns[1:] {
		if c.Text > 0 || c.Numbers == 0 || !c.Whole || c.Negative {
			return false
		}
	}
	return true
}

// joinOr lists choices: "a", "a or b", "a, b or c".
func joinOr(items []string) string {
	switch len(items) {
	case 1:
		return items[0]
	}
	s := items[0]
	for _, it := range items[1 : len(items)-1] {
		s += ", " + it
	}
	return s + " or " + items[len(items)-1]
}
