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

// parseCell classifies a trimmed cell and, for a number, returns its value.
// comma says whether ',' is accepted as the decimal mark. usedComma reports
// that the number was written with a decimal comma.
//
// The accepted grammar is the plain decimal form
//
//	[+-] (digits [mark [digits]] | mark digits) [(e|E) [+-] digits]
//
// so ".5", "+2", "1e3" and "1.5E1" are numbers, while hexadecimal floats,
// digit separators ("1_000", "1,000.5") and words are text. Special cases:
//
//	"", "NA", "N/A", "NaN", ".", "-" (any letter case) are missing;
//	"inf", "infinity", "∞" with an optional sign, and numbers beyond ±LargestValue, are infinite.
//
// Short numbers (at most 15 digits and a power of ten within ±22)
// are converted exactly as m·10^e or m/10^e, which is correctly rounded because
// both operands are exact in float64 (Clinger 1990, "How to read floating point
// numbers accurately"); anything else goes through strconv.ParseFloat.
func parseCell(s []byte, comma bool) (v float64, kind cellKind, usedComma bool) {
	if len(s) <= 3 && isMissing(s) {
		return 0, cellMissing, false
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
	start := i
	i, mant = digitRun(s, i, mant)
	digits, fracDigits := i-start, 0
	markAt := -1
	if i < len(s) && (s[i] == '.' || (comma && s[i] == ',')) {
		markAt = i
		fracStart := i + 1
		i, mant = digitRun(s, fracStart, mant)
		fracDigits = i - fracStart
		digits += fracDigits
	}
	if digits == 0 {
		if isInfinity(s) {
			return 0, cellInfinite, false
		}
		return 0, cellText, false
	}
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
			return 0, cellText, false
		}
		if expNeg {
			exp = -exp
		}
	}
	if i != len(s) {
		return 0, cellText, false
	}
	usedComma = markAt >= 0 && s[markAt] == ','
	e := exp - fracDigits
	if digits > 15 || e > 22 || e < -22 {
		return finite(slowParse(s, markAt), usedComma)
	}
	f := float64(mant)
	switch {
	case e > 0:
		f = float64(f * (pow10[e]))
	case e < 0:
		f /= pow10[-e]
	}
	if neg {
		f = -f
	}
	return finite(f, usedComma)
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

// slowParse converts a cell already checked against the grammar; a decimal
// comma is replaced in a small stack buffer so that no cell is copied to the heap.
func slowParse(s []byte, markAt int) float64 {
	var buf [64]byte
	t := s
	if markAt >= 0 && s[markAt] == ',' {
		t = append(buf[:0], s...)
		t[markAt] = '.'
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

func finite(f float64, usedComma bool) (float64, cellKind, bool) {
	if math.Abs(f) > LargestValue {
		return 0, cellInfinite, false
	}
	if f == 0 {
		f = 0 // fold -0 into +0 so that equal values rank together
	}
	return f, cellNumber, usedComma
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
