package sheet

import (
	"bytes"
	"strconv"
	"unicode/utf8"
)

// xmlScanner walks the tags of an XML document (XML 1.0, §3) and the text
// between them: enough for the parts of a spreadsheet file, and several
// times faster than encoding/xml, whose tokens allocate. Names are compared
// without their namespace prefix ("x:c" is "c"); comments, processing
// instructions and the document type are skipped; CDATA sections are text.
type xmlScanner struct {
	b []byte
	i int
}

// tag is one start, end or empty-element tag.
type tag struct {
	name  []byte // local name, without prefix
	attrs []byte // the raw attributes
	end   bool   // </name>
	empty bool   // <name/>
}

// next moves to the next tag, collecting the text before it into text
// when text is not nil; it reports false at the end of the document.
func (s *xmlScanner) next(text *[]byte) (tag, bool) {
	for {
		lt := bytes.IndexByte(s.b[s.i:], '<')
		if lt < 0 {
			if text != nil {
				*text = appendText(*text, s.b[s.i:])
			}
			s.i = len(s.b)
			return tag{}, false
		}
		if text != nil {
			*text = appendText(*text, s.b[s.i:s.i+lt])
		}
		s.i += lt
		rest := s.b[s.i:]
		if len(rest) > 1 && rest[1] != '!' && rest[1] != '?' {
			return s.readTag(), true
		}
		switch {
		case bytes.HasPrefix(rest, []byte("<!--")):
			s.skipPast("-->")
			continue
		case bytes.HasPrefix(rest, []byte("<![CDATA[")):
			end := bytes.Index(rest, []byte("]]>"))
			if end < 0 {
				end = len(rest)
			}
			if text != nil {
				*text = append(*text, rest[9:end]...)
			}
			s.i += min(end+3, len(rest))
			continue
		case bytes.HasPrefix(rest, []byte("<?")):
			s.skipPast("?>")
			continue
		case bytes.HasPrefix(rest, []byte("<!")):
			s.skipPast(">")
			continue
		}
		return s.readTag(), true
	}
}

// skipPast moves past the next occurrence of end, or to the end.
func (s *xmlScanner) skipPast(end string) {
	k := bytes.Index(s.b[s.i:], []byte(end))
	if k < 0 {
		s.i = len(s.b)
		return
	}
	s.i += k + len(end)
}

// readTag reads the tag at s.i, which starts with '<'.
func (s *xmlScanner) readTag() tag {
	var t tag
	i := s.i + 1
	if i < len(s.b) && s.b[i] == '/' {
		t.end = true
		i++
	}
	start := i
	for i < len(s.b) && !isSpace(s.b[i]) && s.b[i] != '>' && s.b[i] != '/' {
		i++
	}
	t.name = localName(s.b[start:i])
	attrStart := i
	// the tag ends at the first '>' outside quoted attribute values
	for ; i < len(s.b); i++ {
		c := s.b[i]
		if c == '>' {
			break
		}
		if c == '"' || c == '\'' {
			end := bytes.IndexByte(s.b[i+1:], c)
			if end < 0 {
				i = len(s.b)
				break
			}
			i += end + 1
		}
	}
	attrEnd := i
	if attrEnd > attrStart && s.b[attrEnd-1] == '/' {
		t.empty = true
		attrEnd--
	}
	t.attrs = s.b[attrStart:attrEnd]
	s.i = min(i+1, len(s.b))
	return t
}

// is reports whether the tag has the local name.
func (t tag) is(name string) bool { return string(t.name) == name }

// attr finds an attribute by local name and returns its value decoded.
func (t tag) attr(name string) (string, bool) {
	for key, value, i, ok := t.nextAttr(0); ok; key, value, i, ok = t.nextAttr(i) {
		if string(key) != name {
			continue
		}
		if bytes.IndexByte(value, '&') < 0 {
			return string(value), true
		}
		return string(appendText(nil, value)), true
	}
	return "", false
}

// nextAttr reads the attribute at or after i in the tag's attributes: its
// local name, its raw value and where the next one starts; ok is false at
// the end (or where the attributes cannot be read further).
func (t tag) nextAttr(i int) (key, value []byte, next int, ok bool) {
	a := t.attrs
	for i < len(a) && isSpace(a[i]) {
		i++
	}
	keyStart := i
	for i < len(a) && a[i] != '=' && !isSpace(a[i]) {
		i++
	}
	key = localName(a[keyStart:i])
	for i < len(a) && isSpace(a[i]) {
		i++
	}
	if i >= len(a) || a[i] != '=' {
		return nil, nil, 0, false
	}
	i++
	for i < len(a) && isSpace(a[i]) {
		i++
	}
	if i >= len(a) || (a[i] != '"' && a[i] != '\'') {
		return nil, nil, 0, false
	}
	quote := a[i]
	valueStart := i + 1
	end := bytes.IndexByte(a[valueStart:], quote)
	if end < 0 {
		return nil, nil, 0, false
	}
	return key, a[valueStart : valueStart+end], valueStart + end + 1, true
}

func localName(name []byte) []byte {
	for k, c := range name {
		if c == ':' {
			return name[k+1:]
		}
	}
	return name
}

func isSpace(c byte) bool { return c == ' ' || c == '\t' || c == '\r' || c == '\n' }

// appendText appends character data with its references decoded: the five
// predefined entities and numeric character references (XML 1.0, §4.1,
// §4.6). An unknown or malformed reference is kept as written.
func appendText(dst, src []byte) []byte {
	for {
		amp := bytes.IndexByte(src, '&')
		if amp < 0 {
			return append(dst, src...)
		}
		dst = append(dst, src[:amp]...)
		src = src[amp:]
		semi := bytes.IndexByte(src, ';')
		if semi < 0 || semi > 12 {
			dst = append(dst, '&')
			src = src[1:]
			continue
		}
		ref := string(src[1:semi])
		switch ref {
		case "lt":
			dst = append(dst, '<')
		case "gt":
			dst = append(dst, '>')
		case "amp":
			dst = append(dst, '&')
		case "quot":
			dst = append(dst, '"')
		case "apos":
			dst = append(dst, '\'')
		default:
			r, ok := charRef(ref)
			if !ok {
				dst = append(dst, src[:semi+1]...)
				break
			}
			dst = utf8.AppendRune(dst, r)
		}
		src = src[semi+1:]
	}
}

// charRef decodes "#65" or "#x41".
func charRef(ref string) (rune, bool) {
	if len(ref) < 2 || ref[0] != '#' {
		return 0, false
	}
	base, digits := 10, ref[1:]
	if digits[0] == 'x' {
		base, digits = 16, digits[1:]
	}
	n, err := strconv.ParseUint(digits, base, 32)
	if err != nil || n > utf8.MaxRune {
		return 0, false
	}
	return rune(n), true
}
