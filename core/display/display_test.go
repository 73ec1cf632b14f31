package display

import "testing"

func TestShow(t *testing.T) {
	for _, c := range []struct {
		show Show
		v    any
		want string
	}{
		{Figure, 7.9882287494437, "7.988"}, // R's PlantGrowth: H from kruskal.test, 7.9882
		{Figure, 5.154999999999999, "5.155"},
		{Figure, 0.0, "0"},
		{Figure, -2.5, "-2.5"},
		{Figure, 123456.0, "123500"},
		{Figure, 1234567.0, "1.235e6"},
		{Figure, 0.00001234, "1.234e-5"},
		{Figure, 0.0001, "0.0001"},
		// p as APA 7 writes it (Publication Manual, 7th ed., 6.36; common practice)
		{PValue, 0.014592168144353301, ".015"},
		{PValue, 0.0184, ".018"}, // R's PlantGrowth: kruskal.test p-value 0.01842
		{PValue, 5.9234e-5, "< .001"},
		{PValue, 0.001, ".001"},
		{PValue, 1e-300, "< .001"},
		{PValue, 0.9994, "> .999"},
		{PValue, 1.0, "> .999"},
		{PValue, 0.0496, ".050"},  // significant at .05 and shown at .05
		{PValue, 0.0504, ".0504"}, // .050 would read as significant at .05
		{PValue, 0.05, ".050"},
		{PValue, 0.0500001, ".0500001"},
		{PValue, 0.01004, ".01004"},
		{PValue, 0.01006, ".0101"},
		{PValue, 0.1004, ".1004"},
		{PValue, 0.0996, ".100"},
		{Share, 0.5, "0.500"},
		{Share, 0.0626, "0.063"},
		{Statistic, 7.9882287494437, "7.99"}, // R's PlantGrowth: H 7.9882
		{Statistic, -2.986, "-2.99"},
		{Statistic, -0.001, "0.00"},
		{Effect, 0.5551, "0.56"},
		{Effect, -0.742, "-0.74"},
		{Count, 30, "30"},
		{Count, 12.0, "12"},
		{Count, 1300, "1,300"},
		{Count, -52300.0, "-52,300"},
		{Count, 1234567, "1,234,567"},
		{Flag, true, "yes"},
		{Flag, false, "no"},
		{Text, "ctrl", "ctrl"},
		{AsRead, 52300.25, "52300.25"},
		{AsRead, 4.5, "4.5"},
		{Figure, nil, "undefined"},
	} {
		if got := c.show.Format(c.v); got != c.want {
			t.Errorf("%v.Format(%v) = %q, want %q", c.show, c.v, got, c.want)
		}
	}
}

func TestRough(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{
		{0, "0"},
		{52300, "52,300"},
		{999_499, "999,499"},
		{999_999, "999,999"},
		{1_049_999, "1 million"},
		{4e6, "4 million"},
		{8.8e8, "880 million"},
		{8.849e8, "880 million"},
		{1.23e9, "1.2 billion"},
		{999.6e9, "1 trillion"},
		{3.1e15, "3.1e+15"},
	} {
		if got := Rough(c.v); got != c.want {
			t.Errorf("Rough(%g) = %q, want %q", c.v, got, c.want)
		}
	}
}
