package sheet

// The usual forms of a worksheet's rows and cells, which make up most of a
// sheet, read in one pass each without the general tag reader (xml.go);
// FuzzPlainCells checks that they read as it would.

// plainCellForm is a cell in its usual form, "<c r="B7" s="1" t="s"><v>3</v></c>"
// or "<c r="B7"/>": its reference, style index and type (each nil when
// absent) and its value as written, which holds no reference to decode.
type plainCellForm struct {
	ref, style, kind, value []byte
	hasValue                bool
}

// plainCell reads, when the scanner stands (after white space) at a cell
// in its usual form, the whole cell in one pass and moves past it; it
// reports false, leaving the scanner where it was, for any other form
// (a formula, inline text, an escaped value, another tag), which the
// general tag reader reads. It does the work of most of a sheet, so it
// scans bytes itself rather than calling helpers.
func (s *xmlScanner) plainCell() (plainCellForm, bool) {
	var c plainCellForm
	attrs, end, ok := s.plainStart("c")
	if !ok {
		return c, false
	}
	c.ref, c.style, c.kind = attrs[0], attrs[1], attrs[2]
	b, i := s.b, end
	if b[i-2] == '/' { // <c …/>
		s.i = i
		return c, true
	}
	if i+3 > len(b) || b[i] != '<' || b[i+1] != 'v' || b[i+2] != '>' {
		return c, false
	}
	start := i + 3
	for i = start; i < len(b) && b[i] != '<'; i++ {
		if b[i] == '&' {
			return c, false
		}
	}
	const closing = "</v></c>"
	if i+len(closing) > len(b) || string(b[i:i+len(closing)]) != closing {
		return c, false
	}
	c.value, c.hasValue = b[start:i], true
	s.i = i + len(closing)
	return c, true
}

// plainRowStart reads, when the scanner stands (after white space) at a
// row's start tag with plain attributes, its r attribute (nil when absent)
// and moves past it.
func (s *xmlScanner) plainRowStart() ([]byte, bool) {
	attrs, end, ok := s.plainStart("row")
	if !ok || s.b[end-2] == '/' {
		return nil, false
	}
	s.i = end
	return attrs[0], true
}

// plainStart reads, when the scanner stands (after white space) at the
// start tag <name …> or <name …/> without a namespace prefix, in which
// every attribute is key="value" or key='value' without references and
// none of r, s and t is given twice, the values of its attributes r, s and
// t (nil when absent) and where the tag ends (just past its '>'), without
// moving the scanner.
func (s *xmlScanner) plainStart(name string) (attrs [3][]byte, end int, ok bool) {
	b, i := s.b, skipSpace(s.b, s.i)
	n := len(name)
	if i+n+1 >= len(b) || b[i] != '<' || string(b[i+1:i+1+n]) != name {
		return attrs, 0, false
	}
	afterName := i + 1 + n
	for i = afterName; i < len(b); {
		switch b[i] {
		case ' ', '\t', '\r', '\n':
			i++
			continue
		case '>':
			return attrs, i + 1, true
		case '/':
			if i+1 < len(b) && b[i+1] == '>' {
				return attrs, i + 2, true
			}
			return attrs, 0, false
		}
		if i == afterName { // the name goes on: another tag, such as <col> for <c>
			return attrs, 0, false
		}
		key := i
		for i < len(b) && b[i] != '=' && b[i] != '>' && b[i] != ' ' {
			i++
		}
		if i+1 >= len(b) || b[i] != '=' || b[i+1] != '"' && b[i+1] != '\'' {
			return attrs, 0, false
		}
		k, quote := localName(b[key:i]), b[i+1]
		i += 2
		value := i
		for i < len(b) && b[i] != quote {
			if b[i] == '&' { // a reference to decode: the general reader's work
				return attrs, 0, false
			}
			i++
		}
		if i >= len(b) {
			return attrs, 0, false
		}
		j := -1
		if len(k) == 1 {
			switch k[0] {
			case 'r':
				j = 0
			case 's':
				j = 1
			case 't':
				j = 2
			}
		}
		if j >= 0 {
			if attrs[j] != nil { // given twice: the general reader decides
				return attrs, 0, false
			}
			attrs[j] = b[value:i]
		}
		i++
	}
	return attrs, 0, false
}

// plainEnd moves past the end tag </name> when the scanner stands at it
// (after white space), and reports whether it did.
func (s *xmlScanner) plainEnd(name string) bool {
	b, i := s.b, skipSpace(s.b, s.i)
	n := len(name)
	if i+n+3 > len(b) || b[i] != '<' || b[i+1] != '/' || string(b[i+2:i+2+n]) != name || b[i+2+n] != '>' {
		return false
	}
	s.i = i + n + 3
	return true
}

// skipSpace gives the index of the first byte at or after i that is not
// XML white space.
func skipSpace(b []byte, i int) int {
	for i < len(b) && isSpace(b[i]) {
		i++
	}
	return i
}
