//go:build !wasm

package table

import (
	"fmt"
	"reflect"
	"strings"
	"testing"
)

// parseBothWays parses data in one pass and, with every text split, in two
// halves, and says how they differ, if at all.
func parseBothWays(data []byte, opt Options) error {
	defer func(from int) { halvesFrom = from }(halvesFrom)
	halvesFrom = 1 << 62
	one, errOne := Parse(data, opt)
	halvesFrom = 0
	two, errTwo := Parse(data, opt)
	if fmt.Sprint(errOne) != fmt.Sprint(errTwo) {
		return fmt.Errorf("one pass: %v; in halves: %v", errOne, errTwo)
	}
	if !reflect.DeepEqual(one, two) {
		return fmt.Errorf("one pass:\n%+v\nin halves:\n%+v", one, two)
	}
	return nil
}

// halvesSeeds are long texts whose halves hold different things: groups
// first seen in the second half, marks and units seen in one half only or
// in both, missing values, counts, problems in either half, line ends of
// every kind.
var halvesSeeds = []string{
	"site,minutes\nNorth,3\nSouth,4\nNorth,NA\nEast,5\nWest,6\nEast,7\n",
	"site,minutes\nNorth,3.5\nSouth,4\nNorth,2\nEast,5\nWest,6,5\nEast,7\n",
	"site;minutes\nNorth;3,5\nSouth;4\nNorth;2\nEast;1.250\nWest;6\nEast;7\n",
	"pay\tgrade\n1\t52,300\n2\t980\n1\t1,234\n2\t1234\n1\t5\n2\t52,300\n",
	"site,minutes\r\nA,3 min\r\nB,4 min\r\nA,5\r\nB,6 min\r\nC,7 min\r\nC,8 h\r\n",
	"site,minutes\nA,3 min\nB,4\nA,5\nB,6\nC,7 h\nC,8 min\n",
	"site,minutes,n\nA,12,3\nB,15,2\nA,NA,1\nC,4,2\nB,5,0\nC,6,x\n",
	"site,minutes,n\nA,12,3\nB,15,2\nA,NA,1\nC,4,2\nB,5,0\nC,6,1\n",
	"site,minutes\nA,1\nB,two\nA,3\nC,4\nB,5\nC,six\n",
	"site,minutes\rA,1\rB,2\rA,3\rC,4\rB,5\rC,6\r",
	"A,1\nB,2\n\nA,3\n,4\nC,5\nB,6\n\n\n",
	"site,minutes\nA,1\nB,2\nA,3\nC,2024-01-05\nB,5\nC,6\n",
}

func TestHalvesAsOnePass(t *testing.T) {
	joined := 0
	halvesJoined = func() { joined++ }
	defer func() { halvesJoined = nil }()
	for _, seed := range halvesSeeds {
		for _, opt := range []Options{{}, {Layout: LayoutLong}, {Count: "3"}, {Decimal: MarkComma}} {
			if err := parseBothWays([]byte(seed), opt); err != nil {
				t.Errorf("%q (%+v): %v", seed, opt, err)
			}
		}
	}
	// 21 readings are split (the others have a cell that cannot be read, or
	// no column of counts)
	if joined != 21 {
		t.Errorf("%d readings of %d were in halves, want 21", joined, 4*len(halvesSeeds))
	}
	// a long text with 20,000 groups: too many once the halves are joined
	var b strings.Builder
	b.WriteString("id,value\n")
	for i := range 2 * MaxGroups {
		fmt.Fprintf(&b, "g%d,%d\n", i, i)
	}
	if err := parseBothWays([]byte(b.String()), Options{Layout: LayoutLong}); err != nil {
		t.Error(err)
	}
}

// FuzzHalves: whatever the text and options, reading a long text in two
// halves gives what one pass gives, problems included.
func FuzzHalves(f *testing.F) {
	for _, seed := range halvesSeeds {
		f.Add([]byte(seed), uint8(0))
		f.Add([]byte(seed), uint8(130))
	}
	f.Fuzz(func(t *testing.T, data []byte, mode uint8) {
		opt := Options{Layout: LayoutLong, Decimal: Mark(mode / 4 % 3), Thousands: Mark(mode / 12 % 6)}
		if mode&1 == 0 {
			opt.Layout = LayoutAuto
		}
		if mode >= 128 {
			opt.Count = "3"
		}
		if err := parseBothWays(data, opt); err != nil {
			t.Fatal(err)
		}
	})
}
