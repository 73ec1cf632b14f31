package sheet

import (
	"bytes"
	"fmt"
	"path"
	"strconv"
	"strings"
)

// openXLSX reads an Office Open XML workbook (ECMA-376 Part 1, §18.2): the
// sheets' names and parts, the shared strings (§18.4) and which cell
// styles show dates (§18.8.30, §18.8.31).
func openXLSX(a *archive) (*Book, error) {
	workbook, err := a.read("xl/workbook.xml")
	if err != nil {
		return nil, err
	}
	targets := map[string]string{} // relationship id → part
	if rels, err := a.read("xl/_rels/workbook.xml.rels"); err == nil {
		s := xmlScanner{b: rels}
		for t, ok := s.next(nil); ok; t, ok = s.next(nil) {
			if t.is("Relationship") && !t.end {
				id, _ := t.attr("Id")
				target, _ := t.attr("Target")
				if strings.HasPrefix(target, "/") {
					target = target[1:]
				} else {
					target = path.Join("xl", target)
				}
				targets[id] = target
			}
		}
	}
	b := &Book{Format: "xlsx"}
	var parts []string
	epoch1904 := false
	s := xmlScanner{b: workbook}
	for t, ok := s.next(nil); ok; t, ok = s.next(nil) {
		switch {
		case t.is("sheet") && !t.end:
			name, _ := t.attr("name")
			id, _ := t.attr("id")
			part, known := targets[id]
			if !known {
				n, _ := t.attr("sheetId")
				part = "xl/worksheets/sheet" + n + ".xml"
			}
			b.Names = append(b.Names, name)
			parts = append(parts, part)
		case t.is("workbookPr") && !t.end:
			v, _ := t.attr("date1904")
			epoch1904 = v == "1" || v == "true"
		}
	}
	if len(parts) == 0 {
		return nil, fmt.Errorf("the workbook has no sheets")
	}
	var x *xlsxShared
	b.sheets = func(i int) ([]byte, error) {
		if x == nil {
			x = &xlsxShared{epoch1904: epoch1904}
			if err := x.load(a); err != nil {
				return nil, err
			}
		}
		data, err := a.read(parts[i])
		if err != nil {
			return nil, err
		}
		return x.sheetText(data)
	}
	return b, nil
}

// xlsxShared holds what every sheet of a workbook refers to.
type xlsxShared struct {
	strings   [][]byte
	dateStyle []bool // by cell style index: the style shows a date or time
	epoch1904 bool
	date      []byte // the last date written, reused from cell to cell
}

func (x *xlsxShared) load(a *archive) error {
	if a.has("xl/sharedStrings.xml") {
		data, err := a.read("xl/sharedStrings.xml")
		if err != nil {
			return err
		}
		x.strings = sharedStrings(data)
	}
	if a.has("xl/styles.xml") {
		data, err := a.read("xl/styles.xml")
		if err != nil {
			return err
		}
		x.dateStyle = dateStyles(data)
	}
	return nil
}

// sharedStrings reads the string table: each <si> is the text of its <t>
// elements, leaving out phonetic runs (<rPh>).
func sharedStrings(data []byte) [][]byte {
	var out [][]byte
	var text []byte
	s := xmlScanner{b: data}
	inT, inPhonetic := false, false
	for {
		var t tag
		var ok bool
		if inT && !inPhonetic {
			t, ok = s.next(&text)
		} else {
			t, ok = s.next(nil)
		}
		if !ok {
			return out
		}
		switch {
		case t.is("si") && t.end:
			out = append(out, text)
		case t.is("si"):
			text = nil
			if t.empty {
				out = append(out, nil)
			}
		case t.is("t"):
			inT = !t.end && !t.empty
		case t.is("rPh"):
			inPhonetic = !t.end && !t.empty
		}
	}
}

// dateStyles marks the cell styles (<cellXfs><xf numFmtId>) whose number
// format shows a date or a time: the built-in formats 14–22 and 45–47
// (ECMA-376 §18.8.30) and custom formats with day, month, year, hour or
// second codes outside quoted text and brackets.
func dateStyles(data []byte) []bool {
	custom := map[string]bool{}
	var styles []bool
	inXfs := false
	s := xmlScanner{b: data}
	for t, ok := s.next(nil); ok; t, ok = s.next(nil) {
		switch {
		case t.is("numFmt") && !t.end:
			id, _ := t.attr("numFmtId")
			code, _ := t.attr("formatCode")
			custom[id] = isDateFormat(code)
		case t.is("cellXfs"):
			inXfs = !t.end && !t.empty
		case inXfs && t.is("xf") && !t.end:
			id, _ := t.attr("numFmtId")
			n, _ := strconv.Atoi(id)
			date, isCustom := custom[id]
			styles = append(styles, date || !isCustom && (n >= 14 && n <= 22 || n >= 45 && n <= 47))
		}
	}
	return styles
}

// isDateFormat reports whether a number format code shows a date or time.
func isDateFormat(code string) bool {
	quoted, bracket := false, false
	for i := 0; i < len(code); i++ {
		c := code[i]
		switch {
		case c == '"':
			quoted = !quoted
		case quoted:
		case c == '\\' || c == '_' || c == '*':
			i++ // the next character is shown as it is, or is padding
		case c == '[':
			bracket = true
		case c == ']':
			bracket = false
		case bracket:
		case strings.IndexByte("dDmMyYhHsS", c) >= 0:
			return true
		}
	}
	return false
}

// sheetText writes a worksheet's cells (<sheetData><row><c>, §18.3.1.4) as
// text.
func (x *xlsxShared) sheetText(data []byte) ([]byte, error) {
	w := textWriter{out: make([]byte, 0, len(data)/4)} // the text is about a fifth of the XML

	s := xmlScanner{b: data}
	rowNumber, col := 0, 0
	var cellType string
	style := -1
	var value []byte
	inValue, inInline := false, false
	for {
		if !inValue { // the usual row and cell forms, read without the general tag reader
			if v, ok := s.plainCell(); ok {
				if v.ref != nil {
					if n, ok := columnOf(v.ref); ok {
						col = n
					}
				}
				// what the general reader would have kept of the cell
				cellType, style, value = string(v.kind), styleOf(v.style), append(value[:0], v.value...)
				if v.hasValue {
					w.cell(rowNumber, col, x.cellText(cellType, style, value))
				}
				col++
				continue
			}
			if s.plainEnd("row") {
				if w.endRow(); w.err != nil {
					return nil, w.err
				}
				continue
			}
			if ref, ok := s.plainRowStart(); ok {
				rowNumber, col = nextRow(rowNumber, ref), 0
				continue
			}
		}
		var t tag
		var ok bool
		if inValue {
			t, ok = s.next(&value)
		} else {
			t, ok = s.next(nil)
		}
		if !ok {
			break
		}
		switch {
		case t.is("row") && !t.end:
			ref, _ := t.attr("r")
			rowNumber, col = nextRow(rowNumber, []byte(ref)), 0
		case t.is("row"):
			w.endRow()
			if w.err != nil {
				return nil, w.err
			}
		case t.is("c") && !t.end:
			cellType, style = "", -1
			for key, v, i, ok := t.nextAttr(0); ok; key, v, i, ok = t.nextAttr(i) {
				switch string(key) {
				case "t":
					cellType = string(v)
				case "r":
					if c, ok := columnOf(v); ok {
						col = c
					}
				case "s":
					style = wholeNumber(v)
				}
			}
			value = value[:0]
			if t.empty {
				col++
			}
		case t.is("c"):
			w.cell(rowNumber, col, x.cellText(cellType, style, value))
			col++
		case t.is("v") || t.is("t") && inInline:
			inValue = !t.end && !t.empty
		case t.is("is"):
			inInline = !t.end && !t.empty
		}
	}
	return w.out, w.err
}

// nextRow is the number of the row after row number prev whose r
// attribute is ref: ref when it is a later row, else the next.
func nextRow(prev int, ref []byte) int {
	if n := wholeNumber(ref); n > prev {
		return n
	}
	return prev + 1
}

// styleOf reads a cell's style index, -1 when there is none.
func styleOf(v []byte) int {
	if v == nil {
		return -1
	}
	return wholeNumber(v)
}

// cellText is a cell's value as text, by its type (§18.18.11).
func (x *xlsxShared) cellText(cellType string, style int, value []byte) []byte {
	switch cellType {
	case "s":
		i := wholeNumber(bytes.TrimSpace(value))
		if i < 0 || i >= len(x.strings) {
			return nil
		}
		return x.strings[i]
	case "str", "inlineStr":
		return value
	case "b":
		if string(value) == "1" {
			return []byte("TRUE")
		}
		return []byte("FALSE")
	case "e":
		if string(value) == "#N/A" {
			return []byte("NA")
		}
		return value
	case "d": // an ISO 8601 date stored as text
		return []byte(strings.Replace(string(value), "T", " ", 1))
	}
	if len(value) == 0 {
		return nil
	}
	if style >= 0 && style < len(x.dateStyle) && x.dateStyle[style] {
		serial, err := float64(wholeNumber(value)), error(nil) // a day without a time, read at once
		if serial < 0 {
			serial, err = strconv.ParseFloat(string(value), 64)
		}
		if err == nil {
			x.date = appendISODate(x.date[:0], x.daysSince1970(serial))
			return x.date
		}
	}
	return number(value)
}

// daysSince1970 converts a serial date: days since 1899-12-30 from serial
// 61 (1900-03-01) on, a day later before it, where the format counts a
// 1900-02-29 that never was (serial 60, shown here as 1900-03-01;
// §18.17.4.1), or days since 1904-01-01 in the 1904 date system.
func (x *xlsxShared) daysSince1970(serial float64) float64 {
	if x.epoch1904 {
		return serial - 24107
	}
	if serial < 61 {
		serial++ // before the leap day that never was
	}
	return serial - 25569
}

// wholeNumber reads a style index or a row number, -1 when it is not a
// whole number.
func wholeNumber(b []byte) int {
	n := 0
	for _, c := range b {
		if c < '0' || c > '9' || n > 1<<24 {
			return -1
		}
		n = n*10 + int(c-'0')
	}
	if len(b) == 0 {
		return -1
	}
	return n
}

// columnOf reads the 0-based column of a cell reference such as "AB12".
func columnOf(ref []byte) (int, bool) {
	col, i := 0, 0
	for ; i < len(ref) && ref[i] >= 'A' && ref[i] <= 'Z'; i++ {
		col = col*26 + int(ref[i]-'A'+1)
		if col > 1<<20 {
			return 0, false
		}
	}
	if i == 0 {
		return 0, false
	}
	return col - 1, true
}
