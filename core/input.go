package core

import (
	"strconv"

	"midrank/core/table"
)

// Input says how the text was read.
type Input struct {
	Layout string `json:"layout"` // wide or long
	// Sheet is the sheet read from a spreadsheet file, null for text
	Sheet *string `json:"sheet"`
	// Encoding is the text file's encoding, which it was made UTF-8 from:
	// UTF-8, UTF-16LE, UTF-16BE or Windows-1252 (UTF-8 for a sheet)
	Encoding    string `json:"encoding"`
	Separator   string `json:"separator"`    // tab, semicolon or comma
	DecimalMark string `json:"decimal_mark"` // point or comma
	Thousands   string `json:"thousands"`    // the thousands separator: none, comma, point, space or apostrophe
	Header      bool   `json:"header"`       // long layout: the first line was a header
	Measure     string `json:"measure"`      // long layout: what the header calls the values
	// long layout: the columns of the groups and of the values, by header
	// (or "column N"); "" in the wide layout
	GroupColumn   string  `json:"group_column"`
	MeasureColumn string  `json:"measure_column"`
	CountColumn   *string `json:"count_column"` // the column of counts of a long reading, null when none
	// Levels are the levels of a table of counts, in order; null otherwise
	Levels []string `json:"levels"`
	// Unit is the unit written beside the values and taken off them ("min",
	// "%", "€"), null when none; UnitCells says from how many values
	Unit          *string `json:"unit"`
	UnitCells     int     `json:"unit_cells"`
	Reason        string  `json:"reason"`         // why the text was read so
	OtherReadings *string `json:"other_readings"` // other plausible readings, null when there are none
	// Alternatives are the same readings as the settings that choose them
	Alternatives []Alternative `json:"alternatives"`
	// OtherNumbers: cells whose marks could be read two ways, and the other
	// way; null when there are none
	OtherNumbers *string `json:"other_numbers"`
	Excluded     []Left  `json:"excluded"` // groups left out by request, in data order
}

// Alternative is another plausible reading of the text: the settings that
// choose it (request keys layout, group and measure; group and measure as
// the column menus name them: the header, or the number when there is no
// header), how the reading names it, and the groups and values it would give
// in the rows the reading looked at.
type Alternative struct {
	Layout  string `json:"layout"`
	Group   string `json:"group"`
	Measure string `json:"measure"`
	Words   string `json:"words"`
	Groups  int    `json:"groups"`
	Values  int    `json:"values"`
}

// LeftLabels lists the labels of the groups left out.
func (in Input) LeftLabels() []string {
	var labels []string
	for _, e := range in.Excluded {
		labels = append(labels, e.Label)
	}
	return labels
}

// Left is a group left out of the analysis by request.
type Left struct {
	Label   string `json:"label"` // as written in the data
	N       int    `json:"n"`
	Missing int    `json:"missing"`
}

// describeInput says how a table was read, for the answer's input.
func describeInput(t *table.Table) Input {
	in := Input{Layout: t.Layout.String(), DecimalMark: "point", Thousands: t.Thousands.String(), Header: t.Header, Measure: t.Measure, Reason: t.Reason, Excluded: []Left{}}
	if t.GroupColumn > 0 {
		in.GroupColumn, in.MeasureColumn = t.Profile.Columns[t.GroupColumn-1].Name, t.Profile.Columns[t.MeasureColumn-1].Name
	}
	if t.CountColumn > 0 {
		in.CountColumn = &t.Profile.Columns[t.CountColumn-1].Name
	}
	in.Levels = t.Levels
	if t.Unit != "" {
		in.Unit, in.UnitCells = &t.Unit, t.UnitCells
	}
	if t.Others != "" {
		in.OtherReadings = &t.Others
	}
	in.Alternatives = []Alternative{}
	for _, a := range t.Alternatives {
		key := func(c int) string {
			switch {
			case c == 0:
				return ""
			case t.Profile.Header:
				return t.Profile.Columns[c-1].Name
			}
			return strconv.Itoa(c)
		}
		in.Alternatives = append(in.Alternatives, Alternative{Layout: a.Layout.String(), Group: key(a.Group), Measure: key(a.Measure),
			Words: a.Words, Groups: a.Groups, Values: a.Values})
	}
	if t.OtherNumbers != "" {
		in.OtherNumbers = &t.OtherNumbers
	}
	for _, e := range t.Excluded {
		in.Excluded = append(in.Excluded, Left{Label: e.Label, N: e.Values, Missing: e.Missing})
	}
	switch t.Separator {
	case '\t':
		in.Separator = "tab"
	case ';':
		in.Separator = "semicolon"
	default:
		in.Separator = "comma"
	}
	if t.DecimalComma {
		in.DecimalMark = "comma"
	}
	return in
}
