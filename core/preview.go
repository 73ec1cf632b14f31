package core

import (
	"context"
	"errors"

	"midrank/core/jsonlite"
	"midrank/core/table"
)

// PreviewRows is how many records of the text a preview holds.
const PreviewRows = 100

// Preview is what the page shows of the text as it is typed, before and
// beside the analysis: the first records as a grid, how the text was read,
// its groups as written (before any group edits) and every cell that could
// not be read.
type Preview struct {
	Input    Input           `json:"input"`
	Rows     []PreviewRow    `json:"rows"`
	Groups   []Left          `json:"groups"`   // in data order, labels as written
	Columns  table.Profile   `json:"columns"`  // the text's columns, to choose the group and measure columns from
	Problems []ProblemDetail `json:"problems"` // data problems, with their places
	Option   *string         `json:"option"`   // the setting that cannot be used, if any
	Message  *string         `json:"message"`  // what is wrong, if anything
}

// PreviewRow is one record of the text.
type PreviewRow struct {
	Line  int      `json:"line"`
	Cells []string `json:"cells"`
}

// PreviewOf reads data with the reading options of opt (layout, separator,
// decimal mark); the group edits and test settings play no part.
func PreviewOf(data []byte, opt Options) Preview {
	p, _, _, _, _ := read(data, opt)
	return p
}

// Workspace is what the page asks for as the text is typed: the preview,
// given to onPreview as soon as the text is read, and the analysis, from
// the same reading. Group edits that name labels not in the text are left
// out rather than refused (see table.Edits.For), so that they wait while a
// label is being retyped.
func Workspace(ctx context.Context, data []byte, opt Options, onPreview func(Preview), progress Progress) (*Result, error) {
	p, s, t, from, err := read(data, opt)
	onPreview(p)
	if err != nil {
		return nil, err
	}
	labels := make([]string, len(p.Groups))
	for i, g := range p.Groups {
		labels[i] = g.Label
	}
	s.edits = s.edits.For(labels)
	r, err := analyzeTable(ctx, t, s, progress)
	if r != nil {
		from.describe(&r.Input)
	}
	return r, err
}

// read validates the options, reads the text and describes it, and says
// where it came from; the table is nil when the text cannot be analysed.
func read(data []byte, opt Options) (Preview, settings, *table.Table, source, error) {
	p := Preview{Input: Input{Excluded: []Left{}, Alternatives: []Alternative{}}, Rows: []PreviewRow{}, Groups: []Left{}, Columns: table.Profile{Columns: []table.ColumnProfile{}},
		Problems: []ProblemDetail{}}
	s, err := opt.validate()
	var from source
	if err == nil {
		data, from, err = textOf(data, opt.Sheet)
	}
	if err == nil {
		for _, r := range table.Records(data, s.read.Separator, PreviewRows) {
			p.Rows = append(p.Rows, PreviewRow{Line: r.Line, Cells: r.Cells})
		}
		var t *table.Table
		if t, err = table.Parse(data, s.read); t != nil {
			p.Input = describeInput(t) // how it was read, even when reading stopped
			from.describe(&p.Input)
			p.Columns = t.Profile
		}
		var ps table.Problems
		if t != nil && (err == nil || errors.As(err, &ps)) {
			counts := make([]int, len(t.Labels))
			for _, g := range t.Groups {
				counts[g]++
			}
			for g, label := range t.Labels {
				p.Groups = append(p.Groups, Left{Label: label, N: counts[g], Missing: t.Missing[g]})
			}
		}
		if err == nil {
			return p, s, t, from, nil
		}
	}
	d := Detail(err)
	p.Problems, p.Option, p.Message = d.Problems, d.Option, &d.Message
	return p, s, nil, from, err
}

// writeProfile writes the columns of a text as
// {"header", "records", "whole", "list": [{"name", "numbers", "text", "blanks", "distinct", "unit"}, …]}.
func writeProfile(w *jsonlite.Writer, p table.Profile) {
	w.BeginObject()
	w.BoolMember("header", p.Header)
	w.IntMember("records", p.Records)
	w.BoolMember("whole", p.Whole)
	w.Key("list")
	w.BeginArray()
	for _, c := range p.Columns {
		w.BeginObject()
		w.StringMember("name", c.Name)
		w.IntMember("numbers", c.Numbers)
		w.IntMember("text", c.Text)
		w.IntMember("blanks", c.Blanks)
		w.IntMember("distinct", c.Distinct)
		w.StringMember("unit", c.Unit)
		w.EndObject()
	}
	w.EndArray()
	w.EndObject()
}

// EncodePreview renders a preview as JSON.
func EncodePreview(p Preview) []byte {
	var w jsonlite.Writer
	w.BeginObject()
	w.Key("input")
	writeInput(&w, p.Input)
	w.Key("rows")
	w.BeginArray()
	for _, r := range p.Rows {
		w.BeginObject()
		w.IntMember("line", r.Line)
		w.Key("cells")
		w.Strings(r.Cells)
		w.EndObject()
	}
	w.EndArray()
	w.Key("groups")
	writeLeft(&w, p.Groups)
	w.Key("columns")
	writeProfile(&w, p.Columns)
	w.Key("problems")
	writeProblems(&w, p.Problems)
	w.Key("option")
	w.OptString(p.Option)
	w.Key("message")
	w.OptString(p.Message)
	w.EndObject()
	return append(w.Bytes(), '\n')
}
