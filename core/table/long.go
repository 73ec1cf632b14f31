package table

import (
	"bytes"
	"fmt"
)

// long reads one value per record, its group label in column cols.group
// and its value in column cols.measure.
func (p *parser) long(cols longColumns) error {
	if err := p.longRecords(cols, true); err != nil {
		return err
	}
	return p.finish()
}

// longRecords reads the records of a long text up to its end, the first
// of them perhaps a header, leaving the numbers and units to be decided.
func (p *parser) longRecords(cols longColumns, first bool) error {
	t, r := p.t, p.r
	t.GroupColumn, t.MeasureColumn, t.CountColumn = cols.group+1, cols.measure+1, cols.count+1
	index := map[string]int{}
	lastLabel, last := []byte(nil), -1
	for {
		ok, err := r.read()
		if err != nil {
			return err
		}
		if !ok {
			return nil
		}
		f := r.fields
		if cols.strict && len(f) > 2 {
			if err := p.problem(&Error{Line: r.line, Column: 3, Found: quoteFound(f[2].text),
				Reason: fmt.Sprintf("there is a third cell (%q), but the long layout has two: group label, then value", quoteFound(f[2].text)),
				Fix:    "remove the extra cells, or choose the group and measure columns"}); err != nil {
				return err
			}
			continue
		}
		var label, value field
		if cols.group < len(f) {
			label = f[cols.group]
		}
		if cols.measure < len(f) {
			value = f[cols.measure]
		}
		if first {
			first = false
			header := cols.header == 1
			if cols.header < 0 {
				_, kind, _ := parseCell(value.text)
				header = kind == cellText
			}
			if header {
				t.Header = true
				t.Measure = value.String()
				continue
			}
		}
		if len(label.text) == 0 {
			if err := p.problem(&Error{Line: r.line, Column: cols.group + 1,
				Reason: "the value has no group label",
				Fix:    fmt.Sprintf("write the group label in column %d of the line", cols.group+1)}); err != nil {
				return err
			}
			continue
		}
		g := last
		if !bytes.Equal(label.text, lastLabel) || label.escaped {
			var bad error
			if g, bad = p.groupOf(index, label, cols.group+1); bad != nil {
				return bad
			}
			lastLabel, last = label.text, g
			if label.escaped {
				lastLabel = nil
			}
		}
		v, kind, form, unit := parseValue(value.text)
		if kind > cellMissing {
			if err := p.problem(p.cellError(value, kind, cols.measure+1, t.Labels[g])); err != nil {
				return err
			}
			continue
		}
		n := 1
		if cols.count >= 0 {
			var cell field
			if cols.count < len(f) {
				cell = f[cols.count]
			}
			var bad *Error
			if n, bad = p.count(cell, cols.count+1, t.Labels[g]); bad != nil {
				if err := p.problem(bad); err != nil {
					return err
				}
				continue
			}
		}
		if kind == cellMissing {
			t.Missing[g] += n
		} else {
			p.numbers.note(t, form, n, r.line, cols.measure+1, t.Labels[g], value.text)
			p.units.note(unit, n, r.line, cols.measure+1, t.Labels[g], value.text)
			for range n {
				t.add(v, g, r.line)
			}
		}
	}
}

// groupOf finds or adds the group of a label; looking up a plain label
// allocates nothing.
func (p *parser) groupOf(index map[string]int, label field, column int) (int, error) {
	t := p.t
	if !label.escaped && len(t.Labels) <= 8 {
		// a few comparisons beat hashing for the usual handful of groups
		text := label.text
		for g, l := range t.Labels {
			// length and first byte first: most mismatches end there, without a call
			if string(text) == l {
				return g, nil
			}
		}
	}
	var g int
	var known bool
	if label.escaped {
		g, known = index[label.String()]
	} else {
		g, known = index[string(label.text)]
	}
	if known {
		return g, nil
	}
	if err := checkLabel(label.text, p.r.line, column); err != nil {
		return 0, err
	}
	if len(t.Labels) == MaxGroups {
		return 0, tooManyGroups(p.r.line, column)
	}
	g = len(t.Labels)
	name := label.String()
	index[name] = g
	t.Labels = append(t.Labels, name)
	t.Missing = append(t.Missing, 0)
	return g, nil
}
