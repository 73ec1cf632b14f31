package rank

import (
	"encoding/binary"
	"fmt"
	"math"
	"math/rand/v2"
	"reflect"
	"testing"
)

// naiveRanks is the definition of midranks: one plus the number of smaller
// values, plus half the number of other equal values.
func naiveRanks(values []float64) []float64 {
	r := make([]float64, len(values))
	for i, v := range values {
		less, equal := 0, 0
		for _, w := range values {
			if w < v {
				less++
			} else if w == v {
				equal++
			}
		}
		r[i] = float64(less) + float64(equal+1)/2
	}
	return r
}

func TestMidranks(t *testing.T) {
	tests := []struct {
		name   string
		values []float64
		ranks  []float64
		ties   []Tie
	}{
		// common practice: midranks of a small tied sample, worked by hand
		{"ties", []float64{3, 1, 4, 1, 5, 9, 2, 6, 5}, []float64{4, 1.5, 5, 1.5, 6.5, 9, 3, 8, 6.5},
			[]Tie{{1, 2}, {5, 2}}},
		{"negative and zero", []float64{-2, 0, -1e300, 7, 0}, []float64{2, 3.5, 1, 5, 3.5}, []Tie{{0, 2}}},
		{"all distinct", []float64{0.3, 0.1, 0.2}, []float64{3, 1, 2}, nil},
	}
	for _, tt := range tests {
		got := Midranks(tt.values)
		if !reflect.DeepEqual(got.Ranks, tt.ranks) || !reflect.DeepEqual(got.Ties, tt.ties) {
			t.Errorf("Midranks(%v) = %v ties %v, want %v ties %v", tt.values, got.Ranks, got.Ties, tt.ranks, tt.ties)
		}
	}
}

// TestMidranksLarge exercises the radix path (more than smallSort values)
// against the definition, with heavy ties, negatives and wide magnitudes.
func TestMidranksLarge(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for _, n := range []int{smallSort - 1, smallSort, 1000, 3000} {
		values := make([]float64, n)
		for i := range values {
			switch i % 3 {
			case 0:
				values[i] = float64(rng.IntN(7)) - 3 // Likert-like ties
			case 1:
				values[i] = rng.NormFloat64() * math.Pow(10, float64(rng.IntN(40)-20))
			default:
				values[i] = math.Round(rng.Float64()*100) / 4
			}
		}
		got := Midranks(values)
		want := naiveRanks(values)
		if !reflect.DeepEqual(got.Ranks, want) {
			t.Fatalf("n=%d: radix midranks differ from the definition", n)
		}
		checkOrder(t, values, got)
	}
}

// checkOrder checks that Order sorts the values stably and that TieSum
// matches the tie table.
func checkOrder(t *testing.T, values []float64, r Ranking) {
	t.Helper()
	for i := 1; i < len(r.Order); i++ {
		a, b := r.Order[i-1], r.Order[i]
		if values[a] > values[b] || (values[a] == values[b] && a > b) {
			t.Fatalf("Order not a stable ascending sort at %d: %v (%d) then %v (%d)", i, values[a], a, values[b], b)
		}
	}
	var sum float64
	for _, tie := range r.Ties {
		c := float64(tie.Count)
		sum += c*c*c - c
	}
	if sum != r.TieSum {
		t.Fatalf("TieSum = %v, tie table gives %v", r.TieSum, sum)
	}
}

// FuzzMidranks checks the definition and the rank-sum identity
// Σ ranks = n(n+1)/2 on arbitrary finite values.
func FuzzMidranks(f *testing.F) {
	f.Add([]byte{0, 0, 0, 0, 0, 0, 240, 63, 0, 0, 0, 0, 0, 0, 240, 63})
	f.Add(make([]byte, 8*300))
	f.Fuzz(func(t *testing.T, data []byte) {
		var values []float64
		for ; len(data) >= 8; data = data[8:] {
			v := math.Float64frombits(binary.LittleEndian.Uint64(data))
			if math.IsNaN(v) {
				continue
			}
			if v == 0 {
				v = 0
			}
			values = append(values, v)
		}
		r := Midranks(values)
		var sum float64
		for _, x := range r.Ranks {
			sum += x
		}
		n := float64(len(values))
		if sum != n*(n+1)/2 {
			t.Fatalf("ranks sum to %v, want %v", sum, n*(n+1)/2)
		}
		if len(values) <= 600 && !reflect.DeepEqual(r.Ranks, naiveRanks(values)) {
			t.Fatalf("Midranks(%v) = %v, want %v", values, r.Ranks, naiveRanks(values))
		}
		checkOrder(t, values, r)
	})
}

func ExampleMidranks() {
	r := Midranks([]float64{12, 7, 12, 3})
	fmt.Println(r.Ranks, r.Ties, r.TieSum)
	// Output: [3.5 2 3.5 1] [{12 2}] 6
}
