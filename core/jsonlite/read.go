package jsonlite

import (
	"fmt"
	"strconv"
	"unicode/utf16"
	"unicode/utf8"
)

// Kind is the type of a JSON value.
type Kind uint8

const (
	Null Kind = iota
	Bool
	Number
	String
	List   // an array of strings
	Record // an object whose members are strings
	Array  // a nested array of any values (a Node, see ParseTree)
	Object // a nested object of any values (a Node)
)

var kindNames = [...]string{"null", "bool", "number", "string", "list", "record", "array", "object"}

func (k Kind) String() string { return kindNames[k] }

// Value is a JSON value of Midrank's requests: a scalar with its text (the
// string's contents, the number as written, "true" or "false"), an array of
// strings in Items, or an object of strings in Fields, in order.
type Value struct {
	Kind   Kind
	Text   string
	Items  []string
	Fields []Field
}

// Field is one member of a Record.
type Field struct{ Name, Text string }

// ParseObject reads a JSON object whose members are scalars (strings,
// numbers, booleans, null), arrays of strings, or objects whose members are
// strings: the shape of Midrank's options and requests. Members keep their
// order; a repeated name is an error, as is anything after the object but
// white space.
func ParseObject(data []byte) ([]string, map[string]Value, error) {
	p := parser{s: data}
	var names []string
	values := map[string]Value{}
	err := p.object(func(name string) error {
		if _, dup := values[name]; dup {
			return p.fail(fmt.Sprintf("the member %q appears twice", name))
		}
		v, err := p.value()
		names = append(names, name)
		values[name] = v
		return err
	})
	if err != nil {
		return nil, nil, err
	}
	p.space()
	if p.i != len(p.s) {
		return nil, nil, p.fail("unexpected text after the object")
	}
	return names, values, nil
}

// object reads {"name": value, ...}, calling member after each name and its
// colon to read the value.
func (p *parser) object(member func(name string) error) error {
	p.space()
	if !p.eat('{') {
		return p.fail("expected an object")
	}
	p.space()
	if p.eat('}') {
		return nil
	}
	for {
		p.space()
		name, err := p.string()
		if err != nil {
			return err
		}
		p.space()
		if !p.eat(':') {
			return p.fail("expected ':' after a member name")
		}
		p.space()
		if err := member(name); err != nil {
			return err
		}
		p.space()
		if p.eat('}') {
			return nil
		}
		if !p.eat(',') {
			return p.fail("expected ',' or '}'")
		}
	}
}

// value reads a member of the top-level object.
func (p *parser) value() (Value, error) {
	switch {
	case p.i < len(p.s) && p.s[p.i] == '[':
		return p.list()
	case p.i < len(p.s) && p.s[p.i] == '{':
		v := Value{Kind: Record}
		seen := map[string]bool{}
		err := p.object(func(name string) error {
			if seen[name] {
				return p.fail(fmt.Sprintf("the member %q appears twice", name))
			}
			seen[name] = true
			text, err := p.string()
			v.Fields = append(v.Fields, Field{name, text})
			return err
		})
		return v, err
	}
	return p.scalar()
}

// list reads an array of strings.
func (p *parser) list() (Value, error) {
	v := Value{Kind: List, Items: []string{}}
	p.eat('[')
	p.space()
	if p.eat(']') {
		return v, nil
	}
	for {
		p.space()
		s, err := p.string()
		if err != nil {
			return v, err
		}
		v.Items = append(v.Items, s)
		p.space()
		if p.eat(']') {
			return v, nil
		}
		if !p.eat(',') {
			return v, p.fail("expected ',' or ']'")
		}
	}
}

type parser struct {
	s []byte
	i int
}

func (p *parser) fail(what string) error {
	return fmt.Errorf("%s at offset %d", what, p.i)
}

func (p *parser) space() {
	for p.i < len(p.s) && (p.s[p.i] == ' ' || p.s[p.i] == '\t' || p.s[p.i] == '\n' || p.s[p.i] == '\r') {
		p.i++
	}
}

func (p *parser) eat(c byte) bool {
	if p.i < len(p.s) && p.s[p.i] == c {
		p.i++
		return true
	}
	return false
}

func (p *parser) literal(word string) bool {
	if len(p.s)-p.i >= len(word) && string(p.s[p.i:p.i+len(word)]) == word {
		p.i += len(word)
		return true
	}
	return false
}

func (p *parser) scalar() (Value, error) {
	if p.i >= len(p.s) {
		return Value{}, p.fail("expected a value")
	}
	switch c := p.s[p.i]; {
	case c == '"':
		s, err := p.string()
		return Value{Kind: String, Text: s}, err
	case p.literal("true"):
		return Value{Kind: Bool, Text: "true"}, nil
	case p.literal("false"):
		return Value{Kind: Bool, Text: "false"}, nil
	case p.literal("null"):
		return Value{Kind: Null, Text: "null"}, nil
	case c == '-' || (c >= '0' && c <= '9'):
		return p.number()
	case c == '{' || c == '[':
		return Value{}, p.fail("objects and arrays nest only one level, and hold only strings")
	}
	return Value{}, p.fail("expected a value")
}

// number checks the JSON number grammar: -? (0 | [1-9][0-9]*) (. [0-9]+)? ([eE] [+-]? [0-9]+)?
// and that the number fits a float64 (RFC 8259 §6 leaves larger ones to the
// implementation; encoding/json refuses them too).
func (p *parser) number() (Value, error) {
	start := p.i
	p.eat('-')
	digits := func() int {
		n := 0
		for p.i < len(p.s) && p.s[p.i] >= '0' && p.s[p.i] <= '9' {
			p.i++
			n++
		}
		return n
	}
	if p.eat('0') {
		// no more integer digits after a leading zero
	} else if digits() == 0 {
		return Value{}, p.fail("malformed number")
	}
	if p.eat('.') && digits() == 0 {
		return Value{}, p.fail("malformed number")
	}
	if p.eat('e') || p.eat('E') {
		if !p.eat('+') {
			p.eat('-')
		}
		if digits() == 0 {
			return Value{}, p.fail("malformed number")
		}
	}
	text := string(p.s[start:p.i])
	if _, err := strconv.ParseFloat(text, 64); err != nil {
		p.i = start
		return Value{}, p.fail("number too large")
	}
	return Value{Kind: Number, Text: text}, nil
}

func (p *parser) string() (string, error) {
	if !p.eat('"') {
		return "", p.fail("expected a string")
	}
	var b []byte
	for {
		if p.i >= len(p.s) {
			return "", p.fail("unterminated string")
		}
		c := p.s[p.i]
		switch {
		case c == '"':
			p.i++
			return string(b), nil
		case c < 0x20:
			return "", p.fail("control character in a string")
		case c == '\\':
			p.i++
			if p.i >= len(p.s) {
				return "", p.fail("unterminated string")
			}
			e := p.s[p.i]
			p.i++
			switch e {
			case '"', '\\', '/':
				b = append(b, e)
			case 'b':
				b = append(b, '\b')
			case 'f':
				b = append(b, '\f')
			case 'n':
				b = append(b, '\n')
			case 'r':
				b = append(b, '\r')
			case 't':
				b = append(b, '\t')
			case 'u':
				r, ok := p.hex4()
				if !ok {
					return "", p.fail("malformed \\u escape")
				}
				if utf16.IsSurrogate(r) {
					// as encoding/json: a valid pair makes one rune; otherwise
					// U+FFFD, and what follows is read on its own
					pair := utf8.RuneError
					if save := p.i; p.literal(`\u`) {
						if lo, ok := p.hex4(); ok {
							pair = utf16.DecodeRune(r, lo)
						}
						if pair == utf8.RuneError {
							p.i = save
						}
					}
					r = pair
				}
				b = utf8.AppendRune(b, r)
			default:
				return "", p.fail("unknown escape in a string")
			}
		default:
			r, size := utf8.DecodeRune(p.s[p.i:])
			if r == utf8.RuneError && size == 1 {
				b = append(b, "\uFFFD"...)
			} else {
				b = append(b, p.s[p.i:p.i+size]...)
			}
			p.i += size
		}
	}
}

func (p *parser) hex4() (rune, bool) {
	if len(p.s)-p.i < 4 {
		return 0, false
	}
	v, err := strconv.ParseUint(string(p.s[p.i:p.i+4]), 16, 32)
	if err != nil {
		return 0, false
	}
	p.i += 4
	return rune(v), true
}
