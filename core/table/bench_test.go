package table

import (
	"math/rand/v2"
	"strconv"
	"testing"
)

// longText makes n lines "label,value" in 5 groups, values with one decimal.
func longText(n int) []byte {
	rng := rand.New(rand.NewPCG(42, 7))
	labels := []string{"North clinic", "South clinic", "East clinic", "West clinic", "Central clinic"}
	b := make([]byte, 0, n*20)
	for i := range n {
		b = append(b, labels[i%5]...)
		b = append(b, ',')
		b = strconv.AppendFloat(b, float64(int(rng.ExpFloat64()*300))/10, 'f', -1, 64)
		b = append(b, '\n')
	}
	return b
}

func BenchmarkParseLong1M(b *testing.B) {
	data := longText(1_000_000)
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Parse(data, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}
