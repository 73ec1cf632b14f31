// Package display is the one policy for showing numbers to people: how
// many digits, when in powers of ten. The page, the reports, the command
// line's text and the plain-language decision all show numbers through it;
// CSV and JSON keep full precision.
package display

import (
	"math"
	"strconv"
	"strings"
)

// Show is a way of showing a value to people.
type Show int

const (
	// Text is shown as it is: labels, words, letters.
	Text Show = iota
	// Count is a whole number: values, missing values, degrees of freedom,
	// with a comma between thousands (1,300).
	Count
	// Figure has 4 significant digits, in powers of ten below 0.0001 and from
	// a million up (a statistic, a median, a rank).
	Figure
	// PValue is a p-value as APA 7 writes it (American Psychological
	// Association, Publication Manual, 7th ed., 2020, 6.36): three decimals
	// without the leading zero (.014), "< .001" below .001 and "> .999"
	// above .999. Where three decimals would carry p across .01, .05 or .10,
	// the common significance levels (p ≤ level counting as significant),
	// decimals are added until it does not (.0504, not .050), so that the
	// figure never contradicts the decision.
	PValue
	// Share is a proportion from 0 to 1 with 3 decimals (a share of a group).
	Share
	// Statistic is a test statistic with 2 decimals (H, z, t), as APA 7
	// reports them.
	Statistic
	// Effect is an effect size with 2 decimals (ε², Cliff's δ, the
	// probability of superiority), as APA 7 reports them.
	Effect
	// Flag is a yes or a no.
	Flag
	// AsRead is a value with every digit it was read with (the shortest
	// decimal that reads back as the same number): the values and ranks
	// an auditor checks one by one.
	AsRead
)

// showNames are the keys of Show in JSON, in the order of the constants.
var showNames = [...]string{"text", "count", "figure", "p", "share", "statistic", "effect", "flag", "as-read"}

// ShowNames are the keys of every Show in JSON.
func ShowNames() []string { return showNames[:] }

// String is the key of s in JSON.
func (s Show) String() string { return showNames[s] }

// Format shows v, a float64, int, string, bool or nil (an undefined
// figure, shown as "undefined").
func (s Show) Format(v any) string {
	switch v := v.(type) {
	case nil:
		return "undefined"
	case string:
		return v
	case bool:
		if v {
			return "yes"
		}
		return "no"
	case int:
		if s == Count {
			return Thousands(int64(v))
		}
		return strconv.Itoa(v)
	case float64:
		return s.number(v)
	}
	panic("display: cannot show a value of this type")
}

func (s Show) number(v float64) string {
	switch s {
	case Count:
		if math.Abs(v) < 1e15 {
			return Thousands(int64(math.Round(v)))
		}
		return strconv.FormatFloat(math.Round(v), 'f', 0, 64)
	case Share:
		return decimals(v, 3)
	case PValue:
		return apaP(v)
	case Statistic, Effect:
		return decimals(v, 2)
	case AsRead:
		return strconv.FormatFloat(v, 'g', -1, 64)
	}
	return significant(v, 4, 1e6)
}

// apaP writes p as APA 7 does; see PValue.
func apaP(p float64) string {
	switch {
	case p < 0.001:
		return "< .001"
	case p > 0.999:
		return "> .999"
	}
	digits := 3
	for digits < 15 && crossesLevel(p, digits) {
		digits++
	}
	return strings.TrimPrefix(strconv.FormatFloat(p, 'f', digits, 64), "0")
}

// crossesLevel reports whether p rounded to the given decimals lies on the
// other side of .01, .05 or .10 than p, a side counting the level itself as
// significant (p ≤ level, report.Significant's rule).
func crossesLevel(p float64, digits int) bool {
	rounded, _ := strconv.ParseFloat(strconv.FormatFloat(p, 'f', digits, 64), 64)
	for _, level := range [...]float64{0.01, 0.05, 0.10} {
		if (p <= level) != (rounded <= level) {
			return true
		}
	}
	return false
}

// decimals writes v with a fixed number of decimals, without a minus sign
// before a zero (-0.001 to 2 decimals is 0.00).
func decimals(v float64, n int) string {
	s := strconv.FormatFloat(v, 'f', n, 64)
	if strings.Trim(s, "-0.") == "" {
		return strings.TrimPrefix(s, "-")
	}
	return s
}

// Thousands writes a whole number with a comma between thousands: 1,300,
// -52,300.
func Thousands(v int64) string {
	s := strconv.FormatInt(v, 10)
	sign := ""
	if v < 0 {
		sign, s = "-", s[1:]
	}
	var b strings.Builder
	b.WriteString(sign)
	for i, c := range s {
		if i > 0 && (len(s)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(c)
	}
	return b.String()
}

// significant shows v with the given significant digits, in powers of ten
// (1.235e-5) below 0.0001 and from large up; trailing zeros are dropped.
func significant(v float64, digits int, large float64) string {
	if a := math.Abs(v); a != 0 && (a < 1e-4 || a >= large) {
		s := strconv.FormatFloat(v, 'e', digits-1, 64)
		mantissa, exp, _ := strings.Cut(s, "e")
		if strings.Contains(mantissa, ".") {
			mantissa = strings.TrimRight(strings.TrimRight(mantissa, "0"), ".")
		}
		sign := exp[:1]
		if sign == "+" {
			sign = ""
		}
		return mantissa + "e" + sign + strings.TrimLeft(exp[1:], "0")
	}
	rounded, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'e', digits-1, 64), 64)
	return strconv.FormatFloat(rounded, 'f', -1, 64)
}

// Rough writes a large count roughly, in words a reader takes in at once:
// whole numbers below a million with commas (52,300), then two significant
// digits with million, billion or trillion (8.8 million, 880 million), and
// powers of ten beyond (3.1e+15).
func Rough(v float64) string {
	if v < 1e6 {
		return Thousands(int64(math.Round(v)))
	}
	for _, unit := range []struct {
		size float64
		name string
	}{{1e12, "trillion"}, {1e9, "billion"}, {1e6, "million"}} {
		if r := roundSignificant(v/unit.size, 2); r >= 1 && r < 1000 {
			return strconv.FormatFloat(r, 'f', -1, 64) + " " + unit.name
		}
	}
	return strconv.FormatFloat(v, 'g', 2, 64)
}

// roundSignificant rounds v to the given significant digits.
func roundSignificant(v float64, digits int) float64 {
	r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', digits, 64), 64)
	return r
}
