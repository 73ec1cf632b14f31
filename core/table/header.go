package table

import (
	"fmt"
	"strconv"
	"strings"
)

// headerPlan says where the table starts in a text, as exports often have
// it: title lines above it (a line whose only cell is a title, above a
// table of several columns) and a header on two lines, the first with a
// cell merged over several columns ("Waiting time" over "min" and "max"),
// whose cells are joined into one name per column.
type headerPlan struct {
	titles   []string // the titles passed over, in order
	joined   []field  // the header's cells joined, nil when the header is one line
	from, to int      // the lines of a joined header
}

// maxTitles is the most title lines passed over.
const maxTitles = 3

// planHeader looks at the first records of a text for title lines and a
// header on two lines. A header is on two lines when both hold no number,
// the line after them does, and the first has a blank cell where the second
// names a column: the part of a merged cell a spreadsheet leaves blank. Each
// column's name is then the first line's cell (a blank one takes the
// nearest name to its left, the merged cell's) and the second's, joined.
func planHeader(data []byte, sep byte) headerPlan {
	var plan headerPlan
	r := newReader(data, sep)
	var records [][]string
	var lines []int
	for len(records) < maxTitles+3 {
		if ok, err := r.read(); !ok || err != nil {
			break
		}
		cells := make([]string, len(r.fields))
		for i, f := range r.fields {
			cells[i] = f.String()
		}
		records, lines = append(records, cells), append(lines, r.line)
	}
	t := 0
	for t < len(records) && t < maxTitles && filled(records[t]) == 1 {
		t++
	}
	if t == len(records) || filled(records[t]) < 2 {
		t = 0 // no table of several columns below: nothing is a title
	}
	for _, title := range records[:t] {
		plan.titles = append(plan.titles, strings.Join(title, ""))
	}
	if t+2 >= len(records) {
		return plan
	}
	top, bottom := records[t], records[t+1]
	if !noNumbers(top) || !noNumbers(bottom) || noNumbers(records[t+2]) || !mergedAbove(top, bottom) {
		return plan
	}
	last := ""
	for c := range max(len(top), len(bottom)) {
		name, under := cell(top, c), cell(bottom, c)
		switch {
		case name != "":
			last = name
		case under != "":
			name = last
		}
		plan.joined = append(plan.joined, field{text: []byte(strings.TrimSpace(name + " " + under))})
	}
	plan.from, plan.to = lines[t], lines[t+1]
	return plan
}

// note says what the plan passed over and joined, "" when nothing.
func (plan headerPlan) note() string {
	var parts []string
	for _, title := range plan.titles {
		parts = append(parts, fmt.Sprintf("the title %s above the table is passed over", strconv.Quote(title)))
	}
	if plan.joined != nil {
		names := make([]string, len(plan.joined))
		for i, f := range plan.joined {
			names[i] = strconv.Quote(string(f.text))
		}
		parts = append(parts, fmt.Sprintf("the header is on lines %d and %d (a cell merged over several columns), read as %s",
			plan.from, plan.to, strings.Join(names, ", ")))
	}
	return strings.Join(parts, "; ")
}

// start moves r to the header, past the titles; a header on two lines is
// then read as one record of the joined cells.
func (r *reader) start(plan headerPlan) {
	for range plan.titles {
		r.read()
	}
	if plan.joined != nil {
		r.read()
		r.joined = plan.joined
	}
}

func filled(cells []string) int {
	n := 0
	for _, c := range cells {
		if c != "" {
			n++
		}
	}
	return n
}

func noNumbers(cells []string) bool {
	for _, c := range cells {
		if _, kind, _ := parseCell([]byte(c)); kind == cellNumber {
			return false
		}
	}
	return true
}

// mergedAbove reports whether top is blank somewhere bottom names a
// column, with a name to its left in top.
func mergedAbove(top, bottom []string) bool {
	named := false
	for c := range bottom {
		if cell(top, c) != "" {
			named = true
		} else if named && bottom[c] != "" {
			return true
		}
	}
	return false
}

func cell(cells []string, c int) string {
	if c < len(cells) {
		return cells[c]
	}
	return ""
}
