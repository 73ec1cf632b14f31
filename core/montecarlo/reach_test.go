package montecarlo

import (
	"math/big"
	"math/rand/v2"
	"testing"
)

// exactX is Σ sᵢ²/nᵢ as a rational, the definition that reach decides.
func exactX(sizes []int, sums []int64) *big.Rat {
	x := new(big.Rat)
	for i, s := range sums {
		term := new(big.Rat).SetFrac(new(big.Int).Mul(big.NewInt(s), big.NewInt(s)), big.NewInt(int64(sizes[i])))
		x.Add(x, term)
	}
	return x
}

// TestReachAgreesWithRationals: for groups whose least common multiple
// overflows 64-bit products (701, 753, 811 and 785 values; and 10,000
// values in groups of coprime sizes), reach decides "X ≥ observed" exactly as
// rational arithmetic does, for random deals, for the observed deal itself,
// for deals that permute equal sizes, and for deals one unit away.
func TestReachAgreesWithRationals(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for _, sizes := range [][]int{{701, 753, 811, 785}, {2999, 3001, 3989, 11}, {5, 5, 5}} {
		n := 0
		for _, s := range sizes {
			n += s
		}
		total := int64(n) * int64(n) // doubled midranks of untied data add up to N(N+1)
		observed := split(r, sizes, total)
		target, err := newReach(sizes, observed, total)
		if err != nil {
			t.Fatal(err)
		}
		want := exactX(sizes, observed)
		deals := [][]int64{observed, nudge(observed, 1), nudge(observed, -1)}
		for i := range sizes {
			for j := i + 1; j < len(sizes); j++ {
				if sizes[i] == sizes[j] { // the same X, summed in another order
					swapped := append([]int64(nil), observed...)
					swapped[i], swapped[j] = swapped[j], swapped[i]
					deals = append(deals, swapped)
				}
			}
		}
		for range 2000 {
			deals = append(deals, split(r, sizes, total))
		}
		for _, sums := range deals {
			if got, want := target.reaches(sums), exactX(sizes, sums).Cmp(want) >= 0; got != want {
				t.Errorf("sizes %v, sums %v: reaches %v, rational arithmetic %v", sizes, sums, got, want)
			}
		}
	}
}

// split deals a total into group sums near the groups' shares.
func split(r *rand.Rand, sizes []int, total int64) []int64 {
	n := 0
	for _, s := range sizes {
		n += s
	}
	sums := make([]int64, len(sizes))
	left := total
	for i, s := range sizes[:len(sizes)-1] {
		share := total * int64(s) / int64(n)
		sums[i] = share + r.Int64N(share/50+1) - share/100
		left -= sums[i]
	}
	sums[len(sums)-1] = left
	return sums
}

// nudge moves one unit from the last group to the first.
func nudge(sums []int64, d int64) []int64 {
	out := append([]int64(nil), sums...)
	out[0] += d
	out[len(out)-1] -= d
	return out
}

// TestReachRefusesInexactSums: sums that float64 cannot hold exactly are
// refused, not compared wrongly.
func TestReachRefusesInexactSums(t *testing.T) {
	if _, err := newReach([]int{2, 2}, []int64{1, 1}, 1<<53); err == nil {
		t.Error("a total of 2⁵³ was accepted")
	}
	if _, err := newReach([]int{2, 2}, []int64{1 << 51, 1 << 51}, 1<<52); err != nil {
		t.Errorf("a total of 2⁵² was refused: %v", err)
	}
}
