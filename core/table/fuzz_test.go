package table

import (
	"bytes"
	"errors"
	"math"
	"reflect"
	"testing"
)

// FuzzParse checks properties of every input: Parse never panics, an error
// is always an *Error, and an accepted table is consistent, finite and the
// same when parsed again.
func FuzzParse(f *testing.F) {
	for _, seed := range []string{
		"A\tB\tC\n1\t2\t3\n4\t\t6\n\t5\t\n7\n",
		"site,minutes\nNorth,3\nSouth,4\nNorth,NA\n",
		"x;y\n1,5;2\nNA;n/a\n2,25;.\n",
		"\"a \"\"q\"\"\",b\n\"1\",2\n",
		"\xEF\xBB\xBFa,b\r\n1,2\r\n",
		"a,b\n1e3,.5\n+2,-0\n",
		"\"open,1\n",
		"a;b\r1;2\r",
		"pay\tgrade\n52,300\t1\n980\t2\n1,234,567.5\t1\n",
		"x;y\n1.234,5;2 300\n3,5;1'000\n",
		"team,never,rarely,often\nNorth,2,5,9\nSouth,6,,7\n",
		"site,minutes,n\nA,12,3\nB,15,2\nA,NA,1\n",
	} {
		f.Add([]byte(seed), uint8(0))
		f.Add([]byte(seed), uint8(131))
	}
	f.Fuzz(func(t *testing.T, data []byte, mode uint8) {
		// the low bits choose the layout, the next the decimal mark, the high ones the thousands separator
		opt := Options{Layout: Layout(mode % 4), Decimal: Mark(mode / 4 % 3), Thousands: Mark(mode / 12 % 6)}
		if mode >= 128 {
			opt.Count = "3" // the third column counts its row
		}
		tab, err := Parse(data, opt)
		if err != nil {
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("Parse error %T %v, want *Error", err, err)
			}
			return
		}
		if len(tab.Values) != len(tab.Groups) || len(tab.Values) != len(tab.Lines) || len(tab.Labels) != len(tab.Missing) {
			t.Fatalf("inconsistent lengths: %d values, %d groups, %d lines, %d labels, %d missing",
				len(tab.Values), len(tab.Groups), len(tab.Lines), len(tab.Labels), len(tab.Missing))
		}
		lines := int32(bytes.Count(data, []byte{'\n'}) + bytes.Count(data, []byte{'\r'}) + 1)
		for i, v := range tab.Values {
			if math.IsNaN(v) || math.IsInf(v, 0) || math.Signbit(v) && v == 0 {
				t.Fatalf("value %d is %v", i, v)
			}
			if g := tab.Groups[i]; g < 0 || int(g) >= len(tab.Labels) {
				t.Fatalf("value %d has group %d of %d", i, g, len(tab.Labels))
			}
			if l := tab.Lines[i]; l < 1 || l > lines {
				t.Fatalf("value %d on line %d of %d", i, l, lines)
			}
		}
		again, err := Parse(data, opt)
		if err != nil || !reflect.DeepEqual(tab, again) {
			t.Fatalf("a second Parse differs: %v", err)
		}
	})
}
