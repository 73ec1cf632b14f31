package rank

import (
	"encoding/binary"
	"fmt"
	"math"
	"math/rand/v2"
	"reflect"
	"slices"
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

// indexTags tags each value with its own index, so that the sorted tags
// show whether the sort was stable.
func indexTags(n int) []int32 {
	t := make([]int32, n)
	for i := range t {
		t[i] = int32(i)
	}
	return t
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
		ties := Rank(tt.values, make([]int32, len(tt.values)), 1).Ties
		if !reflect.DeepEqual(got, tt.ranks) || !reflect.DeepEqual(ties, tt.ties) {
			t.Errorf("Midranks(%v) = %v ties %v, want %v ties %v", tt.values, got, ties, tt.ranks, tt.ties)
		}
	}
}

// TestRankLarge exercises the radix path (more than smallSort values)
// against the definition, with heavy ties, negatives and wide magnitudes.
func TestRankLarge(t *testing.T) {
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
		if got, want := Midranks(values), naiveRanks(values); !reflect.DeepEqual(got, want) {
			t.Fatalf("n=%d: midranks differ from the definition", n)
		}
		checkRanking(t, values)
	}
}

// checkRanking checks that Rank sorts stably, that rank sums and sizes add
// up per group, and that TieSum matches the tie table.
func checkRanking(t *testing.T, values []float64) {
	t.Helper()
	r := Rank(values, indexTags(len(values)), len(values))
	ranks := naiveRanks(values)
	for i := range r.Sorted {
		idx := r.Groups[i]
		if r.Sorted[i] != values[idx] {
			t.Fatalf("Sorted[%d] = %v carries tag %d of value %v", i, r.Sorted[i], idx, values[idx])
		}
		if i > 0 && (r.Sorted[i-1] > r.Sorted[i] || (r.Sorted[i-1] == r.Sorted[i] && r.Groups[i-1] > idx)) {
			t.Fatalf("not a stable ascending sort at %d", i)
		}
		if r.Sizes[idx] != 1 || r.RankSums[idx] != ranks[idx] {
			t.Fatalf("value %d: size %d, rank sum %v; want 1, %v", idx, r.Sizes[idx], r.RankSums[idx], ranks[idx])
		}
	}
	var sum float64
	for _, tie := range r.Ties {
		c := float64(tie.Count)
		sum += c*c*c - c
		if _, shared := r.RankOf(tie.Value); shared != tie.Count {
			t.Fatalf("RankOf(%v) shared by %d, tie table says %d", tie.Value, shared, tie.Count)
		}
	}
	if sum != r.TieSum {
		t.Fatalf("TieSum = %v, tie table gives %v", r.TieSum, sum)
	}
}

func TestRankOfLongTie(t *testing.T) {
	values := make([]float64, 1000)
	for i := range values {
		values[i] = float64(i / 400) // blocks of 400, 400, 200
	}
	r := Rank(values, make([]int32, len(values)), 1)
	for _, tt := range []struct {
		v      float64
		rank   float64
		shared int
	}{{0, 200.5, 400}, {1, 600.5, 400}, {2, 900.5, 200}} {
		if rank, shared := r.RankOf(tt.v); rank != tt.rank || shared != tt.shared {
			t.Errorf("RankOf(%v) = %v, %d; want %v, %d", tt.v, rank, shared, tt.rank, tt.shared)
		}
	}
}

// FuzzRank checks the definition, stability and the rank-sum identity
// Σ ranks = n(n+1)/2 on arbitrary finite values.
func FuzzRank(f *testing.F) {
	f.Add([]byte{0, 0, 0, 0, 0, 0, 240, 63, 0, 0, 0, 0, 0, 0, 240, 63})
	f.Add(make([]byte, 8*20))
	f.Fuzz(func(t *testing.T, data []byte) {
		var values []float64
		data = data[:min(len(data), 8*4096)] // long inputs add nothing but time
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
		r := Rank(values, make([]int32, len(values)), 1)
		if n := float64(len(values)); r.RankSums[0] != n*(n+1)/2 {
			t.Fatalf("ranks sum to %v, want %v", r.RankSums[0], n*(n+1)/2)
		}
		if len(values) <= 600 {
			checkRanking(t, values)
		}
	})
}

func ExampleRank() {
	// two groups: 0 holds 12 and 7, 1 holds 12 and 3
	r := Rank([]float64{12, 7, 12, 3}, []int32{0, 0, 1, 1}, 2)
	fmt.Println(r.RankSums, r.Ties, r.TieSum)
	rank, shared := r.RankOf(12)
	fmt.Println(rank, shared)
	// Output:
	// [5.5 4.5] [{12 2}] 6
	// 3.5 2
}

// TestSortInHalves: sorting in two halves and merging gives exactly what
// one pass gives (stable among ties), whichever passes are skipped: all
// values equal (every pass), values apart in their top digits only, ties
// across the halves, negatives, odd lengths.
func TestSortInHalves(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	kinds := map[string]func(i int) float64{
		"all equal":   func(int) float64 { return 2.5 },
		"top digits":  func(i int) float64 { return math.Ldexp(1, i%7) },
		"ratings":     func(int) float64 { return float64(rng.IntN(5) + 1) },
		"signed":      func(int) float64 { return rng.NormFloat64() * 1e3 },
		"descending":  func(i int) float64 { return float64(-i) },
		"half and -0": func(i int) float64 { return float64(i%2) * 0.5 },
	}
	defer func(from int) { halvesFrom = from }(halvesFrom)
	for name, value := range kinds {
		for _, n := range []int{smallSort, 1001, 4096} {
			values := make([]float64, n)
			for i := range values {
				values[i] = value(i)
			}
			halvesFrom = 1 << 62
			want, wantTags := sortTagged(values, indexTags(n))
			keys, keys2, tags2 := make([]uint64, n), make([]uint64, n), make([]int32, n)
			got, gotTags := sortInHalves(values, keys, keys2, indexTags(n), tags2)
			if !slices.Equal(got, want) || !slices.Equal(gotTags, wantTags) {
				t.Errorf("%s, n = %d: the halves merged differ from one pass", name, n)
			}
		}
	}
}
