package table

import (
	"fmt"
	"strconv"
	"strings"
)

// longColumns are the columns a long reading takes its groups and values from.
type longColumns struct {
	group, measure int  // 0-based
	count          int  // 0-based column of counts, -1 when none
	header         int8 // the first record is a header: 1, it is not: 0, detect it: -1
	strict         bool // a cell beyond the two columns is an error (a two-column text read as it stands)
}

// chooseColumns settles the layout of t and, for the long layout, its
// columns: as opt chooses them, else from the profile of the text (see
// chooseReading), else by the first-record rule of detectLayout; and says
// why in t.Reason.
func (t *Table) chooseColumns(data []byte, opt Options, plan headerPlan) (longColumns, error) {
	p := t.Profile
	if opt.Group != "" || opt.Measure != "" || opt.Count != "" {
		return t.chosenColumns(opt)
	}
	cols := longColumns{group: 0, measure: 1, count: -1, header: -1, strict: true}
	switch t.Layout {
	case LayoutCounts:
		t.Reason = "one row per group, its label and then the count of each level, the levels named in the first row, as chosen"
		return cols, nil
	case LayoutLong:
		t.Reason = "one row per value, the group then the value, as chosen"
		return cols, nil
	case LayoutWide:
		t.Reason = "one column per group, as chosen"
		return cols, nil
	}
	if first := p.first; len(first) > 0 {
		if read, ok := countsReading(p, first); ok {
			t.Layout, t.Reason, t.Alternatives, t.Others = read.Layout, read.Reason, read.Alternatives, others(read.Alternatives)
			return cols, nil
		}
	}
	if read, ok := chooseReading(p); ok {
		t.Layout, t.Reason, t.Alternatives, t.Others = read.Layout, read.Reason, read.Alternatives, others(read.Alternatives)
		return longColumns{group: read.Group, measure: read.Measure, count: -1, header: 1, strict: len(p.Columns) <= 2}, nil
	}
	t.Layout = detectLayout(data, t.Separator, plan)
	t.Reason = "one column per group, its label in the first row"
	if t.Layout == LayoutLong {
		t.Reason = "one row per value: the first column holds labels of groups, the second the values"
	}
	return cols, nil
}

// chosenColumns reads the group and measure columns opt names; the one not
// named is the automatic reading's, or else the first (group) or last
// (measure) other column.
func (t *Table) chosenColumns(opt Options) (longColumns, error) {
	if t.Layout == LayoutWide || t.Layout == LayoutCounts {
		return longColumns{}, &Error{Reason: "a group, measure or count column is chosen, which means one row per value, but the layout chosen is " + t.Layout.String(),
			Fix: "choose the layout auto or long, or leave the columns to the reading"}
	}
	p := t.Profile
	t.Layout = LayoutLong
	if len(p.Columns) < 2 {
		return longColumns{}, &Error{Reason: fmt.Sprintf("a group and a measure column are read from the text, but it has %d column", len(p.Columns)),
			Fix: "paste or open a table with a column of groups and a column of values"}
	}
	group, err := p.column(opt.Group, "group")
	if err != nil {
		return longColumns{}, err
	}
	measure, err := p.column(opt.Measure, "measure")
	if err != nil {
		return longColumns{}, err
	}
	count, err := p.column(opt.Count, "count")
	if err != nil {
		return longColumns{}, err
	}
	auto, _ := chooseReading(p)
	if auto.Layout == LayoutLong && auto.Measure == count {
		auto.Measure = otherMeasure(p, auto.Group, count)
	}
	last := len(p.Columns) - 1
	if group < 0 {
		group = 0
		if auto.Layout == LayoutLong && auto.Group != measure {
			group = auto.Group
		} else if measure == 0 {
			group = 1
		}
	}
	if measure < 0 {
		measure = last
		if auto.Layout == LayoutLong && auto.Measure != group {
			measure = auto.Measure
		} else if group == last {
			measure = last - 1
		}
		if measure == count {
			measure = otherMeasure(p, group, count)
		}
	}
	if twice := group; group == measure || count == group || count == measure && count >= 0 {
		if count == measure {
			twice = measure
		}
		return longColumns{}, &Error{Reason: fmt.Sprintf("column %s is chosen for two roles", strconv.Quote(p.Columns[twice].Name)),
			Fix: "choose different columns for the groups, the values and the counts"}
	}
	t.Reason = fmt.Sprintf("groups from column %s and values from column %s, as chosen",
		strconv.Quote(p.Columns[group].Name), strconv.Quote(p.Columns[measure].Name))
	if count >= 0 {
		t.Reason = fmt.Sprintf("groups from column %s, values from column %s, each row counted the number of times column %s says, as chosen",
			strconv.Quote(p.Columns[group].Name), strconv.Quote(p.Columns[measure].Name), strconv.Quote(p.Columns[count].Name))
	}
	header := int8(-1)
	if p.Header {
		header = 1
	}
	return longColumns{group: group, measure: measure, count: count, header: header}, nil
}

// otherMeasure is the last column of numbers that is neither the group
// column nor the count column, or the first other column when none holds
// numbers.
func otherMeasure(p Profile, group, count int) int {
	fallback := -1
	for c := len(p.Columns) - 1; c >= 0; c-- {
		if c == group || c == count {
			continue
		}
		if p.Columns[c].Numbers > 0 {
			return c
		}
		fallback = c
	}
	return fallback
}

// column finds the column ref names: its 1-based number, else its header
// (exactly, then in any letter case); -1 when ref is "".
func (p Profile) column(ref, role string) (int, error) {
	ref = strings.TrimSpace(ref)
	if ref == "" {
		return -1, nil
	}
	if n, err := strconv.Atoi(ref); err == nil && n >= 1 && n <= len(p.Columns) {
		return n - 1, nil
	}
	if p.Header {
		for c, col := range p.Columns {
			if col.Name == ref {
				return c, nil
			}
		}
		for c, col := range p.Columns {
			if strings.EqualFold(col.Name, ref) {
				return c, nil
			}
		}
	}
	names := make([]string, len(p.Columns))
	for c, col := range p.Columns {
		names[c] = strconv.Quote(col.Name)
	}
	return -1, &Error{Reason: fmt.Sprintf("there is no column %s for the %s", strconv.Quote(ref), role),
		Fix: fmt.Sprintf("name a column by its header or its number from 1 to %d: %s", len(p.Columns), strings.Join(names, ", "))}
}
