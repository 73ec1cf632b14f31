package table

import (
	"fmt"
	"math"
)

// MaxCounted is the most values a table of counts may stand for, so that a
// mistyped count cannot fill the memory: ten million, well beyond any
// survey.
const MaxCounted = 10_000_000

// counts reads a table of counts: the first record names the levels of an
// ordered scale (its first cell names the groups' column), and each record
// after it is a group: its label, then how many of its values are at each
// level. Each count becomes that many values of the level: the level's name
// when every name is a number, else its position (1, 2, 3…), which ranks
// the levels in column order. A blank count is 0.
func (p *parser) counts() error {
	t, r := p.t, p.r
	if err := p.header("paste or open a table with the levels in the first row and a row of counts per group"); err != nil {
		return err
	}
	header := r.line
	levels := r.fields[1:]
	for len(levels) > 0 && len(levels[len(levels)-1].text) == 0 {
		levels = levels[:len(levels)-1] // a trailing separator
	}
	if len(levels) < 2 {
		return &Error{Line: header, Reason: fmt.Sprintf("a table of counts needs a column of groups and at least two columns of levels; the first row has %d", len(levels)+1),
			Fix: "write the levels' names in the first row, after the name of the groups' column"}
	}
	numeric := true
	for c, f := range levels {
		name := f.String()
		if name == "" {
			return &Error{Line: header, Column: c + 2, Reason: "a level without a name",
				Fix: "write each level's name in the first row, in the order of the scale"}
		}
		t.Levels = append(t.Levels, name)
		v, kind, _ := parseCell(f.text)
		numeric = numeric && kind == cellNumber
		t.LevelValues = append(t.LevelValues, v)
	}
	if !numeric {
		for c := range t.LevelValues {
			t.LevelValues[c] = float64(c + 1)
		}
	}
	index := map[string]int{}
	rowOf := map[int]int{} // group → the line of its row
	total := 0
	for {
		ok, err := r.read()
		if err != nil {
			return err
		}
		if !ok {
			return p.finish()
		}
		f := r.fields
		if len(f[0].text) == 0 {
			if err := p.problem(&Error{Line: r.line, Column: 1, Reason: "the counts have no group label",
				Fix: "write the group's label in the first column"}); err != nil {
				return err
			}
			continue
		}
		g, bad := p.groupOf(index, f[0], 1)
		if bad != nil {
			return bad
		}
		if first, seen := rowOf[g]; seen {
			if err := p.problem(&Error{Line: r.line, Column: 1, Group: t.Labels[g],
				Reason: fmt.Sprintf("group %q has a second row of counts; its first is line %d", t.Labels[g], first),
				Fix:    "give each group one row, or add the counts up"}); err != nil {
				return err
			}
			continue
		}
		rowOf[g] = r.line
		for c, cell := range f[1:] {
			if c >= len(t.Levels) {
				if len(cell.text) > 0 {
					if err := p.problem(&Error{Line: r.line, Column: c + 2, Group: t.Labels[g], Found: quoteFound(cell.text),
						Reason: fmt.Sprintf("%q stands in no level's column", quoteFound(cell.text)),
						Fix:    "name the level in the first row, or remove the cell"}); err != nil {
						return err
					}
				}
				continue
			}
			if len(cell.text) == 0 {
				continue // no values at this level
			}
			n, bad := p.count(cell, c+2, t.Labels[g])
			if bad == nil && total+n > MaxCounted {
				return &Error{Line: r.line, Column: c + 2, Group: t.Labels[g],
					Reason: fmt.Sprintf("the counts add up to more than %d values", MaxCounted), Fix: "check the counts"}
			}
			if bad != nil {
				if err := p.problem(bad); err != nil {
					return err
				}
				continue
			}
			total += n
			for range n {
				t.add(t.LevelValues[c], g, r.line)
			}
		}
	}
}

// count reads a cell of counts: a whole number from 0 to MaxCounted.
func (p *parser) count(cell field, column int, group string) (int, *Error) {
	v, kind, _ := parseCell(cell.text)
	if kind != cellNumber || v < 0 || v != math.Trunc(v) || v > MaxCounted {
		return 0, &Error{Line: p.r.line, Column: column, Group: group, Found: quoteFound(cell.text),
			Reason: fmt.Sprintf("%q is not a count: a count is a whole number of 0 or more", quoteFound(cell.text)),
			Fix:    "correct the cell"}
	}
	return int(v), nil
}
