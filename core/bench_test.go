package core

import (
	"math/rand/v2"
	"strconv"
	"sync"
	"testing"
)

// benchText makes n values in 5 groups as long-layout text: a label, then a
// number with one decimal, as exported by a spreadsheet. Groups differ a
// little in location so the test has something to find. A negative n makes
// the same values in an export of six columns "id,site,year,code,minutes,grade".
func benchText(n int) []byte {
	six := n < 0
	n = max(n, -n)
	rng := rand.New(rand.NewPCG(42, 7))
	labels := []string{"North clinic", "South clinic", "East clinic", "West clinic", "Central clinic"}
	b := make([]byte, 0, n*40)
	if six {
		b = append(b, "id,site,year,code,minutes,grade\n"...)
	} else {
		b = append(b, "site,minutes\n"...)
	}
	for i := range n {
		g := i % len(labels)
		v := rng.ExpFloat64()*30 + float64(g)
		if six {
			b = strconv.AppendInt(b, int64(i+1), 10)
			b = append(b, ',')
		}
		b = append(b, labels[g]...)
		b = append(b, ',')
		if six {
			b = append(b, "2026,"...)
			b = strconv.AppendInt(b, int64(100+i%900), 10)
			b = append(b, ',')
		}
		b = strconv.AppendFloat(b, float64(int(v*10))/10, 'f', -1, 64)
		if six {
			b = append(b, ",B"...)
		}
		b = append(b, '\n')
	}
	return b
}

var texts sync.Map // n → []byte

func text(n int) []byte {
	if b, ok := texts.Load(n); ok {
		return b.([]byte)
	}
	b := benchText(n)
	texts.Store(n, b)
	return b
}

// n values of benchText(n); a negative n for the six-column export.
func benchmarkAnalyze(b *testing.B, n int, opt Options) {
	data := text(n)
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Analyze(data, opt); err != nil {
			b.Fatal(err)
		}
	}
}

// testOnly is the H test alone: parse, rank, H, p (no pairs).
var testOnly = Options{PostHoc: "none"}

// Text to result (parse, rank, H, p) for 1,000,000 values in 5 groups.
func BenchmarkAnalyze1M(b *testing.B) { benchmarkAnalyze(b, 1_000_000, testOnly) }

// The same values from an export of six columns, the group and measure
// columns chosen by name: the target is at most 1.5 times BenchmarkAnalyze1M.
func BenchmarkAnalyze1MSixColumns(b *testing.B) {
	benchmarkAnalyze(b, -1_000_000, Options{PostHoc: "none", Group: "site", Measure: "minutes"})
}

// The same for 10,000,000 values: growth should be linear.
func BenchmarkAnalyze10M(b *testing.B) { benchmarkAnalyze(b, 10_000_000, testOnly) }

// The default analysis of 1,000,000 values, with Dunn pairs and their effect sizes.
func BenchmarkAnalyze1MWithPairs(b *testing.B) { benchmarkAnalyze(b, 1_000_000, Options{}) }

// A small everyday case with the defaults: 60 values, exact p, pairs.
func BenchmarkAnalyzeSmall(b *testing.B) { benchmarkAnalyze(b, 60, Options{}) }

func BenchmarkEncode200k(b *testing.B) {
	r, err := Analyze(text(200_000), Options{})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Encode(r); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkAutomaticChoice: the default p-value choice (no pairs) on the
// shapes of real data that once took minutes or went wrong: yes/no answers,
// rating scales in unequal groups, continuous values, up to 1,000,000
// values. Each should stay within about 1 s natively and 3 s in the module
// (make bench-wasm).
func BenchmarkAutomaticChoice(b *testing.B) {
	cases := []struct {
		name  string
		sizes []int
		draw  func(r *rand.Rand, g int) string
	}{
		{"yes-no_4x100", []int{100, 100, 100, 100}, yesNo},
		{"yes-no_3x1000", []int{1000, 1000, 1000}, yesNo},
		{"yes-no_3x1200", []int{1200, 1200, 1200}, yesNo},
		{"yes-no_3x100000", []int{100_000, 100_000, 100_000}, yesNo},
		{"rating_701-753-811-785", []int{701, 753, 811, 785}, rating(0.05)},
		{"rating_4x7500", []int{7500, 7500, 7500, 7500}, rating(0)},
		{"continuous_5x60", []int{60, 60, 60, 60, 60}, continuous},
		{"continuous_3x16667", []int{16_667, 16_667, 16_666}, continuous},
		{"continuous_5x200000", []int{200_000, 200_000, 200_000, 200_000, 200_000}, continuous},
		{"rating_6x166667", []int{166_667, 166_667, 166_667, 166_667, 166_666, 166_666}, rating(0.01)},
	}
	for _, c := range cases {
		b.Run(c.name, func(b *testing.B) {
			data := sample(c.sizes, 1, c.draw)
			b.SetBytes(int64(len(data)))
			for b.Loop() {
				if _, err := Analyze(data, testOnly); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
