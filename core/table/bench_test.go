package table

import (
	"math/rand/v2"
	"strconv"
	"testing"
)

// longText makes n lines "label,value" in 5 groups, values with one
// decimal; with wide set, each line is instead an export's six columns
// "id,label,year,code,value,grade" whose second and fifth are read.
func longText(n int, wide bool) []byte {
	rng := rand.New(rand.NewPCG(42, 7))
	labels := []string{"North clinic", "South clinic", "East clinic", "West clinic", "Central clinic"}
	b := make([]byte, 0, n*40)
	if wide {
		b = append(b, "id,site,year,code,minutes,grade\n"...)
	}
	for i := range n {
		if wide {
			b = strconv.AppendInt(b, int64(i+1), 10)
			b = append(b, ',')
		}
		b = append(b, labels[i%5]...)
		b = append(b, ',')
		if wide {
			b = append(b, "2026,"...)
			b = strconv.AppendInt(b, int64(rng.IntN(900)+100), 10)
			b = append(b, ',')
		}
		b = strconv.AppendFloat(b, float64(int(rng.ExpFloat64()*300))/10, 'f', -1, 64)
		if wide {
			b = append(b, ",B"...)
		}
		b = append(b, '\n')
	}
	return b
}

// BenchmarkParseLong1MSixColumns reads the same values from an export of
// six columns, the group and measure columns chosen by name; the target is
// at most 1.5 times BenchmarkParseLong1M.
func BenchmarkParseLong1MSixColumns(b *testing.B) {
	data := longText(1_000_000, true)
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Parse(data, Options{Group: "site", Measure: "minutes"}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkParseLong1M(b *testing.B) {
	data := longText(1_000_000, false)
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Parse(data, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}
