// Package sheet turns a sheet of a spreadsheet file, Office Open XML
// (.xlsx, ECMA-376) or OpenDocument (.ods, OASIS ODF 1.2), into
// tab-separated text for the table reader: each row a line (a row number in
// the spreadsheet is the line number in the text), each cell its value as
// stored: numbers with every digit they hold, not as displayed; the cached
// value of a formula; dates and times as ISO 8601 text (2026-03-01,
// 2026-03-01 08:30:00), which the table reader refuses as measures. Cells
// holding a tab, a line break or a quote are quoted (RFC 4180).
package sheet

import (
	"bytes"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Book is an opened spreadsheet file.
type Book struct {
	Format string   // "xlsx" or "ods"
	Names  []string // the sheets, in the file's order
	sheets func(i int) ([]byte, error)
}

// IsSpreadsheet reports whether data starts like a ZIP file, as .xlsx and
// .ods files do (and no text does).
func IsSpreadsheet(data []byte) bool {
	return bytes.HasPrefix(data, []byte("PK\x03\x04"))
}

// Open reads the list of sheets of an .xlsx or .ods file.
func Open(data []byte) (*Book, error) {
	a, err := openArchive(data)
	if err != nil {
		return nil, err
	}
	switch {
	case a.has("xl/workbook.xml"):
		return openXLSX(a)
	case a.has("content.xml"):
		return openODS(a)
	}
	return nil, fmt.Errorf("the file is a ZIP archive but neither an .xlsx nor an .ods spreadsheet; save it from the spreadsheet as .xlsx, .ods or CSV")
}

// Sheet finds a sheet by name or by 1-based number; "" is the first.
func (b *Book) Sheet(ref string) (int, error) {
	if ref == "" {
		return 0, nil
	}
	for i, n := range b.Names {
		if n == ref {
			return i, nil
		}
	}
	if n, err := strconv.Atoi(ref); err == nil && n >= 1 && n <= len(b.Names) {
		return n - 1, nil
	}
	return 0, fmt.Errorf("there is no sheet %q; the sheets are %s", ref, quoteList(b.Names))
}

// Text gives sheet i as tab-separated text.
func (b *Book) Text(i int) ([]byte, error) {
	if i < 0 || i >= len(b.Names) {
		return nil, fmt.Errorf("there is no sheet %d", i+1)
	}
	return b.sheets(i)
}

func quoteList(names []string) string {
	q := make([]string, len(names))
	for i, n := range names {
		q[i] = strconv.Quote(n)
	}
	return strings.Join(q, ", ")
}

// MaxText bounds the text made of one sheet; it matches what the table
// reader takes.
const MaxText = 256 << 20

// textWriter writes rows of cells as tab-separated text, each at its row
// number: rows skipped in the file are written as empty lines, and empty
// cells at the end of a row or rows at the end of the sheet are not written
// at all (an .ods file repeats its last empty row to the millionth).
type textWriter struct {
	out   []byte
	line  int  // lines begun
	cells int  // cells written to the current line
	open  bool // the current row has a cell on its line
	err   error
}

// cell writes a non-empty cell at 0-based column col of 1-based row row,
// after the cells of the row so far (a gap is filled with empty cells).
func (w *textWriter) cell(row, col int, value []byte) {
	if len(value) == 0 || w.open && col < w.cells {
		return
	}
	tabs := col - w.cells + 1
	if !w.open {
		for w.line < row-1 {
			w.out = append(w.out, '\n')
			w.line++
		}
		w.line++
		w.open, tabs = true, col
	}
	for range tabs {
		w.out = append(w.out, '\t')
	}
	w.out = appendCell(w.out, value)
	w.cells = col + 1
}

// endRow ends the current row.
func (w *textWriter) endRow() {
	if !w.open {
		return
	}
	w.out = append(w.out, '\n')
	w.open, w.cells = false, 0
	if len(w.out) > MaxText {
		w.err = fmt.Errorf("the sheet makes more than %d MB of text; the most that is read is %d MB", MaxText>>20, MaxText>>20)
	}
}

// appendCell writes a cell, quoted when it holds a tab, a line break or a
// quote.
func appendCell(dst, v []byte) []byte {
	if needsQuotes(v) {
		dst = append(dst, '"')
		dst = append(dst, bytes.ReplaceAll(v, []byte(`"`), []byte(`""`))...)
		return append(dst, '"')
	}
	return append(dst, v...)
}

func needsQuotes(v []byte) bool {
	for _, c := range v {
		if c == '\t' || c == '\n' || c == '\r' || c == '"' {
			return true
		}
	}
	return false
}

// number gives a stored number as it is written in the file, which holds
// every digit of the double ("0.1", "1.0000000000000001E-7"), when it is
// a plain decimal number; otherwise, as the shortest text that reads back
// as the same double. Text that is not a finite number is kept as it is.
func number(stored []byte) []byte {
	plain := len(stored) > 0
	for _, c := range stored {
		if !(c >= '0' && c <= '9' || c == '.' || c == '-' || c == '+' || c == 'E' || c == 'e') {
			plain = false
			break
		}
	}
	if plain {
		return stored
	}
	v, err := strconv.ParseFloat(strings.TrimSpace(string(stored)), 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return stored
	}
	return strconv.AppendFloat(nil, v, 'g', -1, 64)
}

// appendISODate appends a day count from the epoch given as days since
// 1970-01-01 of the spreadsheet's day zero, and its fraction of a day, as
// "YYYY-MM-DD" or, with a time, "YYYY-MM-DD hh:mm:ss" (rounded to the second).
func appendISODate(b []byte, days float64) []byte {
	secs := math.Round(days * 86400)
	day := math.Floor(secs / 86400)
	rest := int64(secs - day*86400)
	y, m, d := civil(int64(day))
	if y >= 0 && y <= 9999 { // written at once: one append rather than three calls
		b = append(b, byte('0'+y/1000), byte('0'+y/100%10), byte('0'+y/10%10), byte('0'+y%10),
			'-', byte('0'+m/10), byte('0'+m%10), '-', byte('0'+d/10), byte('0'+d%10))
	} else {
		b = appendDigits(b, y, 4)
		b = appendDigits(append(b, '-'), int64(m), 2)
		b = appendDigits(append(b, '-'), int64(d), 2)
	}
	if rest != 0 {
		b = appendDigits(append(b, ' '), rest/3600, 2)
		b = appendDigits(append(b, ':'), rest/60%60, 2)
		b = appendDigits(append(b, ':'), rest%60, 2)
	}
	return b
}

// appendDigits writes n with at least width digits, led by zeros.
func appendDigits(b []byte, n int64, width int) []byte {
	if n < 0 || n >= 10000 {
		return strconv.AppendInt(b, n, 10)
	}
	var d [4]byte
	for i := 3; i >= 0; i-- {
		d[i] = byte('0' + n%10)
		n /= 10
	}
	return append(b, d[4-width:]...)
}

// civil converts days since 1970-01-01 to a proleptic Gregorian date
// (Hinnant, "chrono-Compatible Low-Level Date Algorithms", civil_from_days).
func civil(z int64) (y int64, m, d int) {
	z += 719468
	era := z / 146097
	if z < 0 && z%146097 != 0 {
		era--
	}
	doe := z - era*146097
	yoe := (doe - doe/1460 + doe/36524 - doe/146096) / 365
	y = yoe + era*400
	doy := doe - (365*yoe + yoe/4 - yoe/100)
	mp := (5*doy + 2) / 153
	d = int(doy - (153*mp+2)/5 + 1)
	m = int(mp + 3)
	if m > 12 {
		m -= 12
	}
	if m <= 2 {
		y++
	}
	return y, m, d
}
