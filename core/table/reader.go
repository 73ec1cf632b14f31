package table

import "bytes"

// field is one cell of a record, trimmed of surrounding spaces and, when it
// was quoted, of its quotes.
type field struct {
	text    []byte
	escaped bool // quoted and holding "" pairs that stand for one quote
}

// String returns the cell's text with "" pairs turned back into quotes.
func (f field) String() string {
	if f.escaped {
		return string(bytes.ReplaceAll(f.text, []byte(`""`), []byte(`"`)))
	}
	return string(f.text)
}

// reader splits text into records of fields, following RFC 4180: fields are
// separated by sep, a field that starts with a quote runs to the matching
// quote and may hold separators, line breaks and "" pairs. It also accepts
// CRLF, LF or CR line ends, spaces around fields, and trailing separators.
// Records whose fields are all empty are skipped. No cell is copied: fields
// point into the text.
type reader struct {
	data   []byte
	pos    int
	eol    byte // '\n', or '\r' for text that has no '\n' at all
	sep    byte
	line   int // 1-based line on which the current record starts
	next   int // 1-based line on which the next record starts
	fields []field
	// where the next separator and quote at or after some earlier position
	// are (len(data) if none); a value below pos is stale
	nextSep, nextQuote int
	// joined, when not nil, stands for the next record: a header on two
	// lines, joined (see headerPlan)
	joined []field
}

func newReader(data []byte, sep byte) *reader {
	eol := byte('\n')
	if bytes.IndexByte(data, '\n') < 0 && bytes.IndexByte(data, '\r') >= 0 {
		eol = '\r'
	}
	return &reader{data: data, eol: eol, sep: sep, next: 1, fields: make([]field, 0, 16), nextSep: -1, nextQuote: -1}
}

// read moves to the next record that has a non-empty field; it returns false
// at the end of the text. Trailing empty fields are dropped, so len(fields)
// is the number of the last non-empty field.
//
// A line without quotes is split right here. It is searched with
// bytes.IndexByte only, which is vectorised natively and hand-written for
// WebAssembly, where a byte-by-byte Go loop and every function call cost
// several times more; and the next separator and quote are remembered, so
// that each is searched for once.
func (r *reader) read() (bool, *Error) {
	ok, err := r.record()
	if r.joined != nil && ok && err == nil {
		r.fields, r.joined = append(r.fields[:0], r.joined...), nil
	}
	return ok, err
}

// record reads the next record as it stands in the text (see read).
func (r *reader) record() (bool, *Error) {
	d := r.data
	for r.pos < len(d) {
		r.line = r.next
		end := len(d)
		if i := bytes.IndexByte(d[r.pos:], r.eol); i >= 0 {
			end = r.pos + i
		}
		if r.nextQuote < r.pos {
			r.nextQuote = len(d)
			if i := bytes.IndexByte(d[r.pos:], '"'); i >= 0 {
				r.nextQuote = r.pos + i
			}
		}
		if r.nextQuote < end {
			if err := r.splitQuoted(); err != nil {
				return false, err
			}
		} else {
			r.fields = r.fields[:0]
			start := r.pos
			for {
				if r.nextSep < start {
					r.nextSep = len(d)
					if i := bytes.IndexByte(d[start:], r.sep); i >= 0 {
						r.nextSep = start + i
					}
				}
				if r.nextSep >= end {
					break
				}
				cell := d[start:r.nextSep]
				if !untrimmed(cell) {
					cell = r.trim(cell)
				}
				r.fields = append(r.fields, field{text: cell})
				start = r.nextSep + 1
			}
			cell := d[start:end]
			if !untrimmed(cell) {
				cell = r.trim(cell)
			}
			r.fields = append(r.fields, field{text: cell})
			r.pos = end + 1
			r.next++
		}
		for n := len(r.fields); n > 0 && len(r.fields[n-1].text) == 0; n-- {
			r.fields = r.fields[:n-1]
		}
		if len(r.fields) > 0 {
			return true, nil
		}
	}
	return false, nil
}

// splitQuoted reads one record starting at pos that may hold quoted fields,
// which may run over several lines.
func (r *reader) splitQuoted() *Error {
	r.fields = r.fields[:0]
	d := r.data
	i := r.pos
	for {
		// skip leading blanks of the field
		start := i
		for i < len(d) && r.isBlank(d[i]) {
			i++
		}
		if i < len(d) && d[i] == '"' {
			i++
			open := i
			escaped := false
			for {
				q := bytes.IndexByte(d[i:], '"')
				if q < 0 {
					return &Error{Line: r.line, Column: len(r.fields) + 1,
						Reason: "a quoted cell is never closed",
						Fix:    "add the closing quote (\") or remove the opening one"}
				}
				i += q + 1
				if i < len(d) && d[i] == '"' {
					escaped = true
					i++
					continue
				}
				break
			}
			text := d[open : i-1]
			r.next += bytes.Count(text, []byte{r.eol})
			for i < len(d) && r.isBlank(d[i]) {
				i++
			}
			r.fields = append(r.fields, field{text: text, escaped: escaped})
			if i < len(d) && d[i] != r.sep && d[i] != r.eol && !(d[i] == '\r' && r.eol == '\n') {
				return &Error{Line: r.line, Column: len(r.fields),
					Reason: "there is text after the closing quote of a cell",
					Fix:    "put the whole cell inside the quotes, or double a quote that belongs to the text (\"\")"}
			}
			for i < len(d) && d[i] == '\r' && r.eol == '\n' {
				i++
			}
		} else {
			j := i
			for j < len(d) && d[j] != r.sep && d[j] != r.eol {
				j++
			}
			r.fields = append(r.fields, field{text: r.trim(d[start:j])})
			i = j
		}
		if i >= len(d) {
			r.pos = len(d)
			r.next++
			return nil
		}
		if d[i] == r.eol {
			r.pos = i + 1
			r.next++
			return nil
		}
		i++ // the separator
	}
}

// untrimmed reports whether a cell starts and ends with a printable ASCII
// character, as most cells do, and so needs no trimming. It is kept small
// enough to inline, with the call to trim left to the rare cell that needs
// it: in WebAssembly a call costs about as much as reading a short cell.
func untrimmed(s []byte) bool {
	n := len(s)
	return n > 0 && s[0] > ' ' && s[n-1] > ' ' && (s[0]|s[n-1]) < 0x80
}

func (r *reader) isBlank(c byte) bool {
	return c == ' ' || (c == '\t' && r.sep != '\t')
}

// trim removes spaces (and tabs when tab is not the separator), a carriage
// return, and no-break spaces (U+00A0) from both ends of a cell.
func (r *reader) trim(s []byte) []byte {
	for len(s) > 0 {
		if r.isBlank(s[0]) || s[0] == '\r' {
			s = s[1:]
		} else if len(s) > 1 && s[0] == 0xC2 && s[1] == 0xA0 {
			s = s[2:]
		} else {
			break
		}
	}
	for n := len(s); n > 0; n = len(s) {
		if r.isBlank(s[n-1]) || s[n-1] == '\r' {
			s = s[:n-1]
		} else if n > 1 && s[n-2] == 0xC2 && s[n-1] == 0xA0 {
			s = s[:n-2]
		} else {
			break
		}
	}
	return s
}

// Record is one record of the text as the reader splits it.
type Record struct {
	Line  int      // 1-based line on which it starts
	Cells []string // its fields, trimmed and unquoted
}

// Records splits the first max records of data with the separator sep
// (0 to detect it), for showing the text as a grid. Where a record cannot be
// split (a quote never closed) it stops and returns the records before.
func Records(data []byte, sep byte, max int) []Record {
	data = bytes.TrimPrefix(data, []byte("\xEF\xBB\xBF"))
	if sep == 0 {
		sep = DetectSeparator(data)
	}
	r := newReader(data, sep)
	var out []Record
	for len(out) < max {
		ok, err := r.read()
		if err != nil || !ok {
			break
		}
		cells := make([]string, len(r.fields))
		for i, f := range r.fields {
			cells[i] = f.String()
		}
		out = append(out, Record{Line: r.line, Cells: cells})
	}
	return out
}
