package table

import (
	"math"
	"strconv"
)

// cellKind says what a trimmed cell holds.
type cellKind uint8

const (
	cellNumber   cellKind = iota // a finite number
	cellMissing                  // empty or a missing marker
	cellText                     // anything else
	cellInfinite                 // an infinity, or a number beyond ±LargestValue
)

// pow10 holds the powers of ten that float64 represents exactly.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// Mark is a character written between the digits of a number: a decimal
// mark or a thousands separator.
type Mark uint8

const (
	NoMark    Mark = iota
	MarkPoint      // "."
	MarkComma      // ","
	MarkSpace      // " ", no-break space U+00A0 or narrow no-break space U+202F
	MarkQuote      // "'" or the right single quotation mark U+2019
	// MarkNone, in Options.Thousands, refuses every thousands separator.
	MarkNone
)

// markAt recognises a mark at s[i:], returning it and its length in bytes.
func markAt(s []byte, i int) (Mark, int) {
	switch s[i] {
	case '.':
		return MarkPoint, 1
	case ',':
		return MarkComma, 1
	case ' ':
		return MarkSpace, 1
	case '\'':
		return MarkQuote, 1
	case 0xC2: // U+00A0
		if i+1 < len(s) && s[i+1] == 0xA0 {
			return MarkSpace, 2
		}
	case 0xE2: // U+202F, U+2019
		if i+2 < len(s) && s[i+1] == 0x80 && (s[i+2] == 0xAF || s[i+2] == 0x99) {
			if s[i+2] == 0xAF {
				return MarkSpace, 3
			}
			return MarkQuote, 3
		}
	}
	return NoMark, 0
}

// form says how a cell wrote its number: which mark it used as the decimal
// mark and which between thousands. One form is ambiguous: one to three
// digits (not led by a zero), a single point or comma, then exactly three
// digits ("52,300", "1.250") is either a decimal or a whole number with a
// thousands separator; the reading decides it on the whole measure (see
// numberReading). The cell's value is then read as the whole number.
type form struct {
	decimal   Mark // the decimal mark used; NoMark for a whole number or an ambiguous cell
	thousands Mark // the thousands separator used; NoMark when none
	ambiguous Mark // MarkPoint or MarkComma for an ambiguous cell
	// ungrouped: four digits or more before the decimal mark with no
	// separator, which a text that groups thousands would not write
	ungrouped bool
}

// maxRuns bounds the digit runs of a grouped number (8 runs reach 10²¹).
const maxRuns = 8

// parseCell classifies a trimmed cell and, for a number, returns its value
// and how it was written.
//
// The accepted grammar is
//
//	[+-] whole [decimal [digits]] [(e|E) [+-] digits]     or     [+-] decimal digits [exponent]
//
// where whole is digits, or one to three digits followed by groups of three
// digits each led by the same thousands separator (comma, point, space,
// no-break space, narrow no-break space, apostrophe), and decimal is a point
// or a comma other than the thousands separator. An exponent is accepted
// only without a thousands separator. So "52,300", "1.234.567,5",
// "1 234,5", "1'234.5", ".5", "+2" and "1.5E1" are numbers, while
// "1,23,456", "1_000", hexadecimal floats and words are text. Special cases:
//
//	"", "NA", "N/A", "NaN", ".", "-" (any letter case) are missing;
//	"inf", "infinity", "∞" with an optional sign, and numbers beyond ±LargestValue, are infinite.
//
// Short numbers (at most 15 digits and a power of ten within ±22)
// are converted exactly as m·10^e or m/10^e, which is correctly rounded because
// both operands are exact in float64 (Clinger 1990, "How to read floating point
// numbers accurately"); anything else goes through strconv.ParseFloat.
func parseCell(s []byte) (v float64, kind cellKind, f form) {
	if len(s) <= 3 && isMissing(s) {
		return 0, cellMissing, f
	}
	i := 0
	neg := false
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		neg = s[i] == '-'
		i++
	}
	// mant collects every digit; it is used only when there are at most 15,
	// so it cannot overflow where it matters.
	var mant uint64
	var runs [maxRuns]int
	var marks [maxRuns - 1]Mark
	start := i
	i, mant = digitRun(s, i, mant)
	runs[0] = i - start
	n := 1 // runs read
	decimalAt := -1
	for i < len(s) && n < maxRuns {
		m, width := markAt(s, i)
		if m == NoMark {
			break
		}
		runStart := i + width
		j, next := digitRun(s, runStart, mant)
		if j == runStart && !(m == MarkPoint || m == MarkComma) {
			break // a thousands separator needs digits after it
		}
		if m == MarkPoint || m == MarkComma {
			decimalAt = i
		}
		marks[n-1], runs[n], mant, i = m, j-runStart, next, j
		n++
	}
	digits := 0
	for _, r := range runs[:n] {
		digits += r
	}
	if digits == 0 {
		if n == 1 && isInfinity(s) {
			return 0, cellInfinite, f
		}
		return 0, cellText, f
	}
	fracDigits := 0
	switch {
	case n == 1:
	case n == 2 && (marks[0] == MarkPoint || marks[0] == MarkComma):
		if runs[0] >= 1 && runs[0] <= 3 && s[start] != '0' && runs[1] == 3 && !exponentAt(s, i) {
			f.ambiguous = marks[0]
			break
		}
		f.decimal, fracDigits = marks[0], runs[1]
	default:
		// thousands separators, then perhaps a different decimal mark
		groups := n - 1
		if last := marks[n-2]; n > 2 && last != marks[0] && (last == MarkPoint || last == MarkComma) {
			f.decimal, fracDigits = last, runs[n-1]
			groups--
		} else {
			decimalAt = -1
		}
		f.thousands = marks[0]
		if runs[0] < 1 || runs[0] > 3 || exponentAt(s, i) {
			return 0, cellText, form{}
		}
		for g := 1; g <= groups; g++ {
			if marks[g-1] != f.thousands || runs[g] != 3 {
				return 0, cellText, form{}
			}
		}
	}
	f.ungrouped = f.thousands == NoMark && f.ambiguous == NoMark && runs[0] >= 4 && s[start] != '0'
	exp := 0
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		i++
		expNeg := false
		if i < len(s) && (s[i] == '+' || s[i] == '-') {
			expNeg = s[i] == '-'
			i++
		}
		expStart := i
		for ; i < len(s) && s[i] >= '0' && s[i] <= '9'; i++ {
			if exp < 100000 {
				exp = exp*10 + int(s[i]-'0')
			}
		}
		if i == expStart {
			return 0, cellText, form{}
		}
		if expNeg {
			exp = -exp
		}
	}
	if i != len(s) {
		return 0, cellText, form{}
	}
	if f.decimal == NoMark {
		decimalAt = -1
	}
	e := exp - fracDigits
	if digits > 15 || e > 22 || e < -22 {
		v, kind = finite(slowParse(s, decimalAt))
		return v, kind, f
	}
	v = float64(mant)
	switch {
	case e > 0:
		v = float64(v * (pow10[e]))
	case e < 0:
		v /= pow10[-e]
	}
	if neg {
		v = -v
	}
	v, kind = finite(v)
	return v, kind, f
}

// exponentAt reports whether an exponent starts at s[i].
func exponentAt(s []byte, i int) bool {
	return i < len(s) && (s[i] == 'e' || s[i] == 'E')
}

// digitRun reads the decimal digits of s from i on into mant, returning the
// position after them.
func digitRun(s []byte, i int, mant uint64) (int, uint64) {
	for ; i < len(s); i++ {
		d := s[i] - '0'
		if d > 9 {
			break
		}
		mant = mant*10 + uint64(d)
	}
	return i, mant
}

// slowParse converts a cell already checked against the grammar: its
// thousands separators are dropped and its decimal mark (at decimalAt, or
// none when -1) becomes a point, in a small stack buffer when the cell fits.
func slowParse(s []byte, decimalAt int) float64 {
	var buf [64]byte
	t := buf[:0]
	for i, c := range s {
		switch {
		case i == decimalAt:
			t = append(t, '.')
		case c >= '0' && c <= '9', c == '+', c == '-', c == 'e', c == 'E':
			t = append(t, c)
		}
	}
	// The grammar was checked, so the only possible error is a range error,
	// for which ParseFloat returns ±Inf or ±0 as the value: finite tells those apart.
	f, _ := strconv.ParseFloat(string(t), 64)
	return f
}

// LargestValue is the largest magnitude a value may have: half the largest
// float64, so that every difference of two values (the Hodges–Lehmann shifts)
// and every sum of two (midpoints of quantiles) is finite. Larger values are
// refused like infinities; no measure that this tool serves comes near.
const LargestValue = math.MaxFloat64 / 2

func finite(f float64) (float64, cellKind) {
	if math.Abs(f) > LargestValue {
		return 0, cellInfinite
	}
	if f == 0 {
		f = 0 // fold -0 into +0 so that equal values rank together
	}
	return f, cellNumber
}

// isMissing reports whether a trimmed cell is one of the missing markers.
func isMissing(s []byte) bool {
	switch len(s) {
	case 0:
		return true
	case 1:
		return s[0] == '.' || s[0] == '-'
	case 2:
		return lower(s[0]) == 'n' && lower(s[1]) == 'a'
	case 3:
		return (lower(s[0]) == 'n' && s[1] == '/' && lower(s[2]) == 'a') ||
			(lower(s[0]) == 'n' && lower(s[1]) == 'a' && lower(s[2]) == 'n')
	}
	return false
}

func isInfinity(s []byte) bool {
	if len(s) > 0 && (s[0] == '+' || s[0] == '-') {
		s = s[1:]
	}
	if string(s) == "∞" {
		return true
	}
	if len(s) != 3 && len(s) != 8 {
		return false
	}
	const word = "infinity"
	for i := range s {
		if lower(s[i]) != word[i] {
			return false
		}
	}
	return true
}

func lower(c byte) byte {
	if c >= 'A' && c <= 'Z' {
		return c + 'a' - 'A'
	}
	return c
}
