package core

import (
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
	p := Preview{Input: Input{Excluded: []Left{}}, Rows: []PreviewRow{}, Groups: []Left{}, Problems: []ProblemDetail{}}
	fail := func(err error) Preview {
		d := Detail(err)
		p.Problems, p.Option, p.Message = d.Problems, d.Option, &d.Message
		return p
	}
	s, err := opt.validate()
	if err != nil {
		return fail(err)
	}
	for _, r := range table.Records(data, s.read.Separator, PreviewRows) {
		p.Rows = append(p.Rows, PreviewRow{Line: r.Line, Cells: r.Cells})
	}
	t, err := table.Parse(data, s.read)
	var ps table.Problems
	if t != nil {
		p.Input = describeInput(t) // how it was read, even when reading stopped
	}
	if t != nil && (err == nil || errors.As(err, &ps)) {
		counts := make([]int, len(t.Labels))
		for _, g := range t.Groups {
			counts[g]++
		}
		for g, label := range t.Labels {
			p.Groups = append(p.Groups, Left{Label: label, N: counts[g], Missing: t.Missing[g]})
		}
	}
	if err != nil {
		return fail(err)
	}
	return p
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
	w.Key("problems")
	writeProblems(&w, p.Problems)
	w.Key("option")
	w.OptString(p.Option)
	w.Key("message")
	w.OptString(p.Message)
	w.EndObject()
	return append(w.Bytes(), '\n')
}
