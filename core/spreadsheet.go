package core

import (
	"midrank/core/jsonlite"
	"midrank/core/sheet"
	"midrank/core/table"
	"midrank/core/textenc"
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

// source is where a text read came from: a sheet of a spreadsheet file, or
// a text file in some encoding, which the text was made UTF-8 from.
type source struct {
	sheet    string // the sheet's name, "" for a text file
	encoding textenc.Encoding
}

// textOf gives the text to read, as UTF-8: data itself, or converted from
// its encoding (package textenc), or the chosen sheet of a spreadsheet file.
func textOf(data []byte, ref string) ([]byte, source, error) {
	if !sheet.IsSpreadsheet(data) {
		text, enc := textenc.ToUTF8(data)
		return text, source{encoding: enc}, nil
	}
	s, err := SheetText(data, ref)
	if err != nil {
		return nil, source{}, err
	}
	return s.Text, source{sheet: s.Names[s.Chosen], encoding: textenc.UTF8}, nil
}

// describe adds the source to how the text was read: the sheet, and the
// encoding, said in the reading's reason when it is not UTF-8 (the
// conversion is a reading like any other, never made silently).
func (s source) describe(in *Input) {
	if s.sheet != "" {
		in.Sheet = &s.sheet
	}
	in.Encoding = string(s.encoding)
	if note := EncodingNote(s.encoding); note != "" {
		in.Reason += "; " + note
	}
}

// EncodingNote says how a text file in encoding enc was read, "" for UTF-8.
func EncodingNote(enc textenc.Encoding) string {
	switch enc {
	case textenc.UTF16LE, textenc.UTF16BE:
		return "the file is " + string(enc) + " text (as spreadsheets save \u201cUnicode text\u201d), read as such"
	case textenc.Windows1252:
		return "the file is not UTF-8, so it was read as Windows-1252, the Western European encoding of text saved on Windows (if letters look wrong, save the file as UTF-8 and open it again)"
	}
	return ""
}
