package sheet

import (
	"fmt"
	"strconv"
	"strings"
)

// maxColumns bounds the columns a row is read to (a repeated empty cell
// may claim thousands); the table reader takes far fewer groups.
const maxColumns = 1 << 14

// openODS reads an OpenDocument spreadsheet's content (OASIS ODF 1.2 Part
// 1, §9.1): its tables are the sheets.
func openODS(a *archive) (*Book, error) {
	content, err := a.read("content.xml")
	if err != nil {
		return nil, err
	}
	b := &Book{Format: "ods"}
	var starts []int // where each table's start tag ends
	s := xmlScanner{b: content}
	for t, ok := s.next(nil); ok; t, ok = s.next(nil) {
		if t.is("table") && !t.end && !t.empty {
			name, _ := t.attr("name")
			b.Names = append(b.Names, name)
			starts = append(starts, s.i)
		}
	}
	if len(starts) == 0 {
		return nil, fmt.Errorf("the spreadsheet has no sheets")
	}
	b.sheets = func(i int) ([]byte, error) { return odsTableText(content, starts[i]) }
	return b, nil
}

// odsTableText writes the table whose content starts at from: rows
// (<table:table-row>, repeated by table:number-rows-repeated) of cells
// (<table:table-cell>, <table:covered-table-cell> for the hidden part of a
// merged cell, repeated by table:number-columns-repeated), each cell's
// value from office:value (float, percentage, currency),
// office:date-value, office:time-value or office:boolean-value by its
// office:value-type, or else its paragraphs (§19.385, §19.679).
func odsTableText(content []byte, from int) ([]byte, error) {
	var w textWriter
	s := xmlScanner{b: content, i: from}
	depth := 0 // tables nested inside this one
	rowNumber, col := 0, 0
	rowRepeat, cellRepeat := 1, 1
	var cells []odsCell // the current row, for repeating it
	var value, text []byte
	inText := false
	paragraphs := 0
	for {
		var t tag
		var ok bool
		if inText {
			t, ok = s.next(&text)
		} else {
			t, ok = s.next(nil)
		}
		if !ok {
			break
		}
		switch {
		case t.is("table") && !t.empty:
			if t.end {
				if depth == 0 {
					return w.out, w.err
				}
				depth--
			} else {
				depth++
			}
		case depth > 0:
		case t.is("table-row") && !t.end:
			rowRepeat = repeat(t, "number-rows-repeated")
			cells, col = cells[:0], 0
			if t.empty {
				rowNumber += rowRepeat
			}
		case t.is("table-row"):
			for range rowRepeat {
				rowNumber++
				for _, c := range cells {
					w.cell(rowNumber, c.col, c.value)
				}
				w.endRow()
				if w.err != nil {
					return nil, w.err
				}
				if len(cells) == 0 {
					rowNumber += rowRepeat - 1 // empty rows: nothing to write
					break
				}
			}
		case (t.is("table-cell") || t.is("covered-table-cell")) && !t.end:
			cellRepeat = repeat(t, "number-columns-repeated")
			value = odsValue(t)
			text, paragraphs = text[:0], 0
			if t.empty {
				col = addCells(&cells, col, cellRepeat, value)
			}
		case t.is("table-cell") || t.is("covered-table-cell"):
			if value == nil && len(text) > 0 {
				value = append([]byte(nil), text...)
			}
			col = addCells(&cells, col, cellRepeat, value)
		case t.is("p") && !t.end:
			if paragraphs > 0 {
				text = append(text, '\n')
			}
			paragraphs++
			inText = !t.empty
		case t.is("p"):
			inText = false
		case t.is("s") && inText:
			n := repeat(t, "c")
			text = append(text, strings.Repeat(" ", min(n, 1000))...)
		case t.is("tab") && inText:
			text = append(text, '\t')
		case t.is("line-break") && inText:
			text = append(text, '\n')
		}
	}
	return w.out, w.err
}

type odsCell struct {
	col   int
	value []byte
}

// addCells adds a cell repeated n times at col to the row, keeping only
// non-empty ones, and gives the column after them.
func addCells(cells *[]odsCell, col, n int, value []byte) int {
	if len(value) > 0 {
		for k := 0; k < n && col+k < maxColumns; k++ {
			*cells = append(*cells, odsCell{col + k, value})
		}
	}
	return col + n
}

// repeat reads a repetition count attribute, 1 when absent or malformed.
func repeat(t tag, name string) int {
	v, ok := t.attr(name)
	if !ok {
		return 1
	}
	n, err := strconv.Atoi(v)
	if err != nil || n < 1 {
		return 1
	}
	return min(n, 1<<20)
}

// odsValue is a cell's typed value as text, nil for a string or an empty
// cell (whose paragraphs are the value).
func odsValue(t tag) []byte {
	kind, _ := t.attr("value-type")
	switch kind {
	case "float", "percentage", "currency":
		v, _ := t.attr("value")
		return number([]byte(v))
	case "date":
		v, _ := t.attr("date-value")
		return []byte(strings.Replace(v, "T", " ", 1))
	case "time":
		v, _ := t.attr("time-value")
		return []byte(v)
	case "boolean":
		v, _ := t.attr("boolean-value")
		return []byte(strings.ToUpper(v))
	}
	return nil
}
