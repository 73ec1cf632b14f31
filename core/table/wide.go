package table

import "fmt"

// wide reads one column per group: the first record holds the labels, and
// a blank cell below a column's last value is padding, one above a value a
// missing value.
func (p *parser) wide(lines int) error {
	t, r := p.t, p.r
	if err := p.header("paste or open a table with a label row and values below it"); err != nil {
		return err
	}
	header := r.line
	if len(r.fields) > MaxGroups {
		return tooManyGroups(header, MaxGroups+1)
	}
	seen := map[string]int{}
	for c, f := range r.fields {
		if err := checkLabel(f.text, header, c+1); err != nil {
			return err
		}
		label := f.String()
		if label != "" {
			if first, dup := seen[label]; dup {
				return &Error{Line: header, Column: c + 1, Group: label,
					Reason: fmt.Sprintf("columns %d and %d are both labelled %q", first, c+1, label),
					Fix:    "give each group its own label"}
			}
			seen[label] = c + 1
		}
		t.Labels = append(t.Labels, label)
	}
	t.reserve(lines * len(t.Labels))
	t.Missing = make([]int, len(t.Labels))
	pending := make([]int, len(t.Labels)) // blank cells not yet known to be missing
	for {
		ok, err := r.read()
		if err != nil {
			return err
		}
		if !ok {
			break
		}
		for c, f := range r.fields {
			if c >= len(t.Labels) || t.Labels[c] == "" {
				if isMissing(f.text) {
					continue
				}
				if err := p.problem(&Error{Line: r.line, Column: c + 1, Found: quoteFound(f.text),
					Reason: fmt.Sprintf("%q has no group label above it", quoteFound(f.text)),
					Fix:    fmt.Sprintf("add a label in line %d, column %d, or remove the cell", header, c+1)}); err != nil {
					return err
				}
				continue
			}
			v, kind, form, unit := parseValue(f.text)
			if kind > cellMissing {
				if err := p.problem(p.cellError(f, kind, c+1, t.Labels[c])); err != nil {
					return err
				}
				continue
			}
			switch {
			case kind == cellNumber:
				t.Missing[c] += pending[c]
				pending[c] = 0
				p.numbers.note(t, form, 1, r.line, c+1, t.Labels[c], f.text)
				p.units.note(unit, 1, r.line, c+1, t.Labels[c], f.text)
				t.add(v, c, r.line)
			case len(f.text) == 0:
				pending[c]++
			default: // an explicit missing marker
				t.Missing[c] += pending[c] + 1
				pending[c] = 0
			}
		}
		for c := len(r.fields); c < len(t.Labels); c++ {
			pending[c]++
		}
	}
	p.dropUnlabelled()
	return p.finish()
}

// dropUnlabelled removes columns that have neither a label nor values (for
// example the empty column a trailing separator makes), renumbering groups.
func (p *parser) dropUnlabelled() {
	t := p.t
	newIndex := make([]int32, len(t.Labels))
	kept := 0
	for c, label := range t.Labels {
		newIndex[c] = int32(kept)
		if label != "" {
			t.Labels[kept] = label
			t.Missing[kept] = t.Missing[c]
			kept++
		}
	}
	if kept == len(t.Labels) {
		return
	}
	t.Labels, t.Missing = t.Labels[:kept], t.Missing[:kept]
	for i, g := range t.Groups {
		t.Groups[i] = newIndex[g]
	}
}
