package core

import (
	"midrank/core/jsonlite"
	"midrank/core/sheet"
	"midrank/core/table"
)

// Sheets is a spreadsheet file turned into text: its format, its sheets,
// the one chosen and that sheet as tab-separated text (see package sheet).
type Sheets struct {
	Format string
	Names  []string
	Chosen int
	Text   []byte
}

// IsSpreadsheet reports whether data is a spreadsheet file (.xlsx or .ods)
// rather than text.
func IsSpreadsheet(data []byte) bool { return sheet.IsSpreadsheet(data) }

// SheetText opens a spreadsheet file and gives one sheet, by name or
// 1-based number ("" for the first), as text. Its errors are *table.Error.
func SheetText(data []byte, ref string) (*Sheets, error) {
	book, err := sheet.Open(data)
	if err != nil {
		return nil, &table.Error{Reason: "the spreadsheet cannot be read: " + err.Error(),
			Fix: "save it again from the spreadsheet as .xlsx, .ods or CSV"}
	}
	i, err := book.Sheet(ref)
	if err != nil {
		return nil, &table.Error{Reason: err.Error(), Fix: "choose one of the sheets"}
	}
	text, err := book.Text(i)
	if err != nil {
		return nil, &table.Error{Reason: "the sheet " + quote(book.Names[i]) + " cannot be read: " + err.Error(),
			Fix: "save it again from the spreadsheet as .xlsx, .ods or CSV"}
	}
	return &Sheets{Format: book.Format, Names: book.Names, Chosen: i, Text: text}, nil
}

// JSON writes {"format", "sheets", "sheet"}: the file's format, the
// sheets' names and the 1-based number of the one given (its text goes
// beside it as bytes).
func (s *Sheets) JSON() []byte {
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("format", s.Format)
	w.Key("sheets")
	w.BeginArray()
	for _, n := range s.Names {
		w.String(n)
	}
	w.EndArray()
	w.IntMember("sheet", s.Chosen+1)
	w.EndObject()
	return w.Bytes()
}

// textOf gives the text to read: data itself, or the chosen sheet of a
// spreadsheet file, whose name it returns.
func textOf(data []byte, ref string) ([]byte, string, error) {
	if !sheet.IsSpreadsheet(data) {
		return data, "", nil
	}
	s, err := SheetText(data, ref)
	if err != nil {
		return nil, "", err
	}
	return s.Text, s.Names[s.Chosen], nil
}
