// Package jsonlite writes and reads the JSON that Midrank exchanges, without
// reflection: encoding/json would add about 0.4 MB (0.1 MB gzip) to the
// WebAssembly module, and the shapes here are few and fixed. Output matches
// encoding/json with HTML escaping off, byte for byte (the tests compare).
package jsonlite

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"unicode/utf8"
)

// Writer appends JSON to a buffer. Objects and arrays keep track of their
// commas: call Key before each member of an object.
type Writer struct {
	b     []byte
	first []bool // per open object or array: no member written yet
	key   string // the last member name, for the error
	err   error
}

// NotFiniteError reports that a NaN or an infinity was to be written; JSON
// has no such numbers, so the Writer put null in its place.
type NotFiniteError struct {
	Key   string // the member it was written for, or the last one before it
	Value float64
}

func (e *NotFiniteError) Error() string {
	return fmt.Sprintf("internal error: %q would be %v, which JSON cannot hold", e.Key, e.Value)
}

// Err returns the first NotFiniteError met, or nil.
func (w *Writer) Err() error { return w.err }

// Grow makes room for n more bytes, saving the copies of growing by steps.
func (w *Writer) Grow(n int) { w.b = slices.Grow(w.b, n) }

// Bytes returns what was written.
func (w *Writer) Bytes() []byte { return w.b }

func (w *Writer) comma() {
	if n := len(w.first); n > 0 {
		if !w.first[n-1] {
			w.b = append(w.b, ',')
		}
		w.first[n-1] = false
	}
}

// BeginObject opens an object as the next value.
func (w *Writer) BeginObject() { w.comma(); w.b = append(w.b, '{'); w.first = append(w.first, true) }

// EndObject closes it.
func (w *Writer) EndObject() { w.first = w.first[:len(w.first)-1]; w.b = append(w.b, '}') }

// BeginArray opens an array as the next value.
func (w *Writer) BeginArray() { w.comma(); w.b = append(w.b, '['); w.first = append(w.first, true) }

// EndArray closes it.
func (w *Writer) EndArray() { w.first = w.first[:len(w.first)-1]; w.b = append(w.b, ']') }

// Key writes a member name; the member's value follows.
func (w *Writer) Key(name string) {
	w.comma()
	w.b = AppendString(w.b, name)
	w.b = append(w.b, ':')
	w.key = name
	w.first[len(w.first)-1] = true // the value that follows takes no comma; the next Key does
}

// Raw writes a value that is already JSON.
func (w *Writer) Raw(json []byte) { w.comma(); w.b = append(w.b, json...) }

// String writes a string value.
func (w *Writer) String(s string) { w.comma(); w.b = AppendString(w.b, s) }

// Float writes a finite number as encoding/json does: the shortest decimal
// that reads back the same, with an exponent below 1e-6 and from 1e21. A NaN
// or an infinity is written as null, and Err reports it.
func (w *Writer) Float(f float64) { w.comma(); w.b = w.AppendFloat(w.b, f) }

// AppendFloat appends f to b as Float writes it, for a value built in a
// scratch buffer and written with Raw.
func (w *Writer) AppendFloat(b []byte, f float64) []byte {
	if math.IsNaN(f) || math.IsInf(f, 0) {
		if w.err == nil {
			w.err = &NotFiniteError{Key: w.key, Value: f}
		}
		return append(b, "null"...)
	}
	return appendFloat(b, f)
}

// Int writes a whole number.
func (w *Writer) Int(i int64) { w.comma(); w.b = strconv.AppendInt(w.b, i, 10) }

// Uint writes a non-negative whole number.
func (w *Writer) Uint(i uint64) { w.comma(); w.b = strconv.AppendUint(w.b, i, 10) }

// Bool writes true or false.
func (w *Writer) Bool(v bool) { w.comma(); w.b = strconv.AppendBool(w.b, v) }

// Null writes null.
func (w *Writer) Null() { w.comma(); w.b = append(w.b, "null"...) }

// OptFloat writes *f, or null when f is nil.
func (w *Writer) OptFloat(f *float64) {
	if f == nil {
		w.Null()
		return
	}
	w.Float(*f)
}

// OptString writes *s, or null when s is nil.
func (w *Writer) OptString(s *string) {
	if s == nil {
		w.Null()
		return
	}
	w.String(*s)
}

// OptInt writes *i, or null when i is nil.
func (w *Writer) OptInt(i *int) {
	if i == nil {
		w.Null()
		return
	}
	w.Int(int64(*i))
}

// Members of objects: a name and its value in one call.

// Strings writes an array of strings.
func (w *Writer) Strings(items []string) {
	w.BeginArray()
	for _, s := range items {
		w.String(s)
	}
	w.EndArray()
}

// Fields writes an object of strings, its members in order.
func (w *Writer) Fields(fields []Field) {
	w.BeginObject()
	for _, f := range fields {
		w.StringMember(f.Name, f.Text)
	}
	w.EndObject()
}

// FloatMember writes "name": f.
func (w *Writer) FloatMember(name string, f float64) { w.Key(name); w.Float(f) }

// IntMember writes "name": i.
func (w *Writer) IntMember(name string, i int) { w.Key(name); w.Int(int64(i)) }

// StringMember writes "name": s.
func (w *Writer) StringMember(name, s string) { w.Key(name); w.String(s) }

// BoolMember writes "name": v.
func (w *Writer) BoolMember(name string, v bool) { w.Key(name); w.Bool(v) }

// OptFloatMember writes "name": *f, or null.
func (w *Writer) OptFloatMember(name string, f *float64) { w.Key(name); w.OptFloat(f) }

// appendFloat formats a finite f as encoding/json does (its floatEncoder for
// 64 bits).
func appendFloat(b []byte, f float64) []byte {
	abs := math.Abs(f)
	format := byte('f')
	if abs != 0 && (abs < 1e-6 || abs >= 1e21) {
		format = 'e'
	}
	b = strconv.AppendFloat(b, f, format, -1, 64)
	if format == 'e' {
		// clean up e-09 to e-9
		n := len(b)
		if n >= 4 && b[n-4] == 'e' && b[n-3] == '-' && b[n-2] == '0' {
			b[n-2] = b[n-1]
			b = b[:n-1]
		}
	}
	return b
}

const hex = "0123456789abcdef"

// AppendString quotes s as encoding/json does with HTML escaping off:
// quote, backslash and control characters escaped, invalid UTF-8 as
// U+FFFD, and U+2028 and U+2029 escaped for JavaScript.
func AppendString(b []byte, s string) []byte {
	b = append(b, '"')
	start := 0
	for i := 0; i < len(s); {
		if c := s[i]; c < utf8.RuneSelf {
			if c >= 0x20 && c != '"' && c != '\\' {
				i++
				continue
			}
			b = append(b, s[start:i]...)
			switch c {
			case '\\', '"':
				b = append(b, '\\', c)
			case '\b':
				b = append(b, '\\', 'b')
			case '\f':
				b = append(b, '\\', 'f')
			case '\n':
				b = append(b, '\\', 'n')
			case '\r':
				b = append(b, '\\', 'r')
			case '\t':
				b = append(b, '\\', 't')
			default:
				b = append(b, '\\', 'u', '0', '0', hex[c>>4], hex[c&0xF])
			}
			i++
			start = i
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			b = append(b, s[start:i]...)
			b = append(b, `\ufffd`...)
			i += size
			start = i
			continue
		}
		if r == '\u2028' || r == '\u2029' {
			b = append(b, s[start:i]...)
			b = append(b, '\\', 'u', '2', '0', '2', hex[r&0xF])
			i += size
			start = i
			continue
		}
		i += size
	}
	b = append(b, s[start:]...)
	return append(b, '"')
}
